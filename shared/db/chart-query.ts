// The chart endpoint's data (GET /api/runs/:id/chart and /chart/axes): x–y points per
// series thinned to a bounded size, what each flagged point broke, the methods left out
// and why, facts about every input and output for the chart's controls, and measured
// data overlaid with each method's deviation from it. Reads a run through the same
// Source helpers as the results table (results-query.ts); the shapes are in
// shared/chart/types.ts.
import type { AxisFacts, ChartAxes, ChartData, ChartPoint, ChartSeries, FlagDetail, LeftOut, MeasuredOverlay, MeasuredRow, TargetFacts, UnreachedPoint } from '../chart/types.js';
import { describeFlag } from '../chart/flags.js';
import { highName, lowName, maxName, minName } from '../design/names.js';
import { getMethod } from '../physics/catalogue.js';
import { compileSolver } from '../physics/engine.js';
import { InputError, type Inputs, type MethodInfo } from '../physics/types.js';
import { entryLength, entryValues, parseStudy, pointAt, type Study } from '../study/index.js';
import { readingRun } from './legacy-results.js';
import type { MeasurementRow } from './measurements.js';
import type { RunInfo } from './queries.js';
import { eachStoredResult, hasRunTable } from './result-table.js';
import { col, conditions, openSource, valueExpr, type RangeFilter, type Source } from './results-query.js';
import { getRunSource } from './runs.js';
import type { Store } from './store.js';

export type { ChartData, ChartSeries, ChartAxes, MeasuredOverlay } from '../chart/types.js';

export const MAX_CHART_POINTS = 20_000;
export const MAX_SERIES = 100;
/**
 * A run of up to this many results (or 5 × max, if larger) is read whole; a larger one
 * through a fixed sample of about this size, looked up by key. Rows read are what a chart
 * request costs (a few µs each on SQLite, measured by `npm run bench -- web`); 10,000
 * still gives each of 2,000 drawn points five results to choose from.
 */
export const SAMPLE_ROWS = 10_000;
const MAX_MEASURED_ROWS = 20_000;
/** Unreached targets listed on a chart at most (each is a marker with its own tooltip). */
export const MAX_UNREACHED = 500;
/** Points whose outputs the axis facts are read from. */
const AXIS_SAMPLE_POINTS = 400;

export interface ChartQuery {
  x: string;
  y: string;
  /** `method` (default) or an input name: one series per method and value of that input. */
  series?: string;
  methods?: string[];
  flagged?: 'any' | 'yes' | 'no';
  filters?: RangeFilter[];
  /** Upper bound on the points returned over all series (default 2000). */
  max?: number;
}

interface Row {
  m: number;
  x: number;
  y: number;
  f: number;
  id: number;
  /** Point index. */
  p: number;
  v?: unknown;
  /** y's band, when the run stores one. */
  lo?: unknown;
  hi?: unknown;
}

/**
 * x–y data per series. When more than `max` results qualify, each series is cut into
 * buckets along x (logarithmic when every x is positive) and each bucket keeps its lowest
 * and highest y: the envelope survives and the payload stays at most `max` points. A run
 * with more than SAMPLE_ROWS qualifying results is thinned from a sample of whole points
 * (`sampled` says how many results), so the request costs the same on any run size.
 */
export async function chartData(store: Store, runId: number, q: ChartQuery, options: { sampleRows?: number } = {}): Promise<ChartData> {
  // Several statements: a run stored before run tables keeps its JSON rows until this is done (legacy-results.ts).
  return readingRun(store, runId, () => chartOf(store, runId, q, options));
}

