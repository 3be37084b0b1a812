// The comparison of two runs: their points paired by chosen inputs (exactly, or within a
// relative tolerance), their results paired by method on paired points, and one output
// compared. The join happens in SQL over the two runs' tables (result-table.ts; a run
// stored before run tables is moved into its table first), on a read-only connection off
// the main thread (read-thread.ts), and pages: no request holds a run in memory.
//
// How a page stays cheap on runs of a million results: a first pass counts the pairs per
// chunk of run a's points (memoised per pair of runs, inputs, tolerance and output), and
// a page then joins only the chunks of run a that hold its rows against run b. Pairing is
// one to one by construction: the chosen inputs must identify a point in each run, or the
// request is refused (422) with the two points that collide, so a result is paired at most
// once and "only in a" is simply what a has beyond the pairs.
//
// Tolerance: two numbers pair when |a − b| ≤ tol · max(|a|, |b|). The distinct values of
// an input over both runs are sorted and cut wherever two neighbours are further apart than
// that; values between two cuts form one cluster and pair. Any two values within the
// tolerance always land in one cluster (every gap between them is smaller); a cluster
// wider than the tolerance can only hold values of different points of one run, which the
// uniqueness check above refuses. Strings and switches pair only when equal.
//
// The few SQL differences between the stores are kept here rather than in dialect.ts,
// which other work edits at the same time; each is a one-line choice below.
import type { CompareRow, Comparison } from '../export/run-data.js';
import { InputError, type Inputs } from '../physics/types.js';
import { convertLegacyRun } from './legacy-results.js';
import { getRun, type RunInfo } from './queries.js';
import { readOffThread } from './read-thread.js';
import type { ColumnKind, RunLayout } from './result-layout.js';
import { eachStoredResult, loadLayout, runTableName, valueColumn } from './result-table.js';
import { MAX_PAGE_SIZE, NAME_PATTERN } from './results-query.js';
import type { Store } from './store.js';

export type { CompareRow, Comparison };

/** Results per run a comparison reads at most (413 beyond): a few seconds of one core. */
export const COMPARE_MAX_RESULTS = 1_000_000;
/** Largest relative tolerance (422 beyond): coarser than this no longer pairs "the same point". */
export const MAX_TOLERANCE = 0.1;
/** Most inputs to pair by (422 beyond). */
export const MAX_PAIR_INPUTS = 12;
/** Points of run a per chunk of the count pass. */
const CHUNK = 2048;
/** Values differing by less than this (relative) count as unchanged: the last bits of a double. */
const SAME = 1e-12;

export interface CompareQuery {
  output: string;
  page?: number;
  pageSize?: number;
  /** `yes`: only pairs whose value differs. */
  changed?: 'yes' | 'any';
  /** Inputs that identify a point in both runs; default: every input of either run. */
  by?: string[];
  /** Relative tolerance on the numeric inputs of `by`; 0 (default) pairs equal values only. */
  tolerance?: number;
}

/** A limit of the comparison (`status` 413: too large; 422: a choice that cannot be honoured). */
export class CompareLimitError extends Error {
  constructor(
    readonly status: 413 | 422,
    message: string,
  ) {
    super(message);
    this.name = 'CompareLimitError';
  }
}

type Kind = 'sqlite' | 'postgres';

interface Sql {
  text: string;
  params: unknown[];
}

/** One run as the SQL reads it: its table, method count and layout. */
interface Side {
  run: RunInfo;
  table: string;
  methods: number;
  layout: RunLayout;
}

const KINDS: ColumnKind[] = ['number', 'string', 'boolean', 'json'];

