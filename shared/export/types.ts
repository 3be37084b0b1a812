// The data an export reads: one run and its result rows, as the store returns them
// (shared/db `getRunRows`). Plain JSON-able objects, no database handles.
import type { ResultRow } from '../physics/engine.js';

export type { ResultRow };

export type RunStatus = 'queued' | 'running' | 'done' | 'failed' | 'interrupted';

export interface MethodVersion {
  id: string;
  version: number;
}

export interface RunInfo {
  id: number;
  /** Study name (the slug of the study file). */
  study: string;
  /** Which stored version of the study file this run executed. */
  study_version: number;
  title: string | null;
  configuration: string;
  status: RunStatus;
  /** ISO-8601 timestamps. */
  started_at: string | null;
  finished_at: string | null;
  /** `git rev-parse HEAD` of the study file's folder, null outside a repository. */
  git_commit: string | null;
  host: string;
  workers: number;
  points_total: number;
  points_done: number;
  results_count: number;
  flagged_count: number;
  methods: MethodVersion[];
  /** sha256 hex of the study file's text. */
  yaml_hash: string;
}

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
