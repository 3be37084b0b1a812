// A worker thread of the sweep pool. It gets the study's sweep and solve plan once
// (workerData), builds the points of each batch itself from their indices (so the main
// thread never expands the sweep or copies inputs across), solves them and returns rows
// already encoded as JSON, so the main thread only has to insert them.
import { workerData } from 'piscina';
import { compilePointDesigner } from '../design/point.js';
import { encodeSummaries } from '../design/stored-summaries.js';
import type { SummaryFacts } from '../design/summary.js';
import type { Inputs, Outputs } from '../physics/types.js';
// sweep.js directly, not the study index: the index also loads the YAML parser, zod and
// the unit tables, which would add most of a second to every worker's start.
import { iteratePoints } from '../study/sweep.js';
import type { BatchTask, ComputedBatch, WorkerData } from './batch-task.js';

const { sweep, plan, methodIds, design } = workerData as WorkerData;
// Sweeps flag a property temperature outside the fluid's range instead of stopping. The
// designer solves the study's target and bands where it has them, and summarises each point.
const solve = compilePointDesigner(plan, methodIds, design);
const M = methodIds.length;

export default function computeBatch(task: BatchTask): ComputedBatch {
  const t0 = performance.now();
  const { indices, points } = pointsOf(task.ranges);
  const n = indices.length;
  const inputs: string[] = new Array(n);
  const outputs: string[] = new Array(n * M);
  const flags: string[] = new Array(n * M);
  const summaries: SummaryFacts[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const point = points[i];
    inputs[i] = JSON.stringify(point);
    const { rows, facts } = solve(point, indices[i]);
    summaries[i] = facts;
    if (rows.length !== M) throw new Error(`solver returned ${rows.length} rows for ${M} methods`);
    for (let m = 0; m < M; m++) {
      const row = rows[m];
      if (row.method !== methodIds[m]) {
        throw new Error(`solver returned method '${row.method}' where '${methodIds[m]}' was expected`);
      }
      const rowFlags = [...row.flags];
      outputs[i * M + m] = encodeOutputs(row.outputs, rowFlags);
      flags[i * M + m] = JSON.stringify(rowFlags);
    }
  }
  return { points: indices, inputs, outputs, flags, summaries: encodeSummaries(indices, summaries, methodIds), computeMs: performance.now() - t0 };
}

// The batch's points, walking the sweep once per range: iteratePoints sets up the value
// lists once, where pointAt would redo that for every point.
function pointsOf(ranges: number[]): { indices: number[]; points: Inputs[] } {
  const indices: number[] = [];
  const points: Inputs[] = [];
  for (let r = 0; r < ranges.length; r += 2) {
    const it = iteratePoints(sweep, ranges[r]);
    for (let i = ranges[r]; i < ranges[r + 1]; i++) {
      indices.push(i);
      points.push(it.next().value as Inputs);
    }
  }
  return { indices, points };
}

// JSON has no NaN or Infinity (JSON.stringify would write null): such an output is left
// out and the result says so with `non-finite:<output>`, instead of storing a silent null.
function encodeOutputs(values: Outputs, rowFlags: string[]): string {
  for (const name in values) {
    if (!Number.isFinite(values[name])) {
      const kept: Outputs = {};
      for (const n in values) {
        if (Number.isFinite(values[n])) kept[n] = values[n];
        else rowFlags.push(`non-finite:${n}`);
      }
      return JSON.stringify(kept);
    }
  }
  return JSON.stringify(values);
}
