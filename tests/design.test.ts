// Design answers, pure parts (shared/design): targets, bands, the summary across methods.
import { describe, expect, it } from 'vitest';
import { compilePointDesigner, evaluateWithFactor, factorRule, isRangeFlag, solveTargetNear, solveTargetValue, type DesignSpec } from '../shared/design/index.js';
import { decodeRecommended, decodeSummary, encodeSummaries } from '../shared/design/stored-summaries.js';
import { getMethod } from '../shared/physics/catalogue.js';
import { compileSolver, solvePoint, type SolvePlan } from '../shared/physics/engine.js';
import type { Inputs } from '../shared/physics/types.js';

// The probe of studies/probe-air-speed.yaml: a 12.7 mm sheath in air (Fernbrook scenario).
const probePlan: SolvePlan = { configuration: 'cylinder', methods: ['churchill-bernstein', 'hilpert', 'zukauskas'], fluid: 'air' };
const probe: Inputs = { diameter: 0.0127, length: 0.094, fluid_temperature: 299.35, surface_temperature: 401.55 };
const ids = probePlan.methods!;
const fractionOf = (id: string) => getMethod('cylinder', id).uncertainty.fraction;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

const target = (value: number, within: [number, number] = [0.2, 40]): DesignSpec => ({
  tolerances: {},
  target: { output: 'h', value, adjust: 'velocity', within },
});

describe('targets', () => {
  it('a target solved per point agrees with a forward solve at the found input to 1e-9', () => {
    const designer = compilePointDesigner(probePlan, ids, target(100));
    for (const diameter of [0.00635, 0.0127, 0.025]) {
      const point = { ...probe, diameter };
      const { rows } = designer(point, 0);
      for (const row of rows) {
        expect(row.flags).toEqual([]);
        const v = row.outputs.velocity;
        expect(row.inputs.velocity).toBe(v);
        const [forward] = solvePoint({ ...probePlan, methods: [row.method] }, { ...point, velocity: v });
        expect(rel(forward.outputs.h, 100)).toBeLessThan(1e-9);
        for (const [name, value] of Object.entries(forward.outputs)) expect(row.outputs[name]).toBe(value);
      }
    }
  });

  it('solves a dimensionless target the same way (Gnielinski: the Re that gives Nu = 500 at Pr = 5)', () => {
    const plan: SolvePlan = { configuration: 'pipe', methods: ['gnielinski'] };
    const { rows } = compilePointDesigner(plan, ['gnielinski'], { tolerances: {}, target: { output: 'Nu', value: 500, adjust: 'Re', within: [1e4, 1e6] } })({ Pr: 5 }, 0);
    const Re = rows[0].outputs.Re;
    expect(rel(solvePoint(plan, { Re, Pr: 5 })[0].outputs.Nu, 500)).toBeLessThan(1e-9);
    // Brent stops when the bracket is below 1e-9 of the root: one more step of 1e-9 changes Nu by less than that.
    expect(Re).toBeGreaterThan(9e4);
    expect(Re).toBeLessThan(1e5);
  });

  it('an unreachable target is flagged with the achievable range (h_min, h_max over within)', () => {
    const { rows } = compilePointDesigner(probePlan, ids, target(5000, [0.2, 40]))(probe, 0);
    for (const row of rows) {
      expect(row.flags).toEqual(['target-not-reached']);
      expect(row.outputs.velocity).toBeUndefined();
      // h rises with velocity, so the range is h at the ends of `within`.
      const [lo] = solvePoint({ ...probePlan, methods: [row.method] }, { ...probe, velocity: 0.2 });
      const [hi] = solvePoint({ ...probePlan, methods: [row.method] }, { ...probe, velocity: 40 });
      expect(rel(row.outputs.h_min, lo.outputs.h)).toBeLessThan(1e-12);
      expect(rel(row.outputs.h_max, hi.outputs.h)).toBeLessThan(1e-12);
    }
  });

  it('a method with no number anywhere in the interval says why beside target-not-reached', () => {
    // Gnielinski on D_h refuses Re ≤ 1000 (its (Re − 1000) factor); the pipe method now blends into laminar flow there.
    const plan: SolvePlan = { configuration: 'duct', methods: ['turbulent-rectangular'] };
    const { rows } = compilePointDesigner(plan, ['turbulent-rectangular'], { tolerances: {}, target: { output: 'Nu', value: 50, adjust: 'Re', within: [100, 900] } })({ Pr: 5 }, 0);
    expect(rows[0].flags).toEqual(['target-not-reached', 'domain-error']);
    expect(rows[0].outputs).toEqual({});
  });

  it('takes the smallest of several roots and says so', () => {
    const s = solveTargetValue((x) => (x - 1.1) * (x - 3), 0, [0, 4]);
    expect(s.status).toBe('solved');
    if (s.status === 'solved') {
      expect(s.severalRoots).toBe(true);
      expect(Math.abs(s.x - 1.1)).toBeLessThan(1.1e-9);
    }
    const one = solveTargetValue((x) => x * x, 2, [0.5, 3]);
    expect(one.status === 'solved' && !one.severalRoots && Math.abs(one.x - Math.SQRT2) < 1e-9 * Math.SQRT2).toBe(true);
  });

  it('a band sample’s local solve finds the root the full scan finds (monotone output)', () => {
    const h = (x: number) => 10 * Math.sqrt(x) + 2 * x;
    for (const [value, x0] of [[30, 3], [30, 9], [100, 2], [12, 40]]) {
      const full = solveTargetValue(h, value, [0.1, 50]);
      const near = solveTargetNear(h, value, [0.1, 50], x0);
      expect(full.status).toBe('solved');
      if (full.status === 'solved') expect(Math.abs(near! - full.x) / full.x).toBeLessThan(2e-7);
    }
    expect(solveTargetNear(h, 1e4, [0.1, 50], 3)).toBeUndefined();
  });
});

