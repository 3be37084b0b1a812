// Opening the database: a file path (or `:memory:`) is SQLite, a `postgres://` or
// `postgresql://` URL is PostgreSQL (shared/db/dialect.ts holds what differs).
//
// SQLite: one better-sqlite3 connection shared by Kysely (everything but the hot path)
// and by prepared statements (batch-writer.ts). WAL lets the dashboard read while the CLI
// writes; synchronous=NORMAL is safe in WAL against a killed process (a committed
// transaction survives kill -9; only a power loss may drop the last ones).
// PostgreSQL: a pg.Pool shared by Kysely's PostgresDialect and the raw statements.
import { existsSync, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import BetterSqlite3 from 'better-sqlite3';
import { Kysely, PostgresDialect, SqliteDialect } from '#kysely';
import type pg from 'pg';
import { InputError } from '../physics/types.js';
import { BUSY_TIMEOUT_MS } from './busy.js';
import { postgresDialect, sqliteDialect, type Dialect, type DialectName } from './dialect.js';
import { stopBackgroundConversions } from './legacy-results.js';
import { migrateToLatest } from './migrate.js';
import { isDatabaseUrl, redactUrl } from './path.js';
import type { Database } from './schema.js';

export interface Store {
  /** Absolute path of the database file (or `:memory:`), or the URL without its password. */
  path: string;
  kind: DialectName;
  db: Kysely<Database>;
  dialect: Dialect;
  /** SQLite stores only: the raw connection under `db`, for prepared statements. Throws on PostgreSQL. */
  sqlite: BetterSqlite3.Database;
  /** PostgreSQL stores only: the pool under `db`. */
  pool?: pg.Pool;
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
  const store = isDatabaseUrl(path) ? await openPostgres(path) : openSqlite(path, options);
  if (options.migrate ?? true) {
    try {
      store.migrated = await migrateToLatest(store.db);
    } catch (e) {
      await closeStore(store);
      throw e;
    }
  }
  return store;
}

function openSqlite(path: string, options: OpenOptions): Store {
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
  return { path, kind: 'sqlite', db, dialect: sqliteDialect(sqlite), sqlite, migrated: [] };
}

// int8 (counts, sums) and numeric as JS numbers: every count here is far below 2^53.
// json as its text: callers parse it (the same code path as SQLite's json(…)).
const PG_INT8 = 20;
const PG_NUMERIC = 1700;
const PG_JSON = 114;
const pgTypes = (types: typeof pg.types) =>
  ({
    getTypeParser(oid: number, format?: 'text' | 'binary') {
      if (oid === PG_INT8 || oid === PG_NUMERIC) return (v: string) => Number(v);
      if (oid === PG_JSON) return (v: string) => v;
      return types.getTypeParser(oid, format);
    },
  }) as pg.CustomTypesConfig;

async function openPostgres(url: string): Promise<Store> {
  // pg (and the fetch machinery it touches) is loaded only for a PostgreSQL store.
  const { default: pg } = await import('pg');
  const pool = new pg.Pool({ connectionString: url, types: pgTypes(pg.types), max: 10 });
  // An idle client losing its server must not crash the process; the next query reports it.
  pool.on('error', () => undefined);
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  const store = { path: redactUrl(url), kind: 'postgres', db, dialect: postgresDialect(pool), pool, migrated: [] } as Omit<Store, 'sqlite'>;
  Object.defineProperty(store, 'sqlite', {
    get() {
      throw new Error('internal: store.sqlite used on a PostgreSQL store (go through store.dialect)');
    },
  });
  return store as Store;
}

export async function closeStore(store: Store): Promise<void> {
  await stopBackgroundConversions(store);
  await store.db.destroy(); // closes the better-sqlite3 connection or ends the pg pool
}
