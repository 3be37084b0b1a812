// Banks of tubes in cross flow (Zukauskas). Re and Nu are on the tube diameter D, and Re on
// the maximum velocity between tubes: Re = V_max D/ν with V_max = maxVelocityRatio(...)·V,
// V the approach velocity. Properties at the mean of inlet and outlet temperatures, Pr_s at
// the surface. Incropera table numbers in `source` are cited from memory of the 7th edition.
import { rangeFlags } from '../ranges.js';
import { InputError, type Method } from '../types.js';
import { rowFor, zukauskasCylinderNu, type PowerLawRow } from './cylinder.js';
import { readInputs } from './method-inputs.js';

export type TubeArrangement = 'aligned' | 'staggered';

/**
 * V_max/V for a bank with transverse pitch S_T and longitudinal pitch S_L (both over D).
 * Aligned: the gap between tubes of a row, S_T − D, so V_max/V = S_T/(S_T − D).
 * Staggered: the diagonal gaps 2(S_D − D), S_D = √(S_L² + (S_T/2)²), carry the flow when they are
 * narrower than S_T − D, i.e. when S_D < (S_T + D)/2; then V_max/V = S_T/(2(S_D − D)).
 * (Incropera et al., 7th ed., §7.6, eqs. 7.60–7.62.)
 */
export function maxVelocityRatio(arrangement: string, ST_over_D: number, SL_over_D: number): number {
  if (arrangement !== 'aligned' && arrangement !== 'staggered') {
    throw new InputError(`tube-bank: arrangement must be 'aligned' or 'staggered', got ${JSON.stringify(arrangement)}`);
  }
  if (!Number.isFinite(ST_over_D) || !(ST_over_D > 1)) {
    throw new InputError(`tube-bank: ST_over_D must be > 1 (tubes of a row would touch), got ${ST_over_D}`);
  }
  if (!Number.isFinite(SL_over_D) || !(SL_over_D > 0)) {
    throw new InputError(`tube-bank: SL_over_D must be > 0, got ${SL_over_D}`);
  }
  const rowGap = ST_over_D - 1;
  if (arrangement === 'aligned') {
    if (SL_over_D < 1) throw new InputError(`tube-bank: aligned rows overlap for SL_over_D < 1, got ${SL_over_D}`);
    return ST_over_D / rowGap;
  }
  const SD = Math.hypot(SL_over_D, ST_over_D / 2);
  if (!(SD > 1)) throw new InputError(`tube-bank: staggered tubes overlap (diagonal pitch S_D/D = ${SD} ≤ 1)`);
  return SD < (ST_over_D + 1) / 2 ? ST_over_D / (2 * (SD - 1)) : ST_over_D / rowGap;
}

interface BankRow extends PowerLawRow {
  /** The band where Zukauskas treats the bank as single tubes. */
  singleTube?: boolean;
}

// Zukauskas (1972) bank constants for N_L ≥ 20, as in Incropera Table 7.5. The staggered
// band 1e3..2e5 has C = 0.35 (S_T/S_L)^⅕ for S_T/S_L < 2 and 0.40 above (set in bankRow).
const BANK_TABLE: Record<TubeArrangement, readonly BankRow[]> = {
  aligned: [
    { ReMin: 10, ReMax: 100, C: 0.8, m: 0.4 },
    { ReMin: 100, ReMax: 1000, C: 0, m: 0, singleTube: true },
    { ReMin: 1000, ReMax: 2e5, C: 0.27, m: 0.63 },
    { ReMin: 2e5, ReMax: 2e6, C: 0.021, m: 0.84 },
  ],
  staggered: [
    { ReMin: 10, ReMax: 100, C: 0.9, m: 0.4 },
    { ReMin: 100, ReMax: 1000, C: 0, m: 0, singleTube: true },
    { ReMin: 1000, ReMax: 2e5, C: 0.35, m: 0.6 },
    { ReMin: 2e5, ReMax: 2e6, C: 0.022, m: 0.84 },
  ],
};

function bankRow(arrangement: TubeArrangement, Re: number, pitchRatio: number): BankRow {
  const row = rowFor(BANK_TABLE[arrangement], Re);
  if (arrangement === 'staggered' && row.ReMin === 1000) {
    return { ...row, C: pitchRatio < 2 ? 0.35 * pitchRatio ** 0.2 : 0.4 };
  }
  return row;
}

