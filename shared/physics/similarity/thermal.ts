// Energy equation on a known similarity velocity field, by quadrature (constant properties).
// Isothermal wall, θ = (T − T∞)/(T_w − T∞):  θ'' + P f θ' = 0  ⇒  θ'(0) = −1/∫₀^∞ e^{−P F} dη,
// F = ∫₀^η f (Pohlhausen 1921 for the flat plate; the same form holds for any Falkner–Skan
// flow, Eckert 1942). Adiabatic wall with viscous dissipation on the flat plate,
// T = T∞ + U²/(2 c_p)·R(η):  R'' + Pr f R' = −2 Pr f''²,  R'(0) = 0, R(∞) = 0, and the
// recovery factor r = R(0) = 2 Pr ∫₀^∞ f''(t)² ∫_t^∞ e^{−Pr (F(η) − F(t))} dη dt
// (Pohlhausen 1921; Hartree's scaling of f, η as in falknerSkan.ts).
import { adaptiveQuadrature } from './quadrature.js';
import type { SolutionTrace } from './trace.js';
import type { FalknerSkanSolution } from './falknerSkan.js';
import { solveCounts } from './cache.js';

/** Exponent at which e^{−x} no longer matters next to 1 (e^{−60} ≈ 1e-26). */
const NEGLIGIBLE_EXPONENT = 60;
/** Quadrature tolerance on the |Kronrod − Gauss| estimate, which overstates the error by orders. */
const REL_TOL = 1e-11;
/** e^{−745} is below the smallest subnormal double. */
const UNDERFLOW_EXPONENT = 745;

export interface ExpIntegral {
  /** ∫_a^∞ e^{−P (F(η) − F_ref)} dη. */
  value: number;
  converged: boolean;
}

/**
 * ∫_a^∞ exp(−P·(F(η) − Fref)) dη over a stored solution, where Fref ≤ F(η) for η ≥ a except
 * near a blowing-induced minimum (pass the minimum as Fref there). `etaMin` is where F has
 * its minimum (f = 0), `gAtMin` the slope f' there: the integrand peaks at etaMin with width
 * 1/√(P f'), so breakpoints grade towards it. Beyond the stored layer F is the outer
 * quadratic, integrated separately so no large F values are subtracted.
 */
export function expIntegral(trace: SolutionTrace, P: number, a: number, Fref: number, etaMin: number, gAtMin: number): ExpIntegral {
  const edge = trace.lastEta;
  const n = trace.length;
  const ge = trace.node(2, n - 1);
  if (a >= edge) {
    const fa = trace.node(1, n - 1) + ge * (a - edge);
    const t = outerIntegral(P, fa, ge);
    return { value: Math.exp(-P * (trace.F(a) - Fref)) * t.value, converged: t.converged };
  }
  const integrand = (x: number) => Math.exp(-P * (trace.F(x) - Fref));
  const start = Math.max(a, etaMin);
  const end = Math.min(negligibleFrom(trace, P, start, Fref), edge);
  const points: number[] = [a];
  if (etaMin > a) {
    // Blowing: the integrand rises from a to its peak at etaMin; grade geometrically both sides.
    const sigma = 1 / Math.sqrt(P * Math.max(gAtMin, 1e-300));
    for (let w = 64 * sigma; w >= sigma / 4; w /= 4) if (etaMin - w > a) points.push(etaMin - w);
    points.push(etaMin);
    for (let w = sigma / 4; w <= 64 * sigma; w *= 4) if (etaMin + w < end) points.push(etaMin + w);
  }
  // Grade from the start, where the integrand is largest, in steps of four from a quarter of its
  // first e-folding length, so that no scale is stepped over.
  for (let x = start + 0.25 * eFoldLength(trace, P, start); x < end; x = start + 4 * (x - start)) {
    if (x > points[points.length - 1]) points.push(x);
  }
  if (end > points[points.length - 1]) points.push(end);
  const inner = adaptiveQuadrature(integrand, points, REL_TOL);
  let value = inner.value;
  let converged = inner.converged;
  const exponentAtEdge = P * (trace.node(0, n - 1) - Fref);
  if (exponentAtEdge < NEGLIGIBLE_EXPONENT + 10) {
    // The outer part only needs the accuracy its weight e^{−exponent} leaves to the sum.
    const weight = Math.exp(-exponentAtEdge);
    const t = outerIntegral(P, trace.node(1, n - 1), ge, (REL_TOL * value) / weight);
    value += weight * t.value;
    converged = converged && t.converged;
  }
  return { value, converged };
}