/** SQL fragments that differ between the stores. */
function flavour(kind: Kind) {
  const sqlite = kind === 'sqlite';
  const columnOf = (side: Side, alias: string, role: 'input' | 'output', name: string, k: ColumnKind) => {
    if (!NAME_PATTERN.test(name)) throw new Error(`internal: unsafe name ${name}`);
    const c = side.layout.column(role, name, k);
    return c === undefined ? undefined : `${alias}.${valueColumn(c)}`;
  };
  // A missing number: typed on PostgreSQL, where an untyped null in a CTE column reads as text.
  const noNumber = sqlite ? 'null' : 'null::float8';
  return {
    /** SQLite: CROSS JOIN keeps the written order (pairs first, then rowid lookups). */
    join: sqlite ? 'cross join' : 'join',
    greatest: (a: string, b: string) => (sqlite ? `max(${a}, ${b})` : `greatest(${a}, ${b})`),
    int: (p: string) => (sqlite ? p : `${p}::int`),
    text: (p: string) => (sqlite ? p : `${p}::text`),
    /** An input as a number (its number column), else null. */
    number: (side: Side, alias: string, name: string) => columnOf(side, alias, 'input', name, 'number') ?? noNumber,
    /** An input of another kind than number as text (tagged by kind), else null. */
    other(side: Side, alias: string, name: string): string {
      const parts = KINDS.slice(1).flatMap((k) => {
        const c = columnOf(side, alias, 'input', name, k);
        return c ? [`'${k[0]}:' || ${sqlite ? c : `${c}::text`}`] : [];
      });
      return parts.length === 0 ? 'null' : parts.length === 1 ? parts[0] : `coalesce(${parts.join(', ')})`;
    },
    /**
     * An input as a pairing key compared by equality. SQLite: the stored value (numbers by
     * value, text as text). PostgreSQL: text, numbers as float8's shortest exact form.
     */
    exact(side: Side, alias: string, name: string): string {
      const n = columnOf(side, alias, 'input', name, 'number');
      const o = this.other(side, alias, name);
      if (sqlite) return n ? (o === 'null' ? n : `coalesce(${n}, ${o})`) : o;
      return n ? `coalesce('n:' || ${n}::text, ${o})` : o;
    },
    /**
     * The key of a value: its cluster in CTE `cl` when a number, else its text. SQLite
     * indexes the CTE for a scalar subquery (not for a left join); PostgreSQL hash-joins.
     */
    clustered(side: Side, alias: string, cl: string, name: string): { key: string; join: string } {
      const n = this.number(side, alias, name);
      const o = this.other(side, alias, name);
      return sqlite
        ? { key: `coalesce('n:' || (select ${cl}.c from ${cl} where ${cl}.v = ${n}), ${o})`, join: '' }
        : { key: `coalesce('n:' || ${cl}.c, ${o})`, join: ` left join ${cl} on ${cl}.v = ${n}` };
    },
    /** An output as a number (its number column), else null. */
    output: (side: Side, alias: string, name: string) => columnOf(side, alias, 'output', name, 'number') ?? noNumber,
  };
}

interface Plan {
  a: Side;
  b: Side;
  by: string[];
  tolerance: number;
  output: string;
  /** Methods of both runs: index in run a, index in run b, id. */
  methods: [number, number, string][];
}

/** A run table's rows of its points (its first method's rows), as alias `t`; `range`: points lo … hi. */
function pointRows(side: Side, range?: [number, number]): Sql {
  const M = side.methods;
  return {
    text: `${side.table} t where t.seq % ${M} = 0${range ? ' and t.seq between ? and ?' : ''}`,
    params: range ? [range[0] * M, range[1] * M] : [],
  };
}

/**
 * The CTEs pairing the two runs' points: `ka`, `kb` (point index and one key per chosen
 * input) and `pp` (ai, bi). `aRange` restricts run a to a range of point indices.
 */
function pairingCtes(kind: Kind, plan: Plan, aRange?: [number, number]): Sql {
  const f = flavour(kind);
  const params: unknown[] = [];
  const ctes: string[] = [];
  const clustered = plan.tolerance > 0;
  if (clustered) {
    plan.by.forEach((k, i) => {
      const [ra, rb] = [pointRows(plan.a), pointRows(plan.b)];
      ctes.push(
        `dv${i} as materialized (select distinct v from (select ${f.number(plan.a, 't', k)} as v from ${ra.text} ` +
          `union all select ${f.number(plan.b, 't', k)} as v from ${rb.text}) u where v is not null)`,
        `cl${i} as materialized (select v, sum(brk) over (order by v rows between unbounded preceding and current row) as c from (` +
          `select v, case when v - lag(v) over (order by v) <= ? * ${f.greatest('abs(v)', 'abs(lag(v) over (order by v))')} then 0 else 1 end as brk from dv${i}) t)`,
      );
      params.push(...ra.params, ...rb.params, plan.tolerance);
    });
  }
  const side = (name: 'ka' | 'kb', s: Side, range?: [number, number]) => {
    const parts = plan.by.map((k, i) => (clustered ? f.clustered(s, 't', `cl${i}`, k) : { key: f.exact(s, 't', k), join: '' }));
    const keys = parts.map((p, i) => `${p.key} as k${i}`);
    const joins = parts.map((p) => p.join).join('');
    const rows = pointRows(s, range);
    const [from, where] = rows.text.split(' where ');
    ctes.push(`${name} as materialized (select t.seq / ${s.methods} as idx, ${keys.join(', ')} from ${from}${joins} where ${where})`);
    params.push(...rows.params);
  };
  side('ka', plan.a, aRange);
  side('kb', plan.b);
  ctes.push(`pp as materialized (select ka.idx as ai, kb.idx as bi from ka join kb on ${plan.by.map((_, i) => `kb.k${i} = ka.k${i}`).join(' and ')})`);
  return { text: ctes.join(',\n'), params };
}

