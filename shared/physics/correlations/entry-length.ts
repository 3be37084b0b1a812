// Entrance lengths for methods that assume fully developed flow, and the usual short-tube
// correction of turbulent correlations. A method whose form assumes fully developed flow
// flags `entry-region` where the tube is shorter than the entry length, so an average
// over a short tube is never silently the fully developed value.
import type { Flag, InputSpec } from '../types.js';

/**
 * Laminar: hydrodynamic entry x_fd,h ≈ 0.05·Re·D and thermal entry x_fd,t ≈ 0.05·Re·Pr·D
 * (Incropera et al., 7th ed., eqs. 8.3 and 8.23); the longer of the two must fit in the tube.
 * Without Pr only the hydrodynamic length is checked.
 */
export function laminarEntryFlag(Re: number, Pr: number | undefined, L_over_D: number | undefined): Flag | undefined {
  if (L_over_D === undefined) return undefined;
  const entry = 0.05 * Re * Math.max(1, Pr ?? 1);
  return L_over_D < entry ? 'entry-region' : undefined;
}

/** Turbulent: fully developed beyond about 10 diameters (Incropera et al., 7th ed., eq. 8.4 and §8.5). */
export const TURBULENT_ENTRY_L_OVER_D = 10;

export function turbulentEntryFlag(L_over_D: number | undefined, corrected: boolean): Flag | undefined {
  if (L_over_D === undefined || corrected) return undefined;
  return L_over_D < TURBULENT_ENTRY_L_OVER_D ? 'entry-region' : undefined;
}

export const shortTubeInput: InputSpec = {
  name: 'short_tube_correction',
  description:
    'true: multiply Nu by 1 + (D/L)^(2/3), the mean over a short tube with a sharp entrance (Hausen 1959, as in Gnielinski 1976); needs L_over_D',
  unit: '1',
  type: 'boolean',
  required: false,
  default: false,
};

// Hausen, H. (1959) Allg. Wärmetechnik 9:75–79, the factor 1 + (D/L)^(2/3) that Gnielinski,
// V. (1976) Int. Chem. Eng. 16:359–368 carries in his equation (from memory).
export function shortTubeFactor(L_over_D: number): number {
  return 1 + (1 / L_over_D) ** (2 / 3);
}
