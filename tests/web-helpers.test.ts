// Pure helpers of the dashboard (web/src/lib): query strings, CSV headers, diagnostics,
// number formatting, roles and the chart option. Expected values are worked by hand
// from the API contract (common practice; no external reference needed).
import { describe, expect, it } from 'vitest';
import { describeFlag } from '../shared/chart/flags.js';
import { autoLog, buildChartOption, hiddenOnLogAxes, LARGE_SERIES_POINTS, wrap } from '../web/src/lib/chart-option.js';
import { defaultChoice, seriesProblem } from '../web/src/lib/chart-defaults.js';
import { readTemperatureUnit, storageKey } from '../web/src/lib/display-units.js';
import { escapeHtml } from '../web/src/lib/escape-html.js';
import { flagText } from '../web/src/lib/flag-text.js';
import { isDecade, logTicks } from '../web/src/lib/log-axis.js';
import { buildParityOption } from '../web/src/lib/parity-option.js';
import { formatQuantity, labelWithUnit, makeQuantities, prettyUnit } from '../web/src/lib/units.js';
import { buildCompareOption } from '../web/src/lib/compare-chart.js';
import { csvHeader, guessMapping, mappingProblem, splitCsvLine, unitProblem } from '../web/src/lib/csv-header.js';
import { diagnosticsOf, sourceLine } from '../web/src/lib/diagnostics.js';
import { formatCount, formatNumber, formatPercent } from '../web/src/lib/format.js';
import { chartSearch, convertBound, defaultResultQuery, filterParams, isBound, resultsSearch } from '../web/src/lib/result-query.js';
import { can } from '../web/src/lib/roles.js';
import type { AxisFacts, ChartData } from '../web/src/api/types.js';

describe('result query strings', () => {
  it('writes page, sort, methods, flagged and repeated filters with open bounds', () => {
    const s = resultsSearch({
      ...defaultResultQuery,
      page: 3,
      sort: 'Nu',
      order: 'desc',
      methods: ['gnielinski', 'dittus-boelter'],
      flagged: 'yes',
      filters: [
        { name: 'Re', min: '1e4', max: '' },
        { name: 'Pr', min: '', max: ' 7 ' },
        { name: 'h', min: '', max: '' },
        { name: 'Nu', min: 'abc', max: '' },
      ],
    });
    const sp = new URLSearchParams(s);
    expect(sp.get('page')).toBe('3');
    expect(sp.get('pageSize')).toBe('50');
    expect(sp.get('sort')).toBe('Nu');
    expect(sp.get('order')).toBe('desc');
    expect(sp.get('method')).toBe('gnielinski,dittus-boelter');
    expect(sp.get('flagged')).toBe('yes');
    expect(sp.getAll('filter')).toEqual(['Re:1e4:', 'Pr::7']);
  });

  it('leaves out what is at its default', () => {
    expect(resultsSearch(defaultResultQuery)).toBe('page=1&pageSize=50');
    expect(chartSearch({ x: 'Re', y: 'Nu', series: 'method', methods: [], filters: [], max: 2000 })).toBe('x=Re&y=Nu&series=method&max=2000');
  });

  it('accepts only empty or finite bounds', () => {
    expect(['', ' ', '1e5', '-3.5', '0.7'].every(isBound)).toBe(true);
    expect(['x', '1e', 'Infinity', '--1'].some(isBound)).toBe(false);
    expect(filterParams([{ name: '', min: '1', max: '2' }])).toEqual([]);
  });
});

describe('CSV header for the column mapping', () => {
  it('splits quoted cells', () => {
    expect(splitCsvLine('a,"b,c","say ""hi""", d ')).toEqual(['a', 'b,c', 'say "hi"', 'd']);
  });
  it('reads the first non-empty line without a BOM', () => {
    expect(csvHeader('\uFEFF\n\nRe,Nu (measured),T [K]\r\n1,2,3\n')).toEqual(['Re', 'Nu (measured)', 'T [K]']);
    expect(csvHeader('')).toEqual([]);
  });
  it('guesses the obvious mapping and asks for Nu or h', () => {
    const m = guessMapping(['re', 'Nu (measured)', 'T [K]'], ['Re', 'Pr', 'Nu', 'h']);
    expect(m).toEqual({ re: 'Re', 'Nu (measured)': 'Nu' });
    expect(mappingProblem(m)).toBeNull();
    expect(mappingProblem({ re: 'Re' })).toMatch(/Nu or h/);
    expect(mappingProblem({ a: 'Nu', b: 'Nu' })).toMatch(/two columns/);
  });
});

