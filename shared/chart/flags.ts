// What a result's flag means at its point, for tooltips and the results table:
// `out-of-range:Re` with the point's Re and the method's validity range for Re (from the
// catalogue). Browser-safe: the server (chart data) and the web app (table) both use it.
import type { ValidityRange } from '../physics/types.js';
import type { FlagDetail } from './types.js';

/** `values`: the point's inputs and the result's outputs; `ranges`: the method's catalogue ranges. */
export function describeFlag(flag: string, values: Record<string, unknown>, ranges: readonly ValidityRange[] | undefined): FlagDetail {
  const m = /^out-of-range:(.+)$/.exec(flag);
  if (!m) return { flag };
  const name = m[1];
  const v = values[name];
  const value = typeof v === 'number' && Number.isFinite(v) ? v : undefined;
  const own = ranges?.filter((r) => r.input === name) ?? [];
  const range = own.find((r) => value !== undefined && outsideRange(r, value)) ?? own[0];
  const detail: FlagDetail = { flag, name };
  if (value !== undefined) detail.value = value;
  if (range?.min !== undefined) detail.min = range.min;
  if (range?.max !== undefined) detail.max = range.max;
  if (range?.inclusive === false) detail.inclusive = false;
  return detail;
}

export function outsideRange(r: Pick<ValidityRange, 'min' | 'max' | 'inclusive'>, v: number): boolean {
  const inclusive = r.inclusive !== false;
  if (r.min !== undefined && (inclusive ? v < r.min : v <= r.min)) return true;
  if (r.max !== undefined && (inclusive ? v > r.max : v >= r.max)) return true;
  return false;
}
