// Runs stored before migrations/0005_run_tables.ts keep their results as JSON documents in
// the shared points/results tables (runs.results_table = 0). They are read from there as
// they are, and converted into a run table (result-table.ts) in small steps:
// - on the dashboard, when such a run is first viewed: in the background, a few thousand
//   points per step with the event loop free between steps, so requests meanwhile answer
//   (straight off the JSON columns, as before);
// - before `resume` continues one (it writes only to run tables).
// The conversion copies every row through the same codec as the runner (the stored JSON
// parsed back gives the same objects the runner had), switches the run over once the copy
// is complete, then deletes the JSON rows in steps, once no reader of this process is
// still reading them (readingRun). It is idempotent: stopped at any point (a closed
// server, a killed process), it starts again from the copy next time.
import type { ExportRow } from '../export/types.js';
import type { Inputs, Outputs } from '../physics/types.js';
import { createBatchWriter } from './batch-writer.js';
import { jsonNumberSql, jsonTextSql } from './dialect.js';
import { ResultBatchEncoder } from './result-layout.js';
import { createRunTableSql, runTableName } from './result-table.js';
import type { MethodVersion } from './runs.js';
import type { Store } from './store.js';
import { sql } from '#kysely';

/** Points per step of a conversion (about 10–30 ms of work on SQLite for a two-method run). */
const STEP_POINTS = 2000;

/**
 * Every result of a run stored in points/results, in point order then method order; with
 * `recommended` (point → method), each row says whether it is its point's recommended one.
 */
export async function legacyRunRows(store: Store, runId: number, recommended?: Map<number, string | null>): Promise<ExportRow[]> {
  const raw = await store.db
    .selectFrom('results as r')
    .innerJoin('points as p', (j) => j.onRef('p.run_id', '=', 'r.run_id').onRef('p.idx', '=', 'r.point_idx'))
    .select(['r.point_idx', 'r.method', 'r.flags'])
    .select(jsonTextSql(store.db, 'p.inputs').as('inputs'))
    .select(jsonTextSql(store.db, 'r.outputs').as('outputs'))
    .where('r.run_id', '=', runId)
    .orderBy('r.point_idx')
    .orderBy('r.method_idx')
    .execute();
  return decodeLegacyRows(raw, recommended);
}

/** A legacy results row as read: its point, method, and its inputs, outputs and flags as JSON text. */
export interface LegacyRawRow {
  point_idx: number;
  method: string;
  inputs: string;
  outputs: string;
  flags: string;
}

/**
 * Legacy rows (point order, then method order) as export rows; with `recommended` (point →
 * method), each says whether it is its point's recommended one.
 */
export function decodeLegacyRows(raw: readonly LegacyRawRow[], recommended?: Map<number, string | null>): ExportRow[] {
  const rows: ExportRow[] = new Array(raw.length);
  let lastPoint = -1;
  let inputs: Inputs = {};
  for (let i = 0; i < raw.length; i++) {
    const r = raw[i];
    // The methods of one point share its inputs object, as the engine returns them.
    if (r.point_idx !== lastPoint) {
      inputs = JSON.parse(r.inputs) as Inputs;
      lastPoint = r.point_idx;
    }
    const row: ExportRow = { method: r.method, inputs, outputs: JSON.parse(r.outputs) as Outputs, flags: JSON.parse(r.flags) as string[] };
    const best = recommended?.get(r.point_idx);
    if (best !== undefined) row.recommended = best === r.method;
    rows[i] = row;
  }
  return rows;
}

export interface LegacySummaryRow {
  method_idx: number;
  points: number;
  flagged: number | null;
  nu_min: number | null;
  nu_max: number | null;
  nux_min: number | null;
  nux_max: number | null;
}

