// Exact laminar boundary-layer similarity solutions: catalogue methods and the solvers below them.
export { similarityMethods, flatPlateSimilarity, wedgeSimilarity, verticalPlateSimilarity } from './methods.js';
export {
  solveFalknerSkan,
  solveFalknerSkanUncached,
  hartreeBeta,
  wallStreamFunction,
  BLOWOFF_WALL_SHEAR,
  type FalknerSkanSolution,
  type MomentumStatus,
  type SolveOptions,
} from './falknerSkan.js';
export { thermalSolution, recoveryFactor, type ThermalResult, type RecoveryResult } from './thermal.js';
export { solveFreeConvection, solveFreeConvectionUncached, type FreeConvectionSolution } from './freeConvection.js';
export { similarityProfiles } from './similarityProfiles.js';
export { separationExponent, blowOffLimit } from './limits.js';
export {
  clearSimilarityCaches,
  similaritySolveCounts,
  resetSimilaritySolveCounts,
  type SimilaritySolveCounts,
} from './cache.js';
