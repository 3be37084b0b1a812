// The chart and point APIs on design answers, through a real server: every drawn point
// carries its point index (the point view's address); a run with stored bands returns y's
// `_low`/`_high` beside each drawn point, also on a run large enough to be charted through a sample;
// a target run's axes name its target and its chart lists the results whose target was
// not reached, with their x and the reachable range; the point view gives the target and
// the run's size. On SQLite and, when FILMSWEEP_TEST_PG_URL is set, PostgreSQL. Expected
// values are the stored rows (getRunRows) and the study files' own numbers.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getRunRows } from '../shared/db/index.js';
import { SAMPLE_ROWS } from '../shared/db/chart-query.js';
import { prepareStudy, runStudy } from '../shared/runner/index.js';
import { loadStudyFile } from '../shared/study/index.js';
import { startTestServer, type Client, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

// The probe-air-speed demo (Fernbrook field station) with the search interval cut to
// 0.1–2 m/s: the 6.35 mm sheath reaches h = 50 W/(m² K) at about 1.4–1.8 m/s, the thicker
// two need more than 2 m/s (about 2.3 and 2.9 m/s in the demo's own run), so they are not reached.
const UNREACHED = `name: chart-unreached
configuration: cylinder
methods: [churchill-bernstein, hilpert, zukauskas]
fluid: air
inputs:
  length: 94 mm
  fluid_temperature: 26.2 degC
  surface_temperature: 128.4 degC
sweep:
  over:
    diameter: [6.35 mm, 9.5 mm, 12.7 mm]
target:
  output: h
  value: 50 W/(m^2 K)
  adjust: velocity
  within: [0.1 m/s, 2 m/s]
`;
// Bands from each method's stated uncertainty alone (exact, no sampling), on a grid large
// enough to be charted through a sample (more than SAMPLE_ROWS results).
const side = Math.ceil(Math.sqrt(SAMPLE_ROWS / 2));
const BANDED = `name: chart-banded
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: ${side}, spacing: log}
    Pr: {from: 0.7, to: 100, count: ${side}, spacing: log}
uncertainty: {}
`;

describe.each(STORE_KINDS)('chart and point APIs on design answers, %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let viewer: Client;
  let dir: string;
  const runs: Record<string, number> = {};

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'chartdesign');
    s = await startTestServer({}, database.location);
    viewer = await s.signIn(s.emails.viewer);
    // Run to the end before any request reads them (as the CLI writes a run).
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-chart-design-'));
    for (const [name, yaml] of Object.entries({ unreached: UNREACHED, banded: BANDED })) {
      writeFileSync(join(dir, `${name}.yaml`), yaml);
      runs[name] = (await runStudy(s.store, prepareStudy(loadStudyFile(join(dir, `${name}.yaml`))), { workers: 1 })).id;
    }
  }, 240_000);
  afterAll(async () => {
    await s?.close();
    await database?.drop();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  const get = async (url: string) => {
    const r = await viewer.json('GET', url);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    return r.body;
  };

  it("names a target run's target in the axes facts, SI", async () => {
    const axes = await get(`/api/runs/${runs.unreached}/chart/axes`);
    expect(axes.target).toEqual({ output: 'h', value: 50, adjust: 'velocity', within: [0.1, 2] });
    expect(axes.names.find((f: { name: string }) => f.name === 'velocity')).toMatchObject({ role: 'output' });
    expect((await get(`/api/runs/${runs.banded}/chart/axes`)).target).toBeUndefined();
  });

  it('lists the results whose target was not reached, at their x, with the reachable range', async () => {
    const { rows } = await getRunRows(s.store, runs.unreached);
    const body = await get(`/api/runs/${runs.unreached}/chart?x=diameter&y=velocity`);
    const missed = rows.map((r, i) => ({ r, point: Math.floor(i / 3) })).filter(({ r }) => r.flags.includes('target-not-reached'));
    expect(missed.length).toBe(6); // 9.5 mm and 12.7 mm, every method
    expect(body.unreached_total).toBe(6);
    expect(body.unreached).toEqual(
      missed.map(({ r, point }) => ({ method: r.method, x: r.inputs.diameter, point, min: r.outputs.h_min, max: r.outputs.h_max })),
    );
    for (const u of body.unreached) expect(u.max).toBeLessThan(50); // not reachable: below the target everywhere in 0.1–2 m/s
    // The reached ones are drawn, with their point index.
    expect(body.series.flatMap((x: { points: number[][] }) => x.points.map((p) => p[0]))).toEqual([0.00635, 0.00635, 0.00635]);
    expect(body.series.every((x: { point_index: number[] }) => x.point_index.join() === '0')).toBe(true);
    // With x a group that an unreached row does not have, its x is null.
    const byRe = await get(`/api/runs/${runs.unreached}/chart?x=Re&y=velocity`);
    expect(byRe.unreached.map((u: { x: number | null }) => u.x)).toEqual([null, null, null, null, null, null]);
    // Filters apply: only the 12.7 mm sheath.
    const thick = await get(`/api/runs/${runs.unreached}/chart?x=diameter&y=velocity&filter=diameter:0.012:`);
    expect(thick.unreached.map((u: { point: number }) => u.point)).toEqual([2, 2, 2]);
    // A run without a target has none.
    expect((await get(`/api/runs/${runs.banded}/chart?x=Re&y=Nu&method=gnielinski`)).unreached).toBeUndefined();
  });

  it("returns y's stored band beside each drawn point, on a run charted through a sample", async () => {
    const { rows } = await getRunRows(s.store, runs.banded);
    expect(rows.length).toBeGreaterThan(SAMPLE_ROWS);
    const body = await get(`/api/runs/${runs.banded}/chart?x=Re&y=Nu&series=Pr&filter=Pr::0.8`);
    expect(body.band_of).toBe('Nu');
    let checked = 0;
    for (const series of body.series) {
      expect(series.band).toHaveLength(series.points.length);
      expect(series.point_index).toHaveLength(series.points.length);
      series.points.forEach((p: number[], j: number) => {
        const row = rows[series.point_index[j] * 2 + (series.method === 'gnielinski' ? 0 : 1)];
        expect(row.method).toBe(series.method);
        expect([row.inputs.Re, row.outputs.Nu]).toEqual([p[0], p[1]]);
        expect(series.band[j]).toEqual([row.outputs.Nu_low, row.outputs.Nu_high]);
        checked++;
      });
    }
    expect(checked).toBeGreaterThan(2 * side - 5);
    // No band of Re stored: none returned for y = Re.
    const noBand = await get(`/api/runs/${runs.banded}/chart?x=Pr&y=Re&filter=Re::1.1e4`);
    expect(noBand.band_of).toBeUndefined();
    expect(noBand.series[0].band).toBeUndefined();
  });

  it('gives the point view its target and the run size', async () => {
    const body = await get(`/api/runs/${runs.unreached}/points/1`);
    expect(body.target).toEqual({ output: 'h', value: 50, adjust: 'velocity', within: [0.1, 2] });
    expect(body.run).toMatchObject({ id: runs.unreached, points_total: 3, status: 'done', study: 'chart-unreached' });
    expect(body.summary.flags).toEqual(['no-applicable-method']);
    expect((await get(`/api/runs/${runs.banded}/points/0`)).target).toBeUndefined();
  });
});
