// Internal flow in a concentric annulus, inner diameter D_i and outer D_o, one wall heated
// and the other insulated. Re, Nu and L/D are on the hydraulic diameter D_h = D_o − D_i;
// properties at the bulk temperature; Nu is the heated wall's, h = q″/(T_wall − T_m).
import { MonotoneCubic } from '../fluids/monotoneCubic.js';
import { rangeFlags } from '../ranges.js';
import { InputError, type InputSpec, type Method, type OutputSpec, type ValidityRange } from '../types.js';
import { laminarEntryFlag, shortTubeFactor, shortTubeInput, turbulentEntryFlag } from './entry-length.js';
import { optionalLengthRatio, withPressureDrop } from './friction.js';
import { readInputs, type MethodInputs } from './method-inputs.js';
import { LAMINAR_RE_LIMIT, type WallCondition } from './pipe.js';

const CONFIGURATION = 'annulus';

export type HeatedWall = 'inner' | 'outer';

/** D_i/D_o as a method input: 0 < a < 1 (a → 0 is a tube, a → 1 a parallel-plate channel). */
export function readDiameterRatio(input: MethodInputs): number {
  const a = input.number('diameter_ratio');
  if (!(a < 1)) throw new InputError(`${CONFIGURATION}: diameter_ratio is D_i/D_o and must be < 1, got ${a}`);
  return a;
}

// Laminar flow between concentric cylinders, exact (e.g. White, Viscous Fluid Flow, 3rd ed.,
// eq. 3-49; Shah & London 1978 ch. XII): Darcy f·Re on D_h = 64(1−a)²/[1 + a² − (1 − a²)/ln(1/a)].
export function annulusLaminarFRe(a: number): number {
  return (64 * (1 - a) ** 2) / (1 + a * a - (1 - a * a) / Math.log(1 / a));
}

// Fully developed laminar Nusselt numbers of the heated wall, the other wall insulated.
// Uniform wall temperature: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.,
// Table 8.2 (after Kays & Perkins, Handbook of Heat Transfer, 1973). Uniform heat flux: the
// Nu_ii and Nu_oo columns of Incropera Table 8.3 (Kays & Leung 1963; Lundberg, McCuen &
// Reynolds 1963). Values recalled from memory; each agrees at its printed precision with the
// SciPy solution in tests/fixtures/annulus_reference.py. a = 0 is the plain tube (outer wall).
const TABLE_8_2 = {
  ratio: [0.05, 0.1, 0.25, 0.5, 1],
  inner: [17.46, 11.56, 7.37, 5.74, 4.86],
  outer: [4.06, 4.11, 4.23, 4.43, 4.86],
  tube: 3.66,
};
const TABLE_8_3 = {
  ratio: [0.05, 0.1, 0.2, 0.4, 0.6, 0.8, 1],
  inner: [17.81, 11.91, 8.499, 6.583, 5.912, 5.58, 5.385],
  outer: [4.792, 4.834, 4.883, 4.979, 5.099, 5.24, 5.385],
  tube: 4.364,
};
/** Smallest tabulated D_i/D_o for the inner wall: below it Nu_i grows without bound. */
export const LAMINAR_ANNULUS_MIN_RATIO = TABLE_8_2.ratio[0];

// Interpolation coordinates chosen against the exact solution (tests/fixtures/annulus_reference.py):
// the inner wall's Nu_i ~ 1/(a ln(1/a)) is nearly a power law, so monotone cubics in (ln a, ln Nu)
// stay within 0.2 %; the outer wall's Nu_o rises like √a from the tube value, so monotone
// cubics in (√a, Nu) stay within 0.1 % for a ≥ 0.05 and 0.8 % at a = 0.02.
function innerCurve(table: typeof TABLE_8_2) {
  const x = table.ratio.map(Math.log);
  const y = table.inner.map(Math.log);
  const cubic = new MonotoneCubic(x, y);
  // Below the table, the first segment's power law: flagged, and within 7 % at a = 0.02.
  const slope = (y[1] - y[0]) / (x[1] - x[0]);
  return (a: number) => Math.exp(a >= table.ratio[0] ? cubic.value(Math.log(a)) : y[0] + slope * (Math.log(a) - x[0]));
}
function outerCurve(table: typeof TABLE_8_2) {
  const cubic = new MonotoneCubic([0, ...table.ratio.map(Math.sqrt)], [table.tube, ...table.outer]);
  return (a: number) => cubic.value(Math.sqrt(a));
}
const laminarCurves = {
  temperature: { inner: innerCurve(TABLE_8_2), outer: outerCurve(TABLE_8_2) },
  flux: { inner: innerCurve(TABLE_8_3), outer: outerCurve(TABLE_8_3) },
};

