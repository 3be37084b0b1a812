// One point of a run, every method there (/runs/:id/points/:point, opened from a chart
// point or a results row, or linked): the design answer first (the recommended method and
// why, the applicable methods and their spread, or that none applies), then each method's
// headline value with its band, range flags and stated uncertainty, then every output
// side by side. Units and the °C/K choice as on the run page; the API stays SI.
import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { describeFlag } from '../../../shared/chart/flags.js';
import { useCatalogue } from '../api/methods.js';
import { usePoint, type PointRow, type PointView } from '../api/points.js';
import { DataTable } from '../components/DataTable.js';
import { StatusBadge } from '../components/StatusBadge.js';
import { Empty, ErrorNote, Loading } from '../components/States.js';
import { TemperatureUnitChoice } from '../components/TemperatureUnitChoice.js';
import { flagText } from '../lib/flag-text.js';
import { formatCount, formatNumber, formatValue } from '../lib/format.js';
import { bandReach, formatInterval, headlineName, outputLines, type OutputLine } from '../lib/point-view.js';
import { routeId, routeIndex } from '../lib/route-id.js';
import { formatQuantity, labelWithUnit, type Quantities } from '../lib/units.js';
import { useQuantities } from '../lib/use-quantities.js';

export function PointPage() {
  const params = useParams();
  const id = routeId(params.id);
  const point = routeIndex(params.point);
  if (id === undefined || point === undefined) return <Empty>No such point: an address reads /runs/&lt;run&gt;/points/&lt;index from 0&gt;. <Link className="link" to="/studies">Back to the studies</Link></Empty>;
  return <PointBody key={`${id}/${point}`} id={id} point={point} />;
}

function PointBody({ id, point }: { id: number; point: number }) {
  const view = usePoint(id, point);
  const quantities = useQuantities(view.data?.run.configuration);
  if (view.isPending) return <Loading what="Loading the point" />;
  if (view.isError) return <ErrorNote error={view.error} title={`Point ${point} of run #${id} could not be loaded`} />;
  return <PointContent view={view.data} quantities={quantities} />;
}

