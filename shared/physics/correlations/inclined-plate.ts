// Free convection from an isothermal flat plate tilted by θ from the vertical, L long along
// the slope. Ra is on L with the full g, gβ|T_s − T_∞|L³/(να); the methods apply the
// published rule for the buoyancy component. Properties at the film temperature.
//   hot side down (a hot face looking downward, or a cold face looking upward): the flow
//     stays attached; the vertical-plate correlation with g·cos θ, 0 ≤ θ ≤ 60°.
//   hot side up (a hot face looking upward, or a cold face looking downward): the plume
//     lifts off the face; the larger of the vertical form with g·cos θ and the horizontal
//     hot-side-up form with g·sin θ on L* = A/P.
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type ValidityRange } from '../types.js';
import { churchillChuVerticalPlate, churchillChuVerticalPlateLaminar, hotSideUpNusselt } from './free-convection.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'inclined-plate';

export type HotSide = 'up' | 'down';

/** The ratio L* / L for a plate L long and W wide, L* = A/P = LW/(2(L + W)) (Goldstein, Sparrow & Jones 1973). */
export function areaPerimeterRatio(widthOverLength: number): number {
  return widthOverLength / (2 * (1 + widthOverLength));
}

export interface InclinedResult {
  Nu: number;
  /** The vertical-plate form with g·cos θ, on L. */
  Nu_vertical: number;
  /** The horizontal hot-side-up form with g·sin θ, converted to L (hot side up only). */
  Nu_horizontal?: number;
  /** Ra·cos θ, the Rayleigh number the vertical form used. */
  Ra_vertical: number;
  /** Ra on L* with g·sin θ (hot side up only). */
  Ra_horizontal?: number;
}

/**
 * The rule: Incropera et al., 7th ed., §9.6.2 (g·cos θ on the downward-facing hot side, after
 * Vliet 1969 and Fujii & Imura 1972); Raithby & Hollands (1998) Handbook of Heat Transfer,
 * 3rd ed., ch. 4 (the larger of the two forms on the upward-facing hot side), from memory.
 */
export function inclinedPlateNusselt(
  vertical: (Ra: number) => number,
  Ra: number,
  tiltDeg: number,
  side: HotSide,
  widthOverLength: number | undefined,
): InclinedResult {
  const theta = (tiltDeg * Math.PI) / 180;
  const Ra_vertical = Ra * Math.max(0, Math.cos(theta));
  const Nu_vertical = vertical(Ra_vertical);
  if (side === 'down') return { Nu: Nu_vertical, Nu_vertical, Ra_vertical };
  if (widthOverLength === undefined) {
    throw new InputError(`${CONFIGURATION}: hot_side 'up' needs width_over_length (the horizontal form's L* = A/P)`);
  }
  const ratio = areaPerimeterRatio(widthOverLength);
  const Ra_horizontal = Ra * ratio ** 3 * Math.sin(theta);
  const Nu_horizontal = Ra_horizontal > 0 ? hotSideUpNusselt(Ra_horizontal) / ratio : 0;
  return { Nu: Math.max(Nu_vertical, Nu_horizontal), Nu_vertical, Nu_horizontal, Ra_vertical, Ra_horizontal };
}

// ---------------------------------------------------------------- method data

const inputs: InputSpec[] = [
  { name: 'Ra', description: 'Rayleigh number on the plate length L along the slope, with the full g: gβ|T_s − T_∞|L³/(να)', unit: '1', required: true },
  { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true },
  {
    name: 'tilt',
    description: 'angle of the plate from vertical, degrees: 0 vertical, 90 horizontal',
    unit: 'deg',
    required: true,
  },
  {
    name: 'hot_side',
    description:
      "'down': the hot face looks downward (or the cold face upward), flow stays attached; 'up': the hot face looks upward (or the cold face downward), the plume lifts off",
    unit: '1',
    type: 'string',
    required: false,
    default: 'down',
    choices: ['down', 'up'],
  },
  {
    name: 'width_over_length',
    description: "W/L, plate width over its length along the slope (needed for hot_side 'up': L* = A/P)",
    unit: '1',
    required: false,
  },
];

const outputs = [
  { name: 'Nu', description: 'average Nusselt number on the length L along the slope, h̄L/k', unit: '1' },
  { name: 'Nu_vertical', description: 'the vertical-plate form with g·cos θ, on L', unit: '1' },
  { name: 'Nu_horizontal', description: "the horizontal hot-side-up form with g·sin θ, on L (hot_side 'up' only)", unit: '1' },
];

