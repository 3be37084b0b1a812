// Running a study: validate in the main thread, compute batches in the worker pool (each
// worker builds its points from their indices), write each finished batch from the main
// thread in its own transaction, and end the run done, failed or interrupted. `resumeRun` finishes an unfinished run from its
// stored study version, computing only the points that have no results yet.
import { dirname, resolve } from 'node:path';
import pLimit from 'p-limit';
import { getMethod, methodsFor } from '../physics/catalogue.js';
import { compilePointDesigner, type PointDesigner } from '../design/point.js';
import { compileSolver, type SolvePlan } from '../physics/engine.js';
import { InputError } from '../physics/types.js';
import { countPoints, entryLength, loadStudyFile, parseStudy, pointAt, type LoadedStudy } from '../study/index.js';
import {
  claimRunForResume,
  closeStore,
  convertLegacyRun,
  createBatchWriter,
  createRun,
  finishRun,
  getRunSource,
  openStore,
  resumeRefusal,
  type BatchWriter,
  type MethodVersion,
  type RunStatus,
  type Store,
} from '../db/index.js';
import { BatchSizer } from './batches.js';
import { defaultWorkers, gitCommit, hostName, processAlive } from './environment.js';
import { createPool, type SweepPool } from './pool.js';
import { PointCursor, pointsIn, toRanges, type ComputedBatch, type StudyForWorkers } from './batch-task.js';
import { computeBatch } from './compute.js';

/** A study checked and ready to run; nothing has touched the database yet. */
export interface PreparedStudy {
  loaded: LoadedStudy;
  plan: SolvePlan;
  methods: MethodVersion[];
  /** Number of points; point ids are 0 … total − 1 (the study's pointAt order). */
  total: number;
}

export interface RunProgress {
  runId: number;
  study: string;
  /** Points with results, including those done before a resume. */
  done: number;
  total: number;
  /** Points that were already done when this process started (for the rate). */
  doneAtStart: number;
  results: number;
  flagged: number;
  elapsedMs: number;
}

export interface RunOptions {
  /** Worker threads; default os.availableParallelism(). */
  workers?: number;
  /** Points per batch; default adapts so a batch takes about 0.2 s of compute (16 points … 32,000 results). */
  batchSize?: number;
  /** Batches in flight at once (p-limit); default 2 per worker. */
  inFlight?: number;
  /**
   * A pool started beforehand (createPool), e.g. before the study files were read, so its
   * threads load while this one does; the caller destroys it. Default: a pool of
   * `workers` threads for this run alone.
   */
  pool?: SweepPool;
  /** Stop scheduling; batches in flight finish and are committed; the run ends `interrupted`. */
  stop?: AbortSignal;
  /** Drop the batches in flight too (a second Ctrl-C); the run ends `interrupted`. */
  cancel?: AbortSignal;
  onProgress?: (p: RunProgress) => void;
  /** Called once the run exists in the database. */
  onStart?: (info: { runId: number; study: string; total: number; done: number }) => void;
}

/** The outcome of one run, as `run --json` prints it (plus the error text of a failed run). */
export interface RunOutcome {
  id: number;
  study: string;
  status: RunStatus;
  points_total: number;
  points_done: number;
  results: number;
  flagged: number;
  seconds: number;
  error?: string;
}

function methodVersions(plan: SolvePlan): MethodVersion[] {
  const methods = plan.methods?.length
    ? plan.methods.map((id) => getMethod(plan.configuration, id))
    : methodsFor(plan.configuration);
  return methods.map((m) => ({ id: m.id, version: m.version }));
}

/**
 * Everything that can reject a study before a run is written: the catalogue lookups
 * (configuration, methods, fluid), the point count, and the first point solved here,
 * which catches inputs the engine cannot use. Throws InputError (or the study's
 * StudyError). The sweep is not expanded here: the workers build their own points.
 */
