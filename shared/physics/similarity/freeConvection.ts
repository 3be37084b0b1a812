// Laminar free convection from an isothermal vertical plate (Ostrach 1953, NACA Report 1111):
//   f''' + 3 f f'' − 2 f'² + θ = 0,   θ'' + 3 Pr f θ' = 0,
//   f(0) = f'(0) = 0, θ(0) = 1, f'(∞) = 0, θ(∞) = 0,
//   η = (y/x)(Gr_x/4)^¼,  ψ = 4ν (Gr_x/4)^¼ f(η),  u = U_c f',  U_c = 2√(gβΔT x) = (2ν/x)·Gr_x^½.
// Shooting on (f''(0), θ'(0)) with Newton and the variational equations, on a Taylor-series
// integration (taylor.ts) whose precision and domain grow with the iterate's accuracy; the last,
// full-precision shot is moved onto the root along its variations. The energy equation is
// carried as its first integral θ' = θ'(0)·E, E = e^{−3 Pr F}, F = ∫f, θ = 1 + θ'(0)·J, J' = E,
// with E' = −3 Pr f E: every equation is then polynomial; a thin high-Pr thermal layer is closed
// in closed form once it has decayed. The outer edge is where both tails have decayed to TAIL,
// with asymptotic far-field conditions there; a trial that misbehaves before (reverse flow, a
// velocity that rises again) gives its Newton step from where it left, a shorter domain.
// Every solve starts from the same fits (no continuation from other points), so a value does
// not depend on which worker solved it or what it solved before.
import { SolutionTrace, TraceBuilder } from './trace.js';
import { LruCache, registerCache, solveCounts } from './cache.js';
import { horner, orderFor, radiusStep, SERIES_LENGTH } from './taylor.js';
import { extendSeries, newtonCurvature, VARIATIONAL_ORDER } from './falknerSkan.js';

export interface FreeConvectionSolution {
  Pr: number;
  status: 'ok' | 'not-converged';
  /** f''(0): wall shear, τ_w = μ U_c f''(0) (Gr_x/4)^¼ / x. */
  wallShear: number;
  /** θ'(0) (negative): Nu_x = −θ'(0)·(Gr_x/4)^¼. */
  wallGradient: number;
  /** Largest f' (u_max/U_c) and where it lies. */
  maxVelocity: number;
  etaMaxVelocity: number;
  /** Outer η where f' has fallen to 1 % of its maximum. */
  eta99: number;
  /** f(∞): the entrainment. */
  fInfinity: number;
  etaInf: number;
  /**
   * Largest relative change of (f''(0), θ'(0)) had the far-field corrections (the heat left
   * beyond η∞) been dropped at this η∞: the size of the correction, far above what is left.
   */
  etaInfChange: number;
  trace?: SolutionTrace;
  integrations: number;
}

/** Local error per Taylor step of the final shot; the cheapest shots; see falknerSkan.ts. */
const EPS_FINAL = 1e-13;
const EPS_COARSE = 1e-10;
/** Full precision once the iterate is this close; accepted (moved by δ along ∂/∂s) when δ is below ACCEPT_CHANGE. */
const FINAL_ERROR = 3e-8;
const ACCEPT_CHANGE = 1e-7;
/** After this many full-precision shots a correction below NOISE_FLOOR_CHANGE is taken as final. */
const STALLED_FINAL_SHOTS = 3;
const NOISE_FLOOR_CHANGE = 1e-6;
/**
 * The edge: f' below TAIL times its maximum and θ below TAIL (e^{−13}). The far-field
 * conditions are exact for the linearised tails, so what they leave is of order TAIL².
 */
const TAIL = 2e-6;
const TAIL_GROWTH = 30;
/** Reverse flow beyond this fraction of the maximum velocity rejects a trial or a root. */
const REVERSE_FLOW = 1e-3;
const ETA_INF_MAX = 3000;
const MAX_STEPS = 20_000;
/**
 * Taylor steps one solve may spend in all (about a second): far outside the fitted Pr range
 * (Pr < 3e-4, where the velocity's decay e^{−3fη} makes the series stiff over a very long
 * domain) the answer is `not-converged` after a bounded time rather than minutes.
 */
