// Everything that differs between the two stores, SQLite (better-sqlite3, one connection)
// and PostgreSQL (pg.Pool), in one place: column types for DDL, JSON reading and number
// extraction, raw statements with `?` placeholders, atomic statement lists, and the
// serialised ("immediate") transactions. The rest of shared/db asks this module and
// never tests the dialect itself (the batch writer's two hot paths, batch-writer.ts, and
// the run tables' column types, result-table.ts, go by the store's kind).
//
// JSON columns (points and results of runs stored before migrations/0005_run_tables.ts):
// SQLite stores JSONB (see migrations/0001_initial.ts); PostgreSQL stores `json`, which
// keeps the text exactly as written (key order and each number's decimal text).
import type BetterSqlite3 from 'better-sqlite3';
import type pg from 'pg';
import { sql, type Kysely, type RawBuilder } from '#kysely';
import { ddl, isPostgres } from '../../migrations/ddl.js';
import { retryBusy } from './busy.js';

export type DialectName = 'sqlite' | 'postgres';

/** Names that may be written into SQL text (validated by the callers' NAME_PATTERN too). */
const SAFE_NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;

function safeName(name: string): string {
  if (!SAFE_NAME.test(name)) throw new Error(`internal: unsafe JSON key in SQL: ${name}`);
  return name;
}

/** One statement for `atomic`. */
export interface Statement {
  sql: string;
  params?: unknown[];
}

export interface Dialect {
  name: DialectName;
  /** Column type of a JSON column (points.inputs, results.outputs). */
  jsonType: 'blob' | 'json';
  /** SQL turning a JSON value into a placeholder's text: `jsonb(?)` or `?::json`. */
  jsonParam: string;
  /** SQL giving the JSON text of a JSON column (what JSON.parse reads back). */
  jsonText(column: string): string;
  /**
   * SQL giving a JSON field as a number, or null when missing or not a number (SQLite
   * gives strings through as strings, as before; they sort above every number there).
   * `name` must be a plain identifier.
   */
  jsonNumber(column: string, name: string): string;
  /** SQL testing that an expression (from jsonNumber or a cache column) is a number. */
  isNumber(expr: string): string;
  /** SQL of an expression as series-label text ('' when null). */
  labelText(expr: string): string;
  /** SQL of the smaller of two numbers. */
  least(a: string, b: string): string;
  /** SQL of a non-negative number rounded down to an integer. */
  floorInt(expr: string): string;
  /**
   * A query over `from` giving, per group of `groupBy`, the columns of the row whose
   * `column` is lowest (`min`) or highest (`max`).
   */
  extremeRows(from: string, groupBy: string[], column: string, which: 'min' | 'max', columns: string[]): string;
  /**
   * The distinct keys of a JSON-object column of a run's rows (byte order), in a query
   * with one parameter, the run id; `cap` limits the rows read.
   */
  jsonKeysQuery(table: string, column: string, cap?: number): string;
  /** Rows of a statement, one at a time (SQLite streams them; PostgreSQL reads them all). */
  each<T>(query: string, params: unknown[], fn: (row: T) => void): Promise<void>;
  /** The same, each row as an array of its values in select order (no object per row). */
  eachRaw(query: string, params: unknown[], fn: (row: unknown[]) => void): Promise<void>;
  /** Rows of a statement with `?` placeholders. */
  all<T = Record<string, unknown>>(query: string, params?: unknown[]): Promise<T[]>;
  /** Runs a statement; resolves to the rows it changed. */
  run(query: string, params?: unknown[]): Promise<number>;
  /** Runs statements in one transaction (all or none). */
  atomic(statements: Statement[]): Promise<void>;
  /**
   * A transaction that is serialised against every other such transaction on the
   * database: BEGIN IMMEDIATE on SQLite (one connection: callers must not run other
   * queries meanwhile), a transaction-scoped advisory lock on PostgreSQL.
   */
  serialized<DB, T>(db: Kysely<DB>, fn: (db: Kysely<DB>) => Promise<T>): Promise<T>;
  /** ORDER BY suffix that sorts a missing value below every number (SQLite's own order). */
  nullsLow(dir: 'asc' | 'desc'): string;
}

// The DDL helpers live in migrations/ddl.ts (migrations import only that, never
// shared/db); re-exported here for code that already imports them from the dialect.
export { ddl, isPostgres };

/** Kysely fragment of a JSON column's text, for typed queries. */
export function jsonTextSql(db: Kysely<any>, column: string): RawBuilder<string> {
  return sql<string>`${sql.raw(isPostgres(db) ? `${column}::text` : `json(${column})`)}`;
}

/** Kysely fragment of a JSON field as a number (see Dialect.jsonNumber). */
export function jsonNumberSql(db: Kysely<any>, column: string, name: string): RawBuilder<number | null> {
  return sql<number | null>`${sql.raw(isPostgres(db) ? pgJsonNumber(column, name) : sqliteJsonNumber(column, name))}`;
}

function sqliteJsonNumber(column: string, name: string): string {
  return `${column} ->> '$."${safeName(name)}"'`;
}

