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
  ],
  ranges: [
    { input: 'Re', min: 10, max: 2e6, note: 'outside the table the end bands are extended' },
    { input: 'Pr', min: 0.7, max: 500 },
    { input: 'ST_over_SL', min: 0.7, note: 'aligned banks only (derived S_T/S_L): below it aligned tubes should not be used' },
  ],
  uncertainty: { fraction: 0.2, note: 'Common practice for tube-bank correlations (no figure taken from the source).' },
  source:
    'Zukauskas, A. (1972) Heat transfer from tubes in crossflow, Advances in Heat Transfer 8:93–160; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eqs. 7.58–7.59 and Tables 7.5–7.6',
  version: 1,
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
    return {
      outputs: { Nu: C2 * Nu20, row_correction: C2, max_velocity_ratio: ratio },
      flags: rangeFlags(zukauskasBank.ranges, checked),
    };
  },
};

export const tubeBankMethods: Method[] = [zukauskasBank];
