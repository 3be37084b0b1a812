// Design answers in the dashboard's pure helpers (web/src/lib): the point view's lines
// (bands and reachable ranges folded into their quantity), the chart's stored bands (drawn
// from `_low` to `_high`, in the units shown), the not-reached rules of a target run (and
// their tooltip), the point index on every drawn point, a target run's default axes, and
// strict ids in page addresses. Expected values are worked by hand from the inputs here
// (common practice; no external reference needed).
import { describe, expect, it } from 'vitest';
import type { PointRow } from '../web/src/api/points.js';
import type { AxisFacts, ChartData } from '../web/src/api/types.js';
import { defaultChoice } from '../web/src/lib/chart-defaults.js';
import { buildChartOption, EVERY_METHOD, NOT_REACHED } from '../web/src/lib/chart-option.js';
import { bandReach, formatInterval, headlineName, outputLines } from '../web/src/lib/point-view.js';
import { routeId, routeIndex } from '../web/src/lib/route-id.js';
import { makeQuantities } from '../web/src/lib/units.js';

const inC = makeQuantities([], 'degC');
const inK = makeQuantities([], 'K');

const row = (method: string, outputs: Record<string, number>, flags: string[] = []): PointRow => ({ method, inputs: {}, outputs, flags, uncertainty: { fraction: 0.2 }, recommended: false });

describe('point view lines', () => {
  const rows = [
    row('hausen', { Nu: 5.8, Nu_low: 5.1, Nu_high: 6.5, length: 4.34, length_low: 3.5, length_high: 5.26, outlet_temperature: 308.15 }),
    row('gnielinski', { h_min: 11.3, h_max: 48.2 }, ['target-not-reached']),
  ];

  it('folds bands and reachable ranges into their quantity, headline first', () => {
    const lines = outputLines(rows, ['length']);
    expect(lines.map((l) => l.name)).toEqual(['length', 'Nu', 'outlet_temperature', 'h']);
    expect(lines[0].cells.hausen).toEqual({ value: 4.34, low: 3.5, high: 5.26 });
    expect(lines[1].cells.hausen).toEqual({ value: 5.8, low: 5.1, high: 6.5 });
    // h has no value at all: only the reachable range of the method that missed its target.
    expect(lines[3].cells).toEqual({ gnielinski: { min: 11.3, max: 48.2 } });
  });

  it('keeps a name that only looks like a bound (no quantity of that stem) as it is', () => {
    expect(outputLines([row('m', { delta_low: 2 })]).map((l) => l.name)).toEqual(['delta_low']);
  });

  it('leads with the spread quantity, else the target input (even where no method reached it), else Nu', () => {
    expect(headlineName(rows, 'length', 'length')).toBe('length');
    expect(headlineName([rows[1]], null, 'velocity')).toBe('velocity');
    expect(headlineName([row('a', { Nu: 3, h: 9 })], null)).toBe('Nu');
    expect(headlineName([row('a', { Nu_x: 3 })], null)).toBe('Nu_x');
  });

  it('writes a band in the units shown, and how far it reaches, never for a temperature', () => {
    expect(formatInterval(inC('length'), 3.5, 5.26)).toBe('3.5 … 5.26 m');
    expect(formatInterval(inC('length'), 3.5, 5.26, false)).toBe('3.5 … 5.26');
    // 305.15 K and 311.15 K are 32 °C and 38 °C.
    expect(formatInterval(inC('outlet_temperature'), 305.15, 311.15)).toBe('32 … 38 °C');
    expect(formatInterval(inK('outlet_temperature'), 305.15, 311.15)).toBe('305.1 … 311.1 K');
    expect(formatInterval(inC('Nu'), 5.1, 6.5)).toBe('5.1 … 6.5');
    // (3.5 − 4.34)/4.34 = −19.35 %, (5.26 − 4.34)/4.34 = +21.2 %.
    expect(bandReach(inC('length'), { value: 4.34, low: 3.5, high: 5.26 })).toBe('−19 % / +21 %');
    expect(bandReach(inC('outlet_temperature'), { value: 308.15, low: 305.15, high: 311.15 })).toBeUndefined();
  });
});

