// Everything of shared/study that runs in the browser too (no node: imports); index.ts
// adds reading files from disk.
export { StudyError, type Diagnostic } from './errors.js';
export { DEFAULT_MAX_POINTS, MAX_ALIAS_COUNT, parseStudy, type ParseOptions } from './parse.js';
export { studyJsonSchema, studySchema, type StudyFile } from './schema.js';
export { starterStudy } from './starter.js';
export {
  countPoints,
  entryLength,
  entryValueAt,
  entryValues,
  expandPoints,
  iteratePoints,
  latinHypercube,
  pointAt,
  sweepDesigns,
  type Sweep,
  type SweepDesign,
  type SweepEntry,
  type SweepSource,
} from './sweep.js';
export type { LoadedStudy, Study, StudyCheck, Tolerance } from './types.js';
export { UnitError, differenceToSI, quantityToSI } from './units.js';
