// `run --queue` and `resume --queue`: create (or claim) the run in the store, put one job
// per batch on the queue, and follow the run's progress from the store until every point
// has its results. The workers, on any machine, do the computing and the writing.
import { dirname, resolve } from 'node:path';
import { Queue, QueueEvents } from 'bullmq';
import {
  claimRunForResume,
  createRun,
  finishRun,
  type RunStatus,
  type Store,
} from '../db/index.js';
import { MIN_BATCH } from '../runner/batches.js';
import { gitCommit, hostName } from '../runner/environment.js';
import { prepareResume, prepareStudy, type PreparedStudy, type RunOptions, type RunOutcome } from '../runner/run-study.js';
import { entryLength } from '../study/index.js';
import { BATCH_JOB, batchJobId, planBatches, type BatchJobData } from './jobs.js';
import { whenReachable, type QueueTarget } from './target.js';

/**
 * Points per queued job at most: kept at the size local batches had, so a job stays a
 * short unit of work that a stopped `filmsweep worker` loses little of.
 */
const MAX_JOB_POINTS = 2000;

/** Tries of one batch: a failed write (a database restart, say) is retried, a bad study is not. */
export const JOB_ATTEMPTS = 3;
const POLL_MS = 250;

export interface QueueRunOptions extends Pick<RunOptions, 'batchSize' | 'stop' | 'onStart' | 'onProgress'> {
  /** Messages for the user (no worker yet, …). */
  notify?: (message: string) => void;
}

export async function runOnQueue(store: Store, prepared: PreparedStudy, target: QueueTarget, options: QueueRunOptions = {}): Promise<RunOutcome> {
  return withQueue(target, async (queue) => {
    const { loaded } = prepared;
    const runId = await createRun(store, {
      study: { name: loaded.study.name, title: loaded.study.title ?? null, configuration: loaded.study.configuration },
      yaml: loaded.text,
      hash: loaded.hash,
      sourceFile: resolve(loaded.file),
      methods: prepared.methods,
      pointsTotal: prepared.total,
      workers: await queue.getWorkersCount(), // worker processes on the queue when the run starts
      host: hostName(),
      pid: process.pid,
      gitCommit: gitCommit(dirname(resolve(loaded.file))),
    });
    const todo = Array.from({ length: prepared.total }, (_, i) => i);
    return follow(store, queue, runId, prepared, todo, options);
  });
}

export interface QueueResumeOptions extends QueueRunOptions {
  force?: boolean;
}

/** Claims an unfinished run and queues the batches of the points that have no results yet. */
export async function resumeOnQueue(store: Store, runId: number, target: QueueTarget, options: QueueResumeOptions = {}): Promise<RunOutcome> {
  const { prepared, isAlive } = await prepareResume(store, runId, options.force);
  return withQueue(target, async (queue) => {
    const workers = await queue.getWorkersCount();
    const done = await claimRunForResume(store, runId, { host: hostName(), pid: process.pid, workers }, isAlive);
    const todo: number[] = [];
    for (let i = 0; i < prepared.total; i++) if (!done.has(i)) todo.push(i);
    return follow(store, queue, runId, prepared, todo, options);
  });
}

/**
 * Points per job when `--batch-size` is not given: enough jobs for the tail of the sweep
 * to be shared evenly among `slots` worker threads (at least four each), within the
 * 16 … 2000 points (MIN_BATCH … MAX_JOB_POINTS) and aligned to the grid's innermost entry, so that points
 * sharing the outer values (and their similarity solve) stay in one job. The number of
 * threads the workers will bring is unknown here; `slots` only keeps the jobs many.
 * Unlike a local run it does not adapt to timings: the same study always gives the same
 * jobs, so queuing it again (a second resume) finds the same job ids.
 */
export function queueBatchSize(prepared: PreparedStudy, fixed?: number, slots = 16): number {
  const { study } = prepared.loaded;
  const entries = Object.values(study.sweep.over);
  const align = study.sweep.design === 'grid' && entries.length >= 2 ? entryLength(entries[entries.length - 1]) : 1;
  if (fixed !== undefined) return fixed;
  const size = Math.max(MIN_BATCH, Math.min(MAX_JOB_POINTS, Math.ceil(prepared.total / (slots * 4))));
  return align <= 1 || align > MAX_JOB_POINTS ? size : Math.max(align, Math.round(size / align) * align);
}

async function withQueue<T>(target: QueueTarget, fn: (queue: Queue) => Promise<T>): Promise<T> {
  const queue = new Queue(target.name, { connection: target.connection, prefix: target.prefix });
  let lastError: Error | undefined;
  queue.on('error', (e) => (lastError = e));
  try {
    await whenReachable(queue.waitUntilReady(), target, () => lastError);
    return await fn(queue);
  } finally {
    await queue.close().catch(() => {});
  }
}