/**
 * ∫₀^∞ exp(−P (f_a τ + g τ²/2)) dτ: the outer flow, where f'' = 0 and f' = g, to an absolute
 * accuracy `absTol` (relative REL_TOL when not given). It equals √(π/(2Pg))·erfcx(f_a√(P/(2g)));
 * for a large argument x the asymptotic series of erfcx (Abramowitz & Stegun 7.1.23) gives
 * (1/(P f_a))·Σ (−1)ⁿ (2n−1)!!/(2x²)ⁿ, used when its smallest term is within the tolerance.
 */
function outerIntegral(P: number, fa: number, g: number, absTol = 0): ExpIntegral {
  const leading = 1 / (P * fa);
  if (g > 0 && fa > 0 && absTol > 0) {
    const twoX2 = (fa * fa * P) / g;
    let term = 1;
    let sum = 1;
    for (let k = 1; k < 60; k++) {
      const next = (-term * (2 * k - 1)) / twoX2;
      if (Math.abs(next) >= Math.abs(term)) break; // the series starts to diverge
      term = next;
      sum += term;
      if (Math.abs(term) * leading < 0.1 * absTol) return { value: sum * leading, converged: true };
    }
  }
  // P (f_a τ + g τ²/2) reaches the negligible exponent at τ_end.
  const need = NEGLIGIBLE_EXPONENT / P;
  const tauEnd = g > 0 ? (2 * need) / (fa + Math.sqrt(fa * fa + 2 * g * need)) : need / fa;
  if (!(tauEnd > 0) || !Number.isFinite(tauEnd)) return { value: NaN, converged: false };
  // Breakpoints from a quarter of the first e-folding length, in steps of four.
  const points = [0];
  for (let t = 0.25 * Math.min(1 / (P * Math.abs(fa)), Math.sqrt(2 / (P * Math.abs(g)))); t < tauEnd; t *= 4) points.push(t);
  points.push(tauEnd);
  const q = adaptiveQuadrature((t) => Math.exp(-P * t * (fa + 0.5 * g * t)), points, REL_TOL, absTol);
  return { value: q.value, converged: q.converged };
}

/**
 * Length over which P·(F − F(start)) first grows by one, from the local Taylor terms of F at
 * `start` (the smallest of the lengths at which each term alone reaches one).
 */
function eFoldLength(trace: SolutionTrace, P: number, start: number): number {
  const f = Math.abs(trace.derivative(1, start));
  const g = Math.abs(trace.derivative(2, start));
  const h = Math.abs(trace.derivative(3, start));
  return Math.min(1 / (P * f), Math.sqrt(2 / (P * g)), Math.cbrt(6 / (P * h)));
}

/** Smallest η ≥ start (to node precision) beyond which P·(F − Fref) exceeds the negligible exponent. */
function negligibleFrom(trace: SolutionTrace, P: number, start: number, Fref: number): number {
  const target = Fref + NEGLIGIBLE_EXPONENT / P;
  const n = trace.length;
  if (trace.node(0, n - 1) < target) return trace.lastEta;
  // F increases beyond the minimum: binary search the nodes.
  let lo = trace.interval(start);
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (trace.node(0, mid) < target) lo = mid;
    else hi = mid;
  }
  return Math.max(trace.eta[hi], start);
}

function requireAttached(sol: FalknerSkanSolution): SolutionTrace {
  if (sol.status !== 'attached' || !sol.trace) throw new Error(`no attached momentum solution (status ${sol.status})`);
  return sol.trace;
}

function slopeAtMinimum(sol: FalknerSkanSolution, trace: SolutionTrace): number {
  return sol.etaFMin > 0 ? trace.derivative(2, sol.etaFMin) : 0;
}

export interface ThermalResult {
  status: 'ok' | 'not-converged';
  /** θ'(0) in Hartree's scaling (negative for a heated wall). */
  wallGradient: number;
}

