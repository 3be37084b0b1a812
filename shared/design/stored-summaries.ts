// The stored form of per-point summaries (migrations/0004_point_summaries.ts): one row per
// run of consecutive points of a batch, its facts as compact JSON arrays with methods as
// their index in the run's method list, and the recommendation counts of the range. One
// row per batch instead of one per point keeps the run's write rate (a point row cost a
// third of a 3-method sweep's throughput); the wording (reason, flags) is rebuilt on read
// by explainSummary. Pure, so the worker threads encode their own batches.
import type { SummaryFacts } from './summary.js';

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

/** Ranges of consecutive ascending point indices, with their summaries encoded. */
export function encodeSummaries(points: readonly number[], summaries: readonly SummaryFacts[], methodIds: readonly string[]): StoredSummaryRange[] {
  const index = new Map(methodIds.map((id, i) => [id, i]));
  const out: StoredSummaryRange[] = [];
  for (let i = 0; i < points.length; ) {
    let j = i + 1;
    while (j < points.length && points[j] === points[j - 1] + 1) j++;
    const cols: SummaryColumns = { recommended: [], applicable: [], spread: [], spread_of: [] };
    const counts: Record<string, number> = {};
    for (let k = i; k < j; k++) {
      const s = summaries[k];
      const rec = s.recommended === null ? null : (index.get(s.recommended) ?? null);
      cols.recommended.push(rec);
      cols.applicable.push(s.applicable.map((id) => index.get(id)!).filter((x) => x !== undefined));
      cols.spread.push(s.spread);
      cols.spread_of.push(s.spread_of);
      const key = rec === null ? 'none' : String(rec);
      counts[key] = (counts[key] ?? 0) + 1;
    }
    out.push({ first: points[i], end: points[j - 1] + 1, facts: JSON.stringify(cols), counts: JSON.stringify(counts) });
    i = j;
  }
  return out;
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