async function follow(
  store: Store,
  queue: Queue,
  runId: number,
  prepared: PreparedStudy,
  todo: number[],
  options: QueueRunOptions,
): Promise<RunOutcome> {
  const started = performance.now();
  const study = prepared.loaded.study.name;
  const total = prepared.total;
  const hash = prepared.loaded.hash;
  const batches = planBatches(todo, queueBatchSize(prepared, options.batchSize));
  const ids = new Set(batches.map((ranges) => batchJobId(runId, ranges)));
  let failure: string | undefined;

  // Failures are read from the queue's event stream from just before the first job goes
  // in, so an early one cannot be missed.
  const events = new QueueEvents(queue.name, {
    connection: queue.opts.connection,
    prefix: queue.opts.prefix,
    lastEventId: await lastEventId(queue),
  });
  events.on('failed', ({ jobId, failedReason }) => {
    if (ids.has(jobId)) failure ??= `batch ${jobId}: ${failedReason}`;
  });
  events.on('error', () => {}); // reconnects by itself; the store is the progress that counts

  let done = total - todo.length;
  const doneAtStart = done;
  let results = 0;
  let flagged = 0;
  try {
    await events.waitUntilReady();
    options.onStart?.({ runId, study, total, done });
    await enqueue(queue, runId, hash, batches);
    if ((await queue.getWorkersCount()) === 0) {
      options.notify?.(`no worker is taking jobs from ${queue.name} yet; start one with \`filmsweep worker --queue URL --db …\` (same database)`);
    }
    for (;;) {
      const run = await store.db
        .selectFrom('runs')
        .select(['points_done', 'results_count', 'flagged_count'])
        .where('id', '=', runId)
        .executeTakeFirstOrThrow();
      const moved = run.points_done !== done;
      done = run.points_done;
      results = run.results_count;
      flagged = run.flagged_count;
      if (moved || done >= total) options.onProgress?.({ runId, study, done, total, doneAtStart, results, flagged, elapsedMs: performance.now() - started });
      if (done >= total || failure !== undefined || options.stop?.aborted) break;
      await sleep(POLL_MS, options.stop);
    }
  } catch (e) {
    failure ??= e instanceof Error ? e.message : String(e);
  } finally {
    await events.close().catch(() => {});
  }

  const status: RunStatus = done >= total ? 'done' : failure !== undefined ? 'failed' : 'interrupted';
  if (status !== 'done') await removeWaiting(queue, ids);
  await finishRun(store, runId, status, status === 'failed' ? failure : undefined);
  return {
    id: runId,
    study,
    status,
    points_total: total,
    points_done: done,
    results,
    flagged,
    seconds: (performance.now() - started) / 1000,
    ...(status === 'failed' ? { error: failure } : {}),
  };
}

/**
 * Adds one job per batch. A job of the same id left from before (a failed batch, a finished
 * one, or one of another database's run with the same id) is removed first, or BullMQ would
 * ignore the add; one still waiting for this same batch is kept as it is.
 */
async function enqueue(queue: Queue, runId: number, hash: string, batches: number[][]): Promise<void> {
  const CHUNK = 500;
  for (let i = 0; i < batches.length; i += CHUNK) {
    const chunk = batches.slice(i, i + CHUNK).map((ranges) => ({ id: batchJobId(runId, ranges), data: { runId, hash, ranges } satisfies BatchJobData }));
    for (const { id, data } of chunk) {
      const old = await queue.getJob(id);
      if (!old) continue;
      const state = await old.getState();
      const same = (old.data as Partial<BatchJobData>)?.hash === hash && JSON.stringify(old.data?.ranges) === JSON.stringify(data.ranges);
      if (state === 'completed' || state === 'failed' || state === 'unknown' || (!same && state !== 'active')) await queue.remove(id);
    }
    await queue.addBulk(
      chunk.map(({ id, data }) => ({
        name: BATCH_JOB,
        data,
        opts: {
          jobId: id,
          attempts: JOB_ATTEMPTS,
          backoff: { type: 'exponential', delay: 1000 },
          removeOnComplete: true,
          removeOnFail: { age: 7 * 24 * 3600 },
        },
      })),
    );
  }
}

/** Takes the run's jobs that no worker holds off the queue (a worker's current job finishes). */
async function removeWaiting(queue: Queue, ids: Set<string>): Promise<void> {
  for (const id of ids) await queue.remove(id).catch(() => 0); // 0 / refused: a worker holds it
}

/** The id of the newest entry of the queue's event stream ('0-0' when it is empty). */
async function lastEventId(queue: Queue): Promise<string> {
  const client = await queue.client;
  client.defineCommand('filmsweepLastEventId', {
    numberOfKeys: 1,
    lua: "local e = redis.call('XREVRANGE', KEYS[1], '+', '-', 'COUNT', 1) if e[1] then return e[1][1] end return '0-0'",
    readOnly: true,
  });
  return String(await client.runCommand('filmsweepLastEventId', [queue.keys.events]));
}

function sleep(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((res) => {
    const timer = setTimeout(done, ms);
    function done() {
      clearTimeout(timer);
      signal?.removeEventListener('abort', done);
      res();
    }
    signal?.addEventListener('abort', done, { once: true });
  });
}
