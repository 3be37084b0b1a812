// What passes between the runner and its worker threads: one batch's task (its study and
// its points) and the computed batch it sends back.
import type { ResultBatch } from '../db/result-layout.js';
import type { DesignSpec } from '../design/types.js';
import type { StoredSummaryRange } from '../design/stored-summaries.js';
import type { SolvePlan } from '../physics/engine.js';
import type { SweepSource } from '../study/sweep.js';

export interface StudyForWorkers {
  /** Names the study (its text's sha256): a thread compiles each study once, on its first task. */
  key: string;
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
   * The study the points are of. Every task carries it (a few kB), so the pool's threads
   * can start before any study is read and serve several studies one after the other.
   */
  study: StudyForWorkers;
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

/** The points of ranges [from, to, …], in order. */
export function pointsIn(ranges: readonly number[]): number {
  let n = 0;
  for (let r = 0; r < ranges.length; r += 2) n += ranges[r + 1] - ranges[r];
  return n;
}

/** Cuts ascending point ranges (flat [from, to, …]) into batches, front to back. */
export class PointCursor {
  private r = 0;
  private at: number;

  constructor(private readonly ranges: readonly number[]) {
    this.at = ranges[0] ?? 0;
  }

  get done(): boolean {
    return this.r >= this.ranges.length;
  }

  /** The next `count` points (fewer at the end) as ranges. */
  next(count: number): number[] {
    const taken: number[] = [];
    let left = count;
    while (left > 0 && this.r < this.ranges.length) {
      const end = this.ranges[this.r + 1];
      const to = Math.min(end, this.at + left);
      taken.push(this.at, to);
      left -= to - this.at;
      this.at = to;
      if (to === end) {
        this.r += 2;
        this.at = this.ranges[this.r] ?? 0;
      }
    }
    return taken;
  }
}

/** A computed batch with its points' design summaries, and how long the computing took (for the adaptive batch size). */
export interface ComputedBatch extends ResultBatch {
  summaries?: StoredSummaryRange[];
  computeMs: number;
}
