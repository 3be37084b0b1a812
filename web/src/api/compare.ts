// Comparison of two runs: GET /api/compare.
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { CompareResponse } from './types.js';
export type { CompareResponse, CompareRow } from './types.js';

export interface CompareQuery {
  a: number;
  b: number;
  output: string;
  page: number;
  pageSize: number;
  changed: 'yes' | 'any';
}

export function useCompare(q: CompareQuery | null) {
  return useQuery({
    queryKey: ['compare', q],
    queryFn: () => api<CompareResponse>(`/api/compare${qs({ ...q! })}`),
    enabled: q !== null,
    placeholderData: keepPreviousData,
  });
}
