// Forced convection along a flat plate at zero pressure gradient. Re and Nu are on the plate
// length L; local outputs (Nu_x, Cf_x) are at x = L. Properties at the film temperature.
// Incropera equation numbers in `source` are cited from memory of the 7th edition.
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type OutputSpec, type ValidityRange } from '../types.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'flat-plate';

/** Smooth-plate critical Reynolds number (Incropera et al. 7th ed. §7.2: "representative" value). */
export const DEFAULT_TRANSITION_RE = 5e5;

const ReInput: InputSpec = { name: 'Re', description: 'Reynolds number on the plate length, U∞L/ν', unit: '1', required: true };
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number at the film temperature', unit: '1', required: true };
const unheatedInput: InputSpec = {
  name: 'unheated_length_ratio',
  description: 'unheated starting length over plate length, ξ/L, in [0, 1)',
  unit: '1',
  required: true,
};

const averageOutputs: OutputSpec[] = [
  { name: 'Nu', description: 'average Nusselt number over the plate, h̄L/k', unit: '1' },
  { name: 'Nu_x', description: 'local Nusselt number at x = L, h_x L/k', unit: '1' },
  { name: 'Cf', description: 'average skin-friction coefficient over the plate', unit: '1' },
  { name: 'Cf_x', description: 'local skin-friction coefficient at x = L', unit: '1' },
];

/**
 * Laminar boundary layer: below transition on a smooth plate, and above Re_L = 1e3, where the
 * boundary-layer approximation (δ/x ≈ 5·Re_x^−½ ≪ 1) starts to hold (common practice).
 */
export const BOUNDARY_LAYER_RE_MIN = 1e3;
const laminarRe: ValidityRange = {
  input: 'Re',
  min: BOUNDARY_LAYER_RE_MIN,
  max: DEFAULT_TRANSITION_RE,
  note: 'laminar boundary layer: below transition on a smooth plate, and Re ≥ 1e3 for the boundary-layer approximation (common practice)',
};
const laminarPr: ValidityRange = { input: 'Pr', min: 0.6, note: 'the Pr^(1/3) form fails for liquid metals' };
const turbulentRe: ValidityRange = {
  input: 'Re',
  min: DEFAULT_TRANSITION_RE,
  max: 1e8,
  note: 'turbulent from the leading edge; the 1/5-power friction law holds to about 1e8 (Incropera §7.2)',
};
const turbulentPr: ValidityRange = { input: 'Pr', min: 0.6, max: 60 };

// Laminar isothermal plate: Pohlhausen (1921), Nu_x = 0.332 Re_x^½ Pr^⅓; Blasius (1908) Cf_x = 0.664 Re_x^-½.
const laminarNu_x = (Re: number, Pr: number) => 0.332 * Math.sqrt(Re) * Math.cbrt(Pr);
const laminarCf_x = (Re: number) => 0.664 / Math.sqrt(Re);
// Turbulent: Schlichting's 1/5-power friction law with the Colburn analogy, Nu_x = 0.0296 Re_x^0.8 Pr^⅓.
const turbulentNu_x = (Re: number, Pr: number) => 0.0296 * Re ** 0.8 * Math.cbrt(Pr);
const turbulentCf_x = (Re: number) => 0.0592 * Re ** -0.2;

