// The data an export reads: one run and its result rows, as the store returns them
// (shared/db `getRunRows`). Plain JSON-able objects, no database handles.
import type { ResultRow } from '../physics/engine.js';

export type { ResultRow };

export type { MethodVersion, RunInfo, RunStatus } from './run-info.js';
import type { RunInfo } from './run-info.js';

/** A stored result row; `recommended` where the run has per-point summaries (shared/design). */
export interface ExportRow extends ResultRow {
  /** Whether this row's method is the recommended one at its point. */
  recommended?: boolean;
}

export interface RunExport {
  run: RunInfo;
  rows: ExportRow[];
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