type S = { name: string; type: string; stack?: string; data: { value?: unknown[]; point?: number; band?: number[] }[] & number[][]; markLine?: { data: { xAxis: number; unreached: unknown[] }[]; precision: number } };
type Option = { series: S[]; xAxis: { min?: number; max?: number }[]; legend: { data: (string | { name: string })[] }; tooltip: { formatter: (p: unknown) => string } };

const target = { output: 'outlet_temperature', value: 308.15, adjust: 'length', within: [0.2, 40] as [number, number] };
const banded: ChartData = {
  x: 'velocity',
  y: 'outlet_temperature',
  total: 4,
  downsampled: false,
  series_by: 'method',
  series: [
    { name: 'hausen', method: 'hausen', points: [[0.05, 308.15, 0], [0.1, 309.15, 0], [0.2, 310.15, 0]], point_index: [0, 1, 2], band: [[305.15, 311.15], [306.15, null], [307.15, 313.15]] },
    { name: 'gnielinski', method: 'gnielinski', points: [[0.05, 300.15, 0], [0.2, 302.15, 0]], point_index: [0, 2], band: [[299.15, 301.15], [301.15, 303.15]] },
  ],
  uncertainty: { hausen: 0.12, gnielinski: 0.1 },
  flag_details: [],
  left_out: [],
  band_of: 'outlet_temperature',
  unreached: [{ method: 'gnielinski', x: 0.1, point: 1, min: 295.15, max: 305.15 }],
  unreached_total: 1,
};

describe('chart option on design answers', () => {
  it("draws every method's stored band from _low to _high in the units shown, skipping points without one", () => {
    const o = buildChartOption(banded, { xLog: false, yLog: false, bandMethod: EVERY_METHOD, quantities: inC }) as unknown as Option;
    const hausen = o.series.filter((s) => s.stack === 'band-0');
    expect(hausen).toHaveLength(2);
    // Lower edge at the stored low, in °C; the stacked width reaches the stored high.
    expect((hausen[0].data as number[][]).map((p) => [p[0], Number(p[1].toFixed(9))])).toEqual([[0.05, 32], [0.2, 34]]);
    expect((hausen[1].data as number[][]).map((p) => Number(p[1].toFixed(9)))).toEqual([6, 6]);
    expect(o.series.some((s) => s.stack === 'band-1')).toBe(true);
    expect(o.legend.data).toContainEqual({ name: '95 % band of each method', icon: 'rect' });
    // One method only.
    const one = buildChartOption(banded, { xLog: false, yLog: false, bandMethod: 'gnielinski', quantities: inC }) as unknown as Option;
    expect(one.series.filter((s) => s.stack).map((s) => s.stack)).toEqual(['band-1', 'band-1']);
    expect(one.legend.data).toContainEqual({ name: '95 % band: gnielinski', icon: 'rect' });
  });

  it('puts the point index (and the band) on every drawn point, and says so in the tooltip', () => {
    const o = buildChartOption(banded, { xLog: false, yLog: false, bandMethod: null, quantities: inC }) as unknown as Option;
    const hausen = o.series.find((s) => s.name === 'hausen')!;
    expect(hausen.data.map((d) => d.point)).toEqual([0, 1, 2]);
    expect(hausen.data[0].band).toEqual([305.15, 311.15]);
    expect(hausen.data[1].band).toBeUndefined();
    const html = o.tooltip.formatter({ seriesName: 'hausen', value: hausen.data[0].value, data: hausen.data[0] });
    expect(html).toContain('outlet_temperature = 35 °C');
    expect(html).toContain('95 % band: 32 … 38 °C');
    expect(html).toContain('point 0: click for every method there');
  });

  it('marks where a target was not reached with a rule at its x, breaks the line there, and says what was reachable', () => {
    const o = buildChartOption(banded, { xLog: false, yLog: false, bandMethod: null, quantities: inC, target }) as unknown as Option;
    const rules = o.series.find((s) => s.name === NOT_REACHED)!;
    expect(rules.markLine!.data.map((d) => d.xAxis)).toEqual([0.1]);
    expect(rules.markLine!.precision).toBeGreaterThanOrEqual(12); // 2 (the default) would move a rule at 0.0095 to 0.01
    expect(o.legend.data).toContainEqual(expect.objectContaining({ name: NOT_REACHED }));
    // gnielinski's line has a gap at 0.1 (no value there), so it does not join 0.05 to 0.2.
    const g = o.series.find((s) => s.name === 'gnielinski')!;
    expect(g.data.map((d) => d.value)).toEqual([[0.05, 27], [0.1, '-'], [0.2, 29]].map(([x, y]) => [x, typeof y === 'number' ? expect.closeTo(y, 9) : y]));
    const html = o.tooltip.formatter({ componentType: 'markLine', seriesName: NOT_REACHED, value: 0.1, data: rules.markLine!.data[0] });
    expect(html).toContain('<b>target not reached</b> at velocity = 0.1 m/s');
    expect(html).toContain('outlet_temperature = 35 °C asked, length searched over 0.2 … 40 m');
    // 295.15 K … 305.15 K reachable: 22 … 32 °C.
    expect(html).toContain('gnielinski: outlet_temperature reachable 22 … 32 °C (point 1)');
  });

  it('widens x to the rules and escapes names in their tooltip', () => {
    const far: ChartData = { ...banded, unreached: [{ method: '<i>x</i>', x: 0.5, point: 3, min: 1, max: 2 }] };
    const o = buildChartOption(far, { xLog: false, yLog: false, bandMethod: null, quantities: inC, target }) as unknown as Option;
    expect(o.xAxis[0].max).toBeGreaterThanOrEqual(0.5);
    const rules = o.series.find((s) => s.name === NOT_REACHED)!;
    const html = o.tooltip.formatter({ componentType: 'markLine', seriesName: NOT_REACHED, value: 0.5, data: rules.markLine!.data[0] });
    expect(html).toContain('&lt;i&gt;x&lt;/i&gt;');
    expect(html).not.toContain('<i>');
  });
});

