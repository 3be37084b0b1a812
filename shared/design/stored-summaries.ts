// The stored form of per-point summaries (migrations/0004_point_summaries.ts): one row per
// run of consecutive points of a batch, its facts as compact JSON columns with methods as
// their index in the run's method list, and the recommendation counts of the range. One
// row per batch instead of one per point keeps the run's write rate (a point row cost a
// third of a 3-method sweep's throughput); the wording (reason, flags) is rebuilt on read
// by explainSummary. Pure, so the worker threads encode their own batches.
//
// A column is a list with one value per point or, for the recommended method, the
// applicable methods and what the spread is of, {"runs": [[value, points], …]}: those
// rarely change from one point to the next, and as runs a 1e6-result run's summaries take
// 10 MB instead of 16 MB (the spread stays a list: it differs at every point). Rows
// written before the runs form keep their lists; the decoders read both.
import type { ResultRow } from '../physics/engine.js';
import { fillSummaryIndices, summaryScratch, type SummaryFacts, type SummaryIndices } from './summary.js';

/** One stored range: points first … end − 1. */
export interface StoredSummaryRange {
  first: number;
  end: number;
  /** JSON of SummaryColumns. */
  facts: string;
  /** JSON `{"<method index>": points, "none": points}`. */
  counts: string;
}

/** One value per point: a list, or runs of equal values. */
type Column<T> = T[] | { runs: [T, number][] };

interface SummaryColumns {
  recommended: Column<number | null>;
  applicable: Column<number[]>;
  spread: Column<number | null>;
  spread_of: Column<string | null>;
}

/** A column's value at the range's k-th point. */
function valueAt<T>(column: Column<T>, k: number): T {
  if (Array.isArray(column)) return column[k];
  let left = k;
  for (const [value, n] of column.runs) {
    if (left < n) return value;
    left -= n;
  }
  throw new Error(`internal: point ${k} is past its stored summary range`);
}

/** Calls `fn` with each point's value of a column, in order. */
function eachValue<T>(column: Column<T>, fn: (value: T, k: number) => void): void {
  if (Array.isArray(column)) return column.forEach(fn);
  let k = 0;
  for (const [value, n] of column.runs) for (let i = 0; i < n; i++) fn(value, k++);
}

/** Builds a runs column from JSON values, compared as their text. */
class RunsWriter {
  private text = '';
  private last: string | undefined;
  private count = 0;

  add(json: string): void {
    if (json === this.last) {
      this.count++;
      return;
    }
    this.flush();
    this.last = json;
    this.count = 1;
  }

  /** `{"runs":[…]}`, and starts over. */
  finish(): string {
    this.flush();
    const out = `{"runs":[${this.text}]}`;
    this.text = '';
    this.last = undefined;
    return out;
  }

  private flush(): void {
    if (this.last === undefined) return;
    this.text += `${this.text ? ',' : ''}[${this.last},${this.count}]`;
    this.count = 0;
  }
}

/**
 * Builds the stored ranges point by point, straight from a point's rows (the workers' hot
 * path: no facts object per point; the runs columns grown as text, the spread kept as
 * numbers and written as JSON once per range) or from facts by id.
 */
export class SummaryEncoder {
  private readonly out: StoredSummaryRange[] = [];
  private readonly scratch: SummaryIndices;
  private readonly index: Map<string, number>;
  /** The open range: its first and next point, and its columns. */
  private first = -1;
  private next = -1;
  private readonly recommended = new RunsWriter();
  private readonly applicable = new RunsWriter();
  private spread: (number | null)[] = [];
  private readonly spreadOf = new RunsWriter();
  /** JSON of each spread_of name met so far. */
  private readonly nameJson = new Map<string | null, string>([[null, 'null']]);
  /** Points per recommended method index in the open range; the last entry counts "none". */
  private counts: number[];
  /** The last point's applicable flags and their JSON (neighbouring points nearly always share them). */
  private readonly lastApplicable: Uint8Array;
  private lastApplicableJson = '';

  constructor(
    private readonly methodIds: readonly string[],
    /** Stated uncertainty of each method (for the recommendation), in methodIds order. */
    private readonly fractions: readonly number[] = [],
    /** A target's adjusted input: its solved values make the spread. */
    private readonly adjust?: string,
  ) {
    this.scratch = summaryScratch(methodIds.length);
    this.counts = new Array<number>(methodIds.length + 1).fill(0);
    this.index = new Map(methodIds.map((id, i) => [id, i]));
    this.lastApplicable = new Uint8Array(methodIds.length);
  }

