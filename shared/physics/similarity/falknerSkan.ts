// Falkner & Skan (1931) wedge flows U = C·x^m in Hartree's (1937) form:
//   f''' + f f'' + β (1 − f'²) = 0,  β = 2m/(m+1),
//   η = y·√((m+1)U/(2νx)),  ψ = √(2νxU/(m+1))·f(η),
//   f(0) = f_w, f'(0) = 0, f'(∞) = 1.
// Blasius is m = β = 0. Solved by shooting on s = f''(0): Newton with the variational equation,
// kept inside a sign bracket, on a Taylor-series integration (taylor.ts) whose precision and
// domain grow with the iterate's accuracy (cheap low-order shots far from the root); the last,
// full-precision shot is moved onto the root along its first and second variations. The outer
// edge η∞ is where the layer has decayed (F = ∫f has grown by EDGE_EXPONENT past its minimum),
// with the asymptotic far-field condition imposed there instead of f'(η∞) = 1.
// Every solve starts from the same fit, with no state carried over from other points (no
// continuation from a neighbour): a point's value, to the last bit, does not depend on which
// worker solved it or what it solved before.
import { SolutionTrace, TraceBuilder } from './trace.js';
import { LruCache, registerCache, solveCounts } from './cache.js';
import { horner, orderFor, radiusStep, SERIES_LENGTH, STABILITY } from './taylor.js';

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
  /** Outer edge of the domain. */
  etaInf: number;
  /**
   * Relative change of f''(0) if the plain condition f'(η∞) = 1 replaced the asymptotic one at
   * this η∞: the size of the far-field correction, far above what is left of the η∞ error.
   */
  etaInfChange: number;
  /** The solution, stored for the thermal quadratures (undefined unless attached). */
  trace?: SolutionTrace;
  /** Minimum of F = ∫f over η ≥ 0 and where it lies (η > 0 only with blowing). */
  FMin: number;
  etaFMin: number;
  /** Memo of derived thermal quantities keyed by Prandtl number (filled by thermal.ts). */
  thermalMemo: Map<string, number>;
  /** Shots (integrations) spent. */
  integrations: number;
}

/** Below this f''(0) (Hartree scaling) the layer counts as blown off: see `solveFalknerSkan`. */
export const BLOWOFF_WALL_SHEAR = 1e-9;

/** Local error per Taylor step of the final shot. */
const EPS_FINAL = 1e-12;
/** The cheapest shots: far from the root their error does not matter. */
const EPS_COARSE = 1e-5;
/**
 * A full-precision shot is taken once the iterate is this close, and accepted when its
 * correction δ is below ACCEPT_CHANGE: the solution is then moved by δ along the first and
 * second variations, which leaves an error of order δ³ (1e-14).
 */
const FINAL_ERROR = 2e-5;
const ACCEPT_CHANGE = 2e-5;
/**
 * The edge: F − F_min = 29. Beyond it f'' ≈ s·e^{−(F − F_min)} (exactly so on the flat plate) is
 * below 3e-13·s; the asymptotic condition takes up that remainder to a relative O(1/f²).
 */
const EDGE_EXPONENT = 29;
const ETA_INF_MAX = 120;
/**
 * Order of the variational series. The steps are sized for the solution at order p, so order q
 * leaves a relative error of about ε^{(q+1)/p} (1e-8 at ε = 1e-12, p = 15): ample for Newton's
 * slope and for the final correction δ·∂y/∂s with δ ≤ ACCEPT_CHANGE, at a fraction of the work.
 */
export const VARIATIONAL_ORDER = 9;
/** Order of the second variation (final shots): it enters the result multiplied by δ²/2 ≤ 2e-10. */
const SECOND_VARIATION_ORDER = 6;
const MAX_STEPS = 5000;
/** Taylor steps one solve may spend in all before it gives up as `not-converged` (bounded time). */
const WORK_STEPS = 50_000;
let stepsLeft = WORK_STEPS;
/** Relative error of `initialGuess` assumed before the first shot. */
const GUESS_ERROR = 0.05;

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

// ------------------------------------------------------------------------------ one shot

