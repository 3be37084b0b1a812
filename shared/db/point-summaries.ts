// Per-point design summaries in the store (migrations/0004_point_summaries.ts): written
// in each batch's transaction (batch-writer.ts), read by `show`, the exports and the API's point view.
import { decodeRecommended, decodeSummary } from '../design/stored-summaries.js';
import type { SummaryFacts } from '../design/summary.js';
import type { ResultRow } from '../physics/engine.js';
import type { Inputs, Outputs } from '../physics/types.js';
import { sql } from '#kysely';
import { jsonTextSql } from './dialect.js';
import { eachStoredResult, hasRunTable, runTableName } from './result-table.js';
import type { Store } from './store.js';

async function methodIdsOf(store: Store, runId: number): Promise<string[] | undefined> {
  const run = await store.db.selectFrom('runs').select('methods').where('id', '=', runId).executeTakeFirst();
  return run && (JSON.parse(run.methods) as { id: string }[]).map((m) => m.id);
}

/** The stored facts of one point's summary (undefined: none, e.g. a run pushed from elsewhere); word them with explainSummary. */
export async function getPointSummaryFacts(store: Store, runId: number, pointIdx: number): Promise<SummaryFacts | undefined> {
  const row = await store.db
    .selectFrom('point_summaries')
    .select(['first_idx', 'facts'])
    .where('run_id', '=', runId)
    .where('first_idx', '<=', pointIdx)
    .where('end_idx', '>', pointIdx)
    .orderBy('first_idx', 'desc')
    .limit(1)
    .executeTakeFirst();
  const methodIds = row && (await methodIdsOf(store, runId));
  return row && methodIds && decodeSummary(row.facts, row.first_idx, pointIdx, methodIds);
}

export interface RecommendationCounts {
  /** Points of the run with a stored summary. */
  points: number;
  /** Method id → points where it was recommended. */
  byMethod: Record<string, number>;
  /** Points where no method's ranges hold. */
  none: number;
}

/**
 * How often each method was recommended over a run's stored points. A range counts once
 * its last point is stored (a batch commits whole); a range overlapping an earlier one (a
 * resumed batch cut differently) counts only its new points.
 */
export async function getRecommendationCounts(store: Store, runId: number): Promise<RecommendationCounts> {
  const methodIds = (await methodIdsOf(store, runId)) ?? [];
  // The range's last point is stored: its first method's row in the run table, or its points row.
  const lastStored = (await hasRunTable(store, runId))
    ? sql<boolean>`exists (select 1 from ${sql.raw(runTableName(runId))} t where t.seq = (s.end_idx - 1) * ${sql.lit(Math.max(1, methodIds.length))})`
    : sql<boolean>`exists (select 1 from points p where p.run_id = s.run_id and p.idx = s.end_idx - 1)`;
  // Each range's counts, not its facts (a run's facts are tens of MB): those are read only
  // for the rare range that overlaps an earlier one.
  const rows = await store.db
    .selectFrom('point_summaries as s')
    .select(['s.first_idx', 's.end_idx', 's.counts'])
    .where('s.run_id', '=', runId)
    .where(lastStored)
    .orderBy('s.first_idx')
    .execute();
  const out: RecommendationCounts = { points: 0, byMethod: {}, none: 0 };
  const add = (key: string, n: number) => {
    out.points += n;
    if (key === 'none') out.none += n;
    else out.byMethod[methodIds[Number(key)] ?? key] = (out.byMethod[methodIds[Number(key)] ?? key] ?? 0) + n;
  };
  let covered = 0;
  for (const r of rows) {
    if (r.first_idx >= covered) {
      for (const [key, n] of Object.entries(JSON.parse(r.counts) as Record<string, number>)) add(key, n);
    } else if (r.end_idx > covered) {
      const { facts } = await store.db
        .selectFrom('point_summaries')
        .select('facts')
        .where('run_id', '=', runId)
        .where('first_idx', '=', r.first_idx)
        .executeTakeFirstOrThrow();
      const recommended = new Map<number, number | null>();
      decodeRecommended(facts, r.first_idx, recommended);
      for (const [idx, m] of recommended) if (idx >= covered) add(m === null ? 'none' : String(m), 1);
    }
    covered = Math.max(covered, r.end_idx);
  }
  return out;
}

/** Point index → recommended method (null: none applies), for the exports' `recommended` column. */
export async function getRecommendedByPoint(store: Store, runId: number): Promise<Map<number, string | null>> {
  const methodIds = (await methodIdsOf(store, runId)) ?? [];
  const rows = await store.db.selectFrom('point_summaries').select(['first_idx', 'facts']).where('run_id', '=', runId).orderBy('first_idx').execute();
  const byIndex = new Map<number, number | null>();
  for (const r of rows) decodeRecommended(r.facts, r.first_idx, byIndex);
  return new Map([...byIndex].map(([idx, m]) => [idx, m === null ? null : methodIds[m]]));
}

export interface StoredPoint {
  inputs: Inputs;
  /** The point's rows, in the run's method order. */
  rows: ResultRow[];
}

/** One stored point of a run with its results (undefined: no such point stored). */
export async function getPointRows(store: Store, runId: number, pointIdx: number): Promise<StoredPoint | undefined> {
  if (await hasRunTable(store, runId)) {
    const methodIds = (await methodIdsOf(store, runId)) ?? [];
    const M = methodIds.length;
    const rows: ResultRow[] = [];
    const seqs = Array.from({ length: M }, (_, m) => pointIdx * M + m);
    await eachStoredResult(store, runId, M, (r) => rows.push({ method: methodIds[r.method], inputs: r.inputs, outputs: r.outputs, flags: r.flags }), { seqs });
    return rows.length ? { inputs: rows[0].inputs, rows } : undefined;
  }
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
