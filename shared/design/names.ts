// Names the design layer adds to result rows, and which flags make a method inapplicable.
//
// - `<output>_low`, `<output>_high`: the 2.5 % and 97.5 % points of an output (bands.ts).
// - `<output>_min`, `<output>_max`: for a target that cannot be met, the smallest and
//   largest value of the output seen over the `within` interval (target.ts).
// - the adjusted input itself (e.g. `velocity`): a target's solved value, in outputs too,
//   because a stored point's inputs are shared by all its methods and each method solves
//   its own value.

/** Outputs that get bands when a row has them (surface/outlet temperature only where solved). */
export const BANDED_OUTPUTS: readonly string[] = ['Nu', 'Nu_x', 'h', 'h_x', 'q', 'heat_rate', 'surface_temperature', 'outlet_temperature'];

export const lowName = (name: string) => `${name}_low`;
export const highName = (name: string) => `${name}_high`;
export const minName = (name: string) => `${name}_min`;
export const maxName = (name: string) => `${name}_max`;

export const TARGET_NOT_REACHED = 'target-not-reached';
export const TARGET_SEVERAL_ROOTS = 'target-several-roots';
/** Some Monte Carlo samples gave no number (a sample's target not met, a non-finite output): the band uses the rest. */
export const BAND_INCOMPLETE = 'band-incomplete';
/** The stated uncertainty could not be carried to this output (no rule below covers the row): its band holds the tolerances only. */
export const bandInputsOnly = (output: string) => `band-inputs-only:${output}`;
export const NO_APPLICABLE_METHOD = 'no-applicable-method';

/**
 * Whether a flag says the method does not hold (or gave no answer) at the point: a range
 * flag `out-of-range:…`, `entry-region`, `domain-error`, `not-converged`, `separation`,
 * `non-finite:…`, or a target it cannot meet. Other flags (`target-several-roots`, `band-…`) leave it applicable.
 */
export function isRangeFlag(flag: string): boolean {
  return (
    flag.startsWith('out-of-range:') ||
    flag.startsWith('non-finite:') ||
    flag === 'domain-error' ||
    flag === 'not-converged' ||
    flag === 'separation' ||
    // A fully developed form used in a tube too short for it (issue 9's entry-region flag).
    flag === 'entry-region' ||
    flag === TARGET_NOT_REACHED
  );
}
