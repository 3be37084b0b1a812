// A run's result rows in slices, for exports that stream: the same rows in the same order
// as getRunRows (point order, then method order; only points that are stored), read
// RUN_ROWS_CHUNK rows at a time by keyset (on the run table's seq, or for a run stored
// before run tables on the unique (run_id, point_idx, method_idx) index), so memory stays
// at one slice whatever the run's size and each slice is one short query.
// Between slices the caller's writer yields to the event loop (better-sqlite3 answers
// synchronously; without a yield one export would hold every other request).
import type { RowSource } from '../export/rows.js';
import type { ExportRow } from '../export/types.js';
import { jsonTextSql } from './dialect.js';
import { decodeLegacyRows } from './legacy-results.js';
import { getRecommendedByPoint } from './point-summaries.js';
import { getRun } from './queries.js';
import { hasRunTable, storedResultChunks } from './result-table.js';
import type { Store } from './store.js';

export const RUN_ROWS_CHUNK = 1000;

/**
 * With `recommended` (the exports), each row also says whether its method is the point's
 * recommended one, where the run has per-point summaries (one small map per run: the
 * summaries are stored per batch, shared/db/point-summaries.ts).
 */
export function runRowSource(store: Store, runId: number, options: { recommended?: boolean; chunk?: number } = {}): RowSource {
  const chunk = options.chunk ?? RUN_ROWS_CHUNK;
  return {
    async *chunks() {
      const recommended = options.recommended ? await getRecommendedByPoint(store, runId) : undefined;
      if (await hasRunTable(store, runId)) {
        const methods = (await getRun(store, runId))!.methods.map((m) => m.id);
        for await (const stored of storedResultChunks(store, runId, methods.length, chunk)) {
          yield stored.map((r) => {
            const row: ExportRow = { method: methods[r.method], inputs: r.inputs, outputs: r.outputs, flags: r.flags };
            const best = recommended?.get(r.point);
            if (best !== undefined) row.recommended = best === row.method;
            return row;
          });
        }
        return;
      }
      let after: [number, number] | undefined;
      for (;;) {
        let q = store.db
          .selectFrom('results as r')
          .innerJoin('points as p', (j) => j.onRef('p.run_id', '=', 'r.run_id').onRef('p.idx', '=', 'r.point_idx'))
          .select(['r.point_idx', 'r.method_idx', 'r.method', 'r.flags'])
          .select(jsonTextSql(store.db, 'p.inputs').as('inputs'))
          .select(jsonTextSql(store.db, 'r.outputs').as('outputs'))
          .where('r.run_id', '=', runId);
        if (after) {
          const [point, method] = after;
          q = q.where((eb) => eb(eb.refTuple('r.point_idx', 'r.method_idx'), '>', eb.tuple(point, method)));
        }
        const raw = await q.orderBy('r.point_idx').orderBy('r.method_idx').limit(chunk).execute();
        if (raw.length === 0) return;
        yield decodeLegacyRows(raw, recommended);
        if (raw.length < chunk) return;
        const last = raw[raw.length - 1];
        after = [last.point_idx, last.method_idx];
      }
    },
  };
}
