// Security and availability of the dashboard (issue 10):
// - sessions.ip and sessions.user_agent: where a session was opened, so a user who lists
//   their sessions can tell them apart; an index on expires_at for the periodic clean-up.
// - invites.revoked_at and invites.revoked_by: a lead may revoke an open invite. An address
//   has at most one open invite (shared/db/invites.ts checks it inside a serialised
//   transaction); older duplicates that already exist are revoked here, keeping the newest.
// - runs.pushed_from: the host a pushed run came from (`filmsweep push`), null for runs
//   computed in this database. A pushed run's points are renumbered 0…n−1, so it must never
//   be resumed here, and a push the server did not finish (killed half-way) is removed at
//   start-up rather than marked interrupted.
import { sql, type Kysely } from '#kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('sessions').addColumn('ip', 'text').execute();
  await db.schema.alterTable('sessions').addColumn('user_agent', 'text').execute();
  await db.schema.createIndex('sessions_expires_idx').on('sessions').column('expires_at').execute();

  await db.schema.alterTable('invites').addColumn('revoked_at', 'text').execute();
  await db.schema.alterTable('invites').addColumn('revoked_by', 'integer').execute();
  await db.schema.createIndex('invites_email_idx').on('invites').column('email').execute();
  // Keep the newest open invite of each address; revoke the older ones.
  await sql`update invites set revoked_at = ${new Date().toISOString()}
    where accepted_at is null and revoked_at is null
      and exists (select 1 from invites newer where newer.email = invites.email and newer.id > invites.id
                  and newer.accepted_at is null and newer.revoked_at is null)`.execute(db);

  await db.schema.alterTable('runs').addColumn('pushed_from', 'text').execute();
  await db.schema.createIndex('password_resets_user_idx').on('password_resets').column('user_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('password_resets_user_idx').execute();
  await db.schema.alterTable('runs').dropColumn('pushed_from').execute();
  await db.schema.dropIndex('invites_email_idx').execute();
  await db.schema.alterTable('invites').dropColumn('revoked_by').execute();
  await db.schema.alterTable('invites').dropColumn('revoked_at').execute();
  await db.schema.dropIndex('sessions_expires_idx').execute();
  await db.schema.alterTable('sessions').dropColumn('user_agent').execute();
  await db.schema.alterTable('sessions').dropColumn('ip').execute();
}
