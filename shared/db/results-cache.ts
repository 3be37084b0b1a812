// Per-run results caches (see migrations/0002_dashboard.ts for the measurements behind
// them): a finished run's results copied once into `results_cache_<run>`, one row per
// result in point and method order (seq = rowid), one plain column per input (i_<k>) and
// output (o_<k>) name, indexed per column on first use. Derived data only: a cache whose
// results_count no longer matches the run (a resumed run) is rebuilt. The table's DDL
// differs by dialect (shared/db/dialect.ts): on PostgreSQL its value columns hold numbers only.
import type { Store } from './store.js';

/** Runs with fewer results are queried straight off the JSONB columns (a few ms). */
export const CACHE_MIN_RESULTS = 20_000;

/** Names the dashboard may filter, sort and plot by; nothing else reaches SQL. */
export const NAME_PATTERN = /^[A-Za-z_][A-Za-z0-9_]*$/;

export interface RunColumns {
  inputs: string[];
  outputs: string[];
}

export interface ResultsCache {
  table: string;
  columns: RunColumns;
  /** Column of the cache table holding an input or output name. */
  inputColumn: Map<string, string>;
  outputColumn: Map<string, string>;
}

function describe(table: string, columns: RunColumns): ResultsCache {
  return {
    table,
    columns,
    inputColumn: new Map(columns.inputs.map((n, k) => [n, `i_${k}`])),
    outputColumn: new Map(columns.outputs.map((n, k) => [n, `o_${k}`])),
  };
}

/** Every input and output name of a run (a full pass over its rows). */
export async function scanRunColumns(store: Store, runId: number, limit?: number): Promise<RunColumns> {
  const d = store.dialect;
  const keys = async (table: string, column: string) =>
    (await d.all<{ key: string }>(d.jsonKeysQuery(table, column, limit), [runId])).map((r) => r.key).filter((n) => NAME_PATTERN.test(n));
  return { inputs: await keys('points', 'inputs'), outputs: await keys('results', 'outputs') };
}

/** The run's cache when it is current, else undefined. */
export async function currentCache(store: Store, runId: number): Promise<ResultsCache | undefined> {
  const [row] = await store.dialect.all<{ table_name: string; columns: string }>(
    `select c.table_name, c.columns from result_caches c join runs r on r.id = c.run_id
     where c.run_id = ? and c.results_count = r.results_count and r.status not in ('running', 'queued')`,
    [runId],
  );
  return row && describe(row.table_name, JSON.parse(row.columns) as RunColumns);
}

/**
 * The run's cache, built first when the run is finished, large enough to need one, and
 * has none (or a stale one). Undefined for runs still running or small runs.
 */
export async function ensureResultsCache(store: Store, runId: number, minResults = CACHE_MIN_RESULTS): Promise<ResultsCache | undefined> {
  const existing = await currentCache(store, runId);
  if (existing) return existing;
  const [run] = await store.dialect.all<{ status: string; results_count: number }>('select status, results_count from runs where id = ?', [runId]);
  if (!run || run.status === 'running' || run.status === 'queued' || run.results_count < minResults) return undefined;
  return buildResultsCache(store, runId);
}

/** (Re)builds a run's cache in one transaction; a reader sees the old state or the new. */
export async function buildResultsCache(store: Store, runId: number): Promise<ResultsCache> {
  const d = store.dialect;
  const table = `results_cache_${Math.floor(runId)}`;
  const columns = await scanRunColumns(store, runId);
  const valueColumns = [...columns.inputs.map((_, k) => `i_${k}`), ...columns.outputs.map((_, k) => `o_${k}`)];
  const extract = [...columns.inputs.map((n) => d.jsonNumber('p.inputs', n)), ...columns.outputs.map((n) => d.jsonNumber('r.outputs', n))];
  const select =
    `select r.id, r.point_idx, r.method_idx, r.flagged${extract.map((e, k) => `, ${e} as v_${k}`).join('')}
     from results r join points p on p.run_id = r.run_id and p.idx = r.point_idx
     where r.run_id = ${Math.floor(runId)} order by r.point_idx, r.method_idx`;
  await d.atomic([
    ...d.cacheTable(table, valueColumns, select),
    {
      // The count read in the same transaction as the copy: they always agree.
      sql: `insert into result_caches (run_id, table_name, results_count, columns, built_at)
            select ?, ?, results_count, ?, ? from runs where id = ?
            on conflict (run_id) do update set table_name = excluded.table_name, results_count = excluded.results_count,
            columns = excluded.columns, built_at = excluded.built_at`,
      params: [runId, table, JSON.stringify(columns), new Date().toISOString(), runId],
    },
  ]);
  return describe(table, columns);
}

/**
 * Index on cache columns (leading column first), created on first use. The queries put
 * every column they test into it, so SQLite answers from the index alone.
 */
export async function ensureCacheIndex(store: Store, cache: ResultsCache, columns: string[]): Promise<string> {
  const unique = [...new Set(columns)];
  for (const c of unique) if (!/^(i|o)_[0-9]+$|^method_idx$|^flagged$/.test(c)) throw new Error(`internal: not a cache column: ${c}`);
  const name = `${cache.table}_x_${unique.join('_')}`;
  await store.dialect.run(`create index if not exists ${name} on ${cache.table} (${unique.join(', ')})`);
  return name;
}

export async function dropResultsCache(store: Store, runId: number): Promise<void> {
  const [row] = await store.dialect.all<{ table_name: string }>('select table_name from result_caches where run_id = ?', [runId]);
  if (!row) return;
  await store.dialect.atomic([{ sql: `drop table if exists ${row.table_name}` }, { sql: 'delete from result_caches where run_id = ?', params: [runId] }]);
}