async function chartOf(store: Store, runId: number, q: ChartQuery, options: { sampleRows?: number }): Promise<ChartData> {
  const max = Math.min(MAX_CHART_POINTS, Math.max(10, Math.floor(q.max ?? 2000)));
  const src = await openSource(store, runId);
  const d = store.dialect;
  const cond = conditions(store, src, { methods: q.methods, flagged: q.flagged, filters: q.filters });
  const x = valueExpr(store, src, q.x);
  const y = valueExpr(store, src, q.y);
  const seriesBy = q.series && q.series !== 'method' ? q.series : undefined;
  // The series may be text (a choice): any column of the name (a run table's numbers-only axes would drop it).
  const by = seriesBy ? valueExpr(store, src, seriesBy, false) : undefined;
  const m = col(src, 'method');
  // y's stored band (`<y>_low`, `<y>_high`) rides along with each row, so it survives thinning.
  const band = hasOutput(src, lowName(q.y)) && hasOutput(src, highName(q.y)) ? { lo: valueExpr(store, src, lowName(q.y)), hi: valueExpr(store, src, highName(q.y)) } : undefined;
  // Numbers only: a string or switch value cannot be plotted.
  const where = [...cond.sql, d.isNumber(x.sql), d.isNumber(y.sql)];
  const whereParams = [...cond.params, ...x.params, ...y.params];

  // 1. The rows. A run of up to sampleRows results is read whole. A larger one is read
  // through a fixed sample of about sampleRows results, looked up by key (no pass over the
  // run): the count of what qualifies is then estimated from the sample (`total_estimated`);
  // the results table counts exactly. When filters leave too little in the sample, the
  // qualifying rows are read in one pass: all of them when few (exact count), else a
  // hashed sample of the point index sized by the estimate.
  const methodIdx = q.methods?.length ? src.run.methods.map((_, i) => i).filter((i) => q.methods!.includes(src.run.methods[i].id)) : src.run.methods.map((_, i) => i);
  const sampleRows = Math.max(options.sampleRows ?? SAMPLE_ROWS, 5 * max);
  const select = (extra: string[], extraParams: unknown[] = []) =>
    d.all<Row>(
      `select ${m} as m, ${x.sql} as x, ${y.sql} as y, ${col(src, 'flagged')} as f, ${col(src, 'id')} as id, ${col(src, 'point')} as p${by ? `, ${by.sql} as v` : ''}${band ? `, ${band.lo.sql} as lo, ${band.hi.sql} as hi` : ''}
       from ${src.from} where ${[...where, ...extra].join(' and ')}`,
      [...x.params, ...y.params, ...(by?.params ?? []), ...(band ? [...band.lo.params, ...band.hi.params] : []), ...whereParams, ...extraParams],
    );
  const stored = src.run.results_count;
  let rows: Row[];
  let total: number;
  let estimated = false;
  let sampled: number | undefined;
  if (stored <= sampleRows) {
    rows = await select([]);
    total = rows.length;
  } else {
    // Keys spread evenly over the run (golden-ratio sequence): run-table rows by seq (point ×
    // methods + method), or whole points by index off the results table of a run stored
    // before run tables. Passed as one array parameter, not as ten thousand literals: the
    // statement stays short (parsing and planning the literal list took most of the 40 ms
    // of a 1,000,000-result run's chart).
    const perPoint = Math.max(1, src.run.methods.length);
    const keys = src.layout ? spread(src.run.points_total * perPoint, sampleRows, 0) : spread(src.run.points_total, Math.ceil(sampleRows / perPoint), 0);
    const looked = keys.length * (src.layout ? 1 : perPoint);
    const key = src.layout ? 'c.seq' : 'r.point_idx';
    const inSample =
      store.kind === 'sqlite'
        ? await select([`${key} in (select value from json_each(?))`], [JSON.stringify(keys)])
        : await select([`${key} = any(?::bigint[])`], [keys]);
    // A run table's keys cover every position of the run (stored or not): scale to all of them.
    const estimate = Math.round((inSample.length * (src.layout ? src.run.points_total * perPoint : stored)) / Math.max(1, looked));
    if (inSample.length >= sampleRows / 4) {
      [rows, total, estimated, sampled] = [inSample, estimate, true, inSample.length];
    } else if (estimate <= 2 * sampleRows) {
      rows = await select([]);
      total = rows.length;
    } else {
      const fraction = Math.min(1, sampleRows / estimate);
      rows = await select([`(${col(src, 'point')} * 2654435761) % 4294967296 < ${Math.ceil(fraction * 4294967296)}`]);
      [total, estimated, sampled] = [Math.round(rows.length / fraction), true, rows.length];
    }
  }

  // 3. Series: per method, and per value of the second input (sorted by value).
  const groups = new Map<string, { m: number; value: number | string | boolean | null; rows: Row[] }>();
  for (const r of rows) {
    r.m = Number(r.m);
    const value = by ? seriesValue(r.v) : null;
    const key = by ? `${r.m}\u0000${typeof value}\u0000${String(value)}` : String(r.m);
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { m: r.m, value, rows: [] }));
    g.rows.push(r);
  }
  if (groups.size > MAX_SERIES) {
    throw new InputError(
      `one series per value of '${seriesBy}' gives ${groups.size} series; at most ${MAX_SERIES} can be drawn: filter '${seriesBy}' to fewer values or plot it on x`,
    );
  }
  const ordered = [...groups.values()].sort((a, b) => a.m - b.m || compareValues(a.value, b.value));
  const downsampled = total > max;
  const buckets = Math.max(1, Math.floor(max / (2 * Math.max(1, ordered.length))));
  const picked = ordered.map((g) => (downsampled ? envelope(g.rows, buckets) : g.rows.sort((a, b) => a.x - b.x || a.y - b.y)));

  // 4. What each flagged point broke.
  const details = await flagDetails(store, src.run, picked.flat().filter((r) => Number(r.f) === 1).map((r) => Number(r.id)), Boolean(src.layout));
  const flagIndex = new Map<string, number>();
  const flag_details: FlagDetail[][] = [];
  const series: ChartSeries[] = ordered.map((g, k) => {
    const method = src.run.methods[g.m].id;
    const points = picked[k].map((r): ChartPoint => {
      if (Number(r.f) !== 1) return [Number(r.x), Number(r.y), 0];
      const detail = details.get(Number(r.id)) ?? [];
      const key = JSON.stringify(detail);
      let at = flagIndex.get(key);
      if (at === undefined) {
        at = flag_details.push(detail) - 1;
        flagIndex.set(key, at);
      }
      return [Number(r.x), Number(r.y), 1, at];
    });
    const extra: Pick<ChartSeries, 'point_index' | 'band'> = { point_index: picked[k].map((r) => Number(r.p)) };
    if (band) extra.band = picked[k].map((r) => [finiteOrNull(r.lo), finiteOrNull(r.hi)]);
    return by ? { name: `${method}, ${seriesBy} = ${String(g.value)}`, method, value: g.value, points, ...extra } : { name: method, method, points, ...extra };
  });

  const uncertainty: Record<string, number> = {};
  for (const i of methodIdx) uncertainty[src.run.methods[i].id] = methodUncertainty(src.run.configuration, src.run.methods[i].id);
  // A method with no row here has none at all, unless the rows were a sample: then ask.
  const drawn = new Set(ordered.map((g) => g.m));
  const absent: number[] = [];
  for (const i of methodIdx) {
    if (drawn.has(i)) continue;
    if (sampled !== undefined && (await d.all(`select 1 from ${src.from} where ${[...where, `${m} = ${i}`].join(' and ')} limit 1`, whereParams)).length) continue;
    absent.push(i);
  }
  const filtered = Boolean(q.filters?.length || q.flagged === 'yes' || q.flagged === 'no');
  const left_out = absent.map((i) => leftOut(src.run, src.run.methods[i].id, q.x, q.y, filtered));
  const out: ChartData = { x: q.x, y: q.y, total, downsampled, series_by: seriesBy ?? 'method', series, uncertainty, flag_details, left_out };
  if (sampled !== undefined) out.sampled = sampled;
  if (estimated) out.total_estimated = true;
  if (band) out.band_of = q.y;
  const unreached = await unreachedTargets(store, src, cond, q.x, seriesBy);
  if (unreached) Object.assign(out, unreached);
  return out;
}

