// A worker thread of the sweep pool. Each task brings its study's sweep and solve plan
// (compiled once per study) and its points as index ranges; the thread builds the points
// itself (so the main thread never expands the sweep or copies inputs across), solves them
// and returns the rows already encoded in the store's columnar form, so the main thread
// only has to insert them (compute.ts).
import { getPriority, setPriority } from 'node:os';

/**
 * How much nicer than the thread that started it a compute thread runs. The main thread
 * writes every batch: with as many busy compute threads as cores it is the stage that
 * sets the pace, and sharing a core evenly with them it wrote at half speed (measured on
 * this 2-core machine, 1e6 results with 2 workers: 1.61–1.66 s with +5, 1.75–1.78 s
 * without; +10 and +19 gave the same as +5). On Linux only, where setpriority() on this
 * thread changes this thread alone; elsewhere it would lower the whole process.
 */
const COMPUTE_NICENESS = 5;
if (process.platform === 'linux') {
  try {
    setPriority(Math.min(19, getPriority() + COMPUTE_NICENESS));
  } catch {
    // Only a courtesy to the writer: a system that refuses it runs the threads as they are.
  }
}

// The compute code loads after the priority is set: loading it is most of a thread's start,
// and the main thread is busy starting too.
const { computeTask } = await import('./compute.js');
export default computeTask;
