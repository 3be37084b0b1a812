// The dimensional engine: turns one point of a study (fluid, temperatures, velocity, sizes,
// or dimensionless groups directly) into the inputs each method needs, calls the methods,
// and adds h, q, heat rates, energy balances and radiation in SI. Pure and synchronous, so
// the CLI, the worker threads and the browser all use the same code. Read top to bottom:
//   point-inputs.ts   one thing said once (over-specified points are errors)
//   geometry.ts       sizes → characteristic length, areas
//   properties.ts     properties at a temperature and pressure, boiling check
//   forward.ts        one method at known temperatures
//   stream.ts         internal flow and tube banks: inlet → outlet energy balance
//   surface.ts        external flow and free convection, with radiation and the
//                     surface-temperature solve (surface-temperature.ts)
import { getMethod, methodsFor, requireConfiguration } from './catalogue.js';
import { dimensionalInputsOf, engineInputsOf, hasEnergyBalance, type Configuration } from './configurations.js';
import { derivableExtensions, outputExtensions } from './extensions.js';
import './catalogue-extensions.js'; // registers the newer configurations' geometry and outputs
import { resolveFluidSpec, type FluidSpec } from './fluids/index.js';
import { FluidRangeError, type Fluid } from './fluids/types.js';
import { evaluateDimensionless, MethodDomainError, type PointContext, type ResultRow } from './forward.js';
import { geometryOf } from './geometry.js';
import { optionalNumber, refuseConflicts } from './point-inputs.js';
import { propertyReader } from './properties.js';
import { dimensionalNames, engineInputNames } from './quantities.js';
import { solveStream } from './stream.js';
import { solveSurface } from './surface.js';
import { InputError, type Inputs, type Method } from './types.js';
import { PointConflictError } from './wall-condition.js';

export { MethodDomainError, propertyRuleOf, type ResultRow } from './forward.js';

export type { FluidSpec } from './fluids/index.js';

/** What a point needs besides its inputs: the same for every point of a study. */
export interface SolvePlan {
  configuration: string;
  /** Method ids; default every method of the configuration. */
  methods?: string[];
  fluid?: FluidSpec;
}

export function resolveFluid(spec: FluidSpec): Fluid {
  return resolveFluidSpec(spec);
}

export interface SolveOptions {
  /**
   * true (the `solve` command): a property temperature outside the fluid's range, or a
   * point whose inputs contradict each other, throws.
   * false (sweeps): the result gets a flag (`out-of-range:property_temperature`,
   * `domain-error`, `conflict:<input>`) and no numbers, so one bad corner of a sweep does
   * not stop the run.
   */
  strict?: boolean;
}

/** Compile a plan once; the returned function solves one point for every method. */
export function compileSolver(plan: SolvePlan, options: SolveOptions = {}): (inputs: Inputs) => ResultRow[] {
  const configuration = requireConfiguration(plan.configuration);
  const methods = planMethods(plan);
  const fluid = plan.fluid === undefined ? undefined : resolveFluid(plan.fluid);
  const strict = options.strict ?? false;
  // What depends only on a point's input names is worked out again only when the names
  // change (a sweep's points all have the same): whether the point is dimensional, and
  // per method whether it declares every name, so a dimensionless point goes to it as it is.
  let names: string[] | undefined;
  let dimensional = false;
  let asGiven: boolean[] = [];
  return (inputs) => {
    if (methods.length === 0) return [];
    if (names === undefined || !sameKeys(inputs, names)) {
      names = undefined;
      dimensional = isDimensionalPoint(inputs, fluid);
      const given = Object.keys(inputs);
      asGiven = methods.map((m) => declaresAll(m, given));
      names = given;
    }
    const rows = new Array<ResultRow>(methods.length);
    for (let i = 0; i < methods.length; i++) {
      const m = methods[i];
      try {
        rows[i] = dimensional ? solveDimensional(m, configuration, fluid!, inputs) : finish(evaluateDimensionless(m, inputs, asGiven[i]));
      } catch (e) {
        if (strict) throw e;
        const flagged = (flag: string): ResultRow => ({ method: m.id, inputs, outputs: {}, flags: [flag] });
        if (e instanceof FluidRangeError) rows[i] = flagged('out-of-range:property_temperature');
        else if (e instanceof PointConflictError) rows[i] = flagged(e.flag);
        else if (e instanceof MethodDomainError) rows[i] = flagged('domain-error');
        else throw e;
      }
    }
    return rows;
  };
}

