// A run's life in the database: created as `running` with its results table, advanced by
// the batch writer, finished as done / failed / interrupted, claimed again by `resume`,
// and deleted (a push that failed half-way).
import { sql } from '#kysely';
import { InputError } from '../physics/types.js';
import { createRunTableSql, layoutOf, methodSql, recountSql, runTableName } from './result-table.js';
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

/** Stores the study and its version (once per content) and a new `running` run with its (empty) results table. */
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
        results_table: 1,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    // Ids are never reused, but a table left by a deleted run must not lend it rows.
    await sql.raw(`drop table if exists ${runTableName(run.id)}`).execute(db);
    await sql.raw(createRunTableSql(store.kind, run.id)).execute(db);
    return run.id;
  });
}

/** Deletes a run with its results (its table, or its rows in points/results by cascade). */
export async function deleteRun(store: Store, runId: number): Promise<void> {
  await store.dialect.atomic([{ sql: `drop table if exists ${runTableName(runId)}` }, { sql: 'delete from runs where id = ?', params: [runId] }]);
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
 * rows, which are the truth after a kill -9. The run's results must be in its table
 * (prepareResume converts a run stored before migrations/0005_run_tables.ts first).
 */
export async function claimRunForResume(
  store: Store,
  runId: number,
  me: { host: string; pid: number; workers: number },
  isAlive: (host: string, pid: number) => boolean,
): Promise<Set<number>> {
  return immediateTransaction(store, async (db) => {
    const run = await db.selectFrom('runs').select(['status', 'host', 'pid', 'methods', 'results_table']).where('id', '=', runId).executeTakeFirst();
    if (!run) throw new InputError(`no run ${runId} in this database`);
    const refusal = resumeRefusal(runId, run, isAlive);
    if (refusal) throw new InputError(refusal);
    if (Number(run.results_table) !== 1) throw new Error(`internal: run ${runId} is stored in points/results; convert it before claiming it`);
    const M = (JSON.parse(run.methods) as MethodVersion[]).length;
    const table = runTableName(runId);
    // A batch stores every method of its points at once: a point is done when its first method's row is there.
    const done = await sql<{ seq: number }>`select seq from ${sql.raw(table)} where ${sql.raw(methodSql('', M))} = 0`.execute(db);
    const [counts] = (await sql<{ results: number; flagged: number | null }>`select count(*) as results, count(flags) as flagged from ${sql.raw(table)}`.execute(db)).rows;
    const columns = await db.selectFrom('result_columns').select(['idx', 'role', 'name', 'kind']).where('run_id', '=', runId).execute();
    for (const statement of recountSql(runId, M, layoutOf(columns, []))) await sql.raw(statement).execute(db);
    await db
      .updateTable('runs')
      .set({
        status: 'running',
        host: me.host,
        pid: me.pid,
        workers: me.workers,
        finished_at: null,
        error: null,
        points_done: done.rows.length,
        results_count: Number(counts.results),
        flagged_count: Number(counts.flagged ?? 0),
      })
      .where('id', '=', runId)
      .execute();
    return new Set(done.rows.map((r) => Math.floor(Number(r.seq) / M)));
  });
}
