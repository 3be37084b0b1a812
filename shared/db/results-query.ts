// The dashboard's reads of one run's results: a filtered, sorted page (chart data is in
// chart-query.ts, which reads through the Source helpers exported here; comparing two
// runs is compare-query.ts). Large finished runs are read from their results cache
// (results-cache.ts), the rest straight off the JSONB columns; both give the same rows in the same order. Names reach SQL only after they
// matched NAME_PATTERN and a column of the run; values always travel as parameters.
import { InputError, type Inputs, type Outputs } from '../physics/types.js';
import { getRun, type RunInfo } from './queries.js';
import { CACHE_MIN_RESULTS, NAME_PATTERN, ensureCacheIndex, ensureResultsCache, scanRunColumns, type ResultsCache, type RunColumns } from './results-cache.js';
import type { Store } from './store.js';

export const MAX_PAGE_SIZE = 500;
/** For runs still being written, names are read from this many rows (the cache reads all). */
const COLUMN_SAMPLE = 20_000;

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

export interface ResultPageRow {
  id: number;
  point: number;
  method: string;
  inputs: Inputs;
  outputs: Outputs;
  flags: string[];
}

export interface ResultsPage {
  total: number;
  page: number;
  pageSize: number;
  rows: ResultPageRow[];
}

/** How SQL reaches a run's values: through its cache table or through the JSONB columns. */
export interface Source {
  run: RunInfo;
  columns: RunColumns;
  cache?: ResultsCache;
  from: string;
  where: string[];
  params: unknown[];
}

export interface Expr {
  sql: string;
  params: unknown[];
  /** Cache column, when the source is a cache. */
  column?: string;
}

export async function openSource(store: Store, runId: number): Promise<Source> {
  const run = await getRun(store, runId);
  if (!run) throw new InputError(`no run ${runId} in this database`);
  const cache = await ensureResultsCache(store, runId);
  if (cache) return { run, columns: cache.columns, cache, from: `${cache.table} c`, where: [], params: [] };
  const sample = run.results_count > COLUMN_SAMPLE || run.status === 'running' ? COLUMN_SAMPLE : undefined;
  return {
    run,
    columns: await scanRunColumns(store, runId, sample),
    from: 'results r join points p on p.run_id = r.run_id and p.idx = r.point_idx',
    where: ['r.run_id = ?'],
    params: [runId],
  };
}

/** The input and output names of a run (exact once the run is cached; sampled while it runs). */
export async function getRunColumns(store: Store, runId: number): Promise<RunColumns> {
  return (await openSource(store, runId)).columns;
}

export function valueExpr(store: Store, src: Source, name: string): Expr {
  if (!NAME_PATTERN.test(name)) throw new InputError(`'${name}' is not a column name`);
  // An output wins over an input of the same name: it is what the method computed.
  if (src.cache) {
    const column = src.cache.outputColumn.get(name) ?? src.cache.inputColumn.get(name);
    if (column) return { sql: `c.${column}`, params: [], column };
  } else if (src.columns.outputs.includes(name)) {
    return { sql: store.dialect.jsonNumber('r.outputs', name), params: [] };
  } else if (src.columns.inputs.includes(name)) {
    return { sql: store.dialect.jsonNumber('p.inputs', name), params: [] };
  }
  const known = [...new Set([...src.columns.inputs, ...src.columns.outputs])].sort();
  throw new InputError(`run ${src.run.id} has no input or output '${name}'; it has: ${known.join(', ')}`);
}

export function col(src: Source, what: 'seq' | 'point' | 'method' | 'flagged' | 'id'): string {
  if (src.cache) return { seq: 'c.seq', point: 'c.point_idx', method: 'c.method_idx', flagged: 'c.flagged', id: 'c.result_id' }[what];
  return { seq: 'r.point_idx, r.method_idx', point: 'r.point_idx', method: 'r.method_idx', flagged: 'r.flagged', id: 'r.id' }[what];
}

function methodIndices(run: RunInfo, methods: string[]): number[] {
  return methods.map((m) => {
    const i = run.methods.findIndex((x) => x.id === m);
    if (i < 0) throw new InputError(`run ${run.id} has no method '${m}'; it has: ${run.methods.map((x) => x.id).join(', ')}`);
    return i;
  });
}

interface Conditions {
  sql: string[];
  params: unknown[];
  filterExprs: Expr[];
}

