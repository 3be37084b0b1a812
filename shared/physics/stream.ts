// Internal flow and tube banks: fluid_temperature is the INLET, and the outlet follows from
// the energy balance of the stream (energy-balance.ts), with the bulk properties at the
// mean of inlet and outlet, iterated until the outlet moves by less than 1e-6 K.
import { hasEnergyBalance } from './configurations.js';
import { outletUniformFlux, outletUniformWallTemperature, iterateOutlet, logMeanTemperatureDifference, transferUnits } from './energy-balance.js';
import { forward, type ForwardResult, type PointContext, type ResultRow } from './forward.js';
import { tubesPerRow, tubeBankRatio } from './geometry.js';
import { optionalNumber, requireNumber } from './point-inputs.js';
import { boilingFlag } from './properties.js';
import { solveSurfaceTemperature } from './surface-temperature.js';
import { InputError, type Flag } from './types.js';

/** How the stream's mass flow is fixed: by the inlet (velocity, flow rate) or by Re at the mean bulk temperature. */
type FlowSpec = { kind: 'mass-flux'; massFlux: number } | { kind: 'reynolds'; Re: number } | { kind: 'none' };

interface StreamGeometry {
  /** Area the mass flux passes: pipe cross-section, or a bank's frontal area N_T·S_T·L. */
  flowArea: number;
  /** Heated area of the whole stream path, m². */
  heatedArea: number;
  /** Whether the areas are per metre of tube because the bank's tube length is not given. */
  perMetre: boolean;
}

export function solveStream(ctx: PointContext): ResultRow {
  const { inputs, configuration, reader, geometry } = ctx;
  if (!hasEnergyBalance(configuration)) throw new Error(`solveStream: '${configuration.id}' has no energy balance`);
  const Tin = requireNumber(inputs, 'fluid_temperature');
  const Ts = optionalNumber(inputs, 'surface_temperature');
  const heatFlux = optionalNumber(inputs, 'heat_flux');
  const flow = flowSpec(ctx, Tin);
  const stream = streamGeometry(ctx);
  const heats = heatFlux !== undefined ? (heatFlux === 0 ? undefined : heatFlux > 0) : Ts !== undefined && Ts !== Tin ? Ts > Tin : undefined;
  const massFluxAt = (Tm: number) => (flow.kind === 'mass-flux' ? flow.massFlux : flow.kind === 'reynolds' ? reynoldsMassFlux(ctx, flow.Re, Tm) : undefined);

  // Without a heated area or a known flow there is no balance: the point is the inlet.
  if (stream === undefined || flow.kind === 'none' || (Ts === undefined && heatFlux === undefined)) {
    return atInlet(ctx, Tin, Ts, heatFlux, heats, massFluxAt(Tin));
  }
  const massFlow = (Tm: number) => massFluxAt(Tm)! * stream.flowArea;

  if (heatFlux === undefined) {
    // Uniform wall temperature: T_s − T_out = (T_s − T_in)·exp(−h̄A/(ṁc_p)).
    const wallT = Ts!;
    const evaluateAt = (Tout: number) => forward(ctx, { Tfluid: (Tin + Tout) / 2, Ts: wallT, massFlux: massFluxAt((Tin + Tout) / 2), heats });
    const it = iterateOutlet(Tin, (Tout) => {
      const f = evaluateAt(Tout);
      if (f.h === undefined || f.props === undefined) return NaN;
      const Tm = (Tin + Tout) / 2;
      return outletUniformWallTemperature(wallT, Tin, transferUnits(f.h, stream.heatedArea, massFlow(Tm), f.props.cp));
    });
    const final = evaluateAt(it.Tout);
    if (!it.converged || final.h === undefined || final.props === undefined) return notConverged(final);
    const Tm = (Tin + it.Tout) / 2;
    const mdot = massFlow(Tm);
    const ntu = transferUnits(final.h, stream.heatedArea, mdot, final.props.cp);
    const Tout = outletUniformWallTemperature(wallT, Tin, ntu);
    const heatRate = mdot * final.props.cp * (Tout - Tin);
    Object.assign(final.row.outputs, balanceOutputs(stream, { Tout, Tm, mdot, heatRate }), {
      log_mean_temperature_difference: logMeanTemperatureDifference(wallT, Tin, ntu),
    });
    return withFlags(final.row, [boilingFlag(reader, [Tin, Tout, wallT])]);
  }

  // Uniform heat flux: T_out = T_in + q″A/(ṁc_p); the wall runs q″/h above the bulk, hottest at the outlet.
  const it = iterateOutlet(Tin, (Tout) => {
    const Tm = (Tin + Tout) / 2;
    return outletUniformFlux(Tin, heatFlux, stream.heatedArea, massFlow(Tm), reader.at(Tm).cp);
  });
  const Tm = (Tin + it.Tout) / 2;
  // The length-mean wall temperature, with h (and μ_s where a method uses it) at that wall temperature.
  const wall = solveSurfaceTemperature({
    convective: (Tw) => {
      const f = forward(ctx, { Tfluid: Tm, Ts: Tw, massFlux: massFluxAt(Tm), heats });
      return f.h === undefined ? NaN : f.h * (Tw - Tm);
    },
    target: heatFlux,
    start: Tm,
  });
  const final = forward(ctx, { Tfluid: Tm, Ts: Number.isFinite(wall.Ts) ? wall.Ts : Tm, massFlux: massFluxAt(Tm), heats });
  if (!it.converged || wall.status !== 'converged' || final.h === undefined || final.props === undefined) {
    if (wall.status === 'out-of-range') return { ...final.row, outputs: {}, flags: [...final.row.flags, 'out-of-range:surface_temperature'] };
    return notConverged(final);
  }
  const mdot = massFlow(Tm);
  const Tout = it.Tout;
  const outletWall = Tout + heatFlux / final.h;
  // Under a uniform flux the heat rate is q″·A by definition; the outlet carries it (ṁc_p(T_out − T_in) = q″A to 1e-6 K).
  Object.assign(final.row.outputs, balanceOutputs(stream, { Tout, Tm, mdot, heatRate: heatFlux * stream.heatedArea }), {
    surface_temperature: wall.Ts,
    surface_temperature_outlet: outletWall,
  });
  return withFlags(final.row, [boilingFlag(reader, [Tin, Tout, wall.Ts, outletWall])]);
}