const WORK_STEPS = 300_000;
let stepsLeft = WORK_STEPS;
/** Likewise for the number of shots (trials that fail at once cost few steps each). */
const WORK_SHOTS = 1200;
let shotsLeft = WORK_SHOTS;
const GUESS_ERROR = 0.05;

// Series buffers: y = [F, f, f', f'', J, E] (s…), then ∂y/∂f''(0) (a…), then ∂y/∂θ'(0) (b…).
const buffer = () => new Float64Array(SERIES_LENGTH);
const sF = buffer(), sf = buffer(), sg = buffer(), sh = buffer(), sJ = buffer(), sE = buffer();
const aF = buffer(), af = buffer(), ag = buffer(), ah = buffer(), aJ = buffer(), aE = buffer();
const bF = buffer(), bf = buffer(), bg = buffer(), bh = buffer(), bJ = buffer(), bE = buffer();
const Y = [sF, sf, sg, sh, sJ, sE];
const D1 = [aF, af, ag, ah, aJ, aE];
const D2 = [bF, bf, bg, bh, bJ, bE];
const SENSITIVITIES = [aF, bF];

/**
 * Taylor coefficients up to order p of the system (k3 = 3 Pr). `thermal` false once the thermal
 * layer is closed (E ≡ 0, J constant): its terms are skipped.
 */
function series(k3: number, s2: number, p: number, thermal: boolean): void {
  for (let k = 0; k < p; k++) {
    // f f'' (and f E) in full; f'² by symmetry, twice the products below the middle plus the middle square.
    let fh = 0, fE = 0, gg = 0;
    const half = (k + 1) >> 1;
    if (thermal) {
      for (let j = 0; j < half; j++) {
        const m = k - j;
        fh += sf[j] * sh[m] + sf[m] * sh[j];
        fE += sf[j] * sE[m] + sf[m] * sE[j];
        gg += sg[j] * sg[m];
      }
    } else {
      for (let j = 0; j < half; j++) {
        const m = k - j;
        fh += sf[j] * sh[m] + sf[m] * sh[j];
        gg += sg[j] * sg[m];
      }
    }
    gg *= 2;
    if ((k & 1) === 0) {
      const m = k >> 1;
      fh += sf[m] * sh[m];
      fE += sf[m] * sE[m];
      gg += sg[m] * sg[m];
    }
    const inv = 1 / (k + 1);
    sF[k + 1] = sf[k] * inv;
    sf[k + 1] = sg[k] * inv;
    sg[k + 1] = sh[k] * inv;
    sh[k + 1] = (-3 * fh + 2 * gg - ((k === 0 ? 1 : 0) + s2 * sJ[k])) * inv;
    sJ[k + 1] = sE[k] * inv;
    sE[k + 1] = -k3 * fE * inv;
  }
  extendSeries(sF, sf, sg, sh, p);
}

/**
 * Taylor coefficients to order q of both variational systems, from the solution's (computed
 * first, to order p ≥ q); the F series are zeroed above q so the trace reads order p.
 */