function PointContent({ view, quantities }: { view: PointView; quantities: Quantities }) {
  const { run, point, summary, target } = view;
  const catalogue = useCatalogue();
  const methodInfo = (method: string) => catalogue.data?.methods.find((m) => m.configuration === run.configuration && m.id === method);
  const headline = headlineName(view.rows, summary.spread_of, target?.adjust);
  const lines = useMemo(() => outputLines(view.rows, headline ? [headline] : []), [view.rows, headline]);
  const values = (row: PointRow) => ({ ...view.inputs, ...row.inputs, ...row.outputs });

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-4">
        <div>
          <p className="text-sm text-ink-600">
            <Link className="link" to="/studies">Studies</Link> / {run.study} / <Link className="link" to={`/runs/${run.id}`}>run #{run.id}</Link> / point {point}
          </p>
          <h1 className="flex items-center gap-3 text-2xl font-semibold">
            Point {point} of run #{run.id} <StatusBadge status={run.status} />
          </h1>
          <p className="text-sm text-ink-600">{run.title ?? run.study} · {run.configuration} · point {formatCount(point + 1)} of {formatCount(run.points_total)}</p>
        </div>
        <div className="ml-auto flex flex-col items-end gap-2">
          <nav aria-label="Neighbouring points" className="flex gap-1.5">
            {point > 0 ? <Link className="btn btn-small" to={`/runs/${run.id}/points/${point - 1}`}>← point {point - 1}</Link> : <span className="btn btn-small opacity-50" aria-disabled>← first point</span>}
            {point + 1 < run.points_total ? <Link className="btn btn-small" to={`/runs/${run.id}/points/${point + 1}`}>point {point + 1} →</Link> : <span className="btn btn-small opacity-50" aria-disabled>last point →</span>}
          </nav>
          <TemperatureUnitChoice />
        </div>
      </div>

      <section className="card space-y-2" aria-labelledby="answer-heading" data-testid="point-answer">
        <h2 id="answer-heading" className="card-title">Which method to use here</h2>
        {summary.recommended ? (
          <>
            <p className="text-base" data-testid="recommended">
              Recommended: <span className="font-mono font-semibold">{summary.recommended}</span> <span className="text-ink-600">{methodInfo(summary.recommended)?.title}</span>
            </p>
            <p className="text-sm" data-testid="recommended-reason">{cap(summary.reason)}.</p>
            <p className="text-sm" data-testid="spread">
              {summary.spread !== null && summary.spread_of
                ? <>Spread between the {summary.applicable.length} applicable methods: <strong>{formatNumber(summary.spread * 100, 3)} %</strong> of {labelWithUnit(quantities(summary.spread_of))} (largest / smallest − 1).</>
                : summary.applicable.length === 1
                  ? 'One method applies here, so there is no spread between methods.'
                  : 'No spread: the applicable methods give no comparable value.'}
            </p>
          </>
        ) : (
          <div className="rounded-[3px] border-l-[3px] border-ember-500 bg-ember-100 px-3 py-2 text-sm" data-testid="no-applicable-method">
            <strong className="font-mono">{summary.flags.join(', ') || 'no-applicable-method'}</strong>: {summary.reason}. Any value below lies outside the ranges its source was fitted on: an extrapolation, not an answer.
          </div>
        )}
        {target && <TargetLine target={target} quantities={quantities} />}
        {view.summary_source === 'computed' && <p className="text-xs text-ink-600">This run was stored without per-point summaries; the summary was worked out now from its rows, over Nu.</p>}
      </section>

      <section className="card" aria-labelledby="inputs-heading">
        <h2 id="inputs-heading" className="card-title">Inputs at this point</h2>
        <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-2 lg:grid-cols-4" data-testid="point-inputs">
          {Object.entries(view.inputs).map(([name, v]) => (
            <div key={name} className="min-w-0">
              <dt className="font-mono text-xs text-ink-600">{labelWithUnit(quantities(name))}</dt>
              <dd className="font-mono text-sm">{typeof v === 'number' ? formatNumber(quantities(name).toDisplay(v)) : formatValue(v)}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section className="card" aria-labelledby="methods-heading">
        <h2 id="methods-heading" className="card-title">Every method here{headline ? `: ${headline}` : ''}</h2>
        <MethodsTable view={view} headline={headline} quantities={quantities} title={(m) => methodInfo(m)?.title} describe={(row) => row.flags.map((f) => flagText(describeFlag(f, values(row), methodInfo(row.method)?.ranges), quantities))} />
      </section>

      <section className="card" aria-labelledby="outputs-heading">
        <h2 id="outputs-heading" className="card-title">Every output, method by method</h2>
        <OutputsTable lines={lines} methods={view.rows.map((r) => r.method)} quantities={quantities} />
        <p className="mt-3 text-xs text-ink-600">
          Bands (95 %) are the 2.5 % and 97.5 % points of an output, from the method's stated uncertainty and the study's input tolerances; “reachable” is an output's range over a target's search interval.
        </p>
      </section>
    </div>
  );
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function TargetLine({ target, quantities }: { target: NonNullable<PointView['target']>; quantities: Quantities }) {
  return (
    <p className="text-sm text-ink-700" data-testid="point-target">
      Target: {target.output} = {formatQuantity(quantities(target.output), target.value)}, met by solving {target.adjust} within {formatInterval(quantities(target.adjust), target.within[0], target.within[1])} for each method.
    </p>
  );
}

interface MethodLine {
  row: PointRow;
  title?: string;
  flags: string[];
}
const methodCol = createColumnHelper<MethodLine>();

function MethodsTable({ view, headline, quantities, title, describe }: { view: PointView; headline?: string; quantities: Quantities; title: (m: string) => string | undefined; describe: (r: PointRow) => string[] }) {
  const data = view.rows.map((row) => ({ row, title: title(row.method), flags: describe(row) }));
  const applicable = new Set(view.summary.applicable);
  const target = view.target;
  const columns = [
    methodCol.accessor((l) => l.row.method, {
      id: 'method',
      header: 'method',
      cell: (c) => (
        <span className="whitespace-normal">
          <span className="font-mono text-xs">{c.getValue()}</span> <span className="text-xs text-ink-600">{c.row.original.title}</span>
        </span>
      ),
    }),
    methodCol.accessor((l) => l.row.method, {
      id: 'verdict',
      header: 'here',
      cell: (c) =>
        c.row.original.row.recommended ? (
          <span className="rounded-[3px] bg-moss-100 px-1.5 py-0.5 text-xs font-semibold text-moss-700" data-testid="recommended-badge">recommended</span>
        ) : applicable.has(c.getValue()) ? (
          <span className="text-xs text-ink-700">applicable</span>
        ) : c.row.original.row.flags.includes('target-not-reached') ? (
          <span className="text-xs text-copper-700">no answer in the search interval</span>
        ) : (
          <span className="text-xs text-copper-700">outside its ranges</span>
        ),
    }),
    methodCol.accessor((l) => l.row.uncertainty?.fraction, {
      id: 'uncertainty',
      header: 'stated uncertainty [%]',
      meta: { numeric: true },
      cell: (c) => (c.getValue() === undefined ? '—' : `±${formatNumber(c.getValue()! * 100, 3)} %`),
    }),
    ...(headline
      ? [
          methodCol.accessor((l) => l.row.outputs[headline], {
            id: 'headline',
            header: () => <span className="font-mono">{labelWithUnit(quantities(headline))}</span>,
            meta: { numeric: true },
            cell: (c) => <HeadlineCell row={c.row.original.row} name={headline} quantities={quantities} target={target} />,
          }),
        ]
      : []),
    methodCol.accessor((l) => l.flags, {
      id: 'flags',
      header: 'flags: what broke',
      enableSorting: false,
      cell: (c) =>
        c.getValue().length ? (
          <span className="flex flex-wrap gap-1">
            {c.getValue().map((text, i) => (
              <span key={i} title={c.row.original.row.flags[i]} className="rounded bg-copper-100 px-1 font-mono text-[11px] text-copper-700" data-testid="flag">{text}</span>
            ))}
          </span>
        ) : (
          <span className="text-xs text-ink-400">none</span>
        ),
    }),
  ];
  return <DataTable label="Methods at this point" columns={columns} data={data} sortable={false} rowClassName={(l) => (l.row.recommended ? 'bg-moss-100/40' : '')} />;
}

/** The headline value with its band, or, where the target was not reached, what was reachable. */
function HeadlineCell({ row, name, quantities, target }: { row: PointRow; name: string; quantities: Quantities; target?: PointView['target'] }) {
  const q = quantities(name);
  const v = row.outputs[name];
  const low = row.outputs[`${name}_low`];
  const high = row.outputs[`${name}_high`];
  if (v === undefined && target && row.flags.includes('target-not-reached')) {
    const out = quantities(target.output);
    return (
      <span className="inline-flex flex-col items-end whitespace-normal text-right" data-testid="not-reached">
        <span className="font-sans text-copper-700">target not reached</span>
        <span className="text-[11px] text-ink-600">
          {target.output} {formatInterval(out, row.outputs[`${target.output}_min`], row.outputs[`${target.output}_max`])} over {target.adjust} {formatInterval(q, target.within[0], target.within[1])}
        </span>
      </span>
    );
  }
  return (
    <span className="inline-flex flex-col items-end" data-testid="headline-value">
      <span>{formatQuantity(q, v ?? null)}</span>
      {(low !== undefined || high !== undefined) && (
        <span className="text-[11px] text-ink-600" data-testid="band">
          95 %: {formatInterval(q, low, high)}
          {bandReach(q, { value: v, low, high }) ? ` (${bandReach(q, { value: v, low, high })})` : ''}
        </span>
      )}
    </span>
  );
}

const outputCol = createColumnHelper<OutputLine>();

function OutputsTable({ lines, methods, quantities }: { lines: OutputLine[]; methods: string[]; quantities: Quantities }) {
  const columns = [
    outputCol.accessor('name', { id: 'output', header: 'output', cell: (c) => <span className="font-mono text-xs">{labelWithUnit(quantities(c.getValue()))}</span> }),
    ...methods.map((m) =>
      outputCol.accessor((l) => l.cells[m]?.value, {
        id: `m:${m}`,
        header: () => <span className="font-mono">{m}</span>,
        meta: { numeric: true },
        cell: (c) => {
          const cell = c.row.original.cells[m];
          const q = quantities(c.row.original.name);
          if (!cell) return <span className="text-ink-400">—</span>;
          return (
            <span className="inline-flex flex-col items-end">
              <span>{cell.value === undefined ? '—' : formatNumber(q.toDisplay(cell.value))}</span>
              {(cell.low !== undefined || cell.high !== undefined) && <span className="text-[11px] text-ink-600">95 %: {formatInterval(q, cell.low, cell.high, false)}</span>}
              {(cell.min !== undefined || cell.max !== undefined) && <span className="text-[11px] text-copper-700">reachable: {formatInterval(q, cell.min, cell.max, false)}</span>}
            </span>
          );
        },
      }),
    ),
  ];
  return <DataTable label="Outputs at this point" columns={columns} data={lines} sortable={false} pageSize={500} />;
}
