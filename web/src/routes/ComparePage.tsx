// Two runs side by side: points paired by the inputs the user picks (exactly or within a
// relative tolerance), how many paired and how many are only in one run, the relative
// differences of one output in a table and a chart, both study files' line diff, and both
// runs' exports. When nothing pairs, the page says so, and never that nothing changed.
// Units as on the run page: every header and axis with its unit, temperatures in the
// user's °C or K (the API stays SI).
import { useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { CAUTION } from '../../../shared/export/caution.js';
import { useCompare, usePickedRun, type CompareResponse, type CompareRow } from '../api/compare.js';
import { useRuns } from '../api/runs.js';
import type { RunInfo } from '../api/types.js';
import { DataTable } from '../components/DataTable.js';
import { EChart } from '../components/EChart.js';
import { ExportLinks } from '../components/ExportLinks.js';
import { Empty, ErrorNote, Loading } from '../components/States.js';
import { TemperatureUnitChoice } from '../components/TemperatureUnitChoice.js';
import { YamlDiff } from '../components/YamlDiff.js';
import { exportChart } from '../lib/chart-export.js';
import { buildCompareOption } from '../lib/compare-chart.js';
import { formatNumber, formatPercent, formatTime, formatValue } from '../lib/format.js';
import { routeId } from '../lib/route-id.js';
import { labelWithUnit } from '../lib/units.js';
import { useQuantities } from '../lib/use-quantities.js';

const col = createColumnHelper<CompareRow>();
const runLabel = (r: RunInfo) => `#${r.id} · ${r.study} v${r.study_version} · ${r.status} · ${formatTime(r.started_at)}`;
const CHART_ROWS = 500;
const count = (n: number) => n.toLocaleString('en');
const plural = (n: number, one: string, many = `${one}s`) => `${count(n)} ${n === 1 ? one : many}`;

/** Relative tolerances offered (0: equal values only). */
const TOLERANCES = [
  { value: 0, label: 'exact' },
  { value: 1e-9, label: '1 in 10⁹' },
  { value: 1e-6, label: '1 in 10⁶' },
  { value: 1e-4, label: '0.01 %' },
  { value: 1e-3, label: '0.1 %' },
  { value: 1e-2, label: '1 %' },
];

function toleranceText(t: number): string {
  if (t === 0) return 'equal values';
  const preset = TOLERANCES.find((p) => p.value === t);
  return `within ${preset ? preset.label : `${formatNumber(t * 100, 3)} %`}`;
}

function Counts({ c }: { c: CompareResponse }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_auto_auto_auto] md:grid-cols-[repeat(4,auto_auto)]" data-testid="compare-counts">
      <dt className="text-ink-600">paired</dt>
      <dd className="font-mono">{count(c.paired)} <span className="font-sans text-ink-600">results at {plural(c.points.paired, 'point')}</span></dd>
      <dt className="text-ink-600">changed</dt>
      <dd className="font-mono">{count(c.changed)}</dd>
      <dt className="text-ink-600">only in a</dt>
      <dd className="font-mono">{count(c.only_a)} <span className="font-sans text-ink-600">results, {plural(c.points.only_a, 'point')}</span></dd>
      <dt className="text-ink-600">only in b</dt>
      <dd className="font-mono">{count(c.only_b)} <span className="font-sans text-ink-600">results, {plural(c.points.only_b, 'point')}</span></dd>
    </dl>
  );
}

/** What the counts mean, in words: nothing paired, nothing changed, or how much did. */
function Verdict({ c }: { c: CompareResponse }) {
  const on = `${c.by.join(', ')} (${toleranceText(c.tolerance)})`;
  if (c.paired === 0) {
    return (
      <div role="alert" className="rounded-[3px] border-l-[3px] border-ember-500 bg-ember-100 px-3 py-2 text-sm text-ink-900" data-testid="compare-verdict">
        <strong className="font-semibold">Nothing paired</strong>, so nothing can be said about what changed: no point of run a has the same {on} as a point
        of run b. If the runs differ in a fixed input (see the study files below), pair by the swept inputs only, or allow a tolerance.
      </div>
    );
  }
  return (
    <p className="text-sm" data-testid="compare-verdict">
      {c.changed === 0
        ? `None of the ${plural(c.paired, 'paired result')} changed its ${c.output}.`
        : `${plural(c.changed, 'paired result')} of ${count(c.paired)} changed ${c.output}.`}{' '}
      <span className="text-ink-600">Points paired by {on}.</span>
    </p>
  );
}