function variationalSeries(k3: number, s2: number, p: number, q: number, thermal: boolean): void {
  for (let k = 0; k < q; k++) {
    let ah_ = 0, bh_ = 0, agg = 0, bgg = 0, aE_ = 0, bE_ = 0;
    for (let j = 0; j <= k; j++) {
      const m = k - j;
      const fj = sf[j], gj = sg[j], hm = sh[m];
      ah_ += af[j] * hm + fj * ah[m];
      bh_ += bf[j] * hm + fj * bh[m];
      agg += gj * ag[m];
      bgg += gj * bg[m];
    }
    if (thermal) {
      for (let j = 0; j <= k; j++) {
        const m = k - j;
        const fj = sf[j], Em = sE[m];
        aE_ += af[j] * Em + fj * aE[m];
        bE_ += bf[j] * Em + fj * bE[m];
      }
    }
    const inv = 1 / (k + 1);
    aF[k + 1] = af[k] * inv;
    af[k + 1] = ag[k] * inv;
    ag[k + 1] = ah[k] * inv;
    ah[k + 1] = (-3 * ah_ + 4 * agg - s2 * aJ[k]) * inv;
    bF[k + 1] = bf[k] * inv;
    bf[k + 1] = bg[k] * inv;
    bg[k + 1] = bh[k] * inv;
    bh[k + 1] = (-3 * bh_ + 4 * bgg - s2 * bJ[k] - sJ[k]) * inv;
    aJ[k + 1] = aE[k] * inv;
    bJ[k + 1] = bE[k] * inv;
    aE[k + 1] = -k3 * aE_ * inv;
    bE[k + 1] = -k3 * bE_ * inv;
  }
  extendSeries(aF, af, ag, ah, q);
  extendSeries(bF, bf, bg, bh, q);
  aF.fill(0, q + 4, p + 4);
  bF.fill(0, q + 4, p + 4);
}

/** Step length for the series just computed: f, f', f'', J and E control it. */
function stepFor(p: number, epsRoot: number): number {
  let scale = 1, last = 0, previous = 0;
  for (let i = 1; i < 6; i++) {
    const a = Y[i];
    scale = Math.max(scale, Math.abs(a[0]));
    last = Math.max(last, Math.abs(a[p]));
    previous = Math.max(previous, Math.abs(a[p - 1]));
  }
  return radiusStep(scale, previous, last, p, epsRoot);
}

interface Shot {
  /** 'edge': both tails decayed; 'exit': the trial misbehaved first (residuals taken there). */
  kind: 'edge' | 'exit' | 'failed';
  residual: [number, number];
  jacobian: [[number, number], [number, number]];
  /** The far-field corrections in the residuals (for `etaInfChange`). */
  correction: [number, number];
  edge: number;
  fEnd: number;
  gMax: number;
  steps?: TraceBuilder;
}

const FAILED: Shot = {
  kind: 'failed',
  residual: [NaN, NaN],
  jacobian: [
    [NaN, NaN],
    [NaN, NaN],
  ],
  correction: [NaN, NaN],
  edge: NaN,
  fEnd: NaN,
  gMax: NaN,
};

/**
 * ∫₀^∞ e^{−k3 (F(η+τ) − F(η))} dτ for a thin tail, F expanded as f τ + f' τ²/2 + f'' τ³/6:
 * (1/(k3 f))·(1 − f'/(k3 f²) − f''/(k3² f³) + 3 f'²/(k3² f⁴)) (our own algebra, Laplace's method).
 */
function tailLength(k3: number, f: number, g: number, h: number): number {
  const a = k3 * f;
  return (1 - g / (a * f) - h / (a * a * f) + (3 * g * g) / (a * a * f * f)) / a;
}

