// The comparison of two runs: their results paired by method and inputs, one output
// compared. (Moved out of results-query.ts unchanged; see the history of that file.)
import { InputError, type Inputs } from '../physics/types.js';
import { getRun, type RunInfo } from './queries.js';
import { NAME_PATTERN } from './results-cache.js';
import { MAX_PAGE_SIZE } from './results-query.js';
import type { Store } from './store.js';

export interface CompareQuery {
  output: string;
  page?: number;
  pageSize?: number;
  /** `yes`: only pairs whose value differs. */
  changed?: 'yes' | 'any';
}

export interface CompareRow {
  method: string;
  inputs: Inputs;
  a: number | null;
  b: number | null;
  /** (b − a)/|a|; null when either is missing or a is 0. */
  rel_diff: number | null;
}

export interface Comparison {
  a: RunInfo;
  b: RunInfo;
  output: string;
  /** Pairs shown by `changed` (before paging). */
  total: number;
  /** Pairs whose value differs. */
  changed: number;
  only_a: number;
  only_b: number;
  rows: CompareRow[];
}

/** Values differing by less than this (relative) count as unchanged: the last bits of a double. */
const SAME = 1e-12;

/**
 * Pairs the results of two runs by method and inputs (key order ignored) and compares
 * one output. Rows in run a's point and method order.
 */
export async function compareRuns(store: Store, aId: number, bId: number, q: CompareQuery): Promise<Comparison> {
  if (!NAME_PATTERN.test(q.output)) throw new InputError(`'${q.output}' is not an output name`);
  const [a, b] = await Promise.all([getRun(store, aId), getRun(store, bId)]);
  if (!a) throw new InputError(`no run ${aId} in this database`);
  if (!b) throw new InputError(`no run ${bId} in this database`);
  const page = Math.max(1, Math.floor(q.page ?? 1));
  const pageSize = Math.min(MAX_PAGE_SIZE, Math.max(1, Math.floor(q.pageSize ?? 50)));
  const d = store.dialect;
  const read =
    `select r.method, ${d.jsonText('p.inputs')} as inputs, ${d.jsonNumber('r.outputs', q.output)} as v from results r
     join points p on p.run_id = r.run_id and p.idx = r.point_idx where r.run_id = ? order by r.point_idx, r.method_idx`;
  const key = (method: string, inputs: string) => `${method}\u0000${canonical(inputs)}`;
  const bValues = new Map<string, number | null>();
  await d.each<{ method: string; inputs: string; v: unknown }>(read, [bId], (r) => {
    bValues.set(key(r.method, r.inputs), typeof r.v === 'number' ? r.v : null);
  });
  const pairs: CompareRow[] = [];
  let changed = 0;
  let onlyA = 0;
  const matched = new Set<string>();
  await d.each<{ method: string; inputs: string; v: unknown }>(read, [aId], (r) => {
    const k = key(r.method, r.inputs);
    if (!bValues.has(k)) {
      onlyA++;
      return;
    }
    matched.add(k);
    const av = typeof r.v === 'number' ? r.v : null;
    const bv = bValues.get(k)!;
    const rel = av !== null && bv !== null && av !== 0 ? (bv - av) / Math.abs(av) : null;
    const differs = av === null || bv === null ? av !== bv : Math.abs(bv - av) > SAME * Math.max(Math.abs(av), Math.abs(bv));
    if (differs) changed++;
    if (q.changed === 'yes' && !differs) return;
    pairs.push({ method: r.method, inputs: JSON.parse(r.inputs) as Inputs, a: av, b: bv, rel_diff: rel });
  });
  const onlyB = bValues.size - matched.size;
  return {
    a,
    b,
    output: q.output,
    total: pairs.length,
    changed,
    only_a: onlyA,
    only_b: onlyB,
    rows: pairs.slice((page - 1) * pageSize, page * pageSize),
  };
}

function canonical(json: string): string {
  const value = JSON.parse(json) as Record<string, unknown>;
  return JSON.stringify(Object.keys(value).sort().map((k) => [k, value[k]]));
}