/** Fully developed laminar Nu of the heated wall, on D_h, interpolated in the published tables. */
export function laminarAnnulusNusselt(a: number, wall: HeatedWall, condition: WallCondition): number {
  if (!(a > 0 && a < 1)) throw new InputError(`diameter_ratio D_i/D_o must be in (0, 1), got ${a}`);
  return laminarCurves[condition][wall](a);
}

// Gnielinski, V. (2009) Heat Transfer Eng. 30(6):431–436, restated in VDI Heat Atlas, 2nd ed.
// (2010), ch. G2 §3 (from memory): turbulent flow in concentric annuli, one wall heated.
export interface AnnulusTurbulentResult {
  Nu: number;
  /** Darcy friction factor ξ = (1.8 log10 Re* − 1.5)^−2 on Re*. */
  f: number;
  /** The heated-wall factor F_ann. */
  annulus_factor: number;
  /** Re* = Re [(1 + a²) ln a + 1 − a²]/[(1 − a)² ln a], the laminar-equivalent Reynolds number. */
  Re_star: number;
}

/** The ratio Re* / Re: 1 for the tube (a → 0), 2/3 for the parallel-plate limit (a → 1). */
export function annulusReynoldsRatio(a: number): number {
  if (a === 0) return 1;
  // Near a = 1 the closed form cancels; its series is 2/3 + O((1 − a)²) (the linear term vanishes).
  if (1 - a < 1e-4) return 2 / 3;
  const ln = Math.log(a);
  return ((1 + a * a) * ln + (1 - a * a)) / ((1 - a) ** 2 * ln);
}

/** F_ann for the heated wall: 0.75 a^−0.17 (inner), 0.9 − 0.15 a^0.6 (outer); both 0.75 at a = 1. */
export function annulusWallFactor(a: number, wall: HeatedWall): number {
  return wall === 'inner' ? 0.75 * a ** -0.17 : 0.9 - 0.15 * a ** 0.6;
}

/**
 * Nu = (ξ/8) Re Pr / [k1 + 12.7 (ξ/8)^½ (Pr^⅔ − 1)] · [1 + (D_h/L)^⅔] · F_ann,
 * k1 = 1.07 + 900/Re − 0.63/(1 + 10 Pr). `shortTube` L/D_h for the entry factor (undefined: fully developed).
 */
export function gnielinskiAnnulus(Re: number, Pr: number, a: number, wall: HeatedWall, shortTube?: number): AnnulusTurbulentResult {
  const Re_star = Re * annulusReynoldsRatio(a);
  const root = 1.8 * Math.log10(Re_star) - 1.5;
  // Konakov's friction law has a pole at Re* ≈ 6.8: far outside any range, and meaningless there.
  if (!(root > 0)) throw new InputError(`Gnielinski's annulus correlation is undefined for Re* ≤ 6.8 (Re = ${Re})`);
  const f = root ** -2;
  const f8 = f / 8;
  const k1 = 1.07 + 900 / Re - 0.63 / (1 + 10 * Pr);
  const developed = (f8 * Re * Pr) / (k1 + 12.7 * Math.sqrt(f8) * (Pr ** (2 / 3) - 1));
  const entry = shortTube === undefined ? 1 : shortTubeFactor(shortTube);
  const annulus_factor = annulusWallFactor(a, wall);
  return { Nu: developed * entry * annulus_factor, f, annulus_factor, Re_star };
}

// ---------------------------------------------------------------- method data

const ReInput: InputSpec = {
  name: 'Re',
  description: 'Reynolds number on the hydraulic diameter, u_m D_h/ν with D_h = D_o − D_i',
  unit: '1',
  required: true,
};
const PrInput: InputSpec = { name: 'Pr', description: 'Prandtl number at the bulk temperature', unit: '1', required: true };
const ratioInput: InputSpec = {
  name: 'diameter_ratio',
  description: 'D_i/D_o, inner over outer diameter (0 < a < 1)',
  unit: '1',
  required: true,
};
const heatedWallInput: InputSpec = {
  name: 'heated_wall',
  description: "'inner' (heated inner wall, outer insulated: a heater rod) or 'outer' (heated outer wall, inner insulated)",
  unit: '1',
  type: 'string',
  required: false,
  default: 'inner',
  choices: ['inner', 'outer'],
};
const optionalPrInput: InputSpec = {
  name: 'Pr',
  description: 'Prandtl number at the bulk temperature (optional: with L_over_D it gives the thermal entry-length check)',
  unit: '1',
  required: false,
};
const lengthInput = (note: string): InputSpec => ({
  name: 'L_over_D',
  description: `annulus length over hydraulic diameter, L/D_h (optional: ${note})`,
  unit: '1',
  required: false,
});
const outputs = (frictionNote: string): OutputSpec[] => [
  { name: 'Nu', description: 'Nusselt number of the heated wall on D_h, hD_h/k, h = q″/(T_wall − T_m)', unit: '1' },
  { name: 'f', description: `Darcy friction factor on D_h, ${frictionNote}`, unit: '1' },
  { name: 'pressure_drop_coefficient', description: 'K = f·L/D_h, so that Δp = K·½ρu_m² (only when L_over_D is given)', unit: '1' },
];

