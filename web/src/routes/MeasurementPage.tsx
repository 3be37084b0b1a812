// One set of measured data: its column mapping and its rows.
import { useMemo } from 'react';
import { useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { useMeasurement } from '../api/measurements.js';
import { DataTable } from '../components/DataTable.js';
import { ErrorNote, Loading } from '../components/States.js';
import { formatNumber, formatTime } from '../lib/format.js';

type Row = { values: Record<string, number> };
const col = createColumnHelper<Row>();

export function MeasurementPage() {
  const id = Number(useParams().id);
  const m = useMeasurement(id);
  const names = useMemo(() => [...new Set((m.data?.rows ?? []).flatMap((r) => Object.keys(r.values)))], [m.data]);
  const columns = useMemo(
    () => names.map((n) => col.accessor((r) => r.values[n], { id: n, header: () => <span className="font-mono">{n}</span>, meta: { numeric: true }, cell: (c) => formatNumber(c.getValue()) })),
    [names],
  );
  if (m.isPending) return <Loading what="Loading measurements" />;
  if (m.isError) return <ErrorNote error={m.error} title="The measurements could not be loaded" />;
  const { measurement, rows } = m.data;
  return (
    <div className="space-y-5">
      <div>
        <h1 className="text-2xl font-semibold">Measurements: {measurement.name}</h1>
        <p className="text-sm text-ink-600">{rows.length} rows · uploaded {formatTime(measurement.created_at)}</p>
      </div>
      <section className="card" aria-labelledby="mapping-heading">
        <h2 id="mapping-heading" className="card-title">Column mapping</h2>
        <ul className="flex flex-wrap gap-x-6 gap-y-1 font-mono text-xs">
          {Object.entries(measurement.columns).map(([csv, name]) => <li key={csv}>{csv} → {name}</li>)}
        </ul>
      </section>
      <section className="card" aria-labelledby="rows-heading">
        <h2 id="rows-heading" className="card-title">Rows</h2>
        <DataTable label="Measured rows" columns={columns} data={rows} pageSize={50} empty="This measurement has no rows." />
      </section>
    </div>
  );
}