interface Shot {
  /** 'edge': reached the outer edge; 'over'/'under': a trial that clearly overshoots f' = 1 or turns back below it. */
  kind: 'edge' | 'over' | 'under' | 'failed';
  /** Far-field residual at the edge (±Infinity for over/under: only its sign counts). */
  residual: number;
  /** ∂residual/∂s from the variational equation (NaN when not carried); at the exit for over/under. */
  slope: number;
  /** ∂²residual/∂s² from the second variation (final shots; NaN otherwise). */
  curvature: number;
  /** f' − 1 at the edge (for the size of the far-field correction) or where the trial left. */
  plain: number;
  /** ∂f'/∂s at the edge. */
  slopePlain: number;
  /** η∞, or where the trial left. */
  edge: number;
  /** The steps, when kept (with ∂/∂s when the variational equation was carried). */
  steps?: TraceBuilder;
}

// Series buffers: F, f, f', f'' and the variational U = ∂F/∂s, u = ∂f/∂s, v = ∂f'/∂s, w = ∂f''/∂s.
const sF = new Float64Array(SERIES_LENGTH);
const sU = new Float64Array(SERIES_LENGTH);
const sf = new Float64Array(SERIES_LENGTH);
const sg = new Float64Array(SERIES_LENGTH);
const sh = new Float64Array(SERIES_LENGTH);
const su = new Float64Array(SERIES_LENGTH);
const sv = new Float64Array(SERIES_LENGTH);
const sw = new Float64Array(SERIES_LENGTH);
// Second variations U2 = ∂²F/∂s², u2, v2, w2 (final shots only).
const sU2 = new Float64Array(SERIES_LENGTH);
const su2 = new Float64Array(SERIES_LENGTH);
const sv2 = new Float64Array(SERIES_LENGTH);
const sw2 = new Float64Array(SERIES_LENGTH);
const SENSITIVITIES = [sU, sU2];

/**
 * Taylor coefficients up to order p (F to p + 3) of the Falkner–Skan system, to order q of its
 * variational equation u''' = −(u f'' + f u'') + 2β f' u' (none when q = 0), and to order q2 ≤ q
 * of the second variation u2''' = −(u2 f'' + 2 u u'' + f u2'') + 2β (u'² + f' u2') (none when 0).
 */
function series(beta: number, p: number, q: number, q2: number): void {
  const twoBeta = 2 * beta;
  for (let k = 0; k < p; k++) {
    // f f'' in full; f'² by symmetry, twice the products below the middle plus the middle square.
    let fh = 0;
    let gg = 0;
    const half = (k + 1) >> 1;
    for (let j = 0; j < half; j++) {
      fh += sf[j] * sh[k - j] + sf[k - j] * sh[j];
      gg += sg[j] * sg[k - j];
    }
    gg *= 2;
    if ((k & 1) === 0) {
      const m = k >> 1;
      fh += sf[m] * sh[m];
      gg += sg[m] * sg[m];
    }
    const inv = 1 / (k + 1);
    sF[k + 1] = sf[k] * inv;
    sf[k + 1] = sg[k] * inv;
    sg[k + 1] = sh[k] * inv;
    sh[k + 1] = (beta * (gg - (k === 0 ? 1 : 0)) - fh) * inv;
    if (k < q) {
      let cw = 0;
      for (let j = 0; j <= k; j++) cw += twoBeta * sg[j] * sv[k - j] - su[j] * sh[k - j] - sf[j] * sw[k - j];
      sU[k + 1] = su[k] * inv;
      su[k + 1] = sv[k] * inv;
      sv[k + 1] = sw[k] * inv;
      sw[k + 1] = cw * inv;
    }
    if (k < q2) {
      let cw2 = 0;
      for (let j = 0; j <= k; j++) {
        const m = k - j;
        cw2 += twoBeta * (sv[j] * sv[m] + sg[j] * sv2[m]) - su2[j] * sh[m] - 2 * su[j] * sw[m] - sf[j] * sw2[m];
      }
      sU2[k + 1] = su2[k] * inv;
      su2[k + 1] = sv2[k] * inv;
      sv2[k + 1] = sw2[k] * inv;
      sw2[k + 1] = cw2 * inv;
    }
  }
  extendSeries(sF, sf, sg, sh, p);
  if (q > 0) {
    extendSeries(sU, su, sv, sw, q);
    sU.fill(0, q + 4, p + 4);
  }
  if (q2 > 0) {
    extendSeries(sU2, su2, sv2, sw2, q2);
    sU2.fill(0, q2 + 4, p + 4);
  }
}

