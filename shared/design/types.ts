// What a study (or `solve`) asks of the design layer, in SI: a target to meet, the
// tolerances of inputs and the Monte Carlo settings of the bands. Plain data, so it
// travels to worker threads with the sweep.

/** Solve, per point and method, the value of `adjust` in `within` at which `output` equals `value`. */
export interface DesignTarget {
  output: string;
  /** SI value of the output to meet. */
  value: number;
  /** The input solved for (neither fixed nor swept). */
  adjust: string;
  /** Search interval of the adjusted input, SI, low < high. */
  within: [number, number];
}

/** A 95 % half-width of a normally distributed input: relative (0.05 for 5 %) or absolute (SI). */
export type InputTolerance = { relative: number } | { absolute: number };

export interface UncertaintySettings {
  /** Monte Carlo samples per point and method (only drawn when there are tolerances). */
  samples: number;
  /** With the point index, fixes every draw. */
  seed: number;
}

export interface DesignSpec {
  target?: DesignTarget;
  /** Input name → tolerance. */
  tolerances: Record<string, InputTolerance>;
  /** Present when results get `_low`/`_high` bands (a study with `tolerances` or `uncertainty`). */
  uncertainty?: UncertaintySettings;
}

/** Per-point summary across methods: which hold there, how far they disagree, which to use. */
export interface PointSummary {
  /** Methods without a range flag at this point, in the study's method order. */
  applicable: string[];
  /** max/min − 1 of `spread_of` over the applicable methods; null with none applicable or no values. */
  spread: number | null;
  /** `Nu`, `Nu_x`, or the target's adjusted input. */
  spread_of: string | null;
  /** The applicable method with the smallest stated uncertainty; null when none applies. */
  recommended: string | null;
  /** Why, in words (or why there is none). */
  reason: string;
  /** `no-applicable-method` where no method's ranges hold. */
  flags: string[];
}
