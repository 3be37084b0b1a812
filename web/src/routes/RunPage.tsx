// One run: what ran, progress while it runs, the summary per method, the chart and
// the results table (both follow the same filters), and the exports. Filters and chart
// choices belong to one run: each run id mounts a fresh view, so opening another run
// starts clean. A run opened while it runs follows its batches and refreshes at its end.
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { CAUTION } from '../../../shared/export/caution.js';
import { useCatalogue } from '../api/methods.js';
import { useMeasurements } from '../api/measurements.js';
import { active, useRefreshRunData, useRun, useSetReference } from '../api/runs.js';
import { useSession } from '../api/session.js';
import type { MethodSummary } from '../api/types.js';
import { DataTable } from '../components/DataTable.js';
import { ExportLinks } from '../components/ExportLinks.js';
import { ResultFilters, type FilterState } from '../components/ResultFilters.js';
import { ResultsTable } from '../components/ResultsTable.js';
import { ResumeButton } from '../components/ResumeButton.js';
import { RunChart } from '../components/RunChart.js';
import { RunProgress, StatusBadge } from '../components/StatusBadge.js';
import { BadAddress, ErrorNote, Loading } from '../components/States.js';
import { TemperatureUnitChoice } from '../components/TemperatureUnitChoice.js';
import { formatCount, formatDuration, formatNumber, formatTime } from '../lib/format.js';
import { defaultResultQuery, type ResultQuery } from '../lib/result-query.js';
import { can } from '../lib/roles.js';
import { routeId } from '../lib/route-id.js';
import { useQuantities } from '../lib/use-quantities.js';

const col = createColumnHelper<MethodSummary & { title?: string; uncertainty?: number }>();

function Fact({ label, children, testId }: { label: string; children: React.ReactNode; testId?: string }) {
  // Long facts wrap at spaces; they are never cut with an ellipsis.
  return (
    <div className="min-w-0">
      <dt className="text-xs text-ink-600">{label}</dt>
      <dd className="text-sm break-words" data-testid={testId}>{children}</dd>
    </div>
  );
}

export function RunPage() {
  const id = routeId(useParams().id);
  if (id === undefined) return <BadAddress what="run" />;
  return <RunView key={id} id={id} />;
}