describe('study diagnostics', () => {
  it('keeps well-formed entries and finds the source line', () => {
    const d = diagnosticsOf({ diagnostics: [{ file: 'x.yaml', line: 2, column: 7, message: 'bad' }, { nope: 1 }] });
    expect(d).toEqual([{ file: 'x.yaml', line: 2, column: 7, message: 'bad' }]);
    expect(diagnosticsOf([{ line: 1 }])).toEqual([]);
    expect(sourceLine('a: 1\nb: 2\n', 2)).toBe('b: 2');
    expect(sourceLine('a', 0)).toBeUndefined();
  });
});

describe('formatting and roles', () => {
  it('formats with significant digits, thousands separators between 1e-3 and 1e5, exponents outside', () => {
    expect(formatNumber(523.456)).toBe('523.5');
    expect(formatNumber(40000)).toBe('40,000');
    expect(formatNumber(1913.4)).toBe('1,913');
    // Rounded first: 99,999 at 4 digits is 1.000e5, written as an exponent like 1e5.
    expect(formatNumber(99_999)).toBe('1e5');
    expect(formatNumber(1.0e5)).toBe('1e5');
    expect(formatNumber(3.2e5, 2)).toBe('3.2e5');
    expect(formatNumber(2.5e6)).toBe('2.5e6');
    expect(formatNumber(0.0123456)).toBe('0.01235');
    expect(formatNumber(0.000123456)).toBe('1.235e-4');
    expect(formatNumber(-1234.5)).toBe('-1,235');
    expect(formatNumber(null)).toBe('—');
    expect(formatCount(1_000_000)).toBe('1,000,000');
    expect(formatPercent(0.0123)).toBe('+1.23 %');
    expect(formatPercent(-0.5)).toBe('-50 %');
  });
  it('orders the roles', () => {
    expect(can('viewer', 'upload')).toBe(false);
    expect(can('researcher', 'upload')).toBe(true);
    expect(can('researcher', 'team')).toBe(false);
    expect(can('lead', 'outbox')).toBe(true);
    expect(can(undefined, 'tokens')).toBe(false);
  });
});

describe('units on screen', () => {
  // Units from the catalogue's specs (none here), the dimensional quantities and the
  // engine's derived outputs (shared/export/units.ts).
  const inC = makeQuantities([], 'degC');
  const inK = makeQuantities([], 'K');
  it('labels every name with its unit, dimensionless as -', () => {
    expect(labelWithUnit(inK('h'))).toBe('h [W/(m²·K)]');
    expect(labelWithUnit(inK('heat_rate'))).toBe('heat_rate [W]');
    expect(labelWithUnit(inK('velocity'))).toBe('velocity [m/s]');
    expect(labelWithUnit(inK('flow_rate'))).toBe('flow_rate [m³/s]');
    expect(labelWithUnit(inK('Re'))).toBe('Re [-]');
    expect(labelWithUnit(inK('h_low'))).toBe('h_low [W/(m²·K)]');
    expect(labelWithUnit(inK('made_up'))).toBe('made_up [?]');
    expect(prettyUnit('J/(kg K)')).toBe('J/(kg·K)');
  });
  it('shows absolute temperatures in °C or K by choice, differences always in K', () => {
    // 0 °C = 273.15 K (SI brochure, 9th ed., §2.3.1).
    expect(labelWithUnit(inC('fluid_temperature'))).toBe('fluid_temperature [°C]');
    expect(inC('fluid_temperature').toDisplay(299.35)).toBeCloseTo(26.2, 12);
    expect(inC('property_temperature').fromDisplay(26.2)).toBeCloseTo(299.35, 12);
    expect(formatQuantity(inC('surface_temperature'), 401.55)).toBe('128.4 °C');
    expect(formatQuantity(inK('surface_temperature'), 401.55)).toBe('401.6 K');
    expect(inC('surface_temperature_high').unit).toBe('°C');
    expect(inC('surface_temperature_outlet').unit).toBe('°C');
    expect(inC('outlet_temperature').unit).toBe('°C');
    expect(labelWithUnit(inC('log_mean_temperature_difference'))).toBe('log_mean_temperature_difference [K]');
    expect(inC('log_mean_temperature_difference').toDisplay(12)).toBe(12);
    expect(formatQuantity(inC('Re'), 40000)).toBe('40,000');
  });
  it('reads bounds typed in °C back to SI for the API', () => {
    expect(convertBound('26.2', inC('fluid_temperature').fromDisplay)).toBe('299.35');
    expect(convertBound('299.35', inC('fluid_temperature').toDisplay)).toBe('26.2');
    expect(convertBound('', inC('fluid_temperature').fromDisplay)).toBe('');
    expect(convertBound('1e5', inC('Re').fromDisplay)).toBe('100000');
  });
  it('remembers the temperature unit per user', () => {
    const store = new Map<string, string>();
    const storage = { getItem: (k: string) => store.get(k) ?? null };
    expect(readTemperatureUnit(storage, 'a@x.example')).toBe('degC');
    store.set(storageKey('A@x.example'), JSON.stringify({ temperature: 'K' }));
    expect(readTemperatureUnit(storage, 'a@x.example')).toBe('K');
    expect(readTemperatureUnit(storage, 'b@x.example')).toBe('degC');
    store.set(storageKey('b@x.example'), 'not json');
    expect(readTemperatureUnit(storage, 'b@x.example')).toBe('degC');
  });
});

