// One point of a run, every method there: GET /api/runs/:id/points/:point.
import { useQuery } from '@tanstack/react-query';
import type { TargetFacts } from '../../../shared/chart/types.js';
import type { PointSummary } from '../../../shared/design/types.js';
import { api } from './client.js';
import type { RunStatus } from './types.js';

export interface PointRow {
  method: string;
  inputs: Record<string, number | string | boolean>;
  /** With `<name>_low`/`<name>_high` bands, and `<output>_min`/`_max` where a target was not reached. */
  outputs: Record<string, number>;
  flags: string[];
  /** The method's stated uncertainty (null: a method no longer in the catalogue). */
  uncertainty: { fraction: number; note?: string } | null;
  recommended: boolean;
}

export interface PointView {
  run: { id: number; study: string; configuration: string; title: string | null; points_total: number; status: RunStatus };
  point: number;
  inputs: Record<string, number | string | boolean>;
  rows: PointRow[];
  summary: PointSummary;
  summary_source: 'stored' | 'computed';
  target?: TargetFacts;
}

export function usePoint(runId: number, point: number) {
  return useQuery({
    queryKey: ['point', runId, point],
    queryFn: () => api<PointView>(`/api/runs/${runId}/points/${point}`),
  });
}