const laminarAnnulus: Method = {
  id: 'laminar-annulus',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Fully developed laminar flow in a concentric annulus (one wall heated)',
  description:
    "Hydrodynamically and thermally fully developed laminar flow, constant properties, one wall heated and the other insulated. Nu of the heated wall interpolated by D_i/D_o in the published tables: uniform wall temperature (Table 8.2) or uniform heat flux (Table 8.3, Nu_ii and Nu_oo). The inner wall's table starts at D_i/D_o = 0.05: below it the value is a flagged power-law extension. f·Re is the exact annular Poiseuille solution.",
  equation:
    '\\mathrm{Nu}_{D_h} = \\mathrm{Nu}_{i}(D_i/D_o)\\ \\text{or}\\ \\mathrm{Nu}_{o}(D_i/D_o),\\quad f\\,\\mathrm{Re}_{D_h} = \\frac{64\\,(1-a)^2}{1 + a^2 - (1 - a^2)/\\ln(1/a)},\\quad a = \\frac{D_i}{D_o},\\ D_h = D_o - D_i',
  inputs: [
    ReInput,
    ratioInput,
    heatedWallInput,
    {
      name: 'wall_condition',
      description: "'temperature' (uniform heated-wall temperature) or 'flux' (uniform heat flux at the heated wall)",
      unit: '1',
      type: 'string',
      required: false,
      default: 'temperature',
      choices: ['temperature', 'flux'],
    },
    lengthInput('gives pressure_drop_coefficient and the entry-length check'),
    optionalPrInput,
  ],
  outputs: [
    ...outputs('exact laminar (f·Re)/Re (fully developed; the entry region adds to it)'),
    { name: 'f_Re', description: 'Darcy friction factor times Re on D_h (Poiseuille number)', unit: '1' },
  ],
  ranges: [
    { input: 'Re', max: LAMINAR_RE_LIMIT, note: 'laminar flow, Re on D_h' },
    { input: 'diameter_ratio', min: LAMINAR_ANNULUS_MIN_RATIO, note: 'heated inner wall only: the first row of the table' },
    { input: 'L_over_D', note: 'fully developed: flagged entry-region where L/D_h < 0.05·Re·max(1, Pr)' },
  ],
  uncertainty: {
    fraction: 0.1,
    note: 'Table values are exact solutions for constant properties (interpolation within 0.2 %, tests/fixtures/annulus_reference.py); ±10 % for real annuli, where properties vary, is common practice.',
  },
  source:
    'Kays, W.M. & Perkins, H.C. (1973) in Handbook of Heat Transfer, ch. 7, McGraw-Hill (uniform wall temperature); Kays, W.M. & Leung, E.Y. (1963) Int. J. Heat Mass Transfer 6:537–557 and Lundberg, R.E., McCuen, P.A. & Reynolds, W.C. (1963) Int. J. Heat Mass Transfer 6:495–529 (uniform flux); as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., Tables 8.2 and 8.3 (table numbers from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(laminarAnnulus, raw);
    const Re = input.number('Re');
    const a = readDiameterRatio(input);
    const wall = input.string('heated_wall') as HeatedWall;
    const Nu = laminarAnnulusNusselt(a, wall, input.string('wall_condition') as WallCondition);
    const fRe = annulusLaminarFRe(a);
    const [reRange, ratioRange] = laminarAnnulus.ranges;
    const flags = rangeFlags(wall === 'inner' ? [reRange, ratioRange] : [reRange], input.values);
    const LD = optionalLengthRatio(input);
    const entry = laminarEntryFlag(Re, input.values.Pr === undefined ? undefined : input.number('Pr'), LD);
    if (entry) flags.push(entry);
    return { outputs: { ...withPressureDrop(Nu, fRe / Re, LD), f_Re: fRe }, flags };
  },
};

