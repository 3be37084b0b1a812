// The worker-thread pool (piscina). Workers load plain JavaScript, so the worker is always
// the compiled dist/shared/runner/worker.js: next to this module when it runs from dist/,
// and the built copy when this module runs from the TypeScript sources (vitest).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { BatchTask, ComputedBatch } from './batch-task.js';

export function workerFile(): string {
  const beside = fileURLToPath(new URL('./worker.js', import.meta.url));
  if (existsSync(beside)) return beside;
  const built = fileURLToPath(new URL('../../dist/shared/runner/worker.js', import.meta.url));
  if (existsSync(built)) return built;
  throw new Error(`worker not found at ${beside} or ${built}: run \`npm run build\` first`);
}

export type SweepPool = Piscina<BatchTask, ComputedBatch>;

/**
 * Young generation of each worker's heap. A worker's garbage is short-lived (each point's
 * objects), so V8's default, which lets it grow to tens of MB over a long run, only makes
 * the process's memory creep with the run's length. Measured here with 2 workers: peak RSS
 * 196 → 228 MB from 1e6 to 4e6 correlation results by default, 179 → 182 MB with 8 MB;
 * the same CPU time, also for a similarity sweep (3.4 s).
 */
const WORKER_YOUNG_GENERATION_MB = 8;

/** `workers` threads, which start loading the compute code at once; each task brings its study. */
export function createPool(workers: number): SweepPool {
  const pool = new Piscina<BatchTask, ComputedBatch>({
    filename: workerFile(),
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: 60_000,
    resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB },
  });
  // A batch cancelled by a second Ctrl-C may still finish in its worker; piscina then
  // emits 'error' ("Unexpected message from Worker") for a task it no longer tracks.
  // Dropping that result is the point of cancelling, so it is not an error here; without
  // a listener the EventEmitter would throw it and crash the process.
  pool.on('error', (e: Error) => {
    if (!String(e?.message).startsWith('Unexpected message from Worker')) {
      process.stderr.write(`filmsweep: worker pool: ${e?.message ?? String(e)}\n`);
    }
  });
  return pool;
}
