// The hot path: one transaction per computed batch holding its rows in the run's table
// (result-table.ts) and the run's progress counters, so a reader sees a batch entirely or
// not at all and a kill -9 loses at most the batches not yet committed. A batch that
// brings a new input or output name (or a new key order) adds the column and the shape to
// the run's layout in the same transaction.
//
// Idempotent: rows go in with ON CONFLICT DO NOTHING on seq (point × methods + method) and
// the counters advance by the rows actually inserted, so a batch written twice (a queue
// job retried after its worker died between commit and acknowledgement) changes nothing
// the second time. The same goes for the per-method figures kept beside the rows
// (result_counts, result_stats: results, flagged, and each number column's count, lowest
// and highest value), which the run summary and the charts read instead of the rows.
//
// SQLite: prepared better-sqlite3 statements, synchronous (one transaction on the
// connection Kysely shares). A batch whose rows are all new (nearly always: one range
// lookup on the rowid tells) goes in up to 256 rows per statement, which costs about
// half of one call per row; runs of rows with one shape and no flags bind only their
// values (and their seq, unless they continue the table's highest one); otherwise row by
// row with ON CONFLICT DO NOTHING, counting what went in. PostgreSQL: one multi-row INSERT … SELECT FROM unnest(arrays)
// per batch (a fixed number of parameters whatever the batch size).
import type pg from 'pg';
import type BetterSqlite3 from 'better-sqlite3';
import { retryBusySync } from './busy.js';
import { numberPlaceholders } from './dialect.js';
import { encodeJsonRows, type ColumnKind, type LayoutMapping, type ResultBatch, type RunLayout } from './result-layout.js';
import { LAYOUT_COLUMNS_SQL, LAYOUT_SHAPES_SQL, layoutAdditions, layoutOf, runTableName, valueColumn } from './result-table.js';
import type { Store } from './store.js';
import type { StoredSummaryRange } from '../design/stored-summaries.js';

export type { ResultBatch };

/** A computed batch with its points' design summaries, encoded by the worker (one entry per run of consecutive points). */
export type SummarizedBatch = (ResultBatch | EncodedBatch) & { summaries?: StoredSummaryRange[] };

/**
 * Per-point summaries go in the batch's own transaction, first: a point is never stored
 * without its summary, and a batch written twice (a retried queue job, a resume) adds no
 * second row for a range that starts at the same point.
 */
const SUMMARY_INSERT = 'insert into point_summaries (run_id, first_idx, end_idx, facts, counts) values (?, ?, ?, ?, ?) on conflict do nothing';

/**
 * A batch as JSON text (the form before migrations/0005_run_tables.ts; still accepted, e.g.
 * from a pushed run): `points[i]`'s inputs as JSON, then per result (point-major, every
 * method of every point) its outputs and the JSON array of its flags.
 */
export interface EncodedBatch {
  points: number[];
  inputs: string[];
  outputs: string[];
  flags: string[];
}

/** Rows a write actually inserted (zero for points already stored). */
export interface WrittenCounts {
  points: number;
  results: number;
  flagged: number;
}

export interface BatchWriter {
  /** Writes the batch (and its summaries) and advances the run's counters by the rows inserted, atomically. */
  write(batch: SummarizedBatch): Promise<WrittenCounts>;
}

export interface BatchWriterOptions {
  /** Advance the run's points_done / results_count / flagged_count (default true; false when converting stored rows). */
  counters?: boolean;
}

export function createBatchWriter(store: Store, runId: number, methodIds: readonly string[], options: BatchWriterOptions = {}): BatchWriter {
  const M = methodIds.length;
  const counters = options.counters ?? true;
  const write = store.kind === 'sqlite' ? sqliteWriter(store.sqlite, runId, M, counters) : postgresWriter(store.pool!, runId, M, counters);
  return {
    write: (batch) => {
      try {
        if (!('columns' in batch) && (batch.outputs.length !== batch.points.length * M || batch.flags.length !== batch.outputs.length)) {
          throw new Error(`batch of ${batch.points.length} points has ${batch.outputs.length} results for ${M} methods`);
        }
        const b = 'columns' in batch ? batch : encodeJsonRows(batch, M);
        checkShape(b, M);
        return write(b, batch.summaries ?? []);
      } catch (e) {
        return Promise.reject(e);
      }
    },
  };
}

function checkShape(batch: ResultBatch, M: number): void {
  const rows = batch.shape.length;
  if (batch.methods !== M || rows !== batch.points.length * M || batch.flags.length !== rows || batch.values.some((v) => v.length !== rows)) {
    throw new Error(`batch of ${batch.points.length} points has ${rows} results for ${M} methods`);
  }
}

