// Scalar root finding shared by the engine (surface temperature from a power balance,
// outlet temperatures) and design targets (the input that meets a requirement).
// Brent's method: Brent, R.P. (1973) Algorithms for Minimization without Derivatives,
// Prentice-Hall, ch. 4 (the zeroin algorithm; this is its usual transcription).
// Every function returns a status instead of throwing, so callers can flag a point.

export type RootStatus = 'converged' | 'not-bracketed' | 'not-converged' | 'non-finite';

export interface RootResult {
  status: RootStatus;
  /** The root (or the best estimate) when status is 'converged'. */
  x: number;
  /** f(x) at the returned x. */
  fx: number;
  iterations: number;
}

export interface BrentOptions {
  /** Relative tolerance on x (default 1e-12). */
  relTol?: number;
  /** Absolute tolerance on x (default 0). */
  absTol?: number;
  maxIterations?: number;
}

/** Brent's method on [a, b]; f(a) and f(b) must differ in sign (or one be zero). */
export function brent(f: (x: number) => number, a: number, b: number, options: BrentOptions = {}): RootResult {
  const relTol = options.relTol ?? 1e-12;
  const absTol = options.absTol ?? 0;
  const maxIterations = options.maxIterations ?? 200;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) return { status: 'non-finite', x: NaN, fx: NaN, iterations: 0 };
  if (fa === 0) return { status: 'converged', x: a, fx: 0, iterations: 0 };
  if (fb === 0) return { status: 'converged', x: b, fx: 0, iterations: 0 };
  if (Math.sign(fa) === Math.sign(fb)) return { status: 'not-bracketed', x: NaN, fx: NaN, iterations: 0 };
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 1; i <= maxIterations; i++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * Math.max(absTol, relTol * Math.abs(b));
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { status: 'converged', x: b, fx: fb, iterations: i };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // Inverse quadratic interpolation, or the secant step when only two points differ.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) return { status: 'non-finite', x: b, fx: fb, iterations: i };
  }
  return { status: 'not-converged', x: b, fx: fb, iterations: maxIterations };
}

/** A sign change of f found by scanning: the sub-interval, and how many sign changes the scan saw. */
export interface Bracket {
  lo: number;
  hi: number;
  /** Sign changes seen over the whole scan (more than 1: several roots). */
  signChanges: number;
}

export interface ScanResult {
  /** The first (smallest-x) bracket, if any. */
  bracket?: Bracket;
  /** Smallest and largest finite f seen on the scan (the achievable range). */
  min: number;
  max: number;
}

/**
 * Scan [lo, hi] in `steps` intervals (geometric when both ends are positive and span more
 * than a decade, else linear) for sign changes of f. Non-finite samples are skipped.
 */
export function scanForBracket(f: (x: number) => number, lo: number, hi: number, steps = 32): ScanResult {
  const geometric = lo > 0 && hi > 0 && hi / lo > 10;
  const at = (i: number) =>
    i === steps ? hi : geometric ? lo * (hi / lo) ** (i / steps) : lo + ((hi - lo) * i) / steps;
  let min = Infinity;
  let max = -Infinity;
  let prevX = NaN;
  let prevF = NaN;
  let first: Bracket | undefined;
  let changes = 0;
  for (let i = 0; i <= steps; i++) {
    const x = at(i);
    const fx = f(x);
    if (!Number.isFinite(fx)) continue;
    min = Math.min(min, fx);
    max = Math.max(max, fx);
    if (fx === 0) {
      // An exact zero on a node: a bracket of zero width around it.
      changes++;
      first ??= { lo: x, hi: x, signChanges: 0 };
    } else if (Number.isFinite(prevF) && prevF !== 0 && Math.sign(prevF) !== Math.sign(fx)) {
      changes++;
      first ??= { lo: prevX, hi: x, signChanges: 0 };
    }
    prevX = x;
    prevF = fx;
  }
  if (first) first.signChanges = changes;
  return { bracket: first, min, max };
}