/** Per method of a run stored in points/results: results, flagged results, the range of Nu and Nu_x. */
export async function legacyRunSummary(store: Store, runId: number): Promise<LegacySummaryRow[]> {
  return store.db
    .selectFrom('results')
    .select(['method_idx'])
    .select((eb) => [eb.fn.countAll<number>().as('points'), eb.fn.sum<number>('flagged').as('flagged')])
    .select(sql<number | null>`min(${jsonNumberSql(store.db, 'outputs', 'Nu')})`.as('nu_min'))
    .select(sql<number | null>`max(${jsonNumberSql(store.db, 'outputs', 'Nu')})`.as('nu_max'))
    .select(sql<number | null>`min(${jsonNumberSql(store.db, 'outputs', 'Nu_x')})`.as('nux_min'))
    .select(sql<number | null>`max(${jsonNumberSql(store.db, 'outputs', 'Nu_x')})`.as('nux_max'))
    .where('run_id', '=', runId)
    .groupBy('method_idx')
    .execute();
}

/** Lets pending I/O and timers run between two steps. */
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Readers of this process that may be reading a run's JSON rows, per store and run. */
const readers = new WeakMap<Store, Map<number, number>>();

/**
 * Runs `fn`, a read of several statements that may go to the run's JSON rows, with the
 * run's JSON rows kept until it is done (a conversion switching the run over meanwhile
 * deletes them only afterwards). Single statements need no such care.
 */
export async function readingRun<T>(store: Store, runId: number, fn: () => Promise<T>): Promise<T> {
  let runs = readers.get(store);
  if (!runs) readers.set(store, (runs = new Map()));
  runs.set(runId, (runs.get(runId) ?? 0) + 1);
  try {
    return await fn();
  } finally {
    const left = runs.get(runId)! - 1;
    if (left) runs.set(runId, left);
    else runs.delete(runId);
  }
}

async function noReaders(store: Store, runId: number, signal?: AbortSignal): Promise<void> {
  while (readers.get(store)?.get(runId) && !signal?.aborted) await new Promise((r) => setTimeout(r, 20));
}

export interface ConvertOptions {
  /** Convert even a run marked running or queued (resume: the caller made sure nobody writes it). */
  force?: boolean;
  signal?: AbortSignal;
}

/**
 * Moves a run's results from points/results into its run table. Resolves true once the
 * run reads from its table (at once when it already did), false when it was left as it is
 * (a run still being written, or `signal` aborted).
 */