// Zukauskas (1972) row correction C2 for N_L < 20, as in Incropera Table 7.6 (stated for Re_max ≳ 1e3).
const ROW_CORRECTION = {
  rows: [1, 2, 3, 4, 5, 7, 10, 13, 16, 20],
  aligned: [0.7, 0.8, 0.86, 0.9, 0.92, 0.95, 0.97, 0.98, 0.99, 1],
  staggered: [0.64, 0.76, 0.84, 0.89, 0.92, 0.95, 0.97, 0.98, 0.99, 1],
} as const;

/** C2 for N_L rows, linear between the tabulated N_L; 1 from 20 rows on. */
export function rowCorrection(arrangement: TubeArrangement, rows: number): number {
  const n = ROW_CORRECTION.rows;
  const c = ROW_CORRECTION[arrangement];
  if (rows >= n[n.length - 1]) return 1;
  let i = 0;
  while (rows > n[i + 1]) i++;
  const t = (rows - n[i]) / (n[i + 1] - n[i]);
  return c[i] + t * (c[i + 1] - c[i]);
}

// Žukauskas' friction-factor charts for banks (as in Incropera et al., 7th ed., Figs. 7.14
// and 7.15: f against Re_max, one curve per pitch) are drawn from Žukauskas & Ulinskas'
// power series Eu = f = Σ c_i/Re^i (Žukauskas, A. & Ulinskas, R. (1983) "Banks of plain and
// finned tubes", Heat Exchanger Design Handbook §2.2.4, Hemisphere; coefficients from
// memory). That is how the charts are put in numbers here: the series for in-line square banks
// (P = S_L/D = S_T/D = 1.25, 1.5, 2.0) and equilateral staggered banks (P = S_T/D = 1.25,
// 1.5, 2.5; the 2.0 curve is left out because the coefficients recalled for its upper band do
// not join its lower band), linear in P between curves. Checked against Incropera Example 7.7.
interface FrictionBand {
  ReMin: number;
  ReMax: number;
  c: readonly number[];
}
const FRICTION_CURVES: Record<TubeArrangement, readonly { P: number; bands: readonly FrictionBand[] }[]> = {
  aligned: [
    { P: 1.25, bands: [{ ReMin: 3, ReMax: 2e3, c: [0.272, 0.207e3, 0.102e3, -0.286e3] }, { ReMin: 2e3, ReMax: 2e6, c: [0.267, 0.249e4, -0.927e7, 0.1e11] }] },
    { P: 1.5, bands: [{ ReMin: 3, ReMax: 2e3, c: [0.263, 0.867e2, -0.202e1] }, { ReMin: 2e3, ReMax: 2e6, c: [0.235, 0.197e4, -0.124e8, 0.312e11, -0.274e14] }] },
    { P: 2.0, bands: [{ ReMin: 7, ReMax: 800, c: [0.188, 0.566e2, -0.646e3, 0.601e4, -0.183e5] }, { ReMin: 800, ReMax: 2e6, c: [0.247, -0.595, 0.15, -0.137, 0.396] }] },
  ],
  staggered: [
    { P: 1.25, bands: [{ ReMin: 3, ReMax: 1e3, c: [0.795, 0.247e3, 0.335e3, -0.155e4, 0.241e4] }, { ReMin: 1e3, ReMax: 2e6, c: [0.245, 0.339e4, -0.984e7, 0.132e11, -0.599e13] }] },
    { P: 1.5, bands: [{ ReMin: 3, ReMax: 1e3, c: [0.683, 0.111e3, -0.973e2, 0.426e3, -0.574e3] }, { ReMin: 1e3, ReMax: 2e6, c: [0.203, 0.248e4, -0.758e7, 0.104e11, -0.482e13] }] },
    { P: 2.5, bands: [{ ReMin: 100, ReMax: 5e3, c: [0.33, 0.989e2, -0.148e5, 0.192e7, -0.862e8] }, { ReMin: 5e3, ReMax: 2e6, c: [0.119, 0.498e4, -0.507e8, 0.251e12, -0.463e15] }] },
  ],
};

