// The comparison chart: relative difference (b − a)/|a| against one input, one series per
// method; x in the units shown (°C or K by the user's choice) with its unit in the axis
// title and tooltip.
import type { EChartsCoreOption } from 'echarts/core';
import type { CompareRow } from '../api/types.js';
import { SERIES_COLOURS, wrap } from './chart-option.js';
import { escapeHtml } from './escape-html.js';
import { formatNumber } from './format.js';
import type { Quantity } from './units.js';
import { FIGURE, FONT_SANS } from './theme.js';

export function buildCompareOption(
  rows: readonly CompareRow[],
  x: string,
  output: string,
  look: {
    xLog: boolean;
    title?: { text: string; subtext: string; footer: string };
    /** Axis title of x with its unit (default: the input's name). */
    xLabel?: string;
    /** x's display rule (°C or K, unit in the tooltip); default: SI as sent. */
    xQuantity?: Quantity;
  },
): EChartsCoreOption {
  const byMethod = new Map<string, [number, number][]>();
  const toX = look.xQuantity?.toDisplay ?? ((v: number) => v);
  const xUnit = look.xQuantity && look.xQuantity.unit !== '-' && look.xQuantity.unit !== '?' ? ` ${look.xQuantity.unit}` : '';
  for (const r of rows) {
    const raw = r.inputs[x];
    const xv = typeof raw === 'number' ? toX(raw) : raw;
    if (typeof xv !== 'number' || r.rel_diff === null || !Number.isFinite(r.rel_diff)) continue;
    if (look.xLog && xv <= 0) continue;
    const list = byMethod.get(r.method) ?? [];
    list.push([xv, r.rel_diff * 100]);
    byMethod.set(r.method, list);
  }
  const series = [...byMethod.entries()].map(([method, pts], i) => {
    pts.sort((a, b) => a[0] - b[0]);
    // Points that share an x (another input varies) are not joined by a line.
    const joined = pts.every((p, k) => k === 0 || p[0] !== pts[k - 1][0]);
    return { type: joined ? 'line' : 'scatter', name: method, color: SERIES_COLOURS[i % SERIES_COLOURS.length], symbolSize: 6, data: pts };
  });
  const option: EChartsCoreOption = {
    animation: false,
    textStyle: { fontFamily: FONT_SANS, color: FIGURE.text },
    grid: { left: 70, right: 24, top: look.title ? 78 : 36, bottom: look.title ? 86 : 56 },
    legend: { type: 'scroll', top: look.title ? 50 : 4 },
    tooltip: { trigger: 'item', formatter: (p: { seriesName: string; value: number[] }) => `${escapeHtml(p.seriesName)}<br/>${escapeHtml(x)} = ${formatNumber(p.value[0])}${escapeHtml(xUnit)}<br/>Δ${escapeHtml(output)} = ${formatNumber(p.value[1], 3)} %` },
    xAxis: { type: look.xLog ? 'log' : 'value', name: look.xLabel ?? x, nameLocation: 'middle', nameGap: 28, scale: !look.xLog, axisLabel: { formatter: (v: number) => formatNumber(v, 3) } },
    yAxis: { type: 'value', name: `(b − a)/|a| of ${output}, %`, nameLocation: 'middle', nameGap: 52, axisLabel: { formatter: (v: number) => formatNumber(v, 3) } },
    series,
  };
  if (look.title) {
    option.title = { text: look.title.text, subtext: look.title.subtext, left: 'center', top: 4, textStyle: { fontSize: 15 }, subtextStyle: { fontSize: 11 } };
    option.graphic = [{ type: 'text', left: 16, bottom: 8, style: { text: wrap(look.title.footer, 170), fontSize: 10, fill: FIGURE.muted, lineHeight: 13 } }];
  }
  return option;
}
