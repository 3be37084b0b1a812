// Markdown export: a GitHub-flavoured table ready to paste into a memo, with the run's
// facts and the caution above it. Columns as chosen by memo-columns.ts; numbers to four
// significant figures by default.
import type { ExportRow } from './types.js';
import { CAUTION } from './caution.js';
import { memoColumns, type MemoColumns } from './memo-columns.js';
import { runFacts } from './run-summary.js';
import { roundSignificant } from './significant.js';
import type { RowEncoder } from './rows.js';
import type { Column } from './table.js';
import type { RunExport, RunInfo } from './types.js';
import type { UnitLookup } from './units.js';

export interface MemoOptions {
  /** Significant figures of numbers (default 4). */
  figures?: number;
  /** Column names to show instead of the default choice. */
  columns?: readonly string[];
}

/**
 * Backslash-escape what Markdown (and a table's `|`) would otherwise interpret. An
 * underscore inside a word (`Nu_x`) cannot start emphasis in CommonMark, so it stays bare.
 */
export function escapeMarkdown(text: string): string {
  return text
    .replace(/\r?\n/g, ' ')
    .replace(/[\\`*|<>]|(?<![A-Za-z0-9])_|_(?![A-Za-z0-9])/g, (c) => `\\${c}`);
}

function mdNumber(x: number, figures: number): string {
  const r = roundSignificant(x, figures);
  return r.exponent === undefined ? r.digits : `${r.digits}e${r.exponent}`;
}

function mdValue(v: number | boolean | string | undefined, figures: number): string {
  if (v === undefined) return '';
  if (typeof v === 'number') return mdNumber(v, figures);
  return escapeMarkdown(String(v));
}

function mdHeader(c: Column): string {
  return escapeMarkdown(c.unit === undefined ? c.label : `${c.label} [${c.unit}]`);
}

function mdCell(row: ExportRow, c: Column, figures: number): string {
  if (c.kind === 'flags') return row.flags.map(escapeMarkdown).join(', ');
  if (c.kind === 'method') return escapeMarkdown(row.method);
  if (c.kind === 'recommended') return row.recommended ? 'yes' : '';
  return mdValue(c.kind === 'input' ? row.inputs[c.name] : row.outputs[c.name], figures);
}

/** The memo table a line at a time; `memo` is the column choice over the whole run. */
export function markdownEncoder(run: RunInfo, memo: MemoColumns, options: MemoOptions = {}): RowEncoder {
  const figures = options.figures ?? 4;
  const { shown, fixed, leftOut } = memo;
  const lines = (xs: string[]) => xs.map((l) => `${l}\n`).join('');
  return {
    head: () => {
      const out: string[] = [`## Run ${run.id}: ${escapeMarkdown(run.study)}`, ''];
      for (const [label, value] of runFacts(run)) {
        out.push(label === 'Study file sha256' ? `- ${label}: \`${value}\`` : `- ${label}: ${escapeMarkdown(value)}`);
      }
      if (fixed.length) {
        const parts = fixed.map(({ column: c, value }) => {
          const unit = c.unit && c.unit !== '-' ? ` ${c.unit}` : '';
          return `${escapeMarkdown(c.label)} = ${mdValue(value, figures)}${escapeMarkdown(unit)}`;
        });
        out.push(`- Fixed inputs: ${parts.join(', ')}`);
      }
      if (leftOut.length) {
        out.push(`- Columns left out: ${leftOut.map(escapeMarkdown).join(', ')} (all columns are in the CSV, JSON and XLSX exports)`);
      }
      out.push('', `> ${escapeMarkdown(CAUTION)}`, '');
      const numeric = (c: Column) => c.kind === 'input' || c.kind === 'output';
      out.push(`| ${shown.map(mdHeader).join(' | ')} |`);
      out.push(`| ${shown.map((c) => (numeric(c) && c.unit !== undefined ? '---:' : '---')).join(' | ')} |`);
      return lines(out);
    },
    rows: (chunk) => lines(chunk.map((row) => `| ${shown.map((c) => mdCell(row, c, figures)).join(' | ')} |`)),
    tail: () => '',
  };
}

export function toMarkdown(data: RunExport, unitOf: UnitLookup, options: MemoOptions = {}): string {
  const enc = markdownEncoder(data.run, memoColumns(data.rows, unitOf, options.columns), options);
  return enc.head() + enc.rows(data.rows) + enc.tail();
}