function pgJsonNumber(column: string, name: string): string {
  const key = safeName(name);
  return `(case when json_typeof(${column} -> '${key}') = 'number' then (${column} ->> '${key}')::float8 end)`;
}

const capClause = (cap?: number) => (cap === undefined ? '' : ` limit ${Math.floor(cap)}`);

export function sqliteDialect(sqlite: BetterSqlite3.Database): Dialect {
  return {
    name: 'sqlite',
    nullsLow: () => '',
    jsonType: 'blob',
    jsonParam: 'jsonb(?)',
    jsonText: (column) => `json(${column})`,
    jsonNumber: sqliteJsonNumber,
    isNumber: (expr) => `typeof(${expr}) in ('integer', 'real')`,
    labelText: (expr) => `coalesce(${expr}, '')`,
    least: (a, b) => `min(${a}, ${b})`,
    floorInt: (expr) => `cast(${expr} as integer)`,
    // A lone min() or max() makes SQLite take the other columns from that row.
    extremeRows: (from, groupBy, column, which, columns) =>
      `select ${columns.map((c) => (c === column ? `${which}(${c}) as ${c}` : c)).join(', ')} from ${from} group by ${groupBy.join(', ')}`,
    jsonKeysQuery: (table, column, cap) =>
      `select distinct j.key from (select ${column} from ${table} where run_id = ?${capClause(cap)}) t, json_each(t.${column}) j order by j.key`,
    each: async <T>(query: string, params: unknown[], fn: (row: T) => void) => {
      for (const row of sqlite.prepare(query).iterate(...params)) fn(row as T);
    },
    eachRaw: async (query, params, fn) => {
      for (const row of sqlite.prepare(query).raw().iterate(...params)) fn(row as unknown[]);
    },
    all: async <T>(query: string, params: unknown[] = []) => sqlite.prepare(query).all(...params) as T[],
    run: async (query, params = []) => sqlite.prepare(query).run(...params).changes,
    atomic: async (statements) => {
      const apply = sqlite.transaction(() => {
        for (const s of statements) sqlite.prepare(s.sql).run(...(s.params ?? []));
      });
      apply.immediate();
    },
    serialized: (db, fn) =>
      retryBusy(async () => {
        await sql`begin immediate`.execute(db);
        try {
          const value = await fn(db);
          await sql`commit`.execute(db);
          return value;
        } catch (e) {
          await sql`rollback`.execute(db);
          throw e;
        }
      }),
  };
}

/** `?` → `$1, $2 …` (no statement of ours has a `?` inside a literal). */
export function numberPlaceholders(query: string): string {
  let n = 0;
  return query.replace(/\?/g, () => `$${++n}`);
}

/** Every serialised transaction takes this advisory lock (any constant of our own). */
const SERIAL_LOCK = 0x46_53_57_50; // "FSWP"

export function postgresDialect(pool: pg.Pool): Dialect {
  return {
    name: 'postgres',
    nullsLow: (dir) => (dir === 'asc' ? ' nulls first' : ' nulls last'),
    jsonType: 'json',
    jsonParam: '?::json',
    jsonText: (column) => `${column}::text`,
    jsonNumber: pgJsonNumber,
    isNumber: (expr) => `${expr} is not null`,
    labelText: (expr) => `coalesce((${expr})::text, '')`,
    least: (a, b) => `least(${a}, ${b})`,
    floorInt: (expr) => `floor(${expr})::int`,
    extremeRows: (from, groupBy, column, which, columns) =>
      `select distinct on (${groupBy.join(', ')}) ${columns.join(', ')} from ${from} order by ${groupBy.join(', ')}, ${column} ${which === 'min' ? 'asc' : 'desc'}`,
    jsonKeysQuery: (table, column, cap) =>
      `select distinct k collate "C" as key from (select ${column} from ${table} where run_id = ?${capClause(cap)}) t, json_object_keys(t.${column}) k order by 1`,
    each: async <T>(query: string, params: unknown[], fn: (row: T) => void) => {
      for (const row of (await pool.query(numberPlaceholders(query), params)).rows) fn(row as T);
    },
    eachRaw: async (query, params, fn) => {
      for (const row of (await pool.query({ text: numberPlaceholders(query), values: params, rowMode: 'array' })).rows) fn(row as unknown[]);
    },
    all: async <T>(query: string, params: unknown[] = []) => (await pool.query(numberPlaceholders(query), params)).rows as T[],
    run: async (query, params = []) => (await pool.query(numberPlaceholders(query), params)).rowCount ?? 0,
    atomic: async (statements) => {
      const client = await pool.connect();
      try {
        await client.query('begin');
        for (const s of statements) await client.query(numberPlaceholders(s.sql), s.params ?? []);
        await client.query('commit');
      } catch (e) {
        await client.query('rollback').catch(() => undefined);
        throw e;
      } finally {
        client.release();
      }
    },
    serialized: (db, fn) =>
      db.transaction().execute(async (trx) => {
        await sql`select pg_advisory_xact_lock(${SERIAL_LOCK})`.execute(trx);
        return fn(trx as unknown as Kysely<any>);
      }),
  };
}
