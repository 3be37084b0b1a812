// Radiation exchange between a small grey surface and large isothermal surroundings, the
// mode that always acts beside free convection: q_rad = εσ(T_s⁴ − T_sur⁴), linearised as
// h_rad = εσ(T_s² + T_sur²)(T_s + T_sur) (Incropera et al., 7th ed., eqs. 1.7 and 1.9).
import { InputError, type Outputs } from './types.js';

/** Stefan–Boltzmann constant, W/(m²·K⁴) (CODATA 2018, exact from the SI defining constants). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

/** εσ(T_s⁴ − T_sur⁴), W/m², positive when the surface loses heat. */
export function radiativeFlux(emissivity: number, Ts: number, Tsur: number): number {
  return emissivity * STEFAN_BOLTZMANN * (Ts ** 4 - Tsur ** 4);
}

/** εσ(T_s² + T_sur²)(T_s + T_sur), W/(m²·K). */
export function radiativeCoefficient(emissivity: number, Ts: number, Tsur: number): number {
  return emissivity * STEFAN_BOLTZMANN * (Ts * Ts + Tsur * Tsur) * (Ts + Tsur);
}

/** The radiation inputs of a point: emissivity 0 … 1 and the surroundings (default: the fluid temperature). */
export interface RadiationSpec {
  emissivity: number;
  surroundings: number;
}

export function radiationSpec(emissivity: number | undefined, surroundings: number | undefined, fluidTemperature: number): RadiationSpec | undefined {
  if (emissivity === undefined) {
    if (surroundings !== undefined) throw new InputError(`input 'surroundings_temperature' needs 'emissivity' (0 … 1) to mean anything`);
    return undefined;
  }
  if (!(emissivity >= 0 && emissivity <= 1)) throw new InputError(`input 'emissivity' must lie in 0 … 1, got ${emissivity}`);
  if (surroundings !== undefined && !(surroundings > 0)) throw new InputError(`input 'surroundings_temperature' must be above 0 K, got ${surroundings}`);
  return { emissivity, surroundings: surroundings ?? fluidTemperature };
}

/**
 * The radiation outputs beside the convective q (and heat_rate when the area is known):
 * h_radiation, q_radiation, q_total, heat_rate_radiation, heat_rate_total, radiation_fraction.
 */
export function radiationOutputs(spec: RadiationSpec, Ts: number, q: number, area: number | undefined): Outputs {
  const qRad = radiativeFlux(spec.emissivity, Ts, spec.surroundings);
  const qTotal = q + qRad;
  const out: Outputs = {
    h_radiation: radiativeCoefficient(spec.emissivity, Ts, spec.surroundings),
    q_radiation: qRad,
    q_total: qTotal,
  };
  if (qTotal !== 0) out.radiation_fraction = qRad / qTotal;
  if (area !== undefined) {
    out.heat_rate_radiation = qRad * area;
    out.heat_rate_total = qTotal * area;
  }
  return out;
}
