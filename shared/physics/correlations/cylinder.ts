// A single circular cylinder in cross flow; Re and Nu on the diameter D. Churchill–Bernstein
// and Hilpert use film properties, Zukauskas free-stream properties with a Pr_s correction.
// Incropera equation and table numbers in `source` are cited from memory of the 7th edition.
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec } from '../types.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'cylinder';

const ReInput: InputSpec = { name: 'Re', description: 'Reynolds number on the diameter, VD/ν', unit: '1', required: true };
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number of the fluid', unit: '1', required: true };
const PrSurfaceInput: InputSpec = {
  name: 'Pr_s',
  description: 'Prandtl number at the surface temperature; defaults to Pr (no property correction)',
  unit: '1',
  required: false,
};
const NuOutput: OutputSpec[] = [{ name: 'Nu', description: 'average Nusselt number over the circumference, h̄D/k', unit: '1' }];

const crossFlowUncertainty = {
  fraction: 0.2,
  note: 'Incropera §7.4: errors of up to 20 % are not unusual for single-cylinder correlations (from memory).',
};

/** A piecewise power law Nu = C·Re^m, one row per Re band [ReMin, ReMax). */
export interface PowerLawRow {
  ReMin: number;
  ReMax: number;
  C: number;
  m: number;
}

/** The row whose band holds Re; outside the table the end rows are extended (and flagged by the caller). */
export function rowFor<T extends PowerLawRow>(table: readonly T[], Re: number): T {
  for (const row of table) if (Re < row.ReMax) return row;
  return table[table.length - 1];
}