/** The far-field residuals at the current point (values v, sensitivities d1, d2). */
function farField(Pr: number, s2: number, v: Float64Array, d1: Float64Array, d2: Float64Array, kind: 'edge' | 'exit', eta: number, gMax: number, steps?: TraceBuilder): Shot {
  const k3 = 3 * Pr;
  const [, f, g, h, J, E] = v;
  if (!(f > 0)) return FAILED;
  // Beyond η∞ f ≈ f_∞ and the tails are linear: (f'' + 3 f f')' = 5 f'² − θ integrates to
  // f'' + 3 f f' = ∫θ − 5∫f'², with θ ∝ e^{−3 Pr f τ} (∫θ = θ/(3 Pr f)) and f' decaying at
  // ν = 3 f·min(1, Pr); and J(∞) = J + E·tailLength (our own algebra).
  const theta = 1 + s2 * J;
  const nu = 3 * f * Math.min(1, Pr);
  const T = tailLength(k3, f, g, h);
  const c1 = -theta / (k3 * f) + (5 * g * g) / (2 * nu);
  const c2 = s2 * E * T;
  const residual: [number, number] = [h + 3 * f * g + c1, 1 + s2 * J + c2];
  const column = (d: Float64Array, q: number): [number, number] => {
    const [, df, dg, dh, dJ, dE] = d;
    const dTheta = s2 * dJ + (q === 1 ? J : 0);
    const a = dh + 3 * (df * g + f * dg) - dTheta / (k3 * f) + (theta * df) / (k3 * f * f) + (5 * g * dg) / nu;
    const b = (q === 1 ? J + E * T : 0) + s2 * (dJ + dE * T - (E * df) / (k3 * f * f));
    return [a, b];
  };
  const [a1, b1] = column(d1, 0);
  const [a2, b2] = column(d2, 1);
  return {
    kind,
    residual,
    jacobian: [
      [a1, a2],
      [b1, b2],
    ],
    correction: [c1, c2],
    edge: eta,
    fEnd: f,
    gMax,
    steps,
  };
}

// State at the step ends: values, and the two sensitivity sets.
const V = new Float64Array(6);
const W1 = new Float64Array(6);
const W2 = new Float64Array(6);

/**
 * Once e^{−3 Pr F} decays much faster than the velocity varies (high Pr, beyond the thermal
 * layer), its remaining integral is added to J in closed form (tailLength) and E set to zero:
 * otherwise its Taylor series would hold the steps to the thermal layer's scale all the way out.
 * Only when what this drops is negligible: the buoyancy left beyond this point, ∫θ ≈
 * −θ'(0)·E·T² with T the tail length, and the third-order terms of T's expansion. (Far out at
 * high Pr an explicit series keeps E at the stability limit of its step, a noise floor near
 * 1e-12 that would never pass stricter bounds.)
 */
function closeThermalLayer(k3: number, s2: number): boolean {
  const [, f, g, h, J, E] = V;
  if (!(f > 0)) return false;
  const a = k3 * f;
  // The small ratios of the expansion in tailLength; its error is of their third power.
  const ratio = Math.max(Math.abs(g) / (a * f), Math.sqrt(Math.abs(h) / (a * a * f)));
  if (ratio > 0.1) return false;
  const T = tailLength(k3, f, g, h);
  if (Math.abs(s2) * E * T * T > 1e-13 || E * T * ratio ** 3 > 1e-15 * Math.abs(J)) return false;
  for (const W of [W1, W2]) {
    // ∂T/∂s: to first order through f only; the other terms are far smaller.
    W[4] += W[5] * T - (E * W[1]) / (a * f);
    W[5] = 0;
  }
  V[4] = J + E * T;
  V[5] = 0;
  return true;
}

/**
 * One trial (f''(0), θ'(0)) = (s1, s2) at local precision `eps`, with both variational
 * systems, until the edge where the tails have decayed to `tail` (or `minEdge`, if farther), a
 * misbehaving tail, or a failure.
 */