export function conditions(store: Store, src: Source, q: Pick<ResultsQuery, 'methods' | 'flagged' | 'filters'>): Conditions {
  const out: Conditions = { sql: [...src.where], params: [...src.params], filterExprs: [] };
  if (q.methods?.length) {
    const idx = methodIndices(src.run, q.methods);
    out.sql.push(`${col(src, 'method')} in (${idx.map(() => '?').join(', ')})`);
    out.params.push(...idx);
  }
  if (q.flagged === 'yes') out.sql.push(`${col(src, 'flagged')} = 1`);
  if (q.flagged === 'no') out.sql.push(`${col(src, 'flagged')} = 0`);
  for (const f of q.filters ?? []) {
    const e = valueExpr(store, src, f.name);
    out.filterExprs.push(e);
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
  const page = Math.max(1, Math.floor(q.page ?? 1));
  const pageSize = Math.min(MAX_PAGE_SIZE, Math.max(1, Math.floor(q.pageSize ?? 50)));
  const dir = q.order === 'desc' ? 'desc' : 'asc';
  const src = await openSource(store, runId);
  const cond = conditions(store, src, q);
  const sort = q.sort ?? 'point';
  const sortExpr = sort === 'point' || sort === 'method' ? undefined : valueExpr(store, src, sort);

  // With a cache, steer SQLite to covering indexes (measured on 1e6 results, see
  // migrations/0002_dashboard.ts): the count walks the index led by the first filter's
  // column (a range scan, 7 ms for one filter); the page walks the index led by the sort
  // column, testing the filters on the index entries (2–25 ms, unlike a table scan with a
  // sort, 60–110 ms, or an index walk with a row lookup per entry, up to 300 ms when the
  // filter removes one end of the sort order). When the filters leave under 5 % of the
  // rows, the page reads those through the count's index and sorts them.
  // Index hints are SQLite's; PostgreSQL's planner gets the same indexes, unhinted.
  const hint = (index: string) => store.dialect.indexHint(index);
  let countHint = '';
  let pagePlan: (total: number) => Promise<string> = async () => '';
  if (src.cache) {
    const cache = src.cache;
    const filterColumns = [...new Set(cond.filterExprs.map((e) => e.column!))];
    const tested = [...filterColumns, 'method_idx', 'flagged'];
    const narrowed = filterColumns.length > 0 || Boolean(q.methods?.length) || q.flagged === 'yes' || q.flagged === 'no';
    const countIndex = narrowed ? await ensureCacheIndex(store, cache, tested) : undefined;
    if (countIndex) countHint = hint(countIndex);
    pagePlan = async (total: number) => {
      const selective = total < src.run.results_count * 0.05;
      if (selective && countIndex) return countHint;
      if (sort === 'point') return '';
      const lead = sortExpr ? sortExpr.column! : 'method_idx';
      return hint(await ensureCacheIndex(store, cache, [lead, ...tested]));
    };
  }
  const [counted] = await store.dialect.all<{ n: number }>(`select count(*) as n from ${src.from}${countHint}${whereOf(cond)}`, cond.params);
  const total = Number(counted.n);
  const pageHint = await pagePlan(total);
  // A missing value sorts below every number, on both stores.
  const nulls = store.dialect.nullsLow(dir);

  const order =
    sort === 'point'
      ? `${col(src, 'seq').split(', ').map((c) => `${c} ${dir}`).join(', ')}`
      : sort === 'method'
        ? `${col(src, 'method')} ${dir}, ${col(src, 'seq').split(', ').map((c) => `${c} ${dir}`).join(', ')}`
        : `${sortExpr!.sql} ${dir}${nulls}, ${col(src, 'seq').split(', ').map((c) => `${c} ${dir}`).join(', ')}`;
  // From a cache, take seq (in every index) and look the result ids up for the page only.
  const picked = (
    await store.dialect.all<{ k: number }>(
      `select ${src.cache ? 'c.seq' : col(src, 'id')} as k from ${src.from}${pageHint}${whereOf(cond)} order by ${order} limit ? offset ?`,
      [...cond.params, ...(sortExpr?.params ?? []), pageSize, (page - 1) * pageSize],
    )
  ).map((r) => Number(r.k));
  const ids = src.cache ? await resultIdsOf(store, src.cache, picked) : picked;
  return { total, page, pageSize, rows: await readRows(store, ids) };
}

async function resultIdsOf(store: Store, cache: ResultsCache, seqs: number[]): Promise<number[]> {
  if (seqs.length === 0) return [];
  const rows = await store.dialect.all<{ seq: number; result_id: number }>(
    `select seq, result_id from ${cache.table} where seq in (${seqs.map(() => '?').join(', ')})`,
    seqs,
  );
  const bySeq = new Map(rows.map((r) => [Number(r.seq), Number(r.result_id)]));
  return seqs.map((q) => bySeq.get(q)!);
}

/** Full rows for result ids, in the given order. */
async function readRows(store: Store, ids: number[]): Promise<ResultPageRow[]> {
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

export { CACHE_MIN_RESULTS };
