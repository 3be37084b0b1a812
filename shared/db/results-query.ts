// The dashboard's reads of one run's results: a filtered, sorted page; chart data
// downsampled to a bounded size; and the comparison of two runs. A run's results are read
// from its own table (result-table.ts), whose plain columns the filters and sorts use
// directly; a run stored before migrations/0005_run_tables.ts is read straight off the
// JSON columns of points/results while it is converted in the background
// (legacy-results.ts). Both give the same rows in the same order. Names reach SQL only
// after they matched NAME_PATTERN and a column of the run; values always travel as
// parameters.
import type { ChartData, ChartSeries, CompareRow, Comparison, ResultPageRow, ResultsPage, RunColumns } from '../export/run-data.js';
import { getMethod } from '../physics/catalogue.js';
import { InputError, type Inputs, type Outputs } from '../physics/types.js';
import { convertInBackground, readingRun } from './legacy-results.js';
import { getRun, type RunInfo } from './queries.js';
import { decodeValue, type RunLayout } from './result-layout.js';
import { eachStoredResult, flaggedSql, hasRunTable, loadLayout, methodSql, runTableName, valueColumn } from './result-table.js';
import type { Store } from './store.js';

export type { ChartData, ChartSeries, CompareRow, Comparison, ResultPageRow, ResultsPage, RunColumns };

export const MAX_PAGE_SIZE = 500;
export const MAX_CHART_POINTS = 20_000;
export const MAX_SERIES = 100;
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
interface Source {
  run: RunInfo;
  columns: RunColumns;
  /** Set when the run has its table. */
  layout?: RunLayout;
  from: string;
  where: string[];
  params: unknown[];
}

interface Expr {
  sql: string;
  params: unknown[];
  /** The run-table column, for a run with its table. */
  column?: number;
}

