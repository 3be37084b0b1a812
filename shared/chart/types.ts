// The shapes of the chart API (GET /api/runs/:id/chart and /chart/axes), in SI. Types
// only, so the browser bundle and the server share one definition
// (shared/db/chart-query.ts builds them, web/src reads them).

/** [x, y, flagged 0|1] or, for a flagged point, [x, y, 1, index into `flag_details`]. */
export type ChartPoint = [number, number, 0 | 1] | [number, number, 0 | 1, number];

export interface ChartSeries {
  /** `method`, or `method, NAME = value` with one series per value of a second input. */
  name: string;
  method: string;
  /** The second input's value of this series (series by an input); null when a result has none. */
  value?: number | string | boolean | null;
  /** Sorted by x. */
  points: ChartPoint[];
  /** Parallel to `points`: the run's point index of each (for the point view, /runs/:id/points/:point). */
  point_index?: number[];
  /**
   * Parallel to `points`, when the run stores a band of y (`<y>_low`, `<y>_high`: the 2.5 %
   * and 97.5 % points, shared/design/bands.ts): [low, high] in SI, null where a row has none.
   */
  band?: [number | null, number | null][];
}

/** A study's target (SI): the value of `adjust` in `within` at which `output` equals `value`. */
export interface TargetFacts {
  output: string;
  value: number;
  adjust: string;
  within: [number, number];
}

/**
 * A result whose target was not reached (flag `target-not-reached`): it has no solved
 * input, only the range of the target's output over the search interval.
 */
export interface UnreachedPoint {
  method: string;
  /** Its series' value of the second input (series by an input). */
  value?: number | string | boolean | null;
  /** Its x, SI; null when x is a quantity the row does not have (a derived group such as Re). */
  x: number | null;
  point: number;
  /** The target output's smallest and largest value over the search interval (`<output>_min`, `<output>_max`). */
  min: number | null;
  max: number | null;
}

/** Why a point is flagged, with what broke: `out-of-range:Re` at Re = 3.2e5 against max 2e5. */
export interface FlagDetail {
  flag: string;
  /** The input of an `out-of-range:` flag. */
  name?: string;
  /** Its value at that point (SI), when the row carries it. */
  value?: number;
  /** The catalogue's validity range of the method for that input. */
  min?: number;
  max?: number;
  /** Whether the bounds themselves are inside (default true). */
  inclusive?: boolean;
}

/** A method of the run that has no point on this chart, and why. */
export interface LeftOut {
  method: string;
  reason: string;
  /** Local outputs (`Nu_x`) the method gives instead, when that is the reason. */
  local?: string[];
}

export interface MeasuredRow {
  /** Where the row sits on x: its own value, or the x the engine derived for it (Re from its velocity). */
  x: number | null;
  measured: number;
  /** Per method: the prediction at this row's inputs. */
  predicted: Record<string, number>;
  /** Per method: (predicted − measured) / measured. */
  deviation: Record<string, number>;
}

export interface MeasuredOverlay {
  name: string;
  /** [x, measured y], sorted by x. */
  points: [number, number][];
  /** With series by a second input: each point's value of it (null when the row has none), parallel to `points`. */
  values?: (number | null)[];
  /** Per method: mean of |deviation| over the rows it predicts (a method with none is absent). */
  mad: Record<string, number>;
  /** Per method: mean signed deviation (positive: the method predicts more than was measured). */
  bias: Record<string, number>;
  /** Rows with a measured y, in file order (at most MAX_MEASURED_ROWS). */
  rows: MeasuredRow[];
  /** Measured rows with a y that could not be placed in the sweep (a swept input missing) or solved. */
  unplaced: number;
}

export interface ChartData {
  x: string;
  y: string;
  /** Results with both x and y, before thinning (estimated from the sample when `total_estimated`). */
  total: number;
  /** True when the run was too large to count in time and `total` comes from the sample. */
  total_estimated?: boolean;
  downsampled: boolean;
  /** When the run is too large to read whole in time: the thinning worked from this many results, a fixed sample. */
  sampled?: number;
  /** `method` or the second input the series are split by. */
  series_by: string;
  series: ChartSeries[];
  /** Stated uncertainty of each method, as a fraction. */
  uncertainty: Record<string, number>;
  /** Per flagged point (see ChartPoint): what each of its flags means there. */
  flag_details: FlagDetail[][];
  left_out: LeftOut[];
  measured?: MeasuredOverlay;
  /** The name whose `_low`/`_high` the series' `band` holds (y), when the run stores a band of it. */
  band_of?: string;
  /** Results of a target run whose target was not reached, drawn at their x (at most MAX_UNREACHED). */
  unreached?: UnreachedPoint[];
  /** How many results did not reach the target, when all are listed (absent: more than the list holds). */
  unreached_total?: number;
}

/** What the chart controls need to know about one input or output of a run. */
export interface AxisFacts {
  name: string;
  role: 'input' | 'output';
  /** Swept input of the study (varies by design). */
  swept: boolean;
  /** Number of distinct numeric values seen (exact for swept and fixed inputs; from a sample for outputs), capped at 1000. */
  distinct: number;
  min: number | null;
  max: number | null;
  /** The distinct values, ascending, when there are at most 24. */
  values?: number[];
  /** Text values of a swept input (a choice such as `arrangement`): it can split series, not be an axis. */
  labels?: string[];
}

export interface ChartAxes {
  names: AxisFacts[];
  /** The study's target, when it has one: the chart then starts on the solved input against a swept one. */
  target?: TargetFacts;
  /** Points the output facts were read from. */
  sampled_points: number;
}
