// Thermophysical properties, SI: rho kg/m³, cp J/(kg·K), mu Pa·s, k W/(m·K),
// nu m²/s, alpha m²/s, Pr 1, beta 1/K (volumetric expansion coefficient).
export interface FluidProperties {
  rho: number;
  cp: number;
  mu: number;
  k: number;
  nu: number;
  alpha: number;
  Pr: number;
  beta: number;
}

export interface Fluid {
  /** Catalogue name, e.g. `water`; `user` for user-defined fluids. */
  name: string;
  title: string;
  /** Valid temperature range in K (inclusive). */
  Tmin: number;
  Tmax: number;
  /** Where the property data come from. */
  source: string;
  /** Properties at temperature T (K). Throws FluidRangeError outside [Tmin, Tmax]: never extrapolates. */
  properties(T: number): FluidProperties;
}

/** A temperature outside a fluid's data range: an error, never an extrapolated number. */
export class FluidRangeError extends Error {
  constructor(
    public readonly fluid: string,
    public readonly temperature: number,
    public readonly Tmin: number,
    public readonly Tmax: number,
    /** Why the range ends where it does, e.g. the freezing point of a solution. */
    note?: string,
  ) {
    super(
      `temperature ${temperature.toFixed(2)} K is outside the range of fluid '${fluid}' ` +
        `(${Tmin.toFixed(2)} K to ${Tmax.toFixed(2)} K)${note ? `: ${note}` : ''}`,
    );
    this.name = 'FluidRangeError';
  }
}