const finiteOrNull = (v: unknown): number | null => (v === null || v === undefined || v === '' || !Number.isFinite(Number(v)) ? null : Number(v));

function hasOutput(src: Source, name: string): boolean {
  return src.columns.outputs.includes(name);
}

/**
 * The results of a target run whose target was not reached: they carry no solved input,
 * only the range of the target's output over the search interval (`<output>_min` and
 * `<output>_max`, shared/design/names.ts), which no other row has. Listed with their x
 * (null where x is a group the row does not have), under the chart's own filters.
 */
async function unreachedTargets(
  store: Store,
  src: Source,
  cond: ReturnType<typeof conditions>,
  xName: string,
  seriesBy: string | undefined,
): Promise<Pick<ChartData, 'unreached' | 'unreached_total'> | undefined> {
  const output = src.columns.outputs.find((n) => n.endsWith('_min') && hasOutput(src, maxName(n.slice(0, -4))))?.slice(0, -4);
  if (output === undefined) return undefined;
  const d = store.dialect;
  const min = valueExpr(store, src, minName(output));
  const max = valueExpr(store, src, maxName(output));
  const x = valueExpr(store, src, xName);
  const by = seriesBy ? valueExpr(store, src, seriesBy) : undefined;
  const rows = await d.all<{ m: number; x: unknown; p: number; lo: unknown; hi: unknown; v?: unknown }>(
    `select ${col(src, 'method')} as m, ${x.sql} as x, ${col(src, 'point')} as p, ${min.sql} as lo, ${max.sql} as hi${by ? `, ${by.sql} as v` : ''}
     from ${src.from} where ${[...cond.sql, d.isNumber(min.sql)].join(' and ')} order by ${col(src, 'seq')} limit ${MAX_UNREACHED + 1}`,
    [...x.params, ...min.params, ...max.params, ...(by?.params ?? []), ...cond.params, ...min.params],
  );
  const unreached: UnreachedPoint[] = rows.slice(0, MAX_UNREACHED).map((r) => ({
    method: src.run.methods[Number(r.m)].id,
    ...(by ? { value: seriesValue(r.v) } : {}),
    x: finiteOrNull(r.x),
    point: Number(r.p),
    min: finiteOrNull(r.lo),
    max: finiteOrNull(r.hi),
  }));
  const out: Pick<ChartData, 'unreached' | 'unreached_total'> = { unreached };
  // Counted only when they all fit; a longer list says "more than MAX_UNREACHED" by omitting the total.
  if (rows.length <= MAX_UNREACHED) out.unreached_total = rows.length;
  return out;
}

