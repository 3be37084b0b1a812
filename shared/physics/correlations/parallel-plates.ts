// Internal flow between two wide parallel plates a gap apart, one or both walls heated (an
// unheated wall is insulated). Re, Nu and L/D are on the hydraulic diameter D_h = 2·gap;
// properties at the bulk temperature; Nu is a heated wall's, h = q″/(T_wall − T_m).
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec } from '../types.js';
import { gnielinskiAnnulus, gnielinskiAnnulusRanges, turbulentChannelLength } from './annulus.js';
import { laminarEntryFlag, shortTubeFactor, shortTubeInput } from './entry-length.js';
import { optionalLengthRatio, petukhovFrictionFactor, withPressureDrop } from './friction.js';
import { readInputs } from './method-inputs.js';
import { gnielinskiNusselt, gnielinskiRanges, LAMINAR_RE_LIMIT, type WallCondition } from './pipe.js';

const CONFIGURATION = 'parallel-plates';

export type HeatedWalls = 'both' | 'one';

// Shah, R.K. & London, A.L. (1978) Laminar Flow Forced Convection in Ducts, ch. VI (parallel
// plates): fully developed Nu on D_h = 2·gap. Both walls heated: 7.541 (T), 8.235 (H);
// one wall heated, the other insulated: 4.861 (T), 70/13 = 5.385 (H). Checked against the SciPy
// solutions in tests/fixtures/laminar_duct_reference.py and annulus_reference.py.
export const PARALLEL_PLATES_LAMINAR_NU: Record<HeatedWalls, Record<WallCondition, number>> = {
  both: { temperature: 7.541, flux: 8.235 },
  one: { temperature: 4.861, flux: 5.385 },
};
/** Darcy f·Re on D_h = 2·gap, plane Poiseuille flow (exact). */
export const PARALLEL_PLATES_F_RE = 96;

const ReInput: InputSpec = {
  name: 'Re',
  description: 'Reynolds number on the hydraulic diameter, u_m D_h/ν with D_h = 2·gap',
  unit: '1',
  required: true,
};
const heatedWallsInput: InputSpec = {
  name: 'heated_walls',
  description: "'both' (both walls heated alike) or 'one' (one wall heated, the other insulated)",
  unit: '1',
  type: 'string',
  required: false,
  default: 'both',
  choices: ['both', 'one'],
};
const lengthInput: InputSpec = {
  name: 'L_over_D',
  description: 'channel length over hydraulic diameter, L/D_h (optional: gives pressure_drop_coefficient)',
  unit: '1',
  required: false,
};
const outputs = (frictionNote: string): OutputSpec[] => [
  { name: 'Nu', description: 'Nusselt number of a heated wall on D_h = 2·gap, hD_h/k', unit: '1' },
  { name: 'f', description: `Darcy friction factor on D_h, ${frictionNote}`, unit: '1' },
  { name: 'pressure_drop_coefficient', description: 'K = f·L/D_h, so that Δp = K·½ρu_m² (only when L_over_D is given)', unit: '1' },
];

const laminarParallelPlates: Method = {
  id: 'laminar-parallel-plates',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Fully developed laminar flow between parallel plates (7.54 / 8.235, one wall 4.86 / 5.385)',
  description:
    'Hydrodynamically and thermally fully developed laminar flow between wide parallel plates, constant properties. Both walls heated: Nu = 7.541 (uniform wall temperature) or 8.235 (uniform heat flux); one wall heated and the other insulated: 4.861 or 5.385. f = 96/Re on D_h = 2·gap.',
  equation:
    '\\mathrm{Nu}_{D_h} = 7.541\\ (T),\\ 8.235\\ (q\'\')\\ \\text{both walls};\\quad 4.861\\ (T),\\ 5.385\\ (q\'\')\\ \\text{one wall};\\quad f = 96/\\mathrm{Re}_{D_h},\\quad D_h = 2\\,\\text{gap}',
  inputs: [
    ReInput,
    heatedWallsInput,
    {
      name: 'wall_condition',
      description: "'temperature' (uniform wall temperature) or 'flux' (uniform wall heat flux)",
      unit: '1',
      type: 'string',
      required: false,
      default: 'temperature',
      choices: ['temperature', 'flux'],
    },
    lengthInput,
    {
      name: 'Pr',
      description: 'Prandtl number at the bulk temperature (optional: with L_over_D it gives the thermal entry-length check)',
      unit: '1',
      required: false,
    },
  ],
  outputs: outputs('96/Re (plane Poiseuille flow, fully developed; the entry region adds to it)'),
  ranges: [
    { input: 'Re', max: LAMINAR_RE_LIMIT, note: 'laminar flow, Re on D_h' },
    { input: 'L_over_D', note: 'fully developed: flagged entry-region where L/D_h < 0.05·Re·max(1, Pr)' },
  ],
  uncertainty: {
    fraction: 0.1,
    note: 'Exact for constant properties and fully developed flow (checked against tests/fixtures/laminar_duct_reference.py and annulus_reference.py); ±10 % for real channels, where properties vary, is common practice.',
  },
  source:
    'Shah, R.K. & London, A.L. (1978) Laminar Flow Forced Convection in Ducts, Academic Press, ch. VI (parallel plates); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., Table 8.1 (b/a → ∞: 7.54, 8.23) and Tables 8.2–8.3 at D_i/D_o = 1 (4.86, 5.385) (table numbers from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(laminarParallelPlates, raw);
    const Re = input.number('Re');
    const walls = input.string('heated_walls') as HeatedWalls;
    const Nu = PARALLEL_PLATES_LAMINAR_NU[walls][input.string('wall_condition') as WallCondition];
    const LD = optionalLengthRatio(input);
    const entry = laminarEntryFlag(Re, input.values.Pr === undefined ? undefined : input.number('Pr'), LD);
    return {
      outputs: withPressureDrop(Nu, PARALLEL_PLATES_F_RE / Re, LD),
      flags: [...rangeFlags(laminarParallelPlates.ranges, input.values), ...(entry ? [entry] : [])],
    };
  },
};