/**
 * CTEs `mm` (the methods both runs have: index in a, index in b, id) and `x`: paired
 * results with run a's point and method order and both values of the output, each row
 * found by its key (point × methods + method) in its run's table.
 */
function pairedResults(kind: Kind, plan: Plan): Sql {
  const f = flavour(kind);
  const values = plan.methods.map(() => `(${f.int('?')}, ${f.int('?')}, ${f.text('?')})`).join(', ');
  return {
    text:
      `mm (am, bm, name) as (values ${values}),\n` +
      `x as (select pp.ai as ap, mm.am as am, mm.name as method, pp.ai as ai, pp.bi as bi, ` +
      `${f.output(plan.a, 'ra', plan.output)} as av, ${f.output(plan.b, 'rb', plan.output)} as bv ` +
      `from pp cross join mm ${f.join} ${plan.a.table} ra on ra.seq = pp.ai * ${plan.a.methods} + mm.am ` +
      `${f.join} ${plan.b.table} rb on rb.seq = pp.bi * ${plan.b.methods} + mm.bm)`,
    params: plan.methods.flat(),
  };
}

function differs(kind: Kind): Sql {
  const f = flavour(kind);
  return {
    text: `(case when x.av is null or x.bv is null then (case when (x.av is null) = (x.bv is null) then 0 else 1 end) when abs(x.bv - x.av) > ? * ${f.greatest('abs(x.av)', 'abs(x.bv)')} then 1 else 0 end)`,
    params: [SAME],
  };
}

/** The inputs of points of a run (read on this connection: a handful of rows). */
async function pointInputs(store: Store, side: Side, points: number[]): Promise<Map<number, Inputs>> {
  const out = new Map<number, Inputs>();
  await eachStoredResult(store, side.run.id, side.methods, (r) => out.set(r.point, r.inputs), {
    layout: side.layout,
    seqs: [...new Set(points)].map((p) => p * side.methods),
  });
  return out;
}

interface ChunkCount {
  chunk: number;
  /** Paired results, changed results and paired points in this chunk of run a. */
  n: number;
  changed: number;
  points: number;
}

interface Counts {
  chunks: ChunkCount[];
  paired: number;
  changed: number;
  points: number;
}

/** Refuses inputs that do not identify a point in one of the runs (two points, one key). */
async function checkUnique(store: Store, plan: Plan): Promise<void> {
  const kind = store.kind as Kind;
  const ctes = pairingCtes(kind, plan);
  const keys = plan.by.map((_, i) => `k${i}`).join(', ');
  const notNull = plan.by.map((_, i) => `k${i} is not null`).join(' and ');
  const dup = (side: 'ka' | 'kb') => `select * from (select '${side}' as side, min(idx) as i, max(idx) as j from ${side} where ${notNull} group by ${keys} having count(*) > 1 limit 1) ${side}_dup`;
  const [found] = await readOffThread<{ side: 'ka' | 'kb'; i: number; j: number }>(store, `with ${ctes.text}\n${dup('ka')} union all ${dup('kb')}`, ctes.params);
  if (!found) return;
  const side = found.side === 'ka' ? plan.a : plan.b;
  const label = found.side === 'ka' ? 'a' : 'b';
  const inputs = await pointInputs(store, side, [Number(found.i), Number(found.j)]);
  const [p, q] = [inputs.get(Number(found.i)), inputs.get(Number(found.j))];
  const show = (v: Inputs[string] | undefined) => (v === undefined ? '(none)' : String(v));
  const differ = Object.keys({ ...p, ...q }).filter((k) => show(p?.[k]) !== show(q?.[k]));
  const detail = differ.length ? differ.map((k) => `${k} ${show(p?.[k])} / ${show(q?.[k])}`).join(', ') : 'identical inputs';
  const merged = plan.tolerance > 0 ? differ.filter((k) => plan.by.includes(k)) : [];
  throw new CompareLimitError(
    422,
    `pairing by ${plan.by.join(', ')}${plan.tolerance > 0 ? ` within ${plan.tolerance * 100} %` : ''} does not tell points of run ${label} (#${side.run.id}) apart: ` +
      `points ${found.i} and ${found.j} would pair as one (${detail}). ` +
      (merged.length ? `Use a smaller tolerance than the spacing of ${merged.join(', ')}, or pair by more inputs.` : 'Pair by more inputs.'),
  );
}

