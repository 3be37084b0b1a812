// Free (natural) convection from isothermal bodies in a large quiescent fluid: vertical
// plates, horizontal plates, horizontal cylinders and spheres. Nu and Ra are on each
// configuration's characteristic length; properties at the film temperature (T_s + T_∞)/2.
// Ra = gβ|T_s − T_∞|L³/(να) is a magnitude: the orientation (hot side up or down) is the method.
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec, ValidityRange } from '../types.js';
import { readInputs } from './method-inputs.js';

const RaInput = (length: string): InputSpec => ({
  name: 'Ra',
  description: `Rayleigh number on ${length}, gβ|T_s − T_∞|L³/(να)`,
  unit: '1',
  required: true,
});
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true };
const NuOutput = (length: string): OutputSpec[] => [
  { name: 'Nu', description: `average Nusselt number on ${length}, h̄L/k`, unit: '1' },
];

// Churchill & Chu's Prandtl function [1 + (c/Pr)^(9/16)]: c = 0.492 for plates, 0.559 for cylinders, 0.469 for spheres.
const prandtlFunction = (c: number, Pr: number) => 1 + (c / Pr) ** (9 / 16);

// ---------------------------------------------------------------- vertical plate

const PLATE_HEIGHT = 'the plate height L';

// Churchill, S.W. & Chu, H.H.S. (1975) Int. J. Heat Mass Transfer 18:1323, eq. for all Ra.
export function churchillChuVerticalPlate(Ra: number, Pr: number): number {
  return (0.825 + (0.387 * Ra ** (1 / 6)) / prandtlFunction(0.492, Pr) ** (8 / 27)) ** 2;
}

// Churchill & Chu (1975), laminar form, Ra ≤ 1e9.
export function churchillChuVerticalPlateLaminar(Ra: number, Pr: number): number {
  return 0.68 + (0.67 * Ra ** 0.25) / prandtlFunction(0.492, Pr) ** (4 / 9);
}

const churchillChuSource =
  'Churchill, S.W. & Chu, H.H.S. (1975) Int. J. Heat Mass Transfer 18:1323–1329; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.,';

const verticalChurchillChu: Method = {
  id: 'churchill-chu',
  configuration: 'vertical-plate',
  kind: 'correlation',
  title: 'Churchill–Chu vertical plate (laminar and turbulent)',
  description:
    'Average Nu over an isothermal vertical plate of height L, one expression for laminar, transitional and turbulent free convection and any Prandtl number. Also applies to vertical cylinders whose diameter is large compared with the boundary-layer thickness.',
  equation:
    '\\overline{\\mathrm{Nu}}_L = \\left\\{0.825 + \\frac{0.387\\,\\mathrm{Ra}_L^{1/6}}{\\left[1 + (0.492/\\mathrm{Pr})^{9/16}\\right]^{8/27}}\\right\\}^2',
  inputs: [RaInput(PLATE_HEIGHT), PrInput],
  outputs: NuOutput(PLATE_HEIGHT),
  ranges: [{ input: 'Ra', min: 0.1, max: 1e12, note: 'the span of the data Churchill & Chu correlated (from memory)' }],
  uncertainty: { fraction: 0.1, note: 'Common practice; the source states no single figure.' },
  source: `${churchillChuSource} eq. 9.26`,
  version: 1,
  evaluate(raw) {
    const input = readInputs(verticalChurchillChu, raw);
    const Nu = churchillChuVerticalPlate(input.number('Ra', 'non-negative'), input.number('Pr'));
    return { outputs: { Nu }, flags: rangeFlags(verticalChurchillChu.ranges, input.values) };
  },
};