export function prepareStudy(loaded: LoadedStudy): PreparedStudy {
  const { study } = loaded;
  const plan: SolvePlan = { configuration: study.configuration, methods: study.methods, fluid: study.fluid };
  const solve = compileSolver(plan, { strict: false });
  const methods = methodVersions(plan);
  const total = countPoints(study);
  if (total > 0) {
    const first = pointAt(study, 0);
    const target = study.design?.target;
    if (!target) solve(first);
    else {
      // A target whose output no method gives (e.g. outlet_temperature outside internal
      // flow) would flag every point: say so before the run starts.
      const [lo, hi] = target.within;
      const probe = lo > 0 ? Math.sqrt(lo * hi) : (lo + hi) / 2;
      const rows = solve({ ...first, [target.adjust]: probe });
      if (!rows.some((r) => r.outputs[target.output] !== undefined)) {
        throw new InputError(
          `${loaded.file}: target output '${target.output}' is given by none of the methods at the first point (${target.adjust} = ${probe}); they give ${[...new Set(rows.flatMap((r) => Object.keys(r.outputs)))].join(', ') || 'nothing (see their flags)'}`,
        );
      }
    }
  }
  return { loaded, plan, methods, total };
}

/** What the worker threads need of a study, sent with each batch (local pool and queue workers alike). */
export function studyForWorkers(prepared: PreparedStudy): StudyForWorkers {
  const { inputs, sweep, design } = prepared.loaded.study;
  return { key: prepared.loaded.hash, sweep: { inputs, sweep }, plan: prepared.plan, methodIds: prepared.methods.map((m) => m.id), ...(design && { design }) };
}

export async function runStudy(store: Store, prepared: PreparedStudy, options: RunOptions = {}): Promise<RunOutcome> {
  const workers = resolveWorkers(options.workers);
  const { loaded } = prepared;
  // The worker threads load their modules while the run is being created.
  const pool = prepared.total > 0 && !options.pool ? createPool(workers) : undefined;
  let runId: number;
  try {
    runId = await createRun(store, {
    study: { name: loaded.study.name, title: loaded.study.title ?? null, configuration: loaded.study.configuration },
    yaml: loaded.text,
    hash: loaded.hash,
    sourceFile: resolve(loaded.file),
    methods: prepared.methods,
    pointsTotal: prepared.total,
    workers,
    host: hostName(),
    pid: process.pid,
    gitCommit: gitCommit(dirname(resolve(loaded.file))),
    });
  } catch (e) {
    await pool?.destroy();
    throw e;
  }
  return execute(store, runId, prepared, prepared.total > 0 ? [0, prepared.total] : [], { results: 0, flagged: 0 }, workers, options, pool);
}

export interface ResumeOptions extends RunOptions {
  /** Take over a `running` run even when its process may be alive (another host, reused pid). */
  force?: boolean;
}

/**
 * Everything a resume checks before it claims the run, shared by the local and the queue
 * resume: the run exists and may be taken over, and the stored study text still expands to
 * the same points with the same method versions. The sweep is rebuilt from the stored
 * text, never from the file on disk (it may have changed).
 */
