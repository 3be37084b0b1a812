// Internal flow in a smooth circular pipe. Re, Nu and L/D are on the inner diameter D;
// properties at the bulk (mean) temperature, except μ_s at the surface for Sieder–Tate.
// Every method also gives the Darcy friction factor f (64/Re when laminar, Petukhov when
// turbulent) and, with L_over_D, the loss coefficient K = f·L/D so that Δp = K·½ρu_m².
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type OutputSpec, type ValidityRange } from '../types.js';
import {
  laminarFrictionFactor,
  optionalLengthRatio,
  petukhovFrictionFactor,
  PETUKHOV_RE_RANGE,
  withPressureDrop,
} from './friction.js';
import { readInputs } from './method-inputs.js';
import { laminarEntryFlag, shortTubeFactor, shortTubeInput, turbulentEntryFlag } from './entry-length.js';
import { pipeFrictionFactor, roughnessInput } from './colebrook.js';
import { gnielinskiLaminarMean, intermittency, TRANSITION_RE } from './pipe-transition.js';

const CONFIGURATION = 'pipe';

/** Reynolds number below which pipe flow is taken as laminar (Incropera 7th ed., eq. 8.3). */
export const LAMINAR_RE_LIMIT = 2300;
/** Lower Reynolds bound of the classic fully turbulent correlations (Dittus–Boelter, Sieder–Tate). */
export const TURBULENT_RE_MIN = 1e4;

// Fully developed laminar Nusselt numbers, Shah & London (1978): 3.657 (uniform wall
// temperature, Graetz eigenvalue 3.65679, checked against tests/fixtures/laminar_duct_reference.py)
// and 48/11 = 4.364 (uniform heat flux), at full precision rather than the textbooks' 3.66 / 4.36.
export const LAMINAR_NU = { temperature: 3.65679, flux: 48 / 11 } as const;
export type WallCondition = keyof typeof LAMINAR_NU;

const ReInput: InputSpec = { name: 'Re', description: 'Reynolds number on the inner diameter, u_m D/ν', unit: '1', required: true };
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number at the bulk temperature', unit: '1', required: true };
const lengthInput = (required: boolean): InputSpec => ({
  name: 'L_over_D',
  description: required
    ? 'heated length over inner diameter, L/D'
    : 'tube length over inner diameter, L/D (optional: gives pressure_drop_coefficient and the L/D range check)',
  unit: '1',
  required,
});
const viscosityRatioInput: InputSpec = {
  name: 'viscosity_ratio',
  description: 'μ_b/μ_s, viscosity at the bulk temperature over viscosity at the surface temperature',
  unit: '1',
  required: false,
  default: 1,
};
const wallConditionInput: InputSpec = {
  name: 'wall_condition',
  description: "'temperature' (uniform wall temperature) or 'flux' (uniform wall heat flux)",
  unit: '1',
  type: 'string',
  required: false,
  default: 'temperature',
  choices: ['temperature', 'flux'],
};
const heatingInput: InputSpec = {
  name: 'heating',
  description: 'true when the wall heats the fluid (T_s > T_m), false when it cools it',
  unit: '1',
  type: 'boolean',
  required: false,
  default: true,
};

const outputs = (frictionNote: string): OutputSpec[] => [
  { name: 'Nu', description: 'Nusselt number on D, hD/k', unit: '1' },
  { name: 'f', description: `Darcy friction factor, ${frictionNote}`, unit: '1' },
  { name: 'pressure_drop_coefficient', description: 'K = f·L/D, so that Δp = K·½ρu_m² (only when L_over_D is given)', unit: '1' },
];
const laminarOutputs = outputs('64/Re (Hagen–Poiseuille, fully developed; the entry region adds to it)');
const turbulentOutputs = outputs('Petukhov (0.790 ln Re − 1.64)^−2 for smooth tubes, fitted for 3000 ≤ Re ≤ 5e6; Colebrook with relative_roughness');
/** Smooth-tube correlations: a rough wall raises h by more than they know (gnielinski takes the rough f). */
const smoothOnly: ValidityRange = { input: 'relative_roughness', max: 0, note: 'smooth tubes; f follows the roughness (Colebrook), Nu does not: use gnielinski' };
const optionalRoughness = (input: { values: Record<string, unknown>; number(name: string, domain?: 'non-negative'): number }) =>
  input.values.relative_roughness === undefined ? undefined : input.number('relative_roughness', 'non-negative');

