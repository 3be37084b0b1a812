// A Kysely transaction that starts with BEGIN IMMEDIATE (Kysely's own starts deferred):
// a read-then-write transaction cannot then fail half-way when another process writes,
// and two processes doing the same thing at once are simply serialised. The store has
// one connection, so callers must not run other queries on it while this is open.
import { sql, type Kysely } from 'kysely';
import { retryBusy } from './busy.js';

export async function immediateTransaction<DB, T>(db: Kysely<DB>, fn: (db: Kysely<DB>) => Promise<T>): Promise<T> {
  return retryBusy(async () => {
    await sql`begin immediate`.execute(db);
    try {
      const value = await fn(db);
      await sql`commit`.execute(db);
      return value;
    } catch (e) {
      await sql`rollback`.execute(db);
      throw e;
    }
  });
}
