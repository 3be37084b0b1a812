// Turns the API's chart data into an ECharts option. Colour says the method; a second
// input is told by line style and marker (its values in a legend of their own, sorted by
// value) or split into small multiples (one panel per value, shared axes). Axis titles,
// tooltips and legend labels carry units (the user's °C or K); flagged points are hollow
// diamonds whose tooltip says which range was broken; an optional ±uncertainty band;
// measured points on top; log axes with labels between decades; a crosshair on both
// axes. Exports add a title, subtitle and the caution, and keep the band and the
// measured data in the legend. Every user-controlled string that reaches the tooltip
// (HTML) goes through escapeHtml. Runs with stored bands (`<y>_low`, `<y>_high`) draw them
// per method instead of the ±fraction; a target run marks the x where a method did not
// reach the target with a dashed rule whose tooltip gives what was reachable. Every
// drawn point carries its point index, so a click opens the point view.
import type { EChartsCoreOption } from 'echarts/core';
import type { TargetFacts, UnreachedPoint } from '../../../shared/chart/types.js';
import type { ChartData, ChartSeries, FlagDetail } from '../api/types.js';
import type { SeriesLayout } from './chart-defaults.js';
import { escapeHtml } from './escape-html.js';
import { flagText } from './flag-text.js';
import { formatNumber } from './format.js';
import { isDecade, logTicks } from './log-axis.js';
import { formatQuantity, labelWithUnit, type Quantities, type Quantity } from './units.js';

import { FONT_SANS, MEASURED_COLOUR as THEME_MEASURED_COLOUR, PALETTE, SERIES_COLOURS as THEME_SERIES_COLOURS } from './theme.js';

/** Filmsweep's series colours and the measured data's (the palette lives in theme.ts). */
export const SERIES_COLOURS = THEME_SERIES_COLOURS;
export const MEASURED_COLOUR = THEME_MEASURED_COLOUR;
/** Neutral ink for legend keys that stand for no one method (line styles, flags). */
export const KEY_COLOUR = PALETTE['ink-600'];
export const GRID_COLOUR = '#e3e6ea';
export const MINOR_GRID_COLOUR = '#f1f3f5';
/** The chart's font, the app's own (shipped with it). */
export const CHART_FONT = FONT_SANS;

/** Markers and dash patterns for the values of a second input, in value order. */
export const VALUE_SYMBOLS = ['circle', 'rect', 'triangle', 'diamond', 'roundRect', 'pin', 'arrow', 'emptyCircle'] as const;
export const VALUE_DASHES: (string | number[])[] = ['solid', 'dashed', 'dotted', [10, 3, 2, 3], [14, 4], [2, 5], [10, 3, 2, 3, 2, 3], [5, 2]];

/** Points of one unjoined series above which it is drawn as a single path (large mode). */
export const LARGE_SERIES_POINTS = 600;

/** `bandMethod` for the stored bands of every method at once. */
export const EVERY_METHOD = '*';
/** Colour of the rules that mark where a target was not reached (the hot side's ember). */
export const NOT_REACHED_COLOUR = PALETTE['ember-500'];

export interface ChartLook {
  xLog: boolean;
  yLog: boolean;
  /**
   * Draw this method's band, or every method's (EVERY_METHOD), or none: the stored 95 %
   * band where the data has one for y (`band_of`), else the ±fraction of `uncertainty`.
   */
  bandMethod: string | null;
  /** The run's target (chart axes), for the words of the not-reached rules. */
  target?: TargetFacts;
  /** Units and display conversions of the run's names. */
  quantities: Quantities;
  /** Series by a second input: line styles (default) or one panel per value. */
  layout?: SeriesLayout;
  /** Export only: title, subtitle and a footer line (the caution). */
  title?: { text: string; subtext: string; footer: string };
}

/** [x, y, flagged, flag detail index, index in the API's series (for point_index and band)]. */
type Pt = [number, number, number, number | undefined, number];

