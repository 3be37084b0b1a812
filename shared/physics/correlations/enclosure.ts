// Free convection across a closed rectangular cavity: one wall hot (T_1), the opposite wall
// cold (T_2), a gap L apart, the walls H high; the other walls insulated. Nu and Ra are on
// the gap L with ΔT = T_1 − T_2, so q″ = Nu·k(T_1 − T_2)/L and Nu = 1 is pure conduction.
// Properties at the mean (T_1 + T_2)/2. The tilt is the angle of the hot and cold walls
// from horizontal, Incropera's τ: 0° a horizontal layer heated from below, 90° a vertical
// cavity heated from one side. (inclined-plate measures its tilt from vertical instead,
// as its source does.)
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec, ValidityRange } from '../types.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'enclosure';

/** Rayleigh number below which a horizontal layer heated from below stays still (Nu = 1). */
export const CRITICAL_RA = 1708;

// Berkovsky, B.M. & Polevikov, V.K. (1977), vertical cavity, 2 ≲ H/L ≲ 10.
export function berkovskyPolevikovTall(Ra: number, Pr: number, H_over_L: number): number {
  return 0.22 * ((Pr / (0.2 + Pr)) * Ra) ** 0.28 * H_over_L ** -0.25;
}
// Berkovsky & Polevikov (1977), vertical cavity, 1 ≲ H/L ≲ 2.
export function berkovskyPolevikovSquat(Ra: number, Pr: number): number {
  return 0.18 * ((Pr / (0.2 + Pr)) * Ra) ** 0.29;
}
// MacGregor, R.K. & Emery, A.P. (1969) J. Heat Transfer 91:391, 10 ≲ H/L ≲ 40, laminar regime.
export function macGregorEmeryLaminar(Ra: number, Pr: number, H_over_L: number): number {
  return 0.42 * Ra ** 0.25 * Pr ** 0.012 * H_over_L ** -0.3;
}
// MacGregor & Emery (1969), 1e6 ≲ Ra ≲ 1e9.
export function macGregorEmeryTurbulent(Ra: number): number {
  return 0.046 * Math.cbrt(Ra);
}
// Globe, S. & Dropkin, D. (1959) J. Heat Transfer 81:24, horizontal layer heated from below.
export function globeDropkin(Ra: number, Pr: number): number {
  return 0.069 * Math.cbrt(Ra) * Pr ** 0.074;
}

/** [x]• of Hollands et al.: x when positive, else 0. */
const positive = (x: number) => Math.max(0, x);

// Hollands, K.G.T., Unny, T.E., Raithby, G.D. & Konicek, L. (1976) J. Heat Transfer 98:189, tilted
// layer heated from below; τ in degrees (the sin 1.8τ term is written in degrees).
export function hollandsNusselt(Ra: number, tiltDeg: number): number {
  const tau = (tiltDeg * Math.PI) / 180;
  const RaCos = Ra * Math.cos(tau);
  if (!(RaCos > 0)) return 1;
  return (
    1 +
    1.44 * positive(1 - CRITICAL_RA / RaCos) * (1 - (CRITICAL_RA * Math.sin(1.8 * tau) ** 1.6) / RaCos) +
    positive(Math.cbrt(RaCos / 5830) - 1)
  );
}

// ---------------------------------------------------------------- method data

const RaInput: InputSpec = {
  name: 'Ra',
  description: 'Rayleigh number on the gap L between the hot and cold walls, gβ(T_1 − T_2)L³/(να)',
  unit: '1',
  required: true,
};
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number at the mean temperature (T_1 + T_2)/2', unit: '1', required: true };
const aspectInput: InputSpec = {
  name: 'height_over_gap',
  description: 'H/L, the height of the hot and cold walls over the gap between them',
  unit: '1',
  required: true,
};
const tiltInput = (defaultDeg: number): InputSpec => ({
  name: 'tilt',
  description: 'angle of the hot and cold walls from horizontal, degrees: 0 a horizontal layer heated from below, 90 a vertical cavity',
  unit: 'deg',
  required: false,
  default: defaultDeg,
});
const outputs = (extra: OutputSpec[] = []): OutputSpec[] => [
  { name: 'Nu', description: 'Nusselt number on the gap L, q″L/(k(T_1 − T_2)); 1 is pure conduction', unit: '1' },
  ...extra,
];
const vertical: ValidityRange = { input: 'tilt', min: 90, max: 90, note: 'vertical cavity, heated from one side' };

