// First schema: studies, their versions (YAML text + hash), runs, points and results.
// Later migrations add the dashboard's tables (users, sessions, api_tokens, invites,
// measurements, mail_outbox, audit_log); nothing here depends on them.
//
// Why no narrow numeric table `result_values(run_id, name, value, result_id)`: measured
// with better-sqlite3 12 / SQLite 3.53 on this machine (200k results × 12 outputs,
// 1000 rows per transaction, WAL, synchronous=NORMAL):
//   results only (JSON columns)                104,000 results/s
//   results + result_values (text name)         14,000 results/s  (7.4× slower)
//   results + result_values (integer name id)   18,000 results/s  (5.8× slower)
//   filling result_values after the run         2× the run's own insert time (1e6 results: 14 s)
// while a filter + sort on JSONB columns of a 1e6-result run
// (`outputs->>'$.Nu' BETWEEN ? AND ? ORDER BY outputs->>'$.h' LIMIT 50`) takes 0.28 s
// (0.80 s with text JSON). So inputs and outputs are stored as JSONB, which the dashboard
// filters and sorts by any name through `->>`, scanning only the run's rows through the
// (run_id, …) indexes. A later migration can still add a value table if runs grow far
// beyond 1e6 results. JSONB keeps each number's decimal text, so json() gives back exactly
// what JSON.stringify wrote (checked on 2e5 random doubles). On PostgreSQL the same
// columns are `json`, which keeps the text as written (shared/db/dialect.ts).
import { sql, type Kysely } from '#kysely';
import { ddl } from './ddl.js';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('studies')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('study_versions')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('study_id', 'integer', (c) => c.notNull().references('studies.id').onDelete('cascade'))
    // 1, 2, 3 … within the study, in the order the contents were first run.
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('hash', 'text', (c) => c.notNull())
    .addColumn('yaml', 'text', (c) => c.notNull())
    .addColumn('title', 'text')
    .addColumn('configuration', 'text', (c) => c.notNull())
    .addColumn('source_file', 'text')
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('study_versions_hash_unique', ['study_id', 'hash'])
    .addUniqueConstraint('study_versions_version_unique', ['study_id', 'version'])
    .execute();

  await db.schema
    .createTable('runs')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('study_version_id', 'integer', (c) => c.notNull().references('study_versions.id').onDelete('cascade'))
    .addColumn('status', 'text', (c) => c.notNull())
    .addColumn('started_at', 'text')
    .addColumn('finished_at', 'text')
    .addColumn('git_commit', 'text')
    .addColumn('host', 'text', (c) => c.notNull())
    .addColumn('pid', 'integer')
    .addColumn('workers', 'integer', (c) => c.notNull())
    .addColumn('points_total', 'integer', (c) => c.notNull())
    .addColumn('points_done', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('results_count', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('flagged_count', 'integer', (c) => c.notNull().defaultTo(0))
    // JSON [{id, version}] in the order of results.method_idx.
    .addColumn('methods', 'text', (c) => c.notNull())
    .addColumn('error', 'text')
    .addCheckConstraint('runs_status_check', sql`status in ('queued', 'running', 'done', 'failed', 'interrupted')`)
    .execute();
  await db.schema.createIndex('runs_study_version_idx').on('runs').column('study_version_id').execute();
  await db.schema.createIndex('runs_status_idx').on('runs').column('status').execute();

  // One row per computed point; inputs as JSONB. Clustered on (run_id, idx) so a run's
  // points read in sweep order and resume finds the missing indices from the key alone.
  await ddl
    .clustered(db, db.schema.createTable('points'))
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('idx', 'integer', (c) => c.notNull())
    .addColumn('inputs', ddl.jsonType(db), (c) => c.notNull())
    .addPrimaryKeyConstraint('points_pk', ['run_id', 'idx'])
    .execute();

  await db.schema
    .createTable('results')
    .addColumn('id', ddl.rowIdType(db), ddl.rowId(db))
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('point_idx', 'integer', (c) => c.notNull())
    // Position of the method in runs.methods; fixes the row order within a point.
    .addColumn('method_idx', 'integer', (c) => c.notNull())
    .addColumn('method', 'text', (c) => c.notNull())
    .addColumn('outputs', ddl.jsonType(db), (c) => c.notNull())
    .addColumn('flags', 'text', (c) => c.notNull())
    .addColumn('flagged', 'integer', (c) => c.notNull())
    .execute();
  // Exactly one result per point and method: a resumed run can never duplicate a row.
  await db.schema
    .createIndex('results_point_method_unique')
    .on('results')
    .columns(['run_id', 'point_idx', 'method_idx'])
    .unique()
    .execute();
  // No further index on results: each costs every insert (a (run_id, method, flagged)
  // index cost 5–15 % of write throughput here), and per-run queries already reach the
  // run's rows through the unique index's run_id prefix.
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('results').execute();
  await db.schema.dropTable('points').execute();
  await db.schema.dropTable('runs').execute();
  await db.schema.dropTable('study_versions').execute();
  await db.schema.dropTable('studies').execute();
}
