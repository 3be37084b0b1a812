// Darcy friction factors for fully developed flow in smooth tubes, and the pressure-loss
// outputs built on them. Used by the pipe and duct correlations for `f` and
// `pressure_drop_coefficient`, and by Gnielinski's correlation itself.
import { InputError, type Outputs } from '../types.js';
import type { MethodInputs } from './method-inputs.js';

/** Reynolds range over which Petukhov fitted his friction factor (Incropera 7th ed., eq. 8.21). */
export const PETUKHOV_RE_RANGE = { min: 3000, max: 5e6 } as const;

// Hagen–Poiseuille, fully developed laminar flow in a circular tube: f = 64/Re.
export function laminarFrictionFactor(Re: number): number {
  if (!(Re > 0)) throw new InputError(`laminar friction factor: Re must be > 0, got ${Re}`);
  return 64 / Re;
}

// Petukhov, B.S. (1970) Adv. Heat Transfer 6:503–564: f = (0.790 ln Re − 1.64)^−2, smooth tubes.
export function petukhovFrictionFactor(Re: number): number {
  const root = 0.79 * Math.log(Re) - 1.64;
  // The fit has a pole at Re ≈ 8; far outside its range, but a number there would be meaningless.
  if (!(root > 0)) throw new InputError(`Petukhov friction factor is undefined for Re ≤ 8 (got ${Re})`);
  return root ** -2;
}

/**
 * Nu and f, plus the loss coefficient K = f·L/D when L/D is known, so that Δp = K·½ρu_m²
 * (the engine turns K into pascals). `lengthRatio` is L/D or L/D_h.
 */
export function withPressureDrop(Nu: number, f: number, lengthRatio: number | undefined): Outputs {
  const out: Outputs = { Nu, f };
  if (lengthRatio !== undefined) out.pressure_drop_coefficient = f * lengthRatio;
  return out;
}

/** The optional L_over_D input: undefined when absent, an InputError when not > 0. */
export function optionalLengthRatio(input: MethodInputs): number | undefined {
  return input.values.L_over_D === undefined ? undefined : input.number('L_over_D');
}
