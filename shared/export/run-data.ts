// What the store's queries of one run give, as the API sends it and the web app reads it:
// the per-method summary, the run's input and output names, a page of results, chart
// data and the comparison of two runs. Pure types (importing only types), so the browser
// bundle shares the one definition with shared/db (whose code it must not import).
import type { Inputs, Outputs } from '../physics/types.js';
import type { RunInfo } from './run-info.js';

export interface MethodSummary {
  method: string;
  version: number;
  /** Points with a result of this method. */
  points: number;
  /** Of those, points whose result carries at least one flag. */
  flagged_points: number;
  /** `Nu` when the method gives a mean Nusselt number, else `Nu_x`, else null. */
  nu_name: 'Nu' | 'Nu_x' | null;
  nu_min: number | null;
  nu_max: number | null;
}

/** A run's input and output names, each sorted. */
export interface RunColumns {
  inputs: string[];
  outputs: string[];
}

export interface ResultPageRow {
  /** The result's number within its run (point × methods + method + 1); runs stored before run tables: their row id. */
  id: number;
  point: number;
  method: string;
  inputs: Inputs;
  outputs: Outputs;
  flags: string[];
}

export interface ResultsPage {
  total: number;
  page: number;
  pageSize: number;
  rows: ResultPageRow[];
}

export interface ChartSeries {
  name: string;
  method: string;
  /** [x, y, flagged 0|1], sorted by x. */
  points: [number, number, 0 | 1][];
}

export interface ChartData {
  x: string;
  y: string;
  /** Results with both x and y, before downsampling. */
  total: number;
  downsampled: boolean;
  series: ChartSeries[];
  /** Stated uncertainty of each method, as a fraction. */
  uncertainty: Record<string, number>;
}

export interface CompareRow {
  method: string;
  inputs: Inputs;
  a: number | null;
  b: number | null;
  /** (b − a)/|a|; null when either is missing or a is 0. */
  rel_diff: number | null;
}

/** The comparison of runs a and b (the API sends its dashboard view of each run). */
export interface Comparison<Run extends RunInfo = RunInfo> {
  a: Run;
  b: Run;
  output: string;
  /** Pairs shown by `changed` (before paging). */
  total: number;
  /** Pairs whose value differs. */
  changed: number;
  only_a: number;
  only_b: number;
  rows: CompareRow[];
}