/** Moves the state to the end of the step: each series evaluated at dt into its constant term. */
function advance(dt: number, p: number, q: number, q2: number): void {
  sF[0] = horner(sF, 0, p + 4, dt);
  sf[0] = horner(sf, 0, p + 3, dt);
  sg[0] = horner(sg, 0, p + 2, dt);
  sh[0] = horner(sh, 0, p + 1, dt);
  if (q > 0) {
    sU[0] = horner(sU, 0, q + 4, dt);
    su[0] = horner(su, 0, q + 3, dt);
    sv[0] = horner(sv, 0, q + 2, dt);
    sw[0] = horner(sw, 0, q + 1, dt);
  }
  if (q2 > 0) {
    sU2[0] = horner(sU2, 0, q2 + 4, dt);
    su2[0] = horner(su2, 0, q2 + 3, dt);
    sv2[0] = horner(sv2, 0, q2 + 2, dt);
    sw2[0] = horner(sw2, 0, q2 + 1, dt);
  }
}

/**
 * Completes the series of F, f, f' beyond order p exactly from the order-p series of f''
 * (each is the integral of the next): F to p + 3, f to p + 2, f' to p + 1.
 */
export function extendSeries(F: Float64Array, f: Float64Array, g: Float64Array, h: Float64Array, p: number): void {
  g[p + 1] = h[p] / (p + 1);
  f[p + 1] = g[p] / (p + 1);
  f[p + 2] = g[p + 1] / (p + 2);
  F[p + 1] = f[p] / (p + 1);
  F[p + 2] = f[p + 1] / (p + 2);
  F[p + 3] = f[p + 2] / (p + 3);
}

/** Step length for the series just computed, controlled by f, f' and f'' (taylor.ts `radiusStep`). */
function stepFor(p: number, epsRoot: number): number {
  const scale = Math.max(1, Math.abs(sf[0]), Math.abs(sg[0]), Math.abs(sh[0]));
  const last = Math.max(Math.abs(sf[p]), Math.abs(sg[p]), Math.abs(sh[p]));
  const previous = Math.max(Math.abs(sf[p - 1]), Math.abs(sg[p - 1]), Math.abs(sh[p - 1]));
  return radiusStep(scale, previous, last, p, epsRoot);
}

/**
 * Where F reaches `target` within a step of length `h` (F rises there: f > 0), by Newton on the
 * step's polynomial from the linear estimate, kept inside [0, h].
 */
function edgeInStep(target: number, terms: number, h: number): number {
  let tau = h * Math.min(1, Math.max(0, (target - sF[0]) / (horner(sF, 0, terms, h) - sF[0])));
  for (let it = 0; it < 50; it++) {
    const r = horner(sF, 0, terms, tau) - target;
    const d = horner(sf, 0, terms - 1, tau);
    const next = Math.min(h, Math.max(0, tau - r / d));
    if (Math.abs(next - tau) <= 1e-15 * Math.max(1, h)) return next;
    tau = next;
  }
  return tau;
}

/**
 * One trial f''(0) = s, integrated at local precision `eps` until the layer has decayed (or
 * to `minEdge`, if farther). `variational` also carries ∂/∂s for Newton's slope.
 */
