// The hot path: one transaction per computed batch holding its points, its results and
// the run's progress counters, so a reader sees a batch entirely or not at all and a
// kill -9 loses at most the batches not yet committed.
//
// These statements go straight to better-sqlite3, prepared once, on the same connection
// Kysely uses: building, compiling and awaiting a Kysely query per row costs more than
// the insert itself at 1e6 rows, and a batch must be written synchronously anyway to
// stay one transaction. Everything else in shared/db goes through Kysely.
import { retryBusySync } from './busy.js';
import type { Store } from './store.js';

/**
 * One computed batch, as the runner's worker returns it: JSON already encoded off the
 * main thread, in flat arrays (cheaper to pass between threads than an object per row).
 * Every point has a result for every method, point-major: result k is point
 * `points[floor(k / methods)]`, method `k % methods`.
 */
export interface EncodedBatch {
  /** Point indices (positions in the sweep expansion). */
  points: number[];
  /** JSON of each point's inputs, parallel to `points`. */
  inputs: string[];
  /** JSON of each result's outputs. */
  outputs: string[];
  /** JSON array of each result's flags (`[]` when none). */
  flags: string[];
}

export interface BatchWriter {
  /** Writes the batch and advances the run's counters, atomically. */
  write(batch: EncodedBatch): { points: number; results: number; flagged: number };
}

const EMPTY_FLAGS = '[]';

export function createBatchWriter(store: Store, runId: number, methodIds: readonly string[]): BatchWriter {
  const { sqlite } = store;
  const insertPoint = sqlite.prepare('insert into points (run_id, idx, inputs) values (?, ?, jsonb(?))');
  const insertResult = sqlite.prepare(
    'insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (?, ?, ?, ?, jsonb(?), ?, ?)',
  );
  const advance = sqlite.prepare(
    'update runs set points_done = points_done + ?, results_count = results_count + ?, flagged_count = flagged_count + ? where id = ?',
  );
  const M = methodIds.length;
  const writeAll = sqlite.transaction((batch: EncodedBatch) => {
    const { points, inputs, outputs, flags } = batch;
    if (outputs.length !== points.length * M || flags.length !== outputs.length) {
      throw new Error(`batch of ${points.length} points has ${outputs.length} results for ${M} methods`);
    }
    let flagged = 0;
    for (let i = 0; i < points.length; i++) {
      insertPoint.run(runId, points[i], inputs[i]);
      for (let m = 0, k = i * M; m < M; m++, k++) {
        const isFlagged = flags[k] === EMPTY_FLAGS ? 0 : 1;
        flagged += isFlagged;
        insertResult.run(runId, points[i], m, methodIds[m], outputs[k], flags[k], isFlagged);
      }
    }
    advance.run(points.length, outputs.length, flagged, runId);
    return { points: points.length, results: outputs.length, flagged };
  });
  // BEGIN IMMEDIATE: take the write lock up front, so waiting for another process happens
  // in the busy handler instead of failing half-way through the batch.
  return { write: (batch) => retryBusySync(() => writeAll.immediate(batch)) };
}
