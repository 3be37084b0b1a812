// One entry point for every export format: exportRun for rows in memory (the CLI), and
// writeRunExport (stream.ts) for rows read from the database in slices (the dashboard).
// Units come from the catalogue's specs of the run's methods (a method since removed from
// the catalogue falls back to the local table).
import { getMethod } from '../physics/catalogue.js';
import { InputError, type MethodInfo } from '../physics/types.js';
import { toCsv } from './csv.js';
import { toJson } from './json.js';
import { toLatex, type LatexOptions } from './latex.js';
import { toMarkdown } from './markdown.js';
import type { ExportFormat, ExportResult, RunExport } from './types.js';
import { exportFormats } from './types.js';
import { makeUnitLookup, type UnitLookup } from './units.js';
import { toXlsx } from './xlsx.js';

export { CAUTION } from './caution.js';
export { csvField, toCsv } from './csv.js';
export { toJson } from './json.js';
export { escapeLatex, latexNumber, latexUnit, toLatex, type LatexOptions } from './latex.js';
export { escapeMarkdown, toMarkdown, type MemoOptions } from './markdown.js';
export { mainOutputs, memoColumns, type MemoColumns } from './memo-columns.js';
export { roundSignificant } from './significant.js';
export { resultColumns, plainHeader, type Column } from './table.js';
export * from './types.js';
export { derivedUnits, displayUnit, makeUnitLookup, type UnitLookup } from './units.js';
export { maxXlsxRows, toXlsx, writeXlsx, xlsxTooLong } from './xlsx.js';
export { writeRunExport, rowsOf, OutputClosedError, type RowSource, type RowEncoder } from './stream.js';

export interface ExportOptions extends LatexOptions {
  /** Override the unit source (tests, or callers that already hold the method specs). */
  unitOf?: UnitLookup;
}

/** The method specs of a run, from the catalogue; unknown ids are skipped. */
export function runMethodSpecs(data: Pick<RunExport, 'run'> & { rows?: RunExport['rows'] }): MethodInfo[] {
  const specs: MethodInfo[] = [];
  const ids = new Set([...data.run.methods.map((m) => m.id), ...(data.rows ?? []).map((r) => r.method)]);
  for (const id of ids) {
    try {
      specs.push(getMethod(data.run.configuration, id));
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
    }
  }
  return specs;
}

export const mediaTypes: Record<ExportFormat, string> = {
  csv: 'text/csv; charset=utf-8; header=present',
  json: 'application/json',
  md: 'text/markdown; charset=utf-8',
  tex: 'application/x-tex',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
};

export async function exportRun(data: RunExport, format: ExportFormat, options: ExportOptions = {}): Promise<ExportResult> {
  if (!exportFormats.includes(format)) {
    throw new InputError(`unknown export format '${String(format)}'; expected one of: ${exportFormats.join(', ')}`);
  }
  const unitOf = options.unitOf ?? makeUnitLookup(runMethodSpecs(data));
  const body = await render(data, format, unitOf, options);
  return { body, mediaType: mediaTypes[format], extension: format };
}

function render(data: RunExport, format: ExportFormat, unitOf: UnitLookup, options: ExportOptions): string | Promise<Buffer> {
  switch (format) {
    case 'csv':
      return toCsv(data, unitOf);
    case 'json':
      return toJson(data);
    case 'md':
      return toMarkdown(data, unitOf, options);
    case 'tex':
      return toLatex(data, unitOf, options);
    case 'xlsx':
      return toXlsx(data, unitOf);
  }
}
