// CSV export (RFC 4180: comma-separated, CRLF line ends, fields quoted when they hold a
// comma, a quote, CR or LF, quotes doubled). Pure data on purpose: no caution or comment
// lines, because a `#` preamble breaks most CSV readers; the caution travels in every other
// format. Numbers are written in full precision (JavaScript's shortest round-trip form,
// e.g. `1e-7`), booleans as `true`/`false`, a missing value as an empty field, flags
// joined by `;`. No byte-order mark: open the XLSX export in a spreadsheet instead.
import type { RunExport } from './types.js';
import { cellOf, plainHeader, resultColumns, type CellValue } from './table.js';
import type { UnitLookup } from './units.js';

export function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function csvValue(v: CellValue): string {
  if (v === undefined) return '';
  if (typeof v === 'number') return csvField(Object.is(v, -0) ? '0' : String(v));
  return csvField(String(v));
}

export function toCsv(data: RunExport, unitOf: UnitLookup): string {
  const columns = resultColumns(data.rows, unitOf);
  const lines = [columns.map((c) => csvField(plainHeader(c))).join(',')];
  for (const row of data.rows) lines.push(columns.map((c) => csvValue(cellOf(row, c))).join(','));
  return lines.join('\r\n') + '\r\n';
}
