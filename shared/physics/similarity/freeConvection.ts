// Laminar free convection from an isothermal vertical plate (Ostrach 1953, NACA Report 1111):
//   f''' + 3 f f'' − 2 f'² + θ = 0,   θ'' + 3 Pr f θ' = 0,
//   f(0) = f'(0) = 0, θ(0) = 1, f'(∞) = 0, θ(∞) = 0,
//   η = (y/x)(Gr_x/4)^¼,  ψ = 4ν (Gr_x/4)^¼ f(η),  u = U_c f',  U_c = 2√(gβΔT x) = (2ν/x)·Gr_x^½.
// Shooting on (f''(0), θ'(0)) with Newton. The energy equation is carried as its first
// integral θ' = θ'(0)·e^{−3 Pr F}, F = ∫f, θ = 1 + θ'(0)·J, J' = e^{−3 Pr F}: this removes the
// stiffness of the thin high-Pr thermal layer, so the adaptive integrator takes long steps in
// the thick outer velocity layer. η∞ grows until the decay of the slowest tail is resolved.
import { integrate } from './dormandPrince.js';
import { SolutionTrace, TraceBuilder } from './trace.js';
import { LruCache, registerCache, solveCounts } from './cache.js';

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
  /** Largest relative change of (f''(0), θ'(0)) between the last two η∞. */
  etaInfChange: number;
  trace?: SolutionTrace;
  integrations: number;
}

const RTOL = 1e-12;
const ATOL = 1e-15;
const ETA_INF_MAX = 3000;
const ETA_CHANGE_TOL = 1e-11;

interface Shot {
  ok: boolean;
  residual: [number, number];
  jacobian: [[number, number], [number, number]];
  fEnd: number;
  /** No reverse flow: buoyancy drives u > 0 everywhere, so a root with u < 0 is spurious. */
  physical: boolean;
  trace?: SolutionTrace;
}

function shoot(Pr: number, s1: number, s2: number, etaInf: number, keepTrace: boolean): Shot {
  const k = 3 * Pr;
  // y = [F, f, f', f'', J] then ∂/∂s1 of the same five, then ∂/∂s2.
  const rhs = (_t: number, y: Float64Array, dy: Float64Array): void => {
    const F = y[0], f = y[1], g = y[2], h = y[3], J = y[4];
    const E = Math.exp(-k * F);
    const theta = 1 + s2 * J;
    dy[0] = f;
    dy[1] = g;
    dy[2] = h;
    dy[3] = -3 * f * h + 2 * g * g - theta;
    dy[4] = E;
    for (let p = 0; p < 2; p++) {
      const o = 5 + 5 * p;
      const dF = y[o], df = y[o + 1], dg = y[o + 2], dh = y[o + 3], dJ = y[o + 4];
      const dTheta = s2 * dJ + (p === 1 ? J : 0);
      dy[o] = df;
      dy[o + 1] = dg;
      dy[o + 2] = dh;
      dy[o + 3] = -3 * (df * h + f * dh) + 4 * g * dg - dTheta;
      dy[o + 4] = -k * E * dF;
    }
  };
  const y0 = new Float64Array(15);
  y0[3] = s1;
  y0[5 + 3] = 1;
  const builder = keepTrace ? new TraceBuilder() : undefined;
  const row = [0, 0, 0, 0, 0, 0];
  let bad = false;
  let gMax = 0;
  let gMin = 0;
  const res = integrate(rhs, 0, etaInf, y0, {
    rtol: RTOL,
    atol: ATOL,
    errorComponents: 5,
    initialStep: 1e-4,
    onStep: (t, y, dy) => {
      // A wild trial: velocity far beyond any buoyant value, or fluid drawn out of the wall
      // (F < 0 makes e^{−3 Pr F} explode).
      gMax = Math.max(gMax, y[2]);
      gMin = Math.min(gMin, y[2]);
      if (Math.abs(y[2]) > 10 || -k * y[0] > 600 || Math.abs(y[4]) > 1e6) {
        bad = true;
        return false;
      }
      if (builder) {
        const E = Math.exp(-k * y[0]);
        row[0] = y[0];
        row[1] = y[1];
        row[2] = y[2];
        row[3] = y[3];
        row[4] = dy[3];
        row[5] = -3 * (y[2] * y[3] + y[1] * dy[3]) + 4 * y[2] * y[3] - s2 * E;
        builder.push(t, row);
      }
      return true;
    },
  });
  if (bad || res.status !== 'done' || !(res.y[1] > 0)) {
    return { ok: false, residual: [NaN, NaN], jacobian: [[NaN, NaN], [NaN, NaN]], fEnd: NaN, physical: false };
  }
  // Asymptotic (Robin) conditions at η∞: beyond the layer f → f∞ and both tails decay as
  // exponentials, f' ∝ e^{−3 f∞ η} and θ ∝ e^{−3 Pr f∞ η}, so f' + f''/(3f) = 0 and
  // θ + θ'/(3 Pr f) = 0 hold up to terms quadratic in the tails.
  const y = res.y;
  const f = y[1], g = y[2], h = y[3], J = y[4];
  const E = Math.exp(-k * y[0]);
  const residual: [number, number] = [g + h / (3 * f), 1 + s2 * J + (s2 * E) / (k * f)];
  const jac = (p: number): [number, number] => {
    const o = 5 + 5 * p;
    const dF = y[o], df = y[o + 1], dg = y[o + 2], dh = y[o + 3], dJ = y[o + 4];
    const d1 = dg + dh / (3 * f) - (h * df) / (3 * f * f);
    const d2 = (p === 1 ? J + E / (k * f) : 0) + s2 * dJ - (s2 * E * dF) / f - (s2 * E * df) / (k * f * f);
    return [d1, d2];
  };
  const [a1, a2] = jac(0);
  const [b1, b2] = jac(1);
  const physical = gMin >= -1e-3 * gMax;
  return { ok: true, residual, jacobian: [[a1, b1], [a2, b2]], fEnd: f, physical, trace: builder?.build() };
}

