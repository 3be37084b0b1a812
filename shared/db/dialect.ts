// Everything that differs between the two stores, SQLite (better-sqlite3, one connection)
// and PostgreSQL (pg.Pool), in one place: column types for DDL, JSON reading and number
// extraction, raw statements with `?` placeholders, atomic statement lists, and the
// serialised ("immediate") transactions. The rest of shared/db and migrations/ ask this
// module and never test the dialect themselves. The batch writer's two hot paths live
// here too (batch-writer.ts defines what they do).
//
// JSON columns: SQLite stores JSONB (see migrations/0001_initial.ts); PostgreSQL stores
// `json`, which keeps the text exactly as written (key order and each number's decimal
// text), so exports read back what the runner wrote, byte for byte, on both stores.
import type BetterSqlite3 from 'better-sqlite3';
import type pg from 'pg';
import { sql, type Kysely, type RawBuilder } from 'kysely';
import { ddl, isPostgres } from '../../migrations/ddl.js';
import type { BatchWriter, EncodedBatch, WrittenCounts } from './batch-writer.js';
import { retryBusy, retryBusySync } from './busy.js';

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
  /**
   * Statements (re)creating a results cache table: plain value columns (SQLite: no
   * declared type, strings stay strings; PostgreSQL: float8, numbers only), filled from
   * `select` (which gives result_id, point_idx, method_idx, flagged, then the values, in
   * seq order).
   */
  cacheTable(table: string, valueColumns: string[], select: string): Statement[];
  /** Rows of a statement, one at a time (SQLite streams them; PostgreSQL reads them all). */
  each<T>(query: string, params: unknown[], fn: (row: T) => void): Promise<void>;
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
  /** The hot path (batch-writer.ts): one batch, idempotent, counters by inserted rows. */
  batchWriter(runId: number, methodIds: readonly string[]): BatchWriter;
  /** Steers SQLite to an index (` indexed by …`); PostgreSQL's planner takes no hints. */
  indexHint(index: string): string;
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
    batchWriter: (runId, methodIds) => sqliteBatchWriter(sqlite, runId, methodIds),
    indexHint: (index) => ` indexed by ${index}`,
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
    cacheTable: (table, valueColumns, select) => [
      { sql: `drop table if exists ${table}` },
      {
        sql:
          `create table ${table} (seq integer primary key, result_id integer not null, point_idx integer not null, ` +
          `method_idx integer not null, flagged integer not null${valueColumns.map((c) => `, ${c}`).join('')})`,
      },
      // seq is the rowid: numbered in the select's order.
      { sql: `insert into ${table} (result_id, point_idx, method_idx, flagged${valueColumns.map((c) => `, ${c}`).join('')}) ${select}` },
    ],
    each: async <T>(query: string, params: unknown[], fn: (row: T) => void) => {
      for (const row of sqlite.prepare(query).iterate(...params)) fn(row as T);
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
    batchWriter: (runId, methodIds) => postgresBatchWriter(pool, runId, methodIds),
    indexHint: () => '',
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
    cacheTable: (table, valueColumns, select) => [
      { sql: `drop table if exists ${table}` },
      {
        sql:
          `create table ${table} (seq bigint primary key, result_id bigint not null, point_idx integer not null, ` +
          `method_idx integer not null, flagged integer not null${valueColumns.map((c) => `, ${c} float8`).join('')})`,
      },
      // No rowid: seq is numbered explicitly, in the select's order.
      {
        sql:
          `insert into ${table} (seq, result_id, point_idx, method_idx, flagged${valueColumns.map((c) => `, ${c}`).join('')}) ` +
          `select row_number() over (order by point_idx, method_idx), * from (${select}) numbered`,
      },
    ],
    each: async <T>(query: string, params: unknown[], fn: (row: T) => void) => {
      for (const row of (await pool.query(numberPlaceholders(query), params)).rows) fn(row as T);
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

const EMPTY_FLAGS = '[]';

function checkShape(batch: EncodedBatch, M: number): void {
  const { points, outputs, flags } = batch;
  if (outputs.length !== points.length * M || flags.length !== outputs.length) {
    throw new Error(`batch of ${points.length} points has ${outputs.length} results for ${M} methods`);
  }
}

// SQLite's hot path: statements straight to better-sqlite3, prepared once, on the same
// connection Kysely uses: building, compiling and awaiting a Kysely query per row costs
// more than the insert itself at 1e6 rows, and the batch is written synchronously to stay
// one transaction on the shared connection.
function sqliteBatchWriter(sqlite: BetterSqlite3.Database, runId: number, methodIds: readonly string[]): BatchWriter {
  const insertPoint = sqlite.prepare('insert into points (run_id, idx, inputs) values (?, ?, jsonb(?)) on conflict do nothing');
  const insertResult = sqlite.prepare(
    'insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (?, ?, ?, ?, jsonb(?), ?, ?) on conflict do nothing',
  );
  const advance = sqlite.prepare(
    'update runs set points_done = points_done + ?, results_count = results_count + ?, flagged_count = flagged_count + ? where id = ?',
  );
  const M = methodIds.length;
  const writeAll = sqlite.transaction((batch: EncodedBatch): WrittenCounts => {
    checkShape(batch, M);
    const { points, inputs, outputs, flags } = batch;
    let pointsIn = 0;
    let resultsIn = 0;
    let flagged = 0;
    for (let i = 0; i < points.length; i++) {
      pointsIn += insertPoint.run(runId, points[i], inputs[i]).changes;
      for (let m = 0, k = i * M; m < M; m++, k++) {
        const isFlagged = flags[k] === EMPTY_FLAGS ? 0 : 1;
        if (insertResult.run(runId, points[i], m, methodIds[m], outputs[k], flags[k], isFlagged).changes) {
          resultsIn++;
          flagged += isFlagged;
        }
      }
    }
    if (pointsIn || resultsIn) advance.run(pointsIn, resultsIn, flagged, runId);
    return { points: pointsIn, results: resultsIn, flagged };
  });
  // BEGIN IMMEDIATE: take the write lock up front, so waiting for another process happens
  // in the busy handler instead of failing half-way through the batch.
  return {
    write: (batch) => {
      try {
        return Promise.resolve(retryBusySync(() => writeAll.immediate(batch)));
      } catch (e) {
        return Promise.reject(e);
      }
    },
  };
}

// PostgreSQL's: two multi-row INSERT … SELECT FROM unnest(arrays) statements (a fixed
// number of parameters whatever the batch size) and one UPDATE, in one transaction on a
// pooled connection; rows go in key order (see retryDeadlock). Measured here: 45,000
// results/s end to end against SQLite's 110,000 (a loaded 2-core machine); COPY would
// need another package.
function postgresBatchWriter(pool: pg.Pool, runId: number, methodIds: readonly string[]): BatchWriter {
  const M = methodIds.length;
  return {
    write: async (batch) => {
      checkShape(batch, M);
      const { points, inputs, outputs, flags } = batch;
      const pointIdx: number[] = [];
      const methodIdx: number[] = [];
      const methods: string[] = [];
      const flaggedOf: number[] = [];
      for (let i = 0; i < points.length; i++) {
        for (let m = 0; m < M; m++) {
          pointIdx.push(points[i]);
          methodIdx.push(m);
          methods.push(methodIds[m]);
          flaggedOf.push(flags[i * M + m] === EMPTY_FLAGS ? 0 : 1);
        }
      }
      return retryDeadlock(async () => {
        const client = await pool.connect();
        try {
          await client.query('begin');
          const p = await client.query(
            `with ins as (
               insert into points (run_id, idx, inputs)
               select $1, u.idx, u.inputs from unnest($2::int[], $3::json[]) as u(idx, inputs)
               order by u.idx
               on conflict do nothing returning 1)
             select count(*)::int as n from ins`,
            [runId, points, inputs],
          );
          const r = await client.query(
            `with ins as (
               insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged)
               select $1, u.p, u.m, u.name, u.outputs, u.flags, u.flagged
               from unnest($2::int[], $3::int[], $4::text[], $5::json[], $6::text[], $7::int[]) as u(p, m, name, outputs, flags, flagged)
               order by u.p, u.m
               on conflict do nothing returning flagged)
             select count(*)::int as n, coalesce(sum(flagged), 0)::int as f from ins`,
            [runId, pointIdx, methodIdx, methods, outputs, flags, flaggedOf],
          );
          const written: WrittenCounts = { points: p.rows[0].n, results: r.rows[0].n, flagged: r.rows[0].f };
          if (written.points || written.results) {
            await client.query(
              'update runs set points_done = points_done + $1, results_count = results_count + $2, flagged_count = flagged_count + $3 where id = $4',
              [written.points, written.results, written.flagged, runId],
            );
          }
          await client.query('commit');
          return written;
        } catch (e) {
          await client.query('rollback').catch(() => undefined);
          throw e;
        } finally {
          client.release();
        }
      });
    },
  };
}

/**
 * Two writers of overlapping batches wait for each other's uncommitted rows; rows go in
 * key order so they cannot wait in a circle, and should PostgreSQL still report a
 * deadlock (40P01), the whole transaction is simply run again.
 */
async function retryDeadlock<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await fn();
    } catch (e) {
      if ((e as { code?: unknown })?.code !== '40P01' || attempt >= 5) throw e;
      await new Promise((r) => setTimeout(r, 20 * 2 ** attempt * Math.random()));
    }
  }
}