/** Whether `inputs` has exactly the keys `names`, in that order. */
function sameKeys(inputs: Inputs, names: readonly string[]): boolean {
  let n = 0;
  for (const k in inputs) if (names[n++] !== k) return false;
  return n === names.length;
}

/** Whether the method declares every one of `names` (then the point itself is what it would be given). */
function declaresAll(method: Method, names: readonly string[]): boolean {
  return names.every((n) => n !== 'profiles' && method.inputs.some((s) => s.name === n));
}

/** One point without a study: what `filmsweep solve` does. */
export function solvePoint(plan: SolvePlan, inputs: Inputs, options: SolveOptions = { strict: true }): ResultRow[] {
  const names = Object.keys(inputs);
  const unknown = unknownInputs(plan, names);
  if (unknown.length) {
    throw new InputError(
      `unknown input '${unknown[0]}' for configuration '${plan.configuration}'; expected one of: ${knownInputs(plan).join(', ')}`,
    );
  }
  const configuration = requireConfiguration(plan.configuration);
  const meaningless = names.filter((n) => dimensionalNames.has(n) && !dimensionalInputsOf(configuration).includes(n));
  if (meaningless.length) {
    throw new InputError(`input '${meaningless[0]}' has no meaning for configuration '${plan.configuration}' (its dimensional inputs: ${dimensionalInputsOf(configuration).join(', ')})`);
  }
  refuseConflicts(names, plan.fluid !== undefined);
  const missing = missingInputs(plan, names);
  if (plan.methods?.length ? missing.length : missing.length === planMethods(plan).length) {
    throw new InputError(missing.map((m) => `method '${m.method}' needs ${m.missing.map((n) => `'${n}'`).join(', ')}`).join('; '));
  }
  // Without --method, "every applicable method": those whose inputs the point provides.
  const methods = plan.methods?.length ? plan.methods : planMethods(plan).map((m) => m.id).filter((id) => !missing.some((x) => x.method === id));
  const solver = compileSolver({ ...plan, methods }, options);
  return solver(inputs);
}

/**
 * Whether a point is dimensional (a fluid and its temperatures) or dimensionless groups
 * only; throws when it mixes the two or lacks its fluid.
 */
function isDimensionalPoint(inputs: Inputs, fluid: Fluid | undefined): boolean {
  let dimensional = false;
  for (const k in inputs) {
    if (dimensionalNames.has(k)) {
      dimensional = true;
      break;
    }
  }
  if (!dimensional) {
    if (fluid) throw new InputError('a fluid was given but no fluid_temperature: properties need a temperature');
    const engineOnly = Object.keys(inputs).filter((n) => engineInputNames.has(n));
    if (engineOnly.length) throw new InputError(`input '${engineOnly[0]}' needs a dimensional point (a fluid and its temperatures)`);
    return false;
  }
  if (!fluid) {
    throw new InputError(`dimensional inputs (${Object.keys(inputs).filter((k) => dimensionalNames.has(k)).join(', ')}) need a fluid`);
  }
  return true;
}

function solveDimensional(method: Method, configuration: Configuration, fluid: Fluid, inputs: Inputs): ResultRow {
  const ctx: PointContext = {
    method,
    configuration,
    reader: propertyReader(fluid, optionalNumber(inputs, 'pressure')),
    inputs,
    geometry: geometryOf(configuration, inputs),
    wallCondition: inputs.heat_flux !== undefined || inputs.heat_rate !== undefined ? 'flux' : 'temperature',
  };
  const row = hasEnergyBalance(configuration) ? solveStream(ctx) : solveSurface(ctx);
  return finish(withExtension(ctx, row));
}

