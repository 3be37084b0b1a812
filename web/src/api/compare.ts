// Comparison of two runs: GET /api/compare, and the runs picked for it.
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { RunResponse } from './runs.js';
import type { CompareResponse } from './types.js';
export type { CompareResponse, CompareRow } from './types.js';

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
