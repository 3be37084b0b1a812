// Reading runs back: used by the CLI (list, show, export) and the dashboard server.
import { sql } from 'kysely';
import { InputError, type Inputs, type Outputs } from '../physics/types.js';
import type { MethodVersion } from './runs.js';
import type { RunStatus } from './schema.js';
import { jsonNumberSql, jsonTextSql } from './dialect.js';
import type { Store } from './store.js';
import type { RunInfo } from '../export/run-info.js';
import type { ExportRow } from '../export/types.js';
import { getRecommendedByPoint } from './point-summaries.js';

/** A run as exports and the API show it (one definition, shared with the web app). */
export type { RunInfo };

/** What `show` adds to RunInfo: the process that ran it and why it failed. */
export interface RunDetails extends RunInfo {
  pid: number | null;
  error: string | null;
}

export interface MethodSummary {
  method: string;
  version: number;
  /** Points with a result of this method. */
  points: number;
  /** Of those, points whose result carries at least one flag. */
  flagged_points: number;
  /** `Nu` when the method gives a mean Nusselt number, else `Nu_x`, else null. */
  nu_name: 'Nu' | 'Nu_x' | null;
  nu_min: number | null;
  nu_max: number | null;
}

function runQuery(store: Store) {
  return store.db
    .selectFrom('runs')
    .innerJoin('study_versions', 'study_versions.id', 'runs.study_version_id')
    .innerJoin('studies', 'studies.id', 'study_versions.study_id')
    .select([
      'runs.id',
      'studies.name as study',
      'study_versions.version as study_version',
      'study_versions.title',
      'study_versions.configuration',
      'runs.status',
      'runs.started_at',
      'runs.finished_at',
      'runs.git_commit',
      'runs.host',
      'runs.workers',
      'runs.points_total',
      'runs.points_done',
      'runs.results_count',
      'runs.flagged_count',
      'runs.methods',
      'study_versions.hash as yaml_hash',
      'runs.pid',
      'runs.error',
    ]);
}

type RunQueryRow = Awaited<ReturnType<ReturnType<typeof runQuery>['executeTakeFirstOrThrow']>>;

function toInfo(r: RunQueryRow): RunInfo {
  return {
    id: r.id,
    study: r.study,
    study_version: r.study_version,
    title: r.title,
    configuration: r.configuration,
    status: r.status,
    started_at: r.started_at,
    finished_at: r.finished_at,
    git_commit: r.git_commit,
    host: r.host,
    workers: r.workers,
    points_total: r.points_total,
    points_done: r.points_done,
    results_count: r.results_count,
    flagged_count: r.flagged_count,
    methods: JSON.parse(r.methods) as MethodVersion[],
    yaml_hash: r.yaml_hash,
  };
}

export interface ListRunsOptions {
  /** Only runs of this study (by name). */
  study?: string;
  status?: RunStatus;
  limit?: number;
}

/** Runs, newest first. */
export async function listRuns(store: Store, options: ListRunsOptions = {}): Promise<RunInfo[]> {
  let q = runQuery(store).orderBy('runs.id', 'desc');
  if (options.study !== undefined) q = q.where('studies.name', '=', options.study);
  if (options.status !== undefined) q = q.where('runs.status', '=', options.status);
  if (options.limit !== undefined) q = q.limit(options.limit);
  return (await q.execute()).map(toInfo);
}

export async function getRun(store: Store, id: number): Promise<RunInfo | undefined> {
  const r = await runQuery(store).where('runs.id', '=', id).executeTakeFirst();
  return r && toInfo(r);
}

export async function getRunDetails(store: Store, id: number): Promise<RunDetails | undefined> {
  const r = await runQuery(store).where('runs.id', '=', id).executeTakeFirst();
  return r && { ...toInfo(r), pid: r.pid, error: r.error };
}