const laminarRe: ValidityRange = { input: 'Re', max: LAMINAR_RE_LIMIT, note: 'laminar pipe flow' };
const turbulentRe: ValidityRange = { input: 'Re', min: TURBULENT_RE_MIN, note: 'fully turbulent flow' };
const optionalPrInput: InputSpec = {
  name: 'Pr',
  description: 'Prandtl number at the bulk temperature (optional: with L_over_D it gives the thermal entry-length check)',
  unit: '1',
  required: false,
};

/**
 * A turbulent method's Nu with the optional short-tube factor, and its entry-region flag
 * (flagged below L/D = 10 unless the factor is applied).
 */
function turbulentLength(input: { values: Record<string, unknown>; boolean(name: string): boolean }, Nu: number, L_over_D: number | undefined) {
  const corrected = input.boolean('short_tube_correction');
  if (corrected && L_over_D === undefined) throw new InputError('short_tube_correction needs L_over_D');
  const flag = turbulentEntryFlag(L_over_D, corrected);
  return { Nu: corrected ? Nu * shortTubeFactor(L_over_D!) : Nu, flags: flag ? [flag] : [] };
}



const laminarDeveloped: Method = {
  id: 'laminar-developed',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Fully developed laminar flow (Nu = 3.66 / 4.36)',
  description:
    'Hydrodynamically and thermally fully developed laminar flow, constant properties. Nu = 3.66 for a uniform wall temperature, 4.36 for a uniform wall heat flux; independent of Re and Pr. Flagged entry-region where the tube is shorter than the entry length (0.05·Re·D hydrodynamic, 0.05·Re·Pr·D thermal): use hausen or sieder-tate-laminar there.',
  equation:
    '\\mathrm{Nu}_D = 3.66\\ (T_s = \\text{const}),\\quad \\mathrm{Nu}_D = \\tfrac{48}{11} = 4.36\\ (q_s\'\' = \\text{const}),\\quad f = 64/\\mathrm{Re}_D',
  inputs: [ReInput, wallConditionInput, lengthInput(false), optionalPrInput],
  outputs: laminarOutputs,
  ranges: [laminarRe, { input: 'L_over_D', note: 'fully developed: flagged entry-region where L/D < 0.05·Re·max(1, Pr)' }],
  uncertainty: {
    fraction: 0.1,
    note: 'Exact for constant properties and fully developed flow (checked against tests/fixtures/laminar_duct_reference.py); ±10 % for real tubes, where properties vary, is common practice.',
  },
  source:
    'Graetz, L. (1883) Ann. Phys. 18:79–94 (uniform wall temperature); Shah, R.K. & London, A.L. (1978) Laminar Flow Forced Convection in Ducts, Academic Press (3.657 and 4.364); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §8.4.1',
  version: 2,
  evaluate(raw) {
    const input = readInputs(laminarDeveloped, raw);
    const Re = input.number('Re');
    const Nu: number = LAMINAR_NU[input.string('wall_condition') as WallCondition];
    const LD = optionalLengthRatio(input);
    const entry = laminarEntryFlag(Re, input.values.Pr === undefined ? undefined : input.number('Pr'), LD);
    return { outputs: withPressureDrop(Nu, laminarFrictionFactor(Re), LD), flags: [...rangeFlags(laminarDeveloped.ranges, input.values), ...(entry ? [entry] : [])] };
  },
};

// Hausen, H. (1943): average Nu over a thermal entry length, uniform wall temperature, parabolic velocity.
export function hausenNusselt(Gz: number): number {
  return 3.66 + (0.0668 * Gz) / (1 + 0.04 * Gz ** (2 / 3));
}

