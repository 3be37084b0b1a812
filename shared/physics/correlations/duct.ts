// Internal flow in a smooth rectangular duct with sides a ≤ b. Re, Nu and L/D are on the
// hydraulic diameter D_h = 4A/P = 2ab/(a+b); properties at the bulk temperature.
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type OutputSpec } from '../types.js';
import { optionalLengthRatio, petukhovFrictionFactor, withPressureDrop } from './friction.js';
import { readInputs } from './method-inputs.js';
import { laminarEntryFlag, shortTubeFactor, shortTubeInput, turbulentEntryFlag } from './entry-length.js';
import { gnielinskiNusselt, gnielinskiRanges, LAMINAR_RE_LIMIT, type WallCondition } from './pipe.js';

const CONFIGURATION = 'duct';

/** Hydraulic diameter of a width × height rectangle, D_h = 4A/P = 2ab/(a+b), in the sides' unit. */
export function hydraulicDiameter(width: number, height: number): number {
  if (!(width > 0) || !(height > 0) || !Number.isFinite(width) || !Number.isFinite(height)) {
    throw new InputError(`duct sides must be finite and > 0, got width ${width} and height ${height}`);
  }
  return (2 * width * height) / (width + height);
}

// Shah, R.K. & London, A.L. (1978) Laminar Flow Forced Convection in Ducts, ch. VII
// (rectangular ducts), table of fully developed fRe, Nu_T and Nu_H1 by aspect ratio α*.
// Values recalled from memory, each confirmed to 0.06 % by tests/fixtures/laminar_duct_reference.py.
// fRe is Fanning (Shah & London's convention); Darcy f·Re is four times it.
const SHAH_LONDON_RECTANGULAR = [
  { aspect: 1, fanningFRe: 14.227, Nu_T: 2.976, Nu_H1: 3.608 },
  { aspect: 0.5, fanningFRe: 15.548, Nu_T: 3.391, Nu_H1: 4.123 },
  { aspect: 0.25, fanningFRe: 18.233, Nu_T: 4.439, Nu_H1: 5.331 },
  { aspect: 0.125, fanningFRe: 20.585, Nu_T: 5.597, Nu_H1: 6.49 },
  { aspect: 0, fanningFRe: 24.0, Nu_T: 7.541, Nu_H1: 8.235 },
] as const;

// A duct of aspect a is the duct of aspect 1/a, so each value is an even function of
// s = (1 − a)/(1 + a). Interpolating linearly in s² respects that symmetry and stays within
// 0.5 % of the exact values between the table's rows (tests/fixtures/laminar_duct_reference.py);
// linear interpolation in a itself errs by up to 4 %.
const symmetricCoordinate = (aspect: number) => ((1 - aspect) / (1 + aspect)) ** 2;

export interface RectangularLaminarValues {
  /** Darcy friction factor times Re on D_h. */
  fRe: number;
  /** Nu on D_h, uniform wall temperature (Shah & London's T condition). */
  Nu_T: number;
  /** Nu on D_h, axially uniform heat flux with peripherally uniform wall temperature (H1). */
  Nu_H: number;
}

/** Fully developed laminar values for aspect ratio 0 < a ≤ 1, interpolated in Shah & London's table. */
export function rectangularLaminarValues(aspect: number): RectangularLaminarValues {
  if (!(aspect > 0 && aspect <= 1)) {
    throw new InputError(`aspect_ratio is the short side over the long side, 0 < a ≤ 1; got ${aspect}`);
  }
  const t = symmetricCoordinate(aspect);
  const rows = SHAH_LONDON_RECTANGULAR;
  let i = 0;
  while (i < rows.length - 2 && symmetricCoordinate(rows[i + 1].aspect) < t) i++;
  const lo = rows[i];
  const hi = rows[i + 1];
  const w = (t - symmetricCoordinate(lo.aspect)) / (symmetricCoordinate(hi.aspect) - symmetricCoordinate(lo.aspect));
  const mix = (x: number, y: number) => x + w * (y - x);
  return { fRe: 4 * mix(lo.fanningFRe, hi.fanningFRe), Nu_T: mix(lo.Nu_T, hi.Nu_T), Nu_H: mix(lo.Nu_H1, hi.Nu_H1) };
}

const ReInput: InputSpec = {
  name: 'Re',
  description: 'Reynolds number on the hydraulic diameter, u_m D_h/ν with D_h = 2ab/(a+b)',
  unit: '1',
  required: true,
};
const lengthInput: InputSpec = {
  name: 'L_over_D',
  description: 'duct length over hydraulic diameter, L/D_h (optional: gives pressure_drop_coefficient)',
  unit: '1',
  required: false,
};
const frictionOutputs = (note: string): OutputSpec[] => [
  { name: 'Nu', description: 'Nusselt number on D_h, hD_h/k', unit: '1' },
  { name: 'f', description: `Darcy friction factor on D_h, ${note}`, unit: '1' },
  { name: 'pressure_drop_coefficient', description: 'K = f·L/D_h, so that Δp = K·½ρu_m² (only when L_over_D is given)', unit: '1' },
];


