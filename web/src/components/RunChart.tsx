// The run's chart: any input or derived output on x and y (units on axes, tooltips and
// exports), colour by method and a second input by line style or small multiples, log or
// linear axes, flagged points with the range they broke, a method's ±uncertainty band,
// measured data with each method's deviation, bias and mean absolute deviation and a
// parity plot; a crosshair read-out; exports as SVG/PNG. Its choices belong to this run
// (RunPage mounts a fresh one per run).
import { useId, useMemo, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { Measurement } from '../api/measurements.js';
import { useChart, useChartAxes } from '../api/runs.js';
import type { AxisFacts, ChartData, RunInfo } from '../api/types.js';
import { chartQueryFor, defaultChoice, numeric, secondInputs, seriesProblem, startingChoice, varies, type ChartChoice, type SeriesLayout } from '../lib/chart-defaults.js';
import { exportChart, exportTitle } from '../lib/chart-export.js';
import { autoLog, buildChartOption, EVERY_METHOD, hiddenOnLogAxes, type ChartLook } from '../lib/chart-option.js';
import { formatCount, formatNumber } from '../lib/format.js';
import type { ChartQuery, FlaggedFilter, RangeFilter } from '../lib/result-query.js';
import { formatQuantity, labelWithUnit, type Quantities } from '../lib/units.js';
import { EChart, type PointerAt } from './EChart.js';
import { MeasuredComparison } from './MeasuredComparison.js';
import { Empty, ErrorNote, Loading } from './States.js';

interface Props {
  run: RunInfo;
  methods: string[];
  flagged: FlaggedFilter;
  filters: RangeFilter[];
  measurements: Measurement[];
  live: boolean;
  quantities: Quantities;
  /** The configuration's flow regime (GET /api/runs/:id): the default abscissa follows it. */
  regime: string | undefined;
}

export function RunChart({ run, methods, flagged, filters, measurements, live, quantities, regime }: Props) {
  const id = useId();
  const axes = useChartAxes(run.id, live);
  const facts = axes.data?.names ?? [];
  const [chosen, setChosen] = useState<Partial<ChartChoice>>({});
  const [logChoice, setLogChoice] = useState<{ x?: boolean; y?: boolean }>({});
  // undefined: the default, every method's stored band where the run has one for y, else none.
  const [band, setBand] = useState<string | undefined>(undefined);
  const navigate = useNavigate();
  const [measurement, setMeasurement] = useState('');
  const [pointer, setPointer] = useState<PointerAt | null>(null);

  // Defaults follow the facts (a live run gains names) until the user picks.
  const target = axes.data?.target;
  const drawnMethods = methods.length || run.methods.length;
  const defaults = useMemo(() => defaultChoice(facts, regime, target, drawnMethods), [axes.data, regime, drawnMethods]);
  const choice = startingChoice(facts, defaults, chosen);
  const problem = facts.length ? seriesProblem(facts, choice, drawnMethods) : null;
  const query = chartQueryFor(facts, choice, { methods, drawnMethods, flagged, filters, measurement: measurement ? Number(measurement) : undefined });
  const chart = useChart(run.id, query, live);
  const data = chart.data;
  const auto = useMemo(() => (data ? autoLog(data, quantities) : { x: true, y: true }), [data, quantities]);
  const storedBand = Boolean(data?.band_of && data.band_of === data.y);
  const bandShown = band ?? (storedBand ? EVERY_METHOD : '');
  const look: ChartLook = { xLog: logChoice.x ?? auto.x, yLog: logChoice.y ?? auto.y, bandMethod: bandShown || null, quantities, layout: choice.layout, target };
  const option = useMemo(() => (data ? buildChartOption(data, look) : null), [data, look.xLog, look.yLog, bandShown, quantities, choice.layout, target]);
  const unreached = data?.unreached ?? [];
  const unplacedMisses = unreached.filter((u) => u.x === null).length;
  const hidden = data ? hiddenOnLogAxes(data, look) : 0;
  const panels = data && data.series_by !== 'method' && choice.layout === 'panels' ? new Set(data.series.map((s) => s.value)).size : 1;
  const choose = (patch: Partial<ChartChoice>) => {
    setChosen({ ...chosen, ...patch });
    if ('x' in patch) setLogChoice((l) => ({ y: l.y }));
    if ('y' in patch) setLogChoice((l) => ({ x: l.x }));
  };

  const what = data ? `${labelWithUnit(quantities(data.y))} against ${labelWithUnit(quantities(data.x))}` : '';
  const save = (type: 'svg' | 'png') => {
    if (!data) return;
    const withTitle = buildChartOption(data, { ...look, title: exportTitle(run, what) });
    exportChart(withTitle, type, `run-${run.id}-${data.y}-vs-${data.x}.${type}`, panels > 1 ? { width: 1400, height: 300 * Math.ceil(panels / 3) + 200 } : undefined);
  };

  const names = (role: 'input' | 'output') => facts.filter((f) => f.role === role && numeric(f));
  const option_ = (f: AxisFacts) => (
    <option key={f.name} value={f.name}>
      {labelWithUnit(quantities(f.name))}
      {varies(f) ? '' : ' (constant)'}
    </option>
  );
  const axisSelect = (label: string, which: 'x' | 'y') => (
    <div>
      <label htmlFor={`${id}-${which}`} className="field-label">{label}</label>
      <select id={`${id}-${which}`} className="input w-auto" value={choice[which]} onChange={(e) => choose({ [which]: e.target.value })}>
        <optgroup label="inputs">{names('input').map(option_)}</optgroup>
        <optgroup label="outputs (computed and derived)">{names('output').map(option_)}</optgroup>
      </select>
    </div>
  );
  const seconds = secondInputs(facts, choice.x);

  if (axes.isPending) return <Loading what="Reading the run's inputs and outputs" />;
  if (axes.isError) return <ErrorNote error={axes.error} title="The chart's choices could not be loaded" />;
  if (!choice.x || !choice.y) return <Empty>{live ? 'No results to plot yet; the chart appears as the run writes them.' : 'This run has no numeric inputs or outputs to plot.'}</Empty>;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        {axisSelect('y axis', 'y')}
        {axisSelect('x axis', 'x')}
        <div>
          <label htmlFor={`${id}-by`} className="field-label">series</label>
          <select id={`${id}-by`} className="input w-auto" value={choice.by} onChange={(e) => choose({ by: e.target.value })}>
            <option value="method">one per method</option>
            {seconds.map((f) => (
              <option key={f.name} value={f.name}>per method and value of {f.name} ({formatCount(f.distinct)} values)</option>
            ))}
          </select>
        </div>
        {choice.by !== 'method' && (
          <fieldset className="flex items-center gap-3 pb-1.5">
            <legend className="field-label">values of {choice.by} as</legend>
            {(['style', 'panels'] as SeriesLayout[]).map((l) => (
              <label key={l} className="flex items-center gap-1 text-sm">
                <input type="radio" name={`${id}-layout`} checked={choice.layout === l} onChange={() => choose({ layout: l })} /> {l === 'style' ? 'line styles' : 'small multiples'}
              </label>
            ))}
          </fieldset>
        )}
        <fieldset className="flex items-center gap-3 pb-1.5">
          <legend className="field-label">log axes</legend>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={look.xLog} onChange={(e) => setLogChoice({ ...logChoice, x: e.target.checked })} /> x</label>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={look.yLog} onChange={(e) => setLogChoice({ ...logChoice, y: e.target.checked })} /> y</label>
        </fieldset>
        <div>
          <label htmlFor={`${id}-band`} className="field-label">uncertainty band</label>
          <select id={`${id}-band`} className="input w-auto" value={bandShown} onChange={(e) => setBand(e.target.value)}>
            <option value="">none</option>
            {storedBand ? (
              <>
                <option value={EVERY_METHOD}>every method (stored 95 % bands)</option>
                {Object.keys(data?.uncertainty ?? {}).map((m) => <option key={m} value={m}>{m} (stored 95 % band)</option>)}
              </>
            ) : (
              <>
                <option value={EVERY_METHOD}>every method (± stated uncertainty)</option>
                {Object.entries(data?.uncertainty ?? {}).map(([m, f]) => (
                  <option key={m} value={m}>{m} (±{formatNumber(f * 100, 3)} %)</option>
                ))}
              </>
            )}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-measured`} className="field-label">measured data</label>
          <select id={`${id}-measured`} className="input w-auto" value={measurement} onChange={(e) => setMeasurement(e.target.value)}>
            <option value="">none</option>
            {measurements.map((m) => <option key={m.id} value={String(m.id)}>{m.name} ({formatCount(m.rows)} rows)</option>)}
          </select>
        </div>
        <div className="ml-auto flex gap-1.5 pb-0.5">
          <button type="button" className="btn btn-small" onClick={() => save('svg')} disabled={!data}>Chart as SVG</button>
          <button type="button" className="btn btn-small" onClick={() => save('png')} disabled={!data}>Chart as PNG</button>
        </div>
      </div>
      {problem ? (
        <div role="status" className="rounded-md border border-copper-500/40 bg-copper-100 px-3 py-2 text-sm text-copper-700" data-testid="series-problem">
          <p>{problem}</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <button type="button" className="btn btn-small" onClick={() => choose({ by: 'method' })}>One series per method</button>
            {choice.layout === 'style' && (
              <button type="button" className="btn btn-small" onClick={() => choose({ layout: 'panels' })}>Small multiples</button>
            )}
            <button type="button" className="btn btn-small" onClick={() => choose({ x: choice.by, by: 'method' })}>Put {choice.by} on x</button>
          </div>
        </div>
      ) : chart.isPending ? (
        <Loading what="Drawing the chart" />
      ) : chart.isError ? (
        <ErrorNote error={chart.error} title="The chart could not be loaded" />
      ) : data!.series.length === 0 ? (
        <Empty>No points to plot with these choices and filters.</Empty>
      ) : (
        <>
          <EChart
            option={option!}
            height={panels > 1 ? 240 * Math.ceil(panels / (panels <= 2 ? panels : panels <= 4 ? 2 : panels <= 9 ? 3 : 4)) + 60 : 460}
            label={what}
            onPointer={setPointer}
            onItemClick={(item) => {
              const point = (item.data as { point?: unknown } | null)?.point;
              if (typeof point === 'number') navigate(`/runs/${run.id}/points/${point}`);
            }}
          />
          <p className="min-h-5 font-mono text-xs text-ink-700" data-testid="crosshair" aria-live="off">
            {pointer ? `${data!.x} = ${formatNumber(pointer.x, 4)} ${quantities(data!.x).unit} · ${data!.y} = ${formatNumber(pointer.y, 4)} ${quantities(data!.y).unit}`.replace(/ [-?](?= ·|$)/g, '') : 'Point at the chart to read x and y.'}
          </p>
          <p className="text-xs text-ink-600" data-testid="chart-note">
            {data!.total_estimated ? 'about ' : ''}{formatCount(data!.total)} results in {formatCount(data!.series.length)} series
            {data!.sampled ? ` · drawn from a fixed sample of ${formatCount(data!.sampled)} results${data!.total_estimated ? ' (the count is estimated from it; the table counts exactly)' : ''}, keeping the lowest and highest of each stretch along x; the table and exports have every result` : data!.downsampled ? ' · thinned for display (the lowest and highest of each stretch along x are kept; the table and exports have every result)' : ''}
            {hidden ? ` · ${formatCount(hidden)} points with zero or negative values cannot be shown on log axes` : ''}
            {data!.flag_details.length || data!.series.some((s) => s.points.some((p) => p[2])) ? ' · ◇ hollow diamonds are flagged results (outside a validity range; point at one to see which)' : ''}
            {bandShown && !(option!.series as { stack?: string }[]).some((x) => x.stack) ? ' · the band needs one value per x: split the series by the other swept input' : ''}
            {bandShown && storedBand ? ' · shaded: the stored 95 % band (2.5 % to 97.5 % points) of each point' : ''}
            {' · click a point for every method there'}
          </p>
          {unreached.length > 0 && (
            <p className="text-xs text-copper-700" data-testid="unreached-note">
              {data!.unreached_total === undefined ? `More than ${formatCount(unreached.length)}` : formatCount(unreached.length)} result{unreached.length === 1 ? '' : 's'} did not reach the target
              {target ? ` (${target.output} = ${formatQuantity(quantities(target.output), target.value)} with ${target.adjust} in ${formatQuantity(quantities(target.adjust), target.within[0])} … ${formatQuantity(quantities(target.adjust), target.within[1])})` : ''}
              {unplacedMisses < unreached.length ? ': dashed rules mark their x (point at one for what each method could reach)' : ''}
              {unplacedMisses > 0 ? `${unplacedMisses < unreached.length ? '; ' : ': '}${formatCount(unplacedMisses)} have no ${data!.x} to be placed by (put an input on x; the results table lists them, flagged target-not-reached)` : ''}.
            </p>
          )}
        </>
      )}
      {data && data.left_out.length > 0 && <LeftOutNote data={data} onPlot={(name) => choose({ y: name })} />}
      {data?.measured && <MeasuredComparison run={run} data={data} quantities={quantities} />}
    </div>
  );
}

function LeftOutNote({ data, onPlot }: { data: ChartData; onPlot: (name: string) => void }) {
  return (
    <div className="rounded-md border border-ink-100 p-3 text-sm" data-testid="left-out">
      <p className="mb-1 text-xs font-semibold text-ink-600">Not on this chart</p>
      <ul className="space-y-1">
        {data.left_out.map((l) => {
          const instead = l.local?.includes(`${data.y}_x`) ? `${data.y}_x` : l.local?.includes('Nu_x') ? 'Nu_x' : undefined;
          return (
            <li key={l.method}>
              <span className="font-mono text-xs">{l.method}</span> {l.reason}
              {instead && (
                <button type="button" className="btn btn-small ml-2" onClick={() => onPlot(instead)}>Plot {instead}</button>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
