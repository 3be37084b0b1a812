// The surface temperature at which a surface sheds a given heat flux by convection (and
// radiation, when it has an emissivity): solve q = h(T_s)·(T_s − T_ref) + εσ(T_s⁴ − T_sur⁴)
// with h re-evaluated at every iterate (properties at the film temperature; T_ref is T∞, or
// the adiabatic wall temperature where viscous dissipation matters). Bracketed by walking
// away from the fluid temperature in doubling steps, then Brent's method: robust for free
// convection, where h itself depends on T_s.
import { FluidRangeError } from './fluids/types.js';
import { brent } from './numerics/roots.js';
import { radiativeFlux, type RadiationSpec } from './radiation.js';

export interface SurfaceBalance {
  /** Convective flux into the fluid at surface temperature T_s, W/m² (throws FluidRangeError beyond the fluid's table). */
  convective(Ts: number): number;
  radiation?: RadiationSpec;
  /** What the surface must shed, convection plus radiation, W/m² (negative: it takes heat in). */
  target: number;
  /** The fluid temperature, where the walk starts, K. */
  start: number;
}

export type SurfaceStatus = 'converged' | 'out-of-range' | 'not-converged';

export interface SurfaceSolution {
  status: SurfaceStatus;
  Ts: number;
  /** Evaluations of the convective flux (each one a method call). */
  evaluations: number;
}

/** Relative tolerance on T_s: the balance then closes to far better than 1e-6 of q. */
const RELATIVE_TOLERANCE = 1e-13;
/** Largest excursion from the fluid temperature tried while bracketing, K. */
const MAX_EXCURSION = 2e4;

export function solveSurfaceTemperature(b: SurfaceBalance): SurfaceSolution {
  let evaluations = 0;
  let outOfRange = false;
  const residual = (Ts: number): number => {
    let conv: number;
    if (Ts === b.start) {
      // At T_s = T∞ free convection has no driving force (Gr = 0): the flux is nil. With
      // dissipation (T_aw ≠ T∞) the method still answers, so ask it when it can.
      try {
        evaluations++;
        conv = b.convective(Ts);
      } catch (e) {
        if (e instanceof FluidRangeError) throw e;
        conv = 0;
      }
    } else {
      evaluations++;
      conv = b.convective(Ts);
    }
    const rad = b.radiation ? radiativeFlux(b.radiation.emissivity, Ts, b.radiation.surroundings) : 0;
    return conv + rad - b.target;
  };
  const safe = (Ts: number): number => {
    try {
      return residual(Ts);
    } catch (e) {
      if (e instanceof FluidRangeError) {
        outOfRange = true;
        return NaN;
      }
      throw e;
    }
  };

  const g0 = safe(b.start);
  if (!Number.isFinite(g0)) return { status: outOfRange ? 'out-of-range' : 'not-converged', Ts: NaN, evaluations };
  if (g0 === 0) return { status: 'converged', Ts: b.start, evaluations };
  // The shed flux grows with T_s: below the target, walk up; above it, walk down.
  const direction = g0 < 0 ? 1 : -1;
  let near = b.start;
  let far = NaN;
  for (let step = 0.5; step <= MAX_EXCURSION; step *= 2) {
    const Ts = b.start + direction * step;
    if (!(Ts > 0)) break;
    const g = safe(Ts);
    if (!Number.isFinite(g)) break;
    if (Math.sign(g) !== Math.sign(g0)) {
      far = Ts;
      break;
    }
    near = Ts;
  }
  if (!Number.isFinite(far)) return { status: outOfRange ? 'out-of-range' : 'not-converged', Ts: NaN, evaluations };
  const [lo, hi] = near < far ? [near, far] : [far, near];
  const root = brent(safe, lo, hi, { relTol: RELATIVE_TOLERANCE });
  if (root.status !== 'converged') return { status: outOfRange ? 'out-of-range' : 'not-converged', Ts: NaN, evaluations };
  return { status: 'converged', Ts: root.x, evaluations };
}
