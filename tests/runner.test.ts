// The sweep runner in-process: worker pool (the compiled worker from dist/, so `npm test`
// builds first), batching, stored rows against the engine called directly, stop/resume,
// failures and the refusals of resume; on SQLite and, when FILMSWEEP_TEST_PG_URL is set,
// on PostgreSQL.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { closeStore, getRun, getRunRows, getRunSummary, openStore, type Store } from '../shared/db/index.js';
import { runTableName } from '../shared/db/result-table.js';
import { compileSolver, type ResultRow } from '../shared/physics/engine.js';
import { InputError } from '../shared/physics/types.js';
import { createPool } from '../shared/runner/pool.js';
import { BatchSizer, MAX_BATCH_RESULTS, MIN_BATCH, prepareStudy, resumeRun, runStudy, type PreparedStudy } from '../shared/runner/index.js';
import { expandPoints, loadStudyFile } from '../shared/study/index.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

let dir: string;
let store: Store;
let database: TestDatabase;

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-runner-'));
});
afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

/** One value of the first row, as a number or a string. */
async function valueOf(query: string, ...params: unknown[]): Promise<unknown> {
  const [row] = await store.dialect.all<Record<string, unknown>>(query, params);
  return Object.values(row)[0];
}

// A dimensionless pipe sweep: 30 × 20 = 600 points, two correlations each; the low-Re
// corner is outside Dittus–Boelter's range, so some results carry flags.
const PIPE = `name: runner-pipe
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: true
sweep:
  over:
    Re: {from: 4.0e3, to: 1.0e6, count: 30, spacing: log}
    Pr: {from: 0.7, to: 120, count: 20, spacing: log}
`;

function prepare(text: string, name = 'study.yaml'): PreparedStudy {
  const file = join(dir, name);
  writeFileSync(file, text);
  return prepareStudy(loadStudyFile(file));
}

/** The rows the engine gives when called directly on the expanded sweep, in this thread. */
function reference(p: PreparedStudy): ResultRow[] {
  const solve = compileSolver(p.plan, { strict: false });
  return expandPoints(p.loaded.study).flatMap((point) => solve(point));
}