/**
 * Isothermal-wall energy solution on a Falkner–Skan layer: θ'(0) in Hartree's scaling, so that
 * Nu_x/Re_x^½ = −θ'(0)·√((m+1)/2). Cached on the momentum solution per Pr.
 */
export function thermalSolution(sol: FalknerSkanSolution, Pr: number): ThermalResult {
  if (!(Pr > 0) || !Number.isFinite(Pr)) throw new RangeError(`Pr must be positive and finite (got ${Pr})`);
  const trace = requireAttached(sol);
  const key = `theta|${Pr}`;
  const memo = sol.thermalMemo.get(key);
  if (memo !== undefined) return Number.isNaN(memo) ? { status: 'not-converged', wallGradient: NaN } : { status: 'ok', wallGradient: memo };
  solveCounts.thermalSolves++;
  let gradient: number;
  if (Pr * sol.FMin < -UNDERFLOW_EXPONENT) {
    // ∫e^{−PF} = e^{−P F_min}·∫e^{−P (F − F_min)}: strong blowing at high Pr insulates the
    // wall so well that θ'(0) ∝ e^{P F_min} is below the smallest double, i.e. zero.
    gradient = -0;
  } else {
    const I = expIntegral(trace, Pr, 0, sol.FMin, sol.etaFMin, slopeAtMinimum(sol, trace));
    gradient = I.converged && I.value > 0 ? -Math.exp(Pr * sol.FMin) / I.value : NaN;
  }
  sol.thermalMemo.set(key, gradient);
  return Number.isNaN(gradient) ? { status: 'not-converged', wallGradient: NaN } : { status: 'ok', wallGradient: gradient };
}

export interface RecoveryResult {
  status: 'ok' | 'not-converged' | 'overflow';
  recoveryFactor: number;
}

/**
 * Recovery factor r(Pr) of the flat plate (m = 0), with or without uniform blowing:
 * T_aw = T∞ + r·U²/(2 c_p). Needs m = 0: on a wedge U² ∝ x^{2m} breaks the similarity of the
 * dissipation term.
 */
export function recoveryFactor(sol: FalknerSkanSolution, Pr: number): RecoveryResult {
  if (sol.m !== 0) throw new RangeError('the recovery factor is a flat-plate (m = 0) similarity result');
  if (!(Pr > 0) || !Number.isFinite(Pr)) throw new RangeError(`Pr must be positive and finite (got ${Pr})`);
  const trace = requireAttached(sol);
  const key = `recovery|${Pr}`;
  const memo = sol.thermalMemo.get(key);
  if (memo !== undefined) {
    if (Number.isNaN(memo)) return { status: 'not-converged', recoveryFactor: NaN };
    if (memo === Infinity) return { status: 'overflow', recoveryFactor: NaN };
    return { status: 'ok', recoveryFactor: memo };
  }
  solveCounts.recoverySolves++;
  const r = computeRecovery(sol, trace, Pr);
  sol.thermalMemo.set(key, r);
  if (Number.isNaN(r)) return { status: 'not-converged', recoveryFactor: NaN };
  if (r === Infinity) return { status: 'overflow', recoveryFactor: NaN };
  return { status: 'ok', recoveryFactor: r };
}

// Radau IIA, three stages, order 5 (Ehle 1969; Hairer & Wanner, Solving ODEs II, §IV.5):
// L-stable, so the fast decay rate Pr·f of a high-Pr layer sets no step limit.
const R6 = Math.sqrt(6);
const RC = [(4 - R6) / 10, (4 + R6) / 10, 1];
const RA = [
  [(88 - 7 * R6) / 360, (296 - 169 * R6) / 1800, (-2 + 3 * R6) / 225],
  [(296 + 169 * R6) / 1800, (88 + 7 * R6) / 360, (-2 - 3 * R6) / 225],
  [(16 - R6) / 36, (16 + R6) / 36, 1 / 9],
];

const stageA = new Float64Array(3);
const stageB = new Float64Array(3);
const M = [new Float64Array(4), new Float64Array(4), new Float64Array(4)];
const stage = new Float64Array(3);

/**
 * One Radau step of S' = −a(t)·S + b(t) together with Y' = S, from S at t over dt.
 * Returns S(t+dt) and the increment of Y. The stage equations are a 3×3 linear system.
 */