const finite = (p: readonly (number | undefined)[]) => Number.isFinite(p[0]) && Number.isFinite(p[1]);
const usable = (look: Pick<ChartLook, 'xLog' | 'yLog'>) => (p: readonly (number | undefined)[]) => finite(p) && (!look.xLog || p[0]! > 0) && (!look.yLog || p[1]! > 0);

/** The chart's points in display units (°C or K), in the same shapes. */
export function displayPoints(data: ChartData, quantities: Quantities) {
  const qx = quantities(data.x);
  const qy = quantities(data.y);
  return {
    series: data.series.map((s) => ({ ...s, points: s.points.map((p, j) => [qx.toDisplay(p[0]), qy.toDisplay(p[1]), p[2], p[3], j] as Pt) })),
    measured: data.measured?.points.map(([x, y]) => [qx.toDisplay(x), qy.toDisplay(y)] as [number, number]) ?? [],
  };
}

/** Points a log axis cannot show (zero or negative in the units shown), counted so the view can say so. */
export function hiddenOnLogAxes(data: ChartData, look: Pick<ChartLook, 'xLog' | 'yLog' | 'quantities'>): number {
  const ok = usable(look);
  const shown = displayPoints(data, look.quantities);
  let n = 0;
  for (const s of shown.series) for (const p of s.points) if (finite(p) && !ok(p)) n++;
  for (const p of shown.measured) if (finite(p) && !ok(p)) n++;
  return n;
}

/** Log axes by default where every value shown is positive and they span a decade or more. */
export function autoLog(data: ChartData, quantities: Quantities): { x: boolean; y: boolean } {
  const shown = displayPoints(data, quantities);
  const all = [...shown.series.flatMap((s) => s.points), ...shown.measured];
  const wide = (k: 0 | 1) => {
    const v = all.map((p) => p[k]).filter(Number.isFinite);
    if (!v.length) return false;
    const lo = Math.min(...v);
    const hi = Math.max(...v);
    return lo > 0 && hi / lo >= 10;
  };
  return { x: wide(0), y: wide(1) };
}

/** `gnielinski`, or `gnielinski, Pr = 0.7` with the value in display units. */
export function seriesLabel(s: Pick<ChartSeries, 'method' | 'value'>, by: string | null, quantities: Quantities): string {
  return by ? `${s.method}, ${valueLabel(by, s.value, quantities)}` : s.method;
}

export function valueLabel(by: string, value: ChartSeries['value'], quantities: Quantities): string {
  if (typeof value === 'number') return `${by} = ${formatQuantity(quantities(by), value)}`;
  return `${by} = ${value === null || value === undefined ? 'none' : String(value)}`;
}

interface Frame {
  left: string | number;
  right: string | number;
  top: string | number;
  bottom: string | number;
}

