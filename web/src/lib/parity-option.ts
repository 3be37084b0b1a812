// The parity plot of measured data: each method's prediction against the measured value
// at the same row, with the line of perfect agreement and ±10 % / ±20 % lines, on log
// axes when the values span a decade. Names reach the tooltip only through escapeHtml.
import type { EChartsCoreOption } from 'echarts/core';
import type { MeasuredOverlay } from '../api/types.js';
import { CHART_FONT, GRID_COLOUR, KEY_COLOUR, SERIES_COLOURS, wrap } from './chart-option.js';
import { escapeHtml } from './escape-html.js';
import { formatNumber, formatPercent } from './format.js';
import { logTicks } from './log-axis.js';
import type { Quantity } from './units.js';

export const PARITY_LINES = [0.1, 0.2] as const;

export function buildParityOption(
  measured: MeasuredOverlay,
  methods: readonly string[],
  q: Quantity,
  title?: { text: string; subtext: string; footer: string },
): EChartsCoreOption {
  const pairs = methods.map((m) =>
    measured.rows
      .filter((r) => Number.isFinite(r.predicted[m]))
      .map((r) => ({ value: [q.toDisplay(r.measured), q.toDisplay(r.predicted[m])], deviation: r.deviation[m] })),
  );
  const all = pairs.flat().flatMap((p) => p.value).filter(Number.isFinite);
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const log = all.length > 0 && lo > 0 && hi / lo >= 10;
  const ticks = log ? logTicks(lo, hi) : null;
  const [a, b] = ticks ? [ticks.min, ticks.max] : all.length ? [Math.min(0, lo), hi * 1.1] : [0, 1];
  const line = (factor: number, name: string, type: string) => ({
    type: 'line',
    name,
    silent: true,
    symbol: 'none',
    color: KEY_COLOUR,
    lineStyle: { width: 1, type },
    data: [
      [a, a * factor],
      [b, b * factor],
    ],
  });
  const unit = q.unit === '-' || q.unit === '?' ? '' : ` [${q.unit}]`;
  const series: Record<string, unknown>[] = [line(1, 'measured = predicted', 'solid')];
  for (const f of PARITY_LINES) {
    const name = `±${f * 100} %`;
    series.push(line(1 + f, name, f === 0.1 ? 'dashed' : 'dotted'), line(1 - f, name, f === 0.1 ? 'dashed' : 'dotted'));
  }
  methods.forEach((m, i) => series.push({ type: 'scatter', name: m, color: SERIES_COLOURS[i % SERIES_COLOURS.length], symbolSize: 7, data: pairs[i] }));
  const axis = (name: string) => ({
    type: log ? 'log' : 'value',
    name,
    nameLocation: 'middle',
    nameGap: 30,
    min: a,
    max: b,
    axisLabel: { formatter: (v: number) => formatNumber(v, 3), ...(ticks ? { customValues: ticks.labels } : {}) },
    ...(ticks ? { axisTick: { customValues: ticks.ticks } } : {}),
    splitLine: { lineStyle: { color: GRID_COLOUR } },
  });
  const option: EChartsCoreOption = {
    animation: false,
    textStyle: { fontFamily: CHART_FONT },
    grid: { left: 76, right: 190, top: title ? 78 : 16, bottom: title ? 86 : 48 },
    legend: { type: 'plain', orient: 'vertical', right: 8, top: title ? 78 : 12, data: [...methods, 'measured = predicted', ...PARITY_LINES.map((f) => `±${f * 100} %`)], textStyle: { fontSize: 11 } },
    tooltip: {
      trigger: 'item',
      confine: true,
      formatter: (p: { seriesName: string; data: { value: number[]; deviation?: number } }) =>
        [
          `<b>${escapeHtml(p.seriesName)}</b>`,
          `measured ${escapeHtml(q.name)} = ${escapeHtml(formatNumber(p.data.value[0]))}${escapeHtml(unit)}`,
          `predicted = ${escapeHtml(formatNumber(p.data.value[1]))}${escapeHtml(unit)}`,
          `deviation ${escapeHtml(formatPercent(p.data.deviation ?? null))}`,
        ].join('<br/>'),
    },
    xAxis: axis(`measured ${q.name}${unit}`),
    yAxis: axis(`predicted ${q.name}${unit}`),
    series,
  };
  if (title) {
    option.title = { text: title.text, subtext: title.subtext, left: 'center', top: 4, textStyle: { fontSize: 15 }, subtextStyle: { fontSize: 11 } };
    option.graphic = [{ type: 'text', left: 16, bottom: 8, style: { text: wrap(title.footer, 170), fontSize: 10, fill: KEY_COLOUR, lineHeight: 13 } }];
  }
  return option;
}
