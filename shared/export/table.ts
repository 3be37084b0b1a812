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

export function resultColumns(rows: readonly ExportRow[], unitOf: UnitLookup): Column[] {
  const inputNames = new Set<string>();
  const outputNames = new Set<string>();
  const numericInputs = new Set<string>();
  for (const row of rows) {
    for (const [k, v] of Object.entries(row.inputs)) {
      inputNames.add(k);
      if (typeof v === 'number') numericInputs.add(k);
    }
    for (const k of Object.keys(row.outputs)) outputNames.add(k);
  }
  const unitFor = (name: string) => {
    const u = unitOf(name);
    return u === undefined ? '?' : displayUnit(u);
  };
  const columns: Column[] = [{ kind: 'method', name: 'method', label: 'method' }];
  for (const name of inputNames) {
    columns.push({ kind: 'input', name, label: name, unit: numericInputs.has(name) ? unitFor(name) : undefined });
  }
  for (const name of outputNames) {
    const label = inputNames.has(name) ? `${name} (output)` : name;
    columns.push({ kind: 'output', name, label, unit: unitFor(name) });
  }
  columns.push({ kind: 'flags', name: 'flags', label: 'flags' });
  if (rows.some((r) => r.recommended !== undefined)) columns.push({ kind: 'recommended', name: 'recommended', label: 'recommended' });
  return columns;
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