function seriesValue(v: unknown): number | string | boolean | null {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  return String(v);
}

/** Numbers by value (so 10 after 2), then text, then missing. */
function compareValues(a: unknown, b: unknown): number {
  const rank = (v: unknown) => (typeof v === 'number' ? 0 : v === null ? 2 : 1);
  if (rank(a) !== rank(b)) return rank(a) - rank(b);
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  return String(a).localeCompare(String(b));
}

/** Per bucket along x, the rows with the lowest and highest y (each once), sorted by x. */
function envelope(rows: Row[], buckets: number): Row[] {
  if (rows.length === 0) return rows;
  let lo = Infinity;
  let hi = -Infinity;
  for (const r of rows) {
    r.x = Number(r.x);
    r.y = Number(r.y);
    if (r.x < lo) lo = r.x;
    if (r.x > hi) hi = r.x;
  }
  const log = lo > 0;
  const [a, b] = log ? [Math.log(lo), Math.log(hi)] : [lo, hi];
  const low = new Map<number, Row>();
  const high = new Map<number, Row>();
  for (const r of rows) {
    const pos = b === a ? 0 : ((log ? Math.log(r.x) : r.x) - a) / (b - a);
    const k = Math.min(buckets - 1, Math.floor(pos * buckets));
    const l = low.get(k);
    if (!l || r.y < l.y || (r.y === l.y && r.x < l.x)) low.set(k, r);
    const h = high.get(k);
    if (!h || r.y > h.y || (r.y === h.y && r.x < h.x)) high.set(k, r);
  }
  return [...new Set([...low.values(), ...high.values()])].sort((p, q) => p.x - q.x || p.y - q.y);
}

/**
 * For result ids (a run table's seq, else results.id), the meaning of each flag there
 * (`out-of-range:Re` → Re's value and range).
 */
async function flagDetails(store: Store, run: RunInfo, ids: number[], table: boolean): Promise<Map<number, FlagDetail[]>> {
  const out = new Map<number, FlagDetail[]>();
  const d = store.dialect;
  if (table) {
    await eachStoredResult(
      store,
      run.id,
      run.methods.length,
      (r) => {
        const ranges = catalogueMethod(run.configuration, run.methods[r.method].id)?.ranges;
        out.set(r.seq, r.flags.map((f) => describeFlag(f, { ...r.inputs, ...r.outputs }, ranges)));
      },
      { seqs: ids },
    );
    return out;
  }
  for (let k = 0; k < ids.length; k += 1000) {
    const chunk = ids.slice(k, k + 1000);
    const rows = await d.all<{ id: number; method: string; flags: string; inputs: string; outputs: string }>(
      `select r.id, r.method, r.flags, ${d.jsonText('p.inputs')} as inputs, ${d.jsonText('r.outputs')} as outputs
       from results r join points p on p.run_id = r.run_id and p.idx = r.point_idx where r.id in (${chunk.map(() => '?').join(', ')})`,
      chunk,
    );
    for (const r of rows) {
      const values = { ...(JSON.parse(r.inputs) as Record<string, unknown>), ...(JSON.parse(r.outputs) as Record<string, unknown>) };
      const ranges = catalogueMethod(run.configuration, r.method)?.ranges;
      out.set(Number(r.id), (JSON.parse(r.flags) as string[]).map((f) => describeFlag(f, values, ranges)));
    }
  }
  return out;
}

