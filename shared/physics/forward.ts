// One method at known temperatures: properties at the method's property temperature,
// the derived groups (Re, Pr, Gr, Ra, Pr_s, μ/μ_s, Ec), the method itself, and h. The
// energy balances and the surface-temperature solve call this at each of their iterates.
import type { Configuration, PropertyRule } from './configurations.js';
import type { FluidProperties } from './fluids/types.js';
import { tubeBankRatio, type Geometry } from './geometry.js';
import { wallProperties, type PropertyReader } from './properties.js';
import { InputError, type Flag, type Inputs, type Method, type MethodResult, type Outputs, type WallCondition } from './types.js';
import { applyHeating, applyWallCondition } from './wall-condition.js';

/** Standard gravity, m/s² (CGPM 1901 conventional value). */
export const GRAVITY = 9.80665;

/** One result: the row format of `solve --json`, exports and the store. */
export interface ResultRow {
  method: string;
  inputs: Inputs;
  outputs: Outputs;
  flags: Flag[];
  /** Velocity and temperature profiles, when the point asked for them (`profiles: true`). */
  profiles?: Record<string, number[]>;
}

/** A method refusing a point (e.g. Gnielinski at Re ≤ 1000): `solve` reports it, a sweep flags `domain-error`. */
export class MethodDomainError extends InputError {}

// Methods whose authors evaluate properties at the free-stream temperature (with a
// wall-property correction) rather than the film temperature of their configuration.
const propertyRuleOverrides: Record<string, PropertyRule> = {
  'cylinder/zukauskas': 'free-stream', // Zukauskas (1972): properties at T_∞, Pr_s at T_s
  'sphere/ranz-marshall': 'film', // Ranz & Marshall (1952): film temperature (common practice)
};

export function propertyRuleOf(method: Method, configuration: Configuration): PropertyRule {
  return propertyRuleOverrides[`${method.configuration}/${method.id}`] ?? configuration.propertyRule;
}

/** What stays fixed while a balance or a solve iterates. */
export interface PointContext {
  method: Method;
  configuration: Configuration;
  reader: PropertyReader;
  inputs: Inputs;
  geometry: Geometry;
  /** 'flux' when the point gives a heat flux or heat rate, else 'temperature'. */
  wallCondition: WallCondition;
}

/** The temperatures of one evaluation. */
export interface ForwardState {
  /** T∞ (external flow, free convection) or the bulk temperature (internal flow, tube banks), K. */
  Tfluid: number;
  /** Surface temperature, K, when known. */
  Ts?: number;
  /** Internal flow and tube banks: mass flux ṁ/A through the flow (or frontal) area, kg/(m²·s), when the flow is fixed by a velocity or flow rate. */
  massFlux?: number;
  /** Whether the wall heats the fluid (sets `heating` where a method has it). */
  heats?: boolean;
}

export interface ForwardResult {
  row: ResultRow;
  props?: FluidProperties;
  /** h̄ (or h_x for local methods), W/(m²·K). */
  h?: number;
  /** The temperature the convective flux is driven against: T∞, or T_aw with dissipation. */
  Tref: number;
}