describe.each(STORE_KINDS)('on %s', (kind) => {
  beforeEach(async () => {
    database = await createTestDatabase(kind, 'runs');
    store = await openStore(database.location);
  });
  afterEach(async () => {
    await closeStore(store);
    await database.drop();
  });

  describe('runStudy', () => {
    it('stores exactly the rows the engine computes, one per point and method, for any worker count and batch size', async () => {
      const p = prepare(PIPE);
      const expected = reference(p);
      expect(expected.length).toBe(600 * 2);
      expect(expected.some((r) => r.flags.length > 0)).toBe(true);
      const outcomes = [];
      for (const [workers, batchSize] of [[1, undefined], [2, 7], [3, 64], [2, undefined]] as const) {
        const o = await runStudy(store, p, { workers, batchSize });
        outcomes.push(o);
        expect(o).toMatchObject({ status: 'done', points_total: 600, points_done: 600, results: 1200 });
        const { run, rows } = await getRunRows(store, o.id);
        expect(rows).toEqual(expected);
        expect(run).toMatchObject({ status: 'done', workers, points_done: 600, results_count: 1200 });
        expect(run.flagged_count).toBe(expected.filter((r) => r.flags.length > 0).length);
      }
      expect(new Set(outcomes.map((o) => o.flagged)).size).toBe(1);
    });

    it('computes each study on its own in a pool started beforehand and shared by several runs', async () => {
      // The threads get each batch's study with the task: a thread that computed the first
      // study must compile the second (other methods, other sweep) before its points.
      const first = prepare(PIPE, 'first.yaml');
      const second = prepare(
        PIPE.replace('name: runner-pipe', 'name: runner-pipe-two').replace('[gnielinski, dittus-boelter]', '[sieder-tate, gnielinski, dittus-boelter]').replace('count: 30', 'count: 12'),
        'second.yaml',
      );
      const pool = createPool(2);
      try {
        for (const p of [first, second, first]) {
          const o = await runStudy(store, p, { workers: 2, batchSize: 40, pool });
          expect(o.status).toBe('done');
          expect((await getRunRows(store, o.id)).rows).toEqual(reference(p));
        }
        // The runs leave the caller's pool running.
        expect(pool.threads.length).toBe(2);
      } finally {
        await pool.destroy();
      }
    });

    it('reports progress up to the total and the run in the database as it goes', async () => {
      const p = prepare(PIPE);
      const seen: number[] = [];
      let started: number | undefined;
      const o = await runStudy(store, p, {
        workers: 2,
        batchSize: 50,
        onStart: (info) => (started = info.runId),
        onProgress: (q) => seen.push(q.done),
      });
      expect(started).toBe(o.id);
      expect(seen.length).toBe(12);
      expect(seen.at(-1)).toBe(600);
      expect([...seen].sort((a, b) => a - b)).toEqual(seen);
    });

    it('stops scheduling on the stop signal, ends interrupted, and resume completes the same rows', async () => {
      const p = prepare(PIPE);
      const stop = new AbortController();
      let batches = 0;
      const o = await runStudy(store, p, {
        workers: 2,
        batchSize: 25,
        stop: stop.signal,
        onProgress: () => {
          if (++batches === 3) stop.abort();
        },
      });
      expect(o.status).toBe('interrupted');
      expect(o.points_done).toBeGreaterThanOrEqual(75);
      expect(o.points_done).toBeLessThan(600);
      expect((await getRun(store, o.id))!.status).toBe('interrupted');

      const seen: number[] = [];
      const r = await resumeRun(store, o.id, { workers: 1, onStart: (info) => seen.push(info.done) });
      expect(seen).toEqual([o.points_done]);
      expect(r).toMatchObject({ id: o.id, status: 'done', points_done: 600, results: 1200 });
      const { rows } = await getRunRows(store, o.id);
      expect(rows).toEqual(reference(p));
    });

    it('drops batches in flight on cancel and still leaves a resumable run', async () => {
      const p = prepare(PIPE);
      const stop = new AbortController();
      const cancel = new AbortController();
      const o = await runStudy(store, p, {
        workers: 2,
        batchSize: 10,
        stop: stop.signal,
        cancel: cancel.signal,
        onProgress: (q) => {
          if (q.done >= 100) {
            stop.abort();
            cancel.abort();
          }
        },
      });
      expect(o.status).toBe('interrupted');
      const r = await resumeRun(store, o.id, { workers: 2 });
      expect(r.status).toBe('done');
      expect((await getRunRows(store, o.id)).rows).toEqual(reference(p));
    });

    it('marks the run failed with the error when a point cannot be computed, keeping committed batches', async () => {
      const p = prepare(`name: runner-fails
configuration: pipe
methods: [dittus-boelter]
fluid: water
inputs:
  diameter: 25 mm
sweep:
  over:
    velocity: [1, 2, 3]
    fluid_temperature: [300 K, 310 K]
`);
      // After validation, make every second point impossible (a temperature that is not a
      // number is an input error in the engine), as a point prepareStudy cannot foresee.
      p.loaded.study.sweep.over.fluid_temperature = { kind: 'list', values: [300, Number.NaN] };
      const o = await runStudy(store, p, { workers: 1, batchSize: 1, inFlight: 1 });
      expect(o.status).toBe('failed');
      expect(o.error).toMatch(/fluid_temperature/);
      const run = await getRun(store, o.id);
      expect(run!.status).toBe('failed');
      expect(run!.points_done).toBe(1);
      expect(await valueOf('select error from runs where id = ?', o.id)).toMatch(/finite number/);
    });

    it('rejects a study whose first point the engine cannot use before anything is written', async () => {
      // Dimensional inputs without a fluid: the engine cannot derive Re.
      expect(() =>
        prepare(`name: runner-no-fluid
configuration: pipe
methods: [dittus-boelter]
inputs:
  diameter: 25 mm
  fluid_temperature: 300 K
sweep:
  over:
    velocity: [1, 2]
`),
      ).toThrow();
      expect(Number(await valueOf('select count(*) as n from runs'))).toBe(0);
    });
  });

  describe('resumeRun', () => {
    it('refuses a done run, a run whose process is alive, and an unknown run', async () => {
      const p = prepare(PIPE);
      const o = await runStudy(store, p, { workers: 1 });
      await expect(resumeRun(store, o.id)).rejects.toThrow(/already done/);
      // Pretend this very process is running it: its pid is alive on this host.
      await store.dialect.run("update runs set status = 'running', pid = ? where id = ?", [process.pid, o.id]);
      await expect(resumeRun(store, o.id)).rejects.toThrow(/still running/);
      await expect(resumeRun(store, 9999)).rejects.toThrow(InputError);
    });

    it('takes over a running run whose process is dead and computes only the missing points', async () => {
      const p = prepare(PIPE);
      const o = await runStudy(store, p, { workers: 2, batchSize: 40 });
      // Simulate a kill -9 after some batches: drop the later points' rows, keep status running.
      const keep = new Set([0, 1, 2, 40, 41, 599]);
      const kept = [...keep].join(', ');
      const table = runTableName(o.id);
      // A mark on the kept rows that a rewrite of them would lose.
      await store.dialect.atomic([
        { sql: `delete from ${table} where seq / 2 not in (${kept})` },
        { sql: `alter table ${table} add column probe integer` },
        { sql: `update ${table} set probe = 1` },
      ]);
      await store.dialect.run("update runs set status = 'running', pid = 2147483646, finished_at = null where id = ?", [o.id]);
      const seen: number[] = [];
      const r = await resumeRun(store, o.id, { workers: 2, onStart: (info) => seen.push(info.done) });
      expect(seen).toEqual([keep.size]);
      expect(r).toMatchObject({ status: 'done', points_done: 600, results: 1200 });
      // The six kept points were not rewritten: their rows still carry the mark.
      const marked = await store.dialect.all<{ seq: unknown }>(`select seq from ${table} where probe = 1 order by seq`);
      expect(marked.map((m) => Number(m.seq))).toEqual([...keep].flatMap((point) => [2 * point, 2 * point + 1]));
      // The per-method figures were recounted from the rows when the run was taken over.
      expect((await getRunSummary(store, o.id)).map((m) => m.points)).toEqual([600, 600]);
      expect((await getRunRows(store, o.id)).rows).toEqual(reference(p));
    });

    it('refuses to mix method versions: the stored run used another version of a method', async () => {
      const p = prepare(PIPE);
      const stop = new AbortController();
      stop.abort();
      const o = await runStudy(store, p, { workers: 1, stop: stop.signal });
      expect(o).toMatchObject({ status: 'interrupted', points_done: 0 });
      await store.dialect.run('update runs set methods = ? where id = ?', [
        JSON.stringify([{ id: 'gnielinski', version: 0 }, { id: 'dittus-boelter', version: 1 }]),
        o.id,
      ]);
      await expect(resumeRun(store, o.id)).rejects.toThrow(/gnielinski v0/);
    });
  });
});

