// A run's results, paged, sorted and filtered on the server.
import { useMemo } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { useResults, type ResultRowDto } from '../api/runs.js';
import type { ResultQuery } from '../lib/result-query.js';
import { formatValue } from '../lib/format.js';
import { DataTable } from './DataTable.js';
import { ErrorNote, Loading } from './States.js';

const col = createColumnHelper<ResultRowDto>();

interface Props {
  runId: number;
  query: ResultQuery;
  onQuery: (q: ResultQuery) => void;
  columns: { inputs: string[]; outputs: string[] };
  live: boolean;
}

export function ResultsTable({ runId, query, onQuery, columns, live }: Props) {
  const results = useResults(runId, query, live);
  const defs = useMemo(
    () => [
      col.accessor('point', { header: 'point', meta: { numeric: true } }),
      col.accessor('method', { header: 'method', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      ...columns.inputs.map((n) =>
        col.accessor((r) => r.inputs[n], { id: n, header: () => <span className="font-mono">{n}</span>, meta: { numeric: true }, cell: (c) => formatValue(c.getValue()) }),
      ),
      ...columns.outputs.map((n) =>
        col.accessor((r) => r.outputs[n], {
          id: n,
          header: () => <span className="font-mono text-copper-700">{n}</span>,
          meta: { numeric: true },
          cell: (c) => formatValue(c.getValue()),
        }),
      ),
      col.accessor('flags', {
        header: 'flags',
        enableSorting: false,
        cell: (c) => (
          <span className="flex flex-wrap gap-1">
            {c.getValue().map((f) => (
              <span key={f} className="rounded bg-copper-100 px-1 font-mono text-[11px] text-copper-700">{f}</span>
            ))}
          </span>
        ),
      }),
    ],
    [columns],
  );

  if (results.isPending) return <Loading what="Loading results" />;
  if (results.isError) return <ErrorNote error={results.error} title="The results could not be loaded" />;
  const page = results.data;
  return (
    <DataTable
      label="Results"
      columns={defs}
      data={page.rows}
      busy={results.isFetching && results.isPlaceholderData}
      empty="No result matches these filters."
      rowClassName={(r) => (r.flags.length ? 'bg-copper-100/25' : '')}
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
