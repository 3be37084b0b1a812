// Where the attached solutions end, found by bisection on the solver's own verdict.
import { solveFalknerSkanUncached } from './falknerSkan.js';

function bisect(attachedAt: (x: number) => boolean, attached: number, detached: number, tol: number): number {
  let a = attached;
  let d = detached;
  while (Math.abs(d - a) > tol) {
    const mid = 0.5 * (a + d);
    if (attachedAt(mid)) a = mid;
    else d = mid;
  }
  return 0.5 * (a + d);
}

/** Wedge exponent m below which no attached Falkner–Skan layer exists (Hartree: β = −0.1988). */
export function separationExponent(wallBlowing = 0, tol = 1e-9): { m: number; beta: number } {
  const m = bisect((x) => solveFalknerSkanUncached(x, wallBlowing).status === 'attached', 0, -0.5, tol);
  return { m, beta: (2 * m) / (m + 1) };
}

/** Largest (v_w/U)·Re_x^½ for which the layer stays on the wall (Emmons & Leigh 1954: ≈ 0.619 for m = 0). */
export function blowOffLimit(m = 0, tol = 1e-7): number {
  return bisect((x) => solveFalknerSkanUncached(m, x).status === 'attached', 0, 2, tol);
}