const turbulentParallelPlates: Method = {
  id: 'turbulent-parallel-plates',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Gnielinski on D_h = 2·gap (turbulent parallel-plate channel)',
  description:
    "Fully developed transitional and turbulent flow between smooth parallel plates. Both walls heated: Gnielinski's tube correlation with the Petukhov friction factor on D_h = 2·gap. One wall heated, the other insulated: the same author's annulus correlation in its parallel-plate limit D_i/D_o → 1 (friction at Re* = ⅔Re, heated-wall factor 0.75), which gives 13–24 % less than both walls heated over Re 1e4–1e6 and Pr 0.7–100; its own ranges (Re ≥ 1e4) apply.",
  equation:
    '\\text{both: } \\mathrm{Nu}_{D_h} = \\frac{(f/8)(\\mathrm{Re} - 1000)\\mathrm{Pr}}{1 + 12.7\\,(f/8)^{1/2}(\\mathrm{Pr}^{2/3} - 1)},\\ f = (0.790\\ln\\mathrm{Re} - 1.64)^{-2};\\quad \\text{one: } \\mathrm{Nu}_{D_h} = 0.75\\,\\frac{(\\xi/8)\\,\\mathrm{Re}\\,\\mathrm{Pr}}{k_1 + 12.7\\sqrt{\\xi/8}\\,(\\mathrm{Pr}^{2/3} - 1)},\\ \\xi = (1.8\\log_{10}\\tfrac{2}{3}\\mathrm{Re} - 1.5)^{-2},\\quad D_h = 2\\,\\text{gap}',
  inputs: [ReInput, { name: 'Pr', description: 'Prandtl number at the bulk temperature', unit: '1', required: true }, heatedWallsInput, lengthInput, shortTubeInput],
  outputs: outputs('Petukhov on D_h (both walls) or Konakov at Re* = ⅔Re (one wall)'),
  ranges: [...gnielinskiRanges, { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D_h = 10 unless short_tube_correction' }],
  uncertainty: {
    fraction: 0.15,
    note: "Gnielinski's ±10 % for circular tubes (Incropera §8.5, from memory), widened for the hydraulic-diameter approximation and the one-wall case: common practice.",
  },
  source:
    'Gnielinski, V. (1976) Int. Chem. Eng. 16:359–368, with Petukhov, B.S. (1970) Adv. Heat Transfer 6:503–564, on D_h as in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §8.6 (both walls); Gnielinski, V. (2009) Heat Transfer Eng. 30(6):431–436, VDI Heat Atlas, 2nd ed. (2010), ch. G2, at D_i/D_o → 1 (one wall; from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(turbulentParallelPlates, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const lengthRatio = optionalLengthRatio(input);
    const length = turbulentChannelLength(input);
    if ((input.string('heated_walls') as HeatedWalls) === 'one') {
      const r = gnielinskiAnnulus(Re, Pr, 1, 'inner', length.shortTube);
      return { outputs: withPressureDrop(r.Nu, r.f, lengthRatio), flags: [...rangeFlags(gnielinskiAnnulusRanges, input.values), ...length.flags] };
    }
    const f = petukhovFrictionFactor(Re);
    const Nu = gnielinskiNusselt(Re, Pr, f) * (length.shortTube === undefined ? 1 : shortTubeFactor(length.shortTube));
    return { outputs: withPressureDrop(Nu, f, lengthRatio), flags: [...rangeFlags(gnielinskiRanges, input.values), ...length.flags] };
  },
};

export const parallelPlatesMethods: Method[] = [laminarParallelPlates, turbulentParallelPlates];
