// A boundary-layer solution stored at the integrator's nodes and read back anywhere by
// two-point Hermite interpolation (value and derivatives at both ends of each step).

/** Number of stored derivatives: F = ∫f, f, f', f'', f''', f''''. */
export const TRACE_ORDERS = 6;

/** Collects nodes while an integration runs. */
export class TraceBuilder {
  readonly eta: number[] = [];
  readonly d: number[][] = Array.from({ length: TRACE_ORDERS }, () => []);

  push(eta: number, derivatives: readonly number[]): void {
    // Steps of zero length (a clipped last step can produce one) add nothing.
    const n = this.eta.length;
    if (n > 0 && eta <= this.eta[n - 1]) return;
    this.eta.push(eta);
    for (let k = 0; k < TRACE_ORDERS; k++) this.d[k].push(derivatives[k]);
  }

  build(): SolutionTrace {
    return new SolutionTrace(Float64Array.from(this.eta), this.d.map((a) => Float64Array.from(a)));
  }
}

/**
 * Piecewise Hermite representation of F(η) = ∫₀^η f and its derivatives. Beyond the last
 * node the outer flow is taken as reached: f'' = 0, so F is the quadratic continuation
 * F_e + f_e·τ + f'_e·τ²/2 (f'_e = 1 for forced flow, 0 for free convection).
 */
export class SolutionTrace {
  /** Newton-form coefficients of the degree-7 interpolant of F, eight per interval. */
  private readonly fCoef: Float64Array;
  /** The same for derivative k (built on first use). */
  private readonly dCoef: (Float64Array | undefined)[] = [];

  constructor(
    readonly eta: Float64Array,
    /** d[k][i] = k-th derivative of F at node i. */
    readonly d: Float64Array[],
  ) {
    const n = eta.length;
    this.fCoef = new Float64Array(8 * Math.max(0, n - 1));
    for (let i = 0; i + 1 < n; i++) hermiteCoefficients(this, 0, 4, i, this.fCoef, 8 * i);
  }

  get length(): number {
    return this.eta.length;
  }

  get lastEta(): number {
    return this.eta[this.eta.length - 1];
  }

  /** Index i with eta[i] ≤ x < eta[i+1] (clamped to the valid range of intervals). */
  interval(x: number): number {
    const e = this.eta;
    let lo = 0;
    let hi = e.length - 2;
    if (x <= e[0]) return 0;
    if (x >= e[hi]) return hi;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (e[mid] <= x) lo = mid;
      else hi = mid;
    }
    return lo;
  }

  /** F(η) = ∫₀^η f dη'. */
  F(x: number): number {
    const n = this.eta.length;
    const last = this.eta[n - 1];
    if (x >= last) {
      const tau = x - last;
      return this.d[0][n - 1] + this.d[1][n - 1] * tau + 0.5 * this.d[2][n - 1] * tau * tau;
    }
    const i = this.interval(x);
    const s = (x - this.eta[i]) / (this.eta[i + 1] - this.eta[i]);
    return evalNewton(this.fCoef, 8 * i, 4, s);
  }

  /** The k-th derivative of F (1: f, 2: f', 3: f'', ...), interpolated from derivatives k..k+3. */
  derivative(k: number, x: number): number {
    const n = this.eta.length;
    const last = this.eta[n - 1];
    if (x >= last) {
      const tau = x - last;
      if (k === 1) return this.d[1][n - 1] + this.d[2][n - 1] * tau;
      if (k === 2) return this.d[2][n - 1];
      return 0;
    }
    const terms = Math.min(4, TRACE_ORDERS - k);
    let coef = this.dCoef[k];
    if (!coef) {
      coef = new Float64Array(2 * terms * (n - 1));
      for (let j = 0; j + 1 < n; j++) hermiteCoefficients(this, k, terms, j, coef, 2 * terms * j);
      this.dCoef[k] = coef;
    }
    const i = this.interval(x);
    const s = (x - this.eta[i]) / (this.eta[i + 1] - this.eta[i]);
    return evalNewton(coef, 2 * terms * i, terms, s);
  }

  /** Node value of derivative k. */
  node(k: number, i: number): number {
    return this.d[k][i];
  }
}

/**
 * Newton coefficients of the two-point Hermite interpolant in s = (η − η_i)/Δ matching
 * derivatives k0 … k0+terms−1 at both ends (divided differences on doubled nodes 0…0,1…1).
 */
function hermiteCoefficients(trace: SolutionTrace, k0: number, terms: number, i: number, out: Float64Array, offset: number): void {
  const delta = trace.eta[i + 1] - trace.eta[i];
  const m = 2 * terms;
  const a = new Float64Array(terms);
  const b = new Float64Array(terms);
  let scale = 1;
  for (let j = 0; j < terms; j++) {
    // Scaled Taylor coefficients: D^j · Δ^j / j!.
    a[j] = trace.d[k0 + j][i] * scale;
    b[j] = trace.d[k0 + j][i + 1] * scale;
    scale *= delta / (j + 1);
  }
  // q[i] holds column j of the divided-difference table, updated in place from the bottom.
  const q = new Float64Array(m);
  for (let r = 0; r < m; r++) q[r] = r < terms ? a[0] : b[0];
  out[offset] = q[0];
  for (let j = 1; j < m; j++) {
    for (let r = m - 1; r >= j; r--) {
      const sameSide = r < terms || r - j >= terms;
      q[r] = sameSide ? (r < terms ? a[j] : b[j]) : q[r] - q[r - 1];
    }
    out[offset + j] = q[j];
  }
}

/** p(s) = Σ_{j<n} c_j s^j + s^n Σ_{j≥n} c_j (s−1)^{j−n}. */
function evalNewton(c: Float64Array, offset: number, terms: number, s: number): number {
  const m = 2 * terms;
  let inner = c[offset + m - 1];
  for (let j = m - 2; j >= terms; j--) inner = c[offset + j] + (s - 1) * inner;
  let acc = inner;
  for (let j = terms - 1; j >= 0; j--) acc = c[offset + j] + s * acc;
  return acc;
}