const berkovskyPolevikov: Method = {
  id: 'berkovsky-polevikov',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Berkovsky–Polevikov (vertical cavity, 1 < H/L < 10)',
  description:
    'Vertical rectangular cavity with one side wall hot and the opposite one cold. Both published forms: 0.18 (Pr Ra/(0.2 + Pr))^0.29 for 1 ≤ H/L < 2, and 0.22 (Pr Ra/(0.2 + Pr))^0.28 (H/L)^−¼ for 2 ≤ H/L ≤ 10; the coefficient used is the C output.',
  equation:
    '\\mathrm{Nu}_L = 0.22\\left(\\frac{\\mathrm{Pr}}{0.2 + \\mathrm{Pr}}\\mathrm{Ra}_L\\right)^{0.28}\\left(\\frac{H}{L}\\right)^{-1/4}\\ (2 \\le H/L \\le 10),\\quad \\mathrm{Nu}_L = 0.18\\left(\\frac{\\mathrm{Pr}}{0.2 + \\mathrm{Pr}}\\mathrm{Ra}_L\\right)^{0.29}\\ (1 \\le H/L < 2)',
  inputs: [RaInput, PrInput, aspectInput, tiltInput(90)],
  outputs: outputs([{ name: 'C', description: 'the form used: 0.22 (2 ≤ H/L ≤ 10) or 0.18 (1 ≤ H/L < 2)', unit: '1' }]),
  ranges: [
    { input: 'height_over_gap', min: 1, max: 10 },
    { input: 'Pr', max: 1e5 },
    { input: 'Ra', min: 1e3, max: 1e10, note: '2 ≤ H/L ≤ 10 form' },
    { input: 'Pr', min: 1e-3, note: '1 ≤ H/L < 2 form' },
    { input: 'Ra_Pr_ratio', min: 1e3, note: 'Ra·Pr/(0.2 + Pr) (derived), 1 ≤ H/L < 2 form' },
    vertical,
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice; the sources state no single figure.' },
  source:
    'Berkovsky, B.M. & Polevikov, V.K. (1977) Numerical study of problems on high-intensive free convection, in Heat Transfer and Turbulent Buoyant Convection, Spalding & Afgan (eds.), Hemisphere, 443–455 (as cited by Catton, I. (1978) Proc. 6th Int. Heat Transfer Conf. 6:13–31); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 9.50–9.51 (numbers from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(berkovskyPolevikov, raw);
    const Ra = input.number('Ra', 'non-negative');
    const Pr = input.number('Pr');
    const aspect = input.number('height_over_gap');
    input.number('tilt', 'any');
    const tall = aspect >= 2;
    const Nu = tall ? berkovskyPolevikovTall(Ra, Pr, aspect) : berkovskyPolevikovSquat(Ra, Pr);
    const [aspectRange, prMax, raTall, prMin, raSquat] = berkovskyPolevikov.ranges;
    const applicable = [aspectRange, prMax, ...(tall ? [raTall] : [prMin, raSquat]), vertical];
    const flags = rangeFlags(applicable, { ...input.values, Ra_Pr_ratio: (Ra * Pr) / (0.2 + Pr) });
    return { outputs: { Nu, C: tall ? 0.22 : 0.18 }, flags };
  },
};

/** Above this Ra (or below H/L = 10) MacGregor & Emery's ⅓-power form applies. */
const MACGREGOR_EMERY_LAMINAR_RA_MAX = 1e7;

const macGregorEmery: Method = {
  id: 'macgregor-emery',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'MacGregor–Emery (vertical cavity, large H/L)',
  description:
    'Tall vertical rectangular cavity with one side wall hot and the opposite one cold. 0.42 Ra^¼ Pr^0.012 (H/L)^−0.3 for 10 ≤ H/L ≤ 40 and Ra ≤ 1e7; above Ra = 1e7 (or for 1 ≤ H/L < 10) the ⅓-power form 0.046 Ra^⅓, independent of H/L. The coefficient used is the C output.',
  equation:
    '\\mathrm{Nu}_L = 0.42\\,\\mathrm{Ra}_L^{1/4}\\,\\mathrm{Pr}^{0.012}\\left(\\frac{H}{L}\\right)^{-0.3}\\ (10 \\le H/L \\le 40,\\ 10^4 \\le \\mathrm{Ra}_L \\le 10^7),\\quad \\mathrm{Nu}_L = 0.046\\,\\mathrm{Ra}_L^{1/3}\\ (1 \\le H/L \\le 40,\\ 10^6 \\le \\mathrm{Ra}_L \\le 10^9)',
  inputs: [RaInput, PrInput, aspectInput, tiltInput(90)],
  outputs: outputs([{ name: 'C', description: 'the form used: 0.42 (Ra^¼) or 0.046 (Ra^⅓)', unit: '1' }]),
  ranges: [
    { input: 'height_over_gap', min: 10, max: 40, note: 'Ra^¼ form' },
    { input: 'Ra', min: 1e4, max: 1e7, note: 'Ra^¼ form' },
    { input: 'Pr', min: 1, max: 2e4, note: 'Ra^¼ form' },
    { input: 'height_over_gap', min: 1, max: 40, note: 'Ra^⅓ form' },
    { input: 'Ra', min: 1e6, max: 1e9, note: 'Ra^⅓ form' },
    { input: 'Pr', min: 1, max: 20, note: 'Ra^⅓ form' },
    vertical,
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice; the source states no single figure.' },
  source:
    'MacGregor, R.K. & Emery, A.P. (1969) Free convection through vertical plane layers: moderate and high Prandtl number fluids, J. Heat Transfer 91:391–403; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 9.52–9.53 (numbers from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(macGregorEmery, raw);
    const Ra = input.number('Ra', 'non-negative');
    const Pr = input.number('Pr');
    const aspect = input.number('height_over_gap');
    input.number('tilt', 'any');
    const quarterPower = aspect >= 10 && Ra <= MACGREGOR_EMERY_LAMINAR_RA_MAX;
    const Nu = quarterPower ? macGregorEmeryLaminar(Ra, Pr, aspect) : macGregorEmeryTurbulent(Ra);
    const r = macGregorEmery.ranges;
    const applicable = [...(quarterPower ? r.slice(0, 3) : r.slice(3, 6)), vertical];
    return { outputs: { Nu, C: quarterPower ? 0.42 : 0.046 }, flags: rangeFlags(applicable, input.values) };
  },
};