async function countPairs(store: Store, plan: Plan): Promise<Counts> {
  const kind = store.kind as Kind;
  const ctes = pairingCtes(kind, plan);
  const x = pairedResults(kind, plan);
  const diff = differs(kind);
  const chunks = await readOffThread<ChunkCount>(
    store,
    `with ${ctes.text},\n${x.text}\nselect x.ap / ${CHUNK} as chunk, count(*) as n, sum(${diff.text}) as changed, count(distinct x.ap) as points from x group by x.ap / ${CHUNK} order by 1`,
    [...ctes.params, ...x.params, ...diff.params],
  );
  const rows = chunks.map((c) => ({ chunk: Number(c.chunk), n: Number(c.n), changed: Number(c.changed), points: Number(c.points) }));
  return {
    chunks: rows,
    paired: rows.reduce((s, c) => s + c.n, 0),
    changed: rows.reduce((s, c) => s + c.changed, 0),
    points: rows.reduce((s, c) => s + c.points, 0),
  };
}

// Counts per (store, runs with their sizes, inputs, tolerance, output): the one full pass.
// A promise, so the table's and the chart's requests for one comparison share it.
const MEMO_SIZE = 32;
const memo = new WeakMap<Store, Map<string, Promise<Counts>>>();

function memoCounts(store: Store, plan: Plan): Promise<Counts> {
  const [a, b] = [plan.a.run, plan.b.run];
  const key = JSON.stringify([a.id, a.results_count, a.status, b.id, b.results_count, b.status, plan.by, plan.tolerance, plan.output]);
  let byStore = memo.get(store);
  if (!byStore) memo.set(store, (byStore = new Map()));
  const hit = byStore.get(key);
  if (hit) {
    byStore.delete(key);
    byStore.set(key, hit); // most recently used last
    return hit;
  }
  const counts = (async () => {
    await checkUnique(store, plan);
    if (plan.methods.length === 0) return { chunks: [], paired: 0, changed: 0, points: 0 };
    return countPairs(store, plan);
  })();
  byStore.set(key, counts);
  counts.catch(() => byStore!.delete(key));
  while (byStore.size > MEMO_SIZE) byStore.delete(byStore.keys().next().value!);
  return counts;
}

/** Input names of a run (every point's, exact: from its table's layout). */
function inputNames(side: Side): string[] {
  return side.layout.names().inputs.filter((k) => NAME_PATTERN.test(k));
}

async function readPage(store: Store, plan: Plan, counts: Counts, onlyChanged: boolean, offset: number, size: number): Promise<CompareRow[]> {
  // The chunks of run a that hold rows offset … offset + size − 1 of the listing.
  const weight = (c: ChunkCount) => (onlyChanged ? c.changed : c.n);
  const chunks = counts.chunks;
  let before = 0;
  let i = 0;
  while (i < chunks.length && before + weight(chunks[i]) <= offset) before += weight(chunks[i++]);
  if (i >= chunks.length) return [];
  let j = i;
  let covered = before + weight(chunks[i]);
  while (covered < offset + size && j + 1 < chunks.length) covered += weight(chunks[++j]);
  const [first, last] = [chunks[i].chunk, chunks[j].chunk];
  const kind = store.kind as Kind;
  const ctes = pairingCtes(kind, plan, [first * CHUNK, (last + 1) * CHUNK - 1]);
  const x = pairedResults(kind, plan);
  const diff = differs(kind);
  const rows = await readOffThread<{ method: string; av: number | null; bv: number | null; ai: number; bi: number }>(
    store,
    `with ${ctes.text},\n${x.text},\n` +
      `pg as (select x.method, x.ai, x.bi, x.av, x.bv, x.ap, x.am from x${onlyChanged ? ` where ${diff.text} = 1` : ''} order by x.ap, x.am limit ? offset ?)\n` +
      'select pg.method, pg.av, pg.bv, pg.ai, pg.bi from pg order by pg.ap, pg.am',
    [...ctes.params, ...x.params, ...(onlyChanged ? diff.params : []), size, offset - before],
  );
  const [ia, ib] = await Promise.all([pointInputs(store, plan.a, rows.map((r) => Number(r.ai))), pointInputs(store, plan.b, rows.map((r) => Number(r.bi)))]);
  return rows.map((r) => {
    const av = typeof r.av === 'number' ? r.av : null;
    const bv = typeof r.bv === 'number' ? r.bv : null;
    return { method: r.method, inputs: ia.get(Number(r.ai))!, inputs_b: ib.get(Number(r.bi))!, a: av, b: bv, rel_diff: av !== null && bv !== null && av !== 0 ? (bv - av) / Math.abs(av) : null };
  });
}