function shoot(Pr: number, s1: number, s2: number, eps: number, tail: number, keepTrace: boolean, minEdge: number): Shot {
  if (--shotsLeft < 0) return FAILED;
  const k3 = 3 * Pr;
  const p = orderFor(eps);
  const epsRoot = Math.pow(eps, 1 / p);
  // Coefficients per variable: F to order p + 3, f to p + 2, f' to p + 1 (extendSeries), the rest to p.
  const counts = [p + 4, p + 3, p + 2, p + 1, p + 1, p + 1];
  const countsVariational = [0, 0, 0, 0, 0, 0];
  const builder = keepTrace ? new TraceBuilder(p + 4, 2) : undefined;
  V.set([0, 0, 0, s1, 0, 1]);
  W1.set([0, 0, 0, 1, 0, 0]);
  W2.fill(0);
  let eta = 0;
  let gMax = 0;
  let pastMaximum = false;
  let thermalDone = false;
  let stopAt = Infinity;
  for (let step = 0; step < MAX_STEPS; step++) {
    if (--stepsLeft < 0) return FAILED;
    for (let i = 0; i < 6; i++) {
      Y[i][0] = V[i];
      D1[i][0] = W1[i];
      D2[i][0] = W2[i];
    }
    series(k3, s2, p, !thermalDone);
    let dt = stepFor(p, epsRoot);
    // A trial that turns into reverse flow is caught where it does (sampling the step's
    // polynomial), where its Newton step is still informative.
    if (gMax > 0) {
      for (let j = 1; j <= 8; j++) {
        if (horner(sg, 0, p + 2, (dt * j) / 8) < -REVERSE_FLOW * gMax) {
          dt = (dt * j) / 8;
          break;
        }
      }
    }
    if (!(dt > 1e-12)) return FAILED;
    const last = eta + dt >= stopAt;
    if (last) dt = stopAt - eta;
    // The variational series at a lower order, unless a decay much faster than the step (the
    // velocity's e^{−3fη} at low Pr, e^{−3 Pr F} in a thin thermal layer) makes the problem stiff
    // there: a truncated series is then only stable at the full order.
    const stiffness = (3 * V[1] + (thermalDone ? 0 : k3 * V[1])) * dt;
    const q = stiffness > 2 ? p : Math.min(p, VARIATIONAL_ORDER);
    variationalSeries(k3, s2, p, q, !thermalDone);
    for (let i = 0; i < 6; i++) countsVariational[i] = counts[i] - p + q;
    builder?.push(eta, sF, SENSITIVITIES);
    for (let i = 0; i < 6; i++) {
      V[i] = horner(Y[i], 0, counts[i], dt);
      W1[i] = horner(D1[i], 0, countsVariational[i], dt);
      W2[i] = horner(D2[i], 0, countsVariational[i], dt);
    }
    eta = last ? stopAt : eta + dt;
    if (!thermalDone) thermalDone = closeThermalLayer(k3, s2);
    const [F, , g, h, J] = V;
    const theta = 1 + s2 * J;
    // A wild trial: velocity far beyond any buoyant value, fluid drawn out of the wall
    // (F < 0 makes e^{−3 Pr F} explode), or no edge in sight.
    if (!Number.isFinite(F + g + h + J) || Math.abs(g) > 10 || (!thermalDone && -k3 * F > 600) || eta > ETA_INF_MAX) return FAILED;
    if (last) return farField(Pr, s2, V, W1, W2, 'edge', eta, gMax, builder);
    gMax = Math.max(gMax, g);
    // (A long step may carry a wild trial past the maximum and below zero at once.)
    if (!pastMaximum && h < 0 && gMax > 0) pastMaximum = true;
    if (!pastMaximum && !thermalDone) {
      if (g < -REVERSE_FLOW * Math.max(gMax, 1e-3)) return FAILED; // reverse flow at the wall
      continue;
    }
    // After its maximum, and beyond the thermal layer, the velocity falls monotonically to zero.
    // (A wrong θ'(0) leaves θ(∞) ≠ 0, which shows in the velocity further out, where the
    // far-field conditions belong.)
    if (g < -REVERSE_FLOW * gMax || (h > 0 && g > tail * gMax)) {
      return farField(Pr, s2, V, W1, W2, 'exit', eta, gMax, builder);
    }
    // (f'' is checked too, so that a profile crossing zero is not taken for a decayed one.)
    if (stopAt === Infinity && Math.abs(g) <= tail * gMax && Math.abs(h) <= 3 * V[1] * tail * gMax && Math.abs(theta) <= tail) {
      if (eta >= minEdge) return farField(Pr, s2, V, W1, W2, 'edge', eta, gMax, builder);
      stopAt = minEdge;
    }
  }
  return FAILED;
}

/** Σ c_k x^k (lowest power first) and its derivative. */
function polynomial(c: readonly number[], x: number): [number, number] {
  let value = 0;
  let slope = 0;
  for (let k = c.length - 1; k >= 0; k--) {
    slope = slope * x + value;
    value = value * x + c[k];
  }
  return [value, slope];
}

