// `filmsweep worker`: a BullMQ worker that takes batch jobs, computes each with the
// local worker-thread pool and writes it to the shared store, exactly once.
//
// A worker that dies mid-batch holds a lock that it no longer renews; once the lock has
// expired (lockDuration), the next stalled check of any live worker (every
// stalledInterval) puts the job back in the queue and someone computes it again. Its
// first computation was never committed, or was committed and the store's batch writer
// (idempotent: on conflict do nothing, counters by inserted rows) adds nothing.
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import type { Store } from '../db/index.js';
import { DEFAULT_LOCK_DURATION_MS, DEFAULT_MAX_STALLED, DEFAULT_STALLED_INTERVAL_MS } from './defaults.js';
import { BATCH_JOB, parseBatchJob, pointsIn, type BatchJobData, type BatchJobResult } from './jobs.js';
import { loadRunContext, type RunContext } from './run-context.js';
import { whenReachable, type QueueTarget } from './target.js';

/** A run's pool is freed after this long without one of its jobs. */
const IDLE_RUN_MS = 60_000;

export interface QueueWorkerOptions {
  target: QueueTarget;
  store: Store;
  /** Threads of the local pool (per run being computed). */
  workers: number;
  /** Jobs in hand at once; default 2 × workers, so no thread waits while a batch is written. */
  concurrency?: number;
  lockDurationMs?: number;
  stalledIntervalMs?: number;
  maxStalledCount?: number;
  /** One line per job, and the worker's errors. */
  log?: (line: string) => void;
}

export interface QueueWorkerHandle {
  worker: Worker<unknown, BatchJobResult>;
  concurrency: number;
  /** Takes no more jobs, finishes (and commits) the ones in hand, frees the pools. */
  close(): Promise<void>;
}

export async function startQueueWorker(options: QueueWorkerOptions): Promise<QueueWorkerHandle> {
  const { store, target, workers } = options;
  const log = options.log ?? (() => {});
  const concurrency = options.concurrency ?? workers * 2;
  const contexts = new Map<number, Promise<RunContext>>();

  // When a job last asked for each run, set before any await: a pool is never freed
  // between a job asking for it and the job using it.
  const asked = new Map<number, number>();

  const contextFor = (runId: number, hash: string): Promise<RunContext> => {
    asked.set(runId, Date.now());
    let ctx = contexts.get(runId);
    if (!ctx) {
      ctx = loadRunContext(store, runId, hash, workers);
      contexts.set(runId, ctx);
      const mine = ctx;
      mine.catch(() => contexts.get(runId) === mine && contexts.delete(runId)); // the next job tries again
    }
    return ctx;
  };

  const processJob = async (job: Job): Promise<BatchJobResult> => {
    const t0 = performance.now();
    let data: BatchJobData;
    try {
      data = parseBatchJob(job.data);
    } catch (e) {
      throw new UnrecoverableError((e as Error).message); // no retry can mend it
    }
    const what = `run ${data.runId} points ${data.ranges[0]}–${data.ranges[data.ranges.length - 1] - 1}`;
    const n = pointsIn(data.ranges);
    const run = await store.db.selectFrom('runs').select('status').where('id', '=', data.runId).executeTakeFirst();
    if (run && (run.status === 'done' || run.status === 'failed')) {
      log(`${what}: skipped, the run is ${run.status}`);
      return { points: 0, skipped: n };
    }
    const ctx = await contextFor(data.runId, data.hash);
    if (ctx.hash !== data.hash) throw new UnrecoverableError(`run ${data.runId} in this worker's database is another study: the worker and \`run --queue\` must use the same --db`);
    ctx.users++;
    try {
      const computed = await ctx.pool.run({ study: ctx.study, ranges: data.ranges });
      const w = await ctx.writer.write(computed);
      const skipped = computed.points.length - w.points;
      const again = skipped ? `, ${skipped} already stored` : '';
      const ms = Math.round(performance.now() - t0);
      log(`${what}: ${w.points} points, ${w.results} results, ${w.flagged} flagged written${again} (${ms} ms, attempt ${job.attemptsMade + 1})`);
      return { points: w.points, skipped };
    } finally {
      ctx.users--;
      asked.set(data.runId, Date.now());
    }
  };

  const worker = new Worker<unknown, BatchJobResult>(target.name, processJob, {
    connection: target.connection,
    prefix: target.prefix,
    concurrency,
    lockDuration: options.lockDurationMs ?? DEFAULT_LOCK_DURATION_MS,
    stalledInterval: options.stalledIntervalMs ?? DEFAULT_STALLED_INTERVAL_MS,
    maxStalledCount: options.maxStalledCount ?? DEFAULT_MAX_STALLED,
    autorun: false,
  });
  let lastError: Error | undefined;
  worker.on('error', (e) => {
    lastError = e;
    log(`queue error: ${e.message}`);
  });
  worker.on('failed', (job, e) => {
    if (job?.name !== BATCH_JOB) return;
    log(`job ${job.id} failed (attempt ${job.attemptsMade}/${job.opts.attempts ?? 1}): ${e.message}`);
  });
  try {
    await whenReachable(worker.waitUntilReady(), target, () => lastError);
  } catch (e) {
    await worker.close(true).catch(() => {});
    throw e;
  }
  void worker.run().catch((e: Error) => log(`queue error: ${e.message}`));

  const sweep = setInterval(() => void freeIdle(contexts, asked, Date.now() - IDLE_RUN_MS), IDLE_RUN_MS / 4);
  sweep.unref();

  return {
    worker,
    concurrency,
    async close() {
      clearInterval(sweep);
      await worker.close();
      await freeIdle(contexts, asked, Infinity);
    },
  };
}

async function freeIdle(contexts: Map<number, Promise<RunContext>>, asked: Map<number, number>, before: number): Promise<void> {
  for (const [runId, pending] of contexts) {
    const ctx = await pending.catch(() => undefined);
    if (contexts.get(runId) !== pending) continue; // replaced meanwhile
    if (!ctx || (ctx.users === 0 && (asked.get(runId) ?? 0) < before)) {
      contexts.delete(runId);
      asked.delete(runId);
      await ctx?.pool.destroy();
    }
  }
}
