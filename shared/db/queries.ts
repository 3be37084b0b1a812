// Reading runs back: used by the CLI (list, show, export) and the dashboard server.
import { InputError } from '../physics/types.js';
import { legacyRunRows, legacyRunSummary, type LegacySummaryRow } from './legacy-results.js';
import { eachStoredResult, hasRunTable, loadLayout } from './result-table.js';
import type { MethodVersion } from './runs.js';
import type { RunStatus } from './schema.js';
import type { Store } from './store.js';
import type { RunInfo } from '../export/run-info.js';
import type { MethodSummary } from '../export/run-data.js';
import type { ExportRow } from '../export/types.js';
import { getRecommendedByPoint } from './point-summaries.js';

/** A run as exports and the API show it, and its per-method summary (one definition each, shared with the web app). */
export type { RunInfo, MethodSummary };

/** What `show` adds to RunInfo: the process that ran it and why it failed. */
export interface RunDetails extends RunInfo {
  pid: number | null;
  error: string | null;
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
  const recommended = options.recommended ? await getRecommendedByPoint(store, runId) : undefined;
  if (!(await hasRunTable(store, runId))) return { run, rows: await legacyRunRows(store, runId, recommended) };
  const rows: ExportRow[] = [];
  await eachStoredResult(store, runId, run.methods.length, (r) => {
    const row: ExportRow = { method: run.methods[r.method].id, inputs: r.inputs, outputs: r.outputs, flags: r.flags };
    const best = recommended?.get(r.point);
    if (best !== undefined) row.recommended = best === row.method;
    rows.push(row);
  });
  return { run, rows };
}

/** Per method: points, flagged points and the range of Nu (Nu, else Nu_x). */
export async function getRunSummary(store: Store, runId: number): Promise<MethodSummary[]> {
  const run = await getRun(store, runId);
  if (!run) throw new InputError(`no run ${runId} in this database`);
  const stats = (await hasRunTable(store, runId)) ? await tableSummary(store, runId) : await legacyRunSummary(store, runId);
  const byIdx = new Map(stats.map((s) => [Number(s.method_idx), s]));
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

/** The summary's figures of a run with a table: from the figures the batch writer keeps. */
async function tableSummary(store: Store, runId: number): Promise<LegacySummaryRow[]> {
  const layout = await loadLayout(store, runId);
  const d = store.dialect;
  const counts = await d.all<{ method_idx: number; results: number; flagged: number }>('select method_idx, results, flagged from result_counts where run_id = ?', [runId]);
  const stats = await d.all<{ method_idx: number; column_idx: number; minimum: number; maximum: number }>(
    'select method_idx, column_idx, minimum, maximum from result_stats where run_id = ?',
    [runId],
  );
  const range = (method: number, name: string) => {
    const c = layout.column('output', name);
    const s = c === undefined ? undefined : stats.find((x) => Number(x.method_idx) === method && Number(x.column_idx) === c);
    return s ? [Number(s.minimum), Number(s.maximum)] : [null, null];
  };
  return counts.map((c) => {
    const m = Number(c.method_idx);
    const [nu_min, nu_max] = range(m, 'Nu');
    const [nux_min, nux_max] = range(m, 'Nu_x');
    return { method_idx: m, points: Number(c.results), flagged: Number(c.flagged), nu_min, nu_max, nux_min, nux_max };
  });
}