describe('bands', () => {
  const banded: DesignSpec = { tolerances: {}, uncertainty: { samples: 400, seed: 1 } };

  it('a band with no tolerances equals the stated uncertainty (Nu, h, q, heat_rate × (1 ∓ fraction))', () => {
    const velocityPoint = { ...probe, velocity: 10 };
    const { rows } = compilePointDesigner(probePlan, ids, banded)(velocityPoint, 0);
    for (const row of rows) {
      const u = fractionOf(row.method);
      for (const name of ['Nu', 'h', 'q', 'heat_rate']) {
        expect(rel(row.outputs[`${name}_low`], row.outputs[name] * (1 - u))).toBeLessThan(1e-14);
        expect(rel(row.outputs[`${name}_high`], row.outputs[name] * (1 + u))).toBeLessThan(1e-14);
      }
      expect(row.flags).toEqual([]);
    }
  });

  it('with a heat flux given, the surface temperature band solves F·h(T_s)·(T_s − T∞) = q″ at F = 1 ∓ fraction', () => {
    const point = { diameter: 0.0127, length: 0.094, fluid_temperature: 299.35, heat_flux: 5000, velocity: 5 };
    const plan = { ...probePlan, methods: ['churchill-bernstein'] };
    const { rows } = compilePointDesigner(plan, ['churchill-bernstein'], banded)(point, 0);
    const row = rows[0];
    const u = fractionOf('churchill-bernstein');
    // A method that underpredicts h (F = 1 − u) needs a hotter wall to shed the same flux.
    const hot = row.outputs.surface_temperature_high;
    const cold = row.outputs.surface_temperature_low;
    expect(hot).toBeGreaterThan(row.outputs.surface_temperature);
    expect(cold).toBeLessThan(row.outputs.surface_temperature);
    const { heat_flux: _q, ...noFlux } = point;
    for (const [Ts, F] of [[hot, 1 - u], [cold, 1 + u]]) {
      const [atTs] = solvePoint(plan, { ...noFlux, surface_temperature: Ts });
      expect(rel(F * atTs.outputs.h * (Ts - 299.35), 5000)).toBeLessThan(1e-6);
    }
    // The given flux is the flux whatever the method's error.
    expect(row.outputs.q_low).toBeCloseTo(5000, 6);
    expect(row.outputs.q_high).toBeCloseTo(5000, 6);
  });

  it('carries the factor through an internal-flow energy balance by the exponential law (NTU · F)', () => {
    // A synthetic evaluator with the balance of Incropera eq. 8.41b: T_s − T_out = (T_s − T_in)·exp(−NTU).
    const NTU = 0.7;
    const evaluate = () => ({
      method: 'm',
      inputs: {},
      outputs: { h: 100, outlet_temperature: 360 - 60 * Math.exp(-NTU), heat_rate: 1000 * (1 - Math.exp(-NTU)) },
      flags: [],
    });
    const inputs = { surface_temperature: 360, fluid_temperature: 300 };
    const rule = factorRule(inputs, evaluate().outputs);
    expect(rule).toBe('energy-balance');
    const { outputs } = evaluateWithFactor(evaluate, inputs, 1.2, rule);
    expect(outputs.h).toBeCloseTo(120, 12);
    expect(outputs.outlet_temperature).toBeCloseTo(360 - 60 * Math.exp(-NTU * 1.2), 12);
    expect(outputs.heat_rate).toBeCloseTo(1000 * (1 - Math.exp(-NTU * 1.2)), 9);
  });

  it('internal flow with a heat flux: the outlet and heat rate stay, the wall moves by q″/(F·h) above the bulk', () => {
    const plan: SolvePlan = { configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' };
    const point = { diameter: 0.02, velocity: 0.5, fluid_temperature: 293.15, heat_flux: 20000, length: 2 };
    const [row] = compilePointDesigner(plan, ['gnielinski'], banded)(point, 0).rows;
    const u = getMethod('pipe', 'gnielinski').uncertainty.fraction;
    expect(row.flags).toEqual([]);
    expect(row.outputs.outlet_temperature_low).toBe(row.outputs.outlet_temperature);
    expect(row.outputs.heat_rate_high).toBe(row.outputs.heat_rate);
    const Tb = row.outputs.mean_bulk_temperature;
    // The engine's wall: the bulk plus q″/h (checked here, then the band from it).
    expect(row.outputs.surface_temperature - Tb).toBeCloseTo(20000 / row.outputs.h, 9);
    expect(row.outputs.surface_temperature_high).toBeCloseTo(Tb + 20000 / ((1 - u) * row.outputs.h), 9);
    expect(row.outputs.surface_temperature_low).toBeCloseTo(Tb + 20000 / ((1 + u) * row.outputs.h), 9);
  });

  const withTolerance = (t: number): DesignSpec => ({ tolerances: { velocity: { relative: t } }, uncertainty: { samples: 400, seed: 7 } });

  function bandsOver(plan: SolvePlan, method: string, point: Inputs, tolerances: number[], h = 'h'): number[][] {
    return tolerances.map((t) => {
      const [row] = compilePointDesigner({ ...plan, methods: [method] }, [method], withTolerance(t))(point, 3).rows;
      return [row.outputs[`${h}_high`] - row.outputs[`${h}_low`], row.outputs[`${h}_low`], row.outputs[`${h}_high`]];
    });
  }
  function expectWidening(bands: number[][]) {
    for (let i = 1; i < bands.length; i++) {
      expect(bands[i][0]).toBeGreaterThan(bands[i - 1][0]);
      expect(bands[i][1]).toBeLessThan(bands[i - 1][1]);
      expect(bands[i][2]).toBeGreaterThan(bands[i - 1][2]);
    }
  }

  it('a band with tolerances widens monotonically with the tolerance (flat-plate similarity: the tolerance dominates)', () => {
    const plate = { length: 0.3, fluid_temperature: 299.35, surface_temperature: 340, velocity: 5 };
    expectWidening(bandsOver({ configuration: 'flat-plate', fluid: 'air' }, 'similarity', plate, [0, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2], 'h_x'));
  });

  it('… and also where a ±20 % stated uncertainty is added to it (Hilpert)', () => {
    expectWidening(bandsOver(probePlan, 'hilpert', { ...probe, velocity: 10 }, [0, 0.1, 0.2, 0.4]));
  });

  it('draws are fixed by the seed and the point index, and shared by the methods of a point', () => {
    const point = { ...probe, velocity: 10 };
    const a = compilePointDesigner(probePlan, ids, withTolerance(0.05))(point, 12);
    const b = compilePointDesigner(probePlan, ids, withTolerance(0.05))(point, 12);
    const c = compilePointDesigner(probePlan, ids, withTolerance(0.05))(point, 13);
    expect(b.rows).toEqual(a.rows);
    expect(c.rows[0].outputs.h_low).not.toBe(a.rows[0].outputs.h_low);
  });

  it('a target run bands the solved input, and the band holds the nominal solution', () => {
    const spec: DesignSpec = { ...target(100), tolerances: { diameter: { absolute: 1e-4 } }, uncertainty: { samples: 100, seed: 2 } };
    const { rows } = compilePointDesigner(probePlan, ids, spec)(probe, 0);
    for (const row of rows) {
      expect(row.outputs.velocity_low).toBeLessThan(row.outputs.velocity);
      expect(row.outputs.velocity_high).toBeGreaterThan(row.outputs.velocity);
    }
  });
});

describe('summary across methods', () => {
  const pipe: SolvePlan = { configuration: 'pipe' };
  const pipeIds = ['laminar-developed', 'hausen', 'sieder-tate-laminar', 'dittus-boelter', 'sieder-tate', 'gnielinski'];

  it('the recommended method never has a range flag, and no-applicable-method is said plainly', () => {
    const designer = compilePointDesigner({ ...pipe, methods: pipeIds }, pipeIds);
    let none = 0;
    let recommended = 0;
    for (const Re of [100, 1000, 2000, 2500, 5000, 1e4, 1e5, 1e6, 1e7]) {
      for (const Pr of [0.3, 0.7, 5, 200, 3000]) {
        const { rows, summary } = designer({ Re, Pr, L_over_D: 40 }, 0);
        if (summary.recommended === null) {
          none++;
          expect(summary.flags).toEqual(['no-applicable-method']);
          expect(rows.every((r) => r.flags.some(isRangeFlag))).toBe(true);
          continue;
        }
        recommended++;
        const row = rows.find((r) => r.method === summary.recommended)!;
        expect(row.flags.filter(isRangeFlag)).toEqual([]);
        // smallest stated uncertainty among the applicable
        const smallest = Math.min(...summary.applicable.map((id) => getMethod('pipe', id).uncertainty.fraction));
        expect(getMethod('pipe', summary.recommended).uncertainty.fraction).toBe(smallest);
        const nus = summary.applicable.map((id) => rows.find((r) => r.method === id)!.outputs.Nu);
        expect(summary.spread).toBeCloseTo(Math.max(...nus) / Math.min(...nus) - 1, 12);
      }
    }
    expect(none).toBeGreaterThan(0);
    expect(recommended).toBeGreaterThan(0);
  });

  it('recommends Gnielinski (±10 %) over Dittus–Boelter and Sieder–Tate (±25 %) in turbulent flow', () => {
    const { summary } = compilePointDesigner({ ...pipe, methods: ['dittus-boelter', 'sieder-tate', 'gnielinski'] }, ['dittus-boelter', 'sieder-tate', 'gnielinski'])({ Re: 1e5, Pr: 5, L_over_D: 40 }, 0);
    expect(summary.recommended).toBe('gnielinski');
    expect(summary.applicable).toEqual(['dittus-boelter', 'sieder-tate', 'gnielinski']);
    expect(summary.reason).toContain('gnielinski ±10 %');
  });

  it('the workers\' columnar summaries store exactly what the facts of each point say (ranges split at gaps)', () => {
    const designer = compilePointDesigner({ ...pipe, methods: pipeIds }, pipeIds);
    const encoder = designer.summaryEncoder();
    const indices: number[] = [];
    const facts: ReturnType<typeof designer>['facts'][] = [];
    let k = 0;
    for (const Re of [100, 1000, 2000, 2500, 5000, 1e4, 1e5, 1e6, 1e7]) {
      for (const Pr of [0.3, 0.7, 5, 200, 3000]) {
        const index = k < 20 ? k : k + 7; // a gap: two stored ranges
        const point = designer({ Re, Pr, L_over_D: 40 }, index);
        encoder.addRows(index, point.rows);
        indices.push(index);
        facts.push(point.facts);
        k++;
      }
    }
    const columnar = encoder.finish();
    expect(columnar.map((r) => [r.first, r.end])).toEqual([
      [0, 20],
      [27, 52],
    ]);
    expect(columnar).toEqual(encodeSummaries(indices, facts, pipeIds));
    indices.forEach((idx, i) => {
      const range = columnar.find((r) => idx >= r.first && idx < r.end)!;
      expect(decodeSummary(range.facts, range.first, idx, pipeIds)).toEqual(facts[i]);
    });
    // Both recommendations and "none" occur, so the counts carry both kinds of key.
    expect(columnar.some((r) => r.counts.includes('"none"'))).toBe(true);
    // The recommended method, the applicable ones and what the spread is of go as runs of
    // equal values (they change at a few points of the sweep); the spread as a list.
    const stored = JSON.parse(columnar[1].facts);
    expect(Object.keys(stored)).toEqual(['recommended', 'applicable', 'spread', 'spread_of']);
    for (const key of ['recommended', 'applicable', 'spread_of']) {
      expect(stored[key].runs.reduce((n: number, [, count]: [unknown, number]) => n + count, 0)).toBe(25);
      expect(stored[key].runs.length).toBeLessThan(25);
    }
    expect(stored.spread).toHaveLength(25);
  });

  it('reads summaries stored as one list per column, as runs before the runs form have them', () => {
    const facts = JSON.stringify({ recommended: [2, null, 0], applicable: [[0, 2], [], [0]], spread: [0.125, null, null], spread_of: ['Nu', null, null] });
    expect(decodeSummary(facts, 10, 10, pipeIds)).toEqual({ recommended: pipeIds[2], applicable: [pipeIds[0], pipeIds[2]], spread: 0.125, spread_of: 'Nu' });
    expect(decodeSummary(facts, 10, 11, pipeIds)).toEqual({ recommended: null, applicable: [], spread: null, spread_of: null });
    expect(decodeSummary(facts, 10, 12, pipeIds)).toEqual({ recommended: pipeIds[0], applicable: [pipeIds[0]], spread: null, spread_of: null });
    const byIndex = new Map<number, number | null>();
    decodeRecommended(facts, 10, byIndex);
    expect([...byIndex]).toEqual([
      [10, 2],
      [11, null],
      [12, 0],
    ]);
    // The runs form gives the same.
    const runs = JSON.stringify({ recommended: { runs: [[2, 1], [null, 1], [0, 1]] }, applicable: { runs: [[[0, 2], 1], [[], 1], [[0], 1]] }, spread: [0.125, null, null], spread_of: { runs: [['Nu', 1], [null, 2]] } });
    for (const idx of [10, 11, 12]) expect(decodeSummary(runs, 10, idx, pipeIds)).toEqual(decodeSummary(facts, 10, idx, pipeIds));
    const fromRuns = new Map<number, number | null>();
    decodeRecommended(runs, 10, fromRuns);
    expect(fromRuns).toEqual(byIndex);
  });

  it('a single-method forward solve and the designer give the same rows', () => {
    const rowsA = compileSolver(probePlan, { strict: false })({ ...probe, velocity: 7 });
    const rowsB = compilePointDesigner(probePlan, ids)({ ...probe, velocity: 7 }, 0).rows;
    expect(rowsB).toEqual(rowsA);
  });
});
