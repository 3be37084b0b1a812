// Free convection in the channel between two vertical parallel plates a gap S apart and
// L high, open at the bottom and top (the classic fin-array and card-cage channel). Nu and
// Ra are on the gap S; the channel's own group is the Elenbaas number El = Ra_S·S/L.
// Properties at the film temperature (T_s + T_∞)/2. Shared with plate-fin-heat-sink.ts.
import { brent } from '../numerics/roots.js';
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type OutputSpec, type ValidityRange } from '../types.js';
import { readInputs } from './method-inputs.js';

export type ChannelWalls = 'both' | 'one';

// Elenbaas, W. (1942) Physica 9:1–28: isothermal plates, Nu_S = (El/24)[1 − exp(−35/El)]^¾.
export function elenbaasNusselt(El: number): number {
  if (!(El > 0)) throw new InputError(`Elenbaas number Ra_S·S/L must be > 0, got ${El}`);
  return (El / 24) * (1 - Math.exp(-35 / El)) ** 0.75;
}

// Bar-Cohen, A. & Rohsenow, W.M. (1984) J. Heat Transfer 106:116–123: Nu_S = [C1/El² + C2/El^½]^−½.
// Isothermal plates: C1 = 576 both walls at T_s, 144 one wall at T_s and the other adiabatic; C2 = 2.87.
export const BAR_COHEN_ROHSENOW: Record<ChannelWalls, { C1: number; C2: number; optimum: number }> = {
  // `optimum`: S_opt = optimum·L·Ra_L^−¼ (Bar-Cohen & Rohsenow's 2.714 and 2.154).
  both: { C1: 576, C2: 2.87, optimum: 2.714 },
  one: { C1: 144, C2: 2.87, optimum: 2.154 },
};

export function barCohenRohsenowNusselt(El: number, walls: ChannelWalls): number {
  if (!(El > 0)) throw new InputError(`Elenbaas number Ra_S·S/L must be > 0, got ${El}`);
  const { C1, C2 } = BAR_COHEN_ROHSENOW[walls];
  return (C1 / (El * El) + C2 / Math.sqrt(El)) ** -0.5;
}

/**
 * The spacing that maximises the heat from a fixed base width (thin plates): the maximum of
 * Nu_S/S² at fixed L and ΔT. With El = (S/L)⁴·Ra_L this is x = S·Ra_L^¼/L maximising
 * Nu(x⁴)/x². For Elenbaas' form the condition reduces to (e^u − 1)/u = 3/2 with u = 35/x⁴
 * (ours, the criterion of Bar-Cohen & Rohsenow applied to his correlation).
 */
function elenbaasOptimumCoefficient(): number {
  const r = brent((u) => Math.expm1(u) / u - 1.5, 0.1, 5);
  if (r.status !== 'converged') throw new Error(`Elenbaas optimum spacing: root ${r.status}`);
  return (35 / r.x) ** 0.25;
}
/** S_opt·Ra_L^¼/L for Elenbaas' correlation (about 2.60). */
export const ELENBAAS_OPTIMUM = elenbaasOptimumCoefficient();

/** S_opt/L = coefficient·Ra_L^−¼ for a channel at Ra_S and S/L. */
export function optimumGapOverHeight(coefficient: number, Ra_S: number, gapOverHeight: number): number {
  // Ra_L = Ra_S (L/S)³.
  const Ra_L = Ra_S / gapOverHeight ** 3;
  return coefficient * Ra_L ** -0.25;
}

// ---------------------------------------------------------------- method data

export const channelRaInput: InputSpec = {
  name: 'Ra',
  description: 'Rayleigh number on the gap S, gβ|T_s − T_∞|S³/(να)',
  unit: '1',
  required: true,
};
/** The S/L input: `gap_over_height` for a plain channel, `gap_over_length` for a heat sink. */
export const gapRatioInput = (name: string, words: string): InputSpec => ({
  name,
  description: `S/L, ${words}`,
  unit: '1',
  required: true,
});
export const channelWallsInput: InputSpec = {
  name: 'heated_walls',
  description: "'both' (both plates at T_s, as in a fin array) or 'one' (one plate at T_s, the other adiabatic)",
  unit: '1',
  type: 'string',
  required: false,
  default: 'both',
  choices: ['both', 'one'],
};
export const channelOutputs: OutputSpec[] = [
  { name: 'Nu', description: 'average Nusselt number of a heated plate on the gap S, h̄S/k', unit: '1' },
  { name: 'El', description: 'Elenbaas number Ra_S·S/L', unit: '1' },
  { name: 'optimum_gap_over_height', description: 'S_opt/L: the spacing that maximises the heat from a given base width at this height and ΔT', unit: '1' },
];
/** Laminar boundary layers: the isolated-plate limit both forms approach holds up to Ra_L ≈ 1e9. */
export const channelRanges: ValidityRange[] = [
  { input: 'Ra_L', max: 1e9, note: 'Ra_L = Ra_S (L/S)³ (derived): laminar flow on the plates' },
];

/** How a configuration names its channel: the S/L input and the words for L. */
export interface ChannelNaming {
  ratio: InputSpec;
  lengthWords: string;
}

