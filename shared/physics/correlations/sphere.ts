// A single sphere in a uniform stream; Re and Nu on the diameter D. Both correlations tend to
// Nu = 2, pure conduction into a still medium, as Re → 0, so Re = 0 is allowed.
// Incropera equation numbers in `source` are cited from memory of the 7th edition.
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec } from '../types.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'sphere';

const ReInput: InputSpec = { name: 'Re', description: 'Reynolds number on the diameter, VD/ν', unit: '1', required: true };
const NuOutput: OutputSpec[] = [{ name: 'Nu', description: 'average Nusselt number over the sphere, h̄D/k', unit: '1' }];

const whitaker: Method = {
  id: 'whitaker',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Whitaker (sphere, gases and liquids)',
  description:
    'Laminar-boundary-layer term Re^½ plus wake term Re^⅔ on top of the conduction limit 2, with a viscosity-ratio correction. All properties at the free-stream temperature except μ_s at the surface.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = 2 + \\left(0.4\\,\\mathrm{Re}_D^{1/2} + 0.06\\,\\mathrm{Re}_D^{2/3}\\right)\\mathrm{Pr}^{0.4}\\left(\\frac{\\mu}{\\mu_s}\\right)^{1/4}',
  inputs: [
    ReInput,
    { name: 'Pr', description: 'Prandtl number at the free-stream temperature', unit: '1', required: true },
    {
      name: 'viscosity_ratio',
      description: 'μ_∞/μ_s, free-stream over surface viscosity',
      unit: '1',
      required: false,
      default: 1,
    },
  ],
  outputs: NuOutput,
  ranges: [
    { input: 'Re', min: 3.5, max: 7.6e4 },
    { input: 'Pr', min: 0.71, max: 380 },
    { input: 'viscosity_ratio', min: 1, max: 3.2 },
  ],
  uncertainty: { fraction: 0.3, note: 'Whitaker (1972): the data scatter about ±30 % around the correlation (from memory).' },
  source:
    'Whitaker, S. (1972) AIChE J. 18:361–371; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.56',
  version: 1,
  evaluate(raw) {
    const input = readInputs(whitaker, raw);
    const Re = input.number('Re', 'non-negative');
    const Pr = input.number('Pr');
    const muRatio = input.number('viscosity_ratio');
    // Whitaker (1972), eq. for the sphere.
    const Nu = 2 + (0.4 * Math.sqrt(Re) + 0.06 * Re ** (2 / 3)) * Pr ** 0.4 * muRatio ** 0.25;
    return { outputs: { Nu }, flags: rangeFlags(whitaker.ranges, input.values) };
  },
};

const ranzMarshall: Method = {
  id: 'ranz-marshall',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Ranz–Marshall (drops and small spheres)',
  description:
    'Conduction limit 2 plus a laminar-boundary-layer term, from evaporating drops. Usually used with film properties (common practice).',
  equation: '\\overline{\\mathrm{Nu}}_D = 2 + 0.6\\,\\mathrm{Re}_D^{1/2}\\mathrm{Pr}^{1/3}',
  inputs: [ReInput, { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true }],
  outputs: NuOutput,
  ranges: [
    { input: 'Re', max: 200, note: 'Re range of the drop experiments (from memory)' },
    { input: 'Pr', min: 0.6, note: 'gases and vapours in the experiments; Pr^1/3 form (from memory)' },
  ],
  uncertainty: { fraction: 0.3, note: 'Common practice: none stated by the source; taken as for Whitaker.' },
  source:
    'Ranz, W.E. & Marshall, W.R. (1952) Evaporation from drops, Chem. Eng. Prog. 48:141–146 and 173–180; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.57',
  version: 1,
  evaluate(raw) {
    const input = readInputs(ranzMarshall, raw);
    const Re = input.number('Re', 'non-negative');
    const Pr = input.number('Pr');
    // Ranz & Marshall (1952).
    const Nu = 2 + 0.6 * Math.sqrt(Re) * Math.cbrt(Pr);
    return { outputs: { Nu }, flags: rangeFlags(ranzMarshall.ranges, input.values) };
  },
};

export const sphereMethods: Method[] = [whitaker, ranzMarshall];
