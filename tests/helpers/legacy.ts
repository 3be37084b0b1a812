// Runs as Filmsweep stored them before migrations/0005_run_tables.ts: results as JSON in
// the shared points/results tables (runs.results_table = 0). Made from a run stored today,
// by writing its rows the way the old batch writer did and dropping its run table.
import { getRun, type Store } from '../../shared/db/index.js';
import { eachStoredResult, runTableName, type StoredResult } from '../../shared/db/result-table.js';

export async function storeAsBeforeRunTables(store: Store, runId: number): Promise<void> {
  const run = (await getRun(store, runId))!;
  const rows: StoredResult[] = [];
  await eachStoredResult(store, runId, run.methods.length, (r) => rows.push(r));
  const d = store.dialect;
  const statements = [];
  for (const r of rows) {
    if (r.method === 0) statements.push({ sql: `insert into points (run_id, idx, inputs) values (?, ?, ${d.jsonParam})`, params: [runId, r.point, JSON.stringify(r.inputs)] });
    statements.push({
      sql: `insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (?, ?, ?, ?, ${d.jsonParam}, ?, ?)`,
      params: [runId, r.point, r.method, run.methods[r.method].id, JSON.stringify(r.outputs), JSON.stringify(r.flags), r.flags.length ? 1 : 0],
    });
  }
  statements.push(
    { sql: `drop table ${runTableName(runId)}` },
    { sql: 'delete from result_columns where run_id = ?', params: [runId] },
    { sql: 'delete from result_shapes where run_id = ?', params: [runId] },
    { sql: 'delete from result_counts where run_id = ?', params: [runId] },
    { sql: 'delete from result_stats where run_id = ?', params: [runId] },
    { sql: 'update runs set results_table = 0 where id = ?', params: [runId] },
  );
  await d.atomic(statements);
}
