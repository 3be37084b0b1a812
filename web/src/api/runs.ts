// Runs, their results, charts and exports: /api/runs…
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { ChartAxes, ChartData, MethodSummary, ResultsPage, RunColumns, RunInfo, RunStatus } from './types.js';
export type { ChartData, ChartSeries, ResultRowDto, ResultsPage } from './types.js';
import type { ChartQuery, ResultQuery } from '../lib/result-query.js';
import { chartAxesUrl, chartUrl, resultsUrl, runUrl } from './run-urls.js';

export interface RunResponse {
  run: RunInfo;
  /** The run's study (null only for a study removed since). */
  study_id: number | null;
  /** The configuration's flow regime (null: a configuration this build does not know). */
  regime: 'external' | 'internal' | 'free' | null;
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
/**
 * What the run page's route prefetched is fresh this long, so the page does not ask again
 * on mount; a live run still refreshes on its interval, and a run's end invalidates it.
 */
const PREFETCHED_FRESH_MS = 5_000;

/** One run with its summary per method (also prefetched by the run page's route, App.tsx). */
export const runQuery = (id: number) => ({ queryKey: ['run', id], queryFn: () => api<RunResponse>(runUrl(id)), staleTime: PREFETCHED_FRESH_MS });

export function useRun(id: number) {
  return useQuery({
    ...runQuery(id),
    refetchInterval: (query) => (active(query.state.data?.run.status) ? 1500 : false),
  });
}

/** One page of a run's results. */
export const resultsQuery = (id: number, query: ResultQuery) => ({
  queryKey: ['results', id, query],
  queryFn: () => api<ResultsPage>(resultsUrl(id, query)),
  staleTime: PREFETCHED_FRESH_MS,
});

export function useResults(id: number, query: ResultQuery, live: boolean) {
  return useQuery({
    ...resultsQuery(id, query),
    placeholderData: keepPreviousData,
    refetchInterval: live ? 3000 : false,
  });
}

/** One chart of a run (the route prefetches the default one). */
export const chartQuery = (id: number, query: ChartQuery | null) => ({
  queryKey: ['chart', id, query],
  queryFn: () => api<ChartData>(chartUrl(id, query!)),
  staleTime: PREFETCHED_FRESH_MS,
});

export function useChart(id: number, query: ChartQuery | null, live: boolean) {
  return useQuery({
    ...chartQuery(id, query),
    enabled: query !== null && query.x !== '' && query.y !== '',
    placeholderData: keepPreviousData,
    refetchInterval: live ? 3000 : false,
  });
}

/** Facts about every input and output, for the chart's choices; refreshed while the run runs. */
export const chartAxesQuery = (id: number) => ({ queryKey: ['chart-axes', id], queryFn: () => api<ChartAxes>(chartAxesUrl(id)), staleTime: PREFETCHED_FRESH_MS });

export function useChartAxes(id: number, live: boolean) {
  return useQuery({
    ...chartAxesQuery(id),
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
