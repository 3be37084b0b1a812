// A plate-fin heat sink: a base carrying N straight rectangular fins (fin_count), each
// fin_height from the base, fin_thickness thick and `length` long along the flow, a `gap`
// S apart. The methods give the channel Nusselt number on S (free convection: the
// vertical-channel forms with S/L; forced: Teertstra et al.'s developing-channel model);
// heatSinkPerformance turns the channel h into fin efficiency, heat rate and thermal
// resistance (the dimensional engine calls it with the sizes and temperatures).
import { rangeFlags } from '../ranges.js';
import { InputError, type Method } from '../types.js';
import { readInputs } from './method-inputs.js';
import { barCohenRohsenowMethod, elenbaasMethod, gapRatioInput, type ChannelNaming } from './vertical-channel.js';

const CONFIGURATION = 'plate-fin-heat-sink';

// Teertstra, P., Yovanovich, M.M. & Culham, J.R. (2000) J. Electronics Manufacturing 10(4):253–261:
// Nu_b = [(Re*Pr/2)^−3 + (0.664 Re*^½ Pr^⅓ (1 + 3.65 Re*^−½)^½)^−3]^−⅓, Re* = Re_b·b/L.
export function teertstraNusselt(ReStar: number, Pr: number): number {
  if (!(ReStar > 0)) throw new InputError(`Teertstra et al.: Re* = Re_b·b/L must be > 0, got ${ReStar}`);
  const saturated = (ReStar * Pr) / 2; // the air leaves at the fin temperature
  const developing = 0.664 * Math.sqrt(ReStar) * Math.cbrt(Pr) * Math.sqrt(1 + 3.65 / Math.sqrt(ReStar));
  return (saturated ** -3 + developing ** -3) ** (-1 / 3);
}

/** Channel velocity over approach velocity, V_ch/V = 1 + t/b (Teertstra et al., the flow squeezed between fins). */
export function channelVelocityRatio(finThickness: number, gap: number): number {
  return 1 + finThickness / gap;
}

export interface HeatSinkGeometry {
  fin_count: number;
  /** Fin projection from the base, m. */
  fin_height: number;
  fin_thickness: number;
  /** Spacing S between neighbouring fins, m. */
  gap: number;
  /** Fin length along the flow (vertical in free convection), m. */
  length: number;
  /** Fin material conductivity, W/(m·K). */
  fin_conductivity: number;
}

export interface HeatSinkPerformance {
  /** Base width N t + (N − 1) S, m. */
  base_width: number;
  /** m·L_c with m = (2h/(k_f t))^½ and the corrected length L_c = H_f + t/2. */
  fin_parameter: number;
  /** tanh(mL_c)/(mL_c). */
  fin_efficiency: number;
  /** 1 − (N A_f/A_t)(1 − η_f). */
  overall_efficiency: number;
  /** Wetted area A_t = N A_f + (N − 1) S L, m² (A_f = 2 L L_c). */
  convective_area: number;
  /** Heat rate by convection, W (signed like T_base − T_air). */
  convective_heat_rate: number;
  /** Area that radiates to the surroundings: the envelope W L + 2 H_f L, m². */
  radiating_area: number;
}

export function checkHeatSinkGeometry(g: HeatSinkGeometry): void {
  if (!Number.isInteger(g.fin_count) || g.fin_count < 2) {
    throw new InputError(`plate-fin-heat-sink: fin_count must be a whole number ≥ 2, got ${g.fin_count}`);
  }
  for (const name of ['fin_height', 'fin_thickness', 'gap', 'length', 'fin_conductivity'] as const) {
    if (!(g[name] > 0) || !Number.isFinite(g[name])) throw new InputError(`plate-fin-heat-sink: ${name} must be > 0, got ${g[name]}`);
  }
}

/**
 * Fins and base at the base temperature excess `baseExcess` = T_b − T_∞, channel h on every
 * wetted surface. Straight rectangular fins with a convecting tip through the corrected
 * length L_c = H_f + t/2 and m = (2h/(k_f t))^½, thin-fin form (Incropera et al., 7th ed.,
 * eqs. 3.89, 3.94–3.95, 3.102–3.103, from memory). The outer faces of the two end fins are
 * given the channel h as well (common practice; slightly conservative in free convection).
 */
