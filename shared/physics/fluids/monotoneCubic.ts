// Monotone piecewise-cubic Hermite interpolation (PCHIP). Between two nodes the curve
// never overshoots the data, so an interpolated property cannot leave the range of its
// neighbours. The node slopes follow SciPy's PchipInterpolator exactly, so SciPy can be
// used as an outside check (tests/fluids_interpolation.test.ts).

/**
 * Node slopes: Fritsch & Butland (SIAM J. Sci. Stat. Comput. 5, 300, 1984) weighted harmonic
 * mean inside, the one-sided three-point rule of Moler (Numerical Computing with MATLAB,
 * 2004, §3.6) at the ends; zero where the data turn. Two nodes give a straight line.
 */
export function monotoneSlopes(x: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  const n = x.length;
  const d = new Float64Array(n);
  if (n < 2) return d;
  if (n === 2) {
    d[0] = d[1] = (y[1] - y[0]) / (x[1] - x[0]);
    return d;
  }
  const h = new Float64Array(n - 1);
  const m = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) {
    h[i] = x[i + 1] - x[i];
    m[i] = (y[i + 1] - y[i]) / h[i];
  }
  for (let i = 1; i < n - 1; i++) {
    const a = m[i - 1];
    const b = m[i];
    if (a === 0 || b === 0 || Math.sign(a) !== Math.sign(b)) {
      d[i] = 0;
    } else {
      const w1 = 2 * h[i] + h[i - 1];
      const w2 = h[i] + 2 * h[i - 1];
      d[i] = (w1 + w2) / (w1 / a + w2 / b);
    }
  }
  d[0] = endSlope(h[0], h[1], m[0], m[1]);
  d[n - 1] = endSlope(h[n - 2], h[n - 3], m[n - 2], m[n - 3]);
  return d;
}

function endSlope(h0: number, h1: number, m0: number, m1: number): number {
  const d = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(m0)) return 0;
  if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > 3 * Math.abs(m0)) return 3 * m0;
  return d;
}

/** Index i of the interval with x[i] <= t <= x[i+1] (binary search; t must lie in [x[0], x[n-1]]). */
export function intervalIndex(x: ArrayLike<number>, t: number): number {
  let lo = 0;
  let hi = x.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >>> 1;
    if (x[mid] <= t) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Cubic Hermite value on interval i at fraction s = (t - x[i]) / h of its width h. */
export function hermiteValue(y: ArrayLike<number>, d: ArrayLike<number>, i: number, s: number, h: number): number {
  const s1 = 1 - s;
  return (
    (1 + 2 * s) * s1 * s1 * y[i] +
    s * s1 * s1 * h * d[i] +
    s * s * (3 - 2 * s) * y[i + 1] -
    s * s * s1 * h * d[i + 1]
  );
}

/** Derivative dy/dx of the same cubic. */
export function hermiteDerivative(y: ArrayLike<number>, d: ArrayLike<number>, i: number, s: number, h: number): number {
  return (
    ((6 * s * s - 6 * s) * (y[i] - y[i + 1])) / h +
    (3 * s * s - 4 * s + 1) * d[i] +
    (3 * s * s - 2 * s) * d[i + 1]
  );
}

/** One interpolated curve (the fluids share one interval search over several curves instead). */
export class MonotoneCubic {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly slopes: Float64Array;

  constructor(x: ArrayLike<number>, y: ArrayLike<number>) {
    if (x.length !== y.length || x.length < 2) {
      throw new RangeError('MonotoneCubic needs x and y of equal length, at least 2');
    }
    this.x = Float64Array.from(x);
    this.y = Float64Array.from(y);
    this.slopes = monotoneSlopes(this.x, this.y);
  }

  /** Value at t; t outside [x0, xn] is a RangeError (no extrapolation). */
  value(t: number): number {
    const i = this.locate(t);
    const h = this.x[i + 1] - this.x[i];
    return hermiteValue(this.y, this.slopes, i, (t - this.x[i]) / h, h);
  }

  /** Derivative dy/dx at t. */
  derivative(t: number): number {
    const i = this.locate(t);
    const h = this.x[i + 1] - this.x[i];
    return hermiteDerivative(this.y, this.slopes, i, (t - this.x[i]) / h, h);
  }

  private locate(t: number): number {
    const n = this.x.length;
    if (!(t >= this.x[0] && t <= this.x[n - 1])) {
      throw new RangeError(`${t} is outside the interpolation range [${this.x[0]}, ${this.x[n - 1]}]`);
    }
    return intervalIndex(this.x, t);
  }
}
