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

// A study file's problem at its line and column (shared/study/errors.ts).
export type { Diagnostic } from '../../../shared/study/errors.js';

// The run queries' shapes: the one definition in shared/export/run-data.ts, which
// shared/db returns and the API sends.
import type { Comparison, ResultPageRow } from '../../../shared/export/run-data.js';
export type { CompareRow, MethodSummary, ResultsPage, RunColumns } from '../../../shared/export/run-data.js';

/** A row of a results page. */
export type ResultRowDto = ResultPageRow;

// The chart API's shapes: one definition with the server (shared/chart/types.ts).
export type { AxisFacts, ChartAxes, ChartData, ChartPoint, ChartSeries, FlagDetail, LeftOut, MeasuredOverlay, MeasuredRow } from '../../../shared/chart/types.js';

/** The comparison of two runs, each with what the API adds to a run; with both study files when asked for (yaml=yes). */
export type CompareResponse = Comparison<RunInfo> & { yaml?: { a: string; b: string } };

