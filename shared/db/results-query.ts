// The dashboard's reads of one run's results: a filtered, sorted page (chart data is in
// chart-query.ts, which reads through the Source helpers exported here; comparing two
// runs is compare-query.ts). A run's results are read from its own table
// (result-table.ts), whose plain columns the filters and sorts use directly; a run stored
// before migrations/0005_run_tables.ts is read straight off the JSON columns of
// points/results while it is converted in the background (legacy-results.ts). Both give
// the same rows in the same order. Names reach SQL only after they matched NAME_PATTERN
// and a column of the run; values always travel as parameters.
import type { ResultPageRow, ResultsPage, RunColumns } from '../export/run-data.js';
import { InputError } from '../physics/types.js';
import { convertInBackground, readingRun } from './legacy-results.js';
import { getRun, type RunInfo } from './queries.js';
import type { RunLayout } from './result-layout.js';
import { eachStoredResult, flaggedSql, hasRunTable, loadLayout, methodSql, runTableName, valueColumn } from './result-table.js';
import type { Store } from './store.js';

export type { ResultPageRow, ResultsPage, RunColumns };

export const MAX_PAGE_SIZE = 500;
/** For runs in points/results, names are read from this many rows while they are large or running. */
const COLUMN_SAMPLE = 20_000;

/** Names the dashboard may filter, sort and plot by; nothing else reaches SQL. */
export const NAME_PATTERN = /^[A-Za-z_][A-Za-z0-9_]*$/;

export interface RangeFilter {
  name: string;
  min?: number;
  max?: number;
}

export interface ResultsQuery {
  page?: number;
  pageSize?: number;
  /** An input or output name, or `point` (default) or `method`. */
  sort?: string;
  order?: 'asc' | 'desc';
  methods?: string[];
  flagged?: 'any' | 'yes' | 'no';
  filters?: RangeFilter[];
}

/** How SQL reaches a run's values: its run table, or the JSON columns of points/results. */
export interface Source {
  run: RunInfo;
  columns: RunColumns;
  /** Set when the run has its table. */
  layout?: RunLayout;
  from: string;
  where: string[];
  params: unknown[];
}

export interface Expr {
  sql: string;
  params: unknown[];
  /** The run-table column, for a run with its table. */
  column?: number;
}

export async function openSource(store: Store, runId: number): Promise<Source> {
  const run = await getRun(store, runId);
  if (!run) throw new InputError(`no run ${runId} in this database`);
  if (await hasRunTable(store, runId)) {
    const layout = await loadLayout(store, runId);
    const names = layout.names();
    const columns = { inputs: names.inputs.filter((n) => NAME_PATTERN.test(n)), outputs: names.outputs.filter((n) => NAME_PATTERN.test(n)) };
    return { run, columns, layout, from: `${runTableName(runId)} c`, where: [], params: [] };
  }
  // Stored before run tables: converted in the background (not for a run still being written).
  if (run.status !== 'running' && run.status !== 'queued') void convertInBackground(store, runId);
  const sample = run.results_count > COLUMN_SAMPLE || run.status === 'running' ? COLUMN_SAMPLE : undefined;
  return {
    run,
    columns: await scanJsonColumns(store, runId, sample),
    from: 'results r join points p on p.run_id = r.run_id and p.idx = r.point_idx',
    where: ['r.run_id = ?'],
    params: [runId],
  };
}

/** Every input and output name of a run in points/results (a pass over `limit` rows, or all). */
async function scanJsonColumns(store: Store, runId: number, limit?: number): Promise<RunColumns> {
  const d = store.dialect;
  const keys = async (table: string, column: string) =>
    (await d.all<{ key: string }>(d.jsonKeysQuery(table, column, limit), [runId])).map((r) => r.key).filter((n) => NAME_PATTERN.test(n));
  return { inputs: await keys('points', 'inputs'), outputs: await keys('results', 'outputs') };
}

/** The input and output names of a run (sampled while a run stored in points/results is large or running). */
export async function getRunColumns(store: Store, runId: number): Promise<RunColumns> {
  return readingRun(store, runId, async () => (await openSource(store, runId)).columns);
}

/**
 * SQL of a name's value. `numbers`: for filters and chart axes, which need numbers (a run
 * table's text or switch values of the name count as missing); otherwise (sorting, series
 * labels) a text column serves too.
 */
export function valueExpr(store: Store, src: Source, name: string, numbers = true): Expr {
  if (!NAME_PATTERN.test(name)) throw new InputError(`'${name}' is not a column name`);
  // An output wins over an input of the same name: it is what the method computed.
  if (src.layout) {
    const column = numbers ? src.layout.numberColumn(name) : src.layout.anyColumn(name);
    if (column !== undefined) return { sql: `c.${valueColumn(column)}`, params: [], column };
    if (src.layout.anyColumn(name) !== undefined) return { sql: 'null', params: [] };
  } else if (src.columns.outputs.includes(name)) {
    return { sql: store.dialect.jsonNumber('r.outputs', name), params: [] };
  } else if (src.columns.inputs.includes(name)) {
    return { sql: store.dialect.jsonNumber('p.inputs', name), params: [] };
  }
  const known = [...new Set([...src.columns.inputs, ...src.columns.outputs])].sort();
  throw new InputError(`run ${src.run.id} has no input or output '${name}'; it has: ${known.join(', ')}`);
}

/** SQL of a row's sequence (the order of point, then method), point, method, flag (0/1) and id. */
export function col(src: Source, what: 'seq' | 'point' | 'method' | 'flagged' | 'id'): string {
  if (src.layout) {
    const M = src.run.methods.length;
    return { seq: 'c.seq', point: `(c.seq / ${M})`, method: methodSql('c.', M), flagged: flaggedSql('c.'), id: 'c.seq' }[what];
  }
  return { seq: 'r.point_idx, r.method_idx', point: 'r.point_idx', method: 'r.method_idx', flagged: 'r.flagged', id: 'r.id' }[what];
}

