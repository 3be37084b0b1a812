// Fluid properties at a point: read at one temperature, with the point's pressure where
// the fluid uses it, and the boiling check for liquid water. A `pressure` given for a
// fluid that cannot use it is refused, never ignored.
import { FluidRangeError, type Fluid, type FluidProperties } from './fluids/types.js';
import { waterSaturationTemperature } from './fluids/water-saturation.js';
import { InputError, type Flag, type Method } from './types.js';

/** Standard atmosphere, Pa. */
export const P_ATM = 101325;

/** How a fluid uses the point's pressure. */
type PressureUse = 'ideal-gas' | 'saturation' | 'in-spec';

// Air behaves as an ideal gas: ρ ∝ p, so ν and α scale with 1/p; μ, k, c_p and Pr barely
// depend on pressure at these conditions (Incropera, Table A.4 note). Water: the tables
// are the saturated / 1 atm liquid (compressed-liquid effects on ρ, μ, k are below 0.5 %
// up to 5 MPa, IAPWS, common practice), and the pressure sets the boiling check.
// Humid air is built for one pressure (its spec carries the study's fixed `pressure`,
// fluids/spec.ts): its properties already hold at that pressure, so nothing is scaled here.
const PRESSURE_USE: Record<string, PressureUse> = { air: 'ideal-gas', water: 'saturation', 'humid-air': 'in-spec' };

export interface PropertyReader {
  fluid: Fluid;
  /** Absolute pressure, Pa (default 1 atm). */
  pressure: number;
  at(T: number): FluidProperties;
}

/** A reader for one point; throws an InputError when the fluid cannot use a given pressure. */
export function propertyReader(fluid: Fluid, pressure: number | undefined): PropertyReader {
  const use = PRESSURE_USE[fluid.name];
  if (pressure !== undefined && use === undefined) {
    throw new InputError(
      `input 'pressure' is not used by fluid '${fluid.name}' (its properties do not depend on it here); remove it. ` +
        `Pressure is read for air (ideal-gas density) and water (boiling check)`,
    );
  }
  if (pressure !== undefined && !(pressure > 0)) throw new InputError(`input 'pressure' must be > 0 Pa, got ${pressure}`);
  const p = pressure ?? P_ATM;
  const scale = use === 'ideal-gas' ? p / P_ATM : 1;
  return {
    fluid,
    pressure: p,
    at(T: number) {
      const props = fluid.properties(T);
      return scale === 1 ? props : { ...props, rho: props.rho * scale, nu: props.nu / scale, alpha: props.alpha / scale };
    },
  };
}

/** Whether a method reads wall properties (Pr_s or μ_b/μ_s). */
export function needsWallProperties(method: Method): boolean {
  return method.inputs.some((s) => s.name === 'Pr_s' || s.name === 'viscosity_ratio');
}

/**
 * Properties at the wall, only for methods that need them. A wall temperature outside the
 * fluid's table flags only those methods (`out-of-range:surface_temperature`).
 */
export function wallProperties(reader: PropertyReader, method: Method, Ts: number | undefined): { props?: FluidProperties; flag?: Flag } {
  if (Ts === undefined || !needsWallProperties(method)) return {};
  try {
    return { props: reader.at(Ts) };
  } catch (e) {
    if (e instanceof FluidRangeError) return { flag: 'out-of-range:surface_temperature' };
    throw e;
  }
}

/**
 * `boiling-possible` when liquid water anywhere in the layer (wall or bulk: the given
 * temperatures) is above its saturation temperature at the point's pressure.
 */
export function boilingFlag(reader: PropertyReader, temperatures: readonly (number | undefined)[]): Flag | undefined {
  if (PRESSURE_USE[reader.fluid.name] !== 'saturation') return undefined;
  const Tsat = waterSaturationTemperature(reader.pressure);
  const hottest = Math.max(...temperatures.filter((t): t is number => t !== undefined && Number.isFinite(t)));
  return Number.isFinite(Tsat) && hottest > Tsat ? 'boiling-possible' : undefined;
}