export function buildChartOption(data: ChartData, look: ChartLook): EChartsCoreOption {
  const q = look.quantities;
  const qx = q(data.x);
  const qy = q(data.y);
  const ok = usable(look);
  const by = data.series_by && data.series_by !== 'method' ? data.series_by : null;
  const shown = displayPoints(data, q);
  const methods = [...new Set(data.series.map((s) => s.method))];
  const colourOf = (method: string) => SERIES_COLOURS[methods.indexOf(method) % SERIES_COLOURS.length];
  const values = by ? sortedValues(data.series.map((s) => s.value)) : [];
  const valueIndex = (v: ChartSeries['value']) => values.findIndex((x) => x === v);
  const panels = by && look.layout === 'panels' && values.length > 1;
  const panelCount = panels ? values.length : 1;

  const series: Record<string, unknown>[] = [];
  const legendData: (string | { name: string; icon?: string })[] = [];
  let anyFlagged = false;

  shown.series.forEach((s, i) => {
    const colour = colourOf(s.method);
    const k = by ? valueIndex(s.value) : 0;
    const styled = by && !panels;
    const axis = panels ? { xAxisIndex: k, yAxisIndex: k } : {};
    const pts = s.points.filter(ok).sort((a, b) => a[0] - b[0]);
    // Several points at one x (another input varies within the series): a joining line
    // would zigzag between them and suggest a curve that is not there.
    const joined = pts.every((p, j) => j === 0 || p[0] !== pts[j - 1][0]);
    const name = seriesLabel(data.series[i], by, q);
    const symbol = styled ? VALUE_SYMBOLS[k % VALUE_SYMBOLS.length] : 'circle';
    const source = data.series[i];
    const pointOf = (j: number) => source.point_index?.[j];
    // Where this series' method did not reach the target, its line breaks (no value there).
    const gaps = (data.unreached ?? [])
      .filter((u) => u.method === s.method && u.x !== null && (!by || u.value === s.value))
      .map((u) => qx.toDisplay(u.x!))
      .filter((x) => (!look.xLog || x > 0) && pts.length > 0 && x > pts[0][0] && x < pts[pts.length - 1][0]);
    const stored = data.band_of === data.y && source.band ? source.band : undefined;
    const bandOf = (j: number) => {
      const b = stored?.[j];
      return b && b[0] !== null && b[1] !== null ? { band: [b[0], b[1]] } : {};
    };
    const items: Record<string, unknown>[] = pts.map(([x, y, flagged, detail, j]) => {
      const point = pointOf(j);
      if (!flagged) return { value: [x, y], point, ...bandOf(j) };
      anyFlagged = true;
      return { value: [x, y], point, ...bandOf(j), flagged: 1, detail, symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: colour, borderWidth: 2 } };
    });
    if (joined) for (const x of gaps) items.push({ value: [x, '-'] });
    items.sort((a, b) => (a.value as number[])[0] - (b.value as number[])[0]);
    // A cloud of points (no joining line) past LARGE_SERIES_POINTS is drawn as one path
    // (ECharts' large mode): a thousand SVG elements cost the page a third of a second.
    // Large mode draws every point alike, so its flagged points (hollow diamonds) go on
    // top in a series of the same name, which the legend shows and hides with it.
    const large = !joined && items.length > LARGE_SERIES_POINTS;
    const common = {
      name,
      color: colour,
      symbol,
      symbolSize: joined ? 6 : 7,
      cursor: 'pointer',
      ...axis,
    };
    series.push({
      ...common,
      type: joined ? 'line' : 'scatter',
      showSymbol: true,
      lineStyle: { width: 1.6, type: styled ? VALUE_DASHES[k % VALUE_DASHES.length] : 'solid' },
      ...(large ? { large: true, largeThreshold: LARGE_SERIES_POINTS } : { emphasis: { focus: 'series' } }),
      data: large ? items.filter((item) => !item.flagged) : items,
    });
    if (large && items.some((item) => item.flagged)) {
      series.push({ ...common, type: 'scatter', emphasis: { focus: 'series' }, data: items.filter((item) => item.flagged) });
    }
    if (!by) legendData.push(name);
    const wanted = look.bandMethod === EVERY_METHOD || s.method === look.bandMethod;
    if (wanted && joined && pts.length > 1) {
      const stack = `band-${i}`;
      const common = { type: 'line', name: '', stack, color: colour, symbol: 'none', silent: true, lineStyle: { opacity: 0 }, ...axis };
      if (stored) {
        // The stored 2.5 % and 97.5 % points, drawn as low plus a stacked (high − low).
        const edges = pts
          .map(([x, , , , j]) => [x, stored[j]?.[0], stored[j]?.[1]] as const)
          .filter((e): e is readonly [number, number, number] => e[1] !== null && e[1] !== undefined && e[2] !== null && e[2] !== undefined)
          .map(([x, lo, hi]) => [x, qy.toDisplay(lo), qy.toDisplay(hi)] as const)
          .filter(([, lo, hi]) => hi >= lo && (!look.yLog || lo > 0));
        if (edges.length > 1) {
          const label = storedBandName(look.bandMethod === EVERY_METHOD ? null : s.method);
          series.push({ ...common, name: label, data: edges.map(([x, lo]) => [x, lo]) });
          series.push({ ...common, name: label, areaStyle: { opacity: look.bandMethod === EVERY_METHOD ? 0.12 : 0.18, color: colour }, data: edges.map(([x, lo, hi]) => [x, hi - lo]) });
        }
      } else if (data.band_of !== data.y) {
        const fraction = data.uncertainty[s.method];
        if (fraction !== undefined && fraction > 0) {
          const label = look.bandMethod === EVERY_METHOD ? EVERY_FRACTION_BAND : bandName(s.method, fraction);
          series.push({ ...common, name: label, data: pts.map(([x, y]) => [x, y * (1 - fraction)]) });
          series.push({ ...common, name: label, areaStyle: { opacity: 0.16, color: colour }, data: pts.map(([x, y]) => [x, 2 * y * fraction]) });
        }
      }
    }
  });

  // Legend keys with no data of their own: one per method (colour) and one per value of
  // the second input (marker and dash), so the legend stays short and sorted by value.
  if (by) {
    for (const m of methods) {
      series.push({ type: 'line', name: m, color: colourOf(m), symbol: 'none', lineStyle: { width: 3 }, data: [] });
      legendData.push(m);
    }
    if (!panels) {
      values.forEach((v, k) => {
        const name = valueLabel(by, v, q);
        series.push({ type: 'line', name, color: KEY_COLOUR, symbol: VALUE_SYMBOLS[k % VALUE_SYMBOLS.length], symbolSize: 7, lineStyle: { width: 1.6, type: VALUE_DASHES[k % VALUE_DASHES.length] }, data: [] });
        legendData.push(name);
      });
    }
  }
  if (look.bandMethod && series.some((s) => s.stack)) {
    const every = look.bandMethod === EVERY_METHOD;
    const stored = data.band_of === data.y;
    const name = stored ? storedBandName(every ? null : look.bandMethod) : every ? EVERY_FRACTION_BAND : bandName(look.bandMethod, data.uncertainty[look.bandMethod]);
    const colour = every ? KEY_COLOUR : colourOf(look.bandMethod);
    series.push({ type: 'line', name, color: colour, symbol: 'none', lineStyle: { opacity: 0 }, areaStyle: { opacity: 0.16 }, data: [] });
    legendData.push({ name, icon: 'rect' });
  }
  // Where a method did not reach the target: a dashed rule at that x (one per x and panel),
  // whose tooltip lists the methods and what they could reach.
  const unreached = (data.unreached ?? []).filter((u) => u.x !== null && (!look.xLog || qx.toDisplay(u.x) > 0));
  if (unreached.length) {
    const groups = new Map<string, { x: number; panel: number; points: UnreachedPoint[] }>();
    for (const u of unreached) {
      const panel = panels ? Math.max(0, valueIndex(u.value ?? null)) : 0;
      const x = qx.toDisplay(u.x!);
      const key = `${panel}:${x}`;
      const g = groups.get(key) ?? { x, panel, points: [] };
      g.points.push(u);
      groups.set(key, g);
    }
    const perPanel = new Map<number, { x: number; points: UnreachedPoint[] }[]>();
    for (const g of groups.values()) perPanel.set(g.panel, [...(perPanel.get(g.panel) ?? []), g]);
    for (const [panel, list] of perPanel) {
      series.push({
        type: 'line',
        name: NOT_REACHED,
        color: NOT_REACHED_COLOUR,
        data: [],
        ...(panels ? { xAxisIndex: panel, yAxisIndex: panel } : {}),
        markLine: {
          symbol: 'none',
          silent: false,
          animation: false,
          // Mark lines round their value to `precision` places (default 2), also where they are drawn.
          precision: 15,
          label: { show: false },
          lineStyle: { type: 'dashed', color: NOT_REACHED_COLOUR, width: 1.4 },
          emphasis: { lineStyle: { width: 2.4 } },
          data: list.map((g) => ({ xAxis: g.x, unreached: g.points })),
        },
      });
    }
    legendData.push({ name: NOT_REACHED, icon: 'path://M0,4 h3 v2 h-3 z M5,4 h3 v2 h-3 z M10,4 h3 v2 h-3 z' });
  }
  if (anyFlagged) {
    series.push({ type: 'scatter', name: FLAGGED, symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: KEY_COLOUR, borderWidth: 2 }, data: [] });
    legendData.push(FLAGGED);
  }
  if (data.measured) {
    const name = `measured: ${data.measured.name}`;
    // In panels, a measured row goes to the panel of its own value of the second input.
    const rows = shown.measured.map((p, j) => ({ p, v: data.measured!.values?.[j] })).filter((e) => ok(e.p));
    const same = (a: unknown, b: unknown) => typeof a === 'number' && typeof b === 'number' && Math.abs(a - b) <= 1e-9 * Math.abs(b);
    const panelData = panels ? values.map((v) => rows.filter((e) => same(e.v, v)).map((e) => e.p)) : [rows.map((e) => e.p)];
    panelData.forEach((p, k) =>
      series.push({ type: 'scatter', name, symbol: 'rect', symbolSize: 7, color: MEASURED_COLOUR, z: 5, measured: true, ...(panels ? { xAxisIndex: k, yAxisIndex: k } : {}), data: p }),
    );
    legendData.push(name);
  }

  // Axes: shared bounds across panels, so panels compare at a glance.
  const allPts = [...shown.series.flatMap((s) => s.points.filter(ok)), ...shown.measured.filter(ok)];
  // The not-reached rules widen x to their own x (ECharts does not count mark lines).
  const ruleXs = unreached.map((u) => qx.toDisplay(u.x!));
  const bounds = (k: 0 | 1, log: boolean) => axisBounds([...allPts.map((p) => p[k]), ...(k === 0 ? ruleXs : [])], log);
  // Linear axes of a single frame keep ECharts' own round bounds (unless rules lie outside them).
  const xb = look.xLog || panels || ruleXs.length ? bounds(0, look.xLog) : undefined;
  const yb = look.yLog || panels ? bounds(1, look.yLog) : undefined;
  const frames = layoutFrames(panelCount, legendData, Boolean(look.title));
  const axis = (quantity: Quantity, log: boolean, b: ReturnType<typeof axisBounds>, frame: number, which: 'x' | 'y') => ({
    type: log ? 'log' : 'value',
    gridIndex: frame,
    name: panels && frame !== (which === 'x' ? panelCount - 1 : 0) ? '' : labelWithUnit(quantity),
    nameLocation: 'middle',
    nameGap: which === 'x' ? 28 : 54,
    nameTextStyle: { fontWeight: 600 },
    scale: !log,
    ...(b ? { min: b.min, max: b.max } : {}),
    axisLabel: {
      formatter: (v: number) => (log && !isDecade(v) ? `{minor|${formatNumber(v, 3)}}` : formatNumber(v, 3)),
      rich: { minor: { fontSize: 9, color: '#7a8594' } },
      hideOverlap: true,
      ...(log && b?.labels ? { customValues: b.labels } : {}),
    },
    axisTick: log && b?.ticks ? { customValues: b.ticks } : {},
    splitLine: { lineStyle: { color: GRID_COLOUR } },
    minorTick: { show: !log },
    minorSplitLine: { show: !log, lineStyle: { color: MINOR_GRID_COLOUR } },
    // The crosshair: a line and a value label on each axis follow the pointer.
    axisPointer: { show: true, type: 'line', snap: false, triggerTooltip: false, label: { formatter: (p: { value: number }) => formatNumber(p.value, 4), backgroundColor: '#55606e' } },
  });

  const option: EChartsCoreOption = {
    animation: false,
    textStyle: { fontFamily: CHART_FONT },
    grid: frames.map((f) => ({ ...f, containLabel: false })),
    legend: {
      type: 'plain',
      orient: 'vertical',
      right: 8,
      top: look.title ? 78 : 12,
      data: legendData,
      selectedMode: by ? false : true,
      textStyle: { fontSize: 11 },
    },
    tooltip: {
      trigger: 'item',
      confine: true,
      formatter: (p: TooltipParams) => (p.componentType === 'markLine' ? unreachedHtml(p.data as { unreached?: UnreachedPoint[] }, data, look.target, qx, q) : tooltipHtml(p, data, qx, qy, q)),
    },
    xAxis: frames.map((_, k) => axis(qx, look.xLog, xb, k, 'x')),
    yAxis: frames.map((_, k) => axis(qy, look.yLog, yb, k, 'y')),
    series,
  };
  const titles: Record<string, unknown>[] = [];
  if (panels) {
    // Each panel titled with its value, just above its frame.
    values.forEach((v, k) => titles.push({ text: valueLabel(by!, v, q), left: frames[k].left, top: `${parseFloat(String(frames[k].top)) - 4.5}%`, textStyle: { fontSize: 12, fontWeight: 600 } }));
  }
  if (look.title) {
    titles.unshift({ text: look.title.text, subtext: look.title.subtext, left: 'center', top: 4, textStyle: { fontSize: 15 }, subtextStyle: { fontSize: 11 } });
    option.graphic = [{ type: 'text', left: 16, bottom: 8, style: { text: wrap(look.title.footer, 170), fontSize: 10, fill: KEY_COLOUR, lineHeight: 13 } }];
  }
  if (titles.length) option.title = titles;
  return option;
}

