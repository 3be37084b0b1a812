// Runs stored before migrations/0005_run_tables.ts (results as JSON in points/results), on
// SQLite and, when FILMSWEEP_TEST_PG_URL is set, PostgreSQL: a database written by the
// older schema is migrated and read as it is; converting a run into its table gives back
// the very same rows and removes the JSON ones; the conversion goes in steps with the event
// loop free between them (the dashboard answers meanwhile), stops with its store and picks
// up again; `resume` converts a run first and finishes it.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Migrator } from 'kysely';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { migrations } from '../migrations/index.js';
import { closeStore, convertLegacyRun, getRun, getRunRows, getRunSummary, openStore, queryResults, type Store } from '../shared/db/index.js';
import { convertInBackground } from '../shared/db/legacy-results.js';
import { hasRunTable, runTableName } from '../shared/db/result-table.js';
import { chartData } from '../shared/db/chart-query.js';
import { compareRuns } from '../shared/db/compare-query.js';
import { prepareStudy, resumeRun, runStudy, type PreparedStudy } from '../shared/runner/index.js';
import { loadStudyFile } from '../shared/study/index.js';
import { storeAsBeforeRunTables } from './helpers/legacy.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

const study = (points: number) => `name: legacy-pipe
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: true
sweep:
  over:
    Re: {from: 4.0e3, to: 1.0e6, count: ${points / 10}, spacing: log}
    Pr: {from: 0.7, to: 120, count: 10, spacing: log}
`;

let dir: string;
let database: TestDatabase;
let store: Store;

function prepare(points: number): PreparedStudy {
  const file = join(dir, `legacy-${points}.yaml`);
  writeFileSync(file, study(points));
  return prepareStudy(loadStudyFile(file));
}

/** Everything a reader sees of a run, as JSON text (key order and -0 included). */
async function snapshot(runId: number): Promise<string> {
  const { run, rows } = await getRunRows(store, runId);
  const page = await queryResults(store, runId, { sort: 'Nu', order: 'desc', pageSize: 30, filters: [{ name: 'Re', min: 1e4 }] });
  // Downsampled and not, by method and by a second input, narrowed by method and value, read
  // whole (a sample of a large run is drawn by different keys from a run table and from
  // JSON rows): the run table and the JSON rows must give the same points.
  const whole = { sampleRows: 1e7 };
  const charts = [
    await chartData(store, runId, { x: 'Re', y: 'Nu', max: 50 }, whole),
    await chartData(store, runId, { x: 'Re', y: 'Nu', max: 20_000 }, whole),
    await chartData(store, runId, { x: 'Re', y: 'f', series: 'Pr', methods: ['gnielinski'], max: 100 }, whole),
    await chartData(store, runId, { x: 'Re', y: 'Nu', series: 'Pr', filters: [{ name: 'Re', min: 1e4, max: 5e5 }], max: 300 }, whole),
  ];
  const summary = await getRunSummary(store, runId);
  return JSON.stringify({ run, rows, page: { ...page, rows: page.rows.map(({ id: _id, ...r }) => r) }, charts, summary });
}

const count = async (query: string, ...params: unknown[]) => Number((await store.dialect.all<{ n: unknown }>(query, params))[0].n);

