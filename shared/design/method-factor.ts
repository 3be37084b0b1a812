// A method's stated uncertainty acts on its Nusselt number as a factor F (Nu → F·Nu, so
// h → F·h). This module gives a method's outputs at a point for a given F, through the
// engine's public solve only, exactly (not linearised) wherever one of these rules holds:
//
// - Nu, Nu_x, h, h_x scale with F (h = Nu·k/L).
// - Surface temperature given (Newton's law of cooling, q = h·ΔT with ΔT fixed):
//   q and heat_rate scale with F.
// - Heat flux given, surface temperature solved: F·h(T_s)·(T_s − T_ref) = q″ is the
//   engine's own fixed point for a flux of q″/F, so the engine is called with that flux;
//   T_s comes out as solved, h and Nu are the engine's values times F, q and heat_rate
//   (the given flux) come back unchanged. Exact also where h depends on T_s (free convection).
// - Internal flow with an energy balance (an `outlet_temperature` output, surface
//   temperature given): T_s − T_out = (T_s − T_in)·exp(−NTU) with NTU = h̄PL/(ṁc_p)
//   (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 8.41b, from
//   memory), so with θ = (T_s − T_out)/(T_s − T_in) the outlet becomes T_s − (T_s − T_in)·θ^F
//   and heat_rate and q scale by (1 − θ^F)/(1 − θ). Properties stay at the nominal mean
//   bulk temperature (their change with the outlet is second order).
// - Internal flow with a heat flux given: the balance T_out = T_in + q″PL/(ṁc_p) does not
//   involve h, so q, heat_rate and the outlet stay; the wall sits q″/h above the bulk, so
//   the (mean) surface temperature becomes T_b + (T_s − T_b)/F (T_b: mean_bulk_temperature).
//
// A banded output that no rule covers in a row (e.g. a temperature solved from a power
// with radiation) is listed in `uncovered`: its band then holds the input tolerances only
// and the row says so with a `band-inputs-only:<output>` flag, never a silent number.
import type { ResultRow } from '../physics/engine.js';
import type { Flag, Inputs, Outputs } from '../physics/types.js';
import { BANDED_OUTPUTS } from './names.js';

/** One method at one point (compileSolver for that method alone, not strict). */
export type MethodEvaluator = (inputs: Inputs) => ResultRow;

const NU_LIKE = ['Nu', 'Nu_x', 'h', 'h_x'];
const HEAT = ['q', 'heat_rate'];

const num = (inputs: Inputs, name: string) => (typeof inputs[name] === 'number' ? (inputs[name] as number) : undefined);

/** Which rule carries F to the row's heat and temperature outputs. */
export type FactorRule = 'surface-temperature' | 'heat-flux' | 'energy-balance' | 'internal-heat-flux' | 'none';

export function factorRule(inputs: Inputs, nominal: Outputs): FactorRule {
  const Ts = num(inputs, 'surface_temperature');
  const flux = num(inputs, 'heat_flux') !== undefined;
  if (nominal.outlet_temperature !== undefined) {
    if (Ts !== undefined) return num(inputs, 'fluid_temperature') !== undefined ? 'energy-balance' : 'none';
    return flux && nominal.mean_bulk_temperature !== undefined ? 'internal-heat-flux' : 'none';
  }
  if (Ts !== undefined) return 'surface-temperature';
  // With radiation the flux is shared with εσ(T_s⁴ − T_sur⁴): q″/F is no longer equivalent.
  if (flux && !(num(inputs, 'emissivity')! > 0)) return 'heat-flux';
  return 'none';
}

/** Banded outputs of a nominal row that `rule` leaves uncovered. */
export function uncoveredOutputs(rule: FactorRule, nominal: Outputs): string[] {
  const covered = new Set(NU_LIKE);
  if (rule === 'surface-temperature') HEAT.forEach((n) => covered.add(n));
  if (rule === 'heat-flux') [...HEAT, 'surface_temperature'].forEach((n) => covered.add(n));
  if (rule === 'energy-balance') [...HEAT, 'outlet_temperature'].forEach((n) => covered.add(n));
  if (rule === 'internal-heat-flux') [...HEAT, 'outlet_temperature', 'surface_temperature'].forEach((n) => covered.add(n));
  return BANDED_OUTPUTS.filter((n) => nominal[n] !== undefined && !covered.has(n));
}

/** The method's outputs at `inputs` with its Nu multiplied by `factor` (> 0). */
export function evaluateWithFactor(evaluate: MethodEvaluator, inputs: Inputs, factor: number, rule: FactorRule): { outputs: Outputs; flags: Flag[] } {
  if (factor === 1) {
    const row = evaluate(inputs);
    return { outputs: row.outputs, flags: row.flags };
  }
  const flux = num(inputs, 'heat_flux');
  const row = rule === 'heat-flux' && flux !== undefined ? evaluate({ ...inputs, heat_flux: flux / factor }) : evaluate(inputs);
  const out: Outputs = { ...row.outputs };
  for (const n of NU_LIKE) if (out[n] !== undefined) out[n] *= factor;
  if (rule === 'surface-temperature' || rule === 'heat-flux') {
    for (const n of HEAT) if (out[n] !== undefined) out[n] *= factor;
  } else if (rule === 'energy-balance') {
    const Ts = inputs.surface_temperature as number;
    const Tin = inputs.fluid_temperature as number;
    const theta = (Ts - out.outlet_temperature) / (Ts - Tin);
    // θ = 1: nothing exchanged, θ = 0: the outlet has reached the wall; both stay put.
    if (theta > 0 && theta < 1) {
      const thetaF = theta ** factor;
      out.outlet_temperature = Ts - (Ts - Tin) * thetaF;
      const ratio = (1 - thetaF) / (1 - theta);
      for (const n of HEAT) if (out[n] !== undefined) out[n] *= ratio;
    }
  } else if (rule === 'internal-heat-flux' && out.surface_temperature !== undefined) {
    const Tb = out.mean_bulk_temperature;
    out.surface_temperature = Tb + (out.surface_temperature - Tb) / factor;
  }
  return { outputs: out, flags: row.flags };
}