function shoot(beta: number, fw: number, s: number, eps: number, edgeExponent: number, variational: boolean, keepTrace: boolean, minEdge: number): Shot {
  const p = orderFor(eps);
  const q = variational ? Math.min(p, VARIATIONAL_ORDER) : 0;
  // The final shot also carries the second variation: its correction is then exact to O(δ³).
  const q2 = keepTrace && variational ? Math.min(q, SECOND_VARIATION_ORDER) : 0;
  const epsRoot = Math.pow(eps, 1 / p);
  const terms = p + 4;
  const builder = keepTrace ? new TraceBuilder(terms, q2 > 0 ? 2 : q > 0 ? 1 : 0) : undefined;
  let eta = 0;
  // The state lives in the series' constant terms: the step evaluates each series in place.
  sF[0] = 0;
  sf[0] = fw;
  sg[0] = 0;
  sh[0] = s;
  sU[0] = su[0] = sv[0] = 0;
  sw[0] = 1;
  sU2[0] = su2[0] = sv2[0] = sw2[0] = 0;
  let FMin = 0;
  let stopAt = Infinity;
  for (let step = 0; step < MAX_STEPS; step++) {
    if (--stepsLeft < 0) return failedShot();
    series(beta, p, q, q2);
    let dt = stepFor(p, epsRoot);
    // The variations decay like e^{−∫f} far out, faster than the solution's steps resolve:
    // keep f·h inside the stability interval of their (lower) order.
    if (q > 0) dt = Math.min(dt, (0.9 * STABILITY[q2 > 0 ? q2 : q]) / (Math.abs(sf[0]) + 0.5));
    if (!(dt > 1e-9)) return failedShot();
    if (stopAt === Infinity && eta + dt > ETA_INF_MAX) return failedShot();
    // The edge: F − F_min reaches the edge exponent within this step.
    const target = FMin + edgeExponent;
    if (stopAt === Infinity && horner(sF, 0, terms, dt) >= target) stopAt = Math.max(eta + edgeInStep(target, terms, dt), minEdge);
    const last = eta + dt >= stopAt;
    if (last) dt = stopAt - eta;
    builder?.push(eta, sF, SENSITIVITIES);
    advance(dt, p, q, q2);
    const F = sF[0], f = sf[0], g = sg[0], h = sh[0], v = sv[0], w = sw[0];
    eta = last ? stopAt : eta + dt;
    if (!Number.isFinite(F + f + g + h)) return failedShot();
    // The attached profile rises monotonically to f' = 1: a trial that clearly overshoots has
    // s too large, one that turns back well below 1 (f'' < 0) has s too small; the sign is all
    // a bracket needs.
    if (g > 1.2) return { kind: 'over', residual: Infinity, slope: variational ? v : NaN, curvature: NaN, plain: g - 1, slopePlain: v, edge: eta };
    if (h < 0 && g < 0.8) return { kind: 'under', residual: -Infinity, slope: variational ? v : NaN, curvature: NaN, plain: g - 1, slopePlain: v, edge: eta };
    if (F < FMin) FMin = F;
    if (last) {
      const plain = g - 1;
      // Asymptotic condition: with f ≈ ξ far out, f' − 1 obeys the linearised equation
      // φ'' + ξ φ' − 2β φ = 0, whose decaying solution has φ'/φ = −ξ − a/ξ + a(a+1)/ξ³ + O(ξ⁻⁵),
      // a = 1 + 2β (our own algebra; the other solution, ξ^{2β}, is what η∞ = ∞ excludes).
      // Imposing that ratio instead of φ = 0 removes the leading truncation error.
      let lambda = Infinity;
      if (f > 3) {
        const a = 1 + 2 * beta;
        lambda = f + a / f - (a * (a + 1)) / (f * f * f);
      }
      const residual = plain + h / lambda;
      const slope = variational ? v + w / lambda : NaN;
      const curvature = q2 > 0 ? sv2[0] + sw2[0] / lambda : NaN;
      return { kind: 'edge', residual, slope, curvature, plain, slopePlain: v, edge: eta, steps: builder };
    }
  }
  return failedShot();
}

function failedShot(): Shot {
  return { kind: 'failed', residual: NaN, slope: NaN, curvature: NaN, plain: NaN, slopePlain: NaN, edge: NaN };
}

// ------------------------------------------------------------------------------ Newton

/** Starting guess for f''(0): a rough fit, only the Newton iteration sets the value. */
function initialGuess(beta: number, fw: number): number {
  // f''(0)² ≈ 0.2205 + 1.1404 β + 0.1584 β² without blowing: our own fit through the Blasius value
  // (β = 0), Hiemenz's (β = 1) and zero at Hartree's separation (β = −0.19884), within about 3 %
  // on −0.19 ≤ β ≤ 1.6; then the suction/blowing shift of a thin layer, s ≈ ½(f_w + √(f_w² + 4 s₀²)).
  const s0 = Math.sqrt(Math.max(0.2205 + 1.1404 * beta + 0.1584 * beta * beta, 1e-8));
  return 0.5 * (fw + Math.sqrt(fw * fw + 4 * s0 * s0));
}

/**
 * Shot precision for an iterate whose relative error is about `error`: enough that the Newton
 * step from it is limited by error² (Newton's own convergence); full once the iterate is close.
 * `scale` is s·∂r/∂s (capped at 1), the size of the residual per relative change of s: near
 * separation, where f''(0) and the residual are small, every precision tightens with it.
 */
function precisionFor(error: number, scale: number): number {
  // (Not below 1e-16: the residual is a difference of order-one numbers.)
  const full = Math.max(1e-16, EPS_FINAL * scale);
  if (error <= FINAL_ERROR) return full;
  return Math.max(full, Math.min(EPS_COARSE, 0.1 * scale * error * error));
}

