// Measured data against the methods: bias and mean absolute deviation per method, the
// deviation at every measured point, and a parity plot (predicted against measured with
// ±10 % and ±20 % lines), exportable like the main chart.
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import type { ChartData, MeasuredRow, RunInfo } from '../api/types.js';
import { exportChart, exportTitle } from '../lib/chart-export.js';
import { formatCount, formatNumber, formatPercent } from '../lib/format.js';
import { buildParityOption } from '../lib/parity-option.js';
import { labelWithUnit, type Quantities, type Quantity } from '../lib/units.js';
import { DataTable } from './DataTable.js';
import { EChart } from './EChart.js';

const col = createColumnHelper<MeasuredRow>();
/** A value in the units shown (the header carries the unit). */
const shown = (q: Quantity, v: number | null | undefined) => (v === null || v === undefined ? '—' : formatNumber(q.toDisplay(v)));

export function MeasuredComparison({ run, data, quantities }: { run: RunInfo; data: ChartData; quantities: Quantities }) {
  const measured = data.measured!;
  const methods = Object.keys(measured.mad);
  const qx = quantities(data.x);
  const qy = quantities(data.y);
  const parity = useMemo(() => buildParityOption(measured, methods, qy), [measured, qy]);
  const columns = useMemo(
    () => [
      col.accessor('x', { header: labelWithUnit(qx), meta: { numeric: true }, cell: (c) => shown(qx, c.getValue()) }),
      col.accessor('measured', { header: `measured ${labelWithUnit(qy)}`, meta: { numeric: true }, cell: (c) => shown(qy, c.getValue()) }),
      ...methods.flatMap((m) => [
        col.accessor((r) => r.predicted[m], { id: `p-${m}`, header: `${m} ${labelWithUnit(qy)}`, meta: { numeric: true }, cell: (c) => shown(qy, c.getValue()) }),
        col.accessor((r) => r.deviation[m], { id: `d-${m}`, header: `${m} deviation [%]`, meta: { numeric: true }, cell: (c) => formatPercent(c.getValue()) }),
      ]),
    ],
    [methods.join(), qx, qy],
  );
  const save = (type: 'svg' | 'png') =>
    exportChart(buildParityOption(measured, methods, qy, exportTitle(run, `parity of ${data.y} with the measured data “${measured.name}”`)), type, `run-${run.id}-parity-${data.y}.${type}`);

  return (
    <div className="space-y-3 rounded-md border border-ink-100 p-3" data-testid="measured-comparison">
      <p className="text-xs font-semibold text-ink-600">
        {data.y} against the measured data “{measured.name}”: deviation = (predicted − measured) / measured
      </p>
      <table className="data-table w-auto" aria-label="Deviation per method" data-testid="mad">
        <thead>
          <tr><th>method</th><th className="text-right">rows</th><th className="text-right">bias [%]</th><th className="text-right">mean absolute deviation [%]</th></tr>
        </thead>
        <tbody>
          {methods.map((m) => (
            <tr key={m}>
              <td className="font-mono text-xs">{m}</td>
              <td className="num">{formatCount(measured.rows.filter((r) => Number.isFinite(r.deviation[m])).length)}</td>
              <td className="num">{formatPercent(measured.bias[m])}</td>
              <td className="num">{formatPercent(measured.mad[m]).replace('+', '')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {methods.length === 0 && <p className="text-sm text-copper-700">No measured row could be placed in this sweep: each row needs every swept input.</p>}
      {measured.unplaced > 0 && <p className="text-xs text-ink-600">{formatCount(measured.unplaced)} measured rows could not be placed (a swept input missing, or inputs outside what the methods accept).</p>}
      {methods.length > 0 && (
        <>
          <div className="flex items-center gap-2">
            <p className="text-xs font-semibold text-ink-600">Parity plot</p>
            <div className="ml-auto flex gap-1.5">
              <button type="button" className="btn btn-small" onClick={() => save('svg')}>Parity plot as SVG</button>
              <button type="button" className="btn btn-small" onClick={() => save('png')}>Parity plot as PNG</button>
            </div>
          </div>
          <EChart option={parity} height={380} label={`predicted against measured ${data.y}`} testId="parity-chart" />
          <DataTable label="Deviation at each measured point" columns={columns} data={measured.rows} pageSize={25} />
        </>
      )}
    </div>
  );
}
