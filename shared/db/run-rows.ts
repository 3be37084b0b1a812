// A run's result rows in slices, for exports that stream: the same rows in the same order
// as getRunRows (point order, then method order; only points that are stored), read
// RUN_ROWS_CHUNK rows at a time by keyset on the unique (run_id, point_idx, method_idx) index, so
// memory stays at one slice whatever the run's size and each slice is one short query.
// Between slices the caller's writer yields to the event loop (better-sqlite3 answers
// synchronously; without a yield one export would hold every other request).
import type { RowSource } from '../export/rows.js';
import type { ExportRow } from '../export/types.js';
import type { Inputs, Outputs } from '../physics/types.js';
import { jsonTextSql } from './dialect.js';
import { getRecommendedByPoint } from './point-summaries.js';
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
        yield rows;
        if (raw.length < chunk) return;
        const last = raw[raw.length - 1];
        after = [last.point_idx, last.method_idx];
      }
    },
  };
}
