// Comparison of two runs: GET /api/compare.
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { CompareRow, RunInfo } from './types.js';
export type { CompareRow } from './types.js';

export interface CompareResponse {
  a: RunInfo;
  b: RunInfo;
  output: string;
  total: number;
  changed: number;
  only_a: number;
  only_b: number;
  rows: CompareRow[];
}

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
