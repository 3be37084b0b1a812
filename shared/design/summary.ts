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
  const applicable = rows.filter((r) => !r.flags.some(isRangeFlag));
  // Nu where the applicable methods give a mean value, else the local Nu_x: never a mix.
  const spreadOf = adjust ?? (applicable.some((r) => r.outputs.Nu !== undefined) ? 'Nu' : applicable.some((r) => r.outputs.Nu_x !== undefined) ? 'Nu_x' : null);
  const values = spreadOf === null ? [] : applicable.map((r) => r.outputs[spreadOf]).filter((v) => Number.isFinite(v) && v > 0);
  const spread = values.length ? Math.max(...values) / Math.min(...values) - 1 : null;

  if (applicable.length === 0) {
    const why = rows.map((r) => `${r.method} (${r.flags.filter(isRangeFlag).join(', ')})`).join('; ');
    return {
      applicable: [],
      spread: null,
      spread_of: null,
      recommended: null,
      reason: `no method's validity ranges hold at this point: ${why}`,
      flags: [NO_APPLICABLE_METHOD],
    };
  }
  let best = applicable[0];
  for (const r of applicable) if ((fractionOf.get(r.method) ?? Infinity) < (fractionOf.get(best.method) ?? Infinity)) best = r;
  const stated = (id: string) => (fractionOf.has(id) ? percent(fractionOf.get(id)!) : 'not stated');
  let reason: string;
  if (applicable.length === 1) {
    reason = `the only method whose validity ranges hold at this point (stated uncertainty ${stated(best.method)})`;
  } else {
    const list = applicable.map((r) => `${r.method} ${stated(r.method)}`).join(', ');
    const tie = applicable.filter((r) => fractionOf.get(r.method) === fractionOf.get(best.method)).length > 1 ? '; a tie, settled by the order of the study\'s methods' : '';
    reason = `smallest stated uncertainty among the ${applicable.length} methods whose validity ranges hold at this point: ${list}${tie}`;
  }
  return {
    applicable: applicable.map((r) => r.method),
    spread,
    spread_of: spread === null ? null : spreadOf,
    recommended: best.method,
    reason,
    flags: [],
  };
}