function catalogueMethod(configuration: string, method: string): MethodInfo | undefined {
  try {
    return getMethod(configuration, method);
  } catch (e) {
    if (e instanceof InputError) return undefined; // a method since removed from the catalogue
    throw e;
  }
}

function methodUncertainty(configuration: string, method: string): number {
  return catalogueMethod(configuration, method)?.uncertainty.fraction ?? NaN;
}

/** Why a method of the run has no point on the chart. */
function leftOut(run: RunInfo, method: string, x: string, y: string, filtered: boolean): LeftOut {
  const info = catalogueMethod(run.configuration, method);
  const outputs = info?.outputs.map((o) => o.name) ?? [];
  const local = outputs.filter((n) => n.endsWith('_x'));
  // Averages a local method does not give (h and q follow from Nu in the engine).
  const averages = [y, x].filter((n) => ['Nu', 'h', 'q', 'heat_rate'].includes(n) && !outputs.includes(n));
  if (local.length && averages.length) {
    const instead = local.includes(`${averages[0]}_x`) ? `${averages[0]}_x` : local.includes('Nu_x') ? 'Nu_x' : local[0];
    return {
      method,
      local,
      reason: `gives local values at x = L (${local.join(', ')}), not the average ${averages.join(' or ')}: plot ${instead} to see it`,
    };
  }
  return { method, reason: `has no result with a number for both ${x} and ${y}${filtered ? ' under these filters' : ''}` };
}

// ---------------------------------------------------------------------------- axis facts

/**
 * Facts about every input and output of a run, for the chart's axis and series choices:
 * inputs from the stored study file (exact: swept or fixed, their values), outputs from a
 * deterministic sample of AXIS_SAMPLE_POINTS points (all their results), read by index.
 */
export async function chartAxes(store: Store, runId: number): Promise<ChartAxes> {
  return readingRun(store, runId, () => axesOf(store, runId));
}

async function axesOf(store: Store, runId: number): Promise<ChartAxes> {
  const src = await openSource(store, runId);
  const d = store.dialect;
  const study = await storedStudy(store, runId);
  // A running run has written (about) its first points_done points: sample those.
  const running = src.run.status === 'running' || src.run.status === 'queued';
  const points = pointSample(running ? Math.min(src.run.points_total, src.run.points_done) : src.run.points_total, AXIS_SAMPLE_POINTS);
  const seen = new Map<string, { role: 'input' | 'output'; values: Set<number>; min: number; max: number; overflow: boolean }>();
  const note = (name: string, role: 'input' | 'output', v: unknown) => {
    let s = seen.get(name);
    if (!s) seen.set(name, (s = { role, values: new Set(), min: Infinity, max: -Infinity, overflow: false }));
    if (typeof v !== 'number' || !Number.isFinite(v)) return;
    if (v < s.min) s.min = v;
    if (v > s.max) s.max = v;
    if (s.values.size < 1000) s.values.add(v);
    else s.overflow = true;
  };
  let sampledPoints = 0;
  if (points.length && (await hasRunTable(store, runId))) {
    const M = src.run.methods.length;
    const pointsSeen = new Set<number>();
    await eachStoredResult(
      store,
      runId,
      M,
      (r) => {
        pointsSeen.add(r.point);
        for (const [k, v] of Object.entries(r.outputs)) note(k, 'output', v);
        for (const [k, v] of Object.entries(r.inputs)) if (!src.columns.outputs.includes(k)) note(k, 'input', v);
      },
      { seqs: points.flatMap((p) => Array.from({ length: M }, (_, m) => p * M + m)) },
    );
    sampledPoints = pointsSeen.size;
  } else if (points.length) {
    const rows = await d.all<{ point_idx: number; inputs: string; outputs: string }>(
      `select r.point_idx, ${d.jsonText('p.inputs')} as inputs, ${d.jsonText('r.outputs')} as outputs
       from results r join points p on p.run_id = r.run_id and p.idx = r.point_idx
       where r.run_id = ? and r.point_idx in (${points.map(() => '?').join(', ')})`,
      [runId, ...points],
    );
    sampledPoints = new Set(rows.map((r) => r.point_idx)).size;
    for (const r of rows) {
      for (const [k, v] of Object.entries(JSON.parse(r.outputs) as Record<string, unknown>)) note(k, 'output', v);
      for (const [k, v] of Object.entries(JSON.parse(r.inputs) as Record<string, unknown>)) if (!src.columns.outputs.includes(k)) note(k, 'input', v);
    }
  }
  const facts = (name: string, role: 'input' | 'output'): AxisFacts => {
    const fromStudy = role === 'input' ? studyFacts(study, name) : undefined;
    if (fromStudy) return fromStudy;
    const s = seen.get(name);
    const values = s ? [...s.values].sort((a, b) => a - b) : [];
    return {
      name,
      role,
      swept: false,
      distinct: s?.overflow ? 1000 : values.length,
      min: values.length ? s!.min : null,
      max: values.length ? s!.max : null,
      ...(values.length <= 24 ? { values } : {}),
    };
  };
  // A name the study gives (swept or fixed) is an input even where the engine echoes it
  // among the outputs (velocity); the queries read the same value either way.
  const given = (n: string) => Boolean(study && (n in study.sweep.over || n in study.inputs));
  const inputs = src.columns.inputs.filter((n) => given(n) || !src.columns.outputs.includes(n));
  const outputs = src.columns.outputs.filter((n) => !inputs.includes(n));
  const out: ChartAxes = { names: [...inputs.map((n) => facts(n, 'input')), ...outputs.map((n) => facts(n, 'output'))], sampled_points: sampledPoints };
  const target = targetFacts(study);
  if (target) out.target = target;
  return out;
}

