// A boundary-layer solution stored as the Taylor series of each integration step (see
// taylor.ts), read back anywhere by evaluating the step's polynomial: the interpolant is the
// integrator's own solution, as accurate between nodes as at them. Only F = ∫f is stored:
// f, f', f'' are its derivatives, and with F's series taken to order p + 3 (exact, from the
// order-p series of f'') they keep every coefficient the integration computed.

/** Number of derivatives read back: F = ∫f, f, f', f'', f''', f''''. */
export const TRACE_ORDERS = 6;

/** FALLING[k][j] = j!/(j − k)!: the factor of a_j τ^{j−k} in the k-th derivative. */
const FALLING: Float64Array[] = Array.from({ length: TRACE_ORDERS }, (_, k) =>
  Float64Array.from({ length: 40 }, (_, j) => {
    let v = 1;
    for (let i = 0; i < k; i++) v *= j - i;
    return v;
  }),
);

/** Scratch for the builders: one integration at a time per thread, copied out by `build`. */
let scratch = new Float64Array(3 * 32 * 128);

/**
 * Collects the steps while an integration runs (one builder in use at a time). With
 * `parameters` > 0, each step also keeps the series of ∂F/∂s_j for each shooting parameter
 * s_j, so that `build` can return the solution for parameters moved by δ: F + Σ δ_j·∂F/∂s_j,
 * exact to O(δ²).
 */
export class TraceBuilder {
  private readonly eta: number[] = [];
  private segments = 0;
  private readonly stride: number;

  /** `terms`: coefficients kept of F's series (the integration's order plus four). */
  constructor(
    readonly terms: number,
    private readonly parameters: 0 | 1 | 2 = 0,
  ) {
    this.stride = (1 + parameters) * terms;
  }

  /** Adds the step that starts at `eta0`: the Taylor series of F about it, then those of ∂F/∂s_j. */
  push(eta0: number, F: Float64Array, sensitivities: readonly Float64Array[] = []): void {
    const t = this.terms;
    if ((this.segments + 1) * this.stride > scratch.length) {
      const grown = new Float64Array(scratch.length * 2);
      grown.set(scratch);
      scratch = grown;
    }
    const o = this.segments * this.stride;
    const c = scratch;
    for (let k = 0; k < t; k++) c[o + k] = F[k];
    for (let j = 0; j < this.parameters; j++) {
      const a = sensitivities[j];
      const oj = o + (j + 1) * t;
      for (let k = 0; k < t; k++) c[oj + k] = a[k];
    }
    this.eta.push(eta0);
    this.segments++;
  }

  /** The trace, closed at `etaEnd` (beyond the start of the last step), moved by `deltas` along ∂/∂s_j. */
  build(etaEnd: number, deltas: readonly number[] = []): SolutionTrace {
    const n = this.segments;
    const t = this.terms;
    // One backing store for nodes, coefficients and the last node's derivatives.
    const store = new Float64Array(n + 1 + n * t + TRACE_ORDERS);
    const eta = store.subarray(0, n + 1);
    for (let i = 0; i < n; i++) eta[i] = this.eta[i];
    eta[n] = etaEnd;
    const coef = store.subarray(n + 1, n + 1 + n * t);
    const d0 = deltas[0] ?? 0;
    const d1 = deltas[1] ?? 0;
    for (let i = 0; i < n; i++) {
      const o = i * this.stride;
      const c = i * t;
      if (this.parameters === 0) for (let k = 0; k < t; k++) coef[c + k] = scratch[o + k];
      else if (this.parameters === 1) for (let k = 0; k < t; k++) coef[c + k] = scratch[o + k] + d0 * scratch[o + t + k];
      else for (let k = 0; k < t; k++) coef[c + k] = scratch[o + k] + d0 * scratch[o + t + k] + d1 * scratch[o + 2 * t + k];
    }
    return new SolutionTrace(eta, coef, t, store.subarray(n + 1 + n * t));
  }
}

/**
 * Piecewise-polynomial F(η) = ∫₀^η f and its derivatives. Beyond the last node the outer flow
 * is taken as reached: f'' = 0, so F is the quadratic continuation F_e + f_e·τ + f'_e·τ²/2
 * (f'_e = 1 for forced flow, 0 for free convection).
 */
export class SolutionTrace {
  private last = 0;

  constructor(
    /** Nodes: the start of every step, then the end of the last. */
    readonly eta: Float64Array,
    /** Per step, the series of F in τ = η − η_i, `terms` coefficients each. */
    private readonly coef: Float64Array,
    private readonly terms: number,
    /** Filled here: derivatives 0 … 5 of F at the last node (the others are read off the coefficients). */
    private readonly end = new Float64Array(TRACE_ORDERS),
  ) {
    const n = eta.length;
    for (let k = 0; k < TRACE_ORDERS; k++) this.end[k] = this.inside(k, n - 2, eta[n - 1] - eta[n - 2]);
  }

  get length(): number {
    return this.eta.length;
  }

  get lastEta(): number {
    return this.eta[this.eta.length - 1];
  }

  /** Index i with eta[i] ≤ x < eta[i+1] (clamped to the valid range of steps). */
  interval(x: number): number {
    const e = this.eta;
    const l = this.last;
    // Quadratures and scans read the trace in increasing η: try the last step first.
    if (x >= e[l] && x < e[l + 1]) return l;
    let lo = 0;
    let hi = e.length - 2;
    if (x <= e[0]) return 0;
    if (x >= e[hi]) return (this.last = hi);
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (e[mid] <= x) lo = mid;
      else hi = mid;
    }
    return (this.last = lo);
  }

  /** F(η) = ∫₀^η f dη'. */
  F(x: number): number {
    const n = this.eta.length;
    if (x >= this.eta[n - 1]) return this.derivative(0, x);
    const i = this.interval(x);
    const t = this.terms;
    const o = i * t;
    const tau = x - this.eta[i];
    const c = this.coef;
    let acc = c[o + t - 1];
    for (let j = t - 2; j >= 0; j--) acc = acc * tau + c[o + j];
    return acc;
  }

  /** The k-th derivative of F (0: F, 1: f, 2: f', 3: f'', 4: f''', 5: f''''). */
  derivative(k: number, x: number): number {
    const n = this.eta.length;
    const end = this.eta[n - 1];
    if (x >= end) {
      const tau = x - end;
      const d = this.end;
      if (k === 0) return d[0] + d[1] * tau + 0.5 * d[2] * tau * tau;
      if (k === 1) return d[1] + d[2] * tau;
      if (k === 2) return d[2];
      return 0;
    }
    const i = this.interval(x);
    return this.inside(k, i, x - this.eta[i]);
  }

  /** Node value of derivative k (0: F, 1: f, 2: f', 3: f'', 4: f''', 5: f''''). */
  node(k: number, i: number): number {
    if (i >= this.eta.length - 1) return this.end[k];
    return FALLING[k][k] * this.coef[i * this.terms + k];
  }

  private inside(k: number, i: number, tau: number): number {
    const t = this.terms;
    const o = i * t;
    const c = this.coef;
    const w = FALLING[k];
    let acc = w[t - 1] * c[o + t - 1];
    for (let j = t - 2; j >= k; j--) acc = acc * tau + w[j] * c[o + j];
    return acc;
  }
}
