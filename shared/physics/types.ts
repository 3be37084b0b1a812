// The shapes every physics module shares. Methods are described as data (id,
// configuration, inputs, outputs, ranges, uncertainty, source, version) plus one pure
// `evaluate` function over plain objects, so the catalogue can be listed, validated
// against and shipped to worker threads or the browser without special cases.

/** Values a method receives: SI numbers, or booleans for switches such as `heating`. */
export type InputValue = number | boolean | string;
export type Inputs = Record<string, InputValue>;
export type Outputs = Record<string, number>;

/**
 * Flags a result can carry. Open-ended strings, but these forms are fixed:
 * - `out-of-range:<input>`: the input lies outside the method's validity range; the number is kept.
 * - `separation`: the boundary layer separates; no number is given for the affected outputs.
 * - `not-converged`: a numerical solver did not reach its tolerance; outputs are omitted.
 * - `extrapolated-property:<name>`: never produced: fluids refuse to extrapolate (see fluids).
 */
export type Flag = string;

export interface MethodResult {
  outputs: Outputs;
  flags: Flag[];
  /** Optional profiles (similarity methods, on request). */
  profiles?: Record<string, number[]>;
}

export interface InputSpec {
  name: string;
  description: string;
  /** SI unit, `1` for dimensionless. */
  unit: string;
  type?: 'number' | 'boolean' | 'string';
  /** Required unless a default is given. */
  required: boolean;
  default?: InputValue;
  /** For string inputs: the allowed values. */
  choices?: string[];
}

export interface OutputSpec {
  name: string;
  description: string;
  unit: string;
}

/** A validity range: a point outside it keeps its number and gets `out-of-range:<input>`. */
export interface ValidityRange {
  input: string;
  min?: number;
  max?: number;
  /** Whether the bounds themselves are inside (default true). */
  inclusive?: boolean;
  note?: string;
}

export type MethodKind = 'similarity' | 'correlation';

export interface MethodInfo {
  /** Method id, unique within its configuration (e.g. `gnielinski`). */
  id: string;
  /** Configuration id (e.g. `pipe`). */
  configuration: string;
  kind: MethodKind;
  /** Human title, e.g. "Gnielinski (turbulent and transitional pipe flow)". */
  title: string;
  description: string;
  /** The governing equation or correlation as LaTeX (rendered by the dashboard). */
  equation: string;
  inputs: InputSpec[];
  outputs: OutputSpec[];
  ranges: ValidityRange[];
  /** Stated uncertainty as a fraction (0.2 for ±20 %), and its wording with the source's words. */
  uncertainty: { fraction: number; note: string };
  /** Full reference to the original publication (and the textbook it was checked against). */
  source: string;
  /** Bumped whenever the implementation changes results; stored with every run. */
  version: number;
  /**
   * The wall conditions the method's Nu holds for: 'temperature' (uniform wall temperature),
   * 'flux' (uniform heat flux). Omitted: both (turbulent internal flow, cross flow, free
   * convection correlations, where the literature uses one form for both). A method with a
   * `wall_condition` input covers the conditions of its choices. The engine flags a
   * dimensional point whose wall condition the method lacks (`no-flux-form`,
   * `no-temperature-form`), never silently giving the other condition's value.
   */
  wallConditions?: readonly WallCondition[];
}

export type WallCondition = 'temperature' | 'flux';

export interface Method extends MethodInfo {
  evaluate(inputs: Inputs): MethodResult;
}

/** Thrown for bad input (unknown names, missing values); the CLI turns it into exit 1. */
export class InputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InputError';
  }
}
