// A run's results, paged, sorted and filtered on the server. Headers carry units, values
// are shown in the user's units, and each flag says what broke there (`Re 5,000 > 2,300`).
// A row (or its point number) opens the point view: every method at that point.
import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { describeFlag } from '../../../shared/chart/flags.js';
import { useCatalogue } from '../api/methods.js';
import { useResults, type ResultRowDto } from '../api/runs.js';
import type { RunInfo } from '../api/types.js';
import { flagText } from '../lib/flag-text.js';
import { formatValue } from '../lib/format.js';
import type { ResultQuery } from '../lib/result-query.js';
import type { Quantities } from '../lib/units.js';
import { DataTable } from './DataTable.js';
import { ErrorNote, Loading } from './States.js';

const col = createColumnHelper<ResultRowDto>();

interface Props {
  run: RunInfo;
  query: ResultQuery;
  onQuery: (q: ResultQuery) => void;
  columns: { inputs: string[]; outputs: string[] };
  live: boolean;
  quantities: Quantities;
}

function Header({ name, output, quantities }: { name: string; output?: boolean; quantities: Quantities }) {
  return (
    <span className="inline-flex flex-col items-end leading-tight">
      <span className={`font-mono ${output ? 'text-copper-700' : ''}`}>{name}</span>
      <span className="text-[10px] font-normal text-ink-600" data-testid="column-unit">[{quantities(name).unit}]</span>
    </span>
  );
}

export function ResultsTable({ run, query, onQuery, columns, live, quantities }: Props) {
  const results = useResults(run.id, query, live);
  const navigate = useNavigate();
  const pointPath = (point: number) => `/runs/${run.id}/points/${point}`;
  const catalogue = useCatalogue();
  const defs = useMemo(() => {
    const shown = (name: string) => (v: unknown) => formatValue(typeof v === 'number' ? quantities(name).toDisplay(v) : v);
    const ranges = (method: string) => catalogue.data?.methods.find((m) => m.configuration === run.configuration && m.id === method)?.ranges;
    return [
      col.accessor('point', {
        header: 'point',
        meta: { numeric: true },
        cell: (c) => <Link className="link" to={pointPath(c.getValue())} title={`Every method at point ${c.getValue()}`}>{c.getValue()}</Link>,
      }),
      col.accessor('method', { header: 'method', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      // An output wins over an input of the same name, as in the API.
      ...columns.inputs.filter((n) => !columns.outputs.includes(n)).map((n) =>
        col.accessor((r) => r.inputs[n], { id: n, header: () => <Header name={n} quantities={quantities} />, meta: { numeric: true }, cell: (c) => shown(n)(c.getValue()) }),
      ),
      ...columns.outputs.map((n) =>
        col.accessor((r) => r.outputs[n] ?? r.inputs[n], { id: n, header: () => <Header name={n} output quantities={quantities} />, meta: { numeric: true }, cell: (c) => shown(n)(c.getValue()) }),
      ),
      col.accessor('flags', {
        header: 'flags',
        enableSorting: false,
        cell: (c) => (
          <span className="flex flex-wrap gap-1">
            {c.getValue().map((f) => (
              <span key={f} title={f} className="rounded bg-copper-100 px-1 font-mono text-[11px] text-copper-700" data-testid="flag">
                {flagText(describeFlag(f, { ...c.row.original.inputs, ...c.row.original.outputs }, ranges(c.row.original.method)), quantities)}
              </span>
            ))}
          </span>
        ),
      }),
    ];
  }, [columns, quantities, catalogue.data, run.configuration, run.id]);

  if (results.isPending) return <Loading what="Loading results" />;
  if (results.isError) return <ErrorNote error={results.error} title="The results could not be loaded" />;
  const page = results.data;
  return (
    <DataTable
      label="Results"
      columns={defs}
      data={page.rows}
      busy={results.isFetching && results.isPlaceholderData}
      empty={live ? 'No result matches yet; the run is still writing.' : 'No result matches these filters.'}
      rowClassName={(r) => (r.flags.length ? 'bg-copper-100/25' : '')}
      onRowClick={(r) => navigate(pointPath(r.point))}
      server={{
        total: page.total,
        page: query.page,
        pageSize: query.pageSize,
        sorting: query.sort ? [{ id: query.sort, desc: query.order === 'desc' }] : [],
        onSortingChange: (s) => onQuery({ ...query, page: 1, sort: s[0]?.id, order: s[0]?.desc ? 'desc' : 'asc' }),
        onPageChange: (p) => onQuery({ ...query, page: p }),
        onPageSizeChange: (size) => onQuery({ ...query, page: 1, pageSize: size }),
      }}
    />
  );
}
