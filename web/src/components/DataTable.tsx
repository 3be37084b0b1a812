// Every table of the dashboard: TanStack Table with sortable headers and a pager.
// Client mode sorts and pages in the browser; server mode (`server` given) only
// reports the wanted sort and page and shows what the API returned.
import { useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { Empty } from './States.js';

export interface ServerPaging {
  total: number;
  page: number;
  pageSize: number;
  sorting: SortingState;
  onSortingChange: (s: SortingState) => void;
  onPageChange: (page: number) => void;
  onPageSizeChange?: (size: number) => void;
}

interface Props<T> {
  columns: ColumnDef<T, any>[];
  data: T[];
  /** Label for screen readers and tests. */
  label: string;
  empty?: string;
  server?: ServerPaging;
  /** Client mode page size (default: everything on one page up to 100). */
  pageSize?: number;
  busy?: boolean;
  rowClassName?: (row: T) => string;
  /** Column sorting on (default) or off (for server lists that have no sort). */
  sortable?: boolean;
  /** A click on a row (outside its links and buttons) opens what the row stands for. */
  onRowClick?: (row: T) => void;
}

export function DataTable<T>({ columns, data, label, empty = 'Nothing here yet.', server, pageSize = 100, busy, rowClassName, sortable = true, onRowClick }: Props<T>) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useReactTable({
    data,
    columns,
    getCoreRowModel: getCoreRowModel(),
    enableSorting: sortable,
    ...(server
      ? {
          manualSorting: true,
          manualPagination: true,
          rowCount: server.total,
          state: { sorting: server.sorting, pagination: { pageIndex: server.page - 1, pageSize: server.pageSize } },
          onSortingChange: (u) => server.onSortingChange(typeof u === 'function' ? u(server.sorting) : u),
        }
      : {
          getSortedRowModel: getSortedRowModel(),
          getPaginationRowModel: getPaginationRowModel(),
          state: { sorting },
          onSortingChange: setSorting,
          initialState: { pagination: { pageIndex: 0, pageSize } },
        }),
  });

  // Pinned while the table scrolls sideways (narrow screens): the method column, else the first.
  const leafIds = table.getAllLeafColumns().map((c) => c.id);
  const pinned = leafIds.includes('method') ? 'method' : leafIds[0];
  const cellClass = (id: string, numeric?: boolean) => [numeric ? 'text-right' : '', id === pinned ? 'pinned' : ''].join(' ').trim() || undefined;
  const total = server ? server.total : data.length;
  const pageCount = Math.max(1, table.getPageCount());
  const pageIndex = table.getState().pagination.pageIndex;
  const goTo = (index: number) => (server ? server.onPageChange(index + 1) : table.setPageIndex(index));

  return (
    <div className="space-y-2">
      <div className={`overflow-auto rounded-md border border-ink-100 ${busy ? 'opacity-60' : ''}`}>
        <table className="data-table" aria-label={label} aria-busy={busy || undefined}>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sort = h.column.getIsSorted();
                  const meta = h.column.columnDef.meta as { numeric?: boolean } | undefined;
                  return (
                    <th key={h.id} aria-sort={sort === 'asc' ? 'ascending' : sort === 'desc' ? 'descending' : undefined} className={cellClass(h.column.id, meta?.numeric)}>
                      {h.isPlaceholder ? null : h.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 hover:text-copper-700" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden className="text-[10px] text-ink-400">{sort === 'asc' ? '▲' : sort === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                className={[rowClassName?.(row.original), onRowClick ? 'cursor-pointer' : ''].filter(Boolean).join(' ') || undefined}
                onClick={
                  onRowClick &&
                  ((e) => {
                    // Links and buttons in the row do their own thing.
                    if ((e.target as HTMLElement).closest('a, button, input, select')) return;
                    onRowClick(row.original);
                  })
                }
              >
                {row.getVisibleCells().map((cell) => {
                  const meta = cell.column.columnDef.meta as { numeric?: boolean } | undefined;
                  return (
                    <td key={cell.id} className={[meta?.numeric ? 'num' : '', cell.column.id === pinned ? 'pinned' : ''].join(' ').trim() || undefined}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
        {total === 0 && !busy && <div className="p-3"><Empty>{empty}</Empty></div>}
      </div>
      {(pageCount > 1 || server) && total > 0 && (
        <nav aria-label={`${label} pages`} className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
          <button type="button" className="btn btn-small" onClick={() => goTo(0)} disabled={pageIndex === 0}>First</button>
          <button type="button" className="btn btn-small" onClick={() => goTo(pageIndex - 1)} disabled={pageIndex === 0}>Previous</button>
          <span data-testid="page-status">
            page {pageIndex + 1} of {pageCount} · {total.toLocaleString('en')} rows
          </span>
          <button type="button" className="btn btn-small" onClick={() => goTo(pageIndex + 1)} disabled={pageIndex + 1 >= pageCount}>Next</button>
          <button type="button" className="btn btn-small" onClick={() => goTo(pageCount - 1)} disabled={pageIndex + 1 >= pageCount}>Last</button>
          {server?.onPageSizeChange && (
            <label className="ml-2 flex items-center gap-1 text-xs">
              rows per page
              <select className="input w-auto py-0.5" value={server.pageSize} onChange={(e) => server.onPageSizeChange!(Number(e.target.value))}>
                {[25, 50, 100, 250, 500].map((n) => <option key={n} value={n}>{n}</option>)}
              </select>
            </label>
          )}
        </nav>
      )}
    </div>
  );
}