const globeDropkinMethod: Method = {
  id: 'globe-dropkin',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Globe–Dropkin (horizontal layer heated from below)',
  description:
    'Horizontal fluid layer between a hot lower plate and a cold upper plate, wide compared with its depth. Below the critical Rayleigh number 1708 the fluid stays still and Nu = 1 exactly (conduction, no flag); above it the correlation, fitted for 3e5 ≤ Ra ≤ 7e9.',
  equation:
    '\\mathrm{Nu}_L = 0.069\\,\\mathrm{Ra}_L^{1/3}\\,\\mathrm{Pr}^{0.074}\\ (3\\times10^5 \\le \\mathrm{Ra}_L \\le 7\\times10^9),\\quad \\mathrm{Nu}_L = 1\\ (\\mathrm{Ra}_L < 1708)',
  inputs: [RaInput, PrInput, tiltInput(0)],
  outputs: outputs(),
  ranges: [
    { input: 'Ra', min: 3e5, max: 7e9, note: 'the correlation; below Ra = 1708 conduction is exact' },
    { input: 'Pr', min: 0.02, max: 8750, note: 'from memory' },
    { input: 'tilt', min: 0, max: 0, note: 'horizontal layer heated from below' },
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice; the source states no single figure.' },
  source:
    'Globe, S. & Dropkin, D. (1959) Natural-convection heat transfer in liquids confined by two horizontal plates and heated from below, J. Heat Transfer 81:24–28; critical Ra = 1708 (Pellew & Southwell 1940); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.49 and §9.8 (numbers from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(globeDropkinMethod, raw);
    const Ra = input.number('Ra', 'non-negative');
    const Pr = input.number('Pr');
    input.number('tilt', 'any');
    const [raRange, ...rest] = globeDropkinMethod.ranges;
    if (Ra < CRITICAL_RA) return { outputs: { Nu: 1 }, flags: rangeFlags(rest, input.values) };
    return { outputs: { Nu: globeDropkin(Ra, Pr) }, flags: rangeFlags([raRange, ...rest], input.values) };
  },
};

const hollands: Method = {
  id: 'hollands',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Hollands (tilted layer heated from below, 0–60°)',
  description:
    'Long rectangular cavity tilted from horizontal by τ, heated from below (hot wall underneath), air. The [x]• terms are zero when x is negative, so Nu = 1 (conduction) until Ra·cos τ passes 1708. Fitted for H/L ≥ 12 and 0 ≤ τ ≤ 60°.',
  equation:
    '\\mathrm{Nu}_L = 1 + 1.44\\left[1 - \\frac{1708}{\\mathrm{Ra}_L\\cos\\tau}\\right]^{\\bullet}\\left[1 - \\frac{1708\\,(\\sin 1.8\\tau)^{1.6}}{\\mathrm{Ra}_L\\cos\\tau}\\right] + \\left[\\left(\\frac{\\mathrm{Ra}_L\\cos\\tau}{5830}\\right)^{1/3} - 1\\right]^{\\bullet}',
  inputs: [RaInput, aspectInput, tiltInput(0)],
  outputs: outputs(),
  ranges: [
    { input: 'Ra', max: 1e5, note: 'the air-layer data (from memory)' },
    { input: 'height_over_gap', min: 12 },
    { input: 'tilt', min: 0, max: 60 },
  ],
  uncertainty: { fraction: 0.1, note: 'Common practice; the authors fitted their air-layer measurements closely, no single figure stated.' },
  source:
    'Hollands, K.G.T., Unny, T.E., Raithby, G.D. & Konicek, L. (1976) Free convective heat transfer across inclined air layers, J. Heat Transfer 98:189–193; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.54 (number from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(hollands, raw);
    const Ra = input.number('Ra', 'non-negative');
    input.number('height_over_gap');
    const tilt = input.number('tilt', 'any');
    return { outputs: { Nu: hollandsNusselt(Ra, tilt) }, flags: rangeFlags(hollands.ranges, input.values) };
  },
};

export const enclosureMethods: Method[] = [berkovskyPolevikov, macGregorEmery, globeDropkinMethod, hollands];
