// Design answers (issue 11): targets (the input that meets a requirement), uncertainty
// bands, and the per-point summary across methods. Browser-safe and pure.
export * from './types.js';
export * from './names.js';
export { normalQuantile, sortedQuantile, Z95 } from './normal.js';
export { evaluateWithFactor, factorRule, uncoveredOutputs, type FactorRule, type MethodEvaluator } from './method-factor.js';
export { solveTargetNear, solveTargetValue, targetRow, SAMPLE_REL_TOL, TARGET_REL_TOL, SCAN_STEPS, type TargetSolution } from './target.js';
export { drawPoint, forwardBands, targetBands, type PointDraws } from './bands.js';
export { explainSummary, summarizePoint, summaryFacts, type MethodUncertainty, type SummaryFacts } from './summary.js';
export { compilePointDesigner, type DesignedPoint, type PointDesigner } from './point.js';
