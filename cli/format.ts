// Terminal formatting shared by the commands: aligned tables and compact numbers.

/** A number with `digits` significant figures, without trailing noise (1.2346e+5 style for extremes). */
export function formatNumber(v: number, digits = 6): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e7) return String(Number(v.toPrecision(digits)));
  return v.toExponential(digits - 1).replace(/\.?0+e/, 'e');
}

export function formatValue(v: unknown): string {
  if (typeof v === 'number') return formatNumber(v);
  if (v === undefined || v === null) return '';
  return String(v);
}

/** Left-aligned text columns, right-aligned numeric columns, two spaces apart. */
export function table(headers: string[], rows: unknown[][]): string {
  const cells = rows.map((r) => r.map(formatValue));
  const numeric = headers.map((_, i) => rows.length > 0 && rows.every((r) => typeof r[i] === 'number' || r[i] === undefined));
  const widths = headers.map((h, i) => Math.max(h.length, ...cells.map((r) => (r[i] ?? '').length)));
  const line = (r: string[]) =>
    r
      .map((c, i) => (numeric[i] ? c.padStart(widths[i]) : c.padEnd(widths[i])))
      .join('  ')
      .trimEnd();
  return [line(headers), line(widths.map((w) => '-'.repeat(w))), ...cells.map(line)].join('\n');
}

export function printJson(value: unknown) {
  process.stdout.write(`${JSON.stringify(value, null, 2)}\n`);
}