const verticalChurchillChuLaminar: Method = {
  id: 'churchill-chu-laminar',
  configuration: 'vertical-plate',
  kind: 'correlation',
  title: 'Churchill–Chu vertical plate, laminar',
  description:
    'Average Nu over an isothermal vertical plate in laminar free convection (Ra_L ≤ 1e9), any Prandtl number; slightly better than the all-Ra form in that range.',
  equation:
    '\\overline{\\mathrm{Nu}}_L = 0.68 + \\frac{0.670\\,\\mathrm{Ra}_L^{1/4}}{\\left[1 + (0.492/\\mathrm{Pr})^{9/16}\\right]^{4/9}}',
  inputs: [RaInput(PLATE_HEIGHT), PrInput],
  outputs: NuOutput(PLATE_HEIGHT),
  ranges: [{ input: 'Ra', max: 1e9, note: 'laminar boundary layer' }],
  uncertainty: { fraction: 0.1, note: 'Common practice; the source states no single figure.' },
  source: `${churchillChuSource} eq. 9.27`,
  version: 1,
  evaluate(raw) {
    const input = readInputs(verticalChurchillChuLaminar, raw);
    const Nu = churchillChuVerticalPlateLaminar(input.number('Ra', 'non-negative'), input.number('Pr'));
    return { outputs: { Nu }, flags: rangeFlags(verticalChurchillChuLaminar.ranges, input.values) };
  },
};

export const verticalPlateFreeMethods: Method[] = [verticalChurchillChu, verticalChurchillChuLaminar];

// ---------------------------------------------------------------- horizontal plate

const PLATE_LENGTH = 'L = A/P (plate area over perimeter)';

/** Where the hot-side-up correlation switches from the laminar ¼ to the turbulent ⅓ power. */
export const HOT_SIDE_UP_TRANSITION_RA = 1e7;

// Lloyd, J.R. & Moran, W.R. (1974) J. Heat Transfer 96:443: 0.54 Ra^¼ (1e4–1e7), 0.15 Ra^⅓ (1e7–1e11), L = A/P.
export function hotSideUpNusselt(Ra: number): number {
  return Ra < HOT_SIDE_UP_TRANSITION_RA ? 0.54 * Ra ** 0.25 : 0.15 * Math.cbrt(Ra);
}

// 0.52 Ra^⅕ for 1e4–1e9, Pr ≥ 0.7 (Incropera 7th ed. eq. 9.32, from Radziemska & Lewandowski 2001).
export function hotSideDownNusselt(Ra: number): number {
  return 0.52 * Ra ** 0.2;
}