function methodIndices(run: RunInfo, methods: string[]): number[] {
  return methods.map((m) => {
    const i = run.methods.findIndex((x) => x.id === m);
    if (i < 0) throw new InputError(`run ${run.id} has no method '${m}'; it has: ${run.methods.map((x) => x.id).join(', ')}`);
    return i;
  });
}

export interface Conditions {
  sql: string[];
  params: unknown[];
}

export function conditions(store: Store, src: Source, q: Pick<ResultsQuery, 'methods' | 'flagged' | 'filters'>): Conditions {
  const out: Conditions = { sql: [...src.where], params: [...src.params] };
  if (q.methods?.length) {
    const idx = methodIndices(src.run, q.methods);
    out.sql.push(`${col(src, 'method')} in (${idx.map(() => '?').join(', ')})`);
    out.params.push(...idx);
  }
  if (q.flagged === 'yes') out.sql.push(`${col(src, 'flagged')} = 1`);
  if (q.flagged === 'no') out.sql.push(`${col(src, 'flagged')} = 0`);
  for (const f of q.filters ?? []) {
    const e = valueExpr(store, src, f.name);
    if (f.min !== undefined) {
      out.sql.push(`${e.sql} >= ?`);
      out.params.push(...e.params, f.min);
    }
    if (f.max !== undefined) {
      out.sql.push(`${e.sql} <= ?`);
      out.params.push(...e.params, f.max);
    }
    if (f.min === undefined && f.max === undefined) {
      out.sql.push(`${e.sql} is not null`);
      out.params.push(...e.params);
    }
  }
  return out;
}

export const whereOf = (c: Conditions) => (c.sql.length ? ` where ${c.sql.join(' and ')}` : '');

/**
 * One page of a run's results. Order: the sort key, then point, then method (descending
 * reverses all three); a missing value sorts below every number, as in SQLite.
 */
export async function queryResults(store: Store, runId: number, q: ResultsQuery = {}): Promise<ResultsPage> {
  return readingRun(store, runId, () => pageOf(store, runId, q));
}

async function pageOf(store: Store, runId: number, q: ResultsQuery): Promise<ResultsPage> {
  const page = Math.max(1, Math.floor(q.page ?? 1));
  const pageSize = Math.min(MAX_PAGE_SIZE, Math.max(1, Math.floor(q.pageSize ?? 50)));
  const dir = q.order === 'desc' ? 'desc' : 'asc';
  const src = await openSource(store, runId);
  const cond = conditions(store, src, q);
  const sort = q.sort ?? 'point';
  const sortExpr = sort === 'point' || sort === 'method' ? undefined : valueExpr(store, src, sort, false);

  // No index on a run table: a count and a sorted page are each one pass over the run's
  // rows of plain columns (tens of milliseconds for 1e6 results; see the api bench), and
  // an index would cost every insert or a long build on first use.
  const [counted] = await store.dialect.all<{ n: number }>(`select count(*) as n from ${src.from}${whereOf(cond)}`, cond.params);
  const total = Number(counted.n);
  // A missing value sorts below every number, on both stores.
  const nulls = store.dialect.nullsLow(dir);
  const bySeq = col(src, 'seq').split(', ').map((c) => `${c} ${dir}`).join(', ');
  const order =
    sort === 'point' ? bySeq : sort === 'method' ? `${col(src, 'method')} ${dir}, ${bySeq}` : `${sortExpr!.sql} ${dir}${nulls}, ${bySeq}`;
  const picked = (
    await store.dialect.all<{ k: number }>(
      `select ${col(src, 'id')} as k from ${src.from}${whereOf(cond)} order by ${order} limit ? offset ?`,
      [...cond.params, ...(sortExpr?.params ?? []), pageSize, (page - 1) * pageSize],
    )
  ).map((r) => Number(r.k));
  const rows = src.layout ? await tableRows(store, src, picked) : await jsonRows(store, picked);
  return { total, page, pageSize, rows };
}

/** Rows of a run table by seq, in the given order. */
async function tableRows(store: Store, src: Source, seqs: number[]): Promise<ResultPageRow[]> {
  const bySeq = new Map<number, ResultPageRow>();
  const methods = src.run.methods;
  await eachStoredResult(
    store,
    src.run.id,
    methods.length,
    (r) => bySeq.set(r.seq, { id: r.seq + 1, point: r.point, method: methods[r.method].id, inputs: r.inputs, outputs: r.outputs, flags: r.flags }),
    { layout: src.layout, seqs },
  );
  return seqs.map((q) => bySeq.get(q)!);
}

/** Full rows from points/results for result ids, in the given order. */
async function jsonRows(store: Store, ids: number[]): Promise<ResultPageRow[]> {
  if (ids.length === 0) return [];
  const d = store.dialect;
  const raw = await d.all<{ id: number; point_idx: number; method: string; flags: string; inputs: string; outputs: string }>(
    `select r.id, r.point_idx, r.method, r.flags, ${d.jsonText('p.inputs')} as inputs, ${d.jsonText('r.outputs')} as outputs
     from results r join points p on p.run_id = r.run_id and p.idx = r.point_idx
     where r.id in (${ids.map(() => '?').join(', ')})`,
    ids,
  );
  const byId = new Map(raw.map((r) => [Number(r.id), r]));
  return ids.map((id) => {
    const r = byId.get(id)!;
    return { id: Number(r.id), point: r.point_idx, method: r.method, inputs: JSON.parse(r.inputs), outputs: JSON.parse(r.outputs), flags: JSON.parse(r.flags) };
  });
}