export function heatSinkPerformance(g: HeatSinkGeometry, h: number, baseExcess: number): HeatSinkPerformance {
  checkHeatSinkGeometry(g);
  if (!(h > 0)) throw new InputError(`plate-fin-heat-sink: the channel h must be > 0, got ${h}`);
  const N = g.fin_count;
  const Lc = g.fin_height + g.fin_thickness / 2;
  const mLc = Math.sqrt((2 * h) / (g.fin_conductivity * g.fin_thickness)) * Lc;
  const fin_efficiency = Math.tanh(mLc) / mLc;
  const finArea = 2 * g.length * Lc;
  const baseArea = (N - 1) * g.gap * g.length;
  const convective_area = N * finArea + baseArea;
  const overall_efficiency = 1 - ((N * finArea) / convective_area) * (1 - fin_efficiency);
  const base_width = N * g.fin_thickness + (N - 1) * g.gap;
  return {
    base_width,
    fin_parameter: mLc,
    fin_efficiency,
    overall_efficiency,
    convective_area,
    convective_heat_rate: overall_efficiency * h * convective_area * baseExcess,
    radiating_area: base_width * g.length + 2 * g.fin_height * g.length,
  };
}

// ---------------------------------------------------------------- method data

const naming: ChannelNaming = {
  ratio: gapRatioInput('gap_over_length', 'fin spacing over fin length along the flow (vertical)'),
  lengthWords: 'here the fins of a heat sink, L long in the vertical flow direction',
};

const teertstra: Method = {
  id: 'teertstra',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Teertstra–Yovanovich–Culham (forced flow through a plate-fin heat sink)',
  description:
    "Average Nu on the fin spacing b for laminar forced flow through the channels of a plate-fin heat sink, a composite of the fully developed (thermally saturated) limit Re*Pr/2 and the developing flat-plate limit, with Re* = Re_b·b/L. Re_b is on the channel velocity V(1 + t/b), V the approach velocity. Channel walls at the base temperature; fin efficiency is applied separately.",
  equation:
    '\\mathrm{Nu}_b = \\left[\\left(\\frac{\\mathrm{Re}_b^*\\mathrm{Pr}}{2}\\right)^{-3} + \\left(0.664\\sqrt{\\mathrm{Re}_b^*}\\,\\mathrm{Pr}^{1/3}\\sqrt{1 + \\frac{3.65}{\\sqrt{\\mathrm{Re}_b^*}}}\\right)^{-3}\\right]^{-1/3},\\quad \\mathrm{Re}_b^* = \\mathrm{Re}_b\\frac{b}{L},\\quad \\mathrm{Re}_b = \\frac{V(1 + t/b)\\,b}{\\nu}',
  inputs: [
    { name: 'Re', description: 'Reynolds number on the fin spacing b with the channel velocity, V(1 + t/b)·b/ν', unit: '1', required: true },
    { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true },
    naming.ratio,
  ],
  outputs: [
    { name: 'Nu', description: 'average Nusselt number on the fin spacing b, h̄b/k', unit: '1' },
    { name: 'Re_star', description: 'channel Reynolds number Re_b·b/L', unit: '1' },
  ],
  ranges: [
    { input: 'Re_star', min: 0.1, max: 100, note: 'Re* = Re_b·b/L (derived): the span of the data compared by the authors (from memory)' },
    { input: 'Pr', min: 0.6, note: 'the laminar flat-plate term' },
  ],
  wallConditions: ['temperature'],
  uncertainty: {
    fraction: 0.15,
    note: 'The authors report agreement with their heat-sink measurements within about 6 % (from memory); ±15 % for other fin arrays is common practice.',
  },
  source:
    'Teertstra, P., Yovanovich, M.M. & Culham, J.R. (2000) Analytical forced convection modeling of plate fin heat sinks, J. Electronics Manufacturing 10(4):253–261 (also Proc. 15th IEEE SEMI-THERM, 1999, 34–41), eqs. for Nu_b and Re_b* (from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(teertstra, raw);
    const Re_star = input.number('Re') * input.number('gap_over_length');
    const Pr = input.number('Pr');
    return { outputs: { Nu: teertstraNusselt(Re_star, Pr), Re_star }, flags: rangeFlags(teertstra.ranges, { ...input.values, Re_star }) };
  },
};

export const plateFinHeatSinkMethods: Method[] = [
  elenbaasMethod(CONFIGURATION, naming),
  barCohenRohsenowMethod(CONFIGURATION, naming),
  teertstra,
];
