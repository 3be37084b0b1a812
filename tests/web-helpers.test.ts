// Pure helpers of the dashboard (web/src/lib): query strings, CSV headers, diagnostics,
// number formatting, roles and the chart option. Expected values are worked by hand
// from the API contract (common practice; no external reference needed).
import { describe, expect, it } from 'vitest';
import { buildChartOption, hiddenOnLogAxes, wrap } from '../web/src/lib/chart-option.js';
import { buildCompareOption } from '../web/src/lib/compare-chart.js';
import { csvHeader, guessMapping, mappingProblem, splitCsvLine } from '../web/src/lib/csv-header.js';
import { diagnosticsOf, sourceLine } from '../web/src/lib/diagnostics.js';
import { formatNumber, formatPercent } from '../web/src/lib/format.js';
import { chartSearch, defaultResultQuery, filterParams, isBound, resultsSearch } from '../web/src/lib/result-query.js';
import { can } from '../web/src/lib/roles.js';
import type { ChartData } from '../web/src/api/types.js';

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
  it('formats with significant digits', () => {
    expect(formatNumber(523.456)).toBe('523.5');
    expect(formatNumber(1.0e5)).toBe('100000');
    expect(formatNumber(2.5e6)).toBe('2.5e6');
    expect(formatNumber(0.000123456)).toBe('1.235e-4');
    expect(formatNumber(null)).toBe('—');
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

const data: ChartData = {
  x: 'Re',
  y: 'Nu',
  total: 5,
  downsampled: false,
  series: [
    { name: 'gnielinski', method: 'gnielinski', points: [[1e5, 200, 0], [1e4, 40, 1], [0, 10, 0]] },
    { name: 'dittus-boelter', method: 'dittus-boelter', points: [[1e4, 45, 0], [1e5, 230, 0]] },
  ],
  uncertainty: { gnielinski: 0.1, 'dittus-boelter': 0.25 },
  measured: { name: 'rig A', points: [[2e4, 70], [-1, 5]], mad: { gnielinski: 0.05 } },
};

type S = { name: string; type: string; stack?: string; data: unknown[]; areaStyle?: unknown };

describe('chart option', () => {
  it('sorts along x, drops what a log axis cannot show and marks flagged points', () => {
    const o = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null }) as { series: S[]; xAxis: { type: string } };
    expect(o.xAxis.type).toBe('log');
    const g = o.series.find((s) => s.name === 'gnielinski')!;
    expect(g.data).toEqual([
      { value: [1e4, 40, 1], symbol: 'diamond', symbolSize: 10, itemStyle: { color: '#ffffff', borderColor: expect.any(String), borderWidth: 2 } },
      { value: [1e5, 200, 0] },
    ]);
    expect(o.series.some((s) => s.name === 'flagged (outside range)')).toBe(true);
    expect(o.series.find((s) => s.name === 'measured: rig A')!.data).toEqual([[2e4, 70]]);
    expect(hiddenOnLogAxes(data, { xLog: true, yLog: true, bandMethod: null })).toBe(2);
    expect(hiddenOnLogAxes(data, { xLog: false, yLog: false, bandMethod: null })).toBe(0);
  });

  it('draws the band as y(1 − f) plus a stacked 2fy, so its top is y(1 + f)', () => {
    const o = buildChartOption(data, { xLog: false, yLog: false, bandMethod: 'gnielinski' }) as { series: S[] };
    const band = o.series.filter((s) => s.stack === 'band-0');
    expect(band).toHaveLength(2);
    expect(band[0].name).toBe('±10 % gnielinski');
    const lower = band[0].data as number[][];
    const width = band[1].data as number[][];
    expect(lower.map((p) => p[0])).toEqual([0, 1e4, 1e5]);
    lower.forEach((p, i) => {
      const y = [10, 40, 200][i];
      expect(p[1]).toBeCloseTo(0.9 * y, 12);
      expect(p[1] + width[i][1]).toBeCloseTo(1.1 * y, 12);
    });
    expect(band[1].areaStyle).toBeDefined();
    expect((o as unknown as { legend: { data: string[] } }).legend.data).not.toContain('±10 % gnielinski');
    expect(o.series.some((s) => s.stack === 'band-1')).toBe(false);
  });

  it('puts title, subtitle and the caution on exported charts only', () => {
    const plain = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null }) as Record<string, unknown>;
    expect(plain.title).toBeUndefined();
    const titled = buildChartOption(data, { xLog: true, yLog: true, bandMethod: null, title: { text: 'T', subtext: 'run #4 v2', footer: 'Caution: a b c' } }) as {
      title: { text: string; subtext: string };
      graphic: { style: { text: string } }[];
    };
    expect(titled.title).toMatchObject({ text: 'T', subtext: 'run #4 v2' });
    expect(titled.graphic[0].style.text).toBe('Caution: a b c');
  });

  it('does not join points that share an x (another input varies), and then draws no band', () => {
    const shared: ChartData = { ...data, measured: undefined, series: [{ name: 'g', method: 'gnielinski', points: [[1e4, 40, 0], [1e4, 90, 0], [1e5, 200, 0]] }] };
    const o = buildChartOption(shared, { xLog: false, yLog: false, bandMethod: 'gnielinski' }) as { series: S[] };
    expect(o.series.map((s) => s.type)).toEqual(['scatter']);
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
