// The table of one run's results, `run_results_<run id>` (migrations/0005_run_tables.ts):
// its DDL by dialect, the run's layout in result_columns / result_shapes, and reading rows
// back as the engine returned them. The codec itself is result-layout.ts; writing is
// batch-writer.ts.
//
// Fixed columns: seq (point × methods + method, the rowid on SQLite: the method is
// seq % methods), shape (result_shapes.idx) and flags (JSON array, null when none); then
// c_<k> for result_columns.idx = k. Nothing more per row: each column costs every insert. SQLite columns c_<k> have no declared type, so every value keeps
// its own (a double stays a double); on PostgreSQL they are typed by kind.
import type { DialectName, Statement } from './dialect.js';
import { RunLayout, type ColumnKind, type LayoutMapping, type ResultColumn, type ResultShape } from './result-layout.js';
import type { Store } from './store.js';
import type { Inputs, Outputs } from '../physics/types.js';

export function runTableName(runId: number): string {
  if (!Number.isSafeInteger(runId) || runId < 1) throw new Error(`internal: bad run id ${runId}`);
  return `run_results_${runId}`;
}

/** SQL name of run column k. */
export function valueColumn(k: number): string {
  return `c_${Math.floor(k)}`;
}

export function createRunTableSql(dialect: DialectName, runId: number): string {
  const seq = dialect === 'postgres' ? 'bigint' : 'integer';
  return `create table if not exists ${runTableName(runId)} (seq ${seq} primary key, shape integer not null, flags text)`;
}

const PG_TYPE: Record<ColumnKind, string> = { number: 'float8', string: 'text', boolean: 'integer', json: 'text' };

/** The statements that store what a batch added to the run's layout (in the batch's transaction). */
export function layoutAdditions(dialect: DialectName, runId: number, added: LayoutMapping['added']): Statement[] {
  const table = runTableName(runId);
  return [
    ...added.columns.flatMap(({ idx, column }) => [
      { sql: `alter table ${table} add column ${valueColumn(idx)}${dialect === 'postgres' ? ` ${PG_TYPE[column.kind]}` : ''}` },
      {
        sql: 'insert into result_columns (run_id, idx, role, name, kind) values (?, ?, ?, ?, ?)',
        params: [runId, idx, column.role, column.name, column.kind],
      },
    ]),
    ...added.shapes.map(({ idx, shape }) => ({
      sql: 'insert into result_shapes (run_id, idx, inputs, outputs) values (?, ?, ?, ?)',
      params: [runId, idx, JSON.stringify(shape.inputs), JSON.stringify(shape.outputs)],
    })),
  ];
}

/**
 * SQL that recounts a run's result_counts and result_stats from its rows (resume: the
 * rows are the truth). Numbers only in the text: the run id and column indices.
 */
export function recountSql(runId: number, methods: number, layout: RunLayout): string[] {
  const table = runTableName(runId);
  const id = Math.floor(runId);
  const method = methodSql('', methods);
  return [
    `delete from result_counts where run_id = ${id}`,
    `delete from result_stats where run_id = ${id}`,
    `insert into result_counts (run_id, method_idx, results, flagged) select ${id}, ${method}, count(*), count(flags) from ${table} group by ${method}`,
    ...layout.columns.flatMap((c, k) =>
      c.kind !== 'number'
        ? []
        : [
            `insert into result_stats (run_id, method_idx, column_idx, count, minimum, maximum) select ${id}, ${method}, ${k}, count(${valueColumn(k)}), ` +
              `min(${valueColumn(k)}), max(${valueColumn(k)}) from ${table} where ${valueColumn(k)} is not null group by ${method}`,
          ],
    ),
  ];
}

/** SQL of a row's method index (`alias.` before the column, or ''). */
export function methodSql(alias: string, methods: number): string {
  return `(${alias}seq % ${Math.floor(methods)})`;
}

/** SQL of a row's flagged mark, 0 or 1. */
export function flaggedSql(alias: string): string {
  return `(case when ${alias}flags is null then 0 else 1 end)`;
}

/** Runs a query with `?` placeholders and resolves to its rows (the store's, or a transaction's). */
export type QueryFn = (query: string, params: unknown[]) => Promise<Record<string, unknown>[]> | Record<string, unknown>[];

export const LAYOUT_COLUMNS_SQL = 'select idx, role, name, kind from result_columns where run_id = ? order by idx';
export const LAYOUT_SHAPES_SQL = 'select idx, inputs, outputs from result_shapes where run_id = ? order by idx';

