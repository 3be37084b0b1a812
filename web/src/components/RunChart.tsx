// The run's chart: any output against any input, linear or log axes, one series per
// method or per value of a second input, flagged points marked, a method's ±uncertainty
// band, measured data with each method's mean absolute deviation; exports as SVG/PNG.
import { useId, useMemo, useState } from 'react';
import { CAUTION } from '../../../shared/export/caution.js';
import type { Measurement } from '../api/measurements.js';
import { useChart } from '../api/runs.js';
import type { RunInfo } from '../api/types.js';
import { buildChartOption, hiddenOnLogAxes, type ChartLook } from '../lib/chart-option.js';
import { exportChart } from '../lib/chart-export.js';
import { formatNumber, formatPercent } from '../lib/format.js';
import type { ChartQuery, RangeFilter } from '../lib/result-query.js';
import { EChart } from './EChart.js';
import { Empty, ErrorNote, Loading } from './States.js';

interface Props {
  run: RunInfo;
  columns: { inputs: string[]; outputs: string[] };
  methods: string[];
  filters: RangeFilter[];
  measurements: Measurement[];
  live: boolean;
}

const preferred = (names: string[], wanted: string[]) => wanted.find((w) => names.includes(w)) ?? names[0] ?? '';

/** The title, subtitle and caution that go on an exported chart. */
export function exportTitle(run: RunInfo, x: string, y: string) {
  return {
    text: `${run.title ?? run.study}: ${y} against ${x}`,
    subtext: `Filmsweep run #${run.id} · study ${run.study} v${run.study_version} (sha256 ${run.yaml_hash.slice(0, 12)}) · ${run.status}${run.git_commit ? ` · commit ${run.git_commit.slice(0, 10)}` : ''}`,
    footer: CAUTION,
  };
}

export function RunChart({ run, columns, methods, filters, measurements, live }: Props) {
  const id = useId();
  const [x, setX] = useState(() => preferred(columns.inputs, ['Re', 'Ra', 'Re_x', 'Gr', 'velocity']));
  const [y, setY] = useState(() => preferred(columns.outputs, ['Nu', 'h', 'Nu_x', 'Nu_D']));
  const [series, setSeries] = useState('method');
  const [xLog, setXLog] = useState(true);
  const [yLog, setYLog] = useState(true);
  const [band, setBand] = useState('');
  const [measurement, setMeasurement] = useState('');

  const query: ChartQuery = { x, y, series, methods, filters, max: 2000, measurement: measurement ? Number(measurement) : undefined };
  const chart = useChart(run.id, x && y ? query : null, live);
  const look: ChartLook = { xLog, yLog, bandMethod: band || null };
  const option = useMemo(() => (chart.data ? buildChartOption(chart.data, look) : null), [chart.data, xLog, yLog, band]);
  const hidden = chart.data ? hiddenOnLogAxes(chart.data, look) : 0;
  const bandMethods = chart.data ? Object.keys(chart.data.uncertainty) : methods;

  const save = (type: 'svg' | 'png') => {
    if (!chart.data) return;
    const withTitle = buildChartOption(chart.data, { ...look, title: exportTitle(run, chart.data.x, chart.data.y) });
    exportChart(withTitle, type, `run-${run.id}-${chart.data.y}-vs-${chart.data.x}.${type}`);
  };

  const select = (label: string, value: string, set: (v: string) => void, options: { value: string; label: string }[], key: string) => (
    <div>
      <label htmlFor={`${id}-${key}`} className="field-label">{label}</label>
      <select id={`${id}-${key}`} className="input w-auto" value={value} onChange={(e) => set(e.target.value)}>
        {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
    </div>
  );

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        {select('y (output)', y, setY, columns.outputs.map((n) => ({ value: n, label: n })), 'y')}
        {select('x (input)', x, setX, columns.inputs.map((n) => ({ value: n, label: n })), 'x')}
        {select('one series per', series, setSeries, [{ value: 'method', label: 'method' }, ...columns.inputs.filter((n) => n !== x).map((n) => ({ value: n, label: `value of ${n}` }))], 'series')}
        <fieldset className="flex items-center gap-3 pb-1.5">
          <legend className="field-label">log axes</legend>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={xLog} onChange={(e) => setXLog(e.target.checked)} /> x</label>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={yLog} onChange={(e) => setYLog(e.target.checked)} /> y</label>
        </fieldset>
        {select('uncertainty band', band, setBand, [{ value: '', label: 'none' }, ...bandMethods.map((m) => ({ value: m, label: `${m} (±${formatNumber((chart.data?.uncertainty[m] ?? 0) * 100, 3)} %)` }))], 'band')}
        {select('measured data', measurement, setMeasurement, [{ value: '', label: 'none' }, ...measurements.map((m) => ({ value: String(m.id), label: `${m.name} (${m.rows} rows)` }))], 'measured')}
        <div className="ml-auto flex gap-1.5 pb-0.5">
          <button type="button" className="btn btn-small" onClick={() => save('svg')} disabled={!chart.data}>Chart as SVG</button>
          <button type="button" className="btn btn-small" onClick={() => save('png')} disabled={!chart.data}>Chart as PNG</button>
        </div>
      </div>
      {!x || !y ? (
        <Empty>This run has no numeric inputs or outputs to plot.</Empty>
      ) : chart.isPending ? (
        <Loading what="Drawing the chart" />
      ) : chart.isError ? (
        <ErrorNote error={chart.error} title="The chart could not be loaded" />
      ) : chart.data.series.length === 0 ? (
        <Empty>No points to plot with these filters.</Empty>
      ) : (
        <>
          <EChart option={option!} label={`${chart.data.y} against ${chart.data.x}`} />
          <p className="text-xs text-ink-600" data-testid="chart-note">
            {chart.data.total.toLocaleString('en')} points in {chart.data.series.length} series
            {chart.data.downsampled ? ' · thinned for display (the extremes of each stretch along x are kept; the table and exports have every point)' : ''}
            {hidden ? ` · ${hidden} points with zero or negative values cannot be shown on log axes` : ''}
            {' · ◇ hollow diamonds are flagged results (outside a validity range)'}
            {band && !(option!.series as { stack?: string }[]).some((x) => x.stack) ? ' · the band needs one value per x: choose one series per value of the other swept input' : ''}
          </p>
        </>
      )}
      {chart.data?.measured && (
        <div className="rounded-md border border-ink-100 p-3" data-testid="mad">
          <p className="mb-1 text-xs font-semibold text-ink-600">Mean absolute deviation from the measured data “{chart.data.measured.name}” (relative)</p>
          <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
            {Object.entries(chart.data.measured.mad).map(([m, v]) => (
              <li key={m}><span className="font-mono text-xs">{m}</span> {formatPercent(v).replace('+', '')}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
