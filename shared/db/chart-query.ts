// The chart endpoint's data (GET /api/runs/:id/chart): x–y points per series, downsampled
// to a bounded size, and measured data overlaid with each method's deviation from it.
// Reads a run through the same Source helpers as the results table (results-query.ts).
import { getMethod } from '../physics/catalogue.js';
import { compileSolver } from '../physics/engine.js';
import { InputError, type Inputs } from '../physics/types.js';
import { entryLength, parseStudy, pointAt } from '../study/index.js';
import type { RunInfo } from './queries.js';
import { col, conditions, openSource, valueExpr, whereOf, type Expr, type RangeFilter } from './results-query.js';
import type { MeasurementRow } from './measurements.js';
import { getRunSource } from './runs.js';
import type { Store } from './store.js';

export const MAX_CHART_POINTS = 20_000;
export const MAX_SERIES = 100;

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

export interface ChartSeries {
  name: string;
  method: string;
  /** [x, y, flagged 0|1], sorted by x. */
  points: [number, number, 0 | 1][];
}

export interface ChartData {
  x: string;
  y: string;
  /** Results with both x and y, before downsampling. */
  total: number;
  downsampled: boolean;
  series: ChartSeries[];
  /** Stated uncertainty of each method, as a fraction. */
  uncertainty: Record<string, number>;
}

/**
 * x–y data per series. When more than `max` results qualify, each series is cut into
 * buckets along x (logarithmic when every x is positive, as the charts are log-log) and
 * each bucket keeps its lowest and highest y: the envelope survives, the payload stays
 * at most `max` points however large the run.
 */
export async function chartData(store: Store, runId: number, q: ChartQuery): Promise<ChartData> {
  const max = Math.min(MAX_CHART_POINTS, Math.max(10, Math.floor(q.max ?? 2000)));
  const src = await openSource(store, runId);
  const d = store.dialect;
  const cond = conditions(store, src, { methods: q.methods, filters: q.filters });
  const x = valueExpr(store, src, q.x);
  const y = valueExpr(store, src, q.y);
  const bySeries = q.series && q.series !== 'method' ? valueExpr(store, src, q.series) : undefined;
  const m = col(src, 'method');
  const f = col(src, 'flagged');
  const seriesSql = bySeries ? `${m} || '|' || ${d.labelText(bySeries.sql)}` : `${m}`;
  const baseParams = [...(bySeries?.params ?? []), ...x.params, ...y.params, ...cond.params, ...x.params, ...y.params];
  // Numbers only: a string or switch value cannot be plotted.
  const numeric = (e: Expr) => d.isNumber(e.sql);
  const base =
    `select ${seriesSql} as s, ${m} as m, ${x.sql} as x, ${y.sql} as y, ${f} as f from ${src.from}` +
    `${whereOf(cond)}${cond.sql.length ? ' and ' : ' where '}${numeric(x)} and ${numeric(y)}`;

  const seriesRows = await d.all<{ s: string; m: number; n: number; lo: number; hi: number }>(
    `with src as (${base}) select s, m, count(*) as n, min(x) as lo, max(x) as hi from src group by s, m order by m, s`,
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

  const uncertainty: Record<string, number> = {};
  const series: ChartSeries[] = seriesRows.map((s) => {
    const method = src.run.methods[s.m].id;
    uncertainty[method] ??= methodUncertainty(src.run.configuration, method);
    const value = bySeries ? String(s.s).slice(String(s.m).length + 1) : undefined;
    return { name: bySeries ? `${method}, ${q.series} = ${value}` : method, method, points: points.get(String(s.s)) ?? [] };
  });
  return { x: q.x, y: q.y, total, downsampled, series, uncertainty };
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

// Measured data on a run's chart, and how far each method lies from it: for every measured
// row the method is solved at that row's inputs (the study's fixed inputs, with the
// measured values in place of the swept ones), and the mean absolute relative deviation
// |predicted − measured| / |measured| is averaged over the rows where both exist.

export interface MeasuredOverlay {
  name: string;
  points: [number, number][];
  /** Per method; a method is absent when no measured row could be predicted. */
  mad: Record<string, number>;
}

export async function measuredOverlay(
  store: Store,
  run: RunInfo,
  measurement: { name: string; rows: MeasurementRow[] },
  x: string,
  y: string,
): Promise<MeasuredOverlay> {
  const points = measurement.rows
    .filter((r) => Number.isFinite(r.values[x]) && Number.isFinite(r.values[y]))
    .map((r) => [r.values[x], r.values[y]] as [number, number])
    .sort((a, b) => a[0] - b[0]);
  return { name: measurement.name, points, mad: await meanAbsoluteDeviation(store, run, measurement.rows, y) };
}

async function meanAbsoluteDeviation(store: Store, run: RunInfo, rows: MeasurementRow[], y: string): Promise<Record<string, number>> {
  const source = await getRunSource(store, run.id);
  if (!source) return {};
  const { study } = parseStudy(source.yaml, source.sourceFile ?? `run-${run.id}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) });
  const varying = Object.entries(study.sweep.over)
    .filter(([, entry]) => entryLength(entry) > 1)
    .map(([name]) => name);
  const base: Inputs = source.pointsTotal > 0 ? pointAt(study, 0) : { ...study.inputs };
  const solve = compileSolver({ configuration: study.configuration, methods: study.methods, fluid: study.fluid }, { strict: false });
  const sums = new Map<string, { sum: number; n: number }>();
  for (const row of rows) {
    const measured = row.values[y];
    if (!Number.isFinite(measured) || measured === 0) continue;
    // A row that does not give every swept input cannot be placed in the sweep.
    if (!varying.every((name) => Number.isFinite(row.values[name]))) continue;
    const inputs: Inputs = { ...base };
    for (const name of Object.keys(base)) if (Number.isFinite(row.values[name])) inputs[name] = row.values[name];
    let results;
    try {
      results = solve(inputs);
    } catch {
      continue; // inputs the engine cannot use (e.g. a fluid temperature out of range)
    }
    for (const r of results) {
      const predicted = r.outputs[y];
      if (!Number.isFinite(predicted)) continue;
      const s = sums.get(r.method) ?? { sum: 0, n: 0 };
      s.sum += Math.abs(predicted - measured) / Math.abs(measured);
      s.n += 1;
      sums.set(r.method, s);
    }
  }
  return Object.fromEntries([...sums].map(([m, s]) => [m, s.sum / s.n]));
}
