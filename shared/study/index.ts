// Study files: schema, units, validation with positions, sweep expansion.
export * from './portable.js';
export { loadStudyFile } from './load-file.js';
