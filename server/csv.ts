// Reading CSV with csv-parse (RFC 4180: quoted fields, doubled quotes, CRLF or LF); a
// comma, semicolon or tab separator, guessed from the header line. Cells stay text, so
// numbers keep every digit they were written with; each record keeps the line it ends on.
import { CsvError, parse } from 'csv-parse/sync';
import { detectSeparator } from '../shared/measurements/header.js';
import { HttpError } from './http-error.js';

export interface CsvRecord {
  /** 1-based line number of the record (its last line, for a quoted field over several lines). */
  line: number;
  cells: string[];
}

export interface CsvTable {
  header: string[];
  records: CsvRecord[];
}

/** The header and the non-empty records; a malformed file is a 400 naming the line. */
export function parseCsv(text: string): CsvTable {
  const body = text.replace(/^\uFEFF/, '');
  const firstLine = body.split(/\r?\n/, 1)[0] ?? '';
  let parsed: { record: string[]; info: { lines: number } }[];
  try {
    parsed = parse(body, { delimiter: detectSeparator(firstLine), relax_column_count: true, skip_empty_lines: true, info: true, trim: false }) as unknown as typeof parsed;
  } catch (e) {
    if (e instanceof CsvError) {
      const line = (e as CsvError & { lines?: number }).lines;
      throw new HttpError(400, `CSV${line ? ` line ${line}` : ''}: ${e.message.replace(/^[^:]*: /, '')}`);
    }
    throw e;
  }
  const rows = parsed.filter((r) => r.record.some((c) => c.trim() !== ''));
  if (rows.length === 0) return { header: [], records: [] };
  return { header: rows[0].record.map((h) => h.trim()), records: rows.slice(1).map((r) => ({ line: r.info.lines, cells: r.record })) };
}