// Our own degree-7 fits in x = log10 Pr over 1e-2 … 1e4 to this solver's values (a starting
// guess only): ln f''(0) within 0.08 %, and ln(θ'(0)/LeFevre's interpolation) within 0.04 %.
const GUESS_SHEAR = [-0.442764, -0.367991, -0.0685788, 0.00966545, 0.000615434, -0.000724221, 0.000185067, -1.70963e-5];
const GUESS_GRADIENT = [0.000424684, 0.000227896, -0.00214169, 0.000325703, 0.000513579, -0.000113185, -2.50758e-5, 6.07261e-6];

/**
 * Starting guesses only (Newton sets the values): −θ'(0) from the interpolation formula
 * 0.75 Pr^½ / (0.609 + 1.221 Pr^½ + 1.238 Pr)^¼ (LeFevre 1956, from memory), both refined by the
 * fits above, continued linearly in log10 Pr outside their range.
 */
function initialGuess(Pr: number): [number, number] {
  const x = Math.log10(Pr);
  const xc = Math.min(4, Math.max(-2, x));
  const [a, aSlope] = polynomial(GUESS_SHEAR, xc);
  const [b, bSlope] = polynomial(GUESS_GRADIENT, xc);
  const lefevre = (-0.75 * Math.sqrt(Pr)) / Math.pow(0.609 + 1.221 * Math.sqrt(Pr) + 1.238 * Pr, 0.25);
  return [Math.exp(a + aSlope * (x - xc)), lefevre * Math.exp(b + bSlope * (x - xc))];
}

function precisionFor(error: number): number {
  if (error <= FINAL_ERROR) return EPS_FINAL;
  return Math.max(EPS_FINAL, Math.min(EPS_COARSE, 1e-2 * error * error));
}

interface RootResult {
  ok: boolean;
  s: [number, number];
  shot?: Shot;
  trace?: SolutionTrace;
  integrations: number;
}

/**
 * Newton on (f''(0), θ'(0)) from `guess`, no component moving by more than half its value per
 * step; a trial that fails outright is pulled halfway back towards the last good iterate.
 */
function findRoot(Pr: number, guess: [number, number], minEdge: number): RootResult {
  let s: [number, number] = [guess[0], guess[1]];
  let good: [number, number] | undefined;
  let error = GUESS_ERROR;
  let previousChange = NaN;
  let previousTail = NaN;
  let finalShots = 0;
  let reachedTail = 1;
  let tailGrowth = Infinity;
  let integrations = 0;
  let retreats = 0;
  for (let iter = 0; iter < 100; iter++) {
    // The domain grows with the iterate's precision (tails of size τ leave errors of order τ²);
    // once a shot has failed, by at most a factor TAIL_GROWTH in τ per shot from the last one
    // that got through (a long domain at once can throw a still rough iterate far off).
    const final = precisionFor(error) === EPS_FINAL && reachedTail / tailGrowth <= TAIL;
    const tail = final ? TAIL : Math.max(TAIL, 0.1 * Math.sqrt(error), reachedTail / tailGrowth);
    const eps = final ? EPS_FINAL : Math.max(precisionFor(error), 10 * EPS_FINAL);
    const shot = shoot(Pr, s[0], s[1], eps, tail, final, minEdge);
    integrations++;
    if (shot.kind === 'failed') {
      tailGrowth = TAIL_GROWTH;
      if (!good || ++retreats > 40) return { ok: false, s, integrations };
      s = [0.5 * (s[0] + good[0]), 0.5 * (s[1] + good[1])];
      error = Math.max(error, GUESS_ERROR);
      continue;
    }
    retreats = 0;
    if (shot.kind === 'edge') reachedTail = Math.min(reachedTail, tail);
    const [[a, b], [c, d]] = shot.jacobian;
    const det = a * d - b * c;
    if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return { ok: false, s, integrations };
    const [r1, r2] = shot.residual;
    const step: [number, number] = [-(d * r1 - b * r2) / det, -(-c * r1 + a * r2) / det];
    const change = Math.max(Math.abs(step[0] / s[0]), Math.abs(step[1] / s[1]));
    // (Only on an unchanged domain: a longer one moves the root by its own amount.)
    const curvature = newtonCurvature(change, tail === previousTail ? previousChange : NaN);
    // Accepted when the correction is small enough, or (after a few full-precision shots) when
    // it no longer shrinks because the shots' own noise sets it: then it leaves about change².
    if (final && shot.kind === 'edge') finalShots++;
    const settled = change <= ACCEPT_CHANGE && curvature * change * change <= 1e-14;
    const atNoiseFloor = finalShots >= STALLED_FINAL_SHOTS && change <= NOISE_FLOOR_CHANGE;
    if (shot.kind === 'edge' && final && (settled || atNoiseFloor) && shot.steps) {
      const trace = shot.steps.build(shot.edge, step);
      return { ok: true, s: [s[0] + step[0], s[1] + step[1]], shot, trace, integrations };
    }
    const lambda = Math.min(1, 0.5 / change);
    // After a step from an edge the error is about change² (or what the shot's precision and
    // domain allow); from an exit only about the step's own size.
    const fullStep = shot.kind === 'edge' && lambda === 1;
    error = fullStep ? Math.max(curvature * change * change, 10 * eps, tail * tail, 1e-16) : Math.min(change, GUESS_ERROR * 10);
    previousChange = fullStep ? change : NaN;
    previousTail = tail;
    good = s;
    s = [s[0] + lambda * step[0], s[1] + lambda * step[1]];
  }
  return { ok: false, s, integrations };
}

