// A boundary-layer solution stored as the Taylor series of each integration step (see
// taylor.ts), read back anywhere by evaluating the step's polynomials: the interpolant is the
// integrator's own solution, as accurate between nodes as at them.
import { horner, hornerDerivative, hornerSecondDerivative } from './taylor.js';

/** Number of stored derivatives: F = ∫f, f, f', f'', f''', f''''. */
export const TRACE_ORDERS = 6;
/** Series stored per step: F, f, f', f''; f''' and f'''' are their derivatives. */
const SERIES = 4;

/** Scratch for the builders: one integration at a time per thread, copied out by `build`. */
let scratch = new Float64Array(2 * SERIES * 32 * 64);

/**
 * Collects the steps while an integration runs (one builder in use at a time). With
 * `parameters` > 0, each step also keeps the series of ∂(F, f, f', f'')/∂s_j for each shooting
 * parameter s_j, so that `build` can return the solution for parameters moved by δ:
 * y + Σ δ_j·∂y/∂s_j, exact to O(δ²).
 */
export class TraceBuilder {
  private readonly eta: number[] = [];
  private segments = 0;
  private readonly stride: number;

  /** `terms`: coefficients kept per series (the order of the integration plus one or two). */
  constructor(
    readonly terms: number,
    private readonly parameters = 0,
  ) {
    this.stride = (1 + parameters) * SERIES * terms;
  }

  /**
   * Adds the step that starts at `eta0`: the Taylor series of F, f, f', f'' about it, then
   * (`sensitivities`) those of ∂F/∂s_j, ∂f/∂s_j, ∂f'/∂s_j, ∂f''/∂s_j for each parameter in turn.
   */
  push(eta0: number, F: Float64Array, f: Float64Array, g: Float64Array, h: Float64Array, sensitivities: readonly Float64Array[] = []): void {
    const t = this.terms;
    if ((this.segments + 1) * this.stride > scratch.length) {
      const grown = new Float64Array(scratch.length * 2);
      grown.set(scratch);
      scratch = grown;
    }
    const c = scratch;
    const o = this.segments * this.stride;
    for (let k = 0; k < t; k++) {
      c[o + k] = F[k];
      c[o + t + k] = f[k];
      c[o + 2 * t + k] = g[k];
      c[o + 3 * t + k] = h[k];
    }
    for (let q = 0; q < SERIES * this.parameters; q++) {
      const a = sensitivities[q];
      const oq = o + (SERIES + q) * t;
      for (let k = 0; k < t; k++) c[oq + k] = a[k];
    }
    this.eta.push(eta0);
    this.segments++;
  }

  /** The trace, closed at `etaEnd` (beyond the start of the last step), moved by `deltas` along ∂/∂s_j. */
  build(etaEnd: number, deltas: readonly number[] = []): SolutionTrace {
    const n = this.segments;
    const eta = new Float64Array(n + 1);
    eta.set(this.eta);
    eta[n] = etaEnd;
    const size = SERIES * this.terms;
    const coef = new Float64Array(n * size);
    for (let i = 0; i < n; i++) {
      const o = i * this.stride;
      for (let k = 0; k < size; k++) {
        let v = scratch[o + k];
        for (let j = 0; j < this.parameters; j++) v += (deltas[j] ?? 0) * scratch[o + (j + 1) * size + k];
        coef[i * size + k] = v;
      }
    }
    return new SolutionTrace(eta, coef, this.terms);
  }
}

/**
 * Piecewise-polynomial F(η) = ∫₀^η f and its derivatives. Beyond the last node the outer flow
 * is taken as reached: f'' = 0, so F is the quadratic continuation F_e + f_e·τ + f'_e·τ²/2
 * (f'_e = 1 for forced flow, 0 for free convection).
 */
export class SolutionTrace {
  /** d[k][i] = k-th derivative of F at node i. */
  readonly d: Float64Array[];
  private last = 0;

  constructor(
    /** Nodes: the start of every step, then the end of the last. */
    readonly eta: Float64Array,
    /** Per step, the series of F, f, f', f'' in τ = η − η_i, `terms` coefficients each. */
    private readonly coef: Float64Array,
    private readonly terms: number,
  ) {
    const n = eta.length;
    this.d = Array.from({ length: TRACE_ORDERS }, () => new Float64Array(n));
    const t = terms;
    for (let i = 0; i + 1 < n; i++) {
      const o = i * SERIES * t;
      for (let k = 0; k < SERIES; k++) this.d[k][i] = coef[o + k * t];
      this.d[4][i] = coef[o + 3 * t + 1];
      this.d[5][i] = 2 * coef[o + 3 * t + 2];
    }
    const end = eta[n - 1];
    for (let k = 0; k < TRACE_ORDERS; k++) this.d[k][n - 1] = this.inside(k, n - 2, end - eta[n - 2]);
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
    return this.derivative(0, x);
  }

  /** The k-th derivative of F (0: F, 1: f, 2: f', 3: f'', 4: f''', 5: f''''). */
  derivative(k: number, x: number): number {
    const n = this.eta.length;
    const end = this.eta[n - 1];
    if (x >= end) {
      const tau = x - end;
      const d = this.d;
      if (k === 0) return d[0][n - 1] + d[1][n - 1] * tau + 0.5 * d[2][n - 1] * tau * tau;
      if (k === 1) return d[1][n - 1] + d[2][n - 1] * tau;
      if (k === 2) return d[2][n - 1];
      return 0;
    }
    const i = this.interval(x);
    return this.inside(k, i, x - this.eta[i]);
  }

  /** Node value of derivative k. */
  node(k: number, i: number): number {
    return this.d[k][i];
  }

  private inside(k: number, i: number, tau: number): number {
    const t = this.terms;
    const o = i * SERIES * t;
    if (k < SERIES) return horner(this.coef, o + k * t, t, tau);
    if (k === 4) return hornerDerivative(this.coef, o + 3 * t, t, tau);
    return hornerSecondDerivative(this.coef, o + 3 * t, t, tau);
  }
}
