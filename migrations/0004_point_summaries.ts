// Per-point design summaries (issue 11): for every point of a run, the methods whose
// validity ranges hold there, their spread, and the recommended method with the reason
// (shared/design/summary.ts). One row per point, clustered on (run_id, point_idx) like
// `points`. The runner writes a batch's summaries just before the batch itself, so every
// stored point has its summary; a summary whose point was never committed (a kill between
// the two writes) is ignored by the readers, which join on `points`, and is written again,
// identically, when the point is computed again.
import type { Kysely } from 'kysely';
import { ddl } from '../shared/db/dialect.js';

export async function up(db: Kysely<any>): Promise<void> {
  await ddl
    .clustered(db, db.schema.createTable('point_summaries'))
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('point_idx', 'integer', (c) => c.notNull())
    // Method id, or null where no method applies (flags then hold no-applicable-method).
    .addColumn('recommended', 'text')
    // JSON array of method ids, in the run's method order.
    .addColumn('applicable', 'text', (c) => c.notNull())
    // max/min − 1 of `spread_of` over the applicable methods.
    .addColumn('spread', 'double precision')
    .addColumn('spread_of', 'text')
    .addColumn('reason', 'text', (c) => c.notNull())
    // JSON array of flags.
    .addColumn('flags', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('point_summaries_pk', ['run_id', 'point_idx'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('point_summaries').execute();
}
