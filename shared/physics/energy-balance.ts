// Energy balances of a stream heated or cooled along its path: what makes an internal-flow
// heat rate consistent with what the stream can carry (never more than ṁ·c_p·|T_s − T_in|).
// Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §8.3.2:
// uniform wall temperature eq. 8.41b, ΔT_lm eq. 8.44; uniform flux eq. 8.40; tube banks §7.6 eqs. 7.63–7.64.

/** Number of transfer units h̄·A/(ṁ·c_p). */
export function transferUnits(h: number, area: number, massFlow: number, cp: number): number {
  return (h * area) / (massFlow * cp);
}

/** Uniform wall temperature: T_out = T_s − (T_s − T_in)·exp(−NTU) (Incropera eq. 8.41b). */
export function outletUniformWallTemperature(Ts: number, Tin: number, ntu: number): number {
  return Ts - (Ts - Tin) * Math.exp(-ntu);
}

/** Uniform heat flux: T_out = T_in + q″·A/(ṁ·c_p) (Incropera eq. 8.40 integrated). */
export function outletUniformFlux(Tin: number, heatFlux: number, area: number, massFlow: number, cp: number): number {
  return Tin + (heatFlux * area) / (massFlow * cp);
}

/**
 * Log-mean temperature difference for a uniform wall temperature (Incropera eq. 8.44),
 * written as (ΔT_in − ΔT_out)/NTU, which is the same number (ln(ΔT_in/ΔT_out) = NTU) but
 * stays finite when ΔT_out underflows (long tubes) and tends to ΔT_in as NTU → 0.
 */
export function logMeanTemperatureDifference(Ts: number, Tin: number, ntu: number): number {
  const dTin = Ts - Tin;
  if (ntu < 1e-8) return dTin * (1 - ntu / 2);
  return (dTin * -Math.expm1(-ntu)) / ntu;
}

export interface OutletIteration {
  converged: boolean;
  Tout: number;
  iterations: number;
}

/**
 * Fixed point on the outlet temperature: `next(T_out)` recomputes the outlet with the
 * properties at the mean bulk temperature (T_in + T_out)/2. Stops when the outlet moves by
 * less than `tolerance` K (1e-6 K unless told). Damped when it oscillates.
 */
export function iterateOutlet(Tin: number, next: (Tout: number) => number, tolerance = 1e-6, maxIterations = 100): OutletIteration {
  let Tout = Tin;
  let previousStep = Infinity;
  let relax = 1;
  for (let i = 1; i <= maxIterations; i++) {
    const proposed = next(Tout);
    if (!Number.isFinite(proposed)) return { converged: false, Tout: proposed, iterations: i };
    const step = proposed - Tout;
    if (Math.abs(step) <= tolerance) return { converged: true, Tout: proposed, iterations: i };
    // A step that grows or flips with a larger size means overshoot: halve the relaxation.
    if (Math.abs(step) > 0.9 * Math.abs(previousStep)) relax = Math.max(relax / 2, 1 / 64);
    previousStep = step;
    Tout += relax * step;
  }
  return { converged: false, Tout, iterations: maxIterations };
}
