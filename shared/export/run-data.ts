// What the store's queries of runs give, as the API sends it and the web app reads it: the
// per-method summary, a run's input and output names, a page of results and the
// comparison of two runs (chart data: shared/chart/types.ts). Pure types (importing only
// types), so the browser bundle shares the one definition with shared/db (whose code it
// must not import).
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

export interface CompareRow {
  method: string;
  /** Run a's point. */
  inputs: Inputs;
  /** Run b's point (differs from run a's in inputs not paired by, or within the tolerance). */
  inputs_b: Inputs;
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
  /** Inputs the points were paired by, and the relative tolerance on numbers (0: exact). */
  by: string[];
  tolerance: number;
  /** Pairs shown by `changed` (before paging). */
  total: number;
  /** Paired results, changed or not. */
  paired: number;
  /** Pairs whose value differs. */
  changed: number;
  /** Results of run a (b) without a partner. */
  only_a: number;
  only_b: number;
  /** The same counts for points: a point pairs when its chosen inputs match. */
  points: { paired: number; only_a: number; only_b: number };
  rows: CompareRow[];
}