/** Ranges of Gnielinski's annulus correlation (shared with the one-wall parallel-plate channel). */
export const gnielinskiAnnulusRanges: ValidityRange[] = [
  { input: 'Re', min: 1e4, max: 1e6, note: 'fully turbulent, Re on D_h (from memory)' },
  { input: 'Pr', min: 0.6, max: 1000, note: 'from memory' },
];
const turbulentEntry: ValidityRange = { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D_h = 10 unless short_tube_correction' };

/** Nu with the optional short-tube factor and the entry-region flag, as the pipe methods do. */
export function turbulentChannelLength(input: MethodInputs): { shortTube?: number; flags: string[] } {
  const LD = optionalLengthRatio(input);
  const corrected = input.boolean('short_tube_correction');
  if (corrected && LD === undefined) throw new InputError('short_tube_correction needs L_over_D');
  const flag = turbulentEntryFlag(LD, corrected);
  return { shortTube: corrected ? LD : undefined, flags: flag ? [flag] : [] };
}

const turbulentAnnulus: Method = {
  id: 'turbulent-annulus',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Gnielinski annulus (turbulent, heated inner or outer wall)',
  description:
    "Turbulent flow in a smooth concentric annulus, one wall heated and the other insulated: Gnielinski's tube correlation on D_h = D_o − D_i with the friction factor taken at the laminar-equivalent Reynolds number Re* and his heated-wall factor F_ann (0.75 a^−0.17 inner, 0.9 − 0.15 a^0.6 outer). Fully developed flow; short_tube_correction applies the source's entry factor 1 + (D_h/L)^⅔ (else flagged entry-region below L/D_h = 10). No wall-to-bulk property correction (the factor K of the source is 1).",
  equation:
    '\\mathrm{Nu}_{D_h} = \\frac{(\\xi/8)\\,\\mathrm{Re}\\,\\mathrm{Pr}}{k_1 + 12.7\\sqrt{\\xi/8}\\,(\\mathrm{Pr}^{2/3} - 1)}\\left[1 + \\left(\\frac{D_h}{L}\\right)^{2/3}\\right] F_{ann},\\quad \\xi = (1.8\\log_{10}\\mathrm{Re}^* - 1.5)^{-2},\\quad k_1 = 1.07 + \\frac{900}{\\mathrm{Re}} - \\frac{0.63}{1 + 10\\,\\mathrm{Pr}},\\quad \\mathrm{Re}^* = \\mathrm{Re}\\,\\frac{(1 + a^2)\\ln a + 1 - a^2}{(1 - a)^2 \\ln a},\\quad F_{ann} = 0.75\\,a^{-0.17}\\ (\\text{inner}),\\ 0.9 - 0.15\\,a^{0.6}\\ (\\text{outer})',
  inputs: [ReInput, PrInput, ratioInput, heatedWallInput, lengthInput('gives pressure_drop_coefficient and the entry-region check'), shortTubeInput],
  outputs: [
    ...outputs('ξ = (1.8 log10 Re* − 1.5)^−2 (Konakov, at the laminar-equivalent Re*)'),
    { name: 'Re_star', description: 'laminar-equivalent Reynolds number Re* used for the friction factor', unit: '1' },
    { name: 'annulus_factor', description: 'heated-wall factor F_ann of the source', unit: '1' },
  ],
  ranges: [...gnielinskiAnnulusRanges, turbulentEntry],
  uncertainty: {
    fraction: 0.15,
    note: "Common practice: Gnielinski's tube correlation is ±10 % (Incropera §8.5, from memory); the annulus factor adds the scatter of the annulus data. Agrees with Petukhov & Roizen's (1964) annulus ratios within 12 % (tests).",
  },
  source:
    'Gnielinski, V. (2009) Heat transfer coefficients for turbulent flow in concentric annular ducts, Heat Transfer Eng. 30(6):431–436; as restated in VDI Heat Atlas, 2nd ed. (2010), ch. G2 §3 (section and constants from memory); friction factor Konakov, P.K. (1946)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(turbulentAnnulus, raw);
    const length = turbulentChannelLength(input);
    const r = gnielinskiAnnulus(input.number('Re'), input.number('Pr'), readDiameterRatio(input), input.string('heated_wall') as HeatedWall, length.shortTube);
    return {
      outputs: { ...withPressureDrop(r.Nu, r.f, optionalLengthRatio(input)), Re_star: r.Re_star, annulus_factor: r.annulus_factor },
      flags: [...rangeFlags(gnielinskiAnnulusRanges, input.values), ...length.flags],
    };
  },
};

export const annulusMethods: Method[] = [laminarAnnulus, turbulentAnnulus];