/** Run column → the batch's column holding it (−1: none, the row stores null). */
function batchColumnOf(layout: RunLayout, mapping: LayoutMapping): Int32Array {
  const of = new Int32Array(layout.columns.length).fill(-1);
  mapping.columns.forEach((runColumn, batchColumn) => (of[runColumn] = batchColumn));
  return of;
}

/** The value of result r in a batch column for PostgreSQL, which would store NaN as NaN: NaN (no number) becomes null. */
function cell(values: ResultBatch['values'][number], r: number): string | number | null {
  const v = values[r];
  return typeof v === 'number' && v !== v ? null : v;
}

/**
 * SQLite: one row's INSERT (or `rows` rows'). PostgreSQL: the batch's INSERT … SELECT FROM
 * unnest(one array per column), giving the seq of each row inserted.
 */
function insertSql(runId: number, columns: number, dialect: 'sqlite' | 'postgres', kinds: ColumnKind[] = [], rows = 1): string {
  const names = ['seq', 'shape', 'flags', ...Array.from({ length: columns }, (_, k) => valueColumn(k))];
  if (dialect === 'sqlite') {
    const row = `(${names.map(() => '?').join(', ')})`;
    const into = `insert into ${runTableName(runId)} (${names.join(', ')}) values `;
    // One row: may meet a stored row (skipped and not counted); several: only where none can.
    return rows === 1 ? `${into}${row} on conflict do nothing` : `${into}${Array(rows).fill(row).join(', ')}`;
  }
  const PG_ARRAY: Record<ColumnKind, string> = { number: 'float8[]', string: 'text[]', boolean: 'int[]', json: 'text[]' };
  const types = ['bigint[]', 'int[]', 'text[]', ...kinds.map((k) => PG_ARRAY[k])];
  return (
    `with ins as (insert into ${runTableName(runId)} (${names.join(', ')}) ` +
    `select * from unnest(${types.map((t, i) => `$${i + 1}::${t}`).join(', ')}) as u(${names.join(', ')}) order by u.seq ` +
    'on conflict do nothing returning seq) select seq from ins'
  );
}

/**
 * SQLite, rows that are all new and share one shape and no flags (nearly every row of a
 * sweep): `rows` rows per statement with the shape written into the statement, and the seq
 * left to SQLite when `appended` (the rows continue the table's highest seq one by one,
 * which is how SQLite numbers a row given none: its largest rowid + 1). Fewer values to
 * bind and no key lookup per row: 1e6 rows of 4 values cost 0.33 s of CPU here against
 * 0.52 s with seq, shape and flags bound.
 */
function uniformInsertSql(runId: number, columns: number, rows: number, shape: number, appended: boolean): string {
  if (!Number.isInteger(shape) || shape < 0) throw new Error(`internal: bad shape ${shape}`);
  const values = Array.from({ length: columns }, (_, k) => valueColumn(k));
  const names = [...(appended ? [] : ['seq']), 'shape', 'flags', ...values];
  const row = `(${[...(appended ? [] : ['?']), String(shape), 'null', ...values.map(() => '?')].join(', ')})`;
  return `insert into ${runTableName(runId)} (${names.join(', ')}) values ${Array(rows).fill(row).join(', ')}`;
}

/** Per method: results and flagged results inserted; per method and run column: count, lowest, highest. */
interface BatchFigures {
  counts: { method: number; results: number; flagged: number }[];
  stats: { method: number; column: number; count: number; minimum: number; maximum: number }[];
}

/** The figures of a batch's rows that were inserted (all of them when `inserted` is not given). */
function figures(batch: ResultBatch, mapping: LayoutMapping, M: number, inserted?: Uint8Array): BatchFigures {
  const rows = batch.shape.length;
  const results = new Array<number>(M).fill(0);
  const flagged = new Array<number>(M).fill(0);
  for (let r = 0; r < rows; r++) {
    if (inserted && !inserted[r]) continue;
    results[r % M]++;
    if (batch.flags[r] !== null) flagged[r % M]++;
  }
  const stats: BatchFigures['stats'] = [];
  batch.values.forEach((values, b) => {
    if (!(values instanceof Float64Array)) return;
    for (let m = 0; m < M; m++) {
      let count = 0;
      let minimum = Infinity;
      let maximum = -Infinity;
      for (let r = m; r < rows; r += M) {
        const v = values[r];
        if (v !== v || (inserted && !inserted[r])) continue;
        count++;
        if (v < minimum) minimum = v;
        if (v > maximum) maximum = v;
      }
      if (count) stats.push({ method: m, column: mapping.columns[b], count, minimum, maximum });
    }
  });
  return { counts: results.map((n, m) => ({ method: m, results: n, flagged: flagged[m] })).filter((c) => c.results > 0), stats };
}