// The chart's base layout: in-line square ((P_T − 1)/(P_L − 1) = 1), staggered equilateral
// (P_T/P_L = 2/√3). Other layouts need Žukauskas' correction-factor chart χ, which is not put
// in numbers here: χ = 1 is used, and a layout more than 15 % off the base is flagged.
const LAYOUT_TOLERANCE = 0.15;

export interface BankFriction {
  /** Friction factor per row, Δp = N_L·χ·f·ρV_max²/2. */
  f: number;
  /** Flags: out-of-chart:Re, out-of-chart:pitch, out-of-chart:pitch_ratio. */
  flags: string[];
}

function seriesAt(curve: { bands: readonly FrictionBand[] }, Re: number): { f: number; inChart: boolean } {
  const bands = curve.bands;
  const band = bands.find((b) => Re >= b.ReMin && Re <= b.ReMax) ?? (Re < bands[0].ReMin ? bands[0] : bands[bands.length - 1]);
  const f = band.c.reduce((sum, ci, i) => sum + ci / Re ** i, 0);
  return { f, inChart: Re >= bands[0].ReMin && Re <= bands[bands.length - 1].ReMax };
}

/** Žukauskas' bank friction factor f(Re_max, pitch) with the chart's out-of-range flags. */
export function bankFrictionFactor(arrangement: TubeArrangement, Re: number, ST_over_D: number, SL_over_D: number): BankFriction {
  const curves = FRICTION_CURVES[arrangement];
  const flags: string[] = [];
  const P = arrangement === 'aligned' ? SL_over_D : ST_over_D;
  const layout = arrangement === 'aligned' ? (ST_over_D - 1) / (SL_over_D - 1) : ST_over_D / SL_over_D / (2 / Math.sqrt(3));
  if (Math.abs(layout - 1) > LAYOUT_TOLERANCE) flags.push('out-of-chart:pitch_ratio');
  const first = curves[0];
  const last = curves[curves.length - 1];
  if (P < first.P || P > last.P) flags.push('out-of-chart:pitch');
  const Pc = Math.min(Math.max(P, first.P), last.P);
  let i = 0;
  while (i < curves.length - 2 && curves[i + 1].P < Pc) i++;
  const lo = seriesAt(curves[i], Re);
  const hi = seriesAt(curves[i + 1], Re);
  if (!lo.inChart || !hi.inChart) flags.push('out-of-chart:Re');
  const t = (Pc - curves[i].P) / (curves[i + 1].P - curves[i].P);
  return { f: lo.f + t * (hi.f - lo.f), flags };
}