/** A configuration's own outputs (extensions.ts), computed on the finished result. */
function withExtension(ctx: PointContext, row: ResultRow): ResultRow {
  const extension = outputExtensions.get(ctx.configuration.id);
  const Tprop = row.outputs.property_temperature;
  if (!extension || Tprop === undefined || row.outputs.Nu === undefined) return row;
  const extra = extension({ inputs: ctx.inputs, outputs: row.outputs, props: ctx.reader.at(Tprop), geometry: ctx.geometry });
  Object.assign(row.outputs, extra.outputs ?? {});
  for (const f of extra.flags ?? []) if (!row.flags.includes(f)) row.flags.push(f);
  return row;
}

// JSON has no NaN or Infinity: a non-finite output is left out and flagged `non-finite:<output>`,
// in `solve`, sweeps and exports alike (never a silent NaN or null).
function finish(row: ResultRow): ResultRow {
  const { outputs } = row;
  let bad: string[] | undefined;
  // A scan without a key list first: nearly every row is finite and keeps its outputs as they are.
  for (const name in outputs) if (!Number.isFinite(outputs[name])) (bad ??= []).push(name);
  if (bad === undefined) return row;
  for (const name of bad) {
    delete outputs[name];
    row.flags.push(`non-finite:${name}`);
  }
  return row;
}

/** Dimensionless inputs the engine derives from the given input names and a fluid. */
export function derivableInputs(configurationId: string, names: readonly string[], hasFluid: boolean): Set<string> {
  const c = requireConfiguration(configurationId);
  const have = new Set(names);
  const out = new Set<string>();
  if (!hasFluid || !have.has('fluid_temperature')) return out;
  out.add('Pr');
  const wall = have.has('surface_temperature') || have.has('heat_flux') || have.has('heat_rate');
  if (wall) {
    out.add('Pr_s');
    out.add('viscosity_ratio');
  }
  const flow = have.has('velocity') || (c.regime === 'internal' && have.has('flow_rate'));
  if (c.regime === 'free' && wall) {
    out.add('Gr');
    out.add('Ra');
  }
  if (c.regime !== 'free' && flow) out.add('Re');
  if (have.has('length') && (c.id === 'pipe' || c.id === 'duct')) out.add('L_over_D');
  if (c.id === 'duct' && have.has('width') && have.has('height')) out.add('aspect_ratio');
  for (const n of derivableExtensions.get(c.id)?.(have) ?? []) out.add(n);
  return out;
}

/** For each method of the plan, the required inputs that are neither given nor derivable. */
export function missingInputs(plan: SolvePlan, names: readonly string[]): { method: string; missing: string[] }[] {
  const methods = planMethods(plan);
  const available = new Set([...names, ...derivableInputs(plan.configuration, names, plan.fluid !== undefined)]);
  const report: { method: string; missing: string[] }[] = [];
  for (const m of methods) {
    let missing = m.inputs.filter((s) => s.required && !available.has(s.name)).map((s) => s.name);
    // Free convection similarity takes Gr or Ra: either one satisfies both.
    if (missing.length && (available.has('Gr') || available.has('Ra'))) missing = missing.filter((n) => n !== 'Gr' && n !== 'Ra');
    if (missing.length) report.push({ method: m.id, missing });
  }
  return report;
}

/** Every input name the plan's methods or the dimensional engine understand. */
export function knownInputs(plan: SolvePlan): string[] {
  const known = new Set<string>();
  for (const m of planMethods(plan)) for (const s of m.inputs) known.add(s.name);
  for (const n of dimensionalNames) known.add(n);
  for (const n of engineInputsOf(requireConfiguration(plan.configuration))) known.add(n);
  return [...known];
}

/** Input names that no method of the plan and no dimensional rule uses (likely typos). */
export function unknownInputs(plan: SolvePlan, names: readonly string[]): string[] {
  const known = new Set([...knownInputs(plan), 'profiles']);
  return names.filter((n) => !known.has(n));
}

function planMethods(plan: SolvePlan): Method[] {
  return plan.methods?.length ? plan.methods.map((id) => getMethod(plan.configuration, id)) : methodsFor(plan.configuration);
}
