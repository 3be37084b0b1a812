// The store on its own, on SQLite and (when FILMSWEEP_TEST_PG_URL is set) PostgreSQL:
// schema and migrations, run bookkeeping, the batch writer's all-or-nothing and idempotent
// transactions into each run's table (exact round trip of every value, key order and kind;
// new names in later batches, also from two connections at once), and the queries the CLI
// and the dashboard read with.
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { Migrator, NO_MIGRATIONS } from 'kysely';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { migrations } from '../migrations/index.js';
import {
  claimRunForResume,
  closeStore,
  createBatchWriter,
  createRun,
  finishRun,
  getRun,
  getRunRows,
  getRunSummary,
  listRuns,
  openStore,
  resolveDbPath,
  resolveRunRef,
  ResultBatchEncoder,
  queryResults,
  type EncodedBatch,
  type NewRunSpec,
  type Store,
} from '../shared/db/index.js';
import { chartData } from '../shared/db/chart-query.js';
import { runTableName } from '../shared/db/result-table.js';
import { InputError } from '../shared/physics/types.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

function spec(over: Partial<NewRunSpec> = {}): NewRunSpec {
  return {
    study: { name: 'tiny', title: 'Tiny study', configuration: 'pipe' },
    yaml: 'name: tiny\n',
    hash: 'a'.repeat(64),
    sourceFile: '/studies/tiny.yaml',
    methods: [
      { id: 'alpha', version: 1 },
      { id: 'beta', version: 3 },
    ],
    pointsTotal: 4,
    workers: 2,
    host: 'test-host',
    pid: 999_999,
    gitCommit: null,
    ...over,
  };
}

// Two methods per point; beta gives only a local Nu_x and flags odd points.
function batch(points: number[]): EncodedBatch {
  return {
    points,
    inputs: points.map((i) => JSON.stringify({ Re: 1000 * (i + 1), Pr: 0.7, heating: true })),
    outputs: points.flatMap((i) => [
      JSON.stringify({ Nu: 10 + i + 1 / 3, h: 0.1 * Math.PI * (i + 1) }),
      JSON.stringify({ Nu_x: 1e-7 * (i + 1) }),
    ]),
    flags: points.flatMap((i) => ['[]', i % 2 ? JSON.stringify(['out-of-range:Re']) : '[]']),
  };
}

describe('resolveDbPath', () => {
  it('prefers --db, then FILMSWEEP_DB, then ./filmsweep.db', () => {
    const saved = process.env.FILMSWEEP_DB;
    try {
      process.env.FILMSWEEP_DB = 'from-env.db';
      expect(resolveDbPath('given.db')).toBe(resolve('given.db'));
      expect(resolveDbPath()).toBe(resolve('from-env.db'));
      delete process.env.FILMSWEEP_DB;
      expect(resolveDbPath()).toBe(resolve('filmsweep.db'));
      // A PostgreSQL URL is kept as it is, from either place.
      expect(resolveDbPath('postgres://u:p@db.example:5432/sweeps')).toBe('postgres://u:p@db.example:5432/sweeps');
      process.env.FILMSWEEP_DB = 'postgresql://db.example/sweeps';
      expect(resolveDbPath()).toBe('postgresql://db.example/sweeps');
    } finally {
      if (saved === undefined) delete process.env.FILMSWEEP_DB;
      else process.env.FILMSWEEP_DB = saved;
    }
  });
});

