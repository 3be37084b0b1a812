// Turns the API's chart data into an ECharts option: one line per series, flagged
// points drawn as hollow diamonds, an optional ±uncertainty band for one method,
// measured points on top, and for exports a title, subtitle and the caution line.
import type { EChartsCoreOption } from 'echarts/core';
import type { ChartData } from '../api/types.js';
import { formatNumber } from './format.js';
import { FONT_SANS, MEASURED_COLOUR as THEME_MEASURED_COLOUR, SERIES_COLOURS as THEME_SERIES_COLOURS } from './theme.js';

/** Filmsweep's series colours and the measured data's (the palette lives in theme.ts). */
export const SERIES_COLOURS = THEME_SERIES_COLOURS;
export const MEASURED_COLOUR = THEME_MEASURED_COLOUR;

export interface ChartLook {
  xLog: boolean;
  yLog: boolean;
  /** Draw the ±fraction band of this method (from `uncertainty`), or none. */
  bandMethod: string | null;
  /** Export only: title, subtitle and a footer line (the caution). */
  title?: { text: string; subtext: string; footer: string };
}

type Pt = [number, number, number];

const usable = (look: ChartLook) => (p: readonly number[]) =>
  Number.isFinite(p[0]) && Number.isFinite(p[1]) && (!look.xLog || p[0] > 0) && (!look.yLog || p[1] > 0);

/** Points a log axis cannot show (zero or negative), counted so the view can say so. */
export function hiddenOnLogAxes(data: ChartData, look: ChartLook): number {
  const ok = usable(look);
  let n = 0;
  for (const s of data.series) for (const p of s.points) if (!ok(p)) n++;
  if (data.measured) for (const p of data.measured.points) if (!ok(p)) n++;
  return n;
}

export function buildChartOption(data: ChartData, look: ChartLook): EChartsCoreOption {
  const ok = usable(look);
  const series: Record<string, unknown>[] = [];
  let anyFlagged = false;

  data.series.forEach((s, i) => {
    const colour = SERIES_COLOURS[i % SERIES_COLOURS.length];
    const pts = (s.points as Pt[]).filter(ok).sort((a, b) => a[0] - b[0]);
    // Several points at one x (another input varies within the series): a joining line
    // would zigzag between them and suggest a curve that is not there.
    const joined = pts.every((p, k) => k === 0 || p[0] !== pts[k - 1][0]);
    series.push({
      type: joined ? 'line' : 'scatter',
      name: s.name,
      color: colour,
      showSymbol: true,
      symbolSize: joined ? 5 : 7,
      lineStyle: { width: 1.6 },
      emphasis: { focus: 'series' },
      data: pts.map(([x, y, flagged]) => {
        if (!flagged) return { value: [x, y, 0] };
        anyFlagged = true;
        return { value: [x, y, 1], symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: colour, borderWidth: 2 } };
      }),
    });
    const fraction = look.bandMethod && s.method === look.bandMethod ? data.uncertainty[s.method] : undefined;
    if (fraction !== undefined && fraction > 0 && joined) {
      const bandName = `±${formatNumber(fraction * 100, 3)} % ${s.name}`;
      const stack = `band-${i}`;
      series.push({
        type: 'line',
        name: bandName,
        stack,
        color: colour,
        symbol: 'none',
        silent: true,
        lineStyle: { opacity: 0 },
        data: pts.map(([x, y]) => [x, y * (1 - fraction)]),
      });
      series.push({
        type: 'line',
        name: bandName,
        stack,
        color: colour,
        symbol: 'none',
        silent: true,
        lineStyle: { opacity: 0 },
        areaStyle: { opacity: 0.16, color: colour },
        data: pts.map(([x, y]) => [x, 2 * y * fraction]),
      });
    }
  });

  if (anyFlagged) {
    // A legend entry explaining the diamonds; it has no data of its own.
    series.push({ type: 'scatter', name: 'flagged (outside range)', symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: '#55606e', borderWidth: 2 }, data: [] });
  }
  if (data.measured) {
    series.push({
      type: 'scatter',
      name: `measured: ${data.measured.name}`,
      symbol: 'rect',
      symbolSize: 7,
      color: MEASURED_COLOUR,
      z: 5,
      data: data.measured.points.filter(ok).map(([x, y]) => [x, y]),
    });
  }

  const axis = (name: string, log: boolean) => ({
    type: log ? 'log' : 'value',
    name,
    nameLocation: 'middle',
    nameGap: 30,
    scale: !log,
    axisLabel: { formatter: (v: number) => formatNumber(v, 3) },
    splitLine: { lineStyle: { color: '#e3e6ea' } },
    minorSplitLine: { show: log, lineStyle: { color: '#f1f3f5' } },
    minorTick: { show: log },
  });

  // Bands share their line's colour and need no legend entry of their own.
  const legendNames = [...new Set(series.filter((x) => !x.stack).map((x) => x.name as string))];
  const top = look.title ? 78 : 36;
  const option: EChartsCoreOption = {
    animation: false,
    textStyle: { fontFamily: FONT_SANS },
    grid: { left: 70, right: look.title ? 250 : 24, top, bottom: look.title ? 86 : 56 },
    // On screen a scrolling legend above the plot; in a file every entry, in a column on the right.
    legend: look.title
      ? { type: 'plain', orient: 'vertical', right: 8, top, data: legendNames, textStyle: { fontSize: 11 } }
      : { type: 'scroll', top: 4, left: 'center', data: legendNames },
    tooltip: {
      trigger: 'item',
      formatter: (p: { seriesName: string; value: number[] }) =>
        `${p.seriesName}<br/>${data.x} = ${formatNumber(p.value[0])}<br/>${data.y} = ${formatNumber(p.value[1])}${p.value[2] ? '<br/><b>flagged</b>' : ''}`,
    },
    xAxis: { ...axis(data.x, look.xLog), nameGap: 28 },
    yAxis: { ...axis(data.y, look.yLog), nameGap: 52 },
    series,
  };
  if (look.title) {
    option.title = { text: look.title.text, subtext: look.title.subtext, left: 'center', top: 4, textStyle: { fontSize: 15 }, subtextStyle: { fontSize: 11 } };
    option.graphic = [
      {
        type: 'text',
        left: 16,
        bottom: 8,
        style: { text: wrap(look.title.footer, 170), fontSize: 10, fill: '#55606e', lineHeight: 13 },
      },
    ];
  }
  return option;
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
