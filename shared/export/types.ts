// The data an export reads: one run and its result rows, as the store returns them
// (shared/db `getRunRows`). Plain JSON-able objects, no database handles.
import type { ResultRow } from '../physics/engine.js';

export type { ResultRow };

export type { MethodVersion, RunInfo, RunStatus } from './run-info.js';
import type { RunInfo } from './run-info.js';

export interface RunExport {
  run: RunInfo;
  rows: ResultRow[];
}

export type ExportFormat = 'csv' | 'json' | 'md' | 'tex' | 'xlsx';

export const exportFormats: readonly ExportFormat[] = ['csv', 'json', 'md', 'tex', 'xlsx'];

export interface ExportResult {
  /** Text for csv, json, md and tex; a Buffer for xlsx. */
  body: string | Buffer;
  mediaType: string;
  /** File extension without the dot. */
  extension: string;
}