describe.each(STORE_KINDS)('the store on %s', (kind) => {
  let database: TestDatabase;
  let store: Store;

  beforeEach(async () => {
    database = await createTestDatabase(kind);
    store = await openStore(database.location);
  });
  afterEach(async () => {
    await closeStore(store);
    await database.drop();
  });

  const count = async (query: string, ...params: unknown[]) => {
    const [row] = await store.dialect.all<{ n: unknown }>(query, params);
    return Number(row.n);
  };

  const tables = async (): Promise<string[]> =>
    (
      await store.dialect.all<{ name: string }>(
        kind === 'sqlite'
          ? "select name from sqlite_master where type = 'table'"
          : "select table_name as name from information_schema.tables where table_schema = current_schema()",
      )
    ).map((t) => t.name);

  describe('openStore', () => {
    it('creates the schema (SQLite: in WAL mode) and applies nothing when reopened', async () => {
      expect(store.migrated).toEqual(Object.keys(migrations).sort());
      expect(store.migrated[0]).toBe('0001_initial');
      expect(store.kind).toBe(kind);
      if (kind === 'sqlite') {
        expect(store.sqlite.pragma('journal_mode', { simple: true })).toBe('wal');
        expect(Number(store.sqlite.pragma('busy_timeout', { simple: true }))).toBeGreaterThan(0);
      } else {
        expect(() => store.sqlite).toThrow(/PostgreSQL/);
        expect(store.path).not.toContain(':filmsweep@'); // the password is not shown
      }
      expect(await tables()).toEqual(expect.arrayContaining(['points', 'results', 'runs', 'studies', 'study_versions', 'result_columns', 'result_shapes']));
      const again = await openStore(database.location);
      expect(again.migrated).toEqual([]);
      await closeStore(again);
    });

    it.runIf(kind === 'sqlite')('refuses to create a missing file when asked not to', async () => {
      const dir = dirname(database.location);
      const missing = join(dir, 'absent.db');
      await expect(openStore(missing, { create: false })).rejects.toThrow(InputError);
      expect(existsSync(missing)).toBe(false);
    });

    it('migrates all the way down and up again', async () => {
      const migrator = new Migrator({ db: store.db, provider: { getMigrations: async () => migrations } });
      const down = await migrator.migrateTo(NO_MIGRATIONS);
      expect(down.error).toBeUndefined();
      expect((await tables()).filter((t) => !t.startsWith('kysely_') && !t.startsWith('sqlite_'))).toEqual([]);
      const up = await migrator.migrateToLatest();
      expect(up.error).toBeUndefined();
      expect(up.results?.map((r) => r.migrationName)).toEqual(Object.keys(migrations).sort());
    });
  });

  describe('runs and study versions', () => {
    it('stores one version per distinct study text', async () => {
      const a = await createRun(store, spec());
      const b = await createRun(store, spec());
      const c = await createRun(store, spec({ yaml: 'name: tiny\n# edited\n', hash: 'b'.repeat(64) }));
      const [ra, rb, rc] = await Promise.all([a, b, c].map((id) => getRun(store, id)));
      expect(ra!.study_version).toBe(1);
      expect(rb!.study_version).toBe(1);
      expect(rc!.study_version).toBe(2);
      expect(rc!.yaml_hash).toBe('b'.repeat(64));
      expect(await count('select count(*) as n from studies')).toBe(1);
    });

    it('gives RunInfo its documented shape', async () => {
      const id = await createRun(store, spec({ gitCommit: 'c'.repeat(40) }));
      const run = await getRun(store, id);
      expect(Object.keys(run!).sort()).toEqual(
        [
          'id', 'study', 'study_version', 'title', 'configuration', 'status', 'started_at', 'finished_at', 'git_commit',
          'host', 'workers', 'points_total', 'points_done', 'results_count', 'flagged_count', 'methods', 'yaml_hash',
        ].sort(),
      );
      expect(run).toMatchObject({
        study: 'tiny',
        title: 'Tiny study',
        configuration: 'pipe',
        status: 'running',
        git_commit: 'c'.repeat(40),
        finished_at: null,
        methods: [
          { id: 'alpha', version: 1 },
          { id: 'beta', version: 3 },
        ],
      });
      expect(new Date(run!.started_at!).toISOString()).toBe(run!.started_at);
      await finishRun(store, id, 'done');
      const done = await getRun(store, id);
      expect(done!.status).toBe('done');
      expect(Date.parse(done!.finished_at!)).toBeGreaterThanOrEqual(Date.parse(done!.started_at!));
    });

    it('refuses a status outside the five of the design', async () => {
      const id = await createRun(store, spec());
      await expect(store.dialect.run("update runs set status = 'paused' where id = ?", [id])).rejects.toThrow(/CHECK|check constraint/);
    });

    it('resolves latest and ids, and rejects unknown references as bad input', async () => {
      await expect(resolveRunRef(store, 'latest')).rejects.toThrow(InputError);
      const first = await createRun(store, spec());
      const second = await createRun(store, spec());
      expect((await resolveRunRef(store, 'latest')).id).toBe(second);
      expect((await resolveRunRef(store, String(first))).id).toBe(first);
      await expect(resolveRunRef(store, '42')).rejects.toThrow(/no run 42/);
      await expect(resolveRunRef(store, 'abc')).rejects.toThrow(InputError);
      expect((await listRuns(store)).map((r) => r.id)).toEqual([second, first]);
    });
  });

  describe('batch writer and row queries', () => {
    it('round-trips rows exactly, in point order then method order, whatever the write order', async () => {
      const id = await createRun(store, spec());
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      await writer.write(batch([2, 3]));
      await writer.write(batch([0, 1]));
      const { run, rows } = await getRunRows(store, id);
      expect(run.points_done).toBe(4);
      expect(run.results_count).toBe(8);
      expect(run.flagged_count).toBe(2);
      expect(rows.map((r) => `${r.inputs.Re}/${r.method}`)).toEqual([
        '1000/alpha', '1000/beta', '2000/alpha', '2000/beta', '3000/alpha', '3000/beta', '4000/alpha', '4000/beta',
      ]);
      // Doubles come back bit for bit (SQLite's JSONB and PostgreSQL's json keep the decimal
      // text JSON.stringify wrote), and so does the key order.
      expect(rows[4].outputs).toEqual({ Nu: 12 + 1 / 3, h: 0.1 * Math.PI * 3 });
      expect(rows[7].outputs.Nu_x).toBe(1e-7 * 4);
      expect(rows[3].flags).toEqual(['out-of-range:Re']);
      expect(rows[0].inputs).toEqual({ Re: 1000, Pr: 0.7, heating: true });
      expect(Object.keys(rows[0].inputs)).toEqual(['Re', 'Pr', 'heating']);
      expect(JSON.stringify(rows.map((r) => r.outputs))).toBe(`[${batch([0, 1, 2, 3]).outputs.join(',')}]`);
    });

    it('stores large batches exactly, written in order, out of order and after a gap, with a few flagged or differently shaped rows among the rest', async () => {
      // 600 points × 2 methods per batch: several multi-row statements each. Most rows share
      // one shape and have no flags (the writer's uniform statements, and on SQLite the
      // batches that continue the highest seq leave the numbering to SQLite); every 131st
      // point's alpha row is flagged and every 97th point's beta row has one output more.
      const wide = (from: number, to: number): EncodedBatch => {
        const points = Array.from({ length: to - from }, (_, k) => from + k);
        return {
          points,
          inputs: points.map((i) => JSON.stringify({ Re: 1e4 + 37.5 * i, Pr: 0.7 + i / 7 })),
          outputs: points.flatMap((i) => [
            JSON.stringify({ Nu: 20 + Math.sqrt(i), f: 0.02 + 1 / (i + 3) }),
            JSON.stringify(i % 97 === 5 ? { Nu: 21 + Math.cbrt(i), f: 0.03, Gz: i / 3 } : { Nu: 21 + Math.cbrt(i), f: 0.03 }),
          ]),
          flags: points.flatMap((i) => [i % 131 === 7 ? JSON.stringify(['out-of-range:Pr']) : '[]', '[]']),
        };
      };
      const id = await createRun(store, spec({ pointsTotal: 3000 }));
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      for (const [from, to] of [[0, 600], [600, 1200], [1800, 2400], [1200, 1800], [2400, 3000]]) await writer.write(wide(from, to));
      const { run, rows } = await getRunRows(store, id);
      const all = wide(0, 3000);
      expect(run.points_done).toBe(3000);
      expect(run.results_count).toBe(6000);
      expect(run.flagged_count).toBe(all.flags.filter((f) => f !== '[]').length);
      expect(rows.map((r) => r.method)).toEqual(all.points.flatMap(() => ['alpha', 'beta']));
      expect(JSON.stringify(rows.map((r) => r.inputs))).toBe(`[${all.inputs.flatMap((i) => [i, i]).join(',')}]`);
      expect(JSON.stringify(rows.map((r) => r.outputs))).toBe(`[${all.outputs.join(',')}]`);
      expect(JSON.stringify(rows.map((r) => r.flags))).toBe(`[${all.flags.join(',')}]`);
    });

    it('refuses a batch whose results do not cover every method of every point', async () => {
      const id = await createRun(store, spec());
      const short = { ...batch([0, 1]), flags: ['[]', '[]', '[]'] };
      short.outputs = short.outputs.slice(0, 3);
      await expect(createBatchWriter(store, id, ['alpha', 'beta']).write(short)).rejects.toThrow(/3 results for 2 methods/);
      expect((await getRun(store, id))!.points_done).toBe(0);
    });

    it('writes a batch entirely or not at all: a row the database refuses rolls back the whole batch', async () => {
      const id = await createRun(store, spec());
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      await writer.write(batch([0, 1]));
      const table = runTableName(id);
      // The last row of the next batch (point 3, method beta: seq 7) is refused.
      if (kind === 'sqlite') {
        await store.dialect.run(`create trigger refuse_seq_7 before insert on ${table} when new.seq = 7 begin select raise(abort, 'refused'); end`);
      } else {
        await store.dialect.run("create function refuse_seq_7() returns trigger language plpgsql as $$ begin if new.seq = 7 then raise exception 'refused'; end if; return new; end $$");
        await store.dialect.run(`create trigger refuse_seq_7 before insert on ${table} for each row execute function refuse_seq_7()`);
      }
      // The batch's point summaries are part of the same transaction: none is left behind.
      const summaries = [{ first: 2, end: 4, facts: '{"recommended":[0,0],"applicable":[[0],[0]],"spread":[null,null],"spread_of":[null,null]}', counts: '{"0":2}' }];
      await expect(writer.write({ ...batch([2, 3]), summaries })).rejects.toThrow(/refused/);
      expect(await count(`select count(*) as n from point_summaries where run_id = ${id}`)).toBe(0);
      const run = await getRun(store, id);
      expect(run).toMatchObject({ points_done: 2, results_count: 4, flagged_count: 1 });
      expect(await count(`select count(*) as n from ${table}`)).toBe(4);
      expect(await count(`select count(*) as n from ${table} where seq >= 4`)).toBe(0);
      expect((await getRunSummary(store, id)).map((m) => m.points)).toEqual([2, 2]);
      // Once the database takes the rows, their summaries go in with them.
      await store.dialect.run(kind === 'sqlite' ? 'drop trigger refuse_seq_7' : `drop trigger refuse_seq_7 on ${table}`);
      await writer.write({ ...batch([2, 3]), summaries });
      expect(await count(`select count(*) as n from point_summaries where run_id = ${id} and first_idx = 2 and end_idx = 4`)).toBe(1);
    });

    it('is idempotent: a batch written again inserts nothing and leaves the counters alone', async () => {
      const id = await createRun(store, spec());
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      expect(await writer.write(batch([0, 1]))).toEqual({ points: 2, results: 4, flagged: 1 });
      // A retried queue job: the same batch, then one overlapping a stored point.
      expect(await writer.write(batch([0, 1]))).toEqual({ points: 0, results: 0, flagged: 0 });
      expect(await writer.write(batch([1, 2, 3]))).toEqual({ points: 2, results: 4, flagged: 1 });
      expect(await getRun(store, id)).toMatchObject({ points_done: 4, results_count: 8, flagged_count: 2 });
      expect(await count(`select count(*) as n from ${runTableName(id)}`)).toBe(8);
      expect((await getRunRows(store, id)).rows).toHaveLength(8);
      // The per-method figures count each row once too.
      const summary = await getRunSummary(store, id);
      expect(summary.map((m) => [m.points, m.flagged_points, m.nu_min, m.nu_max])).toEqual([
        [4, 0, 10 + 1 / 3, 13 + 1 / 3],
        [4, 2, 1e-7, 1e-7 * 4],
      ]);
    });

    it('counts each row once when two connections write overlapping batches at the same time', async () => {
      const id = await createRun(store, spec({ pointsTotal: 200 }));
      const other = await openStore(database.location);
      try {
        const mine = createBatchWriter(store, id, ['alpha', 'beta']);
        const theirs = createBatchWriter(other, id, ['alpha', 'beta']);
        const writes: Promise<unknown>[] = [];
        for (let b = 0; b < 20; b++) {
          const points = Array.from({ length: 10 }, (_, i) => 10 * b + i);
          writes.push(mine.write(batch(points)), theirs.write(batch([...points].reverse())));
        }
        await Promise.all(writes);
      } finally {
        await closeStore(other);
      }
      expect(await getRun(store, id)).toMatchObject({ points_done: 200, results_count: 400, flagged_count: 100 });
      expect(await count(`select count(*) as n from ${runTableName(id)}`)).toBe(400);
      expect(await count(`select count(*) as n from ${runTableName(id)} where seq % 2 = 0`)).toBe(200);
      expect((await getRunSummary(store, id)).map((m) => [m.points, m.flagged_points])).toEqual([
        [200, 0],
        [200, 100],
      ]);
    });

    it('keeps one result per point and method: the run table is keyed by point × methods + method', async () => {
      const id = await createRun(store, spec());
      await createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0]));
      const dup = `insert into ${runTableName(id)} (seq, shape, flags) values (1, 0, null)`;
      await expect(store.dialect.run(dup)).rejects.toThrow(/UNIQUE|duplicate key/);
    });

    it('gives back every value as the engine had it: kinds, key order per row, new names in later batches, non-finite outputs flagged', async () => {
      const id = await createRun(store, spec({ pointsTotal: 6 }));
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      const inputsOf = (i: number) =>
        i < 3
          ? { Re: 1e5 * (i + 1), arrangement: 'staggered', heating: i % 2 === 0, Pr: 0.1 + 0.2 }
          : // Later points: another key order, a name first seen here, a value of another kind for a known name, a nested value.
            { Pr: -0, Re: 'high', extra: { a: [1, 2] }, heating: false };
      const outputsOf = (i: number, m: number): Record<string, number> =>
        m === 0 ? { Nu: 1 / (i + 3), f: Number.MAX_VALUE, tiny: 5e-324 } : i === 4 ? { h: Number.NaN, Nu_x: -1.5e-300 } : { Nu_x: i * 1e21, h: 2 ** -40 };
      const expected: { inputs: Record<string, unknown>; outputs: Record<string, number>; flags: string[] }[] = [];
      for (const points of [[0, 1, 2], [3, 4, 5]]) {
        const encoder = new ResultBatchEncoder(2, points.length);
        for (const i of points) {
          encoder.addPoint(i, inputsOf(i) as never);
          for (let m = 0; m < 2; m++) {
            const flags = i === 1 && m === 1 ? ['out-of-range:Re'] : [];
            encoder.addResult(outputsOf(i, m), flags);
            const outputs = JSON.parse(JSON.stringify(outputsOf(i, m)));
            if (i === 4 && m === 1) delete outputs.h; // NaN is left out and flagged
            expected.push({
              inputs: JSON.parse(JSON.stringify(inputsOf(i))),
              outputs,
              flags: i === 4 && m === 1 ? ['non-finite:h'] : flags,
            });
          }
        }
        await writer.write(encoder.finish());
      }
      const { rows } = await getRunRows(store, id);
      // toEqual ignores key order and -0: compare the JSON text, which does not.
      expect(JSON.stringify(rows.map(({ inputs, outputs, flags }) => ({ inputs, outputs, flags })))).toBe(JSON.stringify(expected));
      expect(Object.is(rows[6].inputs.Pr, 0)).toBe(true);
      expect(rows[0].outputs.tiny).toBe(5e-324);
      expect(await getRun(store, id)).toMatchObject({ points_done: 6, results_count: 12, flagged_count: 2 });

      // The dashboard's queries: filters and chart axes take numbers (Re is text in later
      // points: those count as missing), a sort may take text.
      const filtered = await queryResults(store, id, { filters: [{ name: 'Re', min: 2e5 }], sort: 'Re' });
      expect(filtered.rows.map((r) => [r.point, r.inputs.Re])).toEqual([[1, 2e5], [1, 2e5], [2, 3e5], [2, 3e5]]);
      const byText = await queryResults(store, id, { sort: 'arrangement', order: 'desc', pageSize: 2 });
      expect(byText.rows.map((r) => r.inputs.arrangement)).toEqual(['staggered', 'staggered']);
      const chart = await chartData(store, id, { x: 'Re', y: 'Nu' });
      expect(chart.total).toBe(3);
      expect(chart.series.map((x) => x.points.map((p) => p[0]))).toEqual([[1e5, 2e5, 3e5]]);
    });

    it('lets two connections add new names to one run at the same time without losing any', async () => {
      const id = await createRun(store, spec({ pointsTotal: 40 }));
      const other = await openStore(database.location);
      try {
        const writers = [createBatchWriter(store, id, ['alpha', 'beta']), createBatchWriter(other, id, ['alpha', 'beta'])];
        // Each batch brings an output name of its own.
        await Promise.all(
          Array.from({ length: 20 }, (_, b) => {
            const encoder = new ResultBatchEncoder(2, 2);
            for (const i of [2 * b, 2 * b + 1]) {
              encoder.addPoint(i, { Re: i });
              encoder.addResult({ Nu: i, [`only_${b}`]: b }, []);
              encoder.addResult({ Nu: 0 - i }, []);
            }
            return writers[b % 2].write(encoder.finish());
          }),
        );
      } finally {
        await closeStore(other);
      }
      const { rows } = await getRunRows(store, id);
      expect(rows).toHaveLength(80);
      rows.forEach((r, k) => {
        const i = Math.floor(k / 2);
        expect(r.outputs).toEqual(k % 2 ? { Nu: 0 - i } : { Nu: i, [`only_${Math.floor(i / 2)}`]: Math.floor(i / 2) });
      });
    });

    it('summarises per method: points, flagged points, min and max of Nu or else Nu_x', async () => {
      const id = await createRun(store, spec());
      await createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0, 1, 2, 3]));
      const summary = await getRunSummary(store, id);
      expect(summary).toEqual([
        { method: 'alpha', version: 1, points: 4, flagged_points: 0, nu_name: 'Nu', nu_min: 10 + 1 / 3, nu_max: 13 + 1 / 3 },
        { method: 'beta', version: 3, points: 4, flagged_points: 2, nu_name: 'Nu_x', nu_min: 1e-7, nu_max: 1e-7 * 4 },
      ]);
    });

    it('lets a second connection read only committed batches while a writer works (SQLite: WAL)', async () => {
      const id = await createRun(store, spec({ pointsTotal: 400 }));
      const reader = await openStore(database.location);
      try {
        const writer = createBatchWriter(store, id, ['alpha', 'beta']);
        for (let b = 0; b < 100; b++) {
          const written = writer.write(batch([4 * b, 4 * b + 1, 4 * b + 2, 4 * b + 3]));
          const [snap] = await reader.dialect.all<{ points_done: number; results_count: number; n: number }>(
            `select r.points_done, r.results_count, (select count(*) from ${runTableName(id)}) n from runs r where id = ?`,
            [id],
          );
          await written;
          snap.n = Number(snap.n);
          expect(snap.n).toBe(snap.results_count);
          expect(snap.results_count).toBe(2 * snap.points_done);
        }
      } finally {
        await closeStore(reader);
      }
    });
  });

  describe('claimRunForResume', () => {
    const alive = () => true;
    const dead = () => false;
    const me = { host: 'test-host', pid: 4242, workers: 3 };

    it('refuses a done run and a running run whose process is alive', async () => {
      const id = await createRun(store, spec());
      await expect(claimRunForResume(store, id, me, alive)).rejects.toThrow(/still running/);
      await finishRun(store, id, 'done');
      await expect(claimRunForResume(store, id, me, dead)).rejects.toThrow(/already done/);
      await expect(claimRunForResume(store, 999, me, dead)).rejects.toThrow(/no run 999/);
    });

    it('takes over a dead run, returns its stored points and recounts its counters from the rows', async () => {
      const id = await createRun(store, spec());
      await createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0, 3]));
      // A kill -9 cannot leave counters out of step with the rows, but a recount is the truth anyway.
      await store.dialect.run('update runs set points_done = 0, results_count = 0, flagged_count = 0 where id = ?', [id]);
      const done = await claimRunForResume(store, id, me, dead);
      expect([...done].sort()).toEqual([0, 3]);
      const run = await getRun(store, id);
      expect(run).toMatchObject({ status: 'running', points_done: 2, results_count: 4, flagged_count: 1, workers: 3 });
      expect(await count('select pid as n from runs where id = ?', id)).toBe(4242);
    });

    it('resumes interrupted and failed runs whatever their pid', async () => {
      const a = await createRun(store, spec());
      await finishRun(store, a, 'interrupted');
      await expect(claimRunForResume(store, a, me, alive)).resolves.toBeInstanceOf(Set);
      const b = await createRun(store, spec());
      await finishRun(store, b, 'failed', 'boom');
      await expect(claimRunForResume(store, b, me, alive)).resolves.toBeInstanceOf(Set);
    });
  });
});
