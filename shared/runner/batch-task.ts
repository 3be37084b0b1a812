// What passes between the runner and its worker threads: the data each worker starts
// with, one batch's task, and the computed batch it sends back.
import type { SummarizedBatch } from '../db/point-summaries.js';
import type { DesignSpec } from '../design/types.js';
import type { SolvePlan } from '../physics/engine.js';
import type { SweepSource } from '../study/sweep.js';

export interface WorkerData {
  /** Fixed inputs and sweep: with the point index, all a point needs. */
  sweep: SweepSource;
  plan: SolvePlan;
  /** Method ids in the order the run stores them; the solver must return this order. */
  methodIds: string[];
  /** The study's design answers (target, tolerances, bands), if it asks for any. */
  design?: DesignSpec;
}

export interface BatchTask {
  /**
   * The batch's point indices as runs of consecutive ids, flat `[from, to, from, to, …]`
   * with `to` excluded: a fresh run's batch is one pair, a resumed run's a few more.
   */
  ranges: number[];
}

/** Ascending point indices → BatchTask.ranges. */
export function toRanges(indices: readonly number[]): number[] {
  const ranges: number[] = [];
  for (let i = 0; i < indices.length; ) {
    let j = i + 1;
    while (j < indices.length && indices[j] === indices[j - 1] + 1) j++;
    ranges.push(indices[i], indices[j - 1] + 1);
    i = j;
  }
  return ranges;
}

/** A computed batch with each point's design summary, and how long the computing took (for the adaptive batch size). */
export interface ComputedBatch extends SummarizedBatch {
  computeMs: number;
}
