// The hot path: one transaction per computed batch holding its points, its results and
// the run's progress counters, so a reader sees a batch entirely or not at all and a
// kill -9 loses at most the batches not yet committed.
//
// Idempotent: points and results go in with ON CONFLICT DO NOTHING on their keys
// ((run_id, idx) and (run_id, point_idx, method_idx)) and the counters advance by the rows
// actually inserted, so a batch written twice (a queue job retried after its worker died
// between commit and acknowledgement) changes nothing the second time.
//
// The statements differ by dialect (shared/db/dialect.ts): prepared better-sqlite3
// statements on SQLite, multi-row INSERT … SELECT FROM unnest(arrays) on PostgreSQL.
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

/** Rows a write actually inserted (zero for points already stored). */
export interface WrittenCounts {
  points: number;
  results: number;
  flagged: number;
}

export interface BatchWriter {
  /** Writes the batch and advances the run's counters by the rows inserted, atomically. */
  write(batch: EncodedBatch): Promise<WrittenCounts>;
}

export function createBatchWriter(store: Store, runId: number, methodIds: readonly string[]): BatchWriter {
  return store.dialect.batchWriter(runId, methodIds);
}