export function layoutOf(columns: Record<string, unknown>[], shapes: Record<string, unknown>[]): RunLayout {
  return RunLayout.from(
    columns.map((c) => ({ idx: Number(c.idx), column: { role: c.role, name: c.name, kind: c.kind } as ResultColumn })),
    shapes.map((s) => ({
      idx: Number(s.idx),
      shape: { inputs: JSON.parse(String(s.inputs)), outputs: JSON.parse(String(s.outputs)) } as ResultShape,
    })),
  );
}

export async function loadLayout(store: Store, runId: number): Promise<RunLayout> {
  const d = store.dialect;
  return layoutOf(await d.all(LAYOUT_COLUMNS_SQL, [runId]), await d.all(LAYOUT_SHAPES_SQL, [runId]));
}

/** Whether the run's results are in its own table (else in points/results, from before 0005). */
export async function hasRunTable(store: Store, runId: number): Promise<boolean> {
  const [row] = await store.dialect.all<{ results_table: number }>('select results_table from runs where id = ?', [runId]);
  return Number(row?.results_table ?? 0) === 1;
}

/** One stored result, decoded. */
export interface StoredResult {
  seq: number;
  point: number;
  method: number;
  inputs: Inputs;
  outputs: Outputs;
  flags: string[];
}

/** SQL selecting a run table's rows in the order eachStoredResult decodes them. */
function selectRows(runId: number, layout: RunLayout): string {
  const values = layout.columns.map((_, k) => `, ${valueColumn(k)}`).join('');
  return `select seq, shape, flags${values} from ${runTableName(runId)}`;
}

/** PostgreSQL reads in pieces of this many rows (SQLite streams). */
const PG_CHUNK = 20_000;

/** Decodes raw rows (as selectRows gives them) of one run into StoredResults, sharing inputs within a point. */
function rowDecoder(layout: RunLayout, methods: number, fn: (row: StoredResult) => void): (row: unknown[]) => void {
  let lastPoint = -1;
  let lastShape = -1;
  let lastInputs: Inputs = {};
  return (row) => {
    const seq = Number(row[0]);
    const shape = Number(row[1]);
    const point = Math.floor(seq / methods);
    const flags = row[2] === null ? [] : (JSON.parse(String(row[2])) as string[]);
    const { inputs, outputs } = layout.decode(shape, (c) => row[3 + c]);
    if (!(point === lastPoint && layout.sameInputs(shape, lastShape))) {
      lastPoint = point;
      lastShape = shape;
      lastInputs = inputs;
    }
    fn({ seq, point, method: seq - point * methods, inputs: lastInputs, outputs, flags });
  };
}

/**
 * A run table's results in slices of at most `chunk` rows, in seq order: one short keyset
 * query per slice, so a caller can yield to the event loop between slices.
 */
export async function* storedResultChunks(store: Store, runId: number, methods: number, chunk: number): AsyncGenerator<StoredResult[]> {
  const layout = await loadLayout(store, runId);
  const base = selectRows(runId, layout);
  let after = -1;
  for (;;) {
    const rows: StoredResult[] = [];
    const decode = rowDecoder(layout, methods, (r) => rows.push(r));
    await store.dialect.eachRaw(`${base} where seq > ? order by seq limit ${Math.floor(chunk)}`, [after], decode);
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < chunk) return;
    after = rows[rows.length - 1].seq;
  }
}

/**
 * Calls `fn` for each result of the run's table, in seq order (point, then method), or
 * only for `seqs` (in seq order). Rows of one point share one inputs object, as the engine
 * returns them.
 */
export async function eachStoredResult(
  store: Store,
  runId: number,
  methods: number,
  fn: (row: StoredResult) => void,
  options: { layout?: RunLayout; seqs?: number[] } = {},
): Promise<void> {
  const layout = options.layout ?? (await loadLayout(store, runId));
  const decode = rowDecoder(layout, methods, fn);
  const base = selectRows(runId, layout);
  if (options.seqs) {
    if (options.seqs.length === 0) return;
    const sorted = [...options.seqs].sort((a, b) => a - b);
    for (let i = 0; i < sorted.length; i += 500) {
      const part = sorted.slice(i, i + 500);
      await store.dialect.eachRaw(`${base} where seq in (${part.map(() => '?').join(', ')}) order by seq`, part, decode);
    }
    return;
  }
  if (store.kind === 'sqlite') {
    await store.dialect.eachRaw(`${base} order by seq`, [], decode);
    return;
  }
  // Keyset pages: bounded memory however large the run.
  let after = -1;
  for (;;) {
    let n = 0;
    await store.dialect.eachRaw(`${base} where seq > ? order by seq limit ${PG_CHUNK}`, [after], (row) => {
      n++;
      after = Number(row[0]);
      decode(row);
    });
    if (n < PG_CHUNK) return;
  }
}
