// The column model every tabular export shares: one column per input name and per output
// name (union over rows, inputs first, each in first-seen order), framed by `method` and
// `flags` (and `recommended`, true on the row of each point's recommended method, when the
// run has per-point summaries). An output that shares its name with an input (the engine echoes `velocity`, for
// example) gets its own column labelled `<name> (output)`, so nothing is merged or lost.
import type { ExportRow } from './types.js';
import { displayUnit, type UnitLookup } from './units.js';

export type ColumnKind = 'method' | 'input' | 'output' | 'flags' | 'recommended';

export interface Column {
  kind: ColumnKind;
  /** The input or output name (`method`, `flags` for the framing columns). */
  name: string;
  /** What a header shows before the unit: the name, or `<name> (output)` on a clash. */
  label: string;
  /**
   * Display unit (`-` for dimensionless), `?` for a numeric column nothing declares a unit
   * for, undefined for text columns (method, flags, string or boolean inputs).
   */
  unit?: string;
}

export type CellValue = number | boolean | string | undefined;

/**
 * The columns of rows seen so far, fed one chunk at a time (a streamed export reads the
 * run once for its columns, then again to write it). Also remembers, for each input of
 * the first row, whether every row has the same value (memo-columns.ts lists those once
 * above the table instead of as a column).
 */
export class ColumnCollector {
  private readonly inputNames = new Set<string>();
  private readonly outputNames = new Set<string>();
  private readonly numericInputs = new Set<string>();
  /** Inputs of the first row and whether every later row repeats the value. */
  private readonly firstInputs = new Map<string, { value: number | boolean | string; constant: boolean }>();
  private rowCount = 0;
  private anyRecommended = false;

  add(rows: readonly ExportRow[]): this {
    for (const row of rows) {
      if (row.recommended !== undefined) this.anyRecommended = true;
      if (this.rowCount === 0) {
        for (const [k, v] of Object.entries(row.inputs)) if (v !== undefined) this.firstInputs.set(k, { value: v, constant: true });
      } else {
        for (const [k, first] of this.firstInputs) if (first.constant && !sameValue(row.inputs[k], first.value)) first.constant = false;
      }
      this.rowCount++;
      for (const [k, v] of Object.entries(row.inputs)) {
        this.inputNames.add(k);
        if (typeof v === 'number') this.numericInputs.add(k);
      }
      for (const k of Object.keys(row.outputs)) this.outputNames.add(k);
    }
    return this;
  }

  get rows(): number {
    return this.rowCount;
  }

  /** The input's value when every row has the same one, else undefined. */
  constantInput(name: string): number | boolean | string | undefined {
    const first = this.firstInputs.get(name);
    return first?.constant ? first.value : undefined;
  }

  columns(unitOf: UnitLookup): Column[] {
    const unitFor = (name: string) => {
      const u = unitOf(name);
      return u === undefined ? '?' : displayUnit(u);
    };
    const columns: Column[] = [{ kind: 'method', name: 'method', label: 'method' }];
    for (const name of this.inputNames) {
      columns.push({ kind: 'input', name, label: name, unit: this.numericInputs.has(name) ? unitFor(name) : undefined });
    }
    for (const name of this.outputNames) {
      const label = this.inputNames.has(name) ? `${name} (output)` : name;
      columns.push({ kind: 'output', name, label, unit: unitFor(name) });
    }
    columns.push({ kind: 'flags', name: 'flags', label: 'flags' });
    if (this.anyRecommended) columns.push({ kind: 'recommended', name: 'recommended', label: 'recommended' });
    return columns;
  }
}

export function sameValue(a: unknown, b: unknown): boolean {
  return a === b || (typeof a === 'number' && typeof b === 'number' && Object.is(a, b));
}

export function resultColumns(rows: readonly ExportRow[], unitOf: UnitLookup): Column[] {
  return new ColumnCollector().add(rows).columns(unitOf);
}

/** `label [unit]`, or the bare label for text columns. */
export function plainHeader(c: Column): string {
  return c.unit === undefined ? c.label : `${c.label} [${c.unit}]`;
}

/** The raw value of a row in a column; flags joined by `;` (the CSV and XLSX form). */
export function cellOf(row: ExportRow, c: Column): CellValue {
  switch (c.kind) {
    case 'method':
      return row.method;
    case 'input':
      return row.inputs[c.name];
    case 'output':
      return row.outputs[c.name];
    case 'flags':
      return row.flags.join(';');
    case 'recommended':
      return row.recommended;
  }
}