/** Solves from scratch (no cache). Prefer `solveFreeConvection`. */
export function solveFreeConvectionUncached(Pr: number, options: { etaInfStart?: number } = {}): FreeConvectionSolution {
  if (!(Pr > 0) || !Number.isFinite(Pr)) throw new RangeError(`Pr must be positive and finite (got ${Pr})`);
  solveCounts.freeConvectionSolves++;
  const failed: FreeConvectionSolution = {
    Pr,
    status: 'not-converged',
    wallShear: NaN,
    wallGradient: NaN,
    maxVelocity: NaN,
    etaMaxVelocity: NaN,
    eta99: NaN,
    fInfinity: NaN,
    etaInf: NaN,
    etaInfChange: NaN,
    integrations: 0,
  };
  const minEdge = Math.min(options.etaInfStart ?? 0, ETA_INF_MAX);
  const work = { integrations: 0 };
  stepsLeft = WORK_STEPS;
  shotsLeft = WORK_SHOTS;
  const root = physicalRoot(Pr, initialGuess(Pr), minEdge, work) ?? continuationInPr(Pr, minEdge, work);
  if (!root?.trace || !root.shot) return { ...failed, integrations: work.integrations };
  const [[a, b], [c, d]] = root.shot.jacobian;
  const [c1, c2] = root.shot.correction;
  const det = a * d - b * c;
  const change = Math.max(Math.abs((d * c1 - b * c2) / det / root.s[0]), Math.abs((-c * c1 + a * c2) / det / root.s[1]));
  return finish(Pr, root.s, root.trace, root.trace.node(1, root.trace.length - 1), root.shot.edge, change, work.integrations);
}

/** A root from `guess` without reverse flow (buoyancy drives u > 0 everywhere: one with is spurious). */
function physicalRoot(Pr: number, guess: [number, number], minEdge: number, work: { integrations: number }): RootResult | undefined {
  if (stepsLeft <= 0 || shotsLeft <= 0) return undefined;
  const root = findRoot(Pr, guess, minEdge);
  work.integrations += root.integrations;
  return root.ok && root.trace && root.shot && withoutReverseFlow(root.trace, root.shot.gMax) ? root : undefined;
}

/** Largest factor in Pr per continuation step. */
const PR_STEP = Math.sqrt(10);