export async function convertLegacyRun(store: Store, runId: number, options: ConvertOptions = {}): Promise<boolean> {
  const d = store.dialect;
  const [run] = await d.all<{ status: string; methods: string; results_table: number }>('select status, methods, results_table from runs where id = ?', [runId]);
  if (!run) return false;
  if (Number(run.results_table) === 1) {
    // Switched over already; JSON rows left by a deletion that was stopped go now.
    const [left] = await d.all<{ top: number | null }>('select max(point_idx) as top from results where run_id = ?', [runId]);
    if (left?.top !== null && left?.top !== undefined) await deleteJsonRows(store, runId, Number(left.top), options.signal);
    return true;
  }
  if (!options.force && (run.status === 'running' || run.status === 'queued')) return false;
  const methodIds = (JSON.parse(run.methods) as MethodVersion[]).map((m) => m.id);
  const M = methodIds.length;
  await d.run(createRunTableSql(store.kind, runId));
  const writer = createBatchWriter(store, runId, methodIds, { counters: false });
  const [{ top }] = await d.all<{ top: number | null }>('select max(point_idx) as top from results where run_id = ?', [runId]);
  const read =
    `select r.point_idx, r.method_idx, ${d.jsonText('p.inputs')} as inputs, ${d.jsonText('r.outputs')} as outputs, r.flags from results r ` +
    'join points p on p.run_id = r.run_id and p.idx = r.point_idx where r.run_id = ? and r.point_idx >= ? and r.point_idx < ? order by r.point_idx, r.method_idx';
  for (let from = 0; top !== null && from <= Number(top); from += STEP_POINTS) {
    if (options.signal?.aborted) return false;
    const rows = await d.all<{ point_idx: number; method_idx: number; inputs: string; outputs: string; flags: string }>(read, [runId, from, from + STEP_POINTS]);
    if (rows.length) {
      if (rows.length % M !== 0) throw new Error(`run ${runId}: points ${from}–${from + STEP_POINTS - 1} do not have a result for every method`);
      const encoder = new ResultBatchEncoder(M, rows.length / M);
      for (let k = 0; k < rows.length; k++) {
        const r = rows[k];
        if (r.method_idx !== k % M) throw new Error(`run ${runId}: point ${r.point_idx} does not have a result for every method`);
        if (k % M === 0) encoder.addPoint(Number(r.point_idx), JSON.parse(r.inputs) as Inputs);
        encoder.addResult(JSON.parse(r.outputs) as Outputs, JSON.parse(r.flags) as string[]);
      }
      await writer.write(encoder.finish());
    }
    await nextTurn();
  }
  if (options.signal?.aborted) return false;
  // Switch over once the copy holds every row, in one serialised transaction.
  const table = runTableName(runId);
  await d.serialized(store.db, async (db) => {
    const [counts] = (
      await sql<{ copied: number; stored: number; done: number }>`select (select count(*) from ${sql.raw(table)}) as copied,
        (select count(*) from results where run_id = ${runId}) as stored, (select results_table from runs where id = ${runId}) as done`.execute(db)
    ).rows;
    if (Number(counts.done) === 1) return;
    if (Number(counts.copied) !== Number(counts.stored)) {
      throw new Error(`run ${runId}: ${counts.copied} results copied of ${counts.stored}; the run changed while it was converted`);
    }
    await db.updateTable('runs').set({ results_table: 1 }).where('id', '=', runId).execute();
  });
  if (top !== null) await deleteJsonRows(store, runId, Number(top), options.signal);
  return true;
}

/**
 * Deletes a switched-over run's JSON rows, in steps: once the readers of this process that
 * started before the switch have finished (new readers read the table).
 */
async function deleteJsonRows(store: Store, runId: number, top: number, signal?: AbortSignal): Promise<void> {
  await noReaders(store, runId, signal);
  for (let from = 0; from <= top && !signal?.aborted; from += STEP_POINTS) {
    await store.dialect.run('delete from results where run_id = ? and point_idx >= ? and point_idx < ?', [runId, from, from + STEP_POINTS]);
    await store.dialect.run('delete from points where run_id = ? and idx >= ? and idx < ?', [runId, from, from + STEP_POINTS]);
    await nextTurn();
  }
}

/** Conversions running in the background, per store and run. */
const background = new WeakMap<Store, Map<number, { done: Promise<boolean>; stop: AbortController }>>();

/**
 * Starts converting a run in the background (once per run and store) and returns at once;
 * the returned promise tells when it ended. A failure is reported on stderr and leaves the
 * run readable as before.
 */
export function convertInBackground(store: Store, runId: number): Promise<boolean> {
  let runs = background.get(store);
  if (!runs) background.set(store, (runs = new Map()));
  const running = runs.get(runId);
  if (running) return running.done;
  const stop = new AbortController();
  const done = convertLegacyRun(store, runId, { signal: stop.signal })
    .catch((e: unknown) => {
      if (!stop.signal.aborted) process.stderr.write(`filmsweep: converting run ${runId} to its results table: ${(e as Error)?.message ?? String(e)}\n`);
      return false;
    })
    .finally(() => runs!.delete(runId));
  runs.set(runId, { done, stop });
  return done;
}

/** Stops the store's background conversions after their current step (before it is closed). */
export async function stopBackgroundConversions(store: Store): Promise<void> {
  const runs = background.get(store);
  if (!runs) return;
  for (const r of runs.values()) r.stop.abort();
  await Promise.all([...runs.values()].map((r) => r.done));
}
