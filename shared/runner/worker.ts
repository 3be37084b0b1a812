// A worker thread of the sweep pool. It gets the study's sweep and solve plan once
// (workerData), builds the points of each batch itself from their indices (so the main
// thread never expands the sweep or copies inputs across), solves them and returns the
// rows already encoded in the store's columnar form, so the main thread only has to
// insert them.
import { workerData } from 'piscina';
import { compilePointDesigner } from '../design/point.js';
import type { BatchTask, ComputedBatch, WorkerData } from './batch-task.js';
import { computeBatch } from './compute.js';

const { sweep, plan, methodIds, design } = workerData as WorkerData;
// Sweeps flag a property temperature outside the fluid's range instead of stopping. The
// designer solves the study's target and bands where it has them, and summarises each point.
const solve = compilePointDesigner(plan, methodIds, design);

export default function computeTask(task: BatchTask): ComputedBatch {
  return computeBatch(solve, sweep, methodIds, task.ranges);
}
