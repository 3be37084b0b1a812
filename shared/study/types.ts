// A study after validation: every value in SI, methods resolved, ready to expand and run.
import type { FluidSpec } from '../physics/engine.js';
import type { Inputs } from '../physics/types.js';
import type { DesignSpec } from '../design/types.js';
import type { Sweep } from './sweep.js';

/** A check passes when within either bound: |actual − expected| ≤ relative·|expected|, or ≤ absolute (SI). */
export interface Tolerance {
  relative?: number;
  absolute?: number;
}

export interface StudyCheck {
  /** Values (SI) that pick one point of the run: inputs, or outputs such as a derived Re (see shared/check). */
  at: Inputs;
  method: string;
  /** Expected outputs, SI. */
  expect: Record<string, number>;
  tolerance: Tolerance;
  /** Where the check is written, for messages. */
  line: number;
  column: number;
}

export interface Study {
  name: string;
  title?: string;
  configuration: string;
  /** Method ids, resolved (the configuration's methods when the file lists none), never empty. */
  methods: string[];
  /** Fluid with constant properties converted to SI. */
  fluid?: FluidSpec;
  /** Fixed inputs, SI. */
  inputs: Inputs;
  sweep: Sweep;
  checks: StudyCheck[];
  /** Relative tolerance used when comparing with the committed baseline. */
  baseline: { tolerance: number };
  /** Design answers asked for: a target, input tolerances, bands (shared/design). */
  design?: DesignSpec;
}

export interface LoadedStudy {
  file: string;
  text: string;
  /** SHA-256 of the text, lowercase hex: identifies the study version. */
  hash: string;
  study: Study;
}
