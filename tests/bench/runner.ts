// End to end (YAML → worker pool → SQLite) against a raw better-sqlite3 insert loop of
// the same rows, and 1 against 2 workers on a compute-heavy similarity sweep.
import { once } from 'node:events';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import BetterSqlite3 from 'better-sqlite3';
import { closeStore, openStore } from '../../shared/db/index.js';
import { runStudyFile } from '../../shared/runner/index.js';
import { fmt, time, timeAsync, type BenchContext } from './timing.js';

const E2E_STUDY = `name: bench-pipe-map
configuration: pipe
methods: [dittus-boelter, gnielinski]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: 1000, spacing: log}
    Pr: {from: 0.7, to: 100, count: 500, spacing: log}
`;

export async function benchEndToEnd(ctx: BenchContext) {
  const file = ctx.study('bench-pipe-map', E2E_STUDY);
  const db = join(ctx.dir, 'e2e.db');
  const e2e = await timeAsync(() => runStudyFile(file, { db, workers: 2 }));
  const results = e2e.value.results;
  const e2eRate = results / e2e.seconds;

  // The same rows, read back, inserted by a plain loop of prepared statements into a
  // fresh database with the same schema, 1000 points per transaction.
  const src = new BetterSqlite3(db, { readonly: true });
  const points = src.prepare('select idx, json(inputs) as inputs from points where run_id = ? order by idx').raw().all(e2e.value.id) as [number, string][];
  const rows = src
    .prepare('select point_idx, method_idx, method, json(outputs), flags, flagged from results where run_id = ? order by point_idx, method_idx')
    .raw()
    .all(e2e.value.id) as [number, number, string, string, string, number][];
  src.close();
  const rawPath = join(ctx.dir, 'raw.db');
  await closeStore(await openStore(rawPath)); // same migrations, same schema
  const raw = new BetterSqlite3(rawPath);
  raw.pragma('journal_mode = WAL');
  raw.pragma('synchronous = NORMAL');
  raw.pragma('foreign_keys = OFF');
  const insertPoint = raw.prepare('insert into points (run_id, idx, inputs) values (1, ?, jsonb(?))');
  const insertResult = raw.prepare(
    'insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (1, ?, ?, ?, jsonb(?), ?, ?)',
  );
  const M = rows.length / points.length;
  const batch = raw.transaction((from: number, to: number) => {
    for (let i = from; i < to; i++) {
      insertPoint.run(points[i][0], points[i][1]);
      for (let k = i * M; k < (i + 1) * M; k++) {
        const r = rows[k];
        insertResult.run(r[0], r[1], r[2], r[3], r[4], r[5]);
      }
    }
  });
  const rawTime = time(() => {
    for (let i = 0; i < points.length; i += 1000) batch(i, Math.min(points.length, i + 1000));
  });
  raw.close();
  const rawRate = rows.length / rawTime.seconds;
  console.log(`end to end, YAML → SQLite (2 workers): ${fmt(results)} results in ${fmt(e2e.seconds)} s = ${fmt(e2eRate)} results/s`);
  console.log(`raw better-sqlite3 insert loop, same rows:  ${fmt(rows.length)} results in ${fmt(rawTime.seconds)} s = ${fmt(rawRate)} results/s`);
  console.log(`  ratio end to end / raw insert: ${fmt(e2eRate / rawRate)} (goal ≥ 0.5)`);
}

// 2400 m values: about 9 s on one thread, so the fixed start-up of a run (about 0.4 s of
// validation, store and worker start that no worker count shortens) does not stand in for
// the scaling. With 1200 m it capped the ratio near 1.6 on a machine whose two cores scale 1.85×.
// The queue section sweeps the same study.
export const SIMILARITY_SWEEP_M = 2400;
export const similaritySweepStudy = (name: string) => `name: ${name}
configuration: wedge
methods: [similarity]
inputs:
  Re: 1.0e5
sweep:
  over:
    m: {from: 0, to: 3, count: ${SIMILARITY_SWEEP_M}}
    Pr: [0.01, 0.7, 7, 100, 1000]
`;

export async function benchWorkers(ctx: BenchContext) {
  const file = ctx.study('bench-wedge-workers', similaritySweepStudy('bench-wedge-workers'));
  const one = await timeAsync(() => runStudyFile(file, { db: join(ctx.dir, 'w1.db'), workers: 1 }));
  const two = await timeAsync(() => runStudyFile(file, { db: join(ctx.dir, 'w2.db'), workers: 2 }));
  const ceiling = await twoThreadCeiling();
  console.log(`similarity sweep, ${SIMILARITY_SWEEP_M} m × 5 Pr (each m a new momentum solve):`);
  console.log(`  1 worker:  ${fmt(one.seconds)} s`);
  console.log(`  2 workers: ${fmt(two.seconds)} s`);
  console.log(`  speed-up 2 vs 1 workers: ${fmt(one.seconds / two.seconds)}× (goal ≥ 1.7)`);
  console.log(`  this machine's own ceiling, 2 vs 1 threads of plain arithmetic: ${fmt(ceiling)}×`);
}

/** Throughput of two threads against one on the same fixed arithmetic: what the cores give at best. */
async function twoThreadCeiling(): Promise<number> {
  const code = `let x = 0; for (let i = 0; i < 2e8; i++) x += Math.sqrt(i); require('node:worker_threads').parentPort.postMessage(x);`;
  const spin = (threads: number) =>
    timeAsync(() =>
      Promise.all(
        Array.from({ length: threads }, async () => {
          const worker = new Worker(code, { eval: true });
          await once(worker, 'message');
          await worker.terminate();
        }),
      ),
    );
  const one = await spin(1);
  const two = await spin(2);
  return (2 * one.seconds) / two.seconds;
}
