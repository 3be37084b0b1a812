// XLSX export with exceljs's streaming WorkbookWriter: a Results sheet (one header row
// with units, frozen, with an auto-filter; numbers stored as numbers in full precision,
// booleans as booleans, flags as `;`-joined text) and a Run sheet (the run's facts, its
// methods and the caution). Rows are committed as they come, so a large run is never held
// whole; the zip is written to the output stream as it grows.
import { PassThrough, type Writable } from 'node:stream';
import ExcelJS from 'exceljs';
import { InputError } from '../physics/types.js';
import { CAUTION } from './caution.js';
import { pumpRows, rowsOf, type RowSource } from './rows.js';
import { cellOf, plainHeader, resultColumns, type Column } from './table.js';
import type { RunExport, RunInfo } from './types.js';
import type { UnitLookup } from './units.js';

/** A worksheet holds 1 048 576 rows (Excel's limit); one is the header. */
export const maxXlsxRows = 1_048_575;

export function xlsxTooLong(run: Pick<RunInfo, 'id'>, rows: number): string | undefined {
  return rows > maxXlsxRows ? `run ${run.id} has ${rows} results; an XLSX sheet holds at most ${maxXlsxRows}: export CSV or JSON instead` : undefined;
}

/** Streams the workbook to `out` (the caller ends nothing: the writer ends `out`). */
export async function writeXlsx(run: RunInfo, columns: readonly Column[], source: RowSource, out: Writable): Promise<void> {
  // The run's own time instead of "now", so exporting a run twice gives the same metadata.
  const stamp = run.finished_at ?? run.started_at;
  const when = stamp ? new Date(stamp) : undefined;
  // Shared strings: a run's text cells repeat a few values (method ids, sets of flags), so
  // the table stays small; without it exceljs's streaming writer drops empty text cells.
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: true });
  workbook.creator = 'Filmsweep';
  if (when) {
    workbook.created = when;
    workbook.modified = when;
  }

  const results = workbook.addWorksheet('Results', { views: [{ state: 'frozen', xSplit: 0, ySplit: 1 }] });
  results.columns = columns.map((c) => ({ header: plainHeader(c), key: `${c.kind}:${c.name}`, width: Math.max(10, plainHeader(c).length + 2) }));
  const header = results.getRow(1);
  header.font = { bold: true };
  header.commit();
  results.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: Math.max(1, columns.length) } };
  let count = 0;
  await pumpRows(source, out, (chunk) => {
    count += chunk.length;
    if (count > maxXlsxRows) throw new InputError(xlsxTooLong(run, count)!);
    for (const row of chunk) results.addRow(columns.map((c) => cellOf(row, c) ?? null)).commit();
  });
  results.commit();

  const info = workbook.addWorksheet('Run');
  info.columns = [
    { header: 'field', key: 'field', width: 18 },
    { header: 'value', key: 'value', width: 80 },
  ];
  const infoHeader = info.getRow(1);
  infoHeader.font = { bold: true };
  infoHeader.commit();
  const fields: [string, string | number | null][] = [
    ['caution', CAUTION],
    ['run id', run.id],
    ['study', run.study],
    ['title', run.title],
    ['study version', run.study_version],
    ['study file sha256', run.yaml_hash],
    ['configuration', run.configuration],
    ['status', run.status],
    ['started at', run.started_at],
    ['finished at', run.finished_at],
    ['git commit', run.git_commit],
    ['host', run.host],
    ['workers', run.workers],
    ['points total', run.points_total],
    ['points done', run.points_done],
    ['results', run.results_count],
    ['flagged results', run.flagged_count],
    ...run.methods.map((m): [string, string] => [`method ${m.id}`, `version ${m.version}`]),
  ];
  fields.forEach(([field, value], i) => {
    const row = info.addRow([field, value]);
    if (i === 0) {
      row.getCell(1).font = { bold: true, color: { argb: 'FFB00020' } };
      row.getCell(2).alignment = { wrapText: true, vertical: 'top' };
    }
    row.commit();
  });
  info.commit();
  await workbook.commit();
}

export async function toXlsx(data: RunExport, unitOf: UnitLookup): Promise<Buffer> {
  const tooLong = xlsxTooLong(data.run, data.rows.length);
  if (tooLong) throw new InputError(tooLong);
  const sink = new PassThrough();
  const parts: Buffer[] = [];
  sink.on('data', (b: Buffer) => parts.push(b));
  const ended = new Promise<void>((resolve, reject) => {
    sink.on('end', resolve);
    sink.on('error', reject);
  });
  await writeXlsx(data.run, resultColumns(data.rows, unitOf), rowsOf(data.rows), sink);
  await ended;
  return Buffer.concat(parts);
}
