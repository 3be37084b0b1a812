// Each run's results in a table of its own, `run_results_<run id>`, with one plain column
// per input and output name (shared/db/result-layout.ts, result-table.ts), instead of JSON
// documents in the shared points/results tables; and the results caches of 0002 go.
//
// Why: measured with better-sqlite3 12 / SQLite 3.53 on this 2-core machine, CPU time to
// insert 1e6 results (2 methods × 5e5 points; Re, Pr, Nu, f), WAL, synchronous=NORMAL:
//   narrow table (run, point, method, Re, Pr, Nu), one row per call: the issue's yardstick   0.63 s
//   points + results as JSONB (0001), one row per call, unique index                      3.06 s
//   one row per result, JSON text beside typed columns, one row per call                 1.98 s
//   one row per result, typed columns (and method, flag), one row per call               1.03 s
//   typed columns only, 256 rows per INSERT (what the batch writer does)                0.51 s
// and the JSONB rows then needed a second copy (the results cache, 2.4 s for 1e6 results)
// before the dashboard could filter and sort them quickly. A row of the run table is what
// the dashboard filters and sorts (no copy, no join to points), and it reads back exactly:
// each row names its shape (the columns of its inputs and outputs objects, in key order;
// result_shapes), numbers are stored as doubles (no text round trip), other values by kind
// (result_columns). A table per run keeps every run's columns its own and dropping a run
// cheap; `seq` (point × methods + method) is the rowid on SQLite, so rows stay in sweep
// order, a batch written twice inserts nothing (ON CONFLICT DO NOTHING on seq) and no
// further index costs the inserts.
//
// Runs stored before this migration keep their rows in points/results (runs.results_table
// = 0) and are read from there until they are converted, in small steps between requests
// on the dashboard or before `resume` continues one (shared/db/legacy-results.ts).
//
// down() cannot put the new runs back into points/results without the code of shared/db
// (which migrations do not import): it drops their tables and deletes those runs.
import { sql, type Kysely } from '#kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // 1: the run's results are in run_results_<id>; 0: in points/results (stored before 0005).
  await db.schema.alterTable('runs').addColumn('results_table', 'integer', (c) => c.notNull().defaultTo(0)).execute();

  await db.schema
    .createTable('result_columns')
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    // Column c_<idx> of the run's table.
    .addColumn('idx', 'integer', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('result_columns_pk', ['run_id', 'idx'])
    .addCheckConstraint('result_columns_role_check', sql`role in ('input', 'output')`)
    .addCheckConstraint('result_columns_kind_check', sql`kind in ('number', 'string', 'boolean', 'json')`)
    .execute();

  await db.schema
    .createTable('result_shapes')
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('idx', 'integer', (c) => c.notNull())
    // JSON arrays of column indices, in the key order of the inputs and outputs objects.
    .addColumn('inputs', 'text', (c) => c.notNull())
    .addColumn('outputs', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('result_shapes_pk', ['run_id', 'idx'])
    .execute();

  // Per run and method, maintained by every batch write (only rows actually inserted count):
  // the results and flagged results, and per number column the count, lowest and highest
  // value. The run summary and the charts' axis ranges read these instead of a pass over
  // the rows.
  await db.schema
    .createTable('result_counts')
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('method_idx', 'integer', (c) => c.notNull())
    .addColumn('results', 'integer', (c) => c.notNull())
    .addColumn('flagged', 'integer', (c) => c.notNull())
    .addPrimaryKeyConstraint('result_counts_pk', ['run_id', 'method_idx'])
    .execute();
  await db.schema
    .createTable('result_stats')
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('method_idx', 'integer', (c) => c.notNull())
    .addColumn('column_idx', 'integer', (c) => c.notNull())
    .addColumn('count', 'integer', (c) => c.notNull())
    .addColumn('minimum', 'double precision', (c) => c.notNull())
    .addColumn('maximum', 'double precision', (c) => c.notNull())
    .addPrimaryKeyConstraint('result_stats_pk', ['run_id', 'method_idx', 'column_idx'])
    .execute();

  // The results caches were derived data, now replaced by the run tables.
  const caches = await db.selectFrom('result_caches').select('table_name').execute();
  for (const c of caches) await sql`drop table if exists ${sql.id(c.table_name)}`.execute(db);
  await db.schema.dropTable('result_caches').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  const runs = await db.selectFrom('runs').select('id').where('results_table', '=', 1).execute();
  for (const r of runs) await sql`drop table if exists ${sql.id(`run_results_${Number(r.id)}`)}`.execute(db);
  if (runs.length) await db.deleteFrom('runs').where('results_table', '=', 1).execute();
  await db.schema.dropTable('result_stats').execute();
  await db.schema.dropTable('result_counts').execute();
  await db.schema.dropTable('result_shapes').execute();
  await db.schema.dropTable('result_columns').execute();
  await db.schema.alterTable('runs').dropColumn('results_table').execute();
  await db.schema
    .createTable('result_caches')
    .addColumn('run_id', 'integer', (c) => c.primaryKey().references('runs.id').onDelete('cascade'))
    .addColumn('table_name', 'text', (c) => c.notNull())
    .addColumn('results_count', 'integer', (c) => c.notNull())
    .addColumn('columns', 'text', (c) => c.notNull())
    .addColumn('built_at', 'text', (c) => c.notNull())
    .execute();
}