describe.each(STORE_KINDS)('runs stored before run tables, on %s', (kind) => {
  beforeEach(async () => {
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-legacy-'));
    database = await createTestDatabase(kind, 'legacy');
  });
  afterEach(async () => {
    await closeStore(store);
    await database.drop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('a database of the older schema is migrated, read as it is, and converted to exactly the same rows', async () => {
    // Today's rows of a run, as the reference.
    store = await openStore(database.location);
    const today = await runStudy(store, prepare(300), { workers: 2 });
    const want = await snapshot(today.id);
    await storeAsBeforeRunTables(store, today.id);
    // Roll the schema back to before 0005 (its down() keeps runs stored the older way), with a 0002 results cache in place.
    const migrator = new Migrator({ db: store.db, provider: { getMigrations: async () => migrations } });
    const down = await migrator.migrateTo('0004_point_summaries');
    expect(down.error).toBeUndefined();
    await store.dialect.run('create table results_cache_1 (seq integer primary key)');
    await store.dialect.run("insert into result_caches (run_id, table_name, results_count, columns, built_at) values (?, 'results_cache_1', 0, '{}', 'then')", [today.id]);
    await closeStore(store);

    store = await openStore(database.location);
    expect(store.migrated).toEqual(['0005_run_tables']);
    expect(await hasRunTable(store, today.id)).toBe(false);
    expect(await snapshot(today.id)).toBe(want);

    expect(await convertLegacyRun(store, today.id)).toBe(true);
    expect(await hasRunTable(store, today.id)).toBe(true);
    expect(await snapshot(today.id)).toBe(want);
    expect(await count('select count(*) as n from results where run_id = ?', today.id)).toBe(0);
    expect(await count('select count(*) as n from points where run_id = ?', today.id)).toBe(0);
    const tables = await store.dialect.all<{ name: string }>(
      kind === 'sqlite' ? "select name from sqlite_master where type = 'table'" : "select table_name as name from information_schema.tables where table_schema = current_schema()",
    );
    expect(tables.map((t) => t.name)).not.toContain('results_cache_1');
    expect(tables.map((t) => t.name)).not.toContain('result_caches');
  });

  it('converts in steps, the event loop free between them: a query answers while the copy is half done', async () => {
    store = await openStore(database.location);
    const big = await runStudy(store, prepare(6_000), { workers: 2 });
    const want = await snapshot(big.id);
    await storeAsBeforeRunTables(store, big.id);

    let done = false;
    const converting = convertInBackground(store, big.id).then((ok) => ((done = true), ok));
    const copied: number[] = [];
    let answeredMidway = false;
    while (!done) {
      await new Promise((r) => setImmediate(r));
      if (done) break;
      const n = await count(`select count(*) as n from ${runTableName(big.id)}`).catch(() => 0);
      copied.push(n);
      if (n > 0 && n < big.results && !answeredMidway) {
        // The dashboard's query answers meanwhile, from the JSON rows, with the same page.
        const page = await queryResults(store, big.id, { sort: 'Nu', order: 'desc', pageSize: 30, filters: [{ name: 'Re', min: 1e4 }] });
        expect(page.total).toBe(JSON.parse(want).page.total);
        answeredMidway = true;
      }
    }
    expect(await converting).toBe(true);
    expect(copied.some((n) => n > 0 && n < big.results)).toBe(true);
    expect(answeredMidway).toBe(true);
    expect(await snapshot(big.id)).toBe(want);
  });

  it('a closed store stops its conversion after the current step; the next one finishes it', async () => {
    store = await openStore(database.location);
    const big = await runStudy(store, prepare(6_000), { workers: 2 });
    const want = await snapshot(big.id);
    await storeAsBeforeRunTables(store, big.id);
    const converting = convertInBackground(store, big.id);
    await new Promise((r) => setImmediate(r));
    await closeStore(store);
    expect(await converting).toBe(false);

    store = await openStore(database.location);
    expect(await hasRunTable(store, big.id)).toBe(false);
    expect(await snapshot(big.id)).toBe(want);
    expect(await convertLegacyRun(store, big.id)).toBe(true);
    expect(await snapshot(big.id)).toBe(want);
  });

  it('resume converts an interrupted run stored before run tables, then finishes it with the rows of an uninterrupted run', async () => {
    store = await openStore(database.location);
    const p = prepare(300);
    const whole = await runStudy(store, p, { workers: 2 });
    const stop = new AbortController();
    const part = await runStudy(store, p, { workers: 1, batchSize: 20, stop: stop.signal, onProgress: (x) => x.done >= 60 && stop.abort() });
    expect(part.status).toBe('interrupted');
    await storeAsBeforeRunTables(store, part.id);
    const resumed = await resumeRun(store, part.id, { workers: 2 });
    expect(resumed).toMatchObject({ status: 'done', points_done: 300, results: 600 });
    expect(await hasRunTable(store, part.id)).toBe(true);
    expect((await getRunRows(store, part.id)).rows).toEqual((await getRunRows(store, whole.id)).rows);
    expect(await getRun(store, part.id)).toMatchObject({ points_done: 300, results_count: 600, flagged_count: whole.flagged });
    const compared = await compareRuns(store, whole.id, part.id, { output: 'Nu' });
    expect(compared).toMatchObject({ paired: 600, changed: 0, only_a: 0, only_b: 0 });
  });
});