/** A study's target block, SI (undefined: none, or a file this version cannot read). */
export function targetFacts(study: Study | undefined): TargetFacts | undefined {
  const t = study?.design?.target;
  return t && { output: t.output, value: t.value, adjust: t.adjust, within: [t.within[0], t.within[1]] };
}

/** The study a run was made from, as this version reads it (undefined: not stored, or unreadable). */
export async function storedStudy(store: Store, runId: number): Promise<Study | undefined> {
  const source = await getRunSource(store, runId);
  if (!source) return undefined;
  try {
    return parseStudy(source.yaml, source.sourceFile ?? `run-${runId}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) }).study;
  } catch {
    return undefined; // a pushed run whose file this version cannot read: the sample answers
  }
}

function studyFacts(study: Study | undefined, name: string): AxisFacts | undefined {
  if (!study) return undefined;
  const entry = study.sweep.over[name];
  let values: number[];
  let distinct: number;
  if (entry) {
    if (study.sweep.design === 'latin-hypercube') {
      // Sampled designs draw a new value per point.
      distinct = Math.min(1000, study.sweep.samples ?? entryLength(entry));
      values = entry.kind === 'list' ? numbers(entry.values) : [entry.from, entry.to];
    } else {
      distinct = Math.min(1000, entryLength(entry));
      values = distinct <= 1000 ? numbers(entryValues(entry)) : entry.kind === 'list' ? numbers(entry.values) : [entry.from, entry.to];
    }
  } else if (name in study.inputs) {
    values = numbers([study.inputs[name]]);
    distinct = values.length;
  } else return undefined;
  values = [...new Set(values)].sort((a, b) => a - b);
  const labels = entry?.kind === 'list' ? [...new Set(entry.values.filter((v) => typeof v === 'string' || typeof v === 'boolean').map(String))] : [];
  return {
    name,
    role: 'input',
    swept: Boolean(entry) && distinct > 1,
    distinct,
    min: values.length ? values[0] : null,
    max: values.length ? values[values.length - 1] : null,
    ...(values.length <= 24 && distinct <= 24 ? { values } : {}),
    ...(labels.length ? { labels } : {}),
  };
}

const numbers = (vs: unknown[]) => vs.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));

/** Up to n point indexes spread over 0 … total − 1 (golden-ratio sequence, plus both ends). */
export function pointSample(total: number, n: number): number[] {
  return spread(total, n, 0);
}

/**
 * Up to n distinct integers spread over first … first + total − 1: both ends and the
 * golden-ratio sequence between, which never lines up with the period of a grid sweep.
 */
export function spread(total: number, n: number, first: number): number[] {
  if (total <= n) return Array.from({ length: Math.max(0, total) }, (_, i) => first + i);
  const golden = (Math.sqrt(5) - 1) / 2;
  const picked = new Set<number>([first, first + total - 1]);
  for (let k = 1; picked.size < n; k++) picked.add(first + Math.floor(((k * golden) % 1) * total));
  return [...picked].sort((a, b) => a - b);
}

// ---------------------------------------------------------------------------- measured data

// Measured data on a run's chart, and how far each method lies from it: for every measured
// row the method is solved at that row's inputs (the study's fixed inputs, with the
// measured values in place of the swept ones); the deviation (predicted − measured) /
// measured is averaged signed (bias) and absolute (mean absolute deviation) over the rows
// a method predicts.

export async function measuredOverlay(
  store: Store,
  run: RunInfo,
  measurement: { name: string; rows: MeasurementRow[] },
  x: string,
  y: string,
  seriesBy?: string,
): Promise<MeasuredOverlay> {
  const source = await getRunSource(store, run.id);
  const study = source && parseStudy(source.yaml, source.sourceFile ?? `run-${run.id}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) }).study;
  const varying = study ? Object.entries(study.sweep.over).filter(([, entry]) => entryLength(entry) > 1).map(([name]) => name) : [];
  const base: Inputs = !study ? {} : source!.pointsTotal > 0 ? pointAt(study, 0) : { ...study.inputs };
  const solve = study ? compileSolver({ configuration: study.configuration, methods: study.methods, fluid: study.fluid }, { strict: false }) : undefined;

  const sums = new Map<string, { dev: number; abs: number; n: number }>();
  const rows: MeasuredRow[] = [];
  const points: { x: number; y: number; v: number | null }[] = [];
  let unplaced = 0;
  for (const row of measurement.rows) {
    const measured = row.values[y];
    if (!Number.isFinite(measured)) continue;
    const own = Number.isFinite(row.values[x]) ? row.values[x] : null;
    const predicted: Record<string, number> = {};
    const deviation: Record<string, number> = {};
    let derivedX: number | null = null;
    let derivedV: number | null = null;
    // A row that does not give every swept input cannot be placed in the sweep.
    const placeable = solve && varying.every((name) => Number.isFinite(row.values[name]));
    let results: ReturnType<NonNullable<typeof solve>> | undefined;
    if (placeable) {
      const inputs: Inputs = { ...base };
      for (const name of Object.keys(base)) if (Number.isFinite(row.values[name])) inputs[name] = row.values[name];
      try {
        results = solve(inputs);
      } catch {
        results = undefined; // inputs the engine cannot use (e.g. a fluid temperature out of range)
      }
    }
    for (const r of results ?? []) {
      const xr = r.outputs[x] ?? r.inputs[x];
      if (derivedX === null && typeof xr === 'number' && Number.isFinite(xr)) derivedX = xr;
      const vr = seriesBy ? (r.outputs[seriesBy] ?? r.inputs[seriesBy]) : undefined;
      if (derivedV === null && typeof vr === 'number' && Number.isFinite(vr)) derivedV = vr;
      const p = r.outputs[y];
      if (!Number.isFinite(p)) continue;
      predicted[r.method] = p;
      if (measured === 0) continue;
      const dev = (p - measured) / measured;
      deviation[r.method] = dev;
      const s = sums.get(r.method) ?? { dev: 0, abs: 0, n: 0 };
      s.dev += dev;
      s.abs += Math.abs(dev);
      s.n += 1;
      sums.set(r.method, s);
    }
    if (!results?.length) unplaced++;
    const at = own ?? derivedX;
    const value = seriesBy && Number.isFinite(row.values[seriesBy]) ? row.values[seriesBy] : derivedV;
    if (at !== null) points.push({ x: at, y: measured, v: value });
    if (rows.length < MAX_MEASURED_ROWS) rows.push({ x: at, measured, predicted, deviation });
  }
  points.sort((a, b) => a.x - b.x);
  const mad: Record<string, number> = {};
  const bias: Record<string, number> = {};
  for (const [method, s] of sums) {
    mad[method] = s.abs / s.n;
    bias[method] = s.dev / s.n;
  }
  const out: MeasuredOverlay = { name: measurement.name, points: points.map((p) => [p.x, p.y]), mad, bias, rows, unplaced };
  if (seriesBy) out.values = points.map((p) => p.v);
  return out;
}
