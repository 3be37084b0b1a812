// XLSX export with exceljs: a Results sheet (one header row with units, frozen, with an
// auto-filter; numbers stored as numbers in full precision, booleans as booleans, flags
// as `;`-joined text) and a Run sheet (the run's facts, its methods and the caution).
import ExcelJS from 'exceljs';
import { InputError } from '../physics/types.js';
import { CAUTION } from './caution.js';
import { cellOf, plainHeader, resultColumns } from './table.js';
import type { RunExport } from './types.js';
import type { UnitLookup } from './units.js';

/** A worksheet holds 1 048 576 rows (Excel's limit); one is the header. */
export const maxXlsxRows = 1_048_575;

export async function toXlsx(data: RunExport, unitOf: UnitLookup): Promise<Buffer> {
  const { run, rows } = data;
  if (rows.length > maxXlsxRows) {
    throw new InputError(`run ${run.id} has ${rows.length} results; an XLSX sheet holds at most ${maxXlsxRows}: export CSV or JSON instead`);
  }
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Filmsweep';
  // The run's own time instead of "now", so exporting a run twice gives the same metadata.
  const when = run.finished_at ?? run.started_at;
  if (when) {
    workbook.created = new Date(when);
    workbook.modified = new Date(when);
  }

  const columns = resultColumns(rows, unitOf);
  const results = workbook.addWorksheet('Results', { views: [{ state: 'frozen', xSplit: 0, ySplit: 1 }] });
  results.columns = columns.map((c) => ({ header: plainHeader(c), key: `${c.kind}:${c.name}`, width: Math.max(10, plainHeader(c).length + 2) }));
  results.getRow(1).font = { bold: true };
  for (const row of rows) {
    results.addRow(columns.map((c) => cellOf(row, c) ?? null));
  }
  results.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: columns.length } };

  const info = workbook.addWorksheet('Run');
  info.columns = [
    { header: 'field', key: 'field', width: 18 },
    { header: 'value', key: 'value', width: 80 },
  ];
  info.getRow(1).font = { bold: true };
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
  for (const [field, value] of fields) info.addRow([field, value]);
  info.getCell('B2').alignment = { wrapText: true, vertical: 'top' };
  info.getCell('A2').font = { bold: true, color: { argb: 'FFB00020' } };

  const buffer = await workbook.xlsx.writeBuffer();
  return Buffer.from(buffer);
}