export function forward(ctx: PointContext, state: ForwardState): ForwardResult {
  const { method, configuration, reader, inputs, geometry } = ctx;
  const { Tfluid, Ts } = state;
  const rule = propertyRuleOf(method, configuration);
  const Tprop = rule === 'film' && Ts !== undefined ? (Ts + Tfluid) / 2 : Tfluid;
  const props = reader.at(Tprop);
  const wall = wallProperties(reader, method, Ts);
  if (wall.flag) return { row: { method: method.id, inputs, outputs: {}, flags: [wall.flag] }, Tref: Tfluid };

  const derived: Outputs = { Pr: props.Pr, property_temperature: Tprop };
  if (wall.props) {
    derived.Pr_s = wall.props.Pr;
    derived.viscosity_ratio = props.mu / wall.props.mu;
  }
  let velocity = num(inputs, 'velocity');
  const L = geometry.length;
  if (state.massFlux !== undefined) {
    // Internal flow and banks: Re from the mass flux, so the stream carries the same ṁ at any property temperature.
    const flux = configuration.id === 'tube-bank' ? state.massFlux * tubeBankRatio(inputs) : state.massFlux;
    derived.Re = (flux * L) / props.mu;
    velocity ??= flux / props.rho;
  } else if (configuration.regime === 'free') {
    if (Ts === undefined) throw new InputError('free convection needs surface_temperature (or heat_flux / heat_rate)');
    if (!Number.isFinite(props.beta)) throw new InputError(`fluid '${reader.fluid.name}' has no expansion coefficient beta: free convection needs it`);
    // |β ΔT|: the sign only says which way the fluid moves (water below 277 K has β < 0).
    const Gr = (GRAVITY * Math.abs(props.beta * (Ts - Tfluid)) * L ** 3) / props.nu ** 2;
    derived.Gr = Gr;
    derived.Ra = Gr * props.Pr;
    // A free configuration that also takes a forced flow (a heat sink's fan): Re on the velocity it is given.
    if (velocity !== undefined) derived.Re = (velocity * (geometry.velocityRatio ?? 1) * L) / props.nu;
  } else {
    const flowRate = num(inputs, 'flow_rate');
    if (velocity === undefined && flowRate !== undefined) {
      if (geometry.flowArea === undefined) throw new InputError(`flow_rate needs the cross-section (configuration '${configuration.id}')`);
      velocity = flowRate / geometry.flowArea;
    }
    if (velocity !== undefined) {
      const vRef = velocity * (configuration.id === 'tube-bank' ? tubeBankRatio(inputs) : geometry.velocityRatio ?? 1);
      derived.Re = (vRef * L) / props.nu;
    }
  }
  if (geometry.L_over_D !== undefined) derived.L_over_D = geometry.L_over_D;
  if (geometry.aspect_ratio !== undefined) derived.aspect_ratio = geometry.aspect_ratio;
  Object.assign(derived, geometry.groups);
  const Re = (inputs.Re as number | undefined) ?? derived.Re;
  if (velocity === undefined && Re !== undefined && configuration.regime !== 'free') velocity = (Re * props.nu) / L;
  if (velocity !== undefined && configuration.regime !== 'free') derived.velocity = velocity;
  // The similarity solutions' Eckert number, so dissipation is real in a high-speed case.
  if (declares(method, 'Ec') && velocity !== undefined && Ts !== undefined && Ts !== Tfluid) {
    derived.Ec = velocity ** 2 / (props.cp * (Ts - Tfluid));
  }

  const condition = applyWallCondition(method, ctx.wallCondition, inputs);
  const switches = { ...condition.set, ...applyHeating(method, state.heats, inputs) };
  const r = evaluate(method, { ...declaredInputs(method, inputs, derived), ...switches });
  const outputs: Outputs = { ...derived, ...r.outputs };
  const flags = [...r.flags, ...condition.flags];

  if (outputs.Nu !== undefined) outputs.h = (outputs.Nu * props.k) / L;
  if (outputs.Nu_x !== undefined) outputs.h_x = (outputs.Nu_x * props.k) / L;
  if (outputs.delta99_x !== undefined) outputs.delta99 = outputs.delta99_x * L;
  // With viscous dissipation the driving difference is T_s − T_aw (flat-plate similarity).
  let Tref = Tfluid;
  if (outputs.recovery_factor !== undefined && velocity !== undefined) {
    outputs.adiabatic_wall_temperature = Tfluid + (outputs.recovery_factor * velocity ** 2) / (2 * props.cp);
    Tref = outputs.adiabatic_wall_temperature;
  }
  if (outputs.pressure_drop_coefficient !== undefined) {
    // Δp = K·½ρu²: internal flow on the mean velocity, banks on V_max (K = N_L·χ·f).
    const flux = state.massFlux ?? (velocity !== undefined ? props.rho * velocity : undefined);
    if (flux !== undefined) {
      const reference = configuration.id === 'tube-bank' ? flux * tubeBankRatio(inputs) : flux;
      outputs.pressure_drop = (outputs.pressure_drop_coefficient * reference * reference) / (2 * props.rho);
    }
  }
  const row: ResultRow = { method: method.id, inputs, outputs, flags };
  if (r.profiles) row.profiles = r.profiles;
  return { row, props, h: outputs.h ?? outputs.h_x, Tref };
}

/** The convective flux and heat rate at the surface temperature of the row (external flow, free convection). */
export function addSurfaceFlux(result: ForwardResult, Ts: number, area: number | undefined): void {
  const { row, h, Tref } = result;
  if (h === undefined) return;
  row.outputs.q = h * (Ts - Tref);
  if (area !== undefined && row.outputs.h !== undefined) {
    row.outputs.heat_rate = row.outputs.h * (Ts - Tref) * area;
    row.outputs.surface_area = area;
  }
}

function evaluate(method: Method, inputs: Inputs): MethodResult {
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

/**
 * A dimensionless point: the method on the inputs it declares (one point feeds several
 * methods). `declaresAll`: the point has no input the method does not declare (nor
 * `profiles`), so it goes as it is instead of as a copy with the same entries.
 */
export function evaluateDimensionless(method: Method, inputs: Inputs, declaresAll = false): ResultRow {
  const r = evaluate(method, declaresAll ? inputs : declaredInputs(method, inputs, NOTHING_DERIVED));
  const row: ResultRow = { method: method.id, inputs, outputs: r.outputs, flags: r.flags };
  if (r.profiles) row.profiles = r.profiles;
  return row;
}

const NOTHING_DERIVED: Outputs = Object.freeze({});

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

function declares(method: Method, name: string): boolean {
  return method.inputs.some((s) => s.name === name);
}

function num(inputs: Inputs, name: string): number | undefined {
  const v = inputs[name];
  return typeof v === 'number' ? v : undefined;
}
