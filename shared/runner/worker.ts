// A worker thread of the sweep pool. It gets the study's sweep and solve plan once
// (workerData), builds the points of each batch itself from their indices (so the main
// thread never expands the sweep or copies inputs across), solves them and returns the
// rows already encoded in the store's columnar form (shared/db/result-layout.ts), so the
// main thread only has to insert them.
import { workerData } from 'piscina';
// result-layout.js directly, not the db index: the codec needs no database package.
import { ResultBatchEncoder } from '../db/result-layout.js';
import { compileSolver } from '../physics/engine.js';
import type { Inputs } from '../physics/types.js';
// sweep.js directly, not the study index: the index also loads the YAML parser, zod and
// the unit tables, which would add most of a second to every worker's start.
import { iteratePoints } from '../study/sweep.js';
import type { BatchTask, ComputedBatch, WorkerData } from './batch-task.js';

const { sweep, plan, methodIds } = workerData as WorkerData;
// Sweeps flag a property temperature outside the fluid's range instead of stopping.
const solve = compileSolver(plan, { strict: false });
const M = methodIds.length;

export default function computeBatch(task: BatchTask): ComputedBatch {
  const t0 = performance.now();
  const { ranges } = task;
  let n = 0;
  for (let r = 0; r < ranges.length; r += 2) n += ranges[r + 1] - ranges[r];
  const encoder = new ResultBatchEncoder(M, n);
  // Walking the sweep once per range: iteratePoints sets up the value lists once, where
  // pointAt would redo that for every point.
  for (let r = 0; r < ranges.length; r += 2) {
    const it = iteratePoints(sweep, ranges[r]);
    for (let i = ranges[r]; i < ranges[r + 1]; i++) {
      const point = it.next().value as Inputs;
      encoder.addPoint(i, point);
      const rows = solve(point);
      if (rows.length !== M) throw new Error(`solver returned ${rows.length} rows for ${M} methods`);
      for (let m = 0; m < M; m++) {
        const row = rows[m];
        if (row.method !== methodIds[m]) throw new Error(`solver returned method '${row.method}' where '${methodIds[m]}' was expected`);
        // An output that is not a finite number is left out with the flag non-finite:<output> (the encoder's rule).
        encoder.addResult(row.outputs, row.flags);
      }
    }
  }
  return { ...encoder.finish(), computeMs: performance.now() - t0 };
}
