// A run's life in the database: created as `running`, advanced by the batch writer,
// finished as done / failed / interrupted, and claimed again by `resume`.
import { InputError } from '../physics/types.js';
import type { RunStatus } from './schema.js';
import type { Store } from './store.js';
import { immediateTransaction } from './transaction.js';

export interface MethodVersion {
  id: string;
  version: number;
}

export interface NewRunSpec {
  study: { name: string; title?: string | null; configuration: string };
  yaml: string;
  /** sha256 of `yaml`, hex. */
  hash: string;
  sourceFile?: string | null;
  methods: MethodVersion[];
  pointsTotal: number;
  workers: number;
  host: string;
  pid: number;
  gitCommit: string | null;
}

const now = () => new Date().toISOString();

/** Stores the study and its version (once per content) and a new `running` run. */
export async function createRun(store: Store, spec: NewRunSpec): Promise<number> {
  return immediateTransaction(store, async (db) => {
    const time = now();
    await db
      .insertInto('studies')
      .values({ name: spec.study.name, created_at: time })
      .onConflict((oc) => oc.column('name').doNothing())
      .execute();
    const study = await db.selectFrom('studies').select('id').where('name', '=', spec.study.name).executeTakeFirstOrThrow();
    let version = await db
      .selectFrom('study_versions')
      .select('id')
      .where('study_id', '=', study.id)
      .where('hash', '=', spec.hash)
      .executeTakeFirst();
    if (!version) {
      const last = await db
        .selectFrom('study_versions')
        .select((eb) => eb.fn.max('version').as('max'))
        .where('study_id', '=', study.id)
        .executeTakeFirst();
      version = await db
        .insertInto('study_versions')
        .values({
          study_id: study.id,
          version: Number(last?.max ?? 0) + 1,
          hash: spec.hash,
          yaml: spec.yaml,
          title: spec.study.title ?? null,
          configuration: spec.study.configuration,
          source_file: spec.sourceFile ?? null,
          created_at: time,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
    }
    const run = await db
      .insertInto('runs')
      .values({
        study_version_id: version.id,
        status: 'running',
        started_at: time,
        finished_at: null,
        git_commit: spec.gitCommit,
        host: spec.host,
        pid: spec.pid,
        workers: spec.workers,
        points_total: spec.pointsTotal,
        methods: JSON.stringify(spec.methods),
        error: null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return run.id;
  });
}

export async function finishRun(store: Store, runId: number, status: Exclude<RunStatus, 'queued' | 'running'>, error?: string): Promise<void> {
  await immediateTransaction(store, (db) =>
    db
      .updateTable('runs')
      .set({ status, finished_at: now(), error: error ?? null })
      .where('id', '=', runId)
      .execute(),
  );
}

export interface RunSource {
  status: RunStatus;
  host: string;
  pid: number | null;
  yaml: string;
  hash: string;
  sourceFile: string | null;
  methods: MethodVersion[];
  pointsTotal: number;
}

/** The stored study version and method list of a run: what `resume` rebuilds the sweep from. */
export async function getRunSource(store: Store, runId: number): Promise<RunSource | undefined> {
  const run = await store.db
    .selectFrom('runs')
    .innerJoin('study_versions', 'study_versions.id', 'runs.study_version_id')
    .select(['runs.status', 'runs.host', 'runs.pid', 'runs.methods', 'runs.points_total'])
    .select(['study_versions.yaml', 'study_versions.hash', 'study_versions.source_file'])
    .where('runs.id', '=', runId)
    .executeTakeFirst();
  if (!run) return undefined;
  return {
    status: run.status,
    host: run.host,
    pid: run.pid,
    yaml: run.yaml,
    hash: run.hash,
    sourceFile: run.source_file,
    methods: JSON.parse(run.methods) as MethodVersion[],
    pointsTotal: run.points_total,
  };
}

/** Why a run cannot be resumed now, or undefined when it can. */
export function resumeRefusal(runId: number, run: Pick<RunSource, 'status' | 'host' | 'pid'>, isAlive: (host: string, pid: number) => boolean): string | undefined {
  if (run.status === 'done') return `run ${runId} is already done; nothing to resume`;
  if (run.status === 'running' && run.pid !== null && isAlive(run.host, run.pid)) {
    return `run ${runId} is still running (pid ${run.pid} on ${run.host}); stop it first or wait for it`;
  }
  return undefined;
}

/**
 * Takes over an unfinished run for `resume` and returns the points already stored.
 * The refusal checks are repeated inside one IMMEDIATE transaction with the claim, so
 * two resumes of the same run cannot both win. The counters are recounted from the
 * rows, which are the truth after a kill -9.
 */
export async function claimRunForResume(
  store: Store,
  runId: number,
  me: { host: string; pid: number; workers: number },
  isAlive: (host: string, pid: number) => boolean,
): Promise<Set<number>> {
  return immediateTransaction(store, async (db) => {
    const run = await db.selectFrom('runs').select(['status', 'host', 'pid']).where('id', '=', runId).executeTakeFirst();
    if (!run) throw new InputError(`no run ${runId} in this database`);
    const refusal = resumeRefusal(runId, run, isAlive);
    if (refusal) throw new InputError(refusal);
    const rows = await db.selectFrom('points').select('idx').where('run_id', '=', runId).execute();
    const counts = await db
      .selectFrom('results')
      .select((eb) => [eb.fn.countAll<number>().as('results'), eb.fn.sum<number>('flagged').as('flagged')])
      .where('run_id', '=', runId)
      .executeTakeFirstOrThrow();
    await db
      .updateTable('runs')
      .set({
        status: 'running',
        host: me.host,
        pid: me.pid,
        workers: me.workers,
        finished_at: null,
        error: null,
        points_done: rows.length,
        results_count: Number(counts.results),
        flagged_count: Number(counts.flagged ?? 0),
      })
      .where('id', '=', runId)
      .execute();
    return new Set(rows.map((r) => r.idx));
  });
}
