// A run as the store returns it and exports, the API and the web app show it. Pure types
// with no imports, so the browser bundle can share them with the server.

export type RunStatus = 'queued' | 'running' | 'done' | 'failed' | 'interrupted';

export interface MethodVersion {
  id: string;
  version: number;
}

export interface RunInfo {
  id: number;
  /** Study name (the slug of the study file). */
  study: string;
  /** 1, 2, 3 …: which stored content of the study file this run executed. */
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