/**
 * Newton's constant C in error_{k+1} ≈ C·error_k², estimated from two successive relative
 * changes (at least 1; 1 when there is no previous step). It is large for β > 0 on a long
 * domain, where ∂f'(η∞)/∂s grows like η∞^{2β}: the acceptance and the precision ladder use it.
 */
export function newtonCurvature(change: number, previousChange: number): number {
  return previousChange > 0 ? Math.max(1, change / (previousChange * previousChange)) : 1;
}

interface RootResult {
  kind: 'root' | 'separation' | 'failed';
  /** f''(0), with the final correction applied. */
  s: number;
  shot?: Shot;
  trace?: SolutionTrace;
  integrations: number;
}

/** Shots before a bracket that has not closed in on a root asks whether one exists at all. */
const SHOTS_BEFORE_FLOOR_CHECK = 4;

/**
 * Newton on s, kept inside a sign bracket [lo, hi] (bisecting when it strays), from `guess`.
 * A root is accepted when a full-precision shot's own correction δ is below ACCEPT_CHANGE and
 * C²·δ³ (the error the correction leaves) below 1e-14.
 * With β < 0 or blowing the attached branch may not exist: if the residual at the bracket's
 * floor `lo0` is not negative, the answer is 'separation'.
 */
function findRoot(beta: number, fw: number, guess: number, lo0: number, minEdge: number): RootResult {
  let lo = lo0;
  let hi = Infinity;
  let s = Math.max(guess, 2 * lo);
  let error = GUESS_ERROR;
  let slope = NaN;
  let scale = 1;
  let previousChange = NaN;
  let integrations = 0;
  let floorChecked = !(beta < 0 || fw < 0);
  for (let iter = 0; iter < 200; iter++) {
    if (!floorChecked && iter >= SHOTS_BEFORE_FLOOR_CHECK) {
      floorChecked = true;
      integrations++;
      const floor = shoot(beta, fw, lo0, precisionFor(0, scale), EDGE_EXPONENT, false, false, minEdge);
      if (floor.kind === 'over' || (floor.kind === 'edge' && floor.residual >= 0)) return { kind: 'separation', s: NaN, integrations };
    }
    const final = error <= FINAL_ERROR;
    const eps = precisionFor(error, scale);
    // A coarse iterate needs a shorter domain only: what lies beyond moves the root by about
    // e^{−exponent}, far below the iterate's own error (and a trial off by a few per cent
    // diverges less on it). Not for β < 0: there the other far-field solution, ξ^{2β}, decays
    // too, and the root moves with the domain algebraically, by far more near separation.
    const edgeExponent = final || beta < 0 ? EDGE_EXPONENT : Math.min(EDGE_EXPONENT, Math.max(8, 4 - 2 * Math.log(error)));
    const shot = shoot(beta, fw, s, eps, edgeExponent, true, final, minEdge);
    integrations++;
    if (shot.kind === 'failed') return { kind: 'failed', s, integrations };
    const r = shot.residual;
    // Only a residual well above the shot's own error (precision, and the domain cut at
    // e^{−exponent}) may move the bracket.
    if (!Number.isFinite(r) || Math.abs(r) > 10 * eps + s * Math.exp(-edgeExponent)) {
      if (r < 0) lo = Math.max(lo, s);
      else if (r > 0) hi = Math.min(hi, s);
    }
    let newton = NaN;
    if (shot.kind === 'edge') {
      if (shot.slope > 0) {
        slope = shot.slope;
        scale = Math.min(1, s * slope);
      }
      if (slope > 0) newton = s - r / slope;
    } else if (shot.slope > 0) {
      // A trial that left the layer early: Newton on f' = 1 where it left, a shorter domain
      // on which the problem is better conditioned (the exit moves out as s closes in).
      newton = s - shot.plain / shot.slope;
    }
    if (Number.isFinite(newton) && newton > lo && newton < hi) {
      const change = Math.abs(newton - s) / s;
      const curvature = newtonCurvature(change, previousChange);
      if (shot.kind === 'edge' && final && change <= ACCEPT_CHANGE && curvature * curvature * change ** 3 <= 1e-14 && shot.steps) {
        // The root to second order, r + r'δ + r''δ²/2 = 0, and the solution moved there along
        // the first and second variations: what is left is of order δ³.
        const delta0 = newton - s;
        const delta = delta0 - (0.5 * shot.curvature * delta0 * delta0) / slope;
        const trace = shot.steps.build(shot.edge, [delta, 0.5 * delta * delta]);
        return { kind: 'root', s: s + delta, shot: { ...shot, residual: 0, plain: shot.plain + delta * shot.slopePlain }, trace, integrations };
      }
      // The next iterate is off by about C·change², or by what this shot's precision allows
      // (its residual error ε over s·∂r/∂s); a step from a shorter domain only by its own size.
      error = shot.kind === 'edge' ? Math.max(curvature * change * change, eps / scale, 1e-16) : change;
      previousChange = shot.kind === 'edge' ? change : NaN;
      s = newton;
      continue;
    }
    error = GUESS_ERROR;
    previousChange = NaN;
    if (hi === Infinity) s = 2 * s + 0.1;
    else if (lo > 0 && hi / lo > 1e3) s = Math.sqrt(lo * hi); // geometric bisection over decades
    else s = 0.5 * (lo + hi);
    if (hi < Infinity && hi - lo <= 1e-14 * hi) return { kind: 'failed', s, integrations };
  }
  return { kind: 'failed', s, integrations };
}

