// Which SI unit each input and output name carries, for export headers. The method's own
// InputSpec/OutputSpec wins; then the dimensional quantities a study may give; then the
// quantities the dimensional engine derives itself (engine.ts), which no method declares.
import { dimensionalQuantities, engineInputSpecs, engineOutputSpecs } from '../physics/quantities.js';
import type { MethodInfo } from '../physics/types.js';

/** Units of what engine.ts adds to a method's outputs, and of the usual dimensionless groups. */
export const derivedUnits: Readonly<Record<string, string>> = {
  ...Object.fromEntries([...engineOutputSpecs, ...engineInputSpecs].map((s) => [s.name, s.unit])),
  Re: '1',
  Pr: '1',
  Pr_s: '1',
  Gr: '1',
  Ra: '1',
  Nu: '1',
  Nu_x: '1',
  f: '1',
  Cf: '1',
  Cf_x: '1',
  viscosity_ratio: '1',
  L_over_D: '1',
  aspect_ratio: '1',
  recovery_factor: '1',
  delta99_x: '1',
  pressure_drop_coefficient: '1',
  // Internal-flow energy balance (issue 9): named here so targets and bands can use them.
  outlet_temperature: 'K',
  mean_bulk_temperature: 'K',
  surface_temperature_outlet: 'K',
  log_mean_temperature_difference: 'K',
  mass_flow: 'kg/s',
};

/** SI unit of a name (`1` for dimensionless), or undefined when nothing declares it. */
export type UnitLookup = (name: string) => string | undefined;

/** A lookup over the given methods' specs, the dimensional quantities and `derivedUnits`. */
export function makeUnitLookup(methods: readonly Pick<MethodInfo, 'inputs' | 'outputs'>[]): UnitLookup {
  const table = new Map<string, string>(Object.entries(derivedUnits));
  for (const q of dimensionalQuantities) table.set(q.name, q.unit);
  // First declaring method wins; the catalogue keeps names and units fixed across methods.
  const declared = new Map<string, string>();
  for (const m of methods) {
    for (const spec of [...m.inputs, ...m.outputs]) {
      if (!declared.has(spec.name)) declared.set(spec.name, spec.unit);
    }
  }
  const direct = (name: string) => declared.get(name) ?? table.get(name);
  // `h_low`/`h_high` (a band), `h_min`/`h_max` (a range) carry the unit of `h`.
  return (name) => direct(name) ?? (BOUND_SUFFIX.test(name) ? direct(name.replace(BOUND_SUFFIX, '')) : undefined);
}

/**
 * Suffixes of names that are bounds of another quantity and share its unit: the design
 * layer's band ends and a target's achievable range (shared/design/names.ts).
 */
export const BOUND_SUFFIX = /_(low|high|min|max)$/;

/**
 * Whether a name is an absolute temperature (shown in °C or K by choice): its unit is K
 * and its name says temperature (`outlet_temperature`, `surface_temperature_outlet`). A
 * temperature difference (`log_mean_temperature_difference`) is K in either choice and
 * never offset.
 */
export function isAbsoluteTemperature(name: string, unit: string | undefined): boolean {
  return unit === 'K' && /temperature/.test(name) && !/difference/.test(name);
}

/** The unit as headers show it: `-` for dimensionless. */
export function displayUnit(unit: string): string {
  return unit === '1' || unit === '' ? '-' : unit;
}
