// Globally adaptive Gauss–Kronrod 7/15-point quadrature (Kronrod 1965; nodes and weights
// as in QUADPACK's QK15, Piessens et al. 1983).

const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
  0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
  0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0.0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204,
  0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
  0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
// Gauss 7-point weights for the nodes XGK[1], XGK[3], XGK[5], XGK[7].
const WG = [
  0.129484966168869693270611432679082, 0.27970539148927666790146777142378,
  0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
];

/** Panels as parallel arrays (no object per panel: the quadrature runs in hot loops). */
class Panels {
  a: Float64Array;
  b: Float64Array;
  value: Float64Array;
  error: Float64Array;
  count = 0;

  constructor(capacity: number) {
    this.a = new Float64Array(capacity);
    this.b = new Float64Array(capacity);
    this.value = new Float64Array(capacity);
    this.error = new Float64Array(capacity);
  }

  /** Integrates fn over [a, b] with the 7/15 pair into panel i. */
  set(i: number, fn: (x: number) => number, a: number, b: number): void {
    const c = 0.5 * (a + b);
    const r = 0.5 * (b - a);
    const fc = fn(c);
    let kronrod = fc * WGK[7];
    let gauss = fc * WG[3];
    for (let j = 0; j < 7; j++) {
      const dx = r * XGK[j];
      const s = fn(c - dx) + fn(c + dx);
      kronrod += WGK[j] * s;
      if (j % 2 === 1) gauss += WG[(j - 1) / 2] * s;
    }
    this.a[i] = a;
    this.b[i] = b;
    this.value[i] = kronrod * r;
    this.error[i] = Math.abs((kronrod - gauss) * r);
  }
}

/** Reused between calls; a nested call (an integrand that integrates) gets its own. */
let pool: Panels | undefined = new Panels(256);

export interface QuadratureResult {
  value: number;
  /** Estimated absolute error (the pessimistic |K15 − G7| sum). */
  error: number;
  converged: boolean;
}

/**
 * ∫ fn over [points[0], points[last]], split at the given breakpoints (sorted, increasing),
 * bisecting the worst panel until the error estimate is below max(absTol, relTol·|value|).
 */
export function adaptiveQuadrature(
  fn: (x: number) => number,
  points: readonly number[],
  relTol: number,
  absTol = 0,
  maxPanels = 4000,
): QuadratureResult {
  const panels = pool ?? new Panels(256);
  pool = undefined;
  try {
    return integrate(panels, fn, points, relTol, absTol, maxPanels);
  } finally {
    panels.count = 0;
    pool = panels;
  }
}

function integrate(p: Panels, fn: (x: number) => number, points: readonly number[], relTol: number, absTol: number, maxPanels: number): QuadratureResult {
  for (let i = 0; i + 1 < points.length; i++) {
    if (points[i + 1] > points[i]) {
      grow(p, p.count + 1);
      p.set(p.count++, fn, points[i], points[i + 1]);
    }
  }
  let value = 0;
  let error = 0;
  for (let i = 0; i < p.count; i++) {
    value += p.value[i];
    error += p.error[i];
  }
  while (error > Math.max(absTol, relTol * Math.abs(value))) {
    if (p.count >= maxPanels) return { value, error, converged: false };
    let worst = 0;
    for (let i = 1; i < p.count; i++) if (p.error[i] > p.error[worst]) worst = i;
    const a = p.a[worst];
    const b = p.b[worst];
    const oldValue = p.value[worst];
    const oldError = p.error[worst];
    const mid = 0.5 * (a + b);
    if (mid <= a || mid >= b) return { value, error, converged: false };
    grow(p, p.count + 1);
    p.set(worst, fn, a, mid);
    p.set(p.count++, fn, mid, b);
    value += p.value[worst] + p.value[p.count - 1] - oldValue;
    error += p.error[worst] + p.error[p.count - 1] - oldError;
    if (!Number.isFinite(value)) return { value, error, converged: false };
  }
  // Re-add from scratch so the running updates leave no rounding drift.
  value = 0;
  error = 0;
  for (let i = 0; i < p.count; i++) {
    value += p.value[i];
    error += p.error[i];
  }
  return { value, error, converged: Number.isFinite(value) };
}

function grow(p: Panels, needed: number): void {
  if (needed <= p.a.length) return;
  const size = Math.max(needed, 2 * p.a.length);
  for (const key of ['a', 'b', 'value', 'error'] as const) {
    const next = new Float64Array(size);
    next.set(p[key]);
    p[key] = next;
  }
}
