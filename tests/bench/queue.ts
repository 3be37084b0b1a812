// Throughput through the Redis queue: the same compute-heavy similarity sweep taken by 1 and
// by 2 `filmsweep worker` processes (one thread each) sharing one SQLite file, against the
// local pool with 1 thread. Needs a Redis: $FILMSWEEP_BENCH_REDIS_URL, else
// $FILMSWEEP_TEST_REDIS_URL, else redis://127.0.0.1:6379 (`eval "$(bash .ci/services.sh)"`).
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { join, resolve } from 'node:path';
import { Queue } from 'bullmq';
import { closeStore, openStore } from '../../shared/db/index.js';
import { parseQueueUrl, runOnQueue } from '../../shared/queue/index.js';
import { prepareStudy, runStudyFile } from '../../shared/runner/index.js';
import { loadStudyFile } from '../../shared/study/index.js';
import { SIMILARITY_SWEEP_LABEL, similaritySweepStudy } from './runner.js';
import { fmt, timeAsync, type BenchContext } from './timing.js';

const BIN = resolve('bin/filmsweep.js');

function startWorker(queueUrl: string, db: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, [BIN, 'worker', '--queue', queueUrl, '--db', db, '--workers', '1'], { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((res, rej) => {
    let out = '';
    const onData = (d: Buffer) => {
      out += d.toString();
      if (/ worker \d+ on /.test(out)) {
        child.stdout!.off('data', onData);
        child.stdout!.resume(); // keep draining the per-job lines
        res(child);
      }
    };
    child.stdout!.on('data', onData);
    child.on('exit', (code) => rej(new Error(`worker exited (${code}) before starting:\n${out}`)));
  });
}

async function queuedRun(ctx: BenchContext, file: string, processes: number): Promise<number> {
  const redis = process.env.FILMSWEEP_BENCH_REDIS_URL || process.env.FILMSWEEP_TEST_REDIS_URL || 'redis://127.0.0.1:6379';
  const url = new URL(redis);
  url.searchParams.set('prefix', `fsbench-${randomBytes(4).toString('hex')}`);
  const target = parseQueueUrl(url.href);
  const db = join(ctx.dir, `queue-${processes}.db`);
  const store = await openStore(db);
  const workers: ChildProcess[] = [];
  try {
    for (let i = 0; i < processes; i++) workers.push(await startWorker(url.href, db));
    // Workers are up and waiting: the time is the run's, enqueue to last batch stored.
    const outcome = await runOnQueue(store, prepareStudy(loadStudyFile(file)), target);
    if (outcome.status !== 'done') throw new Error(`queued run ended ${outcome.status}: ${outcome.error ?? ''}`);
    return outcome.seconds;
  } finally {
    for (const w of workers) w.kill('SIGTERM');
    await Promise.all(workers.map((w) => new Promise((r) => (w.exitCode !== null ? r(null) : w.on('exit', r)))));
    await closeStore(store);
    const queue = new Queue(target.name, { connection: target.connection, prefix: target.prefix });
    await queue.obliterate({ force: true }).catch(() => {});
    await queue.close();
  }
}

export async function benchQueue(ctx: BenchContext) {
  const file = ctx.study('bench-plate-queue', similaritySweepStudy('bench-plate-queue'));
  const local = await timeAsync(() => runStudyFile(file, { db: join(ctx.dir, 'queue-local.db'), workers: 1 }));
  const one = await queuedRun(ctx, file, 1);
  const two = await queuedRun(ctx, file, 2);
  const points = local.value.points_total;
  console.log(`similarity sweep through the Redis queue, ${SIMILARITY_SWEEP_LABEL}, worker processes of 1 thread, one SQLite file:`);
  console.log(`  local pool, 1 thread:   ${fmt(local.seconds)} s = ${fmt(points / local.seconds)} points/s`);
  console.log(`  queue, 1 worker process: ${fmt(one)} s = ${fmt(points / one)} points/s`);
  console.log(`  queue, 2 worker processes: ${fmt(two)} s = ${fmt(points / two)} points/s`);
  console.log(`  ratio queue (1 process) / local pool (1 thread): ${fmt(local.seconds / one)} (goal ≥ 0.9)`);
  console.log(`  speed-up 2 vs 1 worker processes: ${fmt(one / two)}× (goal ≥ 1.7 on 2 free cores)`);
}