const FLAGGED = 'flagged (outside a validity range)';
export const NOT_REACHED = 'target not reached at this x';
const bandName = (method: string, fraction: number) => `±${formatNumber(fraction * 100, 3)} % band: ${method}`;
const EVERY_FRACTION_BAND = 'stated uncertainty band of each method';
const storedBandName = (method: string | null) => (method ? `95 % band: ${method}` : '95 % band of each method');

function sortedValues(values: ChartSeries['value'][]): ChartSeries['value'][] {
  const rank = (v: unknown) => (typeof v === 'number' ? 0 : v === null || v === undefined ? 2 : 1);
  return [...new Set(values)].sort((a, b) => rank(a) - rank(b) || (typeof a === 'number' && typeof b === 'number' ? a - b : String(a).localeCompare(String(b))));
}

function axisBounds(values: number[], log: boolean): { min: number; max: number; ticks?: number[]; labels?: number[] } | undefined {
  const v = values.filter(Number.isFinite);
  if (!v.length) return undefined;
  const lo = Math.min(...v);
  const hi = Math.max(...v);
  if (log) return logTicks(lo, hi) ?? undefined;
  if (lo === hi) return undefined;
  const pad = (hi - lo) * 0.04;
  return { min: niceFloor(lo - pad, hi - lo), max: niceCeil(hi + pad, hi - lo) };
}