export function ComparePage() {
  const [params, setParams] = useSearchParams();
  const a = routeId(params.get('a') ?? undefined);
  const b = routeId(params.get('b') ?? undefined);
  const output = params.get('output') ?? 'Nu';
  const changed = (params.get('changed') ?? 'yes') as 'yes' | 'any';
  const tolerance = Number(params.get('tol')) || 0;
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(50);
  const [x, setX] = useState('');
  const [xLog, setXLog] = useState(true);
  const runs = useRuns();
  const runA = usePickedRun(a);
  const runB = usePickedRun(b);

  const inputsA = runA.data?.columns.inputs ?? [];
  const inputsB = runB.data?.columns.inputs ?? [];
  const inputs = [...new Set([...inputsA, ...inputsB])].sort();
  // Default pairing: the inputs both runs have (an input only one run has cannot match).
  const byParam = params.get('by');
  const by = byParam !== null ? byParam.split(',').filter(Boolean) : inputs.filter((n) => inputsA.includes(n) && inputsB.includes(n));
  const ready = a !== undefined && b !== undefined && runA.isSuccess && runB.isSuccess && by.length > 0;
  const base = { a: a!, b: b!, output, by, tolerance };
  const summary = useCompare(ready ? { ...base, page: 1, pageSize: 1, changed: 'any', yaml: true } : null);
  const compare = useCompare(ready ? { ...base, page, pageSize, changed } : null);
  const forChart = useCompare(ready ? { ...base, page: 1, pageSize: CHART_ROWS, changed: 'any' } : null);

  const set = (changes: Record<string, string>) => {
    const next = new URLSearchParams(params);
    for (const [key, value] of Object.entries(changes)) {
      if (value) next.set(key, value);
      else next.delete(key);
    }
    setParams(next, { replace: true });
    setPage(1);
  };
  const pickRun = (k: 'a' | 'b', value: string) => set({ [k]: value, by: '' }); // new runs: default pairing again
  const toggleBy = (name: string) => set({ by: (by.includes(name) ? by.filter((n) => n !== name) : [...by, name]).sort().join(',') || ',' });

  const outputs = [...new Set([...(runA.data?.columns.outputs ?? []), ...(runB.data?.columns.outputs ?? [])])];
  const configuration = runA.data?.run.configuration ?? runB.data?.run.configuration;
  const quantities = useQuantities(configuration);
  // `Re [-]`, `velocity [m/s]`, `fluid_temperature [°C]`, as the run page labels them.
  const withUnit = (name: string) => labelWithUnit(quantities(name));
  const shown = (name: string) => (v: unknown) => formatValue(typeof v === 'number' ? quantities(name).toDisplay(v) : v);
  const kelvinNote = quantities(output).temperature ? ' of the kelvin values' : '';
  const xName = x || inputs.find((n) => n === 'Re' || n === 'Ra') || inputs[0] || '';
  // Inputs in which run b's paired point differs from run a's (not paired by, or within the tolerance).
  const rowsShown = compare.data?.rows ?? [];
  const differingB = inputs.filter((n) => rowsShown.some((r) => r.inputs_b[n] !== r.inputs[n]));
  const columns = useMemo(
    () => [
      col.accessor('method', { header: 'method', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      ...inputs.map((n) => col.accessor((r) => r.inputs[n], { id: n, header: () => <span className="font-mono">{withUnit(n)}</span>, meta: { numeric: true }, cell: (c) => shown(n)(c.getValue()) })),
      ...differingB.map((n) =>
        col.accessor((r) => r.inputs_b[n], { id: `b:${n}`, header: () => <span className="font-mono">{withUnit(n)} in b</span>, meta: { numeric: true }, cell: (c) => shown(n)(c.getValue()) }),
      ),
      col.accessor('a', { header: `run a: ${withUnit(output)}`, meta: { numeric: true }, cell: (c) => formatNumber(c.getValue() === null ? null : quantities(output).toDisplay(c.getValue()!), 6) }),
      col.accessor('b', { header: `run b: ${withUnit(output)}`, meta: { numeric: true }, cell: (c) => formatNumber(c.getValue() === null ? null : quantities(output).toDisplay(c.getValue()!), 6) }),
      col.accessor('rel_diff', {
        // A relative change of an absolute temperature is taken on kelvin (SI), whatever is shown.
        header: `(b − a)/|a|${kelvinNote} [%]`,
        meta: { numeric: true },
        cell: (c) => <span className={c.getValue() ? 'text-ember-700' : 'text-ink-400'}>{formatPercent(c.getValue())}</span>,
      }),
    ],
    [inputs.join(','), differingB.join(','), output, quantities],
  );
  const xLook = { xLog, xLabel: withUnit(xName), xQuantity: quantities(xName) };
  const chartOption = useMemo(() => (forChart.data && xName ? buildCompareOption(forChart.data.rows, xName, output, xLook) : null), [forChart.data, xName, output, xLog, quantities]);

  const save = (type: 'svg' | 'png') => {
    if (!forChart.data) return;
    const { a: ra, b: rb } = forChart.data;
    const option = buildCompareOption(forChart.data.rows, xName, output, {
      ...xLook,
      title: {
        text: `Change of ${output} between run #${ra.id} and run #${rb.id}`,
        subtext: `a: run #${ra.id}, ${ra.study} v${ra.study_version} · b: run #${rb.id}, ${rb.study} v${rb.study_version} · paired by ${forChart.data.by.join(', ')}`,
        footer: CAUTION,
      },
    });
    exportChart(option, type, `compare-${ra.id}-${rb.id}-${output}.${type}`);
  };

  const runOptions = runs.data?.runs ?? [];
  const pickedError = runA.error ?? runB.error;
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center gap-4">
        <h1 className="text-2xl font-bold tracking-tight">Compare two runs</h1>
        <div className="ml-auto"><TemperatureUnitChoice /></div>
      </div>
      <section className="card space-y-4" aria-label="Runs to compare">
        {runs.isError && <ErrorNote error={runs.error} title="The runs could not be listed" />}
        <div className="flex flex-wrap items-end gap-3">
          {(['a', 'b'] as const).map((k) => (
            <div key={k} className="w-full sm:w-96">
              <label htmlFor={`run-${k}`} className="field-label">run {k}</label>
              <select id={`run-${k}`} className="input" value={(k === 'a' ? a : b) ?? ''} onChange={(e) => pickRun(k, e.target.value)}>
                <option value="">{runs.isPending ? '(loading the runs…)' : '(choose a run)'}</option>
                {runOptions.map((r) => <option key={r.id} value={r.id}>{runLabel(r)}</option>)}
              </select>
            </div>
          ))}
          <div>
            <label htmlFor="compare-output" className="field-label">output</label>
            <select id="compare-output" className="input w-auto" value={output} onChange={(e) => set({ output: e.target.value })}>
              {[...new Set([output, ...outputs])].map((n) => <option key={n} value={n}>{withUnit(n)}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="compare-changed" className="field-label">show</label>
            <select id="compare-changed" className="input w-auto" value={changed} onChange={(e) => set({ changed: e.target.value })}>
              <option value="yes">changed points only</option>
              <option value="any">every paired point</option>
            </select>
          </div>
        </div>
        {inputs.length > 0 && (
          <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
            <fieldset>
              <legend className="field-label">pair points by</legend>
              <div className="flex flex-wrap gap-x-4 gap-y-1">
                {inputs.map((n) => (
                  <label key={n} className="flex items-center gap-1.5 text-sm">
                    <input type="checkbox" checked={by.includes(n)} onChange={() => toggleBy(n)} />
                    <span className="font-mono">{n}</span>
                    {!(inputsA.includes(n) && inputsB.includes(n)) && <span className="text-xs text-ink-600">(only in {inputsA.includes(n) ? 'a' : 'b'})</span>}
                  </label>
                ))}
              </div>
            </fieldset>
            <div>
              <label htmlFor="compare-tolerance" className="field-label">numbers match within</label>
              <select id="compare-tolerance" className="input w-auto" value={tolerance} onChange={(e) => set({ tol: e.target.value === '0' ? '' : e.target.value })}>
                {TOLERANCES.map((t) => <option key={t.value} value={t.value}>{t.label}</option>)}
              </select>
            </div>
          </div>
        )}
      </section>

      {a === undefined || b === undefined ? (
        <Empty>Choose two runs. From a study page you can tick two runs and compare them.</Empty>
      ) : pickedError ? (
        <ErrorNote error={pickedError} title="A run could not be loaded" />
      ) : !runA.isSuccess || !runB.isSuccess ? (
        <Loading what="Loading the runs" />
      ) : by.length === 0 ? (
        <Empty>Pick at least one input to pair the points of the two runs by.</Empty>
      ) : summary.isPending ? (
        <Loading what="Pairing the points of the two runs" />
      ) : summary.isError ? (
        <ErrorNote error={summary.error} title="The runs could not be compared" />
      ) : (
        <>
          <section className="card space-y-3" aria-label="Comparison summary">
            <div className="flex flex-wrap items-start gap-x-6 gap-y-3">
              <Counts c={summary.data} />
              <div className="space-y-1.5 sm:ml-auto">
                <div className="flex flex-wrap items-center gap-2 text-xs"><Link className="link w-16" to={`/runs/${a}`}>run a #{a}</Link><ExportLinks runId={a} /></div>
                <div className="flex flex-wrap items-center gap-2 text-xs"><Link className="link w-16" to={`/runs/${b}`}>run b #{b}</Link><ExportLinks runId={b} /></div>
              </div>
            </div>
            <Verdict c={summary.data} />
          </section>

          <section className="card" aria-labelledby="compare-yaml-heading">
            <h2 id="compare-yaml-heading" className="card-title">Study files</h2>
            <YamlDiff a={summary.data.yaml?.a ?? ''} b={summary.data.yaml?.b ?? ''} />
          </section>

          {summary.data.paired > 0 && (
            <>
              <section className="card space-y-3" aria-labelledby="compare-chart-heading">
                <div className="flex flex-wrap items-end gap-3">
                  <h2 id="compare-chart-heading" className="card-title mb-0 mr-auto">Relative difference</h2>
                  <div>
                    <label htmlFor="compare-x" className="field-label">against</label>
                    <select id="compare-x" className="input w-auto" value={xName} onChange={(e) => setX(e.target.value)}>
                      {inputs.map((n) => <option key={n} value={n}>{withUnit(n)}</option>)}
                    </select>
                  </div>
                  <label className="flex items-center gap-1 pb-1.5 text-sm"><input type="checkbox" checked={xLog} onChange={(e) => setXLog(e.target.checked)} /> log x</label>
                  <button type="button" className="btn btn-small" onClick={() => save('svg')} disabled={!chartOption}>Chart as SVG</button>
                  <button type="button" className="btn btn-small" onClick={() => save('png')} disabled={!chartOption}>Chart as PNG</button>
                </div>
                {forChart.isError ? (
                  <ErrorNote error={forChart.error} title="The chart could not be drawn" />
                ) : forChart.isPending ? (
                  <Loading what="Drawing" />
                ) : chartOption && forChart.data.rows.some((r) => r.rel_diff !== null) ? (
                  <>
                    <EChart option={chartOption} height={360} label={`relative difference of ${output} against ${xName}`} />
                    {forChart.data.total > CHART_ROWS && <p className="text-xs text-ink-600">The chart shows the first {count(CHART_ROWS)} of {count(forChart.data.total)} pairs; the table pages through all of them.</p>}
                  </>
                ) : (
                  <Empty>No paired result has both values of {output} to plot.</Empty>
                )}
              </section>

              <section className="card" aria-labelledby="compare-table-heading">
                <h2 id="compare-table-heading" className="card-title">Paired points</h2>
                {compare.isPending ? (
                  <Loading what="Loading the pairs" />
                ) : compare.isError ? (
                  <ErrorNote error={compare.error} title="The pairs could not be listed" />
                ) : (
                  <DataTable
                    label="Compared points"
                    sortable={false}
                    columns={columns}
                    data={compare.data.rows}
                    busy={compare.isFetching && compare.isPlaceholderData}
                    empty={changed === 'yes' ? `No paired point changed its ${output}.` : 'No pairs.'}
                    server={{ total: compare.data.total, page, pageSize, sorting: [], onSortingChange: () => {}, onPageChange: setPage, onPageSizeChange: (n) => { setPageSize(n); setPage(1); } }}
                  />
                )}
              </section>
            </>
          )}
        </>
      )}
    </div>
  );
}
