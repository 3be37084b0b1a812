// The dashboard's tables: accounts and their sessions, API tokens, invitations and
// password resets, measurements, the local mail outbox, the audit log, and the results
// caches that make dashboard queries on large runs fast; plus runs.reference and
// runs.started_by.
//
// Why result_caches: a filtered, sorted page of a 1e6-result run straight off the JSONB
// columns costs a full scan per query (count 0.20 s + page 0.24 s, measured with
// better-sqlite3 12 / SQLite 3.53 here; 0.31 s when the filter is on an input, which
// needs the join to points). For a finished run of 20,000 results or more the dashboard
// copies the results once into a plain table `results_cache_<run>` (one row per result in
// point and method order, one column per input and output name; 2.2 s for 1e6 results,
// done when a dashboard run ends or at the first query) and creates covering indexes on
// the column combinations the dashboard actually filters and sorts by, on first use
// (about 1 s each). The same page then costs 20–50 ms (count through the index led by the
// filter column, page by walking the index led by the sort column), against 90–110 ms for
// a table scan with a sort. The caches are derived data: dropping them loses nothing.
// Those tables are made at run time (shared/db/results-cache.ts); this migration only
// creates their registry.
//
// users are disabled, never deleted, so runs.started_by needs no foreign key (SQLite's
// DROP COLUMN, used by down(), refuses a column that has one).
import { sql, type Kysely } from '#kysely';
import { ddl } from './ddl.js';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('disabled', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addCheckConstraint('users_role_check', sql`role in ('viewer', 'researcher', 'lead')`)
    .execute();

  await db.schema
    .createTable('sessions')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('csrf_token', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sessions_user_idx').on('sessions').column('user_id').execute();

  await db.schema
    .createTable('api_tokens')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('last_used_at', 'text')
    .execute();
  await db.schema.createIndex('api_tokens_user_idx').on('api_tokens').column('user_id').execute();

  await db.schema
    .createTable('invites')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addColumn('accepted_at', 'text')
    .addCheckConstraint('invites_role_check', sql`role in ('viewer', 'researcher', 'lead')`)
    .execute();

  await db.schema
    .createTable('password_resets')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('user_id', 'integer', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('expires_at', 'text', (c) => c.notNull())
    .addColumn('used_at', 'text')
    .execute();

  await db.schema
    .createTable('measurements')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('study_id', 'integer', (c) => c.notNull().references('studies.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('columns', 'text', (c) => c.notNull())
    .addColumn('rows', 'text', (c) => c.notNull())
    .addColumn('row_count', 'integer', (c) => c.notNull())
    .addColumn('created_by', 'integer', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('measurements_study_idx').on('measurements').column('study_id').execute();

  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('to_address', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('raw', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'integer', ddl.autoId(db))
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('user_id', 'integer')
    .addColumn('user_email', 'text')
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('detail', 'text', (c) => c.notNull())
    .addColumn('ip', 'text')
    .execute();

  await db.schema
    .createTable('result_caches')
    .addColumn('run_id', 'integer', (c) => c.primaryKey().references('runs.id').onDelete('cascade'))
    .addColumn('table_name', 'text', (c) => c.notNull())
    .addColumn('results_count', 'integer', (c) => c.notNull())
    .addColumn('columns', 'text', (c) => c.notNull())
    .addColumn('built_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema.alterTable('runs').addColumn('reference', 'integer', (c) => c.notNull().defaultTo(0)).execute();
  await db.schema.alterTable('runs').addColumn('started_by', 'integer').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  const caches = await db.selectFrom('result_caches').select('table_name').execute();
  for (const c of caches) await sql`drop table if exists ${sql.id(c.table_name)}`.execute(db);
  await db.schema.alterTable('runs').dropColumn('started_by').execute();
  await db.schema.alterTable('runs').dropColumn('reference').execute();
  for (const t of ['result_caches', 'audit_log', 'mail_outbox', 'measurements', 'password_resets', 'invites', 'api_tokens', 'sessions', 'users']) {
    await db.schema.dropTable(t).execute();
  }
}