const hotSideUp: Method = {
  id: 'hot-side-up',
  configuration: 'horizontal-plate',
  kind: 'correlation',
  title: 'Horizontal plate, upper surface hot (or lower surface cold)',
  description:
    'Average Nu on the upper face of a hot isothermal plate, or the lower face of a cold one, where the plume rises (or falls) freely. Nu = 0.54 Ra^¼ below Ra = 1e7 and 0.15 Ra^⅓ above, with L = A/P; the two branches differ by 6 % at the switch.',
  equation:
    '\\overline{\\mathrm{Nu}}_L = 0.54\\,\\mathrm{Ra}_L^{1/4}\\ (10^4 \\le \\mathrm{Ra}_L \\le 10^7,\\ \\mathrm{Pr} \\ge 0.7),\\quad 0.15\\,\\mathrm{Ra}_L^{1/3}\\ (10^7 \\le \\mathrm{Ra}_L \\le 10^{11}),\\quad L = A_s/P',
  inputs: [RaInput(PLATE_LENGTH), PrInput],
  outputs: NuOutput(PLATE_LENGTH),
  ranges: [
    { input: 'Ra', min: 1e4, max: 1e11 },
    { input: 'Pr', min: 0.7, note: 'for the 0.54 Ra^¼ branch (Ra < 1e7) only' },
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice; the sources state no single figure.' },
  source:
    'Lloyd, J.R. & Moran, W.R. (1974) J. Heat Transfer 96:443–447 (after McAdams, Heat Transmission, 3rd ed., 1954; L = A/P from Goldstein, Sparrow & Jones (1973) Int. J. Heat Mass Transfer 16:1025); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 9.30–9.31',
  version: 1,
  evaluate(raw) {
    const input = readInputs(hotSideUp, raw);
    const Ra = input.number('Ra', 'non-negative');
    input.number('Pr');
    const [raRange, prRange] = hotSideUp.ranges;
    const applicable = Ra < HOT_SIDE_UP_TRANSITION_RA ? [raRange, prRange] : [raRange];
    return { outputs: { Nu: hotSideUpNusselt(Ra) }, flags: rangeFlags(applicable, input.values) };
  },
};

const hotSideDown: Method = {
  id: 'hot-side-down',
  configuration: 'horizontal-plate',
  kind: 'correlation',
  title: 'Horizontal plate, lower surface hot (or upper surface cold)',
  description:
    'Average Nu on the lower face of a hot isothermal plate, or the upper face of a cold one, where the plate itself blocks the buoyant flow and the fluid must leave round the edges: much weaker than the hot-side-up case. L = A/P.',
  equation: '\\overline{\\mathrm{Nu}}_L = 0.52\\,\\mathrm{Ra}_L^{1/5}\\ (10^4 \\le \\mathrm{Ra}_L \\le 10^9,\\ \\mathrm{Pr} \\ge 0.7),\\quad L = A_s/P',
  inputs: [RaInput(PLATE_LENGTH), PrInput],
  outputs: NuOutput(PLATE_LENGTH),
  ranges: [
    { input: 'Ra', min: 1e4, max: 1e9 },
    { input: 'Pr', min: 0.7 },
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice; the sources state no single figure.' },
  source:
    'Radziemska, E. & Lewandowski, W.M. (2001) Applied Energy 68:347–366 (origin as cited by Incropera, from memory); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.32',
  version: 1,
  evaluate(raw) {
    const input = readInputs(hotSideDown, raw);
    const Ra = input.number('Ra', 'non-negative');
    input.number('Pr');
    return { outputs: { Nu: hotSideDownNusselt(Ra) }, flags: rangeFlags(hotSideDown.ranges, input.values) };
  },
};

export const horizontalPlateMethods: Method[] = [hotSideUp, hotSideDown];

// ---------------------------------------------------------------- horizontal cylinder

const DIAMETER = 'the diameter D';

// Churchill, S.W. & Chu, H.H.S. (1975) Int. J. Heat Mass Transfer 18:1049, long horizontal cylinder.
export function churchillChuHorizontalCylinder(Ra: number, Pr: number): number {
  return (0.6 + (0.387 * Ra ** (1 / 6)) / prandtlFunction(0.559, Pr) ** (8 / 27)) ** 2;
}

// Morgan, V.T. (1975) Adv. Heat Transfer 11:199: Nu = C Ra^n by Ra band; each band is [from, to).
export const MORGAN_BANDS = [
  { from: 1e-10, to: 1e-2, C: 0.675, n: 0.058 },
  { from: 1e-2, to: 1e2, C: 1.02, n: 0.148 },
  { from: 1e2, to: 1e4, C: 0.85, n: 0.188 },
  { from: 1e4, to: 1e7, C: 0.48, n: 0.25 },
  { from: 1e7, to: 1e12, C: 0.125, n: 0.333 },
] as const;

export function morganNusselt(Ra: number): { Nu: number; C: number; n: number } {
  // Below the table the first band, above it the last: the point is flagged either way.
  const band = MORGAN_BANDS.find((b) => Ra < b.to) ?? MORGAN_BANDS[MORGAN_BANDS.length - 1];
  return { Nu: band.C * Ra ** band.n, C: band.C, n: band.n };
}

const cylinderChurchillChu: Method = {
  id: 'churchill-chu',
  configuration: 'horizontal-cylinder',
  kind: 'correlation',
  title: 'Churchill–Chu horizontal cylinder',
  description:
    'Average Nu around a long isothermal horizontal cylinder, one expression from very small Ra to turbulent free convection, any Prandtl number.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = \\left\\{0.60 + \\frac{0.387\\,\\mathrm{Ra}_D^{1/6}}{\\left[1 + (0.559/\\mathrm{Pr})^{9/16}\\right]^{8/27}}\\right\\}^2',
  inputs: [RaInput(DIAMETER), PrInput],
  outputs: NuOutput(DIAMETER),
  ranges: [{ input: 'Ra', max: 1e12 }],
  uncertainty: { fraction: 0.1, note: 'Common practice; the source states no single figure.' },
  source:
    'Churchill, S.W. & Chu, H.H.S. (1975) Int. J. Heat Mass Transfer 18:1049–1053; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.34',
  version: 1,
  evaluate(raw) {
    const input = readInputs(cylinderChurchillChu, raw);
    const Nu = churchillChuHorizontalCylinder(input.number('Ra', 'non-negative'), input.number('Pr'));
    return { outputs: { Nu }, flags: rangeFlags(cylinderChurchillChu.ranges, input.values) };
  },
};

const morgan: Method = {
  id: 'morgan',
  configuration: 'horizontal-cylinder',
  kind: 'correlation',
  title: 'Morgan horizontal cylinder (C Ra^n by range)',
  description:
    'Average Nu around a long isothermal horizontal cylinder as C Ra^n, with C and n taken from the Ra_D band (1e-10 to 1e12, five bands). Nu jumps by a few per cent at band edges; the band used is given as the C and n outputs.',
  equation: '\\overline{\\mathrm{Nu}}_D = C\\,\\mathrm{Ra}_D^{\\,n},\\quad (C, n)\\ \\text{from the } \\mathrm{Ra}_D\\ \\text{band}',
  inputs: [RaInput(DIAMETER)],
  outputs: [
    ...NuOutput(DIAMETER),
    { name: 'C', description: "Morgan's coefficient for the Ra band used", unit: '1' },
    { name: 'n', description: "Morgan's exponent for the Ra band used", unit: '1' },
  ],
  ranges: [{ input: 'Ra', min: 1e-10, max: 1e12 }],
  uncertainty: { fraction: 0.1, note: 'Common practice; the source states no single figure here.' },
  source:
    'Morgan, V.T. (1975) Adv. Heat Transfer 11:199–264; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.33 and Table 9.1',
  version: 1,
  evaluate(raw) {
    const input = readInputs(morgan, raw);
    const { Nu, C, n } = morganNusselt(input.number('Ra', 'non-negative'));
    return { outputs: { Nu, C, n }, flags: rangeFlags(morgan.ranges, input.values) };
  },
};

export const horizontalCylinderMethods: Method[] = [cylinderChurchillChu, morgan];

// ---------------------------------------------------------------- sphere

// Churchill, S.W. (1983), sphere: Nu = 2 + 0.589 Ra^¼ / [1 + (0.469/Pr)^(9/16)]^(4/9).
export function churchillSphere(Ra: number, Pr: number): number {
  return 2 + (0.589 * Ra ** 0.25) / prandtlFunction(0.469, Pr) ** (4 / 9);
}

const sphereChurchill: Method = {
  id: 'churchill',
  configuration: 'sphere-free',
  kind: 'correlation',
  title: 'Churchill sphere',
  description:
    'Average Nu over an isothermal sphere in free convection. Nu → 2 as Ra → 0: pure conduction from a sphere into an infinite medium.',
  equation: '\\overline{\\mathrm{Nu}}_D = 2 + \\frac{0.589\\,\\mathrm{Ra}_D^{1/4}}{\\left[1 + (0.469/\\mathrm{Pr})^{9/16}\\right]^{4/9}}',
  inputs: [RaInput(DIAMETER), PrInput],
  outputs: NuOutput(DIAMETER),
  ranges: [
    { input: 'Ra', max: 1e11 },
    { input: 'Pr', min: 0.7 },
  ],
  uncertainty: { fraction: 0.1, note: 'Common practice; the source states no single figure.' },
  source:
    'Churchill, S.W. (1983) Free convection around immersed bodies, in Heat Exchanger Design Handbook, §2.5.7, Hemisphere; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 9.35',
  version: 1,
  evaluate(raw) {
    const input = readInputs(sphereChurchill, raw);
    const Nu = churchillSphere(input.number('Ra', 'non-negative'), input.number('Pr'));
    return { outputs: { Nu }, flags: rangeFlags(sphereChurchill.ranges, input.values) };
  },
};

export const sphereFreeMethods: Method[] = [sphereChurchill];