const laminarRectangular: Method = {
  id: 'laminar-rectangular',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Fully developed laminar flow in a rectangular duct (Shah & London)',
  description:
    'Hydrodynamically and thermally fully developed laminar flow, constant properties, by aspect ratio a = short side/long side (1 square, → 0 parallel plates). wall_condition "temperature" is a uniform wall temperature; "flux" is an axially uniform heat flux with a peripherally uniform wall temperature (Shah & London\'s H1, as for a highly conductive wall). Values interpolated in Shah & London\'s table; Re, Nu and f on D_h = 2ab/(a+b).',
  equation:
    '\\mathrm{Nu}_{D_h} = \\mathrm{Nu}_T(a)\\ \\text{or}\\ \\mathrm{Nu}_{H1}(a),\\quad f = \\frac{(f\\mathrm{Re})(a)}{\\mathrm{Re}_{D_h}},\\quad D_h = \\frac{4A}{P} = \\frac{2ab}{a+b}',
  inputs: [
    ReInput,
    { name: 'aspect_ratio', description: 'short side over long side, 0 < a ≤ 1', unit: '1', required: true },
    {
      name: 'wall_condition',
      description: "'temperature' (uniform wall temperature) or 'flux' (axially uniform heat flux, H1)",
      unit: '1',
      type: 'string',
      required: false,
      default: 'temperature',
      choices: ['temperature', 'flux'],
    },
    lengthInput,
    { name: 'Pr', description: 'Prandtl number at the bulk temperature (optional: with L_over_D it gives the thermal entry-length check)', unit: '1', required: false },
  ],
  outputs: [
    ...frictionOutputs('(f·Re)/Re from Shah & London (fully developed; the entry region adds to it)'),
    { name: 'f_Re', description: 'Darcy friction factor times Re on D_h (Poiseuille number)', unit: '1' },
  ],
  ranges: [
    { input: 'Re', max: LAMINAR_RE_LIMIT, note: 'laminar flow, Re on D_h' },
    { input: 'L_over_D', note: 'fully developed: flagged entry-region where L/D_h < 0.05·Re·max(1, Pr)' },
  ],
  uncertainty: {
    fraction: 0.1,
    note: 'Table values are exact solutions for constant properties (interpolation within 0.5 %); ±10 % for real ducts, where properties vary, is common practice.',
  },
  source:
    'Shah, R.K. & London, A.L. (1978) Laminar Flow Forced Convection in Ducts, Academic Press, ch. VII, rectangular-duct table of fRe, Nu_T, Nu_H1; as reproduced (rounded) in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., Table 8.1',
  version: 2,
  evaluate(raw) {
    const input = readInputs(laminarRectangular, raw);
    const Re = input.number('Re');
    const values = rectangularLaminarValues(input.number('aspect_ratio'));
    const Nu = (input.string('wall_condition') as WallCondition) === 'flux' ? values.Nu_H : values.Nu_T;
    const LD = optionalLengthRatio(input);
    const out = withPressureDrop(Nu, values.fRe / Re, LD);
    const entry = laminarEntryFlag(Re, input.values.Pr === undefined ? undefined : input.number('Pr'), LD);
    return { outputs: { ...out, f_Re: values.fRe }, flags: [...rangeFlags(laminarRectangular.ranges, input.values), ...(entry ? [entry] : [])] };
  },
};

const turbulentRectangular: Method = {
  id: 'turbulent-rectangular',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Gnielinski on the hydraulic diameter (turbulent rectangular duct)',
  description:
    'Fully developed transitional and turbulent flow in a smooth rectangular duct, treated as a circular tube of diameter D_h = 2ab/(a+b): Gnielinski\'s correlation with the Petukhov friction factor, Re on D_h. The hydraulic-diameter approach is a fair approximation in turbulent flow; it is poorer for very flat ducts (a ≲ 0.1).',
  equation:
    '\\mathrm{Nu}_{D_h} = \\frac{(f/8)(\\mathrm{Re}_{D_h} - 1000)\\mathrm{Pr}}{1 + 12.7\\,(f/8)^{1/2}\\left(\\mathrm{Pr}^{2/3} - 1\\right)},\\quad f = (0.790\\ln\\mathrm{Re}_{D_h} - 1.64)^{-2},\\quad D_h = \\frac{2ab}{a+b}',
  inputs: [ReInput, { name: 'Pr', description: 'Prandtl number at the bulk temperature', unit: '1', required: true }, lengthInput, shortTubeInput],
  outputs: frictionOutputs('Petukhov (0.790 ln Re − 1.64)^−2 on D_h'),
  ranges: [...gnielinskiRanges, { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D_h = 10' }],
  uncertainty: {
    fraction: 0.15,
    note: "Gnielinski's ±10 % for circular tubes (Incropera §8.5, from memory), widened for the hydraulic-diameter approximation: common practice.",
  },
  source:
    'Gnielinski, V. (1976) Int. Chem. Eng. 16:359–368, with Petukhov, B.S. (1970) Adv. Heat Transfer 6:503–564, applied on D_h as recommended in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §8.6',
  version: 2,
  evaluate(raw) {
    const input = readInputs(turbulentRectangular, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const f = petukhovFrictionFactor(Re);
    const LD = optionalLengthRatio(input);
    const corrected = input.boolean('short_tube_correction');
    if (corrected && LD === undefined) throw new InputError('short_tube_correction needs L_over_D');
    const Nu = gnielinskiNusselt(Re, Pr, f) * (corrected ? shortTubeFactor(LD!) : 1);
    const entry = turbulentEntryFlag(LD, corrected);
    return { outputs: withPressureDrop(Nu, f, LD), flags: [...rangeFlags(turbulentRectangular.ranges, input.values), ...(entry ? [entry] : [])] };
  },
};

export const ductMethods: Method[] = [laminarRectangular, turbulentRectangular];