export async function prepareResume(store: Store, runId: number, force = false): Promise<{ prepared: PreparedStudy; isAlive: typeof processAlive }> {
  const source = await getRunSource(store, runId);
  if (!source) throw new InputError(`no run ${runId} in this database`);
  const isAlive = force ? () => false : processAlive;
  const refusal = resumeRefusal(runId, source, isAlive);
  if (refusal) throw new InputError(refusal);
  const loaded = parseStudy(source.yaml, source.sourceFile ?? `run-${runId}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) });
  if (loaded.hash !== source.hash) throw new Error(`run ${runId}: stored study text does not match its hash`);
  const prepared = prepareStudy(loaded);
  if (prepared.total !== source.pointsTotal) {
    throw new InputError(`run ${runId}: the study now expands to ${prepared.total} points, the run has ${source.pointsTotal}`);
  }
  const changed = methodChanges(source.methods, prepared.methods);
  if (changed) throw new InputError(`run ${runId} cannot be resumed with this version of Filmsweep: ${changed}; start a new run`);
  // A run stored before run tables continues in its table: its rows are moved there first.
  await convertLegacyRun(store, runId, { force: true });
  return { prepared, isAlive };
}

export async function resumeRun(store: Store, runId: number, options: ResumeOptions = {}): Promise<RunOutcome> {
  const workers = resolveWorkers(options.workers);
  const { prepared, isAlive } = await prepareResume(store, runId, options.force);
  const donePoints = await claimRunForResume(store, runId, { host: hostName(), pid: process.pid, workers }, isAlive);
  const missing: number[] = [];
  for (let i = 0; i < prepared.total; i++) if (!donePoints.has(i)) missing.push(i);
  const pending = toRanges(missing);
  const counts = await store.db
    .selectFrom('runs')
    .select(['results_count', 'flagged_count'])
    .where('id', '=', runId)
    .executeTakeFirstOrThrow();
  return execute(store, runId, prepared, pending, { results: counts.results_count, flagged: counts.flagged_count }, workers, options);
}

function methodChanges(stored: MethodVersion[], now: MethodVersion[]): string | undefined {
  const was = stored.map((m) => `${m.id} v${m.version}`).join(', ');
  const is = now.map((m) => `${m.id} v${m.version}`).join(', ');
  return was === is ? undefined : `the run used ${was}, this build has ${is}`;
}

function resolveWorkers(workers: number | undefined): number {
  const n = workers ?? defaultWorkers();
  if (!Number.isInteger(n) || n < 1) throw new InputError(`workers: expected a whole number ≥ 1, got ${n}`);
  return n;
}

/** `pending`: the points to compute, as ascending ranges [from, to, …] (to excluded). */
async function execute(
  store: Store,
  runId: number,
  prepared: PreparedStudy,
  pending: number[],
  counts: { results: number; flagged: number },
  workers: number,
  options: RunOptions,
  pool?: SweepPool,
): Promise<RunOutcome> {
  const started = performance.now();
  const study = prepared.loaded.study.name;
  const total = prepared.total;
  const doneAtStart = total - pointsIn(pending);
  let done = doneAtStart;
  let { results, flagged } = counts;
  options.onStart?.({ runId, study, total, done });

  let failure: unknown;
  try {
    failure = await computeAndWrite(store, runId, prepared, pending, workers, options, pool, (w) => {
      done += w.points;
      results += w.results;
      flagged += w.flagged;
      options.onProgress?.({ runId, study, done, total, doneAtStart, results, flagged, elapsedMs: performance.now() - started });
    });
  } catch (e) {
    // Not a batch's error (those end as a failed run below) but the pool failing to start
    // or the like: record it rather than leave the run "running".
    await finishRun(store, runId, 'failed', describe(e)).catch(() => {});
    throw e;
  }

  const status: RunStatus = failure !== undefined ? 'failed' : done < total ? 'interrupted' : 'done';
  const error = failure !== undefined ? describe(failure) : undefined;
  await finishRun(store, runId, status, error);
  return {
    id: runId,
    study,
    status,
    points_total: total,
    points_done: done,
    results,
    flagged,
    seconds: (performance.now() - started) / 1000,
    ...(error !== undefined ? { error } : {}),
  };
}

/** Points that share every sweep value but the last: the grid's innermost run. */
function innermostLength(sweep: PreparedStudy['loaded']['study']['sweep']): number {
  const entries = Object.values(sweep.over);
  if (sweep.design !== 'grid' || entries.length < 2) return 1;
  return entryLength(entries[entries.length - 1]);
}

/**
 * Results in a batch the main thread computes itself while the workers start: about 10 ms
 * of correlation points (2,000 two-method points), where a full batch would keep the
 * workers' first answers waiting (measured: bench e2e, median of 9, 1.84 → 1.79 s).
 */
const MAIN_THREAD_BATCH_RESULTS = 4000;

/**
 * Cuts `pending` (point ranges) into batches, has the pool compute them and writes each one
 * as it returns. Stops cutting on `stop`, on `cancel` (which also drops batches in
 * flight) or at the first failed batch; resolves with that batch's error, if any. Memory
 * stays that of the batches in flight, whatever the number of points.
 */
async function computeAndWrite(
  store: Store,
  runId: number,
  prepared: PreparedStudy,
  pending: number[],
  workers: number,
  options: RunOptions,
  given: SweepPool | undefined,
  onWritten: (w: { points: number; results: number; flagged: number }) => void,
): Promise<unknown> {
  const count = pointsIn(pending);
  if (count === 0) {
    await given?.destroy();
    return undefined;
  }
  const pool = options.pool ?? given ?? createPool(workers);
  // Only a pool this run started is this run's to stop.
  const release = () => (pool === options.pool ? Promise.resolve() : pool.destroy());
  let writer: BatchWriter;
  try {
    writer = createBatchWriter(store, runId, prepared.methods.map((m) => m.id));
  } catch (e) {
    await release();
    throw e;
  }
  const study = studyForWorkers(prepared);
  const { inputs, sweep, design } = prepared.loaded.study;
  const sizer = new BatchSizer(count, workers, options.batchSize, innermostLength(sweep), prepared.methods.length);
  const inFlight = options.inFlight ?? workers * 2;
  const limit = pLimit(inFlight);
  let failure: unknown;
  const stopped = () => options.stop?.aborted || options.cancel?.aborted || failure !== undefined;

  const write = async (computed: ComputedBatch) => {
    sizer.observe(computed.points.length, computed.computeMs);
    onWritten(await writer.write(computed));
  };
  // Until the first worker has answered (starting one takes a tenth of a second or more),
  // the main thread, idle otherwise, computes and writes batches itself, with the same code:
  // small ones, so that it is soon back to writing what the workers send.
  let workersStarted = false;
  let solveHere: PointDesigner | undefined;
  const methodIds = prepared.methods.map((m) => m.id);
  const ownBatch = Math.max(1, Math.floor(MAIN_THREAD_BATCH_RESULTS / methodIds.length));
  const runBatch = async (ranges: number[]) => {
    if (stopped()) return;
    const computed = await pool.run({ study, ranges }, { signal: options.cancel ?? null });
    workersStarted = true;
    if (options.cancel?.aborted) return;
    await write(computed);
  };
  const runHere = async (ranges: number[]) => {
    solveHere ??= compilePointDesigner(prepared.plan, methodIds, design);
    await write(computeBatch(solveHere, { inputs, sweep }, methodIds, ranges));
    // Let the workers' answers (and signals) in before the next one.
    await new Promise((r) => setImmediate(r));
  };

  // p-limit runs at most `inFlight` batches at once; a batch is cut only when a slot is
  // free, so its size uses the latest timing and a stop leaves nothing queued.
  const running = new Set<Promise<void>>();
  try {
    const cursor = new PointCursor(pending);
    while (!cursor.done && !stopped()) {
      if (running.size >= inFlight) {
        if (!workersStarted) {
          await runHere(cursor.next(Math.min(sizer.next(), ownBatch))).catch((e: unknown) => {
            failure ??= e ?? new Error('a batch failed without an error');
          });
          continue;
        }
        await Promise.race(running);
        continue;
      }
      const task: Promise<void> = limit(runBatch, cursor.next(sizer.next()))
        .catch((e: unknown) => {
          if (isAbort(e) && options.cancel?.aborted) return; // dropped on purpose
          failure ??= e ?? new Error('a batch failed without an error');
        })
        .finally(() => running.delete(task));
      running.add(task);
    }
    await Promise.all(running);
  } finally {
    await release();
  }
  return failure;
}

function isAbort(e: unknown): boolean {
  const name = (e as { name?: unknown } | null)?.name;
  return name === 'AbortError';
}

function describe(e: unknown): string {
  if (e instanceof Error) return e.message;
  return String(e);
}

export interface RunFileOptions extends RunOptions {
  /** Database file (see resolveDbPath for the CLI default). */
  db: string;
  maxPoints?: number;
}

/**
 * One study file from disk to the database, without the CLI (benchmarks, scripts):
 * load, validate, open the store, run, close.
 */
export async function runStudyFile(file: string, options: RunFileOptions): Promise<RunOutcome> {
  const prepared = prepareStudy(loadStudyFile(file, { maxPoints: options.maxPoints }));
  const store = await openStore(options.db);
  try {
    return await runStudy(store, prepared, options);
  } finally {
    await closeStore(store);
  }
}