const laminar: Method = {
  id: 'laminar',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Laminar isothermal plate (Pohlhausen)',
  description:
    'Laminar boundary layer on an isothermal plate. Local Nu_x = 0.332 Re_x^½ Pr^⅓; integrating over the plate gives Nu = 2 Nu_x(L). Skin friction from the Blasius solution.',
  equation:
    '\\mathrm{Nu}_x = 0.332\\,\\mathrm{Re}_x^{1/2}\\mathrm{Pr}^{1/3},\\quad \\overline{\\mathrm{Nu}}_L = 0.664\\,\\mathrm{Re}_L^{1/2}\\mathrm{Pr}^{1/3},\\quad \\overline{C}_f = 1.328\\,\\mathrm{Re}_L^{-1/2}',
  inputs: [ReInput, PrInput],
  outputs: averageOutputs,
  ranges: [laminarRe, laminarPr],
  uncertainty: {
    fraction: 0.05,
    note: 'Within 2 % of the exact similarity solution for Pr ≥ 0.6 (checked in tests/fixtures/external_flow_reference.py); ±5 % for real plates is common practice.',
  },
  source:
    'Pohlhausen, E. (1921) ZAMM 1:115–121; Blasius, H. (1908) Z. Math. Phys. 56:1–37; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §7.2.1',
  wallConditions: ['temperature'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(laminar, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const Nu_x = laminarNu_x(Re, Pr);
    const Cf_x = laminarCf_x(Re);
    return { outputs: { Nu: 2 * Nu_x, Nu_x, Cf: 2 * Cf_x, Cf_x }, flags: rangeFlags(laminar.ranges, input.values) };
  },
};

// Churchill & Ozoe (1973), laminar plate for all Pr, isothermal (J. Heat Transfer 95:416) and
// uniform flux (J. Heat Transfer 95:78): Nu_x = a Re_x^½ Pr^⅓ / [1 + (b/Pr)^⅔]^¼.
const churchillOzoeConstants = {
  temperature: { a: 0.3387, b: 0.0468, averageFactor: 2 },
  flux: { a: 0.4637, b: 0.0207, averageFactor: 1.5 },
} as const;

const churchillOzoe: Method = {
  id: 'churchill-ozoe',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Churchill–Ozoe laminar plate, all Pr',
  description:
    'Laminar plate for any Prandtl number, liquid metals to oils. wall_condition "temperature" is the isothermal plate (Nu = 2 Nu_x(L)); "flux" is the uniform-heat-flux plate, whose Nu is based on the length-mean wall-to-stream temperature difference (Nu = 1.5 Nu_x(L), since ΔT grows as x^½).',
  equation:
    '\\mathrm{Nu}_x = \\frac{a\\,\\mathrm{Re}_x^{1/2}\\mathrm{Pr}^{1/3}}{\\left[1 + (b/\\mathrm{Pr})^{2/3}\\right]^{1/4}},\\quad (a,b) = (0.3387, 0.0468)\\ \\text{isothermal},\\ (0.4637, 0.0207)\\ \\text{uniform flux}',
  inputs: [
    ReInput,
    PrInput,
    {
      name: 'wall_condition',
      description: "'temperature' (isothermal plate) or 'flux' (uniform heat flux)",
      unit: '1',
      type: 'string',
      required: false,
      default: 'temperature',
      choices: ['temperature', 'flux'],
    },
  ],
  outputs: averageOutputs,
  ranges: [laminarRe, { input: 'Pe', min: 100, note: 'Pe = Re·Pr (derived): the boundary-layer approximation needs Pe_x ≥ 100' }],
  uncertainty: {
    fraction: 0.05,
    note: 'Within 1.4 % of the exact similarity solutions from Pr = 1e-3 to 1e4 (tests/fixtures/external_flow_reference.py); ±5 % for real plates is common practice.',
  },
  source:
    'Churchill, S.W. & Ozoe, H. (1973) J. Heat Transfer 95:416–419 (isothermal) and 95:78–84 (uniform flux); isothermal form as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.32',
  version: 2,
  evaluate(raw) {
    const input = readInputs(churchillOzoe, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const { a, b, averageFactor } = churchillOzoeConstants[input.string('wall_condition') as 'temperature' | 'flux'];
    const Nu_x = (a * Math.sqrt(Re) * Math.cbrt(Pr)) / (1 + (b / Pr) ** (2 / 3)) ** 0.25;
    const Cf_x = laminarCf_x(Re);
    return {
      outputs: { Nu: averageFactor * Nu_x, Nu_x, Cf: 2 * Cf_x, Cf_x },
      flags: rangeFlags(churchillOzoe.ranges, { ...input.values, Pe: Re * Pr }),
    };
  },
};

const turbulent: Method = {
  id: 'turbulent',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Turbulent isothermal plate (Colburn analogy)',
  description:
    'Turbulent boundary layer from the leading edge (tripped, or Re far above transition). Local Nu_x = 0.0296 Re_x^0.8 Pr^⅓ from the 1/5-power friction law and the Colburn analogy; integrating from x = 0 gives Nu = 0.037 Re^0.8 Pr^⅓.',
  equation:
    '\\mathrm{Nu}_x = 0.0296\\,\\mathrm{Re}_x^{4/5}\\mathrm{Pr}^{1/3},\\quad \\overline{\\mathrm{Nu}}_L = 0.037\\,\\mathrm{Re}_L^{4/5}\\mathrm{Pr}^{1/3},\\quad \\overline{C}_f = 0.074\\,\\mathrm{Re}_L^{-1/5}',
  inputs: [ReInput, PrInput],
  outputs: averageOutputs,
  ranges: [turbulentRe, turbulentPr],
  uncertainty: { fraction: 0.15, note: 'Common practice for turbulent flat-plate correlations (no figure stated by the sources).' },
  source:
    'Colburn, A.P. (1933) Trans. AIChE 29:174–210 (j-factor analogy) with the 1/5-power friction law C_f,x = 0.0592 Re_x^-1/5 (Schlichting, Boundary-Layer Theory); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.34–7.36 and 7.38 with Re_x,c = 0',
  wallConditions: ['temperature'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(turbulent, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const Nu_x = turbulentNu_x(Re, Pr);
    const Cf_x = turbulentCf_x(Re);
    return { outputs: { Nu: Nu_x / 0.8, Nu_x, Cf: Cf_x / 0.8, Cf_x }, flags: rangeFlags(turbulent.ranges, input.values) };
  },
};

/** A and B of the mixed-plate averages: the laminar part replaces the turbulent integral up to x_c. */
export function mixedPlateConstants(transitionRe: number): { A: number; B: number } {
  return {
    A: 0.037 * transitionRe ** 0.8 - 0.664 * Math.sqrt(transitionRe),
    B: 0.074 * transitionRe ** 0.8 - 1.328 * Math.sqrt(transitionRe),
  };
}

const mixed: Method = {
  id: 'mixed',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Mixed laminar–turbulent plate',
  description:
    'Laminar from the leading edge to x_c (Re_x = transition_Re), turbulent beyond, transition taken as abrupt. Nu = (0.037 Re^0.8 − A) Pr^⅓ with A = 0.037 Re_c^0.8 − 0.664 Re_c^½ (871 for Re_c = 5e5); below Re_c the whole plate is laminar and the laminar result is returned. Nu_x at x = L is the laminar or turbulent local value, so it jumps at Re = Re_c; Nu is continuous.',
  equation:
    '\\overline{\\mathrm{Nu}}_L = \\left(0.037\\,\\mathrm{Re}_L^{4/5} - A\\right)\\mathrm{Pr}^{1/3},\\ A = 0.037\\,\\mathrm{Re}_c^{4/5} - 0.664\\,\\mathrm{Re}_c^{1/2};\\quad \\overline{C}_f = 0.074\\,\\mathrm{Re}_L^{-1/5} - B/\\mathrm{Re}_L,\\ B = 0.074\\,\\mathrm{Re}_c^{4/5} - 1.328\\,\\mathrm{Re}_c^{1/2}',
  inputs: [
    ReInput,
    PrInput,
    {
      name: 'transition_Re',
      description: 'critical Reynolds number Re_x,c where the layer turns turbulent',
      unit: '1',
      required: false,
      default: DEFAULT_TRANSITION_RE,
    },
  ],
  outputs: [
    ...averageOutputs,
    { name: 'laminar_fraction', description: 'laminar part of the plate, x_c/L = min(1, Re_c/Re)', unit: '1' },
  ],
  ranges: [
    { input: 'Re', max: 1e8 },
    turbulentPr,
    { input: 'transition_Re', min: 1e5, max: 3e6, note: 'observed range of the critical Reynolds number (Incropera §6.3)' },
  ],
  uncertainty: { fraction: 0.15, note: 'Common practice; the abrupt-transition model ignores the transition region.' },
  source:
    'Laminar Pohlhausen (1921) and turbulent Colburn (1933) local relations integrated over an abrupt transition; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.38–7.41',
  wallConditions: ['temperature'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(mixed, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const Rec = input.number('transition_Re');
    const flags = rangeFlags(mixed.ranges, input.values);
    if (Re <= Rec) {
      const Nu_x = laminarNu_x(Re, Pr);
      const Cf_x = laminarCf_x(Re);
      return { outputs: { Nu: 2 * Nu_x, Nu_x, Cf: 2 * Cf_x, Cf_x, laminar_fraction: 1 }, flags };
    }
    const { A, B } = mixedPlateConstants(Rec);
    return {
      outputs: {
        Nu: (0.037 * Re ** 0.8 - A) * Math.cbrt(Pr),
        Nu_x: turbulentNu_x(Re, Pr),
        Cf: 0.074 * Re ** -0.2 - B / Re,
        Cf_x: turbulentCf_x(Re),
        laminar_fraction: Rec / Re,
      },
      flags,
    };
  },
};

const fluxOutputs: OutputSpec[] = [
  {
    name: 'Nu',
    description: 'average Nusselt number q″L/(k·ΔT̄), ΔT̄ the length-mean wall-to-stream temperature difference',
    unit: '1',
  },
  ...averageOutputs.slice(1),
];

const laminarUniformFlux: Method = {
  id: 'laminar-uniform-flux',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Laminar plate, uniform heat flux',
  description:
    'Laminar plate with uniform wall heat flux: Nu_x = 0.453 Re_x^½ Pr^⅓, 36 % above the isothermal value. The wall-to-stream difference grows as x^½, so its mean over the plate is ⅔ of its value at L and Nu = q″L/(kΔT̄) = 1.5 Nu_x(L) = 0.680 Re^½ Pr^⅓.',
  equation:
    '\\mathrm{Nu}_x = 0.453\\,\\mathrm{Re}_x^{1/2}\\mathrm{Pr}^{1/3},\\quad \\overline{\\mathrm{Nu}}_L = \\frac{q_s\'\'L}{k\\,\\overline{\\Delta T}} = 0.680\\,\\mathrm{Re}_L^{1/2}\\mathrm{Pr}^{1/3}',
  inputs: [ReInput, PrInput],
  outputs: fluxOutputs,
  ranges: [laminarRe, laminarPr],
  uncertainty: {
    fraction: 0.05,
    note: 'Within 2.5 % of the exact uniform-flux similarity solution for Pr ≥ 0.6 (tests/fixtures/external_flow_reference.py); ±5 % common practice.',
  },
  source:
    'Kays, W.M., Crawford, M.E. & Weigand, B., Convective Heat and Mass Transfer, 4th ed. (2005), laminar constant-heat-rate plate; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.45. Average by integrating ΔT(x) (ours)',
  wallConditions: ['flux'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(laminarUniformFlux, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    // Kays & Crawford: Nu_x = 0.453 Re_x^½ Pr^⅓ for uniform q″.
    const Nu_x = 0.453 * Math.sqrt(Re) * Math.cbrt(Pr);
    const Cf_x = laminarCf_x(Re);
    return { outputs: { Nu: 1.5 * Nu_x, Nu_x, Cf: 2 * Cf_x, Cf_x }, flags: rangeFlags(laminarUniformFlux.ranges, input.values) };
  },
};

const turbulentUniformFlux: Method = {
  id: 'turbulent-uniform-flux',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Turbulent plate, uniform heat flux',
  description:
    'Turbulent plate from the leading edge with uniform wall heat flux: Nu_x = 0.0308 Re_x^0.8 Pr^⅓, 4 % above the isothermal value. ΔT grows as x^0.2, so Nu = q″L/(kΔT̄) = 1.2 Nu_x(L).',
  equation:
    '\\mathrm{Nu}_x = 0.0308\\,\\mathrm{Re}_x^{4/5}\\mathrm{Pr}^{1/3},\\quad \\overline{\\mathrm{Nu}}_L = \\frac{q_s\'\'L}{k\\,\\overline{\\Delta T}} = 0.0370\\,\\mathrm{Re}_L^{4/5}\\mathrm{Pr}^{1/3}',
  inputs: [ReInput, PrInput],
  outputs: fluxOutputs,
  ranges: [turbulentRe, turbulentPr],
  uncertainty: { fraction: 0.15, note: 'Common practice for turbulent flat-plate correlations (no figure stated by the sources).' },
  source:
    'Kays, W.M., Crawford, M.E. & Weigand, B., Convective Heat and Mass Transfer, 4th ed. (2005), turbulent constant-heat-rate plate; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 7.46. Average by integrating ΔT(x) (ours)',
  wallConditions: ['flux'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(turbulentUniformFlux, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    // Kays & Crawford: Nu_x = 0.0308 Re_x^0.8 Pr^⅓ for uniform q″.
    const Nu_x = 0.0308 * Re ** 0.8 * Math.cbrt(Pr);
    const Cf_x = turbulentCf_x(Re);
    return { outputs: { Nu: 1.2 * Nu_x, Nu_x, Cf: Cf_x / 0.8, Cf_x }, flags: rangeFlags(turbulentUniformFlux.ranges, input.values) };
  },
};

const unheatedOutputs: OutputSpec[] = [
  {
    name: 'Nu',
    description: 'h̄L/k with h̄ averaged over the whole plate 0..L (the unheated part carries no heat), so heat rate = h̄·L·width·ΔT',
    unit: '1',
  },
  { name: 'Nu_heated', description: 'h̄L/k with h̄ averaged over the heated part ξ..L only (as the source states it)', unit: '1' },
  { name: 'Nu_x', description: 'local Nusselt number at x = L', unit: '1' },
  { name: 'Cf', description: 'average skin-friction coefficient (the velocity layer does not see the heating)', unit: '1' },
  { name: 'Cf_x', description: 'local skin-friction coefficient at x = L', unit: '1' },
];

/**
 * Nu with an unheated starting length ξ before an isothermal section. Local: Nu_x(0)·[1 − (ξ/x)^b]^(−c);
 * average over ξ..L (Ameel 1997): Nu_L(0)·L/(L−ξ)·[1 − (ξ/L)^((p+1)/(p+2))]^(p/(p+1)).
 */
function unheatedStartingLength(ratio: number, p: number, b: number, c: number, Nu_x0: number, Nu0: number) {
  const Nu_x = Nu_x0 / (1 - ratio ** b) ** c;
  const Nu_heated = ratio === 0 ? Nu0 : (Nu0 / (1 - ratio)) * (1 - ratio ** ((p + 1) / (p + 2))) ** (p / (p + 1));
  return { Nu: Nu_heated * (1 - ratio), Nu_heated, Nu_x };
}

function readUnheatedRatio(input: ReturnType<typeof readInputs>): number {
  const ratio = input.number('unheated_length_ratio', 'non-negative');
  if (ratio >= 1) throw new InputError(`flat-plate: unheated_length_ratio must be below 1 (ξ < L), got ${ratio}`);
  return ratio;
}

const unheatedLaminar: Method = {
  id: 'unheated-starting-length',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Unheated starting length, laminar',
  description:
    'Laminar plate unheated from the leading edge to ξ and isothermal beyond. Local Nu_x at x = L from the integral method; the average over the heated part from Ameel (1997). A separate id, unheated-starting-length-turbulent, covers the turbulent layer (its ranges and exponents differ).',
  equation:
    '\\mathrm{Nu}_x = \\frac{0.332\\,\\mathrm{Re}_x^{1/2}\\mathrm{Pr}^{1/3}}{\\left[1-(\\xi/x)^{3/4}\\right]^{1/3}},\\quad \\overline{\\mathrm{Nu}}_{\\xi..L} = 0.664\\,\\mathrm{Re}_L^{1/2}\\mathrm{Pr}^{1/3}\\,\\frac{L}{L-\\xi}\\left[1-(\\xi/L)^{3/4}\\right]^{2/3}',
  inputs: [ReInput, PrInput, unheatedInput],
  outputs: unheatedOutputs,
  ranges: [laminarRe, laminarPr],
  uncertainty: { fraction: 0.1, note: 'Common practice: an integral-method (cubic-profile) result on top of the laminar correlation.' },
  source:
    'Kays, W.M., Crawford, M.E. & Weigand, B., Convective Heat and Mass Transfer, 4th ed. (2005), integral method; average: Ameel, T.A. (1997) Int. Comm. Heat Mass Transfer 24:1113–1120; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.24 and 7.42 (p = 2)',
  wallConditions: ['temperature'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(unheatedLaminar, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const ratio = readUnheatedRatio(input);
    const Nu_x0 = laminarNu_x(Re, Pr);
    const Cf_x = laminarCf_x(Re);
    const nu = unheatedStartingLength(ratio, 2, 3 / 4, 1 / 3, Nu_x0, 2 * Nu_x0);
    return { outputs: { ...nu, Cf: 2 * Cf_x, Cf_x }, flags: rangeFlags(unheatedLaminar.ranges, input.values) };
  },
};

const unheatedTurbulent: Method = {
  id: 'unheated-starting-length-turbulent',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Unheated starting length, turbulent',
  description:
    'Turbulent plate (turbulent from the leading edge) unheated up to ξ and isothermal beyond. Local Nu_x at x = L from the integral method with the 1/7-power profile; the average over the heated part from Ameel (1997).',
  equation:
    '\\mathrm{Nu}_x = \\frac{0.0296\\,\\mathrm{Re}_x^{4/5}\\mathrm{Pr}^{1/3}}{\\left[1-(\\xi/x)^{9/10}\\right]^{1/9}},\\quad \\overline{\\mathrm{Nu}}_{\\xi..L} = 0.037\\,\\mathrm{Re}_L^{4/5}\\mathrm{Pr}^{1/3}\\,\\frac{L}{L-\\xi}\\left[1-(\\xi/L)^{9/10}\\right]^{8/9}',
  inputs: [ReInput, PrInput, unheatedInput],
  outputs: unheatedOutputs,
  ranges: [turbulentRe, turbulentPr],
  uncertainty: { fraction: 0.15, note: 'Common practice for turbulent flat-plate correlations.' },
  source:
    'Kays, W.M., Crawford, M.E. & Weigand, B., Convective Heat and Mass Transfer, 4th ed. (2005), integral method; average: Ameel, T.A. (1997) Int. Comm. Heat Mass Transfer 24:1113–1120; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.37 and 7.42 (p = 8)',
  wallConditions: ['temperature'],
  version: 2,
  evaluate(raw) {
    const input = readInputs(unheatedTurbulent, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const ratio = readUnheatedRatio(input);
    const Nu_x0 = turbulentNu_x(Re, Pr);
    const Cf_x = turbulentCf_x(Re);
    const nu = unheatedStartingLength(ratio, 8, 9 / 10, 1 / 9, Nu_x0, Nu_x0 / 0.8);
    return { outputs: { ...nu, Cf: Cf_x / 0.8, Cf_x }, flags: rangeFlags(unheatedTurbulent.ranges, input.values) };
  },
};

export const flatPlateMethods: Method[] = [
  laminar,
  churchillOzoe,
  turbulent,
  mixed,
  laminarUniformFlux,
  turbulentUniformFlux,
  unheatedLaminar,
  unheatedTurbulent,
];