function RunView({ id }: { id: number }) {
  const run = useRun(id);
  const session = useSession();
  const catalogue = useCatalogue();
  const setReference = useSetReference(id);
  const refreshRunData = useRefreshRunData();
  const [query, setQuery] = useState<ResultQuery>(defaultResultQuery);
  const studyId = run.data?.study_id ?? undefined;
  const measurements = useMeasurements(studyId);
  const quantities = useQuantities(run.data?.run.configuration);

  // When a run seen running ends, its table, chart and facts are read once more.
  const status = run.data?.run.status;
  const wasActive = useRef(false);
  useEffect(() => {
    if (status === undefined) return;
    if (wasActive.current && !active(status)) refreshRunData(id);
    wasActive.current = active(status);
  }, [status, id]);

  const summaryColumns = useMemo(
    () => [
      col.accessor('method', { header: 'Method', cell: (c) => <span><span className="font-mono text-xs">{c.getValue()}</span> <span className="text-ink-600">{c.row.original.title}</span></span> }),
      col.accessor('version', { header: 'v', meta: { numeric: true } }),
      col.accessor('points', { header: 'Points', meta: { numeric: true }, cell: (c) => formatCount(c.getValue()) }),
      col.accessor('flagged_points', {
        header: 'Flagged',
        meta: { numeric: true },
        cell: (c) => <span className={c.getValue() ? 'text-copper-700' : ''}>{formatCount(c.getValue())}{c.row.original.points ? ` (${formatNumber((100 * c.getValue()) / c.row.original.points, 3)} %)` : ''}</span>,
      }),
      col.accessor((s) => s.nu_min, { id: 'nu', header: 'Nusselt range [-]', meta: { numeric: true }, cell: (c) => (c.row.original.nu_name ? `${c.row.original.nu_name} ${formatNumber(c.row.original.nu_min)} … ${formatNumber(c.row.original.nu_max)}` : '—') }),
      col.accessor('uncertainty', { header: 'Stated uncertainty [%]', meta: { numeric: true }, cell: (c) => (c.getValue() !== undefined ? `±${formatNumber(c.getValue()! * 100, 3)} %` : '—') }),
    ],
    [],
  );

  if (run.isPending) return <Loading what="Loading the run" />;
  if (run.isError) return <ErrorNote error={run.error} title="The run could not be loaded" />;
  const { run: info, summary, error, columns } = run.data;
  const live = active(info.status);
  const described = summary.map((s) => {
    const m = catalogue.data?.methods.find((x) => x.configuration === info.configuration && x.id === s.method);
    return { ...s, title: m?.title, uncertainty: m?.uncertainty.fraction };
  });
  const methodIds = summary.length ? summary.map((s) => s.method) : info.methods.map((m) => m.id);
  const filters: FilterState = { methods: query.methods, flagged: query.flagged, filters: query.filters };

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-4">
        <div>
          <p className="text-sm text-ink-600">
            <Link className="link" to="/studies">Studies</Link> / {studyId ? <Link className="link" to={`/studies/${studyId}`}>{info.study}</Link> : info.study} / run #{info.id}
          </p>
          <h1 className="flex items-center gap-3 text-2xl font-semibold">
            Run #{info.id} <StatusBadge status={info.status} />
            {info.reference && <span className="rounded bg-copper-100 px-2 py-0.5 text-sm font-medium text-copper-700">reference run</span>}
          </h1>
          <p className="text-sm text-ink-600">{info.title ?? info.study} · study version v{info.study_version} · {info.configuration}</p>
        </div>
        <div className="ml-auto flex flex-col items-end gap-2">
          <ExportLinks runId={info.id} />
          <TemperatureUnitChoice />
          {can(session.data?.user.role, 'reference') && (
            <button type="button" className="btn btn-small" disabled={setReference.isPending} onClick={() => setReference.mutate(!info.reference)}>
              {info.reference ? 'Unmark as reference' : 'Mark as reference for memos'}
            </button>
          )}
          {setReference.isError && <ErrorNote error={setReference.error} />}
          <ResumeButton run={info} />
        </div>
      </div>

      <section className="card" aria-label="Run facts">
        <dl className="grid grid-cols-2 gap-3 md:grid-cols-4 xl:grid-cols-8">
          <Fact label="Progress" testId="fact-progress">{live ? <RunProgress run={info} /> : `${formatCount(info.points_done)} / ${formatCount(info.points_total)} points`}</Fact>
          <Fact label="Results" testId="fact-results">{formatCount(info.results_count)} ({formatCount(info.flagged_count)} flagged)</Fact>
          <Fact label="Started">{formatTime(info.started_at)}</Fact>
          <Fact label="Took">{formatDuration(info.started_at, info.finished_at)}</Fact>
          <Fact label="Started by">{info.started_by ?? '—'}</Fact>
          <Fact label="Host · workers">{info.host} · {info.workers}</Fact>
          <Fact label="Git commit"><span className="font-mono text-xs">{info.git_commit?.slice(0, 10) ?? '—'}</span></Fact>
          <Fact label="Study file sha256"><span className="font-mono text-xs" title={info.yaml_hash}>{info.yaml_hash.slice(0, 12)}</span></Fact>
        </dl>
        {error && <div className="mt-3"><ErrorNote error={new Error(error)} title="The run failed" /></div>}
      </section>

      <section className="card" aria-labelledby="summary-heading">
        <h2 id="summary-heading" className="card-title">Summary per method</h2>
        <DataTable label="Summary per method" columns={summaryColumns} data={described} empty={live ? 'No results yet; the run is in progress.' : 'This run has no results.'} />
      </section>

      <section className="card" aria-labelledby="filters-heading">
        <h2 id="filters-heading" className="card-title">Filters (table and chart)</h2>
        <ResultFilters value={filters} methods={methodIds} columns={columns} quantities={quantities} onApply={(f) => setQuery({ ...query, ...f, page: 1 })} />
      </section>

      <section className="card" aria-labelledby="chart-heading">
        <h2 id="chart-heading" className="card-title">Chart</h2>
        <RunChart run={info} methods={query.methods} flagged={query.flagged} filters={query.filters} measurements={measurements.data?.measurements ?? []} live={live} quantities={quantities} regime={run.data.regime ?? undefined} />
      </section>

      <section className="card" aria-labelledby="results-heading">
        <h2 id="results-heading" className="card-title">Results</h2>
        <ResultsTable run={info} query={query} onQuery={setQuery} columns={columns} live={live} quantities={quantities} />
        <p className="mt-3 text-xs text-ink-600">{CAUTION}</p>
      </section>
    </div>
  );
}
