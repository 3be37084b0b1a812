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

/**
 * Suffixes the design layer (shared/design/names.ts) appends to a name: band ends and
 * the achievable range of a target out of reach. They carry the unit of the name itself.
 */
const SAME_UNIT_SUFFIXES = ['_low', '_high', '_min', '_max'];

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
  return (name) => {
    const unit = direct(name);
    if (unit !== undefined) return unit;
    const suffix = SAME_UNIT_SUFFIXES.find((s) => name.endsWith(s));
    return suffix ? direct(name.slice(0, -suffix.length)) : undefined;
  };
}

/** The unit as headers show it: `-` for dimensionless. */
export function displayUnit(unit: string): string {
  return unit === '1' || unit === '' ? '-' : unit;
}
