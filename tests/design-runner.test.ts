// Design answers through the real runner and store (compiled worker from dist/, so
// `npm test` builds first): targets and bands computed by the worker threads, the same
// for 1 and 3 workers, summaries stored per point (migration 0004) on SQLite and, with
// FILMSWEEP_TEST_PG_URL, PostgreSQL; the export's recommended column and the counts `show` prints.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeStore, getPointRows, getPointSummaryFacts, getRecommendationCounts, getRunRows, openStore, type Store } from '../shared/db/index.js';
import { compilePointDesigner, isRangeFlag } from '../shared/design/index.js';
import { exportRun } from '../shared/export/index.js';
import { prepareStudy, runStudy, type PreparedStudy } from '../shared/runner/index.js';
import { expandPoints, loadStudyFile } from '../shared/study/index.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

// Air over a heated probe (Fernbrook scenario): 3 diameters × 2 air temperatures, the speed
// for h = 100 W/(m² K), bands from diameter and temperature tolerances.
const TARGET = `name: design-runner-probe
configuration: cylinder
methods: [churchill-bernstein, hilpert, zukauskas]
fluid: air
inputs:
  length: 94 mm
  surface_temperature: 128.4 degC
sweep:
  over:
    diameter: [3 mm, 12.7 mm, 40 mm]
    fluid_temperature: [10 degC, 30 degC]
target:
  output: h
  value: 100 W/(m^2 K)
  adjust: velocity
  within: [0.05 m/s, 60 m/s]
tolerances:
  diameter: 0.1 mm
  fluid_temperature: 1 K
uncertainty: {samples: 40, seed: 11}
`;

// A forward pipe sweep with a Re tolerance: laminar and turbulent methods side by side,
// so some points recommend a laminar method, some Gnielinski, some none.
const BANDED = `name: design-runner-pipe
configuration: pipe
inputs:
  Pr: 5
  L_over_D: 40
sweep:
  over:
    Re: {from: 500, to: 5.0e6, count: 13, spacing: log}
tolerances:
  Re: 5 %
uncertainty: {samples: 80, seed: 4}
`;

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-design-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function prepare(text: string, name: string): PreparedStudy {
  const file = join(dir, name);
  writeFileSync(file, text);
  return prepareStudy(loadStudyFile(file));
}

describe.each(STORE_KINDS)('on %s', (kind) => {
  let database: TestDatabase;
  let store: Store;
  beforeAll(async () => {
    database = await createTestDatabase(kind, 'design');
    store = await openStore(database.location);
  });
  afterAll(async () => {
    await closeStore(store);
    await database.drop();
  });

  for (const [label, text] of [['target', TARGET], ['forward', BANDED]] as const) {
    it(`a ${label} run with tolerances is identical for 1 and 3 workers and equals the designer called directly`, async () => {
      const p = prepare(text, `${label}.yaml`);
      const one = await runStudy(store, p, { workers: 1, batchSize: 2 });
      const three = await runStudy(store, p, { workers: 3, batchSize: 1 });
      expect(one.status).toBe('done');
      expect(three.status).toBe('done');
      const a = await getRunRows(store, one.id);
      const b = await getRunRows(store, three.id);
      expect(b.rows).toEqual(a.rows);
      // Against the pure designer in this thread, point by point (index seeds the draws).
      const methodIds = p.methods.map((m) => m.id);
      const designer = compilePointDesigner(p.plan, methodIds, p.loaded.study.design);
      const points = expandPoints(p.loaded.study);
      const expected = points.flatMap((point, i) => designer(point, i).rows.map((r) => ({ method: r.method, outputs: r.outputs, flags: r.flags })));
      expect(a.rows.map((r) => ({ method: r.method, outputs: r.outputs, flags: r.flags }))).toEqual(expected);
      // Summaries: one per point, the same for both runs, and the recommended method never has a range flag.
      for (let i = 0; i < points.length; i++) {
        const s1 = await getPointSummaryFacts(store, one.id, i);
        const s3 = await getPointSummaryFacts(store, three.id, i);
        expect(s1).toBeDefined();
        expect(s3).toEqual(s1);
        const { applicable, spread, spread_of, recommended } = designer(points[i], i).summary;
        expect(s1).toEqual({ applicable, spread, spread_of, recommended });
        const stored = (await getPointRows(store, one.id, i))!;
        if (s1!.recommended !== null) {
          const row = stored.rows.find((r) => r.method === s1!.recommended)!;
          expect(row.flags.filter(isRangeFlag)).toEqual([]);
        } else {
          expect(s1!.applicable).toEqual([]);
        }
      }
      const counts = await getRecommendationCounts(store, one.id);
      expect(counts.points).toBe(points.length);
      expect(Object.values(counts.byMethod).reduce((x, y) => x + y, 0) + counts.none).toBe(points.length);
      expect(await getRecommendationCounts(store, three.id)).toEqual(counts);
    });
  }

  it('counts a summary range once its batch is stored, and an overlapping range (a resumed batch cut differently) once', async () => {
    const p = prepare(BANDED, 'counts.yaml');
    const run = await runStudy(store, p, { workers: 1, batchSize: 4 });
    const before = await getRecommendationCounts(store, run.id);
    expect(before.points).toBe(13);
    const [first] = await store.db.selectFrom('point_summaries').selectAll().where('run_id', '=', run.id).orderBy('first_idx').execute();
    const { encodeSummaries } = await import('../shared/design/stored-summaries.js');
    const { decodeSummary } = await import('../shared/design/stored-summaries.js');
    const ids = p.methods.map((m) => m.id);
    // Points 1…3 again, as a resume might write them after a kill, starting at point 1.
    const again = encodeSummaries([1, 2, 3], [1, 2, 3].map((i) => decodeSummary(first.facts, first.first_idx, i, ids)), ids);
    await store.db.insertInto('point_summaries').values({ run_id: run.id, first_idx: 1, end_idx: 4, facts: again[0].facts, counts: again[0].counts }).execute();
    // A range whose batch never committed (points 13…15 do not exist).
    await store.db.insertInto('point_summaries').values({ run_id: run.id, first_idx: 13, end_idx: 16, facts: again[0].facts, counts: again[0].counts }).execute();
    expect(await getRecommendationCounts(store, run.id)).toEqual(before);
  });

  it('stores solved inputs and bands as outputs, and exports carry a recommended column', async () => {
    const p = prepare(TARGET, 'target.yaml');
    const run = await runStudy(store, p, { workers: 2 });
    const data = await getRunRows(store, run.id, { recommended: true });
    expect((await getRunRows(store, run.id)).rows[0].recommended).toBeUndefined();
    for (const row of data.rows) {
      expect(row.outputs.velocity_low).toBeLessThan(row.outputs.velocity);
      expect(row.outputs.velocity_high).toBeGreaterThan(row.outputs.velocity);
      expect(typeof row.recommended).toBe('boolean');
    }
    // Exactly one recommended row per point (every method applies somewhere here).
    const perPoint = 3;
    for (let i = 0; i < data.rows.length; i += perPoint) {
      expect(data.rows.slice(i, i + perPoint).filter((r) => r.recommended).length).toBeLessThanOrEqual(1);
    }
    const csv = (await exportRun(data, 'csv')).body as string;
    const [header, first] = csv.split('\r\n');
    expect(header.split(',').at(-1)).toBe('recommended');
    expect(header).toContain('velocity_low [m/s]');
    expect(['true', 'false']).toContain(first.split(',').at(-1));
    const json = JSON.parse((await exportRun(data, 'json')).body as string);
    expect(json.rows[0].recommended).toBe(data.rows[0].recommended);
  });
});
