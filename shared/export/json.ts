// JSON export: `{"caution", "run", "rows"}` with SI values (DESIGN.md section 6). The
// caution is an extra top-level key so `run` and `rows` keep the documented shape. One row
// per line keeps large runs compact yet greppable and diffable (and lets the export be
// written row by row). Non-finite numbers (never produced by the engine) would become
// null, as JSON.stringify does.
import { CAUTION } from './caution.js';
import type { RowEncoder } from './rows.js';
import type { ExportRow, RunExport, RunInfo } from './types.js';

export function jsonEncoder(run: RunInfo): RowEncoder {
  let written = 0;
  const line = (r: ExportRow) =>
    JSON.stringify({ method: r.method, inputs: r.inputs, outputs: r.outputs, flags: r.flags, ...(r.recommended !== undefined && { recommended: r.recommended }) });
  return {
    head: () => `{\n  "caution": ${JSON.stringify(CAUTION)},\n  "run": ${JSON.stringify(run, null, 2).replace(/\n/g, '\n  ')},\n  "rows": `,
    rows: (chunk) => {
      if (chunk.length === 0) return '';
      const text = (written === 0 ? '[\n    ' : ',\n    ') + chunk.map(line).join(',\n    ');
      written += chunk.length;
      return text;
    },
    tail: () => `${written === 0 ? '[]' : '\n  ]'}\n}\n`,
  };
}

export function toJson(data: RunExport): string {
  const enc = jsonEncoder(data.run);
  return enc.head() + enc.rows(data.rows) + enc.tail();
}