function radauStep(a: (t: number) => number, b: (t: number) => number, t: number, dt: number, S: number): [number, number] {
  for (let j = 0; j < 3; j++) {
    stageA[j] = a(t + RC[j] * dt);
    stageB[j] = b(t + RC[j] * dt);
  }
  // (I + dt·A·diag(a))·S_stage = S + dt·A·b, as an augmented matrix.
  for (let i = 0; i < 3; i++) {
    const row = M[i];
    for (let j = 0; j < 3; j++) row[j] = (i === j ? 1 : 0) + dt * RA[i][j] * stageA[j];
    row[3] = S + dt * (RA[i][0] * stageB[0] + RA[i][1] * stageB[1] + RA[i][2] * stageB[2]);
  }
  solve3(M, stage);
  const dY = dt * (RA[2][0] * stage[0] + RA[2][1] * stage[1] + RA[2][2] * stage[2]);
  return [stage[2], dY];
}

/** Gaussian elimination with partial pivoting on a 3×3 augmented system (modified in place). */
function solve3(A: Float64Array[], x: Float64Array): void {
  for (let c = 0; c < 3; c++) {
    let p = c;
    for (let i = c + 1; i < 3; i++) if (Math.abs(A[i][c]) > Math.abs(A[p][c])) p = i;
    if (p !== c) [A[c], A[p]] = [A[p], A[c]];
    for (let i = c + 1; i < 3; i++) {
      const f = A[i][c] / A[c][c];
      for (let j = c; j < 4; j++) A[i][j] -= f * A[c][j];
    }
  }
  for (let i = 2; i >= 0; i--) {
    let v = A[i][3];
    for (let j = i + 1; j < 3; j++) v -= A[i][j] * x[j];
    x[i] = v / A[i][i];
  }
}

// r = 2 Pr ∫₀^∞ S dη with S(η) = ∫₀^η f''(t)² e^{−Pr (F(η) − F(t))} dt, i.e. S' = −Pr f S + f''²,
// S(0) = 0: integrated with step doubling across the stored layer, then the outer tail
// (f'' = 0, S decays as e^{−Pr (F − F_e)}) by quadrature.
function computeRecovery(sol: FalknerSkanSolution, trace: SolutionTrace, Pr: number): number {
  const a = (t: number) => Pr * trace.derivative(1, t);
  const b = (t: number) => {
    const h = trace.derivative(3, t);
    return h * h;
  };
  const end = trace.lastEta;
  const rtol = 1e-12;
  let t = 0;
  let S = 0;
  let Y = 0;
  let dt = 1e-6;
  let Smax = 0;
  for (let steps = 0; end - t > 1e-13 * end; steps++) {
    if (steps > 100_000) return NaN;
    dt = Math.min(dt, end - t);
    const [Sbig, dYbig] = radauStep(a, b, t, dt, S);
    const [Shalf, dY1] = radauStep(a, b, t, 0.5 * dt, S);
    const [Ssmall, dY2] = radauStep(a, b, t + 0.5 * dt, 0.5 * dt, Shalf);
    const dYsmall = dY1 + dY2;
    if (!Number.isFinite(Ssmall) || !Number.isFinite(dYsmall)) return Infinity;
    // S only matters through Y, so its error is judged against the largest S seen.
    const errS = Math.abs(Ssmall - Sbig) / (rtol * Math.max(Math.abs(Ssmall), Smax) + 1e-300);
    const errY = Math.abs(dYsmall - dYbig) / (rtol * Math.abs(Y + dYsmall) + 1e-300);
    const err = Math.max(errS, errY);
    if (err <= 1) {
      t = t + dt >= end ? end : t + dt;
      S = Ssmall;
      Smax = Math.max(Smax, Math.abs(S));
      Y += dYsmall;
    }
    dt *= Math.min(3, Math.max(0.2, 0.9 * Math.pow(Math.max(err, 1e-30), -1 / 6)));
  }
  const tail = expIntegral(trace, Pr, end, trace.F(end), end, 0);
  if (!tail.converged) return NaN;
  const r = 2 * Pr * (Y + S * tail.value);
  return Number.isFinite(r) ? r : Infinity;
}