describe('target runs start on their answer', () => {
  const f = (name: string, role: 'input' | 'output', min: number, max: number, distinct: number, swept = role === 'input' && distinct > 1): AxisFacts => ({ name, role, swept, distinct, min, max });
  it('plots the solved input against the widest swept input, not Re', () => {
    const facts = [f('diameter', 'input', 0.00635, 0.0127, 3), f('length', 'input', 0.094, 0.094, 1), f('Re', 'output', 400, 2400, 9), f('velocity', 'output', 1.4, 3, 9), f('Nu', 'output', 10, 25, 9), f('h', 'output', 50, 50, 1)];
    expect(defaultChoice(facts, 'external', { output: 'h', value: 50, adjust: 'velocity', within: [0.1, 30] })).toEqual({ x: 'diameter', y: 'velocity', by: 'method', layout: 'style' });
    // Without the target, the trade's abscissa as before.
    expect(defaultChoice(facts, 'external')).toMatchObject({ x: 'Re', y: 'Nu' });
  });
  it('splits a second swept input as before', () => {
    const facts = [f('velocity', 'input', 0.05, 0.2, 3), f('diameter', 'input', 0.01, 0.03, 3), f('length', 'output', 2, 30, 18)];
    expect(defaultChoice(facts, 'internal', { output: 'outlet_temperature', value: 308.15, adjust: 'length', within: [0.2, 40] })).toEqual({ x: 'velocity', y: 'length', by: 'diameter', layout: 'style' });
  });
});

describe('ids in page addresses', () => {
  it('reads whole positive numbers only, so /runs/-1 asks the API nothing', () => {
    expect(routeId('12')).toBe(12);
    for (const bad of ['-1', '0', 'abc', '1.5', '', ' 3', '1e3', '01', undefined]) expect(routeId(bad), String(bad)).toBeUndefined();
    expect(routeIndex('0')).toBe(0);
    expect(routeIndex('41')).toBe(41);
    for (const bad of ['-1', 'x', '2.0', undefined]) expect(routeIndex(bad), String(bad)).toBeUndefined();
  });
});
