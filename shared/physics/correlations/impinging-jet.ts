// Gas jets from round nozzles impinging normally on a flat surface: one nozzle, or a
// square or hexagonal array. Re and Nu are on the nozzle diameter D with the nozzle exit
// velocity; H is the nozzle-to-surface distance. The single-nozzle Nu is the average over
// the disc of radius r around the stagnation point; the array Nu is the average over the
// surface the array serves. Properties at the film temperature (common practice).
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type MethodResult, type ValidityRange } from '../types.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'impinging-jet';

export type NozzleLayout = 'single' | 'square-array' | 'hexagonal-array';

// Martin, H. (1977) Adv. Heat Transfer 13:1–60, single round nozzle:
// Nu/Pr^0.42 = G(r/D, H/D)·F1(Re), G = (D/r)(1 − 1.1D/r)/(1 + 0.1(H/D − 6)D/r),
// F1 = 2 Re^½ (1 + 0.005 Re^0.55)^½.
export function martinSingleNusselt(Re: number, Pr: number, H_over_D: number, r_over_D: number): number {
  const d = 1 / r_over_D;
  const G = (d * (1 - 1.1 * d)) / (1 + 0.1 * (H_over_D - 6) * d);
  const F1 = 2 * Math.sqrt(Re) * Math.sqrt(1 + 0.005 * Re ** 0.55);
  return Pr ** 0.42 * G * F1;
}

// Martin (1977), array of round nozzles: Nu/Pr^0.42 = K·G·F2, F2 = 0.5 Re^⅔,
// K = [1 + ((H/D)/(0.6/A_r^½))^6]^−0.05, G = 2A_r^½(1 − 2.2A_r^½)/(1 + 0.2(H/D − 6)A_r^½).
export function martinArrayNusselt(Re: number, Pr: number, H_over_D: number, A_r: number): number {
  const s = Math.sqrt(A_r);
  const K = (1 + (H_over_D / (0.6 / s)) ** 6) ** -0.05;
  const G = (2 * s * (1 - 2.2 * s)) / (1 + 0.2 * (H_over_D - 6) * s);
  return Pr ** 0.42 * K * G * 0.5 * Re ** (2 / 3);
}

/** Relative nozzle area A_r: nozzle area over the area each nozzle serves (Martin 1977). */
export function relativeNozzleArea(layout: Exclude<NozzleLayout, 'single'>, pitch_over_D: number): number {
  // Square: each nozzle serves S²; hexagonal (equilateral triangles): (√3/2)S².
  return layout === 'square-array' ? Math.PI / (4 * pitch_over_D ** 2) : Math.PI / (2 * Math.sqrt(3) * pitch_over_D ** 2);
}

// ---------------------------------------------------------------- method data

const inputs: InputSpec[] = [
  { name: 'Re', description: 'Reynolds number on the nozzle diameter D with the nozzle exit velocity, V_e D/ν', unit: '1', required: true },
  { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true },
  {
    name: 'nozzles',
    description: "'single' (one round nozzle), 'square-array' or 'hexagonal-array' (round nozzles on a square or equilateral-triangle pitch)",
    unit: '1',
    type: 'string',
    required: false,
    default: 'single',
    choices: ['single', 'square-array', 'hexagonal-array'],
  },
  { name: 'H_over_D', description: 'nozzle-to-surface distance over nozzle diameter, H/D', unit: '1', required: true },
  { name: 'r_over_D', description: "radius of the disc the average covers over nozzle diameter, r/D (nozzles 'single')", unit: '1', required: false },
  { name: 'pitch_over_D', description: 'nozzle pitch over nozzle diameter, S/D (arrays)', unit: '1', required: false },
];

const common: ValidityRange[] = [{ input: 'H_over_D', min: 2, max: 12 }];
const singleRanges: ValidityRange[] = [{ input: 'Re', min: 2000, max: 4e5, note: 'single nozzle' }, ...common, { input: 'r_over_D', min: 2.5, max: 7.5 }];
const arrayRanges: ValidityRange[] = [
  { input: 'Re', min: 2000, max: 1e5, note: 'arrays' },
  ...common,
  { input: 'nozzle_area_ratio', min: 0.004, max: 0.04, note: 'A_r (derived from pitch_over_D), arrays' },
];

