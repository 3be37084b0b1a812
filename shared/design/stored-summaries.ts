// The stored form of per-point summaries (migrations/0004_point_summaries.ts): one row per
// run of consecutive points of a batch, its facts as compact JSON arrays with methods as
// their index in the run's method list, and the recommendation counts of the range. One
// row per batch instead of one per point keeps the run's write rate (a point row cost a
// third of a 3-method sweep's throughput); the wording (reason, flags) is rebuilt on read
// by explainSummary. Pure, so the worker threads encode their own batches.
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

interface SummaryColumns {
  recommended: (number | null)[];
  applicable: number[][];
  spread: (number | null)[];
  spread_of: (string | null)[];
}

/**
 * Builds the stored ranges point by point, straight from a point's rows (the workers' hot
 * path: no facts object per point, the JSON written as it goes) or from facts by id.
 * The text is exactly JSON.stringify of SummaryColumns.
 */
export class SummaryEncoder {
  private readonly out: StoredSummaryRange[] = [];
  private readonly scratch: SummaryIndices;
  private readonly index: Map<string, number>;
  /** The open range: its first and next point, and its columns as JSON pieces. */
  private first = -1;
  private next = -1;
  private recommended: string[] = [];
  private applicable: string[] = [];
  private spread: string[] = [];
  private spreadOf: string[] = [];
  /** Points per recommended method index in the open range; the last entry counts "none". */
  private counts: number[];
  /** JSON of each spread_of name met so far. */
  private readonly nameJson = new Map<string, string>();

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
  }

  /** Point `point`'s rows, one per method in methodIds order. */
  addRows(point: number, rows: readonly ResultRow[]): void {
    const f = fillSummaryIndices(rows, this.fractions, this.adjust, this.scratch);
    let list = '';
    for (let i = 0; i < rows.length; i++) if (f.applicable[i]) list += list ? `,${i}` : `${i}`;
    const json = `[${list}]`;
    this.push(point, f.best < 0 ? null : f.best, json, f.spread, f.spread_of);
  }

  /** Point `point`'s facts by method id (methods not in the run's list are left out). */
  addFacts(point: number, s: SummaryFacts): void {
    const rec = s.recommended === null ? null : (this.index.get(s.recommended) ?? null);
    const applicable = s.applicable.map((id) => this.index.get(id)).filter((x) => x !== undefined);
    this.push(point, rec, JSON.stringify(applicable), s.spread, s.spread_of);
  }

  private push(point: number, rec: number | null, applicable: string, spread: number | null, spreadOf: string | null): void {
    if (point !== this.next) this.close();
    if (this.first < 0) this.first = point;
    this.next = point + 1;
    this.recommended.push(rec === null ? 'null' : String(rec));
    this.applicable.push(applicable);
    this.spread.push(JSON.stringify(spread));
    let name = spreadOf === null ? 'null' : this.nameJson.get(spreadOf);
    if (name === undefined) this.nameJson.set(spreadOf!, (name = JSON.stringify(spreadOf)));
    this.spreadOf.push(name);
    this.counts[rec === null ? this.methodIds.length : rec]++;
  }

  private close(): void {
    if (this.first < 0) return;
    const facts = `{"recommended":[${this.recommended.join(',')}],"applicable":[${this.applicable.join(',')}],"spread":[${this.spread.join(',')}],"spread_of":[${this.spreadOf.join(',')}]}`;
    // Keys as JSON.stringify of a record gives them: method indices ascending, then "none".
    const counts: Record<string, number> = {};
    const none = this.methodIds.length;
    this.counts.forEach((n, m) => {
      if (n) counts[m === none ? 'none' : String(m)] = n;
    });
    this.out.push({ first: this.first, end: this.next, facts, counts: JSON.stringify(counts) });
    this.first = this.next = -1;
    this.recommended = [];
    this.applicable = [];
    this.spread = [];
    this.spreadOf = [];
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
  const rec = cols.recommended[k];
  return {
    applicable: cols.applicable[k].map((m) => methodIds[m]),
    spread: cols.spread[k],
    spread_of: cols.spread_of[k],
    recommended: rec === null ? null : methodIds[rec],
  };
}

/** Point index → recommended method index (null: none applies) of a stored range. */
export function decodeRecommended(facts: string, first: number, into: Map<number, number | null>): void {
  const cols = JSON.parse(facts) as Pick<SummaryColumns, 'recommended'>;
  cols.recommended.forEach((m, k) => into.set(first + k, m));
}
