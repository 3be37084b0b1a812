// One set of measured data: its column mapping and its rows, each header with its unit and
// temperatures in the user's °C or K (the store holds SI, converted from the CSV's own
// header units on upload).
import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { useMeasurement } from '../api/measurements.js';
import { DataTable } from '../components/DataTable.js';
import { BadAddress, ErrorNote, Loading } from '../components/States.js';
import { TemperatureUnitChoice } from '../components/TemperatureUnitChoice.js';
import { formatCount, formatNumber, formatTime } from '../lib/format.js';
import { routeId } from '../lib/route-id.js';
import { labelWithUnit } from '../lib/units.js';
import { useQuantities } from '../lib/use-quantities.js';

type Row = { values: Record<string, number> };
const col = createColumnHelper<Row>();

export function MeasurementPage() {
  const id = routeId(useParams().id);
  if (id === undefined) return <BadAddress what="measurement" />;
  return <MeasurementView key={id} id={id} />;
}

function MeasurementView({ id }: { id: number }) {
  const m = useMeasurement(id);
  // Units of every catalogue name (a measurement is mapped to names of its study's
  // configuration; the catalogue keeps one unit per name).
  const quantities = useQuantities(undefined);
  const names = useMemo(() => [...new Set((m.data?.rows ?? []).flatMap((r) => Object.keys(r.values)))], [m.data]);
  const columns = useMemo(
    () =>
      names.map((n) =>
        col.accessor((r) => r.values[n], {
          id: n,
          header: () => (
            <span className="inline-flex flex-col items-end leading-tight">
              <span className="font-mono">{n}</span>
              <span className="text-[10px] font-normal text-ink-600" data-testid="column-unit">[{quantities(n).unit}]</span>
            </span>
          ),
          meta: { numeric: true },
          cell: (c) => formatNumber(c.getValue() === undefined ? undefined : quantities(n).toDisplay(c.getValue())),
        }),
      ),
    [names, quantities],
  );
  if (m.isPending) return <Loading what="Loading measurements" />;
  if (m.isError) return <ErrorNote error={m.error} title="The measurements could not be loaded" />;
  const { measurement, rows } = m.data;
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-4">
        <div>
          {measurement.study_id !== undefined && (
            <p className="text-sm text-ink-600">
              <Link className="link" to="/studies">Studies</Link> / <Link className="link" to={`/studies/${measurement.study_id}`}>the study</Link> / measurements
            </p>
          )}
          <h1 className="text-2xl font-semibold">Measurements: {measurement.name}</h1>
          <p className="text-sm text-ink-600">{formatCount(rows.length)} rows · uploaded {formatTime(measurement.created_at)}</p>
        </div>
        <div className="ml-auto">
          <TemperatureUnitChoice />
        </div>
      </div>
      <section className="card" aria-labelledby="mapping-heading">
        <h2 id="mapping-heading" className="card-title">Column mapping</h2>
        <ul className="flex flex-wrap gap-x-6 gap-y-1 font-mono text-xs" data-testid="column-mapping">
          {Object.entries(measurement.columns).map(([csv, name]) => <li key={csv}>{csv} → {labelWithUnit(quantities(name))}</li>)}
        </ul>
        <p className="mt-2 text-xs text-ink-600">Values were converted to SI from each CSV column's unit when the file was uploaded; they show here in the units of the headers.</p>
      </section>
      <section className="card" aria-labelledby="rows-heading">
        <h2 id="rows-heading" className="card-title">Rows</h2>
        <DataTable label="Measured rows" columns={columns} data={rows} pageSize={50} empty="This measurement has no rows." />
      </section>
    </div>
  );
}
