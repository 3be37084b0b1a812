// Comparison of two runs: GET /api/compare, and the runs picked for it.
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { RunResponse } from './runs.js';
import type { CompareRow, RunInfo } from './types.js';
export type { CompareRow } from './types.js';

export interface CompareResponse {
  a: RunInfo;
  b: RunInfo;
  output: string;
  /** Inputs the points were paired by, and the relative tolerance on numbers (0: exact). */
  by: string[];
  tolerance: number;
  /** Pairs listed (changed ones only when asked), before paging. */
  total: number;
  paired: number;
  changed: number;
  only_a: number;
  only_b: number;
  points: { paired: number; only_a: number; only_b: number };
  rows: CompareRow[];
  /** Both study files, when asked for with yaml=yes. */
  yaml?: { a: string; b: string };
}

export interface CompareQuery {
  a: number;
  b: number;
  output: string;
  page: number;
  pageSize: number;
  changed: 'yes' | 'any';
  by: string[];
  tolerance: number;
  yaml?: boolean;
}

export function useCompare(q: CompareQuery | null) {
  return useQuery({
    queryKey: ['compare', q],
    queryFn: () =>
      api<CompareResponse>(
        `/api/compare${qs({ a: q!.a, b: q!.b, output: q!.output, page: q!.page, pageSize: q!.pageSize, changed: q!.changed, by: q!.by.join(','), tolerance: q!.tolerance || undefined, yaml: q!.yaml ? 'yes' : undefined })}`,
      ),
    enabled: q !== null,
    placeholderData: keepPreviousData,
  });
}

/**
 * A run picked in a form (its inputs and outputs for the choices): nothing is asked
 * until one is picked. Shares the run page's cache entry.
 */
export function usePickedRun(id: number | undefined) {
  return useQuery({
    queryKey: ['run', id],
    queryFn: () => api<RunResponse>(`/api/runs/${id}`),
    enabled: id !== undefined && id > 0,
  });
}
