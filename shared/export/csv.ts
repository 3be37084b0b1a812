// CSV export (RFC 4180: comma-separated, CRLF line ends, fields quoted when they hold a
// comma, a quote, CR or LF, quotes doubled), written with csv-stringify. Pure data on
// purpose: no caution or comment lines, because a `#` preamble breaks most CSV readers;
// the caution travels in every other format. Numbers are written in full precision
// (JavaScript's shortest round-trip form, e.g. `1e-7`), booleans as `true`/`false`, a
// missing value as an empty field, flags joined by `;`. No byte-order mark: open the XLSX
// export in a spreadsheet instead.
//
// Spreadsheet formula injection: a text cell (a method id, a flag, a string input, a
// header) that begins with `=`, `+`, `-`, `@`, a tab or a CR would be run as a formula
// by a spreadsheet that opens the file; csv-stringify's escape_formulas prefixes such a
// cell with `'`, so it shows as the text it is. Numbers are numbers and never prefixed
// (`-0.5` stays `-0.5`).
import { stringify, type Options } from 'csv-stringify/sync';
import type { ExportRow } from './types.js';
import type { RowEncoder } from './rows.js';
import { cellOf, plainHeader, resultColumns, type Column } from './table.js';
import type { RunExport } from './types.js';
import type { UnitLookup } from './units.js';

const CSV_OPTIONS: Options = {
  record_delimiter: 'windows',
  // Quote a field holding a lone LF or CR too (csv-stringify quotes only CRLF once a record delimiter is set).
  quote_record_delimiter: true,
  escape_formulas: true,
  cast: {
    boolean: (v) => (v ? 'true' : 'false'),
    number: (v) => (Object.is(v, -0) ? '0' : String(v)),
  },
};

/** One field as the CSV export writes it (quoted when needed, formulas neutralised). */
export function csvField(text: string): string {
  return stringify([[text]], { ...CSV_OPTIONS, eof: false });
}

export function csvEncoder(columns: readonly Column[]): RowEncoder {
  return {
    head: () => stringify([columns.map(plainHeader)], CSV_OPTIONS),
    rows: (chunk: readonly ExportRow[]) => (chunk.length ? stringify(chunk.map((row) => columns.map((c) => cellOf(row, c))), CSV_OPTIONS) : ''),
    tail: () => '',
  };
}

export function toCsv(data: RunExport, unitOf: UnitLookup): string {
  const enc = csvEncoder(resultColumns(data.rows, unitOf));
  return enc.head() + enc.rows(data.rows) + enc.tail();
}
