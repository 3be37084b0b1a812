export type { CheckOutcome } from './outcome.js';
export { evaluateChecks, matchTolerance, defaultCheckTolerance, type CheckSpec } from './study-checks.js';
export {
  makeBaseline,
  serializeBaseline,
  parseBaseline,
  baselinePathFor,
  compareWithBaseline,
  describeDrift,
  rowKey,
  type Baseline,
  type BaselineOptions,
  type BaselineOutcome,
  type Drift,
  type DriftKind,
} from './baseline.js';
export { junitXml, outcomeCases, xmlAttr, xmlText, type JUnitCase, type JUnitSuite } from './junit.js';
