// Falkner & Skan (1931) wedge flows U = C·x^m in Hartree's (1937) form:
//   f''' + f f'' + β (1 − f'²) = 0,  β = 2m/(m+1),
//   η = y·√((m+1)U/(2νx)),  ψ = √(2νxU/(m+1))·f(η),
//   f(0) = f_w, f'(0) = 0, f'(∞) = 1.
// Blasius is m = β = 0. Solved by shooting on s = f''(0) (Newton with a bracket) with an
// adaptive Dormand–Prince integrator; η∞ grows until s no longer changes.
import { integrate } from './dormandPrince.js';
import { SolutionTrace, TraceBuilder } from './trace.js';
import { LruCache, registerCache, solveCounts } from './cache.js';

export type MomentumStatus = 'attached' | 'separation' | 'not-converged';

export interface FalknerSkanSolution {
  m: number;
  /** Hartree's pressure-gradient parameter β = 2m/(m+1). */
  beta: number;
  /** (v_w/U)·Re_x^½, negative for suction. */
  wallBlowing: number;
  /** f(0) in Hartree's scaling: f_w = −wall_blowing·√(2/(m+1)). */
  fw: number;
  status: MomentumStatus;
  /** f''(0) in Hartree's scaling (NaN unless attached). */
  wallShear: number;
  /** η_H where f' = 0.99 (NaN unless attached). */
  eta99: number;
  /** Outer edge of the converged domain. */
  etaInf: number;
  /** Relative change of f''(0) between the last two η∞ (the η∞-convergence check). */
  etaInfChange: number;
  /** The solution, stored for the thermal quadratures (undefined unless attached). */
  trace?: SolutionTrace;
  /** Minimum of F = ∫f over η ≥ 0 and where it lies (η > 0 only with blowing). */
  FMin: number;
  etaFMin: number;
  /** Memo of derived thermal quantities keyed by Prandtl number (filled by thermal.ts). */
  thermalMemo: Map<string, number>;
  /** Newton iterations (integrations) spent. */
  integrations: number;
}

/** Below this f''(0) (Hartree scaling) the layer counts as blown off: see `solveFalknerSkan`. */
export const BLOWOFF_WALL_SHEAR = 1e-9;

const RTOL = 1e-12;
const ATOL = 1e-14;
const ETA_INF_MAX = 120;
const ETA_CHANGE_TOL = 1e-11;

/** Converts the two wedge parameters; m ≤ −1 has no wedge-flow meaning. */
export function hartreeBeta(m: number): number {
  return (2 * m) / (m + 1);
}

/**
 * f(0) in Hartree's scaling from wall_blowing = (v_w/U)·Re_x^½. With ψ = √(2νxU/(m+1))·f(η),
 * U = C x^m: v_w = −∂ψ/∂x at y = 0 = −((m+1)/2)·√(2νC/(m+1))·x^{(m−1)/2}·f_w, so
 * v_w/U = −√((m+1)/2)·f_w/√Re_x and f_w = −wall_blowing·√(2/(m+1)). A constant wall_blowing
 * (v_w ∝ x^{(m−1)/2}, on the flat plate v_w ∝ x^{−½}) is exactly what keeps f(0) constant.
 * Flat plate: f_w = −√2·wall_blowing here, i.e. −2·wall_blowing in the η = y√(U/(νx)) scaling
 * where the equation reads f''' + ½ f f'' = 0.
 */
export function wallStreamFunction(m: number, wallBlowing: number): number {
  return -wallBlowing * Math.sqrt(2 / (m + 1));
}

interface ShotResult {
  /** f'(η∞) − 1, or ±Infinity when the trial blew up on the way. */
  residual: number;
  /** ∂f'(η∞)/∂s from the variational equations (NaN after a blow-up). */
  slope: number;
  trace?: SolutionTrace;
}