const niceStep = (range: number) => 10 ** Math.floor(Math.log10(range)) / 10;
const niceFloor = (v: number, range: number) => Number((Math.floor(v / niceStep(range)) * niceStep(range)).toPrecision(12));
const niceCeil = (v: number, range: number) => Number((Math.ceil(v / niceStep(range)) * niceStep(range)).toPrecision(12));

/** Plot frames: one, or a grid of panels, left of a vertical legend as wide as its longest entry. */
function layoutFrames(n: number, legend: (string | { name: string })[], exported: boolean): Frame[] {
  const longest = Math.max(8, ...legend.map((l) => (typeof l === 'string' ? l : l.name).length));
  const legendPct = Math.min(34, Math.round(((longest * 6.4 + 44) / 1100) * 100));
  const top = exported ? 78 : 16;
  const bottom = exported ? 86 : 48;
  if (n === 1) return [{ left: 76, right: `${legendPct + 1}%`, top, bottom }];
  const cols = n <= 2 ? n : n <= 4 ? 2 : n <= 9 ? 3 : 4;
  const rows = Math.ceil(n / cols);
  const width = (100 - legendPct - 9) / cols;
  const height = (100 - (exported ? 26 : 12)) / rows;
  const frames: Frame[] = [];
  for (let k = 0; k < n; k++) {
    const c = k % cols;
    const r = Math.floor(k / cols);
    frames.push({
      left: `${(7 + c * width + 1.5).toFixed(2)}%`,
      right: `${(100 - (7 + (c + 1) * width) + 1.5).toFixed(2)}%`,
      top: `${((exported ? 14 : 5) + r * height + 4).toFixed(2)}%`,
      bottom: `${(100 - ((exported ? 14 : 5) + (r + 1) * height) + 5).toFixed(2)}%`,
    });
  }
  return frames;
}

