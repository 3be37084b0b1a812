// Kysely's typed view of the database (migrations/ creates it). Timestamps are ISO-8601
// text. A run's results are in its own table `run_results_<id>` (result-table.ts; made at
// run time, so not listed here); runs stored before migrations/0005_run_tables.ts keep
// theirs in points/results, whose inputs and outputs are JSON columns (JSONB blobs on
// SQLite, json on PostgreSQL: read them through shared/db/dialect.ts).
import type { Generated, Insertable, Selectable } from '#kysely';

export const RUN_STATUSES = ['queued', 'running', 'done', 'failed', 'interrupted'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export interface StudiesTable {
  id: Generated<number>;
  name: string;
  created_at: string;
}

export interface StudyVersionsTable {
  id: Generated<number>;
  study_id: number;
  version: number;
  /** sha256 of the YAML text, hex. */
  hash: string;
  yaml: string;
  title: string | null;
  configuration: string;
  source_file: string | null;
  created_at: string;
}

export interface RunsTable {
  id: Generated<number>;
  study_version_id: number;
  status: RunStatus;
  started_at: string | null;
  finished_at: string | null;
  git_commit: string | null;
  host: string;
  pid: number | null;
  workers: number;
  points_total: number;
  points_done: Generated<number>;
  results_count: Generated<number>;
  flagged_count: Generated<number>;
  /** JSON `[{id, version}]`, in method_idx order. */
  methods: string;
  error: string | null;
  /** 0002_dashboard: 1 when a lead marked the run as the reference (for a memo). */
  reference: Generated<number>;
  /** 0002_dashboard: users.id of who started it from the dashboard or pushed it; null from the CLI. */
  started_by: number | null;
  /** 0003_security: the host a pushed run came from; null for runs computed in this database. */
  pushed_from: Generated<string | null>;
  /** 0005_run_tables: 1 when the results are in run_results_<id>; 0 when in points/results. */
  results_table: Generated<number>;
}

export interface PointsTable {
  run_id: number;
  idx: number;
  /** JSONB. */
  inputs: Uint8Array;
}

export interface ResultsTable {
  id: Generated<number>;
  run_id: number;
  point_idx: number;
  method_idx: number;
  method: string;
  /** JSONB. */
  outputs: Uint8Array;
  /** JSON array of flag strings. */
  flags: string;
  /** 1 when flags is not empty. */
  flagged: number;
}

export interface Database {
  studies: StudiesTable;
  study_versions: StudyVersionsTable;
  runs: RunsTable;
  points: PointsTable;
  results: ResultsTable;
  // 0002_dashboard
  users: UsersTable;
  sessions: SessionsTable;
  api_tokens: ApiTokensTable;
  invites: InvitesTable;
  password_resets: PasswordResetsTable;
  measurements: MeasurementsTable;
  mail_outbox: MailOutboxTable;
  audit_log: AuditLogTable;
  // 0004_point_summaries
  point_summaries: PointSummariesTable;
  // 0005_run_tables
  result_columns: ResultColumnsTable;
  result_shapes: ResultShapesTable;
  result_counts: ResultCountsTable;
  result_stats: ResultStatsTable;
}

export type RunRow = Selectable<RunsTable>;
export type NewRun = Insertable<RunsTable>;

// Dashboard tables (migrations/0002_dashboard.ts).

export const ROLES = ['viewer', 'researcher', 'lead'] as const;
export type Role = (typeof ROLES)[number];

export interface UsersTable {
  id: Generated<number>;
  /** Lower-case. */
  email: string;
  name: string;
  role: Role;
  /** bcrypt hash. */
  password_hash: string;
  disabled: Generated<number>;
  created_at: string;
}

export interface SessionsTable {
  /** sha256 hex of the cookie value; the cookie value itself is never stored. */
  id: string;
  user_id: number;
  csrf_token: string;
  created_at: string;
  expires_at: string;
  /** 0003_security: client address and browser at sign-in, for the user's list of sessions. */
  ip: Generated<string | null>;
  user_agent: Generated<string | null>;
}

export interface ApiTokensTable {
  id: Generated<number>;
  user_id: number;
  name: string;
  /** sha256 hex of the token. */
  token_hash: string;
  created_at: string;
  last_used_at: string | null;
}

export interface InvitesTable {
  id: Generated<number>;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: number | null;
  created_at: string;
  expires_at: string;
  accepted_at: string | null;
  /** 0003_security: set when a lead revoked the invite (it can no longer be accepted). */
  revoked_at: Generated<string | null>;
  revoked_by: Generated<number | null>;
}

export interface PasswordResetsTable {
  id: Generated<number>;
  user_id: number;
  token_hash: string;
  created_at: string;
  expires_at: string;
  used_at: string | null;
}

export interface MeasurementsTable {
  id: Generated<number>;
  study_id: number;
  name: string;
  /** JSON `{csvColumn: input or output name}`. */
  columns: string;
  /** JSON `[{name: number}]`, one object per CSV row. */
  rows: string;
  row_count: number;
  created_by: number | null;
  created_at: string;
}

export interface MailOutboxTable {
  id: Generated<number>;
  to_address: string;
  subject: string;
  text: string;
  /** The raw message as nodemailer built it (RFC 822). */
  raw: string;
  created_at: string;
}

export interface AuditLogTable {
  id: Generated<number>;
  at: string;
  user_id: number | null;
  /** Kept beside user_id: the entry stays readable whatever happens to the account. */
  user_email: string | null;
  action: string;
  /** JSON object. */
  detail: string;
  ip: string | null;
}

// migrations/0005_run_tables.ts: the layout of each run's table (shared/db/result-layout.ts).

export interface ResultColumnsTable {
  run_id: number;
  /** Column c_<idx> of run_results_<run_id>. */
  idx: number;
  role: 'input' | 'output';
  name: string;
  kind: 'number' | 'string' | 'boolean' | 'json';
}

export interface ResultShapesTable {
  run_id: number;
  idx: number;
  /** JSON array of column indices, in the key order of the inputs object. */
  inputs: string;
  /** JSON array of column indices, in the key order of the outputs object. */
  outputs: string;
}

/** Per run and method: results and flagged results stored (kept by the batch writer). */
export interface ResultCountsTable {
  run_id: number;
  method_idx: number;
  results: number;
  flagged: number;
}

/** Per run, method and number column: how many values, the lowest and the highest (kept by the batch writer). */
export interface ResultStatsTable {
  run_id: number;
  method_idx: number;
  column_idx: number;
  count: number;
  minimum: number;
  maximum: number;
}

/** migrations/0004_point_summaries.ts: design summaries, one row per run of consecutive points (shared/design/stored-summaries.ts). */
export interface PointSummariesTable {
  run_id: number;
  first_idx: number;
  end_idx: number;
  /** JSON columns of the range's summaries. */
  facts: string;
  /** JSON `{"<method index>": points, "none": points}`. */
  counts: string;
}