function shoot(beta: number, fw: number, s: number, etaInf: number, keepTrace: boolean): ShotResult {
  // y = [F, f, f', f'', ∂f/∂s, ∂f'/∂s, ∂f''/∂s]
  const rhs = (_t: number, y: Float64Array, dy: Float64Array): void => {
    const f = y[1], g = y[2], h = y[3];
    dy[0] = f;
    dy[1] = g;
    dy[2] = h;
    dy[3] = -f * h - beta * (1 - g * g);
    dy[4] = y[5];
    dy[5] = y[6];
    dy[6] = -(y[4] * h + f * y[6]) + 2 * beta * g * y[5];
  };
  const builder = keepTrace ? new TraceBuilder() : undefined;
  const row = [0, 0, 0, 0, 0, 0];
  let blowUp = 0;
  const res = integrate(rhs, 0, etaInf, Float64Array.of(0, fw, 0, s, 0, 0, 1), {
    rtol: RTOL,
    atol: ATOL,
    errorComponents: 4,
    initialStep: 1e-3,
    onStep: (t, y, dy) => {
      const g = y[2];
      // The attached profile rises monotonically to f' = 1: a trial that clearly overshoots has
      // s too large, one that turns back well below 1 (f'' < 0) has s too small; the sign is all
      // we need. Trials near the root run to η∞ and give Newton its slope.
      if (g > 1.2) {
        blowUp = 1;
        return false;
      }
      if (y[3] < 0 && g < 0.8) {
        blowUp = -1;
        return false;
      }
      if (builder) {
        row[0] = y[0];
        row[1] = y[1];
        row[2] = g;
        row[3] = y[3];
        row[4] = dy[3];
        row[5] = -(g * y[3] + y[1] * dy[3]) + 2 * beta * g * y[3];
        builder.push(t, row);
      }
      return true;
    },
  });
  if (blowUp !== 0 || res.status !== 'done') {
    const sign = blowUp !== 0 ? blowUp : Math.sign(res.y[2] - 1) || 1;
    return { residual: sign * Infinity, slope: NaN };
  }
  return { residual: res.y[2] - 1, slope: res.y[5], trace: builder?.build() };
}

/** Starting guess for f''(0): a rough fit, only the Newton iteration sets the value. */
function initialGuess(beta: number, fw: number): number {
  const s0 = Math.sqrt(Math.max(0.2205 + 1.3 * beta, 0.0025));
  return 0.5 * (fw + Math.sqrt(fw * fw + 4 * s0 * s0));
}

interface LevelResult {
  kind: 'root' | 'separation' | 'failed';
  s: number;
  shot?: ShotResult;
  integrations: number;
}

/** Newton on s at a fixed η∞, kept inside a sign bracket [lo, hi] and bisecting when it strays. */
function solveLevel(beta: number, fw: number, etaInf: number, guess: number): LevelResult {
  let integrations = 0;
  let lo = 0;
  let hi = Infinity;
  // The attached branch needs residual(lo) < 0: with s = 0 (or, with blowing, s at the
  // blow-off floor) a non-negative residual means no attached root exists above it.
  const needsCheck = beta < 0 || fw < 0;
  if (needsCheck) {
    lo = fw < 0 ? BLOWOFF_WALL_SHEAR : 0;
    const r = shoot(beta, fw, lo, etaInf, false);
    integrations++;
    if (!(r.residual < 0)) return { kind: 'separation', s: NaN, integrations };
  }
  let s = Math.max(guess, lo * 2);
  for (let iter = 0; iter < 200; iter++) {
    const shot = shoot(beta, fw, s, etaInf, true);
    integrations++;
    const r = shot.residual;
    if (r < 0) lo = Math.max(lo, s);
    else if (r > 0) hi = Math.min(hi, s);
    else return { kind: 'root', s, shot, integrations };
    let next: number;
    const newton = Number.isFinite(r) && shot.slope > 0 ? s - r / shot.slope : NaN;
    if (Number.isFinite(newton) && newton > lo && newton < hi) next = newton;
    else if (hi === Infinity) next = 2 * s + 0.1;
    else if (lo > 0 && hi / lo > 1e3) next = Math.sqrt(lo * hi); // geometric bisection over decades
    else next = 0.5 * (lo + hi);
    if (Math.abs(next - s) <= 1e-13 * s || (Number.isFinite(r) && Math.abs(r) < 1e-15)) {
      if (!Number.isFinite(r)) break;
      return { kind: 'root', s, shot, integrations };
    }
    if (hi < Infinity && hi - lo <= 1e-14 * hi && Number.isFinite(r)) return { kind: 'root', s, shot, integrations };
    s = next;
  }
  return { kind: 'failed', s, integrations };
}

function firstCrossing(trace: SolutionTrace, k: number, level: number, from = 0): number {
  // First η where derivative k of F rises through `level` (nodes, then bisection on the interpolant).
  const d = trace.d[k];
  let i = from;
  while (i < trace.length && d[i] < level) i++;
  if (i === 0) return trace.eta[0];
  if (i >= trace.length) return NaN;
  let a = trace.eta[i - 1];
  let b = trace.eta[i];
  for (let it = 0; it < 100 && b - a > 1e-15 * b; it++) {
    const c = 0.5 * (a + b);
    if (trace.derivative(k, c) < level) a = c;
    else b = c;
  }
  return 0.5 * (a + b);
}

export interface SolveOptions {
  /** First outer edge tried (the η∞ loop then grows it); for checking η∞ independence. */
  etaInfStart?: number;
}