interface TooltipParams {
  componentType?: string;
  seriesName: string;
  value: number[];
  data: { flagged?: number; detail?: number; point?: number; band?: [number, number] } | number[];
}

function tooltipHtml(p: TooltipParams, data: ChartData, qx: Quantity, qy: Quantity, q: Quantities): string {
  const at = (quantity: Quantity, v: number) => `${escapeHtml(quantity.name)} = ${escapeHtml(formatNumber(v, 4))}${quantity.unit === '-' || quantity.unit === '?' ? '' : ` ${escapeHtml(quantity.unit)}`}`;
  const lines = [`<b>${escapeHtml(p.seriesName)}</b>`, at(qx, p.value[0]), at(qy, p.value[1])];
  const item = Array.isArray(p.data) ? undefined : p.data;
  const band = item?.band;
  if (band) lines.push(`95 % band: ${escapeHtml(formatNumber(qy.toDisplay(band[0]), 4))} … ${escapeHtml(formatNumber(qy.toDisplay(band[1]), 4))}${qy.unit === '-' || qy.unit === '?' ? '' : ` ${escapeHtml(qy.unit)}`}`);
  if (item?.flagged) {
    const details: FlagDetail[] = item.detail !== undefined ? (data.flag_details[item.detail] ?? []) : [];
    const text = details.map((d) => escapeHtml(flagText(d, q))).join('; ');
    lines.push(`<span style="color:#8c4119">flagged${text ? `: ${text}` : ''}</span>`);
  }
  if (item?.point !== undefined) lines.push(`<span style="color:${KEY_COLOUR}">point ${item.point}: click for every method there</span>`);
  return lines.join('<br/>');
}

