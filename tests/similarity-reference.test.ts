// The similarity solvers against SciPy: tests/fixtures/similarity_reference.py (run with
// /usr/bin/python3) writes similarity_reference.json; its own η∞ and tolerance checks are stored
// in `self_consistency`. The brief's bar is a relative error of 1e-6 on the normalised outputs.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  flatPlateSimilarity,
  recoveryFactor,
  separationExponent,
  solveFalknerSkan,
  verticalPlateSimilarity,
  wedgeSimilarity,
} from '../shared/physics/similarity/index.js';

interface Reference {
  falkner_skan: { m: number; wall_blowing: number; Cf_x_Re_half: number; delta99_x_Re_half: number }[];
  separation: { beta: number; m: number };
  thermal: { m: number; wall_blowing: number; Pr: number; Nu_x_Re_half: number }[];
  recovery: { wall_blowing: number; Pr: number; recovery_factor: number }[];
  free_convection: { Pr: number; Nu_x_Gr_quarter: number; Cf_x_Gr_quarter: number; delta99_x_Gr_quarter: number }[];
  self_consistency: Record<string, number>;
}
const ref: Reference = JSON.parse(readFileSync(new URL('./fixtures/similarity_reference.json', import.meta.url), 'utf8'));
// A second, separately written SciPy reference (the correlation module's): Nu_x/Re_x^½ of the flat plate.
const external: { flat_plate_similarity: { rows: { Pr: number; isothermal: number }[] } } = JSON.parse(
  readFileSync(new URL('./fixtures/external_flow_reference.json', import.meta.url), 'utf8'),
);

const TOL = 1e-6;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

/** Largest relative error over rows, also returned so the test names what it saw. */
function worst<T>(rows: T[], error: (row: T) => number): number {
  let w = 0;
  for (const row of rows) {
    const e = error(row);
    expect(Number.isFinite(e), JSON.stringify(row)).toBe(true);
    w = Math.max(w, e);
  }
  return w;
}

const wedge = (m: number, wb: number, Pr = 0.7) => {
  const r = m === 0 ? flatPlateSimilarity.evaluate({ Re: 1e4, Pr, wall_blowing: wb }) : wedgeSimilarity.evaluate({ Re: 1e4, Pr, m, wall_blowing: wb });
  return r.outputs;
};

describe('SciPy reference', () => {
  it('covers the whole range the methods claim', () => {
    const ms = ref.falkner_skan.map((r) => r.m);
    expect(Math.min(...ms)).toBeLessThanOrEqual(-0.0904);
    expect(Math.max(...ms)).toBeGreaterThanOrEqual(4);
    const prs = ref.thermal.map((r) => r.Pr);
    expect([Math.min(...prs), Math.max(...prs)]).toEqual([1e-3, 1e4]);
    const free = ref.free_convection.map((r) => r.Pr);
    expect([Math.min(...free), Math.max(...free)]).toEqual([1e-2, 1e4]);
    expect(ref.recovery.map((r) => r.Pr)).toEqual(expect.arrayContaining([1e-3, 1e4]));
  });

  it('is itself converged far below 1e-6', () => {
    for (const [k, v] of Object.entries(ref.self_consistency)) expect(v, k).toBeLessThan(1e-9);
  });

  it('Falkner–Skan Cf_x·Re_x^½ and δ99/x·Re_x^½ over m (separation to 4) and blowing', () => {
    const cf = worst(ref.falkner_skan, (r) => rel(wedge(r.m, r.wall_blowing).Cf_x_Re_half, r.Cf_x_Re_half));
    const d = worst(ref.falkner_skan, (r) => rel(wedge(r.m, r.wall_blowing).delta99_x_Re_half, r.delta99_x_Re_half));
    expect(cf).toBeLessThan(TOL);
    expect(d).toBeLessThan(TOL);
  });

  it('separation value of β', () => {
    const { beta, m } = separationExponent(0, 1e-10);
    expect(Math.abs(beta - ref.separation.beta)).toBeLessThan(1e-8);
    expect(Math.abs(m - ref.separation.m)).toBeLessThan(1e-8);
  });

  it('Nu_x/Re_x^½ over Pr = 1e-3 … 1e4 for several m and blowing', () => {
    const nu = worst(ref.thermal, (r) => rel(wedge(r.m, r.wall_blowing, r.Pr).Nu_x_Re_half, r.Nu_x_Re_half));
    expect(nu).toBeLessThan(TOL);
    const other = worst(external.flat_plate_similarity.rows, (r) => rel(wedge(0, 0, r.Pr).Nu_x_Re_half, r.isothermal));
    expect(other).toBeLessThan(TOL);
  });

  it('recovery factor over Pr', () => {
    const r = worst(ref.recovery, (row) => rel(recoveryFactor(solveFalknerSkan(0, row.wall_blowing), row.Pr).recoveryFactor, row.recovery_factor));
    expect(r).toBeLessThan(TOL);
  });

  it('free convection Nu_x/(Gr_x/4)^¼, Cf_x·(Gr_x/4)^¼ and δ/x·(Gr_x/4)^¼ over Pr = 1e-2 … 1e4', () => {
    const out = (Pr: number) => verticalPlateSimilarity.evaluate({ Gr: 1e7, Pr }).outputs;
    expect(worst(ref.free_convection, (r) => rel(out(r.Pr).Nu_x_Gr_quarter, r.Nu_x_Gr_quarter))).toBeLessThan(TOL);
    expect(worst(ref.free_convection, (r) => rel(out(r.Pr).Cf_x_Gr_quarter, r.Cf_x_Gr_quarter))).toBeLessThan(TOL);
    expect(worst(ref.free_convection, (r) => rel(out(r.Pr).delta99_x_Gr_quarter, r.delta99_x_Gr_quarter))).toBeLessThan(TOL);
  });
});