/** `latest` (the newest run) or a run id; an unknown reference is bad input. */
export async function resolveRunRef(store: Store, ref: string | number): Promise<RunInfo> {
  const text = String(ref).trim();
  if (text === 'latest') {
    const [newest] = await listRuns(store, { limit: 1 });
    if (!newest) throw new InputError('there are no runs in this database yet');
    return newest;
  }
  if (!/^[1-9][0-9]*$/.test(text)) throw new InputError(`run reference '${text}': expected a run id or 'latest'`);
  const run = await getRun(store, Number(text));
  if (!run) throw new InputError(`no run ${text} in this database`);
  return run;
}

/**
 * Every result of a run, in point order then method order. With `recommended` (the
 * exports), each row also says whether its method is the point's recommended one, where
 * the run has per-point summaries (migrations/0004_point_summaries.ts).
 */
export async function getRunRows(store: Store, runId: number, options: { recommended?: boolean } = {}): Promise<{ run: RunInfo; rows: ExportRow[] }> {
  const run = await getRun(store, runId);
  if (!run) throw new InputError(`no run ${runId} in this database`);
  const raw = await store.db
    .selectFrom('results as r')
    .innerJoin('points as p', (j) => j.onRef('p.run_id', '=', 'r.run_id').onRef('p.idx', '=', 'r.point_idx'))
    .select(['r.point_idx', 'r.method', 'r.flags'])
    .select(jsonTextSql(store.db, 'p.inputs').as('inputs'))
    .select(jsonTextSql(store.db, 'r.outputs').as('outputs'))
    .where('r.run_id', '=', runId)
    .orderBy('r.point_idx')
    .orderBy('r.method_idx')
    .execute();
  const rows: ExportRow[] = [];
  const recommended = options.recommended ? await getRecommendedByPoint(store, runId) : undefined;
  let lastPoint = -1;
  let inputs: Inputs = {};
  for (const r of raw) {
    // The methods of one point share its inputs object, as the engine returns them.
    if (r.point_idx !== lastPoint) {
      inputs = JSON.parse(r.inputs) as Inputs;
      lastPoint = r.point_idx;
    }
    const row: ExportRow = { method: r.method, inputs, outputs: JSON.parse(r.outputs) as Outputs, flags: JSON.parse(r.flags) as string[] };
    const best = recommended?.get(r.point_idx);
    if (best !== undefined) row.recommended = best === r.method;
    rows.push(row);
  }
  return { run, rows };
}

/** Per method: points, flagged points and the range of Nu (Nu, else Nu_x). */
export async function getRunSummary(store: Store, runId: number): Promise<MethodSummary[]> {
  const run = await getRun(store, runId);
  if (!run) throw new InputError(`no run ${runId} in this database`);
  const stats = await store.db
    .selectFrom('results')
    .select(['method_idx'])
    .select((eb) => [eb.fn.countAll<number>().as('points'), eb.fn.sum<number>('flagged').as('flagged')])
    .select(sql<number | null>`min(${jsonNumberSql(store.db, 'outputs', 'Nu')})`.as('nu_min'))
    .select(sql<number | null>`max(${jsonNumberSql(store.db, 'outputs', 'Nu')})`.as('nu_max'))
    .select(sql<number | null>`min(${jsonNumberSql(store.db, 'outputs', 'Nu_x')})`.as('nux_min'))
    .select(sql<number | null>`max(${jsonNumberSql(store.db, 'outputs', 'Nu_x')})`.as('nux_max'))
    .where('run_id', '=', runId)
    .groupBy('method_idx')
    .execute();
  const byIdx = new Map(stats.map((s) => [s.method_idx, s]));
  return run.methods.map((m, i) => {
    const s = byIdx.get(i);
    const useNu = s?.nu_min != null;
    const useNux = !useNu && s?.nux_min != null;
    return {
      method: m.id,
      version: m.version,
      points: Number(s?.points ?? 0),
      flagged_points: Number(s?.flagged ?? 0),
      nu_name: useNu ? 'Nu' : useNux ? 'Nu_x' : null,
      nu_min: useNu ? s!.nu_min : useNux ? s!.nux_min : null,
      nu_max: useNu ? s!.nu_max : useNux ? s!.nux_max : null,
    };
  });
}
