// What goes through the queue: one job per batch of a run, naming the run and the point
// index ranges to compute. Everything else (sweep, plan, methods) the worker reads from
// the store once per run, so a job stays a few bytes however large the study.
import { toRanges } from '../runner/batch-task.js';

export interface BatchJobData {
  runId: number;
  /** sha256 of the run's study text: a worker on another database refuses the job. */
  hash: string;
  /** Point index ranges, flat `[from, to, …]`, `to` excluded (as BatchTask.ranges). */
  ranges: number[];
}

/** What a finished job returns (kept only as long as BullMQ keeps the job). */
export interface BatchJobResult {
  points: number;
  /** Points that were already stored (a retried batch) and were not written again. */
  skipped: number;
}

/** The job name shown by BullMQ tools. */
export const BATCH_JOB = 'batch';

/**
 * `run-<id>-<first point>`: adding the same batch twice (a re-enqueue, a second resume)
 * leaves one job, since BullMQ ignores an add whose id exists.
 */
export function batchJobId(runId: number, ranges: readonly number[]): string {
  return `run-${runId}-${ranges[0]}`;
}

export function jobIdPrefix(runId: number): string {
  return `run-${runId}-`;
}

/**
 * Cuts the points to compute (ascending) into batches of `size` points, each as ranges.
 * A fresh run gives one range per batch; a resumed run's batches skip the done points.
 */
export function planBatches(todo: readonly number[], size: number): number[][] {
  if (!(Number.isInteger(size) && size >= 1)) throw new RangeError(`batch size must be a whole number ≥ 1, got ${size}`);
  const batches: number[][] = [];
  for (let i = 0; i < todo.length; i += size) batches.push(toRanges(todo.slice(i, i + size)));
  return batches;
}

export function pointsIn(ranges: readonly number[]): number {
  let n = 0;
  for (let r = 0; r < ranges.length; r += 2) n += ranges[r + 1] - ranges[r];
  return n;
}

/** Checks a job's data as it comes back from Redis (another version may have queued it). */
export function parseBatchJob(data: unknown): BatchJobData {
  const d = data as Partial<BatchJobData> | null;
  const ok =
    d !== null &&
    typeof d === 'object' &&
    Number.isSafeInteger(d.runId) &&
    typeof d.hash === 'string' &&
    Array.isArray(d.ranges) &&
    d.ranges.length >= 2 &&
    d.ranges.length % 2 === 0 &&
    d.ranges.every((x, i, a) => Number.isSafeInteger(x) && x >= 0 && (i === 0 || x > a[i - 1]));
  if (!ok) throw new Error(`malformed batch job: ${JSON.stringify(data).slice(0, 200)}`);
  return { runId: d.runId!, hash: d.hash!, ranges: d.ranges! };
}