export function readChannel(method: Method, raw: Parameters<Method['evaluate']>[0], ratioName: string) {
  const input = readInputs(method, raw);
  const Ra = input.number('Ra');
  const gapOverHeight = input.number(ratioName);
  return { input, Ra, gapOverHeight, El: Ra * gapOverHeight, Ra_L: Ra / gapOverHeight ** 3 };
}

const elenbaasSource =
  'Elenbaas, W. (1942) Heat dissipation of parallel plates by free convection, Physica 9:1–28; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.37 (equation number from memory)';
const barCohenRohsenowSource =
  'Bar-Cohen, A. & Rohsenow, W.M. (1984) Thermally optimum spacing of vertical, natural convection cooled, parallel plates, J. Heat Transfer 106:116–123; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 9.38–9.40 and Table 9.3 (numbers from memory)';

export function elenbaasMethod(configuration: string, { ratio, lengthWords }: ChannelNaming): Method {
  const m: Method = {
    id: 'elenbaas',
    configuration,
    kind: 'correlation',
    title: 'Elenbaas (isothermal vertical parallel plates)',
    description: `Average Nu of isothermal vertical plates a gap S apart, ${lengthWords}, both at T_s, in free convection. From the fully developed limit El/24 (narrow, long channels) to the isolated-plate limit 0.59 El^¼ (wide gaps). The optimum spacing maximises Nu_S/S² of this same form (S_opt ≈ 2.60 L Ra_L^−¼).`,
    equation:
      '\\mathrm{Nu}_S = \\frac{1}{24}\\,\\mathrm{Ra}_S\\frac{S}{L}\\left[1 - \\exp\\left(-\\frac{35}{\\mathrm{Ra}_S\\,S/L}\\right)\\right]^{3/4},\\quad S_{opt} \\approx 2.60\\,L\\,\\mathrm{Ra}_L^{-1/4}',
    inputs: [channelRaInput, ratio],
    outputs: channelOutputs,
    ranges: channelRanges,
    wallConditions: ['temperature'],
    uncertainty: {
      fraction: 0.15,
      note: 'Common practice: Elenbaas fitted his air measurements on square plates; the source states no single figure.',
    },
    source: elenbaasSource,
    version: 1,
    evaluate(raw) {
      const { input, Ra, gapOverHeight, El, Ra_L } = readChannel(m, raw, ratio.name);
      return {
        outputs: { Nu: elenbaasNusselt(El), El, optimum_gap_over_height: optimumGapOverHeight(ELENBAAS_OPTIMUM, Ra, gapOverHeight) },
        flags: rangeFlags(m.ranges, { ...input.values, Ra_L }),
      };
    },
  };
  return m;
}

export function barCohenRohsenowMethod(configuration: string, { ratio, lengthWords }: ChannelNaming): Method {
  const m: Method = {
    id: 'bar-cohen-rohsenow',
    configuration,
    kind: 'correlation',
    title: 'Bar-Cohen–Rohsenow (vertical parallel plates, with optimum spacing)',
    description: `Average Nu of isothermal vertical plates a gap S apart, ${lengthWords}: both plates at T_s (C1 = 576, C2 = 2.87) or one at T_s and the other adiabatic (C1 = 144). A composite of the fully developed and isolated-plate limits. The optimum spacing S_opt = 2.714 L Ra_L^−¼ (both) or 2.154 L Ra_L^−¼ (one) maximises the heat from a given base width; there Nu_S = 1.307 (both walls).`,
    equation:
      '\\mathrm{Nu}_S = \\left[\\frac{C_1}{(\\mathrm{Ra}_S\\,S/L)^2} + \\frac{C_2}{(\\mathrm{Ra}_S\\,S/L)^{1/2}}\\right]^{-1/2},\\quad C_1 = 576\\ (144),\\ C_2 = 2.87,\\quad S_{opt} = 2.714\\ (2.154)\\,L\\,\\mathrm{Ra}_L^{-1/4}',
    inputs: [channelRaInput, ratio, channelWallsInput],
    outputs: channelOutputs,
    ranges: channelRanges,
    wallConditions: ['temperature'],
    uncertainty: { fraction: 0.15, note: 'Common practice: the source states no single figure.' },
    source: barCohenRohsenowSource,
    version: 1,
    evaluate(raw) {
      const { input, Ra, gapOverHeight, El, Ra_L } = readChannel(m, raw, ratio.name);
      const walls = input.string('heated_walls') as ChannelWalls;
      return {
        outputs: {
          Nu: barCohenRohsenowNusselt(El, walls),
          El,
          optimum_gap_over_height: optimumGapOverHeight(BAR_COHEN_ROHSENOW[walls].optimum, Ra, gapOverHeight),
        },
        flags: rangeFlags(m.ranges, { ...input.values, Ra_L }),
      };
    },
  };
  return m;
}

const plates: ChannelNaming = { ratio: gapRatioInput('gap_over_height', 'plate spacing over plate height'), lengthWords: 'L high' };
export const verticalChannelMethods: Method[] = [elenbaasMethod('vertical-channel', plates), barCohenRohsenowMethod('vertical-channel', plates)];