function firstCrossing(trace: SolutionTrace, k: number, level: number, from = 0): number {
  // First η where derivative k of F rises through `level`: nodes, then Newton on the step's
  // polynomial safeguarded by bisection.
  let i = from;
  while (i < trace.length && trace.node(k, i) < level) i++;
  if (i === 0) return trace.eta[0];
  if (i >= trace.length) return NaN;
  let a = trace.eta[i - 1];
  let b = trace.eta[i];
  let x = 0.5 * (a + b);
  for (let it = 0; it < 100; it++) {
    const r = trace.derivative(k, x) - level;
    if (r < 0) a = x;
    else b = x;
    const slope = trace.derivative(k + 1, x);
    let next = x - r / slope;
    if (!(next > a && next < b)) next = 0.5 * (a + b);
    if (Math.abs(next - x) <= 1e-15 * Math.max(1, x) || b - a <= 1e-15 * b) return next;
    x = next;
  }
  return x;
}

export interface SolveOptions {
  /** Smallest outer edge (the solver's own edge is used when farther); for checking η∞ independence. */
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
  const minEdge = Math.min(options.etaInfStart ?? 0, ETA_INF_MAX);
  stepsLeft = WORK_STEPS;
  // The attached branch needs residual(lo) < 0: with s = 0 (or, with blowing, s at the
  // blow-off floor) a non-negative residual means no attached root exists above it.
  const lo = fw < 0 ? BLOWOFF_WALL_SHEAR : 0;
  const root = findRoot(beta, fw, initialGuess(beta, fw), lo, minEdge);
  base.integrations = root.integrations;
  if (root.kind === 'separation') return { ...base, status: 'separation' };
  const trace = root.trace;
  if (root.kind === 'root' && trace && isAttachedProfile(trace)) {
    const shot = root.shot!;
    const s = root.s;
    // Blowing near blow-off: f''(0) falls below the floor as the layer leaves the wall.
    if (s < BLOWOFF_WALL_SHEAR) return { ...base, status: 'separation' };
    const { FMin, etaFMin } = minimumOfF(trace, fw);
    return {
      ...base,
      status: 'attached',
      wallShear: s,
      eta99: firstCrossing(trace, 2, 0.99),
      etaInf: shot.edge,
      etaInfChange: Math.abs(shot.plain / shot.slope / s),
      trace,
      FMin,
      etaFMin,
    };
  }
  return base;
}

function isAttachedProfile(trace: SolutionTrace): boolean {
  // The attached branch has 0 ≤ f' ≤ 1 and f'' ≥ 0 throughout: spurious roots break these by
  // O(1) (checked at the nodes, and f' between them too); the margins only absorb the residual
  // left at η∞, where for β > 0 the sensitivity ∂f'(η∞)/∂s grows like η∞^{2β}.
  for (let i = 0; i < trace.length; i++) {
    const g = trace.node(2, i);
    if (g < -1e-6 || g > 1 + 1e-6 || trace.node(3, i) < -1e-6) return false;
    if (i + 1 < trace.length) {
      const mid = trace.derivative(2, 0.5 * (trace.eta[i] + trace.eta[i + 1]));
      if (mid < -1e-6 || mid > 1 + 1e-6) return false;
    }
  }
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
 * (f''(0) → 0; taken as f''(0) < 1e-9 in Hartree's scaling).
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