const hausen: Method = {
  id: 'hausen',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Hausen (laminar thermal entry, uniform wall temperature)',
  description:
    'Average Nu over a heated length L in laminar flow with a fully developed velocity profile (thermal entry problem) and uniform wall temperature, with Gz = Re·Pr/(L/D). Tends to 3.66 for long tubes. It also serves the combined entry when Pr ≳ 5, where the velocity develops much faster than the temperature.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = 3.66 + \\frac{0.0668\\,\\mathrm{Gz}_D}{1 + 0.04\\,\\mathrm{Gz}_D^{2/3}},\\quad \\mathrm{Gz}_D = \\frac{\\mathrm{Re}_D\\mathrm{Pr}}{L/D}',
  inputs: [ReInput, PrInput, lengthInput(true)],
  outputs: [...laminarOutputs, { name: 'Gz', description: 'Graetz number Re·Pr/(L/D)', unit: '1' }],
  ranges: [laminarRe],
  wallConditions: ['temperature'],
  uncertainty: {
    fraction: 0.12,
    note: 'Against the exact Graetz solution (tests/fixtures/graetz_reference.py): within 2 % for Gz ≤ 100, up to 12 % high near Gz = 3000; real-tube property effects come on top.',
  },
  source:
    'Hausen, H. (1943) Z. VDI Beih. Verfahrenstech. 4:91–98; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §8.4.2',
  version: 1,
  evaluate(raw) {
    const input = readInputs(hausen, raw);
    const Re = input.number('Re');
    const Gz = (Re * input.number('Pr')) / input.number('L_over_D');
    const out = withPressureDrop(hausenNusselt(Gz), laminarFrictionFactor(Re), optionalLengthRatio(input));
    return { outputs: { ...out, Gz }, flags: rangeFlags(hausen.ranges, input.values) };
  },
};

// Sieder, E.N. & Tate, G.E. (1936): laminar combined entry, Nu = 1.86 (Re Pr D/L)^⅓ (μ_b/μ_s)^0.14.
export function siederTateLaminarNusselt(Gz: number, viscosityRatio: number): number {
  return 1.86 * Math.cbrt(Gz) * viscosityRatio ** 0.14;
}

const siederTateLaminar: Method = {
  id: 'sieder-tate-laminar',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Sieder–Tate laminar (combined entry)',
  description:
    'Average Nu over a short tube in laminar flow with both velocity and temperature developing, uniform wall temperature, with the viscosity correction (μ_b/μ_s)^0.14. Valid only while (Gz)^⅓(μ_b/μ_s)^0.14 ≥ 2: a longer tube tends to the fully developed 3.66, and such a point is flagged out-of-range:L_over_D.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = 1.86\\left(\\frac{\\mathrm{Re}_D\\mathrm{Pr}}{L/D}\\right)^{1/3}\\left(\\frac{\\mu}{\\mu_s}\\right)^{0.14}',
  inputs: [ReInput, PrInput, lengthInput(true), viscosityRatioInput],
  outputs: [...laminarOutputs, { name: 'Gz', description: 'Graetz number Re·Pr/(L/D)', unit: '1' }],
  ranges: [
    laminarRe,
    { input: 'Pr', min: 0.48, max: 16700 },
    { input: 'viscosity_ratio', min: 0.0044, max: 9.75 },
    { input: 'L_over_D', note: 'short tubes only: flagged when (Gz)^⅓(μ_b/μ_s)^0.14 < 2' },
  ],
  wallConditions: ['temperature'],
  uncertainty: { fraction: 0.2, note: 'Common practice; the sources state no figure.' },
  source:
    'Sieder, E.N. & Tate, G.E. (1936) Ind. Eng. Chem. 28:1429–1435; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 6th ed., §8.4.2 (edition from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(siederTateLaminar, raw);
    const Re = input.number('Re');
    const Gz = (Re * input.number('Pr')) / input.number('L_over_D');
    const ratio = input.number('viscosity_ratio');
    const flags = rangeFlags(siederTateLaminar.ranges, input.values);
    if (Math.cbrt(Gz) * ratio ** 0.14 < 2 && !flags.includes('out-of-range:L_over_D')) flags.push('out-of-range:L_over_D');
    const out = withPressureDrop(siederTateLaminarNusselt(Gz, ratio), laminarFrictionFactor(Re), optionalLengthRatio(input));
    return { outputs: { ...out, Gz }, flags };
  },
};