const COUNTS_UPSERT =
  'insert into result_counts (run_id, method_idx, results, flagged) values (?, ?, ?, ?) on conflict (run_id, method_idx) ' +
  'do update set results = result_counts.results + excluded.results, flagged = result_counts.flagged + excluded.flagged';
const STATS_UPSERT = (least: string, greatest: string) =>
  'insert into result_stats (run_id, method_idx, column_idx, count, minimum, maximum) values (?, ?, ?, ?, ?, ?) ' +
  'on conflict (run_id, method_idx, column_idx) do update set count = result_stats.count + excluded.count, ' +
  `minimum = ${least}(result_stats.minimum, excluded.minimum), maximum = ${greatest}(result_stats.maximum, excluded.maximum)`;

/**
 * Rows per multi-row INSERT on SQLite, largest first (the rest of a batch takes the smaller
 * ones). Measured here, 1e6 rows of 7 values: 32 rows 0.60 s of CPU, 64 0.58 s, 128 0.55 s,
 * 256 0.51 s, against 0.64 s for a bare loop of one row per call into a narrow table.
 * SQLite allows 32,766 values per statement: wide runs take fewer rows.
 */
const ROWS_PER_INSERT = [256, 16, 1];
const MAX_VALUES = 32_000;

const ADVANCE = 'update runs set points_done = points_done + ?, results_count = results_count + ?, flagged_count = flagged_count + ? where id = ?';

