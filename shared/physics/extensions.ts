// Where configurations added beside the built-in ones plug into the dimensional engine,
// without growing its switch statements: their geometry (characteristic length, areas) and
// any outputs of their own computed after the method ran (a heat sink's fin efficiency,
// total heat rate and thermal resistance, say). A module registers on import:
//   geometryExtensions.set('my-configuration', (inputs, need) => ({ length: need('gap', …) }));
// This file imports nothing from the engine, so registering creates no import cycle.
import type { FluidProperties } from './fluids/types.js';
import type { Flag, Inputs, Outputs } from './types.js';

/** The geometry a configuration needs (see geometry.ts `Geometry`). */
export interface ExtensionGeometry {
  length: number;
  area?: number;
  flowArea?: number;
  perimeter?: number;
  flowLength?: number;
  L_over_D?: number;
  aspect_ratio?: number;
  /** Dimensionless groups the sizes give (diameter_ratio, gap_over_height …), handed to the methods like L_over_D. */
  groups?: Record<string, number>;
  /** The velocity Re is built on over the given velocity (a heat sink's channel velocity V(1 + t/S)); default 1. */
  velocityRatio?: number;
}

export type GeometryBuilder = (inputs: Inputs, need: (name: string, v: number | undefined) => number) => ExtensionGeometry;

export const geometryExtensions = new Map<string, GeometryBuilder>();

/** The groups a configuration's geometry derives from the input names a point gives (for the study checks before a run). */
export type DerivableGroups = (names: ReadonlySet<string>) => string[];

export const derivableExtensions = new Map<string, DerivableGroups>();

export interface OutputExtensionContext {
  inputs: Inputs;
  /** The method's outputs with the engine's (h, q, heat_rate …); the extension may read them. */
  outputs: Outputs;
  /** Properties at the property temperature of the result. */
  props: FluidProperties;
  geometry: ExtensionGeometry;
}

/** Extra outputs (and flags) for one result of a configuration. */
export type OutputExtension = (ctx: OutputExtensionContext) => { outputs?: Outputs; flags?: Flag[] };

export const outputExtensions = new Map<string, OutputExtension>();
