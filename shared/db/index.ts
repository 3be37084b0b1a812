// The store: SQLite or PostgreSQL through Kysely (schema in migrations/, dialect
// differences in dialect.ts, each run's results in its own table: result-table.ts), plus
// the queries the CLI and the dashboard server share.
export { openStore, closeStore, type Store, type OpenOptions } from './store.js';
export { resolveDbPath, isDatabaseUrl, redactUrl, DEFAULT_DB_FILE } from './path.js';
export type { Dialect, DialectName } from './dialect.js';
export { migrateToLatest, pendingMigrations } from './migrate.js';
export type { Database, RunStatus, RunRow } from './schema.js';
export { RUN_STATUSES } from './schema.js';
export {
  listRuns,
  getRun,
  getRunDetails,
  resolveRunRef,
  getRunRows,
  getRunSummary,
  type RunInfo,
  type RunDetails,
  type MethodSummary,
  type ListRunsOptions,
} from './queries.js';
export {
  createRun,
  deleteRun,
  finishRun,
  getRunSource,
  claimRunForResume,
  resumeRefusal,
  type MethodVersion,
  type NewRunSpec,
  type RunSource,
} from './runs.js';
export { createBatchWriter, type BatchWriter, type BatchWriterOptions, type EncodedBatch, type SummarizedBatch, type WrittenCounts } from './batch-writer.js';
export { ResultBatchEncoder, RunLayout, type ResultBatch, type ResultColumn, type ResultShape, type ColumnKind } from './result-layout.js';
export { convertLegacyRun } from './legacy-results.js';
export { immediateTransaction } from './transaction.js';
export { isBusyError } from './busy.js';
// The dashboard's store modules (migrations/0002_dashboard.ts).
export { ROLES, type Role } from './schema.js';
export * from './users.js';
export * from './sessions.js';
export * from './tokens.js';
export * from './invites.js';
export * from './audit.js';
export * from './outbox.js';
export * from './measurements.js';
export * from './studies.js';
export * from './results-query.js';
export * from './point-summaries.js';
export { newSecret, hashSecret } from './secrets.js';
