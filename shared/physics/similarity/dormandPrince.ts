// Adaptive explicit Runge–Kutta integration with the Dormand–Prince 5(4) embedded pair
// (Dormand & Prince 1980, J. Comput. Appl. Math. 6, 19–26; coefficients as in Hairer,
// Nørsett & Wanner, Solving ODEs I, table 5.2).

/** Right-hand side y' = F(t, y), written into `dydt`. */
export type Rhs = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface IntegrateOptions {
  rtol: number;
  atol: number;
  /** Only the first `errorComponents` entries drive the step size (sensitivities just follow). */
  errorComponents?: number;
  initialStep?: number;
  maxStep?: number;
  maxSteps?: number;
  /** Called at the start and after every accepted step; returning false stops the integration. */
  onStep?: (t: number, y: Float64Array, dydt: Float64Array) => boolean | void;
}

export type IntegrateStatus = 'done' | 'stopped' | 'max-steps' | 'step-too-small' | 'non-finite';

export interface IntegrateResult {
  status: IntegrateStatus;
  t: number;
  y: Float64Array;
  steps: number;
}

const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
// Fifth-order minus embedded fourth-order weights: the local error estimate.
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

/** Integrates y' = rhs(t, y) from t0 to t1 (t1 > t0). `y0` is not modified. */
export function integrate(rhs: Rhs, t0: number, t1: number, y0: Float64Array, opts: IntegrateOptions): IntegrateResult {
  const n = y0.length;
  const nErr = opts.errorComponents ?? n;
  const maxSteps = opts.maxSteps ?? 200_000;
  const maxStep = opts.maxStep ?? t1 - t0;
  const y = Float64Array.from(y0);
  const yNew = new Float64Array(n);
  const tmp = new Float64Array(n);
  const k1 = new Float64Array(n), k2 = new Float64Array(n), k3 = new Float64Array(n);
  const k4 = new Float64Array(n), k5 = new Float64Array(n), k6 = new Float64Array(n), k7 = new Float64Array(n);

  let t = t0;
  rhs(t, y, k1);
  if (opts.onStep && opts.onStep(t, y, k1) === false) return { status: 'stopped', t, y, steps: 0 };
  let h = Math.min(opts.initialStep ?? 1e-3 * (t1 - t0), maxStep);
  let steps = 0;
  let rejectedLast = false;

  while (t < t1) {
    if (steps >= maxSteps) return { status: 'max-steps', t, y, steps };
    let last = false;
    if (t + h >= t1) {
      h = t1 - t;
      last = true;
    }
    if (h <= 1e-14 * Math.max(1, Math.abs(t))) return { status: 'step-too-small', t, y, steps };

    for (let i = 0; i < n; i++) tmp[i] = y[i] + h * A21 * k1[i];
    rhs(t + C2 * h, tmp, k2);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
    rhs(t + C3 * h, tmp, k3);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
    rhs(t + C4 * h, tmp, k4);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
    rhs(t + C5 * h, tmp, k5);
    for (let i = 0; i < n; i++)
      tmp[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
    rhs(t + h, tmp, k6);
    for (let i = 0; i < n; i++)
      yNew[i] = y[i] + h * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
    rhs(t + h, yNew, k7);

    let err = 0;
    for (let i = 0; i < nErr; i++) {
      const e = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
      const scale = opts.atol + opts.rtol * Math.max(Math.abs(y[i]), Math.abs(yNew[i]));
      const r = e / scale;
      err += r * r;
    }
    err = Math.sqrt(err / nErr);
    if (!Number.isFinite(err)) {
      // A blown-up trial step: retry smaller, give up once the step is hopeless.
      h *= 0.1;
      rejectedLast = true;
      continue;
    }

    if (err <= 1) {
      t = last ? t1 : t + h;
      y.set(yNew);
      k1.set(k7);
      steps++;
      for (let i = 0; i < n; i++) if (!Number.isFinite(y[i])) return { status: 'non-finite', t, y, steps };
      if (opts.onStep && opts.onStep(t, y, k1) === false) return { status: 'stopped', t, y, steps };
      let factor = err === 0 ? 5 : 0.9 * Math.pow(err, -0.2);
      factor = Math.min(rejectedLast ? 1 : 5, Math.max(0.2, factor));
      h = Math.min(h * factor, maxStep);
      rejectedLast = false;
    } else {
      h *= Math.max(0.2, 0.9 * Math.pow(err, -0.2));
      rejectedLast = true;
    }
  }
  return { status: 'done', t, y, steps };
}
