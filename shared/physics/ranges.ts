import type { Flag, Inputs, ValidityRange } from './types.js';

/** Flags `out-of-range:<input>` for every range the inputs fall outside (numbers only). */
export function rangeFlags(ranges: readonly ValidityRange[], inputs: Inputs): Flag[] {
  const flags: Flag[] = [];
  for (const r of ranges) {
    const v = inputs[r.input];
    if (typeof v !== 'number') continue;
    const inclusive = r.inclusive ?? true;
    const below = r.min !== undefined && (inclusive ? v < r.min : v <= r.min);
    const above = r.max !== undefined && (inclusive ? v > r.max : v >= r.max);
    const flag = `out-of-range:${r.input}`;
    if ((below || above) && !flags.includes(flag)) flags.push(flag);
  }
  return flags;
}
