// The per-point summary across methods: the methods whose ranges hold at the point
// (no range flag, names.ts), how far they disagree (max/min − 1 of Nu, or of a target's
// solved input), and the recommended one: the applicable method with the smallest stated
// uncertainty (DESIGN.md §7), ties going to the method listed first in the study.
import type { ResultRow } from '../physics/engine.js';
import { isRangeFlag, NO_APPLICABLE_METHOD } from './names.js';
import type { PointSummary } from './types.js';

export interface MethodUncertainty {
  id: string;
  /** Stated uncertainty as a fraction (0.2 for ±20 %). */
  fraction: number;
}

const percent = (fraction: number) => `±${Number((fraction * 100).toPrecision(3))} %`;

/**
 * `rows`: one per method, in the study's order; `methods`: their stated uncertainties;
 * `adjust`: the target's adjusted input, whose solved values then make the spread.
 */
export function summarizePoint(rows: readonly ResultRow[], methods: readonly MethodUncertainty[], adjust?: string): PointSummary {
  const fractionOf = new Map(methods.map((m) => [m.id, m.fraction]));
  return explainSummary(summaryFacts(rows, rows.map((r) => fractionOf.get(r.method) ?? Infinity), adjust), methods, rows);
}

/** The index form of a point's summary facts, filled in place (no allocation per point). */
export interface SummaryIndices {
  /** 1 where rows[i]'s method holds at the point (no range flag), else 0; at least rows.length long. */
  applicable: Uint8Array;
  /** The recommended row (−1: none applies). */
  best: number;
  spread: number | null;
  spread_of: string | null;
}

export function summaryScratch(methods: number): SummaryIndices {
  return { applicable: new Uint8Array(methods), best: -1, spread: null, spread_of: null };
}

/**
 * The summary's facts by row index, into `into`: what the workers compute for every point of
 * every run (columnar, stored-summaries.ts), so kept to plain loops. `fractions[i]` is the
 * stated uncertainty of `rows[i]`'s method.
 */
export function fillSummaryIndices(rows: readonly ResultRow[], fractions: readonly number[], adjust: string | undefined, into: SummaryIndices): SummaryIndices {
  const { applicable } = into;
  let best = -1;
  let anyNu = false;
  let anyNux = false;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    let holds = 1;
    for (const f of r.flags) if (isRangeFlag(f)) holds = 0;
    applicable[i] = holds;
    if (!holds) continue;
    if (best < 0 || fractions[i] < fractions[best]) best = i;
    if (r.outputs.Nu !== undefined) anyNu = true;
    else if (r.outputs.Nu_x !== undefined) anyNux = true;
  }
  // Nu where the applicable methods give a mean value, else the local Nu_x: never a mix.
  const spreadOf = adjust ?? (anyNu ? 'Nu' : anyNux ? 'Nu_x' : null);
  let lo = Infinity;
  let hi = -Infinity;
  if (spreadOf !== null) {
    for (let i = 0; i < rows.length; i++) {
      const v = rows[i].outputs[spreadOf];
      if (!(v > 0) || !Number.isFinite(v) || !applicable[i]) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  into.best = best;
  into.spread = hi >= lo ? hi / lo - 1 : null;
  into.spread_of = into.spread === null ? null : spreadOf;
  return into;
}

/** The summary's facts alone, by method id (`show`, the point view, `solve`). */
export function summaryFacts(rows: readonly ResultRow[], fractions: readonly number[], adjust?: string): SummaryFacts {
  const f = fillSummaryIndices(rows, fractions, adjust, summaryScratch(rows.length));
  const applicable: string[] = [];
  for (let i = 0; i < rows.length; i++) if (f.applicable[i]) applicable.push(rows[i].method);
  return { applicable, spread: f.spread, spread_of: f.spread_of, recommended: f.best < 0 ? null : rows[f.best].method };
}

/** What the store keeps of a summary: the facts, without their wording. */
export type SummaryFacts = Pick<PointSummary, 'applicable' | 'spread' | 'spread_of' | 'recommended'>;

/**
 * The summary in words (reason, flags) from its facts. `rows`, when at hand, name each
 * method's range flags where none applies.
 */
export function explainSummary(facts: SummaryFacts, methods: readonly MethodUncertainty[], rows?: readonly ResultRow[]): PointSummary {
  const fractionOf = new Map(methods.map((m) => [m.id, m.fraction]));
  const stated = (id: string) => (fractionOf.has(id) ? percent(fractionOf.get(id)!) : 'not stated');
  const { applicable, recommended } = facts;
  if (recommended === null || applicable.length === 0) {
    const why = rows ? `: ${rows.map((r) => `${r.method} (${r.flags.filter(isRangeFlag).join(', ')})`).join('; ')}` : '';
    return { ...facts, applicable: [], spread: null, spread_of: null, recommended: null, reason: `no method's validity ranges hold at this point${why}`, flags: [NO_APPLICABLE_METHOD] };
  }
  let reason: string;
  if (applicable.length === 1) {
    reason = `the only method whose validity ranges hold at this point (stated uncertainty ${stated(recommended)})`;
  } else {
    const list = applicable.map((id) => `${id} ${stated(id)}`).join(', ');
    const tie = applicable.filter((id) => fractionOf.get(id) === fractionOf.get(recommended)).length > 1 ? "; a tie, settled by the order of the study's methods" : '';
    reason = `smallest stated uncertainty among the ${applicable.length} methods whose validity ranges hold at this point: ${list}${tie}`;
  }
  return { ...facts, reason, flags: [] };
}
