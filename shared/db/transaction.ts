// A Kysely transaction serialised against every other one made here: BEGIN IMMEDIATE on
// SQLite (Kysely's own starts deferred), so a read-then-write transaction cannot fail
// half-way when another process writes; an advisory lock on PostgreSQL. Two processes
// doing the same thing at once are simply serialised. On SQLite the store has one
// connection, so callers must not run other queries on it while this is open.
import type { Kysely } from '#kysely';
import type { Database } from './schema.js';
import type { Store } from './store.js';

export async function immediateTransaction<T>(store: Store, fn: (db: Kysely<Database>) => Promise<T>): Promise<T> {
  return store.dialect.serialized(store.db, fn);
}
