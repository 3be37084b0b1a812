// The dimensional engine: turns one point of a study (fluid, temperatures, velocity,
// sizes, or dimensionless groups directly) into the inputs each method needs, calls the
// methods, and adds h, q, heat rate and pressure drop in SI. Pure and synchronous, so
// the CLI, the worker threads and the browser all use the same code.
import { getMethod, methodsFor, requireConfiguration } from './catalogue.js';
import type { Configuration, PropertyRule } from './configurations.js';
import { hydraulicDiameter } from './correlations/duct.js';
import { maxVelocityRatio } from './correlations/tube-bank.js';
import { resolveFluidSpec, type FluidSpec } from './fluids/index.js';
import { FluidRangeError, type Fluid, type FluidProperties } from './fluids/types.js';
import { dimensionalNames } from './quantities.js';
import { InputError, type Flag, type Inputs, type Method, type Outputs } from './types.js';

/** Standard gravity, m/s² (CGPM 1901 conventional value). */
const G = 9.80665;
/** Standard atmosphere, Pa. */
const P_ATM = 101325;

export type { FluidSpec } from './fluids/index.js';

/** What a point needs besides its inputs: the same for every point of a study. */
export interface SolvePlan {
  configuration: string;
  /** Method ids; default every method of the configuration. */
  methods?: string[];
  fluid?: FluidSpec;
}

/** One result: the row format of `solve --json`, exports and the store. */
export interface ResultRow {
  method: string;
  inputs: Inputs;
  outputs: Outputs;
  flags: Flag[];
  /** Velocity and temperature profiles, when the point asked for them (`profiles: true`). */
  profiles?: Record<string, number[]>;
}

// Methods whose authors evaluate properties at the free-stream temperature (with a
// wall-property correction) rather than the film temperature of their configuration.
const propertyRuleOverrides: Record<string, PropertyRule> = {
  'cylinder/zukauskas': 'free-stream', // Zukauskas (1972): properties at T_∞, Pr_s at T_s
  'sphere/ranz-marshall': 'film', // Ranz & Marshall (1952): film temperature (common practice)
};

export function resolveFluid(spec: FluidSpec): Fluid {
  return resolveFluidSpec(spec);
}

export function propertyRuleOf(method: Method, configuration: Configuration): PropertyRule {
  return propertyRuleOverrides[`${method.configuration}/${method.id}`] ?? configuration.propertyRule;
}

/** Compile a plan once; the returned function solves one point for every method. */
export interface SolveOptions {
  /**
   * true (the `solve` command): a property temperature outside the fluid's range throws.
   * false (sweeps): the result gets `out-of-range:property_temperature` and no numbers,
   * so one bad corner of a sweep does not stop the run.
   */
  strict?: boolean;
}

export function compileSolver(plan: SolvePlan, options: SolveOptions = {}): (inputs: Inputs) => ResultRow[] {
  const configuration = requireConfiguration(plan.configuration);
  const methods = planMethods(plan);
  const fluid = plan.fluid === undefined ? undefined : resolveFluid(plan.fluid);
  const strict = options.strict ?? false;
  return (inputs) =>
    methods.map((m) => {
      try {
        return solveMethod(m, configuration, fluid, inputs);
      } catch (e) {
        if (strict) throw e;
        if (e instanceof FluidRangeError) return { method: m.id, inputs, outputs: {}, flags: ['out-of-range:property_temperature'] };
        if (e instanceof MethodDomainError) return { method: m.id, inputs, outputs: {}, flags: ['domain-error'] };
        throw e;
      }
    });
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
  const missing = missingInputs(plan, names);
  if (plan.methods?.length ? missing.length : missing.length === planMethods(plan).length) {
    throw new InputError(missing.map((m) => `method '${m.method}' needs ${m.missing.map((n) => `'${n}'`).join(', ')}`).join('; '));
  }
  // Without --method, "every applicable method": those whose inputs the point provides.
  const methods = plan.methods?.length ? plan.methods : planMethods(plan).map((m) => m.id).filter((id) => !missing.some((x) => x.method === id));
  const solver = compileSolver({ ...plan, methods }, options);
  return solver(inputs);
}