const martin: Method = {
  id: 'martin',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Martin (round impinging jets: single nozzle or array)',
  description:
    "Average Nu under gas jets from round nozzles impinging normally on a flat surface. nozzles 'single': the average over the disc of radius r round the stagnation point. 'square-array' / 'hexagonal-array': the average over the surface, by the relative nozzle area A_r = πD²/(4S²) (square) or πD²/(2√3 S²) (hexagonal), with the spent gas leaving freely between the nozzles. Within Martin's ranges only: each is flagged outside them.",
  equation:
    '\\text{single: } \\frac{\\overline{\\mathrm{Nu}}}{\\mathrm{Pr}^{0.42}} = \\frac{D}{r}\\,\\frac{1 - 1.1D/r}{1 + 0.1(H/D - 6)D/r}\\cdot 2\\,\\mathrm{Re}^{1/2}\\left(1 + 0.005\\,\\mathrm{Re}^{0.55}\\right)^{1/2};\\quad \\text{array: } \\frac{\\overline{\\mathrm{Nu}}}{\\mathrm{Pr}^{0.42}} = \\left[1 + \\left(\\frac{H/D}{0.6/A_r^{1/2}}\\right)^6\\right]^{-0.05}\\frac{2A_r^{1/2}(1 - 2.2A_r^{1/2})}{1 + 0.2(H/D - 6)A_r^{1/2}}\\cdot 0.5\\,\\mathrm{Re}^{2/3}',
  inputs,
  outputs: [
    { name: 'Nu', description: 'average Nusselt number on the nozzle diameter, h̄D/k', unit: '1' },
    { name: 'nozzle_area_ratio', description: 'relative nozzle area A_r (arrays)', unit: '1' },
  ],
  ranges: [...singleRanges, ...arrayRanges],
  uncertainty: {
    fraction: 0.15,
    note: 'Common practice: Martin fitted heat- and mass-transfer data from several laboratories; the scatter is of this order, no single figure stated here.',
  },
  source:
    'Martin, H. (1977) Heat and mass transfer between impinging gas jets and solid surfaces, Advances in Heat Transfer 13:1–60; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §7.7, eqs. 7.71–7.75 (numbers from memory)',
  version: 1,
  evaluate(raw): MethodResult {
    const input = readInputs(martin, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const H_over_D = input.number('H_over_D');
    const layout = input.string('nozzles') as NozzleLayout;
    const needs = (name: string) => {
      if (input.values[name] === undefined) throw new InputError(`${CONFIGURATION}/martin: nozzles '${layout}' needs ${name}`);
      return input.number(name);
    };
    if (layout === 'single') {
      const r_over_D = needs('r_over_D');
      // Below r/D = 1.1 Martin's G turns negative: no physical answer.
      if (!(r_over_D > 1.1)) throw new InputError(`${CONFIGURATION}/martin: r_over_D must be > 1.1 (its range is 2.5–7.5), got ${r_over_D}`);
      return { outputs: { Nu: martinSingleNusselt(Re, Pr, H_over_D, r_over_D) }, flags: rangeFlags(singleRanges, input.values) };
    }
    const A_r = relativeNozzleArea(layout, needs('pitch_over_D'));
    // Above A_r = 1/4.84 the factor (1 − 2.2A_r^½) is ≤ 0; nozzles that close together are a slot, not an array.
    if (!(Math.sqrt(A_r) < 1 / 2.2)) throw new InputError(`${CONFIGURATION}/martin: pitch_over_D too small (A_r = ${A_r}; its range is 0.004–0.04)`);
    const Nu = martinArrayNusselt(Re, Pr, H_over_D, A_r);
    return { outputs: { Nu, nozzle_area_ratio: A_r }, flags: rangeFlags(arrayRanges, { ...input.values, nozzle_area_ratio: A_r }) };
  },
};

export const impingingJetMethods: Method[] = [martin];