  /** Point `point`'s rows, one per method in methodIds order. */
  addRows(point: number, rows: readonly ResultRow[]): void {
    const f = fillSummaryIndices(rows, this.fractions, this.adjust, this.scratch);
    this.push(point, f.best < 0 ? null : f.best, this.applicableJson(f.applicable, rows.length), f.spread, f.spread_of);
  }

  /** Point `point`'s facts by method id (methods not in the run's list are left out). */
  addFacts(point: number, s: SummaryFacts): void {
    const rec = s.recommended === null ? null : (this.index.get(s.recommended) ?? null);
    const applicable = s.applicable.map((id) => this.index.get(id)).filter((x) => x !== undefined);
    this.push(point, rec, JSON.stringify(applicable), s.spread, s.spread_of);
  }

  /** The JSON list of the method indices whose flag is set. */
  private applicableJson(flags: ArrayLike<number>, n: number): string {
    const last = this.lastApplicable;
    let same = this.lastApplicableJson !== '';
    for (let i = 0; i < n && same; i++) same = last[i] === flags[i];
    if (same) return this.lastApplicableJson;
    let list = '';
    for (let i = 0; i < n; i++) {
      last[i] = flags[i];
      if (flags[i]) list += list ? `,${i}` : `${i}`;
    }
    return (this.lastApplicableJson = `[${list}]`);
  }

  private push(point: number, rec: number | null, applicable: string, spread: number | null, spreadOf: string | null): void {
    if (point !== this.next) this.close();
    if (this.first < 0) this.first = point;
    this.next = point + 1;
    this.recommended.add(rec === null ? 'null' : String(rec));
    this.applicable.add(applicable);
    this.spread.push(spread);
    let name = this.nameJson.get(spreadOf);
    if (name === undefined) this.nameJson.set(spreadOf, (name = JSON.stringify(spreadOf)));
    this.spreadOf.add(name);
    this.counts[rec === null ? this.methodIds.length : rec]++;
  }

  private close(): void {
    if (this.first < 0) return;
    const facts =
      `{"recommended":${this.recommended.finish()},"applicable":${this.applicable.finish()},` +
      `"spread":${JSON.stringify(this.spread)},"spread_of":${this.spreadOf.finish()}}`;
    // Keys as JSON.stringify of a record gives them: method indices ascending, then "none".
    const counts: Record<string, number> = {};
    const none = this.methodIds.length;
    this.counts.forEach((n, m) => {
      if (n) counts[m === none ? 'none' : String(m)] = n;
    });
    this.out.push({ first: this.first, end: this.next, facts, counts: JSON.stringify(counts) });
    this.first = this.next = -1;
    this.spread = [];
    this.counts.fill(0);
  }

  finish(): StoredSummaryRange[] {
    this.close();
    return this.out;
  }
}

/** Ranges of consecutive ascending point indices, with their summaries encoded. */
export function encodeSummaries(points: readonly number[], summaries: readonly SummaryFacts[], methodIds: readonly string[]): StoredSummaryRange[] {
  const encoder = new SummaryEncoder(methodIds);
  points.forEach((p, k) => encoder.addFacts(p, summaries[k]));
  return encoder.finish();
}

/** The facts of point `idx` from a stored range's JSON. */
export function decodeSummary(facts: string, first: number, idx: number, methodIds: readonly string[]): SummaryFacts {
  const cols = JSON.parse(facts) as SummaryColumns;
  const k = idx - first;
  const rec = valueAt(cols.recommended, k);
  return {
    applicable: valueAt(cols.applicable, k).map((m) => methodIds[m]),
    spread: valueAt(cols.spread, k),
    spread_of: valueAt(cols.spread_of, k),
    recommended: rec === null ? null : methodIds[rec],
  };
}

/** Point index → recommended method index (null: none applies) of a stored range. */
export function decodeRecommended(facts: string, first: number, into: Map<number, number | null>): void {
  const cols = JSON.parse(facts) as Pick<SummaryColumns, 'recommended'>;
  eachValue(cols.recommended, (m, k) => into.set(first + k, m));
}