function solveMethod(method: Method, configuration: Configuration, fluid: Fluid | undefined, inputs: Inputs): ResultRow {
  const dimensional = Object.keys(inputs).some((k) => dimensionalNames.has(k));
  if (!dimensional) {
    if (fluid) throw new InputError('a fluid was given but no fluid_temperature: properties need a temperature');
    // Each method sees only the inputs it declares: one point feeds several methods.
    const r = evaluate(method, declaredInputs(method, inputs, {}));
    return withProfiles({ method: method.id, inputs, outputs: r.outputs, flags: r.flags }, r.profiles);
  }
  if (!fluid) {
    throw new InputError(
      `dimensional inputs (${Object.keys(inputs).filter((k) => dimensionalNames.has(k)).join(', ')}) need a fluid`,
    );
  }
  const heatFlux = num(inputs, 'heat_flux');
  if (heatFlux !== undefined && num(inputs, 'surface_temperature') === undefined) {
    return solveWithHeatFlux(method, configuration, fluid, inputs, heatFlux);
  }
  return solveDimensional(method, configuration, fluid, inputs);
}

// Given q″ instead of T_s: iterate T_s = T_∞ + q″/h(T_s) until it stops moving.
function solveWithHeatFlux(method: Method, configuration: Configuration, fluid: Fluid, inputs: Inputs, heatFlux: number): ResultRow {
  const Tinf = requireNum(inputs, 'fluid_temperature');
  let Ts = Tinf + Math.sign(heatFlux) * 1; // a 1 K start keeps Gr non-zero in free convection
  for (let i = 0; i < 200; i++) {
    const row = solveDimensional(method, configuration, fluid, { ...inputs, surface_temperature: Ts });
    const h = row.outputs.h ?? row.outputs.h_x;
    if (!(h > 0)) return { ...row, inputs, flags: [...row.flags, 'not-converged'] };
    const next = Tinf + heatFlux / h;
    if (Math.abs(next - Ts) < 1e-7 * Math.max(1, Math.abs(next))) {
      const final = solveDimensional(method, configuration, fluid, { ...inputs, surface_temperature: next });
      final.inputs = inputs;
      final.outputs.surface_temperature = next;
      final.outputs.q = heatFlux;
      return final;
    }
    Ts = 0.5 * Ts + 0.5 * next; // damped: free convection h depends strongly on T_s
  }
  return { method: method.id, inputs, outputs: {}, flags: ['not-converged'] };
}

function solveDimensional(method: Method, configuration: Configuration, fluid: Fluid, inputs: Inputs): ResultRow {
  const Tinf = requireNum(inputs, 'fluid_temperature');
  const Ts = num(inputs, 'surface_temperature');
  const pressure = num(inputs, 'pressure');
  const rule = propertyRuleOf(method, configuration);
  const Tprop = rule === 'film' && Ts !== undefined ? (Ts + Tinf) / 2 : Tinf;
  const props = atPressure(fluid, fluid.properties(Tprop), pressure);
  const wall = Ts === undefined ? undefined : atPressure(fluid, fluid.properties(Ts), pressure);
  const geometry = geometryOf(configuration, inputs);

  const derived: Outputs = { Pr: props.Pr, property_temperature: Tprop };
  if (wall) {
    derived.Pr_s = wall.Pr;
    derived.viscosity_ratio = props.mu / wall.mu;
  }
  let velocity = num(inputs, 'velocity');
  const flowRate = num(inputs, 'flow_rate');
  if (velocity === undefined && flowRate !== undefined) {
    if (geometry.flowArea === undefined) throw new InputError(`flow_rate needs the cross-section (configuration '${configuration.id}')`);
    velocity = flowRate / geometry.flowArea;
  }
  if (configuration.regime === 'free') {
    if (Ts === undefined) throw new InputError('free convection needs surface_temperature (or heat_flux)');
    if (!Number.isFinite(props.beta)) {
      throw new InputError(`fluid '${fluid.name}' has no expansion coefficient beta: free convection needs it`);
    }
    const L = geometry.length;
    // |β ΔT|: the sign only says which way the fluid moves (water below 277 K has β < 0).
    const Gr = (G * Math.abs(props.beta * (Ts - Tinf)) * L ** 3) / props.nu ** 2;
    derived.Gr = Gr;
    derived.Ra = Gr * props.Pr;
  } else if (velocity !== undefined) {
    derived.velocity = velocity;
    const vRef = configuration.id === 'tube-bank' ? velocity * tubeBankRatio(inputs) : velocity;
    derived.Re = (vRef * geometry.length) / props.nu;
  }
  if (geometry.L_over_D !== undefined) derived.L_over_D = geometry.L_over_D;
  if (geometry.aspect_ratio !== undefined) derived.aspect_ratio = geometry.aspect_ratio;

  // Explicit dimensionless inputs win over derived ones.
  const methodInputs = declaredInputs(method, inputs, derived);
  if (methodInputs.Re !== undefined && velocity === undefined && configuration.regime !== 'free') {
    derived.velocity = ((methodInputs.Re as number) * props.nu) / geometry.length;
  }
  const r = evaluate(method, methodInputs);
  const outputs: Outputs = { ...derived, ...r.outputs };
  addDimensionalOutputs(outputs, geometry, props, Ts, Tinf);
  return withProfiles({ method: method.id, inputs, outputs, flags: r.flags }, r.profiles);
}