describe('BatchSizer', () => {
  it('starts small, then sizes batches to the target compute time within its bounds', () => {
    const s = new BatchSizer(1_000_000, 2);
    expect(s.next()).toBe(MIN_BATCH);
    s.observe(16, 16 * 0.01); // 10 µs per point: 0.2 s is 20,000 points
    expect(s.next()).toBe(20_000);
    const cheap = new BatchSizer(1_000_000, 2);
    cheap.observe(16, 16 * 0.0001); // 0.1 µs per point: capped at the batch's results, 32,000 for one method …
    expect(cheap.next()).toBe(MAX_BATCH_RESULTS);
    const four = new BatchSizer(1_000_000, 2, undefined, 1, 4);
    four.observe(16, 16 * 0.0001);
    expect(four.next()).toBe(MAX_BATCH_RESULTS / 4); // … and 8,000 points for four
    const slow = new BatchSizer(1_000_000, 2);
    slow.observe(16, 16 * 5); // 5 ms per point: 40 points make 0.2 s
    expect(slow.next()).toBe(40);
    const tail = new BatchSizer(100, 2);
    tail.observe(16, 0.016);
    expect(tail.next()).toBe(MIN_BATCH); // never fewer than four batches per worker … nor below the minimum
    expect(new BatchSizer(10, 1, 3).next()).toBe(3);
    expect(() => new BatchSizer(10, 1, 0)).toThrow(RangeError);
  });
});
