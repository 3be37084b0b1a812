// What a queue worker needs to compute a run's batches, built once per run from the
// store (as `resume` does: from the stored study text, never a file on disk) and kept
// while jobs of that run keep coming.
import { UnrecoverableError } from 'bullmq';
import { createBatchWriter, getRunSource, type BatchWriter, type MethodVersion, type Store } from '../db/index.js';
import { prepareStudy, studyForWorkers } from '../runner/run-study.js';
import type { StudyForWorkers } from '../runner/batch-task.js';
import { createPool, type SweepPool } from '../runner/pool.js';
import { parseStudy } from '../study/index.js';

export interface RunContext {
  runId: number;
  /** sha256 of the run's study text, as the jobs carry it. */
  hash: string;
  pool: SweepPool;
  /** What the pool's threads need of the study, sent with each batch. */
  study: StudyForWorkers;
  /**
   * The store's batch writer, which is idempotent: a job that runs twice (its worker died
   * after the commit but before telling Redis) inserts nothing and counts nothing again.
   */
  writer: BatchWriter;
  /** Jobs of this run in hand. */
  users: number;
}

/**
 * Loads run `runId` for computing. A job this worker can never do (the run is missing
 * or is another study: the worker is on another database; another build of the
 * methods) fails without retries: BullMQ's UnrecoverableError.
 */
export async function loadRunContext(store: Store, runId: number, hash: string, workers: number): Promise<RunContext> {
  const source = await getRunSource(store, runId);
  const where = `this worker's database (${store.path})`;
  if (!source) throw new UnrecoverableError(`run ${runId} is not in ${where}: the worker and \`run --queue\` must use the same --db`);
  if (source.hash !== hash) {
    throw new UnrecoverableError(`run ${runId} in ${where} is another study: the worker and \`run --queue\` must use the same --db`);
  }
  const loaded = parseStudy(source.yaml, source.sourceFile ?? `run-${runId}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) });
  const prepared = prepareStudy(loaded);
  if (prepared.total !== source.pointsTotal) {
    throw new UnrecoverableError(`run ${runId}: this worker expands the study to ${prepared.total} points, the run has ${source.pointsTotal}`);
  }
  const was = describeMethods(source.methods);
  const is = describeMethods(prepared.methods);
  if (was !== is) throw new UnrecoverableError(`run ${runId} used ${was}, this worker's build has ${is}: run the same Filmsweep version everywhere`);

  const methodIds = prepared.methods.map((m) => m.id);
  const pool = createPool(workers);
  return { runId, hash, pool, study: studyForWorkers(prepared), writer: createBatchWriter(store, runId, methodIds), users: 0 };
}

function describeMethods(methods: MethodVersion[]): string {
  return methods.map((m) => `${m.id} v${m.version}`).join(', ');
}