async function openSource(store: Store, runId: number): Promise<Source> {
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
function valueExpr(store: Store, src: Source, name: string, numbers = true): Expr {
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

function col(src: Source, what: 'seq' | 'method' | 'flagged' | 'id'): string {
  if (src.layout) return { seq: 'c.seq', method: methodSql('c.', src.run.methods.length), flagged: flaggedSql('c.'), id: 'c.seq' }[what];
  return { seq: 'r.point_idx, r.method_idx', method: 'r.method_idx', flagged: 'r.flagged', id: 'r.id' }[what];
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
}

function conditions(store: Store, src: Source, q: Pick<ResultsQuery, 'methods' | 'flagged' | 'filters'>): Conditions {
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

const whereOf = (c: Conditions) => (c.sql.length ? ` where ${c.sql.join(' and ')}` : '');

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

export interface ChartQuery {
  x: string;
  y: string;
  /** `method` (default) or an input name: one series per method and value of that input. */
  series?: string;
  methods?: string[];
  filters?: RangeFilter[];
  /** Upper bound on the points returned over all series (default 2000). */
  max?: number;
}

/**
 * x–y data per series. When more than `max` results qualify, each series is cut into
 * buckets along x (logarithmic when every x is positive, as the charts are log-log) and
 * each bucket keeps its lowest and highest y: the envelope survives, the payload stays
 * at most `max` points however large the run.
 */
export async function chartData(store: Store, runId: number, q: ChartQuery): Promise<ChartData> {
  return readingRun(store, runId, () => chartOf(store, runId, q));
}

async function chartOf(store: Store, runId: number, q: ChartQuery): Promise<ChartData> {
  const max = Math.min(MAX_CHART_POINTS, Math.max(10, Math.floor(q.max ?? 2000)));
  const src = await openSource(store, runId);
  const d = store.dialect;
  const cond = conditions(store, src, { methods: q.methods, filters: q.filters });
  const x = valueExpr(store, src, q.x);
  const y = valueExpr(store, src, q.y);
  const bySeries = q.series && q.series !== 'method' ? valueExpr(store, src, q.series, false) : undefined;
  const m = col(src, 'method');
  const f = col(src, 'flagged');
  // s: the series as one text key (grouping); v: the value of the series input (its label).
  const seriesSql = bySeries ? `${m} || '|' || ${d.labelText(bySeries.sql)}` : `${m}`;
  const baseParams = [...(bySeries?.params ?? []), ...(bySeries?.params ?? []), ...x.params, ...y.params, ...cond.params, ...x.params, ...y.params];
  // Numbers only: a string or switch value cannot be plotted.
  const numeric = (e: Expr) => d.isNumber(e.sql);
  const base =
    `select ${seriesSql} as s, ${bySeries ? bySeries.sql : 'null'} as v, ${m} as m, ${x.sql} as x, ${y.sql} as y, ${f} as f from ${src.from}` +
    `${whereOf(cond)}${cond.sql.length ? ' and ' : ' where '}${numeric(x)} and ${numeric(y)}`;
  const label = (v: unknown) => (bySeries?.column !== undefined && src.layout ? decodeValue(src.layout.columns[bySeries.column].kind, v) : v);

  if (d.visitRows && src.layout) {
    const found = await envelopeInOnePass(store, src, q, { base, baseParams, x, bySeries: Boolean(bySeries), max });
    return chartResult(src, q, Boolean(bySeries), found, label);
  }

  const seriesRows = await d.all<{ s: string; v: unknown; m: number; n: number; lo: number; hi: number }>(
    `with src as (${base}) select s, min(v) as v, m, count(*) as n, min(x) as lo, max(x) as hi from src group by s, m`,
    baseParams,
  );
  if (seriesRows.length > MAX_SERIES) {
    throw new InputError(`series by '${q.series}' gives ${seriesRows.length} series; at most ${MAX_SERIES} can be plotted`);
  }
  const total = seriesRows.reduce((a, s) => a + Number(s.n), 0);
  const downsampled = total > max;
  const points = new Map<string, [number, number, 0 | 1][]>();
  if (!downsampled) {
    const rows = await d.all<{ s: string; x: number; y: number; f: number }>(`${base} order by ${m}, x, y`, baseParams);
    for (const r of rows) push(points, r.s, [r.x, r.y, r.f ? 1 : 0]);
  } else {
    const buckets = Math.max(1, Math.floor(max / (2 * seriesRows.length)));
    const logX = seriesRows.every((s) => s.lo > 0);
    const pos = logX ? '(ln(src.x) - ln(e.lo)) / (ln(e.hi) - ln(e.lo))' : '(src.x - e.lo) / (e.hi - e.lo)';
    const bucketed =
      `with src as (${base}), e as (select s, min(x) as lo, max(x) as hi from src group by s), ` +
      `b as (select src.s, src.x, src.y, src.f, case when e.hi = e.lo then 0 else ${d.least(String(buckets - 1), d.floorInt(`${pos} * ${buckets}`))} end as k ` +
      `from src join e on e.s = src.s) `;
    const extremes = (which: 'min' | 'max') =>
      d.all<{ s: string; k: number; x: number; y: number; f: number }>(`${bucketed} ${d.extremeRows('b', ['s', 'k'], 'y', which, ['s', 'k', 'x', 'y', 'f'])}`, baseParams);
    const lows = await extremes('min');
    const highs = await extremes('max');
    const seen = new Set<string>();
    for (const { s, k, x: xv, y: yv, f: fv } of [...lows, ...highs]) {
      const key = `${s}\u0000${k}\u0000${xv}\u0000${yv}`;
      if (seen.has(key)) continue;
      seen.add(key);
      push(points, s, [xv, yv, fv ? 1 : 0]);
    }
    for (const list of points.values()) list.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  }
  const series = seriesRows.map((r) => ({ m: Number(r.m), v: r.v, points: points.get(String(r.s)) ?? [] }));
  return chartResult(src, q, Boolean(bySeries), { total, downsampled, series }, label);
}

interface SeriesPoints {
  total: number;
  downsampled: boolean;
  series: { m: number; v: unknown; points: [number, number, 0 | 1][] }[];
}

/** Series in method order, then by the value of the series input (numbers by size); labels as JavaScript writes the value. */
function chartResult(src: Source, q: ChartQuery, bySeries: boolean, found: SeriesPoints, label: (v: unknown) => unknown): ChartData {
  const uncertainty: Record<string, number> = {};
  const ordered = [...found.series].sort((a, b) => a.m - b.m || compareValues(a.v, b.v));
  const series: ChartSeries[] = ordered.map((s) => {
    const method = src.run.methods[s.m].id;
    uncertainty[method] ??= methodUncertainty(src.run.configuration, method);
    const value = s.v === null || s.v === undefined ? '' : String(label(s.v));
    return { name: bySeries ? `${method}, ${q.series} = ${value}` : method, method, points: s.points };
  });
  return { x: q.x, y: q.y, total: found.total, downsampled: found.downsampled, series, uncertainty };
}

function compareValues(a: unknown, b: unknown): number {
  if (a === b) return 0;
  if (a === null || a === undefined) return -1;
  if (b === null || b === undefined) return 1;
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  if (typeof a === 'number') return -1;
  if (typeof b === 'number') return 1;
  return String(a) < String(b) ? -1 : 1;
}

/** One series' bucket bookkeeping in envelopeInOnePass. */
interface SeriesEnvelope {
  m: number;
  v: unknown;
  lo: number;
  hi: number;
  n: number;
  /** Per bucket: x, y and flag of the lowest and the highest y (NaN: empty). */
  low: Float64Array;
  high: Float64Array;
}

/**
 * The chart of a run table on SQLite, the same points as the SQL path: the axis range of
 * each series first (from the figures the batch writer keeps when nothing narrows the run,
 * else one grouped query), then a single pass over the rows that keeps every point while
 * they are few and each bucket's lowest and highest y (ties: the first row, as SQLite's
 * min and max do).
 */
async function envelopeInOnePass(
  store: Store,
  src: Source,
  q: ChartQuery,
  p: { base: string; baseParams: unknown[]; x: Expr; bySeries: boolean; max: number },
): Promise<SeriesPoints> {
  const d = store.dialect;
  let ranges: { m: number; v: unknown; lo: number; hi: number }[];
  if (!p.bySeries && !q.filters?.length && p.x.column !== undefined && src.layout!.columns[p.x.column].kind === 'number') {
    const wanted = q.methods?.length ? new Set(methodIndices(src.run, q.methods)) : undefined;
    const rows = await d.all<{ method_idx: number; minimum: number; maximum: number }>(
      'select method_idx, minimum, maximum from result_stats where run_id = ? and column_idx = ?',
      [src.run.id, p.x.column],
    );
    ranges = rows
      .filter((r) => !wanted || wanted.has(Number(r.method_idx)))
      .map((r) => ({ m: Number(r.method_idx), v: null, lo: Number(r.minimum), hi: Number(r.maximum) }));
  } else {
    ranges = (
      await d.all<{ v: unknown; m: number; lo: number; hi: number }>(
        `with src as (${p.base}) select min(v) as v, m, min(x) as lo, max(x) as hi from src group by s, m`,
        p.baseParams,
      )
    ).map((r) => ({ m: Number(r.m), v: r.v, lo: Number(r.lo), hi: Number(r.hi) }));
  }
  if (ranges.length > MAX_SERIES) {
    throw new InputError(`series by '${q.series}' gives ${ranges.length} series; at most ${MAX_SERIES} can be plotted`);
  }
  const buckets = Math.max(1, Math.floor(p.max / (2 * Math.max(1, ranges.length))));
  const logX = ranges.every((r) => r.lo > 0);
  // Series by method, then by the series input's value.
  const byMethod = new Map<number, Map<unknown, SeriesEnvelope>>();
  for (const r of ranges) {
    if (!byMethod.has(r.m)) byMethod.set(r.m, new Map());
    byMethod.get(r.m)!.set(r.v, { ...r, n: 0, low: new Float64Array(3 * buckets).fill(NaN), high: new Float64Array(3 * buckets).fill(NaN) });
  }
  const all: { e: SeriesEnvelope; x: number; y: number; f: number }[] = [];
  let total = 0;
  await d.visitRows!(`select count(filmsweep_visit(m, v, x, y, f)) from (${p.base})`, p.baseParams, (mv, vv, xv, yv, fv) => {
    const e = byMethod.get(Number(mv))?.get(vv);
    if (!e) return; // not in the ranges: cannot happen, as the ranges cover every row
    const x = Number(xv);
    const y = Number(yv);
    const f = fv ? 1 : 0;
    e.n++;
    if (++total <= p.max) all.push({ e, x, y, f });
    // The bucket, as the SQL path computes it: position along x (logarithmic when every x is positive).
    const pos = e.hi === e.lo ? 0 : logX ? (Math.log(x) - Math.log(e.lo)) / (Math.log(e.hi) - Math.log(e.lo)) : (x - e.lo) / (e.hi - e.lo);
    const k = 3 * Math.max(0, Math.min(buckets - 1, Math.floor(pos * buckets)));
    if (!(e.low[k + 1] <= y)) {
      e.low[k] = x;
      e.low[k + 1] = y;
      e.low[k + 2] = f;
    }
    if (!(e.high[k + 1] >= y)) {
      e.high[k] = x;
      e.high[k + 1] = y;
      e.high[k + 2] = f;
    }
  });
  const used = [...byMethod.values()].flatMap((v) => [...v.values()]).filter((e) => e.n > 0);
  if (total <= p.max) {
    const points = new Map<SeriesEnvelope, [number, number, 0 | 1][]>(used.map((e) => [e, []]));
    all.sort((a, b) => a.x - b.x || a.y - b.y);
    for (const a of all) points.get(a.e)!.push([a.x, a.y, a.f as 0 | 1]);
    return { total, downsampled: false, series: used.map((e) => ({ m: e.m, v: e.v, points: points.get(e)! })) };
  }
  return {
    total,
    downsampled: true,
    series: used.map((e) => {
      const points: [number, number, 0 | 1][] = [];
      for (let k = 0; k < 3 * buckets; k += 3) {
        if (Number.isNaN(e.low[k + 1])) continue;
        points.push([e.low[k], e.low[k + 1], e.low[k + 2] as 0 | 1]);
        if (e.high[k] !== e.low[k] || e.high[k + 1] !== e.low[k + 1]) points.push([e.high[k], e.high[k + 1], e.high[k + 2] as 0 | 1]);
      }
      points.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
      return { m: e.m, v: e.v, points };
    }),
  };
}

function push<T>(map: Map<string, T[]>, key: unknown, value: T) {
  const k = String(key);
  const list = map.get(k);
  if (list) list.push(value);
  else map.set(k, [value]);
}

function methodUncertainty(configuration: string, method: string): number {
  try {
    return getMethod(configuration, method).uncertainty.fraction;
  } catch (e) {
    if (e instanceof InputError) return NaN; // a method since removed from the catalogue
    throw e;
  }
}

export interface CompareQuery {
  output: string;
  page?: number;
  pageSize?: number;
  /** `yes`: only pairs whose value differs. */
  changed?: 'yes' | 'any';
}

/** Values differing by less than this (relative) count as unchanged: the last bits of a double. */
const SAME = 1e-12;

/**
 * Pairs the results of two runs by method and inputs (key order ignored) and compares
 * one output. Rows in run a's point and method order.
 */
export async function compareRuns(store: Store, aId: number, bId: number, q: CompareQuery): Promise<Comparison> {
  if (!NAME_PATTERN.test(q.output)) throw new InputError(`'${q.output}' is not an output name`);
  const [a, b] = await Promise.all([getRun(store, aId), getRun(store, bId)]);
  if (!a) throw new InputError(`no run ${aId} in this database`);
  if (!b) throw new InputError(`no run ${bId} in this database`);
  const page = Math.max(1, Math.floor(q.page ?? 1));
  const pageSize = Math.min(MAX_PAGE_SIZE, Math.max(1, Math.floor(q.pageSize ?? 50)));
  const key = (method: string, inputs: Inputs) => `${method}\u0000${canonical(inputs)}`;
  const bValues = new Map<string, number | null>();
  await eachOutput(store, b, q.output, (method, inputs, v) => {
    bValues.set(key(method, inputs), v);
  });
  const pairs: CompareRow[] = [];
  let changed = 0;
  let onlyA = 0;
  const matched = new Set<string>();
  await eachOutput(store, a, q.output, (method, inputs, av) => {
    const k = key(method, inputs);
    if (!bValues.has(k)) {
      onlyA++;
      return;
    }
    matched.add(k);
    const bv = bValues.get(k)!;
    const rel = av !== null && bv !== null && av !== 0 ? (bv - av) / Math.abs(av) : null;
    const differs = av === null || bv === null ? av !== bv : Math.abs(bv - av) > SAME * Math.max(Math.abs(av), Math.abs(bv));
    if (differs) changed++;
    if (q.changed === 'yes' && !differs) return;
    pairs.push({ method, inputs, a: av, b: bv, rel_diff: rel });
  });
  const onlyB = bValues.size - matched.size;
  return {
    a,
    b,
    output: q.output,
    total: pairs.length,
    changed,
    only_a: onlyA,
    only_b: onlyB,
    rows: pairs.slice((page - 1) * pageSize, page * pageSize),
  };
}

/** Each result's method, inputs and one output (null when missing or not a number), in point and method order. */
async function eachOutput(store: Store, run: RunInfo, output: string, fn: (method: string, inputs: Inputs, value: number | null) => void): Promise<void> {
  if (await hasRunTable(store, run.id)) {
    await eachStoredResult(store, run.id, run.methods.length, (r) => {
      const v = r.outputs[output];
      fn(run.methods[r.method].id, r.inputs, typeof v === 'number' ? v : null);
    });
    return;
  }
  const d = store.dialect;
  await d.each<{ method: string; inputs: string; v: unknown }>(
    `select r.method, ${d.jsonText('p.inputs')} as inputs, ${d.jsonNumber('r.outputs', output)} as v from results r
     join points p on p.run_id = r.run_id and p.idx = r.point_idx where r.run_id = ? order by r.point_idx, r.method_idx`,
    [run.id],
    (r) => fn(r.method, JSON.parse(r.inputs) as Inputs, typeof r.v === 'number' ? r.v : null),
  );
}

function canonical(value: Inputs): string {
  return JSON.stringify(Object.keys(value).sort().map((k) => [k, value[k]]));
}