describe('escaping for HTML sinks', () => {
  it('escapes the five HTML specials', () => {
    expect(escapeHtml('<img src=x onerror="alert(1)">&\'')).toBe('&lt;img src=x onerror=&quot;alert(1)&quot;&gt;&amp;&#39;');
    expect(escapeHtml(5)).toBe('5');
  });
});

describe('log axes', () => {
  it('labels 1, 2, 5 within three decades and ticks every multiple', () => {
    const t = logTicks(1.2e4, 9e5)!;
    expect(t.min).toBe(1e4);
    expect(t.max).toBe(1e6);
    expect(t.labels).toEqual([1e4, 2e4, 5e4, 1e5, 2e5, 5e5, 1e6]);
    expect(t.ticks).toContain(3e4);
    expect(t.ticks).toContain(9e5);
  });
  it('labels every multiple on one decade, only decades on many', () => {
    expect(logTicks(2, 9)).toMatchObject({ min: 2, max: 9, labels: [2, 3, 4, 5, 6, 7, 8, 9] });
    const wide = logTicks(2e7, 1.2e10)!;
    expect(wide.labels).toEqual([1e7, 1e8, 1e9, 1e10, 1e11]);
    expect(logTicks(0, 10)).toBeNull();
    expect(isDecade(1e-3)).toBe(true);
    expect(isDecade(2e3)).toBe(false);
  });
});

describe('flags in words', () => {
  const q = makeQuantities([], 'degC');
  it('says which range was broken, in the units shown', () => {
    expect(flagText(describeFlag('out-of-range:Re', { Re: 3.2e5 }, [{ input: 'Re', max: 2e5 }]), q)).toBe('Re 3.2e5 > 2e5');
    expect(flagText(describeFlag('out-of-range:Re', { Re: 800 }, [{ input: 'Re', min: 3000, max: 5e6 }]), q)).toBe('Re 800 < 3,000');
    expect(flagText(describeFlag('out-of-range:Pe', {}, [{ input: 'Pe', min: 0.2 }]), q)).toBe('Pe outside 0.2 ≤ Pe');
    expect(flagText({ flag: 'out-of-range:fluid_temperature', name: 'fluid_temperature', value: 253.15, min: 273.15 }, q)).toBe('fluid_temperature -20 °C < 0 °C');
    expect(flagText(describeFlag('separation', {}, undefined), q)).toMatch(/separates/);
    expect(flagText(describeFlag('out-of-chart:pitch', {}, undefined), q)).toBe('pitch beyond the pressure-drop charts (χ = 1 used)');
    expect(flagText(describeFlag('something-new', {}, undefined), q)).toBe('something-new');
  });
});

