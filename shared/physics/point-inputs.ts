// Reading a point's inputs, and the rule that a point says each thing once: two inputs
// that fix the same quantity (velocity and Re, heat_flux and surface_temperature …) are
// an error naming both, never a silent choice of one (`solve` and study files alike).
import { InputError, type Inputs } from './types.js';

export function optionalNumber(inputs: Inputs, name: string): number | undefined {
  const v = inputs[name];
  if (v === undefined) return undefined;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`input '${name}': expected a finite number, got ${JSON.stringify(v)}`);
  return v;
}

export function requireNumber(inputs: Inputs, name: string): number {
  const v = optionalNumber(inputs, name);
  if (v === undefined) throw new InputError(`missing input '${name}'`);
  return v;
}

/** Two inputs that fix the same thing, and why. */
export interface InputConflict {
  first: string;
  second: string;
  reason: string;
}

// Pairs that over-specify a point whatever the fluid; order = the order of the message.
const ALWAYS: readonly [string, string, string][] = [
  ['velocity', 'Re', 'Re follows from the velocity and the fluid'],
  ['flow_rate', 'velocity', 'the velocity follows from the flow rate and the cross-section'],
  ['flow_rate', 'Re', 'Re follows from the flow rate and the fluid'],
  ['heat_flux', 'surface_temperature', 'with a heat flux the surface temperature is solved for (give one of them)'],
  ['heat_rate', 'surface_temperature', 'with a heat rate the surface temperature is solved for (give one of them)'],
  ['heat_rate', 'heat_flux', 'both fix the power the surface sheds'],
  ['Gr', 'Ra', 'Ra = Gr·Pr: give one of them'],
];

// Groups the engine derives from a fluid and its temperatures: given as well, they would
// silently disagree with the fluid.
const WITH_FLUID: readonly [string, string][] = [
  ['Pr', 'Pr follows from the fluid at its property temperature'],
  ['Pr_s', 'Pr_s follows from the fluid at the surface temperature'],
  ['viscosity_ratio', 'μ/μ_s follows from the fluid at the bulk and surface temperatures'],
  ['Gr', 'Gr follows from the fluid and the temperatures'],
  ['Ra', 'Ra follows from the fluid and the temperatures'],
  ['Ec', 'Ec follows from the velocity, c_p and the temperatures'],
];

/** Every over-specification among the given names (fixed and swept alike). */
export function inputConflicts(names: readonly string[], hasFluid: boolean): InputConflict[] {
  const have = new Set(names);
  const found: InputConflict[] = [];
  for (const [first, second, reason] of ALWAYS) if (have.has(first) && have.has(second)) found.push({ first, second, reason });
  if (hasFluid && have.has('fluid_temperature')) {
    for (const [name, reason] of WITH_FLUID) if (have.has(name)) found.push({ first: 'fluid', second: name, reason });
  }
  return found;
}

export function conflictMessage(c: InputConflict): string {
  const what = c.first === 'fluid' ? `a fluid and '${c.second}'` : `'${c.first}' and '${c.second}'`;
  return `over-specified point: ${what} both given; ${c.reason}`;
}

/** Throws the first conflict as an InputError (the `solve` command: exit 1 naming both inputs). */
export function refuseConflicts(names: readonly string[], hasFluid: boolean): void {
  const [first] = inputConflicts(names, hasFluid);
  if (first) throw new InputError(conflictMessage(first));
}
