// Ethylene- and propylene-glycol–water solutions at a given mass concentration (10 % to
// 60 %), from the solution's freezing point to 100 °C. The properties are a closed-form
// correlation in concentration and temperature (data/glycolWater.ts), evaluated directly:
// no table, so nothing to interpolate. The freezing curve is a table in concentration,
// interpolated by a monotone cubic.

import { FluidRangeError, type Fluid, type FluidProperties } from './types.js';
import { MonotoneCubic } from './monotoneCubic.js';
import type { GlycolSolutionData } from './data/glycolWater.js';

/** Mass-fraction range of the correlations and of the catalogue entries. */
export const GLYCOL_CONCENTRATION_MIN = 0.1;
export const GLYCOL_CONCENTRATION_MAX = 0.6;
/** Upper end of the correlations (100 °C). */
export const GLYCOL_TMAX = 373.15;

const T_REF = 273.15;

/** Freezing point (K) of the solution at mass fraction xi, from the handbook table. */
export function freezingPoint(data: GlycolSolutionData, xi: number): number {
  return T_REF + freezingCurve(data).value(xi);
}

const curves = new WeakMap<GlycolSolutionData, MonotoneCubic>();
function freezingCurve(data: GlycolSolutionData): MonotoneCubic {
  let curve = curves.get(data);
  if (!curve) {
    curve = new MonotoneCubic(
      data.freezing.map(([x]) => x),
      data.freezing.map(([, t]) => t),
    );
    curves.set(data, curve);
  }
  return curve;
}

// Conde (2011): Y = A1 + A2 ξ + A3 Θ + A4 ξ Θ + A5 Θ², Θ = 273.15/T.
function conde(a: readonly number[], xi: number, theta: number): number {
  return a[0] + a[1] * xi + (a[2] + a[3] * xi) * theta + a[4] * theta * theta;
}

// dY/dT of the same form: dΘ/dT = −Θ/T.
function condeSlope(a: readonly number[], xi: number, theta: number, T: number): number {
  return (-(a[2] + a[3] * xi + 2 * a[4] * theta) * theta) / T;
}

/** The solution at mass fraction xi (callers check 0.1 ≤ xi ≤ 0.6). */
export function makeGlycolWater(data: GlycolSolutionData, xi: number): Fluid {
  const percent = Number((xi * 100).toPrecision(6));
  const Tmin = freezingPoint(data, xi);
  const label = `${data.name} ${percent} %`;
  return {
    name: data.name,
    title: `${data.glycol[0].toUpperCase()}${data.glycol.slice(1)}–water solution, ${percent} % by mass`,
    Tmin,
    Tmax: GLYCOL_TMAX,
    source: data.source,
    properties(T: number): FluidProperties {
      if (!(T >= Tmin && T <= GLYCOL_TMAX)) {
        const note =
          T < Tmin
            ? `the ${percent} % solution freezes at ${Tmin.toFixed(2)} K (${(Tmin - T_REF).toFixed(1)} °C)`
            : 'the correlations end at 100 °C';
        throw new FluidRangeError(label, T, Tmin, GLYCOL_TMAX, note);
      }
      const theta = T_REF / T;
      const rho = conde(data.rho, xi, theta);
      const cp = conde(data.cp, xi, theta) * 1e3;
      const k = conde(data.k, xi, theta);
      const mu = Math.exp(conde(data.lnMu, xi, theta));
      // β = −(1/ρ) ∂ρ/∂T of the density correlation itself.
      const beta = -condeSlope(data.rho, xi, theta, T) / rho;
      const nu = mu / rho;
      const alpha = k / (rho * cp);
      return { rho, cp, mu, k, nu, alpha, Pr: nu / alpha, beta };
    },
  };
}