describe('chart defaults', () => {
  const f = (name: string, role: 'input' | 'output', min: number, max: number, distinct: number, swept = role === 'input' && distinct > 1): AxisFacts => ({ name, role, swept, distinct, min, max });
  it('plots Nu against Re on a dimensional forced-convection run, a second input as line styles', () => {
    const facts = [f('velocity', 'input', 1, 20, 8), f('length', 'input', 0.5, 5, 4), f('fluid_temperature', 'input', 300, 300, 1), f('Re', 'output', 1e3, 1e5, 32), f('Nu', 'output', 30, 3000, 100), f('h', 'output', 10, 90, 100)];
    expect(defaultChoice(facts, 'external')).toEqual({ x: 'Re', y: 'Nu', by: 'length', layout: 'style' });
  });
  it('starts one series per method when the split would draw more than a few dozen (eight pipe methods × five Pr values)', () => {
    const facts = [f('Re', 'input', 500, 1e6, 10), f('Pr', 'input', 0.7, 500, 5), f('Nu', 'output', 3, 2e4, 400)];
    expect(defaultChoice(facts, 'internal', undefined, 7)).toMatchObject({ x: 'Re', by: 'Pr' });
    expect(defaultChoice(facts, 'internal', undefined, 8)).toMatchObject({ x: 'Re', by: 'method' });
    expect(seriesProblem(facts, defaultChoice(facts, 'internal', undefined, 8), 8)).toBeNull();
  });
  it('does not split by the one swept input that x derives from', () => {
    const facts = [f('velocity', 'input', 1, 20, 8), f('Re', 'output', 600, 16000, 24), f('Nu', 'output', 12, 77, 24)];
    expect(defaultChoice(facts, 'external')).toEqual({ x: 'Re', y: 'Nu', by: 'method', layout: 'style' });
  });
  it('takes Ra for free convection, and the widest swept input when no group varies', () => {
    expect(defaultChoice([f('height', 'input', 0.3, 1.2, 3), f('Ra', 'output', 1e7, 1e10, 27), f('Nu', 'output', 30, 300, 27)], 'free').x).toBe('Ra');
    const dimensionless = [f('Pr', 'input', 0.7, 7, 2), f('Re', 'input', 800, 3e5, 7), f('Nu', 'output', 3.66, 3.66, 1), f('h', 'output', 1, 9, 5)];
    // Re spans 2.6 decades, Pr one: Re on x. Nu is constant here, so y is h.
    expect(defaultChoice(dimensionless, undefined)).toEqual({ x: 'Re', y: 'h', by: 'Pr', layout: 'style' });
    expect(defaultChoice([f('m', 'input', 0, 1, 5), f('Nu_x', 'output', 1, 50, 5)], 'external')).toMatchObject({ x: 'm', y: 'Nu_x', by: 'method' });
  });
  it('refuses a few dozen series with a suggestion', () => {
    const facts = [f('Re', 'input', 1e4, 1e6, 1000), f('Pr', 'input', 0.7, 100, 500), f('L_over_D', 'input', 10, 60, 6)];
    expect(seriesProblem(facts, { x: 'Re', y: 'Nu', by: 'method', layout: 'style' }, 4)).toBeNull();
    expect(seriesProblem(facts, { x: 'Re', y: 'Nu', by: 'L_over_D', layout: 'style' }, 4)).toBeNull();
    expect(seriesProblem(facts, { x: 'Re', y: 'Nu', by: 'L_over_D', layout: 'style' }, 8)).toMatch(/48 series.*range filter on L_over_D/);
    expect(seriesProblem(facts, { x: 'Re', y: 'Nu', by: 'Pr', layout: 'style' }, 2)).toMatch(/Pr has 500 values.*line styles/);
    expect(seriesProblem(facts, { x: 'Re', y: 'Nu', by: 'Pr', layout: 'panels' }, 2)).toMatch(/more than 12 panels/);
  });
});