function sqliteWriter(sqlite: BetterSqlite3.Database, runId: number, M: number, counters: boolean): (batch: ResultBatch, summaries: StoredSummaryRange[]) => Promise<WrittenCounts> {
  const advance = sqlite.prepare(ADVANCE);
  const summaryInsert = sqlite.prepare(SUMMARY_INSERT);
  const load = () => layoutOf(sqlite.prepare(LAYOUT_COLUMNS_SQL).all(runId) as Record<string, unknown>[], sqlite.prepare(LAYOUT_SHAPES_SQL).all(runId) as Record<string, unknown>[]);
  // The layout as this process last committed or read it; a failed transaction leaves it as it was.
  let layout: RunLayout | undefined;
  const statements = new Map<string, BetterSqlite3.Statement>();
  const prepared = (key: string, sql: () => string) => {
    let st = statements.get(key);
    if (!st) statements.set(key, (st = sqlite.prepare(sql())));
    return st;
  };
  const statement = (columns: number, rows: number) => prepared(`${columns}/${rows}`, () => insertSql(runId, columns, 'sqlite', [], rows));
  const uniformStatement = (columns: number, rows: number, shape: number, appended: boolean) =>
    prepared(`${columns}/${rows}/${shape}/${appended ? 'a' : 's'}`, () => uniformInsertSql(runId, columns, rows, shape, appended));
  // Parameter arrays, kept from batch to batch (one per length).
  const argArrays = new Map<number, (string | number | null)[]>();
  const argsOf = (length: number) => {
    let a = argArrays.get(length);
    if (!a) argArrays.set(length, (a = new Array(length).fill(null)));
    return a;
  };
  const anyStored = sqlite.prepare(`select exists (select 1 from ${runTableName(runId)} where seq between ? and ?) as found`).pluck();
  const highestSeq = sqlite.prepare(`select max(seq) from ${runTableName(runId)}`).pluck();
  const countsUpsert = sqlite.prepare(COUNTS_UPSERT);
  const statsUpsert = sqlite.prepare(STATS_UPSERT('min', 'max'));

  const writeAll = sqlite.transaction((batch: ResultBatch, summaries: StoredSummaryRange[]): { counts: WrittenCounts; layout: RunLayout } => {
    for (const r of summaries) summaryInsert.run(runId, r.first, r.end, r.facts, r.counts);
    let current = layout ?? load();
    let mapping = current.find(batch);
    if (!mapping) {
      // New names or shapes: read the layout again inside the write lock (another process
      // may have extended it), then add what is still missing.
      current = load();
      mapping = current.merge(batch);
      for (const s of layoutAdditions('sqlite', runId, mapping.added)) sqlite.prepare(s.sql).run(...(s.params ?? []));
    }
    const C = current.columns.length;
    const W = 3 + C;
    const from = batchColumnOf(current, mapping);
    const { points, shape, flags } = batch;
    const shapes = mapping.shapes;
    // Per run column, the batch's values (SQLite stores a bound NaN as NULL: no number there).
    const columns = Array.from(from, (b) => (b < 0 ? null : batch.values[b]));
    /** Writes result r's parameters into args from position o. */
    const fill = (args: (string | number | null)[], o: number, r: number, seq: number) => {
      args[o] = seq;
      args[o + 1] = shapes[shape[r]];
      args[o + 2] = flags[r];
      for (let c = 0; c < C; c++) {
        const v = columns[c];
        args[o + 3 + c] = v === null ? null : v[r];
      }
    };
    let lo = Infinity;
    let hi = -Infinity;
    for (const p of points) {
      if (p < lo) lo = p;
      if (p > hi) hi = p;
    }
    let counts: WrittenCounts;
    let inserted: Uint8Array | undefined;
    if (points.length && !anyStored.get(lo * M, hi * M + M - 1)) {
      // Every row is new: several rows per statement, and the counts are the batch's own.
      const total = points.length * M;
      // Consecutive points right after the highest stored seq: SQLite numbers them itself.
      let appended = hi - lo + 1 === points.length && highestSeq.get() === lo * M - 1;
      for (let i = 0; appended && i < points.length; i++) appended = points[i] === lo + i;
      let flagged = 0;
      let r = 0;
      let last: number | bigint | undefined;
      for (const size of ROWS_PER_INSERT) {
        const wide = Math.max(1, Math.min(size, Math.floor(MAX_VALUES / W)));
        const narrow = Math.max(1, Math.min(size, Math.floor(MAX_VALUES / (C + 1))));
        // narrow ≥ wide: a uniform row binds fewer values.
        while (r + wide <= total) {
          // The next `narrow` rows, if they share a shape and have no flags, go in as one uniform statement.
          const common = shapes[shape[r]];
          let uniform = r + narrow <= total;
          for (let q = r; uniform && q < r + narrow; q++) uniform = flags[q] === null && shapes[shape[q]] === common;
          if (uniform) {
            const own = appended ? 0 : 1;
            const V = own + C;
            const args = argsOf(V * narrow);
            for (let j = 0; j < narrow; j++) {
              const q = r + j;
              const o = j * V;
              if (own) args[o] = points[Math.floor(q / M)] * M + (q % M);
              for (let c = 0; c < C; c++) {
                const v = columns[c];
                args[o + own + c] = v === null ? null : v[q];
              }
            }
            last = uniformStatement(C, narrow, common, appended).run(args).lastInsertRowid;
            r += narrow;
            continue;
          }
          const insert = statement(C, wide);
          const args = argsOf(W * wide);
          for (let j = 0; j < wide; j++) {
            const q = r + j;
            if (flags[q] !== null) flagged++;
            fill(args, j * W, q, points[Math.floor(q / M)] * M + (q % M));
          }
          last = insert.run(args).lastInsertRowid;
          r += wide;
        }
      }
      if (r !== total) throw new Error(`internal: ${r} of ${total} rows written`);
      // SQLite's numbering is checked, not assumed: a row with another seq would be another point.
      if (appended && Number(last) !== hi * M + M - 1) throw new Error(`internal: the batch's last row got seq ${last}, expected ${hi * M + M - 1}`);
      counts = { points: points.length, results: total, flagged };
    } else {
      const one = statement(C, 1);
      const args = argsOf(W);
      counts = { points: 0, results: 0, flagged: 0 };
      inserted = new Uint8Array(shape.length);
      for (let i = 0, r = 0; i < points.length; i++) {
        let n = 0;
        for (let m = 0; m < M; m++, r++) {
          fill(args, 0, r, points[i] * M + m);
          if (one.run(args).changes) {
            inserted[r] = 1;
            n++;
            if (flags[r] !== null) counts.flagged++;
          }
        }
        counts.results += n;
        if (n) counts.points++;
      }
    }
    if (counts.results) {
      const f = figures(batch, mapping, M, inserted);
      for (const c of f.counts) countsUpsert.run(runId, c.method, c.results, c.flagged);
      for (const x of f.stats) statsUpsert.run(runId, x.method, x.column, x.count, x.minimum, x.maximum);
    }
    if (counters && counts.results) advance.run(counts.points, counts.results, counts.flagged, runId);
    return { counts, layout: current };
  });

  return (batch, summaries) => {
    try {
      // BEGIN IMMEDIATE: take the write lock up front, so waiting for another process happens
      // in the busy handler instead of failing half-way through the batch.
      const done = retryBusySync(() => writeAll.immediate(batch, summaries));
      layout = done.layout;
      return Promise.resolve(done.counts);
    } catch (e) {
      return Promise.reject(e);
    }
  };
}