/** The stream at its inlet only (no length, or no wall condition): properties at T_in. */
function atInlet(ctx: PointContext, Tin: number, Ts: number | undefined, heatFlux: number | undefined, heats: boolean | undefined, massFlux: number | undefined): ResultRow {
  if (heatFlux === undefined) {
    const f = forward(ctx, { Tfluid: Tin, Ts, massFlux, heats });
    if (Ts !== undefined && f.h !== undefined) f.row.outputs.q = f.h * (Ts - Tin);
    if (massFlux !== undefined && ctx.geometry.flowArea !== undefined) f.row.outputs.mass_flow = massFlux * ctx.geometry.flowArea;
    return withFlags(f.row, [boilingFlag(ctx.reader, [Tin, Ts])]);
  }
  const wall = solveSurfaceTemperature({
    convective: (Tw) => {
      const f = forward(ctx, { Tfluid: Tin, Ts: Tw, massFlux, heats });
      return f.h === undefined ? NaN : f.h * (Tw - Tin);
    },
    target: heatFlux,
    start: Tin,
  });
  const f = forward(ctx, { Tfluid: Tin, Ts: Number.isFinite(wall.Ts) ? wall.Ts : Tin, massFlux, heats });
  if (wall.status !== 'converged') return { ...f.row, outputs: {}, flags: [...f.row.flags, wall.status === 'out-of-range' ? 'out-of-range:surface_temperature' : 'not-converged'] };
  f.row.outputs.surface_temperature = wall.Ts;
  f.row.outputs.q = heatFlux;
  return withFlags(f.row, [boilingFlag(ctx.reader, [Tin, wall.Ts])]);
}

function flowSpec(ctx: PointContext, Tin: number): FlowSpec {
  const { inputs, configuration, geometry } = ctx;
  const velocity = optionalNumber(inputs, 'velocity');
  const flowRate = optionalNumber(inputs, 'flow_rate');
  const Re = optionalNumber(inputs, 'Re');
  // velocity and flow_rate are taken at the inlet: ṁ = ρ(T_in)·u·A, conserved along the stream.
  const rhoIn = () => ctx.reader.at(Tin).rho;
  if (velocity !== undefined) return { kind: 'mass-flux', massFlux: rhoIn() * velocity };
  if (flowRate !== undefined) {
    if (geometry.flowArea === undefined) throw new InputError(`flow_rate needs the cross-section (configuration '${configuration.id}')`);
    return { kind: 'mass-flux', massFlux: (rhoIn() * flowRate) / geometry.flowArea };
  }
  if (Re !== undefined) return { kind: 'reynolds', Re };
  return { kind: 'none' };
}

/** Mass flux that gives Re at the mean bulk temperature (Re = G·L/μ; banks: on V_max). */
function reynoldsMassFlux(ctx: PointContext, Re: number, Tm: number): number {
  const mu = ctx.reader.at(Tm).mu;
  const flux = (Re * mu) / ctx.geometry.length;
  return ctx.configuration.id === 'tube-bank' ? flux / tubeBankRatio(ctx.inputs) : flux;
}

function streamGeometry(ctx: PointContext): StreamGeometry | undefined {
  const { configuration, geometry, inputs } = ctx;
  if (configuration.id === 'tube-bank') {
    // The bank's balance does not depend on the tube length (area and flow both scale with it):
    // without `length` it runs per metre of tube, and no heat rate or mass flow is reported.
    const L = geometry.flowLength;
    const perMetre = L === undefined;
    const length = L ?? 1;
    const ST = requireNumber(inputs, 'ST_over_D') * geometry.length;
    const area = geometry.area ?? (optionalNumber(inputs, 'rows') ?? 20) * tubesPerRow(inputs) * Math.PI * geometry.length * length;
    return { flowArea: tubesPerRow(inputs) * ST * length, heatedArea: area, perMetre };
  }
  if (geometry.area === undefined || geometry.flowArea === undefined) return undefined;
  return { flowArea: geometry.flowArea, heatedArea: geometry.area, perMetre: false };
}

function balanceOutputs(stream: StreamGeometry, b: { Tout: number; Tm: number; mdot: number; heatRate: number }) {
  const out: Record<string, number> = {
    outlet_temperature: b.Tout,
    mean_bulk_temperature: b.Tm,
    q: b.heatRate / stream.heatedArea,
  };
  if (!stream.perMetre) {
    out.mass_flow = b.mdot;
    out.heat_rate = b.heatRate;
    out.surface_area = stream.heatedArea;
  }
  return out;
}

function notConverged(f: ForwardResult): ResultRow {
  // A method that gave no h (its own flags say why, e.g. the wall outside the fluid's table)
  // is not a balance failure: keep its flags only.
  const flags = f.h === undefined ? f.row.flags : [...f.row.flags, 'not-converged'];
  return { ...f.row, outputs: {}, flags };
}

function withFlags(row: ResultRow, flags: (Flag | undefined)[]): ResultRow {
  for (const f of flags) if (f && !row.flags.includes(f)) row.flags.push(f);
  return row;
}
