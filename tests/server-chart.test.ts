// The chart endpoint through a real server: a derived output on x (Nu against Re on a
// dimensional run), series by a second input sorted by value, what each flagged point
// broke, methods left out and why, the flagged filter, the facts behind the chart's
// choices (/chart/axes), thinning from a point sample on large runs, and measured data
// placed by the engine's derived x with per-point deviation, bias and mean absolute
// deviation; on SQLite and, when FILMSWEEP_TEST_PG_URL is set, PostgreSQL. Expected values
// come from the stored rows (getRunRows), the catalogue's ranges and the engine's own
// one-point solve.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chartData } from '../shared/db/chart-query.js';
import { getRunRows } from '../shared/db/index.js';
import { getMethod } from '../shared/physics/catalogue.js';
import { solvePoint } from '../shared/physics/engine.js';
import { quantityToSI } from '../shared/study/units.js';
import { startTestServer, waitForRun, type Client, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

const PIPE = `name: chart-pipe
configuration: pipe
methods: [gnielinski, dittus-boelter, laminar-developed]
inputs:
  L_over_D: 60
sweep:
  over:
    Re: [800, 5000, 2.0e4, 1.0e5]
    Pr: [2, 10, 100]
`;
const PLATE = `name: chart-plate
configuration: flat-plate
methods: [laminar, similarity]
sweep:
  over:
    Re: [1.0e4, 1.0e5, 3.0e5]
    Pr: [0.7, 7]
`;
// An invented probe in air (the Fernbrook field station's battery-room duct).
const PROBE = `name: chart-probe
configuration: cylinder
methods: [churchill-bernstein, hilpert]
fluid: air
inputs:
  diameter: 12.7 mm
  length: 94 mm
  fluid_temperature: 26.2 degC
  surface_temperature: 128.4 degC
sweep:
  over:
    velocity: [1 m/s, 2 m/s, 5 m/s, 10 m/s, 20 m/s]
`;
const GRID = `name: chart-grid
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: 40, spacing: log}
    Pr: {from: 0.7, to: 100, count: 25, spacing: log}
`;

describe.each(STORE_KINDS)('chart API on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let viewer: Client;
  let researcher: Client;
  const runs: Record<string, { run: number; study: number }> = {};

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'chart');
    s = await startTestServer({}, database.location);
    researcher = await s.signIn(s.emails.researcher);
    viewer = await s.signIn(s.emails.viewer);
    for (const [name, yaml] of Object.entries({ pipe: PIPE, plate: PLATE, probe: PROBE, grid: GRID })) {
      const form = new FormData();
      form.append('file', new Blob([yaml], { type: 'application/yaml' }), `${name}.yaml`);
      const up = await researcher.json('POST', '/api/studies', { form });
      expect(up.status, JSON.stringify(up.body)).toBe(201);
      runs[name] = { run: up.body.run.id, study: up.body.study.id };
      await waitForRun(viewer, up.body.run.id);
    }
  }, 120_000);
  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  const chart = async (run: number, query: string) => {
    const r = await viewer.json('GET', `/api/runs/${run}/chart?${query}`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    return r.body;
  };

  it('splits series by a second input in numeric order (2, 10, 100), not text order', async () => {
    const body = await chart(runs.pipe.run, 'x=Re&y=Nu&series=Pr&method=dittus-boelter');
    expect(body.series_by).toBe('Pr');
    expect(body.series.map((x: { value: number }) => x.value)).toEqual([2, 10, 100]);
    expect(body.series.map((x: { name: string }) => x.name)).toEqual(['dittus-boelter, Pr = 2', 'dittus-boelter, Pr = 10', 'dittus-boelter, Pr = 100']);
  });

  it("says for each flagged point which range it broke, from the point's value and the catalogue's range", async () => {
    const { rows } = await getRunRows(s.store, runs.pipe.run);
    const body = await chart(runs.pipe.run, 'x=Re&y=Nu');
    let flagged = 0;
    for (const series of body.series) {
      const ranges = getMethod('pipe', series.method).ranges;
      for (const [x, y, f, detail] of series.points) {
        const row = rows.find((r) => r.method === series.method && r.inputs.Re === x && r.outputs.Nu === y)!;
        expect(f).toBe(row.flags.length ? 1 : 0);
        if (!f) continue;
        flagged++;
        const details = body.flag_details[detail];
        expect(details.map((d: { flag: string }) => d.flag)).toEqual(row.flags);
        for (const d of details) {
          if (d.name !== 'Re') continue;
          const range = ranges.find((r) => r.input === 'Re')!;
          expect(d).toMatchObject({ value: x, ...(range.min !== undefined ? { min: range.min } : {}), ...(range.max !== undefined ? { max: range.max } : {}) });
        }
      }
    }
    // Dittus–Boelter below Re = 1e4, laminar-developed above 2300, Gnielinski at 800 has no Nu (domain error).
    expect(flagged).toBeGreaterThan(10);
    const only = await chart(runs.pipe.run, 'x=Re&y=Nu&flagged=yes');
    expect(only.series.every((x: { points: number[][] }) => x.points.every((p) => p[2] === 1))).toBe(true);
    expect(only.total).toBe(flagged);
  });

  it('lists a method that gives only local values as left out, with the reason', async () => {
    const body = await chart(runs.plate.run, 'x=Re&y=Nu');
    expect(body.series.map((x: { method: string }) => x.method)).toEqual(['laminar']);
    expect(body.left_out).toEqual([expect.objectContaining({ method: 'similarity', local: expect.arrayContaining(['Nu_x']) })]);
    expect(body.left_out[0].reason).toMatch(/local values at x = L .*not the average Nu: plot Nu_x/);
    const local = await chart(runs.plate.run, 'x=Re&y=Nu_x');
    expect(local.left_out).toEqual([]);
    expect(local.series.map((x: { method: string }) => x.method)).toEqual(['laminar', 'similarity']);
  });

  it('plots Nu against the derived Re of a dimensional run', async () => {
    const { rows } = await getRunRows(s.store, runs.probe.run);
    const body = await chart(runs.probe.run, 'x=Re&y=Nu');
    expect(body.total).toBe(rows.length);
    for (const series of body.series) {
      const own = rows.filter((r) => r.method === series.method);
      expect(series.points.map((p: number[]) => [p[0], p[1]])).toEqual(own.map((r) => [r.outputs.Re, r.outputs.Nu]).sort((a, b) => a[0] - b[0]));
    }
  });

  it('gives the facts behind the chart choices: swept and fixed inputs exactly, outputs from their values', async () => {
    const r = await viewer.json('GET', `/api/runs/${runs.pipe.run}/chart/axes`);
    expect(r.status).toBe(200);
    const byName = Object.fromEntries(r.body.names.map((f: { name: string }) => [f.name, f]));
    expect(byName.Re).toMatchObject({ role: 'input', swept: true, distinct: 4, min: 800, max: 1e5, values: [800, 5000, 2e4, 1e5] });
    expect(byName.Pr).toMatchObject({ role: 'input', swept: true, distinct: 3, values: [2, 10, 100] });
    expect(byName.L_over_D).toMatchObject({ role: 'input', swept: false, distinct: 1, min: 60, max: 60 });
    const { rows } = await getRunRows(s.store, runs.pipe.run);
    const nus = rows.map((x) => x.outputs.Nu).filter((v) => Number.isFinite(v));
    expect(byName.Nu).toMatchObject({ role: 'output', min: Math.min(...nus), max: Math.max(...nus) });
    const probe = (await viewer.json('GET', `/api/runs/${runs.probe.run}/chart/axes`)).body;
    const velocity = probe.names.find((f: { name: string }) => f.name === 'velocity');
    // velocity is swept (the engine also echoes it among the outputs); Re is derived from it.
    expect(velocity).toMatchObject({ role: 'input', swept: true, distinct: 5, min: 1, max: 20 });
    expect(probe.names.find((f: { name: string }) => f.name === 'Re')).toMatchObject({ role: 'output', distinct: 5 });
    expect((await viewer.json('GET', '/api/runs/999999/chart/axes')).status).toBe(404);
  });

  it('thins a large run from a fixed sample of whole points: real results, bounded, the same every time', async () => {
    const { rows } = await getRunRows(s.store, runs.grid.run);
    expect(rows.length).toBe(2000);
    const q = { x: 'Re', y: 'Nu', max: 40 };
    const a = await chartData(s.store, runs.grid.run, q, { sampleRows: 300 });
    const b = await chartData(s.store, runs.grid.run, q, { sampleRows: 300 });
    expect(a).toEqual(b);
    // Every result has Nu here, so the sample's estimate is exact: 300 of 2000, all qualifying.
    expect(a).toMatchObject({ total: 2000, total_estimated: true, downsampled: true });
    expect(a.sampled).toBeGreaterThan(300 * 0.6);
    expect(a.sampled).toBeLessThan(300 * 1.4);
    const points = a.series.flatMap((x) => x.points);
    expect(points.length).toBeLessThanOrEqual(40);
    for (const series of a.series) {
      for (const [x, y] of series.points) expect(rows.some((r) => r.method === series.method && r.inputs.Re === x && r.outputs.Nu === y)).toBe(true);
    }
    // The sample reaches across the grid, not one corner of it.
    const xs = points.map((p) => p[0]);
    expect(Math.min(...xs)).toBeLessThan(2e4);
    expect(Math.max(...xs)).toBeGreaterThan(5e5);
    // A filter that leaves few rows in the sample: those rows are read whole and counted exactly.
    const prs = [...new Set(rows.map((r) => r.inputs.Pr as number))].sort((p, q) => p - q);
    const one = await chartData(s.store, runs.grid.run, { ...q, filters: [{ name: 'Pr', min: prs[3], max: prs[3] }] }, { sampleRows: 300 });
    expect(one).toMatchObject({ total: 80, downsampled: true });
    expect(one.total_estimated).toBeUndefined();
    expect(one.sampled).toBeUndefined();
    // Under the sample size nothing is sampled.
    expect((await chartData(s.store, runs.grid.run, { x: 'Re', y: 'Nu', max: 40 })).sampled).toBeUndefined();
  });

  it("places measured rows at the engine's derived x and gives per-point deviation, bias and mean absolute deviation", async () => {
    const csv = 'velocity [m/s],h [W/(m^2 K)]\n2,42\n10,110\n';
    const form = new FormData();
    form.append('file', new Blob([csv], { type: 'text/csv' }), 'rig.csv');
    form.append('mapping', JSON.stringify({ 'velocity [m/s]': 'velocity', 'h [W/(m^2 K)]': 'h' }));
    const made = await researcher.json('POST', `/api/studies/${runs.probe.study}/measurements`, { form });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const body = await chart(runs.probe.run, `x=Re&y=h&measurement=${made.body.measurement.id}`);
    const m = body.measured;
    const plan = { configuration: 'cylinder', methods: ['churchill-bernstein', 'hilpert'], fluid: 'air' };
    const at = (velocity: number) =>
      solvePoint(plan, {
        diameter: 0.0127,
        length: 0.094,
        fluid_temperature: quantityToSI('fluid_temperature', '26.2 degC'),
        surface_temperature: quantityToSI('surface_temperature', '128.4 degC'),
        velocity,
      });
    const measured = [
      { v: 2, h: 42 },
      { v: 10, h: 110 },
    ];
    const solved = measured.map((r) => at(r.v));
    expect(m.points).toEqual(measured.map((r, i) => [solved[i][0].outputs.Re, r.h]));
    for (const method of ['churchill-bernstein', 'hilpert']) {
      const devs = measured.map((r, i) => (solved[i].find((x) => x.method === method)!.outputs.h - r.h) / r.h);
      expect(m.rows.map((r: { deviation: Record<string, number> }) => r.deviation[method])).toEqual(devs.map((d) => expect.closeTo(d, 12)));
      expect(m.bias[method]).toBeCloseTo((devs[0] + devs[1]) / 2, 12);
      expect(m.mad[method]).toBeCloseTo((Math.abs(devs[0]) + Math.abs(devs[1])) / 2, 12);
    }
    expect(m.unplaced).toBe(0);
  });
});
