// Per-point design summaries (issue 11): for every point of a run, the methods whose
// validity ranges hold there, their spread, and the recommended method (shared/design/
// summary.ts). Stored per run of consecutive points of a batch (shared/design/
// stored-summaries.ts): one row per batch rather than per point, so a plain sweep keeps
// its write rate. The runner writes a batch's summaries just before the batch itself, so
// every stored point has its summary; a range whose batch was never committed (a kill
// between the two writes) is ignored by the counts, which take a range once its last
// point is stored, and a resumed batch's range that starts at the same point is not
// written twice (on conflict do nothing; its content is the same, computed again).
import type { Kysely } from '#kysely';
import { ddl } from './ddl.js';

export async function up(db: Kysely<any>): Promise<void> {
  await ddl
    .clustered(db, db.schema.createTable('point_summaries'))
    .addColumn('run_id', 'integer', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('first_idx', 'integer', (c) => c.notNull())
    // One past the range's last point.
    .addColumn('end_idx', 'integer', (c) => c.notNull())
    // JSON {recommended: [method index | null], applicable: [[method index]], spread: [number | null], spread_of: [name | null]};
    // newer rows give recommended, applicable and spread_of as {runs: [[value, points], …]} (shared/design/stored-summaries.ts).
    .addColumn('facts', 'text', (c) => c.notNull())
    // JSON {"<method index>": points, "none": points}: what `show` adds up.
    .addColumn('counts', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('point_summaries_pk', ['run_id', 'first_idx'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('point_summaries').execute();
}