/**
 * A method refusing a point (e.g. Gnielinski at Re ≤ 1000, where its (Re − 1000) factor
 * makes Nu ≤ 0): `solve` reports the message; a sweep keeps going with `domain-error`.
 */
export class MethodDomainError extends InputError {}

function evaluate(method: Method, inputs: Inputs) {
  try {
    return method.evaluate(inputs);
  } catch (e) {
    if (e instanceof InputError) {
      const id = `${method.configuration}/${method.id}`;
      throw new MethodDomainError(e.message.startsWith(id) ? e.message : `${id}: ${e.message}`);
    }
    throw e;
  }
}

function withProfiles(row: ResultRow, profiles: Record<string, number[]> | undefined): ResultRow {
  if (profiles) row.profiles = profiles;
  return row;
}

/** The inputs a method declares, from the point or else from the derived groups. */
function declaredInputs(method: Method, inputs: Inputs, derived: Outputs): Inputs {
  const picked: Inputs = {};
  for (const spec of method.inputs) {
    const v = inputs[spec.name] ?? derived[spec.name];
    if (v !== undefined) picked[spec.name] = v;
  }
  if (inputs.profiles === true) picked.profiles = true;
  return picked;
}

interface Geometry {
  /** Characteristic length, m. */
  length: number;
  /** Heated area, m², when the inputs define it. */
  area?: number;
  /** Flow cross-section for internal flow, m². */
  flowArea?: number;
  L_over_D?: number;
  aspect_ratio?: number;
}

function geometryOf(c: Configuration, inputs: Inputs): Geometry {
  const override = num(inputs, 'characteristic_length');
  const D = num(inputs, 'diameter');
  const len = num(inputs, 'length');
  const w = num(inputs, 'width');
  const h = num(inputs, 'height');
  const need = (name: string, v: number | undefined) => {
    if (v === undefined) throw new InputError(`configuration '${c.id}' needs input '${name}' (its ${c.lengthNote})`);
    return v;
  };
  switch (c.id) {
    case 'flat-plate':
    case 'wedge': {
      const L = override ?? need('length', len);
      return { length: L, area: w !== undefined ? L * w : undefined };
    }
    case 'cylinder':
    case 'horizontal-cylinder':
    case 'tube-bank': {
      const d = override ?? need('diameter', D);
      return { length: d, area: len !== undefined ? Math.PI * d * len : undefined };
    }
    case 'sphere':
    case 'sphere-free': {
      const d = override ?? need('diameter', D);
      return { length: d, area: Math.PI * d * d };
    }
    case 'pipe': {
      const d = need('diameter', D);
      return {
        length: override ?? d,
        flowArea: (Math.PI * d * d) / 4,
        area: len !== undefined ? Math.PI * d * len : undefined,
        L_over_D: len !== undefined ? len / d : undefined,
      };
    }
    case 'duct': {
      const a = need('width', w);
      const b = need('height', h);
      const Dh = hydraulicDiameter(a, b);
      return {
        length: override ?? Dh,
        flowArea: a * b,
        area: len !== undefined ? 2 * (a + b) * len : undefined,
        L_over_D: len !== undefined ? len / Dh : undefined,
        aspect_ratio: Math.min(a, b) / Math.max(a, b),
      };
    }
    case 'vertical-plate': {
      const H = override ?? need('height', h);
      return { length: H, area: w !== undefined ? H * w : undefined };
    }
    case 'horizontal-plate': {
      // Lloyd & Moran (1974): L = A/P.
      if (override !== undefined) return { length: override };
      const a = need('length', len);
      const b = need('width', w);
      return { length: (a * b) / (2 * (a + b)), area: a * b };
    }
    default:
      throw new InputError(`configuration '${c.id}' has no dimensional form`);
  }
}

