// Per-run results caches (see migrations/0002_dashboard.ts for the measurements behind
// them): a finished run's results copied once into `results_cache_<run>`, one row per
// result in point and method order (seq = rowid), one plain column per input (i_<k>) and
// output (o_<k>) name, indexed per column on first use. Derived data only: a cache whose
// results_count no longer matches the run (a resumed run) is rebuilt.
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
export function scanRunColumns(store: Store, runId: number, limit?: number): RunColumns {
  const cap = limit === undefined ? '' : ` limit ${Math.floor(limit)}`;
  const inputs = store.sqlite
    .prepare(`select distinct j.key from (select inputs from points where run_id = ?${cap}) p, json_each(p.inputs) j order by j.key`)
    .pluck()
    .all(runId) as string[];
  const outputs = store.sqlite
    .prepare(`select distinct j.key from (select outputs from results where run_id = ?${cap}) r, json_each(r.outputs) j order by j.key`)
    .pluck()
    .all(runId) as string[];
  return { inputs: inputs.filter((n) => NAME_PATTERN.test(n)), outputs: outputs.filter((n) => NAME_PATTERN.test(n)) };
}

/** The run's cache when it is current, else undefined. */
export function currentCache(store: Store, runId: number): ResultsCache | undefined {
  const row = store.sqlite
    .prepare(
      `select c.table_name, c.columns from result_caches c join runs r on r.id = c.run_id
       where c.run_id = ? and c.results_count = r.results_count and r.status not in ('running', 'queued')`,
    )
    .get(runId) as { table_name: string; columns: string } | undefined;
  return row && describe(row.table_name, JSON.parse(row.columns) as RunColumns);
}

/**
 * The run's cache, built first when the run is finished, large enough to need one, and
 * has none (or a stale one). Undefined for runs still running or small runs.
 */
export function ensureResultsCache(store: Store, runId: number, minResults = CACHE_MIN_RESULTS): ResultsCache | undefined {
  const existing = currentCache(store, runId);
  if (existing) return existing;
  const run = store.sqlite.prepare('select status, results_count from runs where id = ?').get(runId) as
    | { status: string; results_count: number }
    | undefined;
  if (!run || run.status === 'running' || run.status === 'queued' || run.results_count < minResults) return undefined;
  return buildResultsCache(store, runId);
}

/** (Re)builds a run's cache in one IMMEDIATE transaction; a reader sees the old state or the new. */
export function buildResultsCache(store: Store, runId: number): ResultsCache {
  const { sqlite } = store;
  const table = `results_cache_${Math.floor(runId)}`;
  const build = sqlite.transaction(() => {
    const columns = scanRunColumns(store, runId);
    const { results_count } = sqlite.prepare('select results_count from runs where id = ?').get(runId) as { results_count: number };
    sqlite.exec(`drop table if exists ${table}`);
    const valueColumns = [...columns.inputs.map((_, k) => `i_${k}`), ...columns.outputs.map((_, k) => `o_${k}`)];
    // Value columns have no declared type: numbers stay numbers, switches and choices stay as they are.
    sqlite.exec(
      `create table ${table} (seq integer primary key, result_id integer not null, point_idx integer not null, ` +
        `method_idx integer not null, flagged integer not null${valueColumns.map((c) => `, ${c}`).join('')})`,
    );
    const extract = [...columns.inputs.map(() => `p.inputs ->> ?`), ...columns.outputs.map(() => `r.outputs ->> ?`)];
    const paths = [...columns.inputs, ...columns.outputs].map((n) => `$."${n}"`);
    sqlite
      .prepare(
        `insert into ${table} (result_id, point_idx, method_idx, flagged${valueColumns.map((c) => `, ${c}`).join('')})
         select r.id, r.point_idx, r.method_idx, r.flagged${extract.map((e) => `, ${e}`).join('')}
         from results r join points p on p.run_id = r.run_id and p.idx = r.point_idx
         where r.run_id = ? order by r.point_idx, r.method_idx`,
      )
      .run(...paths, runId);
    sqlite
      .prepare(
        `insert into result_caches (run_id, table_name, results_count, columns, built_at) values (?, ?, ?, ?, ?)
         on conflict (run_id) do update set table_name = excluded.table_name, results_count = excluded.results_count,
         columns = excluded.columns, built_at = excluded.built_at`,
      )
      .run(runId, table, results_count, JSON.stringify(columns), new Date().toISOString());
    return columns;
  });
  return describe(table, build.immediate());
}

/**
 * Index on cache columns (leading column first), created on first use. The queries put
 * every column they test into it, so SQLite answers from the index alone.
 */
export function ensureCacheIndex(store: Store, cache: ResultsCache, columns: string[]): string {
  const unique = [...new Set(columns)];
  for (const c of unique) if (!/^(i|o)_[0-9]+$|^method_idx$|^flagged$/.test(c)) throw new Error(`internal: not a cache column: ${c}`);
  const name = `${cache.table}_x_${unique.join('_')}`;
  store.sqlite.exec(`create index if not exists ${name} on ${cache.table} (${unique.join(', ')})`);
  return name;
}

export function dropResultsCache(store: Store, runId: number): void {
  const row = store.sqlite.prepare('select table_name from result_caches where run_id = ?').get(runId) as { table_name: string } | undefined;
  if (!row) return;
  store.sqlite.transaction(() => {
    store.sqlite.exec(`drop table if exists ${row.table_name}`);
    store.sqlite.prepare('delete from result_caches where run_id = ?').run(runId);
  })();
}
