// Which columns a memo table (Markdown, LaTeX) shows. A full run is too wide to paste, so
// by default: the method, the inputs that vary across rows, the main outputs (Re and Ra
// when the engine derived them, Nu, Nu_x, h, h_x) and the flags. Inputs that never change
// are listed once above the table; every other column is named as left out (the CSV,
// JSON and XLSX exports carry everything). `columns` picks the columns by name instead.
import type { ExportRow } from './types.js';
import { InputError } from '../physics/types.js';
import { ColumnCollector, type Column } from './table.js';
import type { UnitLookup } from './units.js';

export const mainOutputs: readonly string[] = ['Re', 'Ra', 'Nu', 'Nu_x', 'h', 'h_x'];

export interface MemoColumns {
  shown: Column[];
  /** Inputs with one value over the whole run, shown above the table. */
  fixed: { column: Column; value: number | boolean | string }[];
  /** Labels of the columns neither shown nor fixed. */
  leftOut: string[];
}

export function memoColumns(rows: readonly ExportRow[], unitOf: UnitLookup, columns?: readonly string[]): MemoColumns {
  return memoColumnsOf(new ColumnCollector().add(rows), unitOf, columns);
}

/** The same choice from a collector that has seen every row (streamed exports). */
export function memoColumnsOf(seen: ColumnCollector, unitOf: UnitLookup, columns?: readonly string[]): MemoColumns {
  const all = seen.columns(unitOf);
  if (columns?.length) {
    const shown = columns.map((name) => {
      const c = all.find((x) => x.label === name) ?? all.find((x) => x.name === name);
      if (!c) throw new InputError(`unknown column '${name}'; this run has: ${all.map((x) => x.label).join(', ')}`);
      return c;
    });
    return { shown, fixed: [], leftOut: all.filter((c) => !shown.includes(c)).map((c) => c.label) };
  }
  const shown: Column[] = [];
  const fixed: MemoColumns['fixed'] = [];
  const leftOut: string[] = [];
  const inputNames = new Set(all.filter((c) => c.kind === 'input').map((c) => c.name));
  for (const c of all) {
    if (c.kind === 'method' || c.kind === 'flags' || c.kind === 'recommended') {
      shown.push(c);
    } else if (c.kind === 'input') {
      const value = seen.constantInput(c.name);
      if (value !== undefined) fixed.push({ column: c, value });
      else shown.push(c);
    } else if (mainOutputs.includes(c.name) && !inputNames.has(c.name)) {
      shown.push(c);
    } else {
      leftOut.push(c.label);
    }
  }
  return { shown, fixed, leftOut };
}