function tubeBankRatio(inputs: Inputs): number {
  const arrangement = (inputs.arrangement as 'aligned' | 'staggered' | undefined) ?? 'aligned';
  const ST = requireNum(inputs, 'ST_over_D');
  const SL = requireNum(inputs, 'SL_over_D');
  return maxVelocityRatio(arrangement, ST, SL);
}

function addDimensionalOutputs(out: Outputs, g: Geometry, props: FluidProperties, Ts: number | undefined, Tinf: number) {
  if (out.Nu !== undefined) out.h = (out.Nu * props.k) / g.length;
  if (out.Nu_x !== undefined) out.h_x = (out.Nu_x * props.k) / g.length;
  if (out.delta99_x !== undefined) out.delta99 = out.delta99_x * g.length;
  // With viscous dissipation the driving difference is T_s − T_aw (flat-plate similarity).
  let Tref = Tinf;
  if (out.recovery_factor !== undefined && out.velocity !== undefined) {
    out.adiabatic_wall_temperature = Tinf + (out.recovery_factor * out.velocity ** 2) / (2 * props.cp);
    Tref = out.adiabatic_wall_temperature;
  }
  const h = out.h ?? out.h_x;
  if (Ts !== undefined && h !== undefined) {
    out.q = h * (Ts - Tref);
    if (g.area !== undefined && out.h !== undefined) out.heat_rate = out.h * (Ts - Tref) * g.area;
  }
  if (out.pressure_drop_coefficient !== undefined && out.velocity !== undefined) {
    out.pressure_drop = 0.5 * out.pressure_drop_coefficient * props.rho * out.velocity ** 2;
  }
}

// Air behaves as an ideal gas: ρ ∝ p, so ν and α scale with 1/p; μ, k, cp and Pr barely
// depend on pressure at these conditions (Incropera, Table A.4 note). Liquids: ignored.
function atPressure(fluid: Fluid, p: FluidProperties, pressure: number | undefined): FluidProperties {
  if (pressure === undefined || fluid.name !== 'air') return p;
  const s = pressure / P_ATM;
  return { ...p, rho: p.rho * s, nu: p.nu / s, alpha: p.alpha / s };
}

function num(inputs: Inputs, name: string): number | undefined {
  const v = inputs[name];
  if (v === undefined) return undefined;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`input '${name}': expected a finite number, got ${JSON.stringify(v)}`);
  return v;
}

function requireNum(inputs: Inputs, name: string): number {
  const v = num(inputs, name);
  if (v === undefined) throw new InputError(`missing input '${name}'`);
  return v;
}

/** Dimensionless inputs the engine derives from the given input names and a fluid. */
export function derivableInputs(configurationId: string, names: readonly string[], hasFluid: boolean): Set<string> {
  const c = requireConfiguration(configurationId);
  const have = new Set(names);
  const out = new Set<string>();
  if (!hasFluid || !have.has('fluid_temperature')) return out;
  out.add('Pr');
  const wall = have.has('surface_temperature') || have.has('heat_flux');
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
