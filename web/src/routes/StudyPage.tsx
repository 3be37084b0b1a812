// One study: its versions (YAML), its runs (pick two to compare), a new version,
// and its measured data.
import { useMemo, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { usePickedRun } from '../api/compare.js';
import { useCatalogue } from '../api/methods.js';
import { useMeasurements, type Measurement } from '../api/measurements.js';
import { useSession } from '../api/session.js';
import { useStudy } from '../api/studies.js';
import type { RunInfo } from '../api/types.js';
import { DataTable } from '../components/DataTable.js';
import { MeasurementUploadForm } from '../components/MeasurementUploadForm.js';
import { RunProgress, StatusBadge } from '../components/StatusBadge.js';
import { BadAddress, Empty, ErrorNote, Loading } from '../components/States.js';
import { StudyUploadForm } from '../components/StudyUploadForm.js';
import { formatDuration, formatTime } from '../lib/format.js';
import { can } from '../lib/roles.js';
import { routeId } from '../lib/route-id.js';

const runCol = createColumnHelper<RunInfo>();
const mCol = createColumnHelper<Measurement>();

export function StudyPage() {
  const id = routeId(useParams().id);
  if (id === undefined) return <BadAddress what="study" />;
  return <StudyView key={id} id={id} />;
}

function StudyView({ id }: { id: number }) {
  const study = useStudy(id);
  const session = useSession();
  const measurements = useMeasurements(id);
  const catalogue = useCatalogue();
  const navigate = useNavigate();
  const [versionId, setVersionId] = useState<number | null>(null);
  const [picked, setPicked] = useState<number[]>([]);
  const latestRun = study.data?.runs[0];
  const latest = usePickedRun(latestRun?.id);
  const role = session.data?.user.role;

  const togglePick = (runId: number) =>
    setPicked((p) => (p.includes(runId) ? p.filter((x) => x !== runId) : [...p, runId].slice(-2)));

  const runColumns = useMemo(
    () => [
      runCol.display({
        id: 'pick',
        header: 'Compare',
        cell: (c) => (
          <input type="checkbox" aria-label={`pick run ${c.row.original.id} for comparison`} checked={picked.includes(c.row.original.id)} onChange={() => togglePick(c.row.original.id)} />
        ),
      }),
      runCol.accessor('id', { header: 'Run', cell: (c) => <Link className="link font-medium" to={`/runs/${c.getValue()}`}>#{c.getValue()}</Link> }),
      runCol.accessor('study_version', { header: 'Version', cell: (c) => `v${c.getValue()}` }),
      runCol.accessor('status', {
        header: 'Status',
        cell: (c) => (
          <div className="flex items-center gap-2">
            <StatusBadge status={c.getValue()} />
            {(c.getValue() === 'running' || c.getValue() === 'queued') && <RunProgress run={c.row.original} />}
            {c.row.original.reference && <span className="rounded bg-copper-100 px-1 text-xs text-copper-700">reference</span>}
          </div>
        ),
      }),
      runCol.accessor('started_at', { header: 'Started', cell: (c) => formatTime(c.getValue()) }),
      runCol.accessor((r) => formatDuration(r.started_at, r.finished_at), { id: 'duration', header: 'Took', enableSorting: false }),
      runCol.accessor('started_by', { header: 'By', cell: (c) => c.getValue() ?? c.row.original.host }),
      runCol.accessor('results_count', { header: 'Results', meta: { numeric: true } }),
      runCol.accessor('flagged_count', { header: 'Flagged', meta: { numeric: true } }),
    ],
    [picked],
  );

  const mColumns = useMemo(
    () => [
      mCol.accessor('name', { header: 'Name', cell: (c) => <Link className="link" to={`/measurements/${c.row.original.id}`}>{c.getValue()}</Link> }),
      mCol.accessor('rows', { header: 'Rows', meta: { numeric: true } }),
      mCol.accessor((m) => Object.entries(m.columns).map(([k, v]) => `${k} → ${v}`).join(', '), { id: 'columns', header: 'Columns' }),
      mCol.accessor('created_at', { header: 'Uploaded', cell: (c) => formatTime(c.getValue()) }),
    ],
    [],
  );

  if (study.isPending) return <Loading what="Loading the study" />;
  if (study.isError) return <ErrorNote error={study.error} title="The study could not be loaded" />;
  const { versions, runs } = study.data;
  const info = study.data.study;
  const shown = versions.find((v) => v.id === versionId) ?? versions[versions.length - 1] ?? versions[0];
  const configuration = info.configuration ?? latestRun?.configuration;
  const methods = catalogue.data?.methods.filter((m) => m.configuration === configuration) ?? [];
  const names = {
    inputs: [...new Set([...(latest.data?.columns.inputs ?? []), ...methods.flatMap((m) => m.inputs.map((i) => i.name))])].sort(),
    outputs: [...new Set([...(latest.data?.columns.outputs ?? []), ...methods.flatMap((m) => m.outputs.map((o) => o.name))])].sort(),
  };

  return (
    <div className="space-y-5">
      <div>
        <p className="text-sm text-ink-600"><Link className="link" to="/studies">Studies</Link> / {info.name}</p>
        <h1 className="text-2xl font-semibold">{info.title ?? info.name}</h1>
        <p className="text-sm text-ink-600">
          <span className="font-mono">{info.name}</span> · configuration <span className="font-mono">{configuration ?? '—'}</span> · {versions.length} version{versions.length === 1 ? '' : 's'}
        </p>
      </div>

      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)]">
        <section className="card min-w-0" aria-labelledby="yaml-heading">
          <div className="mb-2 flex flex-wrap items-center gap-3">
            <h2 id="yaml-heading" className="card-title mb-0">Study file</h2>
            {versions.length > 0 && (
              <label className="ml-auto flex min-w-0 max-w-full items-center gap-2 text-xs text-ink-600">
                version
                <select className="input w-auto min-w-0 py-0.5" value={shown?.id ?? ''} onChange={(e) => setVersionId(Number(e.target.value))}>
                  {versions.map((v) => (
                    <option key={v.id} value={v.id}>v{v.version} · {formatTime(v.created_at)} · {v.hash.slice(0, 8)}</option>
                  ))}
                </select>
              </label>
            )}
          </div>
          {shown ? (
            <pre className="max-h-[520px] overflow-auto rounded bg-ink-50 p-3 font-mono text-xs leading-relaxed" data-testid="study-yaml">
              {shown.yaml.split('\n').map((line, i) => (
                <div key={i}><span className="mr-3 inline-block w-6 select-none text-right text-ink-400">{i + 1}</span>{line}</div>
              ))}
            </pre>
          ) : (
            <Empty>No stored version.</Empty>
          )}
        </section>

        <section className="card min-w-0" aria-labelledby="runs-heading">
          <div className="mb-2 flex flex-wrap items-center gap-3">
            <h2 id="runs-heading" className="card-title mb-0">Runs</h2>
            <button type="button" className="btn btn-small ml-auto" disabled={picked.length !== 2} onClick={() => navigate(`/compare?a=${Math.min(...picked)}&b=${Math.max(...picked)}`)}>
              Compare the two picked runs
            </button>
          </div>
          <DataTable label="Runs" columns={runColumns} data={runs} empty="This study has not been run yet." pageSize={15} />
        </section>
      </div>

      {can(role, 'upload') && (
        <section className="card" aria-labelledby="version-heading">
          <h2 id="version-heading" className="card-title">New version</h2>
          <StudyUploadForm label="Upload a new version of this study" />
        </section>
      )}

      <section className="card space-y-3" aria-labelledby="measurements-heading">
        <h2 id="measurements-heading" className="card-title">Measurements</h2>
        {measurements.isPending ? (
          <Loading what="Loading measurements" />
        ) : measurements.isError ? (
          <ErrorNote error={measurements.error} />
        ) : (
          <DataTable label="Measurements" columns={mColumns} data={measurements.data.measurements} empty="No measured data for this study." />
        )}
        {can(role, 'upload') && <MeasurementUploadForm studyId={id} names={names} />}
      </section>
    </div>
  );
}