/**
 * Pairs the results of two runs by method and the chosen inputs and compares one output.
 * Rows in run a's point and method order.
 */
export async function compareRuns(store: Store, aId: number, bId: number, q: CompareQuery): Promise<Comparison> {
  if (!NAME_PATTERN.test(q.output)) throw new InputError(`'${q.output}' is not an output name`);
  const [a, b] = await Promise.all([getRun(store, aId), getRun(store, bId)]);
  if (!a) throw new InputError(`no run ${aId} in this database`);
  if (!b) throw new InputError(`no run ${bId} in this database`);
  for (const [label, run] of [['a', a], ['b', b]] as const) {
    if (run.results_count > COMPARE_MAX_RESULTS) {
      throw new CompareLimitError(
        413,
        `run ${label} (#${run.id}) has ${run.results_count.toLocaleString('en')} results; a comparison reads at most ${COMPARE_MAX_RESULTS.toLocaleString('en')} per run. Export both runs and compare them offline.`,
      );
    }
  }
  const tolerance = q.tolerance ?? 0;
  if (!(tolerance >= 0 && tolerance <= MAX_TOLERANCE)) {
    throw new CompareLimitError(422, `tolerance ${tolerance} is outside 0 … ${MAX_TOLERANCE} (a relative tolerance: 0.001 is 0.1 %)`);
  }
  // Both runs in their tables (a run stored before run tables is moved there first, in steps).
  const sides: Side[] = [];
  for (const run of [a, b]) {
    if (!(await convertLegacyRun(store, run.id))) {
      throw new CompareLimitError(422, `run #${run.id} is still being written by an older Filmsweep; compare it once it has ended`);
    }
    sides.push({ run, table: runTableName(run.id), methods: run.methods.length, layout: await loadLayout(store, run.id) });
  }
  const [namesA, namesB] = [inputNames(sides[0]), inputNames(sides[1])];
  const known = [...new Set([...namesA, ...namesB])].sort();
  const by = q.by?.length ? [...new Set(q.by)] : known;
  if (by.length === 0) throw new CompareLimitError(422, 'the runs have no inputs to pair their points by');
  if (by.length > MAX_PAIR_INPUTS) throw new CompareLimitError(422, `pairing by ${by.length} inputs; at most ${MAX_PAIR_INPUTS}`);
  const unknown = by.filter((k) => !known.includes(k));
  if (unknown.length) throw new CompareLimitError(422, `neither run has the input${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}; they have: ${known.join(', ')}`);

  const common = a.methods.flatMap((m, am): [number, number, string][] => {
    const bm = b.methods.findIndex((x) => x.id === m.id);
    return bm < 0 ? [] : [[am, bm, m.id]];
  });
  const plan: Plan = { a: sides[0], b: sides[1], by, tolerance, output: q.output, methods: common };
  const counts = await memoCounts(store, plan);
  const page = Math.max(1, Math.floor(q.page ?? 1));
  const pageSize = Math.min(MAX_PAGE_SIZE, Math.max(1, Math.floor(q.pageSize ?? 50)));
  const onlyChanged = q.changed === 'yes';
  const total = onlyChanged ? counts.changed : counts.paired;
  const offset = (page - 1) * pageSize;
  const rows = offset < total ? await readPage(store, plan, counts, onlyChanged, offset, pageSize) : [];
  return {
    a,
    b,
    output: q.output,
    by,
    tolerance,
    total,
    paired: counts.paired,
    changed: counts.changed,
    only_a: a.results_count - counts.paired,
    only_b: b.results_count - counts.paired,
    points: { paired: counts.points, only_a: a.points_done - counts.points, only_b: b.points_done - counts.points },
    rows,
  };
}

/** The study file text each run executed (for the comparison's YAML diff). */
export async function studyYamlOf(store: Store, runId: number): Promise<string | undefined> {
  const [row] = await store.dialect.all<{ yaml: string }>('select v.yaml from runs r join study_versions v on v.id = r.study_version_id where r.id = ?', [runId]);
  return row?.yaml;
}