/**
 * The fallback when the direct start fails (far outside 1e-2 ≤ Pr ≤ 1e4, where the starting
 * fits are extrapolated): solve at the nearest end of that range, then step towards Pr by
 * factors of up to √10, each start the previous root scaled by the fits' own ratio, a failed
 * step retried at half the distance (in log Pr). It depends on Pr alone, so the answer does too.
 */
function continuationInPr(Pr: number, minEdge: number, work: { integrations: number }): RootResult | undefined {
  let from = Math.min(1e4, Math.max(1e-2, Pr));
  if (from === Pr) return undefined;
  let root = physicalRoot(from, initialGuess(from), 0, work);
  for (let steps = 0; root && from !== Pr && steps < 40; steps++) {
    let to = Math.min(Math.max(Pr, from / PR_STEP), from * PR_STEP);
    let next: RootResult | undefined;
    for (let tries = 0; tries < 6 && !next; tries++) {
      if (tries > 0) to = Math.sqrt(from * to);
      const [g0, g1] = initialGuess(from);
      const [h0, h1] = initialGuess(to);
      next = physicalRoot(to, [(root.s[0] * h0) / g0, (root.s[1] * h1) / g1], to === Pr ? minEdge : 0, work);
    }
    if (!next) return undefined;
    root = next;
    from = to;
  }
  return from === Pr ? root : undefined;
}

function withoutReverseFlow(trace: SolutionTrace, gMax: number): boolean {
  for (let i = 0; i + 1 < 2 * trace.length - 1; i++) {
    const x = i % 2 === 0 ? trace.eta[i / 2] : 0.5 * (trace.eta[(i - 1) / 2] + trace.eta[(i + 1) / 2]);
    if (trace.derivative(2, x) < -REVERSE_FLOW * gMax) return false;
  }
  return true;
}

function finish(Pr: number, s: [number, number], trace: SolutionTrace, fEnd: number, etaInf: number, change: number, integrations: number): FreeConvectionSolution {
  // Maximum of f' where f'' changes sign, then the outer 1 % point.
  let i = 1;
  while (i < trace.length && trace.node(3, i) > 0) i++;
  let a = trace.eta[i - 1];
  let b = trace.eta[Math.min(i, trace.length - 1)];
  for (let it = 0; it < 100 && b - a > 1e-15 * b; it++) {
    const c = 0.5 * (a + b);
    if (trace.derivative(3, c) > 0) a = c;
    else b = c;
  }
  const etaMax = 0.5 * (a + b);
  const uMax = trace.derivative(2, etaMax);
  const level = 0.01 * uMax;
  let j = i;
  while (j < trace.length && trace.node(2, j) > level) j++;
  let eta99 = NaN;
  if (j < trace.length) {
    let lo = trace.eta[j - 1];
    let hi = trace.eta[j];
    for (let it = 0; it < 100 && hi - lo > 1e-15 * hi; it++) {
      const c = 0.5 * (lo + hi);
      if (trace.derivative(2, c) > level) lo = c;
      else hi = c;
    }
    eta99 = 0.5 * (lo + hi);
  }
  return {
    Pr,
    status: 'ok',
    wallShear: s[0],
    wallGradient: s[1],
    maxVelocity: uMax,
    etaMaxVelocity: etaMax,
    eta99,
    fInfinity: fEnd,
    etaInf,
    etaInfChange: change,
    trace,
    integrations,
  };
}

const cache = new LruCache<number, FreeConvectionSolution>(256);
registerCache(() => cache.clear());

/** The Ostrach solution for one Prandtl number, cached (a sweep over Gr or Ra at fixed Pr solves once). */
export function solveFreeConvection(Pr: number): FreeConvectionSolution {
  const hit = cache.get(Pr);
  if (hit) {
    solveCounts.freeConvectionCacheHits++;
    return hit;
  }
  const sol = solveFreeConvectionUncached(Pr);
  cache.set(Pr, sol);
  return sol;
}