function inclinedMethod(spec: {
  id: string;
  title: string;
  vertical: (Ra: number, Pr: number) => number;
  verticalRa: ValidityRange;
  verticalEquation: string;
  equationNumber: string;
}): Method {
  const m: Method = {
    id: spec.id,
    configuration: CONFIGURATION,
    kind: 'correlation',
    title: spec.title,
    description:
      "Isothermal plate tilted θ from vertical. hot_side 'down' (the default): the vertical-plate correlation with g·cos θ, 0 ≤ θ ≤ 60°. hot_side 'up': the larger of that and the horizontal hot-side-up correlation (Lloyd & Moran) with g·sin θ on L* = A/P; beyond about θ = 60° the horizontal form takes over. Nu_vertical and Nu_horizontal show both.",
    equation: `\\overline{\\mathrm{Nu}}_L = \\begin{cases} \\mathrm{Nu}_V(\\mathrm{Ra}_L\\cos\\theta) & \\text{hot side down},\\ 0 \\le \\theta \\le 60^\\circ \\\\ \\max\\left[\\mathrm{Nu}_V(\\mathrm{Ra}_L\\cos\\theta),\\ \\frac{L}{L^*}\\mathrm{Nu}_H(\\mathrm{Ra}_{L^*}\\sin\\theta)\\right] & \\text{hot side up} \\end{cases},\\quad \\mathrm{Nu}_V = ${spec.verticalEquation},\\quad \\mathrm{Nu}_H = 0.54\\,\\mathrm{Ra}^{1/4}\\ (< 10^7),\\ 0.15\\,\\mathrm{Ra}^{1/3}`,
    inputs,
    outputs,
    ranges: [
      { ...spec.verticalRa, note: `${spec.verticalRa.note}; applied to Ra·cos θ` },
      { input: 'tilt', min: 0, max: 60, note: "hot_side 'down': the g·cos θ rule" },
      { input: 'tilt', min: 0, max: 90, note: "hot_side 'up'" },
      { input: 'Ra_horizontal', min: 1e4, max: 1e11, note: "Ra on L* with g·sin θ (derived), hot_side 'up' when the horizontal form is the larger" },
    ],
    uncertainty: {
      fraction: 0.2,
      note: 'Common practice: the vertical forms are ±10 %, the tilt rule adds the scatter of the inclined-plate data (Fujii & Imura 1972).',
    },
    source: `Churchill, S.W. & Chu, H.H.S. (1975) Int. J. Heat Mass Transfer 18:1323–1329 (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., ${spec.equationNumber}) with the g·cos θ rule of Incropera §9.6.2 (after Vliet, G.C. (1969) J. Heat Transfer 91:511–516 and Fujii, T. & Imura, H. (1972) Int. J. Heat Mass Transfer 15:755–767); hot side up: the larger of the vertical and horizontal forms as recommended by Raithby, G.D. & Hollands, K.G.T. (1998) in Handbook of Heat Transfer, 3rd ed., ch. 4, with Lloyd, J.R. & Moran, W.R. (1974) J. Heat Transfer 96:443–447 (Incropera eqs. 9.30–9.31) (numbers from memory)`,
    version: 1,
    evaluate(raw) {
      const input = readInputs(m, raw);
      const Ra = input.number('Ra', 'non-negative');
      const Pr = input.number('Pr');
      const tilt = input.number('tilt', 'non-negative');
      const side = input.string('hot_side') as HotSide;
      const widthOverLength = input.values.width_over_length === undefined ? undefined : input.number('width_over_length');
      const r = inclinedPlateNusselt((x) => spec.vertical(x, Pr), Ra, tilt, side, widthOverLength);
      const [raRange, downTilt, upTilt, horizontalRa] = m.ranges;
      const horizontalWins = r.Nu_horizontal !== undefined && r.Nu_horizontal > r.Nu_vertical;
      const applicable = side === 'down' ? [raRange, downTilt] : [horizontalWins ? horizontalRa : raRange, upTilt];
      const flags = rangeFlags(applicable, { ...input.values, Ra: r.Ra_vertical, Ra_horizontal: r.Ra_horizontal ?? 0 });
      const out: Record<string, number> = { Nu: r.Nu, Nu_vertical: r.Nu_vertical };
      if (r.Nu_horizontal !== undefined) out.Nu_horizontal = r.Nu_horizontal;
      return { outputs: out, flags };
    },
  };
  return m;
}

export const inclinedPlateMethods: Method[] = [
  inclinedMethod({
    id: 'churchill-chu',
    title: 'Churchill–Chu inclined plate (g·cos θ rule; hot side up: larger of vertical and horizontal)',
    vertical: churchillChuVerticalPlate,
    verticalRa: { input: 'Ra', min: 0.1, max: 1e12, note: 'the span of the data Churchill & Chu correlated (from memory)' },
    verticalEquation:
      '\\left\\{0.825 + \\frac{0.387\\,\\mathrm{Ra}^{1/6}}{[1 + (0.492/\\mathrm{Pr})^{9/16}]^{8/27}}\\right\\}^2',
    equationNumber: 'eq. 9.26',
  }),
  inclinedMethod({
    id: 'churchill-chu-laminar',
    title: 'Churchill–Chu laminar inclined plate (g·cos θ rule; hot side up: larger of vertical and horizontal)',
    vertical: churchillChuVerticalPlateLaminar,
    verticalRa: { input: 'Ra', max: 1e9, note: 'laminar boundary layer' },
    verticalEquation: '0.68 + \\frac{0.670\\,\\mathrm{Ra}^{1/4}}{[1 + (0.492/\\mathrm{Pr})^{9/16}]^{4/9}}',
    equationNumber: 'eq. 9.27',
  }),
];
