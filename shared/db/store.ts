// Opening the database: one better-sqlite3 connection shared by Kysely (everything but
// the hot path) and by prepared statements (batch-writer.ts). WAL lets the dashboard
// read while the CLI writes; synchronous=NORMAL is safe in WAL against a killed process
// (a committed transaction survives kill -9; only a power loss may drop the last ones).
import { existsSync, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import BetterSqlite3 from 'better-sqlite3';
import { Kysely, SqliteDialect } from 'kysely';
import { InputError } from '../physics/types.js';
import { BUSY_TIMEOUT_MS } from './busy.js';
import { migrateToLatest } from './migrate.js';
import type { Database } from './schema.js';

export interface Store {
  /** Absolute path of the database file (or `:memory:`). */
  path: string;
  db: Kysely<Database>;
  /** The raw connection under `db`, for the batch writer's prepared statements. */
  sqlite: BetterSqlite3.Database;
  /** Migrations applied while opening (empty when the schema was current). */
  migrated: string[];
}

export interface OpenOptions {
  /** Apply pending migrations (default true; `filmsweep migrate` opens without). */
  migrate?: boolean;
  /** Create the file when missing (default true); false: a missing file is bad input. */
  create?: boolean;
}

export async function openStore(path: string, options: OpenOptions = {}): Promise<Store> {
  if (path !== ':memory:') {
    if (options.create === false && !existsSync(path)) throw new InputError(`no database at ${path} (run a study first, or pass --db)`);
    mkdirSync(dirname(path), { recursive: true });
  }
  const sqlite = new BetterSqlite3(path, { timeout: BUSY_TIMEOUT_MS });
  try {
    sqlite.pragma('journal_mode = WAL');
    sqlite.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
    sqlite.pragma('synchronous = NORMAL');
    sqlite.pragma('foreign_keys = ON');
  } catch (e) {
    sqlite.close();
    throw e;
  }
  const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }) });
  const store: Store = { path, db, sqlite, migrated: [] };
  if (options.migrate ?? true) {
    try {
      store.migrated = await migrateToLatest(db);
    } catch (e) {
      await closeStore(store);
      throw e;
    }
  }
  return store;
}

export async function closeStore(store: Store): Promise<void> {
  await store.db.destroy(); // closes the better-sqlite3 connection too
}