/** Starting guesses only (Newton sets the values): a quadratic fit in log Pr for f''(0), and for −θ'(0) the
 * interpolation formula 0.75 Pr^½ / (0.609 + 1.221 Pr^½ + 1.238 Pr)^¼ (LeFevre 1956, from memory). */
function initialGuess(Pr: number): [number, number] {
  const x = Math.log10(Pr);
  const s1 = Math.exp(-0.4808 - 0.3375 * x - 0.04436 * x * x);
  const s2 = (-0.75 * Math.sqrt(Pr)) / Math.pow(0.609 + 1.221 * Math.sqrt(Pr) + 1.238 * Pr, 0.25);
  return [s1, s2];
}

interface LevelResult {
  ok: boolean;
  s: [number, number];
  shot?: Shot;
  integrations: number;
}

const norm = (r: [number, number]) => Math.hypot(r[0], r[1]);

/** Damped Newton on (f''(0), θ'(0)) at fixed η∞. */
function solveLevel(Pr: number, etaInf: number, guess: [number, number]): LevelResult {
  let s: [number, number] = [guess[0], guess[1]];
  let integrations = 1;
  let shot = shoot(Pr, s[0], s[1], etaInf, true);
  if (!shot.ok) return { ok: false, s, integrations };
  for (let iter = 0; iter < 60; iter++) {
    const [[a, b], [c, d]] = shot.jacobian;
    const det = a * d - b * c;
    if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return { ok: false, s, integrations };
    const [r1, r2] = shot.residual;
    const step: [number, number] = [-(d * r1 - b * r2) / det, -(-c * r1 + a * r2) / det];
    let lambda = 1;
    let accepted = false;
    for (let tries = 0; tries < 30; tries++) {
      const trial: [number, number] = [s[0] + lambda * step[0], s[1] + lambda * step[1]];
      const next = shoot(Pr, trial[0], trial[1], etaInf, true);
      integrations++;
      if (next.ok && (norm(next.residual) < norm(shot.residual) || lambda === 1 && norm(next.residual) < 1e-6)) {
        s = trial;
        shot = next;
        accepted = true;
        break;
      }
      lambda *= 0.5;
    }
    const small = Math.abs(lambda * step[0]) <= 1e-13 * Math.abs(s[0]) && Math.abs(lambda * step[1]) <= 1e-13 * Math.abs(s[1]);
    if (small || norm(shot.residual) < 1e-15) return { ok: true, s, shot, integrations };
    if (!accepted) {
      // No decrease possible: at the noise floor of the integrator if the step is already tiny.
      const tiny = Math.abs(step[0]) <= 1e-10 * Math.abs(s[0]) && Math.abs(step[1]) <= 1e-10 * Math.abs(s[1]);
      return { ok: tiny, s, shot, integrations };
    }
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
  let guess = initialGuess(Pr);
  let etaInf = options.etaInfStart ?? 12;
  let good: { etaInf: number; s: [number, number] } | undefined;
  let integrations = 0;
  let target = 0;
  // Continuation in η∞: until a first physical solution is found the domain shrinks (short
  // domains forgive a rough guess); afterwards η∞ grows, and a failed level is retried closer
  // to the last good one. Stops when the slowest tail is resolved and the values stand still.
  for (let level = 0; level < 200 && etaInf <= ETA_INF_MAX; level++) {
    const result = solveLevel(Pr, etaInf, guess);
    integrations += result.integrations;
    const shot = result.shot;
    if (!result.ok || !shot?.trace || !shot.physical) {
      if (!good) {
        if (etaInf < 1) break;
        etaInf /= 1.5;
      } else {
        etaInf = good.etaInf + 0.5 * (etaInf - good.etaInf);
        if (etaInf - good.etaInf < 1e-3 * good.etaInf) break;
      }
      continue;
    }
    const s = result.s;
    const change = good
      ? Math.max(Math.abs(s[0] - good.s[0]) / Math.abs(s[0]), Math.abs(s[1] - good.s[1]) / Math.abs(s[1]))
      : Infinity;
    if (change <= ETA_CHANGE_TOL && etaInf >= target) {
      return finish(Pr, s, shot.trace, shot.fEnd, etaInf, change, integrations);
    }
    // The slowest tail decays like e^{−λη}, λ = 3 f∞·min(1, Pr) (velocity, or heat at low Pr);
    // with the asymptotic conditions the error goes as its square, so 20/λ beyond the layer
    // leaves about e^{−40}.
    const lambda = 3 * shot.fEnd * Math.min(1, Pr);
    target = 10 + 20 / lambda;
    good = { etaInf, s };
    guess = s;
    etaInf = Math.min(Math.max(1.3 * etaInf, target), 2 * etaInf);
  }
  return { ...failed, etaInf, integrations };
}

function finish(Pr: number, s: [number, number], trace: SolutionTrace, fEnd: number, etaInf: number, change: number, integrations: number): FreeConvectionSolution {
  // Maximum of f' where f'' changes sign, then the outer 1 % point.
  const h = trace.d[3];
  let i = 1;
  while (i < trace.length && h[i] > 0) i++;
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
  const g = trace.d[2];
  let j = i;
  while (j < trace.length && g[j] > level) j++;
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