const churchillBernstein: Method = {
  id: 'churchill-bernstein',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Churchill–Bernstein (all Re, all Pr)',
  description:
    'One expression for the whole Re range of a cylinder in cross flow, for any Pr, provided Re·Pr ≥ 0.2. Properties at the film temperature.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = 0.3 + \\frac{0.62\\,\\mathrm{Re}_D^{1/2}\\mathrm{Pr}^{1/3}}{\\left[1+(0.4/\\mathrm{Pr})^{2/3}\\right]^{1/4}}\\left[1+\\left(\\frac{\\mathrm{Re}_D}{282\\,000}\\right)^{5/8}\\right]^{4/5}',
  inputs: [ReInput, { ...PrInput, description: 'Prandtl number at the film temperature' }],
  outputs: NuOutput,
  ranges: [{ input: 'Pe', min: 0.2, note: 'Pe = Re·Pr (derived), the authors\' lower limit' }],
  uncertainty: crossFlowUncertainty,
  source:
    'Churchill, S.W. & Bernstein, M. (1977) J. Heat Transfer 99:300–306; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.54',
  version: 1,
  evaluate(raw) {
    const input = readInputs(churchillBernstein, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    // Churchill & Bernstein (1977), their eq. for the full range of Re.
    const Nu =
      0.3 +
      ((0.62 * Math.sqrt(Re) * Math.cbrt(Pr)) / (1 + (0.4 / Pr) ** (2 / 3)) ** 0.25) *
        (1 + (Re / 282_000) ** (5 / 8)) ** (4 / 5);
    return { outputs: { Nu }, flags: rangeFlags(churchillBernstein.ranges, { ...input.values, Pe: Re * Pr }) };
  },
};

/** Hilpert (1933) constants, as tabulated by Knudsen & Katz (1958) and Incropera Table 7.2. */
export const HILPERT_TABLE: readonly PowerLawRow[] = [
  { ReMin: 0.4, ReMax: 4, C: 0.989, m: 0.33 },
  { ReMin: 4, ReMax: 40, C: 0.911, m: 0.385 },
  { ReMin: 40, ReMax: 4000, C: 0.683, m: 0.466 },
  { ReMin: 4000, ReMax: 40_000, C: 0.193, m: 0.618 },
  { ReMin: 40_000, ReMax: 400_000, C: 0.027, m: 0.805 },
];

const hilpert: Method = {
  id: 'hilpert',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Hilpert (C, m by Re range)',
  description:
    "Hilpert's air measurements as Nu = C Re^m Pr^⅓, with C and m from a table of five Re bands (0.4 to 4e5); the Pr^⅓ factor extends them to liquids (Knudsen & Katz). A band's lower bound belongs to it. The bands meet within about 2 %. Properties at the film temperature.",
  equation:
    '\\overline{\\mathrm{Nu}}_D = C\\,\\mathrm{Re}_D^{m}\\,\\mathrm{Pr}^{1/3};\\ (C, m) = (0.989, 0.330),\\ (0.911, 0.385),\\ (0.683, 0.466),\\ (0.193, 0.618),\\ (0.027, 0.805)\\ \\text{for}\\ \\mathrm{Re}_D\\ \\text{in}\\ [0.4, 4, 40, 4000, 4\\times10^4, 4\\times10^5]',
  inputs: [ReInput, { ...PrInput, description: 'Prandtl number at the film temperature' }],
  outputs: NuOutput,
  ranges: [
    { input: 'Re', min: 0.4, max: 400_000, note: 'outside the table the end bands are extended' },
    { input: 'Pr', min: 0.7 },
  ],
  uncertainty: crossFlowUncertainty,
  source:
    'Hilpert, R. (1933) Forsch. Geb. Ingenieurwes. 4:215–224; Pr^1/3 form and table from Knudsen, J.G. & Katz, D.L., Fluid Dynamics and Heat Transfer, McGraw-Hill (1958); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.52 and Table 7.2',
  version: 1,
  evaluate(raw) {
    const input = readInputs(hilpert, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const { C, m } = rowFor(HILPERT_TABLE, Re);
    return { outputs: { Nu: C * Re ** m * Math.cbrt(Pr) }, flags: rangeFlags(hilpert.ranges, input.values) };
  },
};

/** Zukauskas (1972) single-cylinder constants, as in Incropera Table 7.4. */
export const ZUKAUSKAS_CYLINDER_TABLE: readonly PowerLawRow[] = [
  { ReMin: 1, ReMax: 40, C: 0.75, m: 0.4 },
  { ReMin: 40, ReMax: 1000, C: 0.51, m: 0.5 },
  { ReMin: 1000, ReMax: 200_000, C: 0.26, m: 0.6 },
  { ReMin: 200_000, ReMax: 1_000_000, C: 0.076, m: 0.7 },
];

/** Zukauskas (1972) single cylinder: Nu = C Re^m Pr^n (Pr/Pr_s)^¼, n = 0.37 for Pr ≤ 10, else 0.36. */
export function zukauskasCylinderNu(Re: number, Pr: number, Pr_s: number): number {
  const { C, m } = rowFor(ZUKAUSKAS_CYLINDER_TABLE, Re);
  const n = Pr <= 10 ? 0.37 : 0.36;
  return C * Re ** m * Pr ** n * (Pr / Pr_s) ** 0.25;
}

const zukauskas: Method = {
  id: 'zukauskas',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Zukauskas (C, m by Re range, wall-Pr correction)',
  description:
    'Nu = C Re^m Pr^n (Pr/Pr_s)^¼ with C and m from a table of four Re bands (1 to 1e6) and n = 0.37 for Pr ≤ 10, 0.36 above. All properties at the free-stream temperature except Pr_s at the surface. A band\'s lower bound belongs to it; the bands meet within about 2 %, and the change of n at Pr = 10 is a 2 % step.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = C\\,\\mathrm{Re}_D^{m}\\,\\mathrm{Pr}^{n}\\left(\\frac{\\mathrm{Pr}}{\\mathrm{Pr}_s}\\right)^{1/4};\\ (C, m) = (0.75, 0.4),\\ (0.51, 0.5),\\ (0.26, 0.6),\\ (0.076, 0.7)\\ \\text{for}\\ \\mathrm{Re}_D\\ \\text{in}\\ [1, 40, 10^3, 2\\times10^5, 10^6];\\ n = 0.37\\ (\\mathrm{Pr}\\le10),\\ 0.36',
  inputs: [ReInput, { ...PrInput, description: 'Prandtl number at the free-stream temperature' }, PrSurfaceInput],
  outputs: NuOutput,
  ranges: [
    { input: 'Re', min: 1, max: 1e6, note: 'outside the table the end bands are extended' },
    { input: 'Pr', min: 0.7, max: 500 },
  ],
  uncertainty: crossFlowUncertainty,
  source:
    'Zukauskas, A. (1972) Heat transfer from tubes in crossflow, Advances in Heat Transfer 8:93–160; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.53 and Table 7.4',
  version: 1,
  evaluate(raw) {
    const input = readInputs(zukauskas, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const Pr_s = input.number('Pr_s', 'positive', Pr);
    return { outputs: { Nu: zukauskasCylinderNu(Re, Pr, Pr_s) }, flags: rangeFlags(zukauskas.ranges, input.values) };
  },
};

export const cylinderMethods: Method[] = [churchillBernstein, hilpert, zukauskas];
