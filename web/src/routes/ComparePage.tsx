// Two runs side by side: points whose output changed, the relative differences, a
// chart of them against an input, and both runs' exports.
import { useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { CAUTION } from '../../../shared/export/caution.js';
import { useCompare, type CompareRow } from '../api/compare.js';
import { useRun, useRuns } from '../api/runs.js';
import type { RunInfo } from '../api/types.js';
import { DataTable } from '../components/DataTable.js';
import { EChart } from '../components/EChart.js';
import { ExportLinks } from '../components/ExportLinks.js';
import { Empty, ErrorNote, Loading } from '../components/States.js';
import { exportChart } from '../lib/chart-export.js';
import { buildCompareOption } from '../lib/compare-chart.js';
import { formatNumber, formatPercent, formatTime, formatValue } from '../lib/format.js';

const col = createColumnHelper<CompareRow>();
const runLabel = (r: RunInfo) => `#${r.id} · ${r.study} v${r.study_version} · ${r.status} · ${formatTime(r.started_at)}`;
const CHART_ROWS = 500;

export function ComparePage() {
  const [params, setParams] = useSearchParams();
  const a = Number(params.get('a')) || 0;
  const b = Number(params.get('b')) || 0;
  const output = params.get('output') ?? 'Nu';
  const changed = (params.get('changed') ?? 'yes') as 'yes' | 'any';
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(50);
  const [x, setX] = useState('');
  const [xLog, setXLog] = useState(true);
  const runs = useRuns();
  const runA = useRun(a || -1);
  const runB = useRun(b || -1);
  const ready = a > 0 && b > 0;
  const compare = useCompare(ready ? { a, b, output, page, pageSize, changed } : null);
  const forChart = useCompare(ready ? { a, b, output, page: 1, pageSize: CHART_ROWS, changed: 'any' } : null);

  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
    setPage(1);
  };

  const inputs = [...new Set([...(runA.data?.columns.inputs ?? []), ...(runB.data?.columns.inputs ?? [])])];
  const outputs = [...new Set([...(runA.data?.columns.outputs ?? []), ...(runB.data?.columns.outputs ?? [])])];
  const xName = x || inputs.find((n) => n === 'Re' || n === 'Ra') || inputs[0] || '';
  const columns = useMemo(
    () => [
      col.accessor('method', { header: 'method', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      ...inputs.map((n) => col.accessor((r) => r.inputs[n], { id: n, header: () => <span className="font-mono">{n}</span>, meta: { numeric: true }, cell: (c) => formatValue(c.getValue()) })),
      col.accessor('a', { header: `run a: ${output}`, meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), 6) }),
      col.accessor('b', { header: `run b: ${output}`, meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), 6) }),
      col.accessor('rel_diff', {
        header: '(b − a)/|a|',
        meta: { numeric: true },
        cell: (c) => <span className={c.getValue() ? 'text-copper-700' : 'text-ink-400'}>{formatPercent(c.getValue())}</span>,
      }),
    ],
    [inputs.join(','), output],
  );
  const chartOption = useMemo(() => (forChart.data && xName ? buildCompareOption(forChart.data.rows, xName, output, { xLog }) : null), [forChart.data, xName, output, xLog]);

  const save = (type: 'svg' | 'png') => {
    if (!forChart.data) return;
    const { a: ra, b: rb } = forChart.data;
    const option = buildCompareOption(forChart.data.rows, xName, output, {
      xLog,
      title: {
        text: `Change of ${output} between run #${ra.id} and run #${rb.id}`,
        subtext: `a: run #${ra.id}, ${ra.study} v${ra.study_version} · b: run #${rb.id}, ${rb.study} v${rb.study_version}`,
        footer: CAUTION,
      },
    });
    exportChart(option, type, `compare-${ra.id}-${rb.id}-${output}.${type}`);
  };

  const runOptions = runs.data?.runs ?? [];
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">Compare two runs</h1>
      <section className="card" aria-label="Runs to compare">
        {runs.isError && <ErrorNote error={runs.error} title="The runs could not be listed" />}
        <div className="flex flex-wrap items-end gap-3">
          {(['a', 'b'] as const).map((k) => (
            <div key={k}>
              <label htmlFor={`run-${k}`} className="field-label">run {k}</label>
              <select id={`run-${k}`} className="input w-96" value={k === 'a' ? a || '' : b || ''} onChange={(e) => set(k, e.target.value)}>
                <option value="">(choose a run)</option>
                {runOptions.map((r) => <option key={r.id} value={r.id}>{runLabel(r)}</option>)}
              </select>
            </div>
          ))}
          <div>
            <label htmlFor="compare-output" className="field-label">output</label>
            <select id="compare-output" className="input w-auto" value={output} onChange={(e) => set('output', e.target.value)}>
              {[...new Set([output, ...outputs])].map((n) => <option key={n} value={n}>{n}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="compare-changed" className="field-label">show</label>
            <select id="compare-changed" className="input w-auto" value={changed} onChange={(e) => set('changed', e.target.value)}>
              <option value="yes">changed points only</option>
              <option value="any">every paired point</option>
            </select>
          </div>
        </div>
      </section>

      {!ready ? (
        <Empty>Choose two runs. From a study page you can tick two runs and compare them.</Empty>
      ) : compare.isPending ? (
        <Loading what="Comparing" />
      ) : compare.isError ? (
        <ErrorNote error={compare.error} title="The runs could not be compared" />
      ) : (
        <>
          <section className="card" aria-label="Comparison summary">
            <div className="flex flex-wrap items-start gap-6">
              <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-4" data-testid="compare-counts">
                <dt className="text-ink-600">{changed === 'yes' ? 'listed (changed)' : 'paired points'}</dt><dd className="font-mono">{compare.data.total}</dd>
                <dt className="text-ink-600">changed</dt><dd className="font-mono">{compare.data.changed}</dd>
                <dt className="text-ink-600">only in a</dt><dd className="font-mono">{compare.data.only_a}</dd>
                <dt className="text-ink-600">only in b</dt><dd className="font-mono">{compare.data.only_b}</dd>
              </dl>
              <div className="ml-auto space-y-1.5">
                <div className="flex items-center gap-2 text-xs"><Link className="link w-16" to={`/runs/${a}`}>run a #{a}</Link><ExportLinks runId={a} /></div>
                <div className="flex items-center gap-2 text-xs"><Link className="link w-16" to={`/runs/${b}`}>run b #{b}</Link><ExportLinks runId={b} /></div>
              </div>
            </div>
          </section>

          <section className="card space-y-3" aria-labelledby="compare-chart-heading">
            <div className="flex flex-wrap items-end gap-3">
              <h2 id="compare-chart-heading" className="card-title mb-0 mr-auto">Relative difference</h2>
              <div>
                <label htmlFor="compare-x" className="field-label">against</label>
                <select id="compare-x" className="input w-auto" value={xName} onChange={(e) => setX(e.target.value)}>
                  {inputs.map((n) => <option key={n} value={n}>{n}</option>)}
                </select>
              </div>
              <label className="flex items-center gap-1 pb-1.5 text-sm"><input type="checkbox" checked={xLog} onChange={(e) => setXLog(e.target.checked)} /> log x</label>
              <button type="button" className="btn btn-small" onClick={() => save('svg')} disabled={!chartOption}>Chart as SVG</button>
              <button type="button" className="btn btn-small" onClick={() => save('png')} disabled={!chartOption}>Chart as PNG</button>
            </div>
            {forChart.isError ? <ErrorNote error={forChart.error} /> : chartOption && forChart.data!.rows.length > 0 ? (
              <>
                <EChart option={chartOption} height={360} label={`relative difference of ${output} against ${xName}`} />
                {forChart.data!.total > CHART_ROWS && <p className="text-xs text-ink-600">The chart shows the first {CHART_ROWS} of {forChart.data!.total} pairs; the table pages through all of them.</p>}
              </>
            ) : forChart.isPending ? <Loading what="Drawing" /> : <Empty>No paired points to plot.</Empty>}
          </section>

          <section className="card" aria-labelledby="compare-table-heading">
            <h2 id="compare-table-heading" className="card-title">Paired points</h2>
            <DataTable
              label="Compared points"
              sortable={false}
              columns={columns}
              data={compare.data.rows}
              busy={compare.isFetching && compare.isPlaceholderData}
              empty={changed === 'yes' ? `No point changed its ${output}.` : 'The runs share no point.'}
              server={{ total: compare.data.total, page, pageSize, sorting: [], onSortingChange: () => {}, onPageChange: setPage, onPageSizeChange: (n) => { setPageSize(n); setPage(1); } }}
            />
          </section>
        </>
      )}
    </div>
  );
}
