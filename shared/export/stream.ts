// Exports written as they are read: the rows come in slices (from the database, or from
// memory for `exportRun`), each format turns a slice into text (or XLSX rows), and the
// text goes to a Writable (an HTTP response, a file) with backpressure: the next slice is
// read only once the output has taken the last. Between slices the event loop gets a turn
// (setImmediate), so a large export never holds other requests. Formats that need every
// column before the first line (CSV, Markdown, LaTeX, XLSX) read the rows twice: once to
// collect the columns, once to write; memory stays at one slice either way.
import type { Writable } from 'node:stream';
import { csvEncoder } from './csv.js';
import { jsonEncoder } from './json.js';
import { latexEncoder, type LatexOptions } from './latex.js';
import { markdownEncoder } from './markdown.js';
import { memoColumnsOf } from './memo-columns.js';
import { collectColumns, pumpRows, type RowEncoder, type RowSource } from './rows.js';
import type { ExportFormat, RunInfo } from './types.js';
import type { UnitLookup } from './units.js';
import { writeXlsx } from './xlsx.js';

export * from './rows.js';

async function writeText(encoder: RowEncoder, source: RowSource, out: Writable): Promise<void> {
  out.write(encoder.head());
  await pumpRows(source, out, (chunk) => {
    const text = encoder.rows(chunk);
    if (text) out.write(text);
  });
  await new Promise<void>((resolve, reject) => {
    out.once('error', reject);
    out.end(encoder.tail(), () => resolve());
  });
}

/**
 * Writes the run in the format to `out` and ends it. Errors before the first byte (a bad
 * column name, a run too long for XLSX) are thrown before anything is written.
 */
export async function writeRunExport(
  run: RunInfo,
  source: RowSource,
  format: ExportFormat,
  out: Writable,
  unitOf: UnitLookup,
  options: LatexOptions = {},
): Promise<void> {
  if (format === 'json') return writeText(jsonEncoder(run), source, out);
  const seen = await collectColumns(source);
  switch (format) {
    case 'csv':
      return writeText(csvEncoder(seen.columns(unitOf)), source, out);
    case 'md':
      return writeText(markdownEncoder(run, memoColumnsOf(seen, unitOf, options.columns), options), source, out);
    case 'tex':
      return writeText(latexEncoder(run, memoColumnsOf(seen, unitOf, options.columns), options), source, out);
    case 'xlsx':
      return writeXlsx(run, seen.columns(unitOf), source, out);
  }
}
