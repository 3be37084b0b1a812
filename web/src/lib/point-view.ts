// What the point view shows of one point's rows: every output once, with each method's
// value, its band (`<name>_low`/`<name>_high`, the 2.5 % and 97.5 % points) and, where a
// target was not reached, the output's range over the search interval (`<name>_min`/
// `_max`). Plain functions, so they are tested without a browser.
import type { PointRow } from '../api/points.js';
import { BOUND_SUFFIX } from '../../../shared/export/units.js';
import { formatNumber } from './format.js';
import type { Quantity } from './units.js';

export interface Cell {
  value?: number;
  low?: number;
  high?: number;
  min?: number;
  max?: number;
}

export interface OutputLine {
  name: string;
  /** Per method id. */
  cells: Record<string, Cell>;
}

const KEY: Record<string, keyof Cell> = { low: 'low', high: 'high', min: 'min', max: 'max' };

/**
 * Every output of the rows once, bound names folded into their quantity (`h_low` into h),
 * `first` names leading (the headline quantity), the rest in the order the rows give them.
 */
export function outputLines(rows: readonly PointRow[], first: readonly string[] = []): OutputLine[] {
  const lines = new Map<string, OutputLine>();
  const line = (name: string) => {
    let l = lines.get(name);
    if (!l) lines.set(name, (l = { name, cells: {} }));
    return l;
  };
  for (const name of first) line(name);
  for (const row of rows) {
    for (const [name, value] of Object.entries(row.outputs)) {
      const bound = BOUND_SUFFIX.exec(name);
      // `h_low` is a bound of h only when the row (or another) has h or its other bound.
      const base = bound ? name.slice(0, -bound[0].length) : name;
      const isBound = bound !== null && rows.some((r) => base in r.outputs || Object.keys(r.outputs).some((n) => n !== name && n.startsWith(`${base}_`) && BOUND_SUFFIX.test(n)));
      const l = line(isBound ? base : name);
      const cell = (l.cells[row.method] ??= {});
      if (isBound) cell[KEY[bound![1]]] = value;
      else cell.value = value;
    }
  }
  // A leading name no row has (a headline missing everywhere) is not a line.
  return [...lines.values()].filter((l) => Object.keys(l.cells).length > 0);
}

/**
 * The quantity the methods table leads with: what the spread is of, a target's solved
 * input, else Nu, Nu_x or h. A target no method reached still leads with its input.
 */
export function headlineName(rows: readonly PointRow[], spreadOf: string | null, adjust?: string): string | undefined {
  const has = (n: string) => rows.some((r) => n in r.outputs);
  return [spreadOf, adjust, 'Nu', 'Nu_x', 'h'].find((n): n is string => !!n && has(n)) ?? adjust;
}

/** `0.9896 … 2.246 m/s` (a band or a range) in the quantity's display unit; `unit: false` leaves the unit to a header. */
export function formatInterval(q: Quantity, low: number | undefined, high: number | undefined, unit = true): string {
  if (low === undefined && high === undefined) return '—';
  const shown = (v: number | undefined) => (v === undefined ? '—' : formatNumber(q.toDisplay(v), 4));
  const text = `${shown(low)} … ${shown(high)}`;
  return unit && q.unit !== '-' && q.unit !== '?' ? `${text} ${q.unit}` : text;
}

/**
 * How far a band reaches below and above the value, relative to it: `−31 % / +57 %`.
 * Only for a quantity without an offset (a temperature's percentage would depend on °C or K).
 */
export function bandReach(q: Quantity, cell: Cell): string | undefined {
  const { value, low, high } = cell;
  if (q.temperature || value === undefined || low === undefined || high === undefined || value === 0) return undefined;
  const pct = (v: number) => formatNumber((100 * (v - value)) / Math.abs(value), 2);
  const below = pct(low);
  const above = pct(high);
  return `${below.startsWith('-') ? below.replace('-', '−') : `+${below}`} % / ${above.startsWith('-') ? above.replace('-', '−') : `+${above}`} %`;
}
