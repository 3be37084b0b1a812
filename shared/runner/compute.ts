// Computing one batch: build its points from their indices, solve each with every method
// (with the study's design answers and each point's summary across methods), and encode
// the rows in the store's columnar form (shared/db/result-layout.ts) and the summaries in
// theirs (shared/design/stored-summaries.ts). The worker threads do this; the main thread
// does it too while they are still starting.
// result-layout.js directly, not the db index: the codec needs no database package.
import { ResultBatchEncoder } from '../db/result-layout.js';
import { compilePointDesigner, type PointDesigner } from '../design/point.js';
import type { Inputs } from '../physics/types.js';
// sweep.js directly, not the study index: the index also loads the YAML parser, zod and
// the unit tables, which would add most of a second to every worker's start.
import { iteratePoints, type SweepSource } from '../study/sweep.js';
import type { BatchTask, ComputedBatch, StudyForWorkers } from './batch-task.js';

export function computeBatch(solve: PointDesigner, sweep: SweepSource, methodIds: readonly string[], ranges: readonly number[]): ComputedBatch {
  const t0 = performance.now();
  const M = methodIds.length;
  let n = 0;
  for (let r = 0; r < ranges.length; r += 2) n += ranges[r + 1] - ranges[r];
  const encoder = new ResultBatchEncoder(M, n);
  const summaries = solve.summaryEncoder();
  // Walking the sweep once per range: iteratePoints sets up the value lists once, where
  // pointAt would redo that for every point.
  for (let r = 0; r < ranges.length; r += 2) {
    const it = iteratePoints(sweep, ranges[r]);
    for (let i = ranges[r]; i < ranges[r + 1]; i++) {
      const point = it.next().value as Inputs;
      encoder.addPoint(i, point);
      const { rows } = solve(point, i);
      if (rows.length !== M) throw new Error(`solver returned ${rows.length} rows for ${M} methods`);
      for (let m = 0; m < M; m++) {
        const row = rows[m];
        if (row.method !== methodIds[m]) throw new Error(`solver returned method '${row.method}' where '${methodIds[m]}' was expected`);
        // An output that is not a finite number is left out with the flag non-finite:<output> (the encoder's rule).
        encoder.addResult(row.outputs, row.flags);
      }
      summaries.addRows(i, rows);
    }
  }
  return { ...encoder.finish(), summaries: summaries.finish(), computeMs: performance.now() - t0 };
}

/** The study this thread compiled last (a thread serves one study at a time). */
let compiled: { study: StudyForWorkers; solve: PointDesigner } | undefined;

/**
 * A worker thread's task: the batch's points of its study. Sweeps flag a property
 * temperature outside the fluid's range instead of stopping; the designer solves the
 * study's target and bands where it has them, and summarises each point.
 */
export function computeTask(task: BatchTask): ComputedBatch {
  if (compiled?.study.key !== task.study.key) {
    const { plan, methodIds, design } = task.study;
    compiled = { study: task.study, solve: compilePointDesigner(plan, methodIds, design) };
  }
  // The first task's copy of the sweep: its value lists are built once (sweep.ts).
  const { study, solve } = compiled;
  return computeBatch(solve, study.sweep, study.methodIds, task.ranges);
}
