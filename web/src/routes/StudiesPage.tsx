// The studies: search, each with its configuration, versions and last run; upload.
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { useSession } from '../api/session.js';
import { useStudies, type StudyListItem } from '../api/studies.js';
import { DataTable } from '../components/DataTable.js';
import { StatusBadge } from '../components/StatusBadge.js';
import { ErrorNote, Loading } from '../components/States.js';
import { StudyUploadForm } from '../components/StudyUploadForm.js';
import { formatTime } from '../lib/format.js';
import { can } from '../lib/roles.js';

const col = createColumnHelper<StudyListItem>();

export function StudiesPage() {
  const [q, setQ] = useState('');
  const studies = useStudies(q.trim());
  const session = useSession();
  const columns = useMemo(
    () => [
      col.accessor('name', {
        header: 'Study',
        cell: (c) => <Link className="link font-medium" to={`/studies/${c.row.original.id}`}>{c.getValue()}</Link>,
      }),
      col.accessor('title', { header: 'Title', cell: (c) => c.getValue() ?? '' }),
      col.accessor('configuration', { header: 'Configuration' }),
      col.accessor('versions', { header: 'Versions', meta: { numeric: true } }),
      col.accessor((s) => s.last_run?.started_at ?? '', {
        id: 'last_run',
        header: 'Last run',
        cell: (c) => {
          const r = c.row.original.last_run;
          return r ? <Link className="link" to={`/runs/${r.id}`}>#{r.id} · {formatTime(r.started_at)}</Link> : <span className="text-ink-400">never</span>;
        },
      }),
      col.accessor((s) => s.last_run?.status ?? '', {
        id: 'status',
        header: 'Status',
        cell: (c) => (c.row.original.last_run ? <StatusBadge status={c.row.original.last_run.status} /> : null),
      }),
      col.accessor((s) => s.last_run?.flagged_count ?? 0, {
        id: 'flagged',
        header: 'Flagged results',
        meta: { numeric: true },
        cell: (c) => (c.row.original.last_run ? `${c.getValue()} / ${c.row.original.last_run.results_count}` : ''),
      }),
    ],
    [],
  );

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end gap-4">
        <h1 className="text-2xl font-semibold">Studies</h1>
        <div className="w-80">
          <label htmlFor="study-search" className="field-label">Search by name, title or configuration</label>
          <input id="study-search" type="search" className="input" value={q} onChange={(e) => setQ(e.target.value)} placeholder="e.g. pipe, glycol" />
        </div>
      </div>
      {studies.isPending ? (
        <Loading what="Loading studies" />
      ) : studies.isError ? (
        <ErrorNote error={studies.error} title="The studies could not be loaded" />
      ) : (
        <DataTable label="Studies" columns={columns} data={studies.data.studies} busy={studies.isFetching} empty={q ? `No study matches “${q}”.` : 'No studies yet. Upload a study file, or run one with the CLI.'} />
      )}
      {can(session.data?.user.role, 'upload') && (
        <section className="card" aria-labelledby="upload-heading">
          <h2 id="upload-heading" className="card-title">New study or new version</h2>
          <StudyUploadForm />
        </section>
      )}
    </div>
  );
}
