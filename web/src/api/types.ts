// The API's shapes (see the API contract). Run and method data reuse the shared types.
// (shared/export/types.ts is not imported: it pulls Node's Buffer and the whole engine into the types.)
export type { MethodInfo, InputSpec, OutputSpec, ValidityRange } from '../../../shared/physics/types.js';

export type Role = 'viewer' | 'researcher' | 'lead';
export const ROLES: readonly Role[] = ['viewer', 'researcher', 'lead'];

export interface User {
  email: string;
  role: Role;
  name: string;
}

import type { RunInfo as StoreRunInfo } from '../../../shared/export/run-info.js';
export type { MethodVersion, RunStatus } from '../../../shared/export/run-info.js';

/** The store's run (shared/export/run-info.ts) plus what the API adds. */
export interface RunInfo extends StoreRunInfo {
  reference: boolean;
  started_by: string | null;
}

export interface MethodSummary {
  method: string;
  version: number;
  points: number;
  flagged_points: number;
  nu_name: 'Nu' | 'Nu_x' | null;
  nu_min: number | null;
  nu_max: number | null;
}

export interface Diagnostic {
  file: string;
  line: number;
  column: number;
  message: string;
}

export interface ResultRowDto {
  id: number;
  point: number;
  method: string;
  inputs: Record<string, number | string | boolean>;
  outputs: Record<string, number>;
  flags: string[];
}

export interface ResultsPage {
  total: number;
  page: number;
  pageSize: number;
  rows: ResultRowDto[];
}

// The chart API's shapes: one definition with the server (shared/chart/types.ts).
export type { AxisFacts, ChartAxes, ChartData, ChartPoint, ChartSeries, FlagDetail, LeftOut, MeasuredOverlay, MeasuredRow } from '../../../shared/chart/types.js';

export interface CompareRow {
  method: string;
  inputs: Record<string, number | string | boolean>;
  /** Run b's point (differs from run a's in inputs not paired by, or within the tolerance). */
  inputs_b: Record<string, number | string | boolean>;
  a: number | null;
  b: number | null;
  rel_diff: number | null;
}

