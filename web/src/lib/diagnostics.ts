// Study-file diagnostics from a 400 answer to an upload: `details.diagnostics`.
import type { Diagnostic } from '../api/types.js';

export function diagnosticsOf(details: unknown): Diagnostic[] {
  const list = (details as { diagnostics?: unknown } | null | undefined)?.diagnostics;
  if (!Array.isArray(list)) return [];
  return list
    .filter((d): d is Diagnostic => typeof d === 'object' && d !== null && typeof (d as Diagnostic).message === 'string')
    .map((d) => ({ file: String(d.file ?? ''), line: Number(d.line) || 0, column: Number(d.column) || 0, message: d.message }));
}

/** The text of line `line` (1-based) of `source`, or undefined. */
export function sourceLine(source: string, line: number): string | undefined {
  if (line < 1) return undefined;
  return source.split(/\r?\n/)[line - 1];
}