/** Solves from scratch (no cache). Prefer `solveFalknerSkan`. */
export function solveFalknerSkanUncached(m: number, wallBlowing = 0, options: SolveOptions = {}): FalknerSkanSolution {
  if (!(m > -1) || !Number.isFinite(m)) throw new RangeError(`wedge exponent m must be a finite number above -1 (got ${m})`);
  if (!Number.isFinite(wallBlowing)) throw new RangeError(`wall_blowing must be finite (got ${wallBlowing})`);
  solveCounts.momentumSolves++;
  const beta = hartreeBeta(m);
  const fw = wallStreamFunction(m, wallBlowing);
  const base: FalknerSkanSolution = {
    m,
    beta,
    wallBlowing,
    fw,
    status: 'not-converged',
    wallShear: NaN,
    eta99: NaN,
    etaInf: NaN,
    etaInfChange: NaN,
    FMin: 0,
    etaFMin: 0,
    thermalMemo: new Map(),
    integrations: 0,
  };

  // Start beyond the layer: thicker near separation, pushed out by blowing.
  let etaInf = Math.min(options.etaInfStart ?? (beta < 0 ? 12 : 10) + 4 * Math.max(0, -fw), ETA_INF_MAX);
  let guess = initialGuess(beta, fw);
  let previous = NaN;
  while (etaInf <= ETA_INF_MAX) {
    const level = solveLevel(beta, fw, etaInf, guess);
    base.integrations += level.integrations;
    if (level.kind === 'separation') return { ...base, status: 'separation', etaInf };
    if (level.kind === 'failed' || !level.shot?.trace) return { ...base, etaInf };
    const s = level.s;
    // f''(0) falls monotonically as η∞ grows when blowing is near blow-off: once it is below
    // the floor the layer has left the wall.
    if (s < BLOWOFF_WALL_SHEAR) return { ...base, status: 'separation', etaInf };
    const change = Math.abs(s - previous) / s;
    if (change <= ETA_CHANGE_TOL) {
      const trace = level.shot.trace;
      // The attached branch has 0 ≤ f' ≤ 1 and f'' ≥ 0 throughout; anything else is another root.
      if (!isAttachedProfile(trace)) return { ...base, etaInf };
      const { FMin, etaFMin } = minimumOfF(trace, fw);
      return {
        ...base,
        status: 'attached',
        wallShear: s,
        eta99: firstCrossing(trace, 2, 0.99),
        etaInf,
        etaInfChange: change,
        trace,
        FMin,
        etaFMin,
      };
    }
    previous = s;
    guess = s;
    etaInf += Math.max(4, 0.25 * etaInf);
  }
  return { ...base, etaInf: ETA_INF_MAX };
}

function isAttachedProfile(trace: SolutionTrace): boolean {
  // Spurious roots break these by O(1); the margins only absorb the residual left at η∞, where
  // for β > 0 the sensitivity ∂f'(η∞)/∂s grows like η∞^{2β}.
  const g = trace.d[2], h = trace.d[3];
  for (let i = 0; i < trace.length; i++) if (g[i] < -1e-6 || g[i] > 1 + 1e-6 || h[i] < -1e-6) return false;
  return true;
}

/** F = ∫f has its minimum at the wall unless blowing makes f < 0 near it. */
function minimumOfF(trace: SolutionTrace, fw: number): { FMin: number; etaFMin: number } {
  if (fw >= 0) return { FMin: 0, etaFMin: 0 };
  const eta = firstCrossing(trace, 1, 0);
  return { FMin: trace.F(eta), etaFMin: eta };
}

const cache = new LruCache<string, FalknerSkanSolution>(512);
registerCache(() => cache.clear());

/**
 * The attached (upper-branch) Falkner–Skan solution for wedge exponent m and wall blowing
 * (v_w/U)·Re_x^½, cached: it depends on nothing else, so a sweep over Pr or Re reuses it.
 * Status `separation` when no attached solution exists: m below the separation value
 * (β ≈ −0.1988 without blowing), or blowing strong enough to lift the layer off the wall
 * (f''(0) → 0; taken as f''(0) < 1e-9 in Hartree's scaling, where the solution stops
 * converging as η∞ grows).
 */
export function solveFalknerSkan(m: number, wallBlowing = 0): FalknerSkanSolution {
  const key = `${m}|${wallBlowing}`;
  const hit = cache.get(key);
  if (hit) {
    solveCounts.momentumCacheHits++;
    return hit;
  }
  const sol = solveFalknerSkanUncached(m, wallBlowing);
  cache.set(key, sol);
  return sol;
}