/** Layout changes of one run are serialised by this advisory lock (with the run id as second key). */
const LAYOUT_LOCK = 0x46_53_57_4c; // "FSWL"

function postgresWriter(pool: pg.Pool, runId: number, M: number, counters: boolean): (batch: ResultBatch, summaries: StoredSummaryRange[]) => Promise<WrittenCounts> {
  let layout: RunLayout | undefined;
  const load = async (client: pg.PoolClient) =>
    layoutOf(
      (await client.query(numberPlaceholders(LAYOUT_COLUMNS_SQL), [runId])).rows,
      (await client.query(numberPlaceholders(LAYOUT_SHAPES_SQL), [runId])).rows,
    );
  return (batch, summaries) =>
    retryDeadlock(async () => {
      const client = await pool.connect();
      try {
        await client.query('begin');
        if (summaries.length) {
          await client.query(
            'insert into point_summaries (run_id, first_idx, end_idx, facts, counts) select $1::int, u.* from unnest($2::int[], $3::int[], $4::text[], $5::text[]) as u on conflict do nothing',
            [runId, summaries.map((r) => r.first), summaries.map((r) => r.end), summaries.map((r) => r.facts), summaries.map((r) => r.counts)],
          );
        }
        let current = layout ?? (await load(client));
        let mapping = current.find(batch);
        if (!mapping) {
          await client.query('select pg_advisory_xact_lock($1, $2)', [LAYOUT_LOCK, runId]);
          current = await load(client);
          mapping = current.merge(batch);
          for (const s of layoutAdditions('postgres', runId, mapping.added)) await client.query(numberPlaceholders(s.sql), s.params ?? []);
        }
        const C = current.columns.length;
        const from = batchColumnOf(current, mapping);
        const n = batch.shape.length;
        const seq = new Array<number>(n);
        const shapes = new Array<number>(n);
        for (let i = 0, r = 0; i < batch.points.length; i++) {
          for (let m = 0; m < M; m++, r++) {
            seq[r] = batch.points[i] * M + m;
            shapes[r] = mapping.shapes[batch.shape[r]];
          }
        }
        const columns = Array.from({ length: C }, (_, c) => {
          const values = from[c] < 0 ? undefined : batch.values[from[c]];
          return Array.from({ length: n }, (_, r) => (values ? cell(values, r) : null));
        });
        const kinds = current.columns.map((c) => c.kind);
        const ins = await client.query(insertSql(runId, C, 'postgres', kinds), [seq, shapes, batch.flags, ...columns]);
        const inserted = new Uint8Array(n);
        const resultOf = new Map<number, number>(); // seq → result index in this batch
        for (let r = 0; r < n; r++) resultOf.set(seq[r], r);
        const points = new Set<number>();
        let flagged = 0;
        for (const row of ins.rows) {
          const r = resultOf.get(Number(row.seq))!;
          inserted[r] = 1;
          points.add(batch.points[Math.floor(r / M)]);
          if (batch.flags[r] !== null) flagged++;
        }
        const written: WrittenCounts = { points: points.size, results: ins.rows.length, flagged };
        if (written.results) {
          const f = figures(batch, mapping, M, inserted);
          if (f.counts.length) {
            await client.query(COUNTS_UPSERT.replace('values (?, ?, ?, ?)', 'select $1::int, u.* from unnest($2::int[], $3::int[], $4::int[]) as u'), [
              runId,
              f.counts.map((c) => c.method),
              f.counts.map((c) => c.results),
              f.counts.map((c) => c.flagged),
            ]);
          }
          if (f.stats.length) {
            await client.query(
              STATS_UPSERT('least', 'greatest').replace('values (?, ?, ?, ?, ?, ?)', 'select $1::int, u.* from unnest($2::int[], $3::int[], $4::int[], $5::float8[], $6::float8[]) as u'),
              [runId, ...(['method', 'column', 'count', 'minimum', 'maximum'] as const).map((k) => f.stats.map((x) => x[k]))],
            );
          }
        }
        if (counters && written.results) {
          await client.query(numberPlaceholders(ADVANCE), [written.points, written.results, written.flagged, runId]);
        }
        await client.query('commit');
        layout = current;
        return written;
      } catch (e) {
        await client.query('rollback').catch(() => undefined);
        throw e;
      } finally {
        client.release();
      }
    });
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
