// A fluid as a study, the command line or a stored run names it (FluidSpec), and how it
// becomes a Fluid. Catalogue fluids are a name; mixtures are a name with their parameters
// in SI (`{name: propylene-glycol-water, concentration: 0.4}`); user fluids are
// `{constant: {...}}` or `{table: {...}}`.

import { InputError } from '../types.js';
import { getFluid, parametricFluids, type ParametricFluid } from './catalogue.js';
import { makeConstantFluid } from './constantFluid.js';
import { makeTableFluid } from './tableFluid.js';
import type { Fluid } from './types.js';

/** Parameters of a mixture, SI: fractions 0…1, pressure in Pa. */
export interface FluidParameters {
  /** Glycol mass fraction of a glycol–water solution. */
  concentration?: number;
  /** Relative humidity of humid air. */
  relative_humidity?: number;
  /** Pressure of humid air; a study's `pressure` input (default 1 atm). */
  pressure?: number;
}

export type FluidSpec =
  | string
  | ({ name: string } & FluidParameters)
  | { constant: { rho: number; cp: number; mu: number; k: number; beta?: number } }
  | { table: { T: number[]; rho: number[]; cp: number[]; mu: number[]; k: number[]; beta?: number[] } };

// One Fluid per distinct mixture spec: a sweep resolves its fluid once, but the dashboard
// and the CLI resolve the same few specs again and again.
const resolved = new Map<string, Fluid>();
const CACHE_LIMIT = 64;

/** The Fluid a spec names; InputError (naming the fluid and the fault) for a bad spec. */
export function resolveFluidSpec(spec: FluidSpec): Fluid {
  if (typeof spec === 'string') return getFluid(spec);
  if (spec === null || typeof spec !== 'object') {
    throw new InputError('fluid: expected a catalogue name, {name, ...parameters}, {constant: {...}} or {table: {...}}');
  }
  if ('constant' in spec) return makeConstantFluid(spec.constant);
  if ('table' in spec) return makeTableFluid({ columns: spec.table });
  if (!('name' in spec) || typeof spec.name !== 'string') {
    throw new InputError('fluid: expected a catalogue name, {name, ...parameters}, {constant: {...}} or {table: {...}}');
  }
  const { name, ...parameters } = spec;
  const family = parametricFluids.find((f) => f.name === name);
  if (!family) {
    const given = Object.keys(parameters);
    const fluid = getFluid(name);
    if (given.length) throw new InputError(`fluid '${name}' takes no parameters (got ${given.join(', ')})`);
    return fluid;
  }
  const values = checkParameters(family, parameters as Record<string, unknown>);
  const key = JSON.stringify([name, values]);
  let fluid = resolved.get(key);
  if (!fluid) {
    fluid = family.make(values);
    if (resolved.size >= CACHE_LIMIT) resolved.delete(resolved.keys().next().value as string);
    resolved.set(key, fluid);
  }
  return fluid;
}

/** Parameter values with defaults, each checked against its range; InputError otherwise. */
function checkParameters(family: ParametricFluid, given: Record<string, unknown>): Record<string, number> {
  const known: string[] = family.parameters.map((p) => p.name);
  for (const key of Object.keys(given)) {
    if (!known.includes(key)) {
      throw new InputError(`fluid '${family.name}' has no parameter '${key}' (its parameters: ${known.join(', ')})`);
    }
  }
  const values: Record<string, number> = {};
  for (const p of family.parameters) {
    const v = given[p.name];
    if (v === undefined) {
      if (p.default === undefined) {
        throw new InputError(`fluid '${family.name}' is a mixture: give its ${p.name} (${p.label} ${p.rangeText}), e.g. ${p.example}`);
      }
      values[p.name] = p.default;
      continue;
    }
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new InputError(`fluid '${family.name}': ${p.name} must be a number, got ${JSON.stringify(v)}`);
    }
    if (!(v >= p.min && v <= p.max)) {
      throw new InputError(`fluid '${family.name}': ${p.name} ${p.format(v)} is outside ${p.rangeText}`);
    }
    values[p.name] = v;
  }
  return values;
}
