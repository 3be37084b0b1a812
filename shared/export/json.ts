// JSON export: `{"caution", "run", "rows"}` with SI values (DESIGN.md section 6). The
// caution is an extra top-level key so `run` and `rows` keep the documented shape. One row
// per line keeps large runs compact yet greppable and diffable. Non-finite numbers (never
// produced by the engine) would become null, as JSON.stringify does.
import { CAUTION } from './caution.js';
import type { RunExport } from './types.js';

export function toJson(data: RunExport): string {
  const run = JSON.stringify(data.run, null, 2).replace(/\n/g, '\n  ');
  const rows = data.rows.map((r) =>
    JSON.stringify({ method: r.method, inputs: r.inputs, outputs: r.outputs, flags: r.flags, ...(r.recommended !== undefined && { recommended: r.recommended }) }),
  );
  const rowsText = rows.length ? `[\n    ${rows.join(',\n    ')}\n  ]` : '[]';
  return `{\n  "caution": ${JSON.stringify(CAUTION)},\n  "run": ${run},\n  "rows": ${rowsText}\n}\n`;
}
