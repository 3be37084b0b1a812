"""The peer for `npm run bench -- similarity`: the script an engineer would write with SciPy.

Falkner-Skan + energy (isothermal wall) as one boundary-value problem for scipy.integrate.solve_bvp
at tol 1e-6, over a sweep of wedge exponent m and wall blowing at a fixed Pr, in sweep order.
Each point starts from the previous point's converged solution (continuation, as filmsweep's own
solver does in a sweep); the first from a generic profile. Hartree's scaling, as in
shared/physics/similarity/falknerSkan.ts:
    f''' + f f'' + beta (1 - f'^2) = 0,  theta'' + Pr f theta' = 0,  beta = 2m/(m+1),
    f(0) = -wall_blowing sqrt(2/(m+1)), f'(0) = 0, f'(L) = 1, theta(0) = 1, theta(L) = 0,
    Cf_x Re_x^(1/2) = f''(0) sqrt(2(m+1)),  Nu_x / Re_x^(1/2) = -theta'(0) sqrt((m+1)/2).
The outer edge L is fixed per point, wide enough for 1e-6 (the layer is pushed out by blowing).

Reads {"Pr": .., "points": [[m, wall_blowing], ...], "continuation": true} as JSON on stdin and
writes {"scipy": version, "seconds": wall time of the solves alone, "cpu_seconds": their CPU time,
"results": [...]} on stdout.
"""
import json
import math
import sys
import time

import numpy as np
import scipy
from scipy.integrate import solve_bvp


def edge(fw):
    return 12.0 + 6.0 * max(0.0, -fw)


def solve_point(m, wb, Pr, guess):
    beta = 2 * m / (m + 1)
    fw = -wb * math.sqrt(2 / (m + 1))
    L = edge(fw)

    def fun(x, y):
        f, g, h, th, thp = y
        return np.vstack((g, h, -f * h - beta * (1 - g * g), thp, -Pr * f * thp))

    def bc(ya, yb):
        return np.array([ya[0] - fw, ya[1], yb[1] - 1, ya[3] - 1, yb[3]])

    if guess is None:
        x = np.linspace(0, L, 101)
        e = np.exp(-x)
        y = np.vstack((fw + x - 1 + e, 1 - e, e, e, -e))
    else:
        # The previous solution stretched onto this point's domain, its wall value shifted.
        x = guess.x * (L / guess.x[-1])
        y = guess.y.copy()
        y[0] += fw - y[0, 0]
    sol = solve_bvp(fun, bc, x, y, tol=1e-6, max_nodes=100000)
    return sol, beta


def main():
    job = json.load(sys.stdin)
    Pr = job['Pr']
    continuation = job.get('continuation', True)
    results = []
    previous = None
    t0 = time.perf_counter()
    c0 = time.process_time()
    for m, wb in job['points']:
        sol, beta = solve_point(m, wb, Pr, previous if continuation else None)
        ok = sol.status == 0
        results.append({
            'm': m,
            'wall_blowing': wb,
            'status': 'ok' if ok else 'failed',
            'Cf_x_Re_half': float(sol.y[2, 0] * math.sqrt(2 * (m + 1))),
            'Nu_x_Re_half': float(-sol.y[4, 0] * math.sqrt((m + 1) / 2)),
        })
        previous = sol if ok else None
    seconds = time.perf_counter() - t0
    cpu_seconds = time.process_time() - c0
    json.dump({'scipy': scipy.__version__, 'seconds': seconds, 'cpu_seconds': cpu_seconds, 'results': results}, sys.stdout)


if __name__ == '__main__':
    main()
