// LaTeX export: booktabs tables (needs \usepackage{booktabs}; no siunitx) ready to paste
// into a memo. Columns as chosen by memo-columns.ts. Long runs are split into several
// `table` floats of `rowsPerTable` rows (default 40) so each fits a page; the first
// carries the run's facts and the caution. Written one table at a time (a continuation's
// caption names its rows, so a table is held until it is full or the run ends).
import type { ExportRow } from './types.js';
import { CAUTION } from './caution.js';
import type { MemoOptions } from './markdown.js';
import { memoColumns, type MemoColumns } from './memo-columns.js';
import { runFacts } from './run-summary.js';
import { roundSignificant } from './significant.js';
import type { RowEncoder } from './rows.js';
import type { Column } from './table.js';
import type { RunExport, RunInfo } from './types.js';
import type { UnitLookup } from './units.js';

export interface LatexOptions extends MemoOptions {
  rowsPerTable?: number;
}

const latexSpecials: Record<string, string> = {
  '\\': '\\textbackslash{}',
  '{': '\\{',
  '}': '\\}',
  $: '\\$',
  '&': '\\&',
  '#': '\\#',
  '%': '\\%',
  _: '\\_',
  '^': '\\textasciicircum{}',
  '~': '\\textasciitilde{}',
  '<': '\\textless{}',
  '>': '\\textgreater{}',
  '|': '\\textbar{}',
  // Brackets in braces, so a cell after `\\` is never read as `\\[<length>]`.
  '[': '{[}',
  ']': '{]}',
  '–': '--',
  '—': '---',
  '·': '\\ensuremath{\\cdot}',
  '″': "\\ensuremath{''}",
};

/** Text safe in a LaTeX paragraph or tabular cell (line breaks become spaces). */
export function escapeLatex(text: string): string {
  return text.replace(/\r?\n/g, ' ').replace(/[\\{}$&#%_^~<>|[\]–—·″]/g, (c) => latexSpecials[c]);
}

/** A unit such as `W/(m^2·K)` typeset with real superscripts: `W/(m\ensuremath{^{2}}…K)`. */
export function latexUnit(unit: string): string {
  return unit
    .split(/(\^-?\d+)/)
    .map((part) => (/^\^-?\d+$/.test(part) ? `\\ensuremath{^{${part.slice(1)}}}` : escapeLatex(part)))
    .join('');
}

export function latexNumber(x: number, figures = 4): string {
  const r = roundSignificant(x, figures);
  if (r.exponent !== undefined) return `$${r.digits}\\times10^{${r.exponent}}$`;
  return r.digits.startsWith('-') ? `$${r.digits}$` : r.digits;
}

function texValue(v: number | boolean | string | undefined, figures: number): string {
  if (v === undefined) return '';
  if (typeof v === 'number') return latexNumber(v, figures);
  return escapeLatex(String(v));
}

function texHeader(c: Column): string {
  const label = escapeLatex(c.label);
  return c.unit === undefined ? label : `${label} [${latexUnit(c.unit)}]`;
}

function texCell(row: ExportRow, c: Column, figures: number): string {
  if (c.kind === 'flags') return row.flags.map(escapeLatex).join(', ');
  if (c.kind === 'method') return escapeLatex(row.method);
  if (c.kind === 'recommended') return row.recommended ? 'yes' : '';
  return texValue(c.kind === 'input' ? row.inputs[c.name] : row.outputs[c.name], figures);
}

/** The memo tables, a `table` float at a time; `memo` is the column choice over the whole run. */
export function latexEncoder(run: RunInfo, memo: MemoColumns, options: LatexOptions = {}): RowEncoder {
  const figures = options.figures ?? 4;
  const perTable = Math.max(1, options.rowsPerTable ?? 40);
  const { shown, fixed, leftOut } = memo;
  const spec = shown.map((c) => ((c.kind === 'input' || c.kind === 'output') && c.unit !== undefined ? 'r' : 'l')).join('');
  const header = `${shown.map(texHeader).join(' & ')} \\\\`;

  const notes: string[] = runFacts(run).map(([label, value]) => `${escapeLatex(label)}: ${escapeLatex(value)}.`);
  if (fixed.length) {
    const parts = fixed.map(({ column: c, value }) => {
      const unit = c.unit && c.unit !== '-' ? `~${latexUnit(c.unit)}` : '';
      return `${escapeLatex(c.label)} = ${texValue(value, figures)}${unit}`;
    });
    notes.push(`Fixed inputs: ${parts.join(', ')}.`);
  }
  if (leftOut.length) {
    notes.push(`Columns left out: ${leftOut.map(escapeLatex).join(', ')} (all columns are in the CSV, JSON and XLSX exports).`);
  }
  notes.push(escapeLatex(CAUTION));

  let tables = 0;
  let pending: string[] = [];
  // One float: its lines each ending in a newline, a blank line before every float but the first.
  const table = (rows: string[]): string => {
    const i = tables++;
    const caption = i === 0
      ? `Run ${run.id}: ${escapeLatex(run.title ?? run.study)}`
      : `Run ${run.id} (continued, rows ${i * perTable + 1}--${i * perTable + rows.length})`;
    const out = ['\\begin{table}[htbp]', '\\centering', `\\caption{${caption}}`, '\\small'];
    out.push(`\\begin{tabular}{${spec}}`, '\\toprule', header, '\\midrule', ...rows, '\\bottomrule', '\\end{tabular}');
    if (i === 0) {
      out.push('', '\\smallskip', '\\parbox{\\linewidth}{\\footnotesize');
      out.push(...notes.map((n) => `${n}\\par`));
      out.push('}');
    }
    out.push('\\end{table}');
    return (i === 0 ? '' : '\n') + out.map((l) => `${l}\n`).join('');
  };
  return {
    head: () => `% Filmsweep run ${run.id}, study ${run.study.replace(/[\r\n]/g, ' ')}; needs \\usepackage{booktabs}.\n`,
    rows: (chunk) => {
      let text = '';
      for (const row of chunk) {
        pending.push(`${shown.map((c) => texCell(row, c, figures)).join(' & ')} \\\\`);
        if (pending.length === perTable) {
          text += table(pending);
          pending = [];
        }
      }
      return text;
    },
    // The last, partly filled float; or the only one, empty, for a run without rows.
    tail: () => (pending.length || tables === 0 ? table(pending) : ''),
  };
}

export function toLatex(data: RunExport, unitOf: UnitLookup, options: LatexOptions = {}): string {
  const enc = latexEncoder(data.run, memoColumns(data.rows, unitOf, options.columns), options);
  return enc.head() + enc.rows(data.rows) + enc.tail();
}
