// Runs, their results, charts and exports: /api/runs…
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { ChartAxes, ChartData, MethodSummary, ResultsPage, RunColumns, RunInfo, RunStatus } from './types.js';
export type { ChartData, ChartSeries, ResultRowDto, ResultsPage } from './types.js';
import { chartSearch, resultsSearch, type ChartQuery, type ResultQuery } from '../lib/result-query.js';

export interface RunResponse {
  run: RunInfo;
  summary: MethodSummary[];
  error: string | null;
  columns: RunColumns;
}

export const EXPORT_FORMATS = [
  { format: 'csv', label: 'CSV' },
  { format: 'xlsx', label: 'XLSX' },
  { format: 'md', label: 'Markdown' },
  { format: 'tex', label: 'LaTeX' },
] as const;

export function exportUrl(runId: number, format: string) {
  return `/api/runs/${runId}/export${qs({ format })}`;
}

export const active = (s: RunStatus | undefined) => s === 'running' || s === 'queued';

export function useRuns(filter: { study?: number; status?: RunStatus } = {}) {
  return useQuery({
    queryKey: ['runs', filter],
    queryFn: () => api<{ runs: RunInfo[] }>(`/api/runs${qs({ study: filter.study, status: filter.status })}`),
  });
}

/** A run; polled while it is queued or running so the progress bar moves. */
export function useRun(id: number) {
  return useQuery({
    queryKey: ['run', id],
    queryFn: () => api<RunResponse>(`/api/runs/${id}`),
    refetchInterval: (query) => (active(query.state.data?.run.status) ? 1500 : false),
  });
}

export function useResults(id: number, query: ResultQuery, live: boolean) {
  return useQuery({
    queryKey: ['results', id, query],
    queryFn: () => api<ResultsPage>(`/api/runs/${id}/results?${resultsSearch(query)}`),
    placeholderData: keepPreviousData,
    refetchInterval: live ? 3000 : false,
  });
}

export function useChart(id: number, query: ChartQuery | null, live: boolean) {
  return useQuery({
    queryKey: ['chart', id, query],
    queryFn: () => api<ChartData>(`/api/runs/${id}/chart?${chartSearch(query!)}`),
    enabled: query !== null && query.x !== '' && query.y !== '',
    placeholderData: keepPreviousData,
    refetchInterval: live ? 3000 : false,
  });
}

/** Facts about every input and output, for the chart's choices; refreshed while the run runs. */
export function useChartAxes(id: number, live: boolean) {
  return useQuery({
    queryKey: ['chart-axes', id],
    queryFn: () => api<ChartAxes>(`/api/runs/${id}/chart/axes`),
    refetchInterval: live ? 3000 : false,
  });
}

/** After a run ends: its table, chart and facts fetched once more, so they show the end state. */
export function useRefreshRunData() {
  const client = useQueryClient();
  return (id: number) => {
    for (const key of ['results', 'chart', 'chart-axes']) void client.invalidateQueries({ queryKey: [key, id] });
  };
}

export function useSetReference(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (reference: boolean) => api<{ run: RunInfo }>(`/api/runs/${id}/reference`, { method: 'POST', body: { reference } }),
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: ['run', id] });
      void client.invalidateQueries({ queryKey: ['runs'] });
    },
  });
}
