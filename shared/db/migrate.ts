// Applying migrations/ through Kysely's Migrator.
// SQLite: the Migrator's own transaction starts with a deferred BEGIN, which two
// processes opening a fresh database at once could both enter; here the whole migration
// runs inside one BEGIN IMMEDIATE instead, so the second process waits (busy timeout),
// then finds nothing left to do. PostgreSQL: the Migrator's own transaction and its
// advisory lock do the same.
import { Migrator, sql, type Kysely, type MigrationResult } from '#kysely';
import { migrations } from '../../migrations/index.js';
import { retryBusy } from './busy.js';
import { isPostgres } from '../../migrations/ddl.js';

function migrator(db: Kysely<any>): Migrator {
  return new Migrator({
    db,
    provider: { getMigrations: async () => migrations },
    disableTransactions: !isPostgres(db), // SQLite: we hold our own BEGIN IMMEDIATE
  });
}

export async function pendingMigrations(db: Kysely<any>): Promise<string[]> {
  return (await migrator(db).getMigrations()).filter((m) => !m.executedAt).map((m) => m.name);
}

function applied(results: MigrationResult[] | undefined): string[] {
  return (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName);
}

/** Applies every pending migration; returns the names applied (empty when up to date). */
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  if ((await pendingMigrations(db)).length === 0) return [];
  if (isPostgres(db)) {
    const outcome = await migrator(db).migrateToLatest();
    if (outcome.error) throw outcome.error;
    return applied(outcome.results);
  }
  return retryBusy(async () => {
    await sql`begin immediate`.execute(db);
    let results: MigrationResult[] | undefined;
    try {
      const outcome = await migrator(db).migrateToLatest();
      if (outcome.error) throw outcome.error;
      results = outcome.results;
      await sql`commit`.execute(db);
    } catch (e) {
      await sql`rollback`.execute(db);
      throw e;
    }
    return applied(results);
  });
}
