// The SQLite store on its own: schema and migrations, run bookkeeping, the batch writer's
// all-or-nothing transactions, and the queries the CLI and the dashboard read with.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
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
  type EncodedBatch,
  type NewRunSpec,
  type Store,
} from '../shared/db/index.js';
import { InputError } from '../shared/physics/types.js';

let dir: string;
let store: Store;

beforeEach(async () => {
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-store-'));
  store = await openStore(join(dir, 'test.db'));
});
afterEach(async () => {
  await closeStore(store);
  rmSync(dir, { recursive: true, force: true });
});

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

describe('openStore', () => {
  it('creates the schema in WAL mode and applies nothing when reopened', async () => {
    expect(store.migrated).toEqual(Object.keys(migrations).sort());
    expect(store.migrated[0]).toBe('0001_initial');
    expect(store.sqlite.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(Number(store.sqlite.pragma('busy_timeout', { simple: true }))).toBeGreaterThan(0);
    const tables = store.sqlite.prepare("select name from sqlite_master where type = 'table'").pluck().all();
    expect(tables).toEqual(expect.arrayContaining(['points', 'results', 'runs', 'studies', 'study_versions']));
    const again = await openStore(store.path);
    expect(again.migrated).toEqual([]);
    await closeStore(again);
  });

  it('refuses to create a missing file when asked not to', async () => {
    const missing = join(dir, 'absent.db');
    await expect(openStore(missing, { create: false })).rejects.toThrow(InputError);
    expect(existsSync(missing)).toBe(false);
  });

  it('migrates all the way down and up again', async () => {
    const migrator = new Migrator({ db: store.db, provider: { getMigrations: async () => migrations } });
    const down = await migrator.migrateTo(NO_MIGRATIONS);
    expect(down.error).toBeUndefined();
    const left = store.sqlite
      .prepare("select name from sqlite_master where type = 'table' and name not like 'kysely_%' and name not like 'sqlite_%'")
      .pluck()
      .all();
    expect(left).toEqual([]);
    const up = await migrator.migrateToLatest();
    expect(up.error).toBeUndefined();
    expect(up.results?.map((r) => r.migrationName)).toEqual(Object.keys(migrations).sort());
  });
});

describe('resolveDbPath', () => {
  it('prefers --db, then FILMSWEEP_DB, then ./filmsweep.db', () => {
    const saved = process.env.FILMSWEEP_DB;
    try {
      process.env.FILMSWEEP_DB = 'from-env.db';
      expect(resolveDbPath('given.db')).toBe(resolve('given.db'));
      expect(resolveDbPath()).toBe(resolve('from-env.db'));
      delete process.env.FILMSWEEP_DB;
      expect(resolveDbPath()).toBe(resolve('filmsweep.db'));
    } finally {
      if (saved === undefined) delete process.env.FILMSWEEP_DB;
      else process.env.FILMSWEEP_DB = saved;
    }
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
    expect(store.sqlite.prepare('select count(*) from studies').pluck().get()).toBe(1);
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
    expect(() => store.sqlite.prepare("update runs set status = 'paused' where id = ?").run(id)).toThrow(/CHECK/);
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
    writer.write(batch([2, 3]));
    writer.write(batch([0, 1]));
    const { run, rows } = await getRunRows(store, id);
    expect(run.points_done).toBe(4);
    expect(run.results_count).toBe(8);
    expect(run.flagged_count).toBe(2);
    expect(rows.map((r) => `${r.inputs.Re}/${r.method}`)).toEqual([
      '1000/alpha', '1000/beta', '2000/alpha', '2000/beta', '3000/alpha', '3000/beta', '4000/alpha', '4000/beta',
    ]);
    // Doubles come back bit for bit (JSONB keeps the decimal text JSON.stringify wrote).
    expect(rows[4].outputs).toEqual({ Nu: 12 + 1 / 3, h: 0.1 * Math.PI * 3 });
    expect(rows[7].outputs.Nu_x).toBe(1e-7 * 4);
    expect(rows[3].flags).toEqual(['out-of-range:Re']);
    expect(rows[0].inputs).toEqual({ Re: 1000, Pr: 0.7, heating: true });
  });

  it('refuses a batch whose results do not cover every method of every point', async () => {
    const id = await createRun(store, spec());
    const short = { ...batch([0, 1]), flags: ['[]', '[]', '[]'] };
    short.outputs = short.outputs.slice(0, 3);
    expect(() => createBatchWriter(store, id, ['alpha', 'beta']).write(short)).toThrow(/3 results for 2 methods/);
    expect((await getRun(store, id))!.points_done).toBe(0);
  });

  it('writes a batch entirely or not at all: a duplicate point rolls back the whole batch', async () => {
    const id = await createRun(store, spec());
    const writer = createBatchWriter(store, id, ['alpha', 'beta']);
    writer.write(batch([0, 1]));
    expect(() => writer.write(batch([2, 1]))).toThrow(/UNIQUE|PRIMARY KEY/);
    const run = await getRun(store, id);
    expect(run).toMatchObject({ points_done: 2, results_count: 4 });
    expect(store.sqlite.prepare('select count(*) from results where run_id = ?').pluck().get(id)).toBe(4);
    expect(store.sqlite.prepare('select count(*) from points where run_id = ? and idx = 2').pluck().get(id)).toBe(0);
  });

  it('enforces one result per point and method with a unique index', async () => {
    const id = await createRun(store, spec());
    createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0]));
    const dup = store.sqlite.prepare(
      "insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (?, 0, 1, 'beta', jsonb('{}'), '[]', 0)",
    );
    expect(() => dup.run(id)).toThrow(/UNIQUE/);
  });

  it('summarises per method: points, flagged points, min and max of Nu or else Nu_x', async () => {
    const id = await createRun(store, spec());
    createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0, 1, 2, 3]));
    const summary = await getRunSummary(store, id);
    expect(summary).toEqual([
      { method: 'alpha', version: 1, points: 4, flagged_points: 0, nu_name: 'Nu', nu_min: 10 + 1 / 3, nu_max: 13 + 1 / 3 },
      { method: 'beta', version: 3, points: 4, flagged_points: 2, nu_name: 'Nu_x', nu_min: 1e-7, nu_max: 1e-7 * 4 },
    ]);
  });

  it('lets a second connection read only committed batches while a writer works (WAL)', async () => {
    const id = await createRun(store, spec({ pointsTotal: 400 }));
    const reader = await openStore(store.path);
    try {
      const writer = createBatchWriter(store, id, ['alpha', 'beta']);
      for (let b = 0; b < 100; b++) {
        writer.write(batch([4 * b, 4 * b + 1, 4 * b + 2, 4 * b + 3]));
        const snap = reader.sqlite
          .prepare(
            'select r.points_done, r.results_count, (select count(*) from results where run_id = r.id) n from runs r where id = ?',
          )
          .get(id) as { points_done: number; results_count: number; n: number };
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
    createBatchWriter(store, id, ['alpha', 'beta']).write(batch([0, 3]));
    // A kill -9 cannot leave counters out of step with the rows, but a recount is the truth anyway.
    store.sqlite.prepare('update runs set points_done = 0, results_count = 0, flagged_count = 0 where id = ?').run(id);
    const done = await claimRunForResume(store, id, me, dead);
    expect([...done].sort()).toEqual([0, 3]);
    const run = await getRun(store, id);
    expect(run).toMatchObject({ status: 'running', points_done: 2, results_count: 4, flagged_count: 1, workers: 3 });
    expect(store.sqlite.prepare('select pid from runs where id = ?').pluck().get(id)).toBe(4242);
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