const quantities = makeQuantities([], 'K');
const data: ChartData = {
  x: 'Re',
  y: 'Nu',
  total: 5,
  downsampled: false,
  series_by: 'method',
  series: [
    { name: 'gnielinski', method: 'gnielinski', points: [[1e5, 200, 0], [1e4, 40, 1, 0], [0, 10, 0]] },
    { name: 'dittus-boelter', method: 'dittus-boelter', points: [[1e4, 45, 0], [1e5, 230, 0]] },
  ],
  uncertainty: { gnielinski: 0.1, 'dittus-boelter': 0.25 },
  flag_details: [[{ flag: 'out-of-range:Re', name: 'Re', value: 1e4, min: 2e4 }]],
  left_out: [],
  measured: { name: 'rig A', points: [[2e4, 70], [-1, 5]], mad: { gnielinski: 0.05 }, bias: { gnielinski: -0.01 }, rows: [], unplaced: 0 },
};

type S = { name: string; type: string; stack?: string; data: unknown[]; areaStyle?: unknown; lineStyle?: { type?: unknown }; symbol?: string; xAxisIndex?: number };
type Tooltip = { formatter: (p: unknown) => string };

describe('chart option', () => {
  it('sorts along x, drops what a log axis cannot show and marks flagged points', () => {
    const o = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null, quantities }) as { series: S[]; xAxis: { type: string; name: string }[]; yAxis: { name: string }[] };
    expect(o.xAxis[0].type).toBe('log');
    expect(o.xAxis[0].name).toBe('Re [-]');
    expect(o.yAxis[0].name).toBe('Nu [-]');
    const g = o.series.find((s) => s.name === 'gnielinski')!;
    expect(g.data).toEqual([
      { value: [1e4, 40], flagged: 1, detail: 0, symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: expect.any(String), borderWidth: 2 } },
      { value: [1e5, 200] },
    ]);
    expect(o.series.some((s) => s.name === 'flagged (outside a validity range)')).toBe(true);
    expect(o.series.find((s) => s.name === 'measured: rig A')!.data).toEqual([[2e4, 70]]);
    expect(hiddenOnLogAxes(data, { xLog: true, yLog: true, quantities })).toBe(2);
    expect(hiddenOnLogAxes(data, { xLog: false, yLog: false, quantities })).toBe(0);
  });

  it('draws a cloud of more than LARGE_SERIES_POINTS points as one path, its flagged points on top under the same name', () => {
    // Several Pr per Re: not joined by a line, so a scatter.
    const points: ChartData['series'][number]['points'] = [];
    for (let i = 0; i < 400; i++) for (const Pr of [1, 2]) points.push([1e4 + 100 * i, 40 + i + Pr, i === 7 && Pr === 2 ? 1 : 0, ...(i === 7 && Pr === 2 ? [0] : [])] as never);
    const cloud: ChartData = { ...data, measured: undefined, series: [{ name: 'gnielinski', method: 'gnielinski', points }, data.series[1]] };
    const o = buildChartOption(cloud, { xLog: true, yLog: true, bandMethod: null, quantities }) as { series: (S & { large?: boolean })[] };
    const g = o.series.filter((s) => s.name === 'gnielinski');
    expect(points.length).toBeGreaterThan(LARGE_SERIES_POINTS);
    expect(g).toHaveLength(2);
    expect(g[0]).toMatchObject({ type: 'scatter', large: true });
    expect(g[0].data).toHaveLength(points.length - 1);
    expect(g[1].large).toBeUndefined();
    expect(g[1].data).toEqual([expect.objectContaining({ value: [1e4 + 700, 49], flagged: 1, symbol: 'diamond' })]);
    // A small series keeps its own symbols (hover emphasis, per-point styles).
    expect(o.series.find((s) => s.name === 'dittus-boelter')!.large).toBeUndefined();
  });

  it('says in the tooltip which range a flagged point broke, and escapes every name', () => {
    const hostile: ChartData = { ...data, series: [{ name: '<b>x</b>', method: '<img src=x onerror=alert(1)>', points: [[1e4, 40, 1, 0]] }] };
    const o = buildChartOption(hostile, { xLog: true, yLog: true, bandMethod: null, quantities }) as { series: S[]; tooltip: Tooltip };
    const html = o.tooltip.formatter({ seriesName: o.series[0].name, value: [1e4, 40], data: o.series[0].data[0] });
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(html).not.toContain('<img');
    expect(html).toContain('Re 10,000 &lt; 20,000');
    expect(html).toContain('Nu = 40');
  });

  it('draws the band as y(1 − f) plus a stacked 2fy, so its top is y(1 + f), with a legend key', () => {
    const o = buildChartOption(data, { xLog: false, yLog: false, bandMethod: 'gnielinski', quantities }) as { series: S[]; legend: { data: (string | { name: string })[] } };
    const band = o.series.filter((s) => s.stack === 'band-0');
    expect(band).toHaveLength(2);
    expect(band[0].name).toBe('±10 % band: gnielinski');
    const lower = band[0].data as number[][];
    const width = band[1].data as number[][];
    expect(lower.map((p) => p[0])).toEqual([0, 1e4, 1e5]);
    lower.forEach((p, i) => {
      const y = [10, 40, 200][i];
      expect(p[1]).toBeCloseTo(0.9 * y, 12);
      expect(p[1] + width[i][1]).toBeCloseTo(1.1 * y, 12);
    });
    expect(band[1].areaStyle).toBeDefined();
    // The band and the measured data are legend entries (on screen and in exported files).
    expect(o.legend.data).toContainEqual({ name: '±10 % band: gnielinski', icon: 'rect' });
    expect(o.legend.data).toContain('measured: rig A');
    expect(o.series.some((s) => s.stack === 'band-1')).toBe(false);
  });

  it('colours by method and tells a second input by marker and dash, legend sorted by value with units', () => {
    const byT: ChartData = {
      ...data,
      x: 'Re',
      series_by: 'fluid_temperature',
      measured: undefined,
      series: [
        { name: 'a, fluid_temperature = 288.15', method: 'a', value: 288.15, points: [[1e4, 40, 0], [1e5, 90, 0]] },
        { name: 'a, fluid_temperature = 263.15', method: 'a', value: 263.15, points: [[1e4, 30, 0], [1e5, 80, 0]] },
        { name: 'b, fluid_temperature = 263.15', method: 'b', value: 263.15, points: [[1e4, 35, 0], [1e5, 85, 0]] },
      ],
    };
    const o = buildChartOption(byT, { xLog: true, yLog: true, bandMethod: null, quantities: makeQuantities([], 'degC') }) as { series: S[]; legend: { data: string[] } };
    expect(o.legend.data).toEqual(['a', 'b', 'fluid_temperature = -10 °C', 'fluid_temperature = 15 °C']);
    const cold = o.series.filter((s) => s.name.includes(', ') && s.name.endsWith('= -10 °C'));
    const warm = o.series.find((s) => s.name === 'a, fluid_temperature = 15 °C')!;
    expect(cold.map((s) => s.name)).toEqual(['a, fluid_temperature = -10 °C', 'b, fluid_temperature = -10 °C']);
    expect(cold[0].symbol).toBe(cold[1].symbol);
    expect(cold[0].symbol).not.toBe(warm.symbol);
    expect(cold[0].lineStyle!.type).not.toEqual(warm.lineStyle!.type);
    expect((cold[0] as { color?: string }).color).toBe((warm as { color?: string }).color);
    // Small multiples: one frame per value, titled with the value.
    const p = buildChartOption(byT, { xLog: true, yLog: true, bandMethod: null, quantities: makeQuantities([], 'degC'), layout: 'panels' }) as { grid: unknown[]; title: { text: string }[]; series: S[] };
    expect(p.grid).toHaveLength(2);
    expect(p.title.map((t) => t.text)).toEqual(['fluid_temperature = -10 °C', 'fluid_temperature = 15 °C']);
    expect(p.series.find((s) => s.name === 'a, fluid_temperature = 15 °C')!.xAxisIndex).toBe(1);
  });

  it('puts title, subtitle and the caution on exported charts only', () => {
    const plain = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null, quantities }) as Record<string, unknown>;
    expect(plain.title).toBeUndefined();
    const titled = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null, quantities, title: { text: 'T', subtext: 'run #4 v2', footer: 'Caution: a b c' } }) as {
      title: { text: string; subtext: string }[];
      graphic: { style: { text: string } }[];
    };
    expect(titled.title[0]).toMatchObject({ text: 'T', subtext: 'run #4 v2' });
    expect(titled.graphic[0].style.text).toBe('Caution: a b c');
  });

  it('does not join points that share an x (another input varies), and then draws no band', () => {
    const shared: ChartData = { ...data, measured: undefined, series: [{ name: 'g', method: 'gnielinski', points: [[1e4, 40, 0], [1e4, 90, 0], [1e5, 200, 0]] }] };
    const o = buildChartOption(shared, { xLog: false, yLog: false, bandMethod: 'gnielinski', quantities }) as { series: S[] };
    expect(o.series.map((s) => s.type)).toEqual(['scatter']);
  });

  it('picks log axes where values are positive and span a decade', () => {
    expect(autoLog(data, quantities)).toEqual({ x: false, y: true });
    const celsius: ChartData = { ...data, x: 'fluid_temperature', measured: undefined, series: [{ name: 'a', method: 'a', points: [[263.15, 5, 0], [400, 50, 0]] }] };
    expect(autoLog(celsius, makeQuantities([], 'degC')).x).toBe(false);
  });

  it('draws a parity plot with ±10 % and ±20 % lines', () => {
    const measured = { ...data.measured!, rows: [{ x: 1e4, measured: 100, predicted: { a: 110 }, deviation: { a: 0.1 } }, { x: 1e5, measured: 1000, predicted: { a: 950 }, deviation: { a: -0.05 } }] };
    const o = buildParityOption(measured, ['a'], quantities('Nu')) as { series: S[]; xAxis: { type: string; name: string } };
    expect(o.xAxis.type).toBe('log');
    expect(o.xAxis.name).toBe('measured Nu');
    const lines = o.series.filter((s) => s.type === 'line').map((s) => (s.data as number[][]).map((p) => p[1] / p[0]));
    expect(lines.map((l) => Number(l[0].toFixed(6)))).toEqual([1, 1.1, 0.9, 1.2, 0.8]);
    expect(o.series.find((s) => s.name === 'a')!.data).toEqual([{ value: [100, 110], deviation: 0.1 }, { value: [1000, 950], deviation: -0.05 }]);
  });

  it('wraps the caption at spaces', () => {
    expect(wrap('aa bb cc dd', 5)).toBe('aa bb\ncc dd');
  });

  it('plots relative differences in percent per method', () => {
    const o = buildCompareOption(
      [
        { method: 'm1', inputs: { Re: 1e5 }, inputs_b: { Re: 1e5 }, a: 100, b: 110, rel_diff: 0.1 },
        { method: 'm1', inputs: { Re: 1e4 }, inputs_b: { Re: 1e4 }, a: 50, b: 50, rel_diff: 0 },
        { method: 'm2', inputs: { Re: 1e4 }, inputs_b: { Re: 1e4 }, a: 50, b: null, rel_diff: null },
      ],
      'Re',
      'Nu',
      { xLog: true },
    ) as { series: S[] };
    expect(o.series).toHaveLength(1);
    expect(o.series[0].data).toEqual([[1e4, 0], [1e5, 10]]);
  });
});