// Dittus, F.W. & Boelter, L.M.K. (1930), in McAdams' form: Nu = 0.023 Re^0.8 Pr^n, n = 0.4 heating, 0.3 cooling.
export function dittusBoelterNusselt(Re: number, Pr: number, heating: boolean): number {
  return 0.023 * Re ** 0.8 * Pr ** (heating ? 0.4 : 0.3);
}

const dittusBoelter: Method = {
  id: 'dittus-boelter',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Dittus–Boelter (turbulent, fully developed)',
  description:
    'Fully developed turbulent flow in a smooth tube, moderate wall-to-bulk temperature differences. Exponent n = 0.4 when the fluid is heated (heating = true, the default) and 0.3 when it is cooled.',
  equation: '\\mathrm{Nu}_D = 0.023\\,\\mathrm{Re}_D^{4/5}\\mathrm{Pr}^{n},\\quad n = 0.4\\ (T_s > T_m),\\ 0.3\\ (T_s < T_m)',
  inputs: [ReInput, PrInput, heatingInput, lengthInput(false), shortTubeInput, roughnessInput],
  outputs: turbulentOutputs,
  ranges: [turbulentRe, { input: 'Pr', min: 0.6, max: 160 }, { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D = 10' }, smoothOnly],
  uncertainty: {
    fraction: 0.25,
    note: 'Incropera et al. (§8.5): errors as large as 25 % (wording from memory).',
  },
  source:
    'Dittus, F.W. & Boelter, L.M.K. (1930) Univ. Calif. Publ. Eng. 2:443–461 (reprinted Int. Comm. Heat Mass Transfer 12 (1985) 3–22); the 0.023 coefficient is McAdams\' restatement (Winterton, R.H.S. (1998) Int. J. Heat Mass Transfer 41:809–810); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 8.60',
  version: 2,
  evaluate(raw) {
    const input = readInputs(dittusBoelter, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const LD = optionalLengthRatio(input);
    const { Nu, flags } = turbulentLength(input, dittusBoelterNusselt(Re, Pr, input.boolean('heating')), LD);
    const friction = pipeFrictionFactor(Re, optionalRoughness(input), false);
    return { outputs: withPressureDrop(Nu, friction.f, LD), flags: [...rangeFlags(dittusBoelter.ranges, input.values), ...flags, ...friction.flags] };
  },
};

// Sieder, E.N. & Tate, G.E. (1936): turbulent, Nu = 0.027 Re^0.8 Pr^⅓ (μ_b/μ_s)^0.14.
export function siederTateNusselt(Re: number, Pr: number, viscosityRatio: number): number {
  return 0.027 * Re ** 0.8 * Math.cbrt(Pr) * viscosityRatio ** 0.14;
}

const siederTate: Method = {
  id: 'sieder-tate',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Sieder–Tate (turbulent, large property variation)',
  description:
    'Fully developed turbulent flow in a smooth tube where viscosity varies strongly between wall and bulk (oils); the (μ_b/μ_s)^0.14 factor carries the correction. All properties except μ_s at the bulk temperature.',
  equation: '\\mathrm{Nu}_D = 0.027\\,\\mathrm{Re}_D^{4/5}\\mathrm{Pr}^{1/3}\\left(\\frac{\\mu}{\\mu_s}\\right)^{0.14}',
  inputs: [ReInput, PrInput, viscosityRatioInput, lengthInput(false), shortTubeInput, roughnessInput],
  outputs: turbulentOutputs,
  ranges: [turbulentRe, { input: 'Pr', min: 0.7, max: 16700 }, { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D = 10' }, smoothOnly],
  uncertainty: {
    fraction: 0.25,
    note: 'Incropera et al. (§8.5): errors as large as 25 % (wording from memory).',
  },
  source:
    'Sieder, E.N. & Tate, G.E. (1936) Ind. Eng. Chem. 28:1429–1435; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 8.61',
  version: 2,
  evaluate(raw) {
    const input = readInputs(siederTate, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const LD = optionalLengthRatio(input);
    const { Nu, flags } = turbulentLength(input, siederTateNusselt(Re, Pr, input.number('viscosity_ratio')), LD);
    const friction = pipeFrictionFactor(Re, optionalRoughness(input), false);
    return { outputs: withPressureDrop(Nu, friction.f, LD), flags: [...rangeFlags(siederTate.ranges, input.values), ...flags, ...friction.flags] };
  },
};

// Gnielinski, V. (1976): Nu = (f/8)(Re − 1000)Pr / [1 + 12.7 (f/8)^½ (Pr^⅔ − 1)], f from Petukhov.
export function gnielinskiNusselt(Re: number, Pr: number, f: number): number {
  // Below Re = 1000 the (Re − 1000) factor makes Nu ≤ 0: no physical answer, so refuse.
  if (!(Re > 1000)) throw new InputError(`Gnielinski correlation is undefined for Re ≤ 1000 (got ${Re}); its range is 3000 ≤ Re ≤ 5e6`);
  const f8 = f / 8;
  return (f8 * (Re - 1000) * Pr) / (1 + 12.7 * Math.sqrt(f8) * (Pr ** (2 / 3) - 1));
}

/** The Gnielinski validity ranges, shared with the duct method (Re on D or D_h). */
export const gnielinskiRanges: ValidityRange[] = [
  { input: 'Re', min: PETUKHOV_RE_RANGE.min, max: PETUKHOV_RE_RANGE.max, note: 'transitional and turbulent flow' },
  { input: 'Pr', min: 0.5, max: 2000 },
];

const gnielinski: Method = {
  id: 'gnielinski',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Gnielinski (transitional and turbulent; smooth or rough tubes)',
  description:
    "Transitional and turbulent flow in a tube. Re ≥ 1e4: Gnielinski's correlation with the Petukhov friction factor for a smooth tube, or the Colebrook f when relative_roughness is given (the rough-tube use the source allows). 2300 < Re < 1e4: Gnielinski's intermittency blend Nu = (1 − γ)·Nu_lam(2300) + γ·Nu_turb(1e4), γ = (Re − 2300)/7700, with his laminar composite (fully developed 3.66 / 4.354 by wall_condition; with short_tube_correction the mean over L/D) and this method's own turbulent value at Re = 1e4, so there is no gap between the laminar and turbulent ranges. Below Re = 2300 his laminar composite, flagged.",
  equation:
    '\\mathrm{Nu}_D = \\frac{(f/8)(\\mathrm{Re}_D - 1000)\\mathrm{Pr}}{1 + 12.7\\,(f/8)^{1/2}\\left(\\mathrm{Pr}^{2/3} - 1\\right)}\\ (\\mathrm{Re}_D \\ge 10^4),\\quad f = (0.790\\ln\\mathrm{Re}_D - 1.64)^{-2}\\ \\text{or}\\ \\frac{1}{\\sqrt f} = -2\\log_{10}\\left(\\frac{\\varepsilon/D}{3.7} + \\frac{2.51}{\\mathrm{Re}_D\\sqrt f}\\right);\\quad \\mathrm{Nu}_D = (1 - \\gamma)\\,\\mathrm{Nu}_{lam,2300} + \\gamma\\,\\mathrm{Nu}_{turb,10^4},\\ \\gamma = \\frac{\\mathrm{Re}_D - 2300}{10^4 - 2300}\\ (2300 < \\mathrm{Re}_D < 10^4)',
  inputs: [ReInput, PrInput, lengthInput(false), shortTubeInput, roughnessInput, wallConditionInput],
  outputs: [
    ...outputs('Petukhov for smooth tubes, Colebrook (1939) with relative_roughness; 64/Re below Re = 2300'),
    { name: 'intermittency', description: 'γ of the transition blend (2300 < Re < 1e4 only)', unit: '1' },
  ],
  ranges: [
    { input: 'Re', min: TRANSITION_RE.laminar, max: PETUKHOV_RE_RANGE.max, note: 'transitional (blend) and turbulent flow' },
    { input: 'Pr', min: 0.5, max: 2000 },
    { input: 'relative_roughness', max: 0.05, note: 'Colebrook; flagged too where f/f_smooth > 4, past which roughness stops raising h (Norris 1971, from memory)' },
    { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D = 10 (in the blend: below the laminar entry length at Re = 2300) unless short_tube_correction' },
  ],
  uncertainty: {
    fraction: 0.1,
    note: 'Incropera et al. (§8.5): errors reduced to less than 10 % compared with Dittus–Boelter (wording from memory); the transition range and rough walls are less certain.',
  },
  source:
    "Gnielinski, V. (1976) Int. Chem. Eng. 16:359–368, with Petukhov, B.S. (1970) Adv. Heat Transfer 6:503–564 (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 8.62 and 8.21; the Moody/Colebrook f for rough tubes as Incropera allows there, from memory); Colebrook, C.F. (1939) J. Inst. Civil Eng. 11:133–156; transition: Gnielinski, V. (1995) Forsch. Ingenieurwes. 61:240–248 and (2013) On heat transfer in tubes, Int. J. Heat Mass Transfer 63:134–140, with his laminar composite of VDI Heat Atlas, 2nd ed. (2010), ch. G1 (from memory)",
  version: 3,
  evaluate(raw) {
    const input = readInputs(gnielinski, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const LD = optionalLengthRatio(input);
    const roughness = optionalRoughness(input);
    const condition = input.string('wall_condition') as WallCondition;
    const ranges = rangeFlags(gnielinski.ranges, input.values);
    if (Re >= TRANSITION_RE.turbulent) {
      const friction = pipeFrictionFactor(Re, roughness, true);
      const { Nu, flags } = turbulentLength(input, gnielinskiNusselt(Re, Pr, friction.f), LD);
      return { outputs: withPressureDrop(Nu, friction.f, LD), flags: unique([...ranges, ...flags, ...friction.flags]) };
    }
    // The laminar part of the blend is fully developed unless the short-tube mean is asked for.
    const corrected = input.boolean('short_tube_correction');
    if (corrected && LD === undefined) throw new InputError('short_tube_correction needs L_over_D');
    const laminarEntry = corrected ? undefined : laminarEntryFlag(TRANSITION_RE.laminar, Pr, LD);
    if (Re <= TRANSITION_RE.laminar) {
      const Nu = gnielinskiLaminarMean(Re, Pr, corrected ? LD : undefined, condition);
      const entry = corrected ? undefined : laminarEntryFlag(Re, Pr, LD);
      return { outputs: withPressureDrop(Nu, laminarFrictionFactor(Re), LD), flags: unique([...ranges, ...(entry ? [entry] : [])]) };
    }
    const atTurbulent = pipeFrictionFactor(TRANSITION_RE.turbulent, roughness, true);
    const turbulent = turbulentLength(input, gnielinskiNusselt(TRANSITION_RE.turbulent, Pr, atTurbulent.f), LD).Nu;
    const laminar = gnielinskiLaminarMean(TRANSITION_RE.laminar, Pr, corrected ? LD : undefined, condition);
    const g = intermittency(Re);
    const friction = pipeFrictionFactor(Re, roughness, false);
    const Nu = (1 - g) * laminar + g * turbulent;
    const flags = [...ranges, ...atTurbulent.flags, ...friction.flags, ...(laminarEntry ? [laminarEntry] : [])];
    return { outputs: { ...withPressureDrop(Nu, friction.f, LD), intermittency: g }, flags: unique(flags) };
  },
};

const unique = (flags: string[]) => [...new Set(flags)];

export const pipeMethods: Method[] = [laminarDeveloped, hausen, siederTateLaminar, dittusBoelter, siederTate, gnielinski];
