// Liquid sodium, 371 K (melting point) to 1100 K, from the recommended correlations of
// Fink, J. K. & Leibowitz, L. (1995) "Thermodynamic and transport properties of sodium liquid
// and vapor", Argonne National Laboratory report ANL/RE-95/2, as also adopted in IAEA (2008)
// "Thermophysical properties of materials for nuclear engineering" (IAEA-THPH). Equations and
// coefficients written FROM MEMORY; checked against Incropera's Table A.7 and the melting-point
// values quoted in those reports (tests/fluids_sodium.test.ts). Evaluated directly, no table.

import { FluidRangeError, type Fluid, type FluidProperties } from './types.js';

/** Critical temperature (K) and density (kg/m³) of the density equation. */
const TC = 2503.7;
const RHO_C = 219;
const F = 275.32;
const G = 511.58;

/** Fink & Leibowitz (1995): ρ = ρc + f(1 − T/Tc) + g(1 − T/Tc)^½, kg/m³. */
export function sodiumDensity(T: number): number {
  const tau = 1 - T / TC;
  return RHO_C + F * tau + G * Math.sqrt(tau);
}

/** dρ/dT of the same equation, kg/(m³·K). */
function sodiumDensitySlope(T: number): number {
  const tau = 1 - T / TC;
  return -(F + G / (2 * Math.sqrt(tau))) / TC;
}

/** Fink & Leibowitz (1995): cp = 1.6582 − 8.4790e-4 T + 4.4541e-7 T² − 2992.6 / T², kJ/(kg·K). */
export function sodiumHeatCapacity(T: number): number {
  return (1.6582 - 8.479e-4 * T + 4.4541e-7 * T * T - 2992.6 / (T * T)) * 1e3;
}

/** Fink & Leibowitz (1995), after Shpil'rain et al.: ln μ = −6.4406 − 0.3958 ln T + 556.835 / T, Pa·s. */
export function sodiumViscosity(T: number): number {
  return Math.exp(-6.4406 - 0.3958 * Math.log(T) + 556.835 / T);
}

/** Fink & Leibowitz (1995): k = 124.67 − 0.11381 T + 5.5226e-5 T² − 1.1842e-8 T³, W/(m·K). */
export function sodiumConductivity(T: number): number {
  return 124.67 - 0.11381 * T + 5.5226e-5 * T * T - 1.1842e-8 * T * T * T;
}

const TMIN = 371;
const TMAX = 1100;

export const sodium: Fluid = {
  name: 'sodium',
  title: 'Sodium (liquid)',
  Tmin: TMIN,
  Tmax: TMAX,
  source:
    'Fink & Leibowitz (1995) ANL/RE-95/2 recommended correlations (as in IAEA 2008 thermophysical properties ' +
    'compilation): rho, cp, mu (after Shpil\'rain et al.), k; beta from the density equation (equations from memory)',
  properties(T: number): FluidProperties {
    if (!(T >= TMIN && T <= TMAX)) {
      const note = T < TMIN ? 'sodium melts at 371 K' : 'the shipped range of the correlations ends at 1100 K';
      throw new FluidRangeError('sodium', T, TMIN, TMAX, note);
    }
    const rho = sodiumDensity(T);
    const cp = sodiumHeatCapacity(T);
    const mu = sodiumViscosity(T);
    const k = sodiumConductivity(T);
    // Expansion along saturation; the vapour pressure below 1100 K is under 1 bar, so this
    // is the isobaric coefficient to well within the correlation's uncertainty.
    const beta = -sodiumDensitySlope(T) / rho;
    const nu = mu / rho;
    const alpha = k / (rho * cp);
    return { rho, cp, mu, k, nu, alpha, Pr: nu / alpha, beta };
  },
};