describe('measurement headers in the browser', () => {
  const q = makeQuantities([], 'degC');
  it('finds the separator and maps names without their units', () => {
    expect(csvHeader('velocity [m/s];fluid_temperature [degC];h [W/(m^2 K)]\n1;2;3')).toEqual(['velocity [m/s]', 'fluid_temperature [degC]', 'h [W/(m^2 K)]']);
    expect(csvHeader('a\tb;c\td\n')).toEqual(['a', 'b;c', 'd']);
    expect(guessMapping(['fluid_temperature [degC]', 'H [W/(m^2 K)]', 'Nu (rig)'], ['fluid_temperature', 'h', 'Nu'])).toEqual({
      'fluid_temperature [degC]': 'fluid_temperature',
      'H [W/(m^2 K)]': 'h',
      'Nu (rig)': 'Nu',
    });
  });
  it('warns before upload as the server will refuse', () => {
    expect(unitProblem('fluid_temperature', 'fluid_temperature', q)).toMatch(/fluid_temperature \[degC\]/);
    expect(unitProblem('fluid_temperature [degC]', 'fluid_temperature', q)).toBeNull();
    expect(unitProblem('Re [m]', 'Re', q)).toMatch(/dimensionless/);
    expect(unitProblem('Re [-]', 'Re', q)).toBeNull();
  });
});
