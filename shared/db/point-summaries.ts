// Per-point design summaries in the store (migrations/0004_point_summaries.ts): written
// by the runner beside each batch, read by `show`, the exports and the API's point view.
import type { PointSummary } from '../design/types.js';
import type { ResultRow } from '../physics/engine.js';
import type { Inputs, Outputs } from '../physics/types.js';
import type { BatchWriter, EncodedBatch, WrittenCounts } from './batch-writer.js';
import { jsonTextSql, type Statement } from './dialect.js';
import type { Store } from './store.js';

/** A computed batch with the summary of each of its points (parallel to `points`). */
export interface SummarizedBatch extends EncodedBatch {
  summaries?: PointSummary[];
}

/** Rows per INSERT: 8 parameters each, far below SQLite's and PostgreSQL's limits. */
const ROWS_PER_STATEMENT = 500;

function insertStatements(runId: number, points: readonly number[], summaries: readonly PointSummary[]): Statement[] {
  const statements: Statement[] = [];
  for (let start = 0; start < points.length; start += ROWS_PER_STATEMENT) {
    const end = Math.min(points.length, start + ROWS_PER_STATEMENT);
    const params: unknown[] = [];
    const rows: string[] = [];
    for (let i = start; i < end; i++) {
      const s = summaries[i];
      rows.push('(?, ?, ?, ?, ?, ?, ?, ?)');
      params.push(runId, points[i], s.recommended, JSON.stringify(s.applicable), s.spread, s.spread_of, s.reason, JSON.stringify(s.flags));
    }
    statements.push({
      sql: `insert into point_summaries (run_id, point_idx, recommended, applicable, spread, spread_of, reason, flags) values ${rows.join(', ')} on conflict do nothing`,
      params,
    });
  }
  return statements;
}

/**
 * The store's batch writer with the points' summaries written first, in their own
 * transaction: a point is never stored without its summary, and a batch written twice
 * (a retried queue job, a resume) changes nothing the second time (on conflict do nothing).
 */
export function withPointSummaries(store: Store, runId: number, writer: BatchWriter): { write(batch: SummarizedBatch): Promise<WrittenCounts> } {
  return {
    async write(batch) {
      const { summaries } = batch;
      if (summaries?.length) {
        if (summaries.length !== batch.points.length) throw new Error(`batch of ${batch.points.length} points has ${summaries.length} summaries`);
        await store.dialect.atomic(insertStatements(runId, batch.points, summaries));
      }
      return writer.write(batch);
    },
  };
}

function toSummary(r: { recommended: string | null; applicable: string; spread: number | null; spread_of: string | null; reason: string; flags: string }): PointSummary {
  return {
    applicable: JSON.parse(r.applicable) as string[],
    spread: r.spread === null ? null : Number(r.spread),
    spread_of: r.spread_of,
    recommended: r.recommended,
    reason: r.reason,
    flags: JSON.parse(r.flags) as string[],
  };
}

/** The stored summary of one point of a run (undefined: none, e.g. a run pushed from elsewhere). */
export async function getPointSummary(store: Store, runId: number, pointIdx: number): Promise<PointSummary | undefined> {
  const r = await store.db
    .selectFrom('point_summaries')
    .select(['recommended', 'applicable', 'spread', 'spread_of', 'reason', 'flags'])
    .where('run_id', '=', runId)
    .where('point_idx', '=', pointIdx)
    .executeTakeFirst();
  return r && toSummary(r);
}

export interface RecommendationCounts {
  /** Points of the run with a stored summary. */
  points: number;
  /** Method id → points where it was recommended. */
  byMethod: Record<string, number>;
  /** Points where no method's ranges hold. */
  none: number;
}

/** How often each method was recommended over a run's stored points. */
export async function getRecommendationCounts(store: Store, runId: number): Promise<RecommendationCounts> {
  const rows = await store.db
    .selectFrom('point_summaries as s')
    .innerJoin('points as p', (j) => j.onRef('p.run_id', '=', 's.run_id').onRef('p.idx', '=', 's.point_idx'))
    .select('s.recommended')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('s.run_id', '=', runId)
    .groupBy('s.recommended')
    .execute();
  const out: RecommendationCounts = { points: 0, byMethod: {}, none: 0 };
  for (const r of rows) {
    const n = Number(r.n);
    out.points += n;
    if (r.recommended === null) out.none += n;
    else out.byMethod[r.recommended] = n;
  }
  return out;
}

/** Point index → recommended method (null: none applies), for the exports' `recommended` column. */
export async function getRecommendedByPoint(store: Store, runId: number): Promise<Map<number, string | null>> {
  const rows = await store.db.selectFrom('point_summaries').select(['point_idx', 'recommended']).where('run_id', '=', runId).execute();
  return new Map(rows.map((r) => [r.point_idx, r.recommended]));
}

export interface StoredPoint {
  inputs: Inputs;
  /** The point's rows, in the run's method order. */
  rows: ResultRow[];
}

/** One stored point of a run with its results (undefined: no such point stored). */
export async function getPointRows(store: Store, runId: number, pointIdx: number): Promise<StoredPoint | undefined> {
  const point = await store.db
    .selectFrom('points')
    .select(jsonTextSql(store.db, 'inputs').as('inputs'))
    .where('run_id', '=', runId)
    .where('idx', '=', pointIdx)
    .executeTakeFirst();
  if (!point) return undefined;
  const inputs = JSON.parse(point.inputs) as Inputs;
  const results = await store.db
    .selectFrom('results')
    .select(['method', 'flags'])
    .select(jsonTextSql(store.db, 'outputs').as('outputs'))
    .where('run_id', '=', runId)
    .where('point_idx', '=', pointIdx)
    .orderBy('method_idx')
    .execute();
  return {
    inputs,
    rows: results.map((r) => ({ method: r.method, inputs, outputs: JSON.parse(r.outputs) as Outputs, flags: JSON.parse(r.flags) as string[] })),
  };
}