/** The tooltip of a not-reached rule: at this x, which methods missed the target and what they could reach. */
function unreachedHtml(item: { unreached?: UnreachedPoint[] }, data: ChartData, target: TargetFacts | undefined, qx: Quantity, q: Quantities): string {
  const list = item.unreached ?? [];
  const x = list[0]?.x;
  const out = target ? q(target.output) : undefined;
  const range = (lo: number | null, hi: number | null, quantity: Quantity) =>
    `${escapeHtml(formatNumber(lo === null ? null : quantity.toDisplay(lo), 4))} … ${escapeHtml(formatNumber(hi === null ? null : quantity.toDisplay(hi), 4))}${quantity.unit === '-' || quantity.unit === '?' ? '' : ` ${escapeHtml(quantity.unit)}`}`;
  const lines = [
    `<b>target not reached</b> at ${escapeHtml(qx.name)} = ${escapeHtml(formatNumber(x === null || x === undefined ? null : qx.toDisplay(x), 4))}${qx.unit === '-' || qx.unit === '?' ? '' : ` ${escapeHtml(qx.unit)}`}`,
  ];
  if (target && out) lines.push(`${escapeHtml(target.output)} = ${escapeHtml(formatQuantity(out, target.value))} asked, ${escapeHtml(target.adjust)} searched over ${range(target.within[0], target.within[1], q(target.adjust))}`);
  for (const u of list) {
    const label = data.series_by !== 'method' && u.value !== undefined ? `${u.method}, ${valueLabel(data.series_by, u.value, q)}` : u.method;
    lines.push(`${escapeHtml(label)}: ${out ? `${escapeHtml(out.name)} reachable ` : 'reachable '}${range(u.min, u.max, out ?? q(''))} (point ${u.point})`);
  }
  return lines.join('<br/>');
}

/** Breaks text into lines of at most `width` characters at spaces (for the caption). */
export function wrap(text: string, width: number): string {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines.join('\n');
}
