// Reads a method's inputs against its InputSpec list: applies defaults, checks types and
// choices, and turns every domain failure into an InputError (never a NaN downstream).
// Keys the method does not declare are ignored: dimensionless studies hand every method
// of a configuration the same point.
import { InputError, type InputSpec, type InputValue, type Inputs } from '../types.js';

export type NumberDomain = 'positive' | 'non-negative' | 'any';

export class MethodInputs {
  /** The declared inputs with defaults applied (what range checks should look at). */
  readonly values: Inputs = {};

  constructor(
    /** The method (its `configuration/id` names it in errors, built only for an error). */
    private readonly method: { id: string; configuration: string },
    private readonly specs: readonly InputSpec[],
    raw: Inputs,
  ) {
    for (const spec of specs) {
      const v = raw[spec.name] ?? spec.default;
      if (v === undefined) {
        if (spec.required) throw new InputError(`${this.label}: missing input '${spec.name}' (${spec.description})`);
        continue;
      }
      this.values[spec.name] = check(this, spec, v);
    }
  }

  get label(): string {
    return `${this.method.configuration}/${this.method.id}`;
  }

  /** A number input; `fallback` covers optional inputs whose default is another input (Pr_s → Pr). */
  number(name: string, domain: NumberDomain = 'positive', fallback?: number): number {
    const v = this.values[name] ?? fallback;
    if (typeof v !== 'number') throw new InputError(`${this.label}: missing input '${name}'`);
    if (domain === 'positive' && !(v > 0)) throw new InputError(`${this.label}: input '${name}' must be > 0, got ${v}`);
    if (domain === 'non-negative' && !(v >= 0)) {
      throw new InputError(`${this.label}: input '${name}' must be ≥ 0, got ${v}`);
    }
    if (fallback !== undefined && this.values[name] === undefined) this.values[name] = v;
    return v;
  }

  string(name: string): string {
    const v = this.values[name];
    if (typeof v !== 'string') throw new InputError(`${this.label}: missing input '${name}'`);
    return v;
  }

  boolean(name: string): boolean {
    const v = this.values[name];
    if (typeof v !== 'boolean') throw new InputError(`${this.label}: missing input '${name}'`);
    return v;
  }
}

/** Read `raw` for the method `configuration/id` described by `specs`. */
export function readInputs(method: { id: string; configuration: string; inputs: readonly InputSpec[] }, raw: Inputs) {
  return new MethodInputs(method, method.inputs, raw);
}

function check(owner: { label: string }, spec: InputSpec, v: InputValue): InputValue {
  const type = spec.type ?? 'number';
  if (type === 'number') {
    if (typeof v !== 'number' || !Number.isFinite(v)) throw bad(owner, spec, v, 'a finite number');
  } else if (type === 'boolean') {
    if (typeof v !== 'boolean') throw bad(owner, spec, v, 'true or false');
  } else {
    if (typeof v !== 'string') throw bad(owner, spec, v, 'a string');
    if (spec.choices && !spec.choices.includes(v)) throw bad(owner, spec, v, `one of ${spec.choices.join(', ')}`);
  }
  return v;
}

function bad(owner: { label: string }, spec: InputSpec, v: InputValue, what: string): InputError {
  return new InputError(`${owner.label}: input '${spec.name}' must be ${what}, got ${JSON.stringify(v)}`);
}