const zukauskasBank: Method = {
  id: 'zukauskas-bank',
  configuration: 'tube-bank',
  kind: 'correlation',
  title: 'Zukauskas tube bank (aligned or staggered)',
  description:
    'Average Nu over a bank of N_L rows: Nu = C2 · C Re_max^m Pr^0.36 (Pr/Pr_s)^¼ with C, m by arrangement and Re_max band; for staggered banks with 1e3 ≤ Re_max < 2e5, C = 0.35 (S_T/S_L)^⅕ when S_T/S_L < 2, else 0.40. In the band 1e2..1e3 Zukauskas treats the bank as single tubes; the single-cylinder Zukauskas correlation is used there, so Nu steps at Re_max = 1e3 as in the source. C2 corrects for fewer than 20 rows (table interpolated linearly in N_L; the table is stated for Re_max ≳ 1e3 and is applied at all Re here). Re is on V_max: see maxVelocityRatio. Aligned banks with S_T/S_L < 0.7 transfer heat poorly and are flagged out-of-range:ST_over_SL.',
  equation:
    '\\overline{\\mathrm{Nu}}_D = C_2\\,C\\,\\mathrm{Re}_{D,\\max}^{m}\\,\\mathrm{Pr}^{0.36}\\left(\\frac{\\mathrm{Pr}}{\\mathrm{Pr}_s}\\right)^{1/4},\\quad \\mathrm{Re}_{D,\\max} = \\frac{V_{\\max}D}{\\nu},\\ V_{\\max} = \\frac{S_T}{S_T - D}V\\ \\text{or}\\ \\frac{S_T}{2(S_D - D)}V',
  inputs: [
    { name: 'Re', description: 'Reynolds number on the diameter and the maximum velocity, V_max D/ν', unit: '1', required: true },
    { name: 'Pr', description: 'Prandtl number at the mean fluid temperature', unit: '1', required: true },
    {
      name: 'Pr_s',
      description: 'Prandtl number at the surface temperature; defaults to Pr (no property correction)',
      unit: '1',
      required: false,
    },
    {
      name: 'arrangement',
      description: "tube layout: 'aligned' (in-line) or 'staggered'",
      unit: '1',
      type: 'string',
      required: false,
      default: 'aligned',
      choices: ['aligned', 'staggered'],
    },
    { name: 'ST_over_D', description: 'transverse pitch over diameter, S_T/D (> 1)', unit: '1', required: true },
    { name: 'SL_over_D', description: 'longitudinal pitch over diameter, S_L/D', unit: '1', required: true },
    { name: 'rows', description: 'number of tube rows in the flow direction, N_L (integer ≥ 1)', unit: '1', required: false, default: 20 },
  ],
  outputs: [
    { name: 'Nu', description: 'average Nusselt number over the bank, h̄D/k', unit: '1' },
    { name: 'row_correction', description: 'C2, the factor applied for N_L < 20 (1 for 20 rows or more)', unit: '1' },
    { name: 'max_velocity_ratio', description: 'V_max/V from the pitches', unit: '1' },
    { name: 'f', description: "Žukauskas' friction factor per row (chart in numbers: Žukauskas & Ulinskas' power series; χ = 1)", unit: '1' },
    {
      name: 'pressure_drop_coefficient',
      description: 'K = N_L·χ·f, so that Δp = K·½ρV_max² over the bank (flags out-of-chart:Re, :pitch, :pitch_ratio where the charts end)',
      unit: '1',
    },
  ],
  ranges: [
    { input: 'Re', min: 10, max: 2e6, note: 'outside the table the end bands are extended' },
    { input: 'Pr', min: 0.7, max: 500 },
    { input: 'ST_over_SL', min: 0.7, note: 'aligned banks only (derived S_T/S_L): below it aligned tubes should not be used' },
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice for tube-bank correlations (no figure taken from the source).' },
  source:
    'Zukauskas, A. (1972) Heat transfer from tubes in crossflow, Advances in Heat Transfer 8:93–160; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.58–7.59 and Tables 7.5–7.6; pressure drop: Incropera eq. 7.65 with Figs. 7.14–7.15, the charts in numbers by Žukauskas, A. & Ulinskas, R. (1983) Heat Exchanger Design Handbook §2.2.4 (power-series coefficients from memory)',
  version: 2,
  evaluate(raw) {
    const input = readInputs(zukauskasBank, raw);
    const Re = input.number('Re');
    const Pr = input.number('Pr');
    const Pr_s = input.number('Pr_s', 'positive', Pr);
    const arrangement = input.string('arrangement') as TubeArrangement;
    const ST = input.number('ST_over_D');
    const SL = input.number('SL_over_D');
    const rows = input.number('rows');
    if (!Number.isInteger(rows)) throw new InputError(`tube-bank/zukauskas-bank: rows must be a whole number ≥ 1, got ${rows}`);
    const ratio = maxVelocityRatio(arrangement, ST, SL);
    const row = bankRow(arrangement, Re, ST / SL);
    // Zukauskas (1972): bank of N_L ≥ 20 rows, times the row correction C2.
    const Nu20 = row.singleTube
      ? zukauskasCylinderNu(Re, Pr, Pr_s)
      : row.C * Re ** row.m * Pr ** 0.36 * (Pr / Pr_s) ** 0.25;
    const C2 = rowCorrection(arrangement, rows);
    const checked = arrangement === 'aligned' ? { ...input.values, ST_over_SL: ST / SL } : input.values;
    const friction = bankFrictionFactor(arrangement, Re, ST, SL);
    return {
      outputs: { Nu: C2 * Nu20, row_correction: C2, max_velocity_ratio: ratio, f: friction.f, pressure_drop_coefficient: rows * friction.f },
      flags: [...rangeFlags(zukauskasBank.ranges, checked), ...friction.flags],
    };
  },
};

export const tubeBankMethods: Method[] = [zukauskasBank];
