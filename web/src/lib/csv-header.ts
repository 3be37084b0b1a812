// The column names of a CSV file, read in the browser so the user can map them to
// inputs and outputs before upload. RFC 4180 quoting: "a,b" and "say ""hi""". The
// separator (comma, semicolon or tab) and the units in square brackets are read as the
// server reads them (shared/measurements/header.ts).
import { detectSeparator, isDimensionlessUnit, parseColumnHeader } from '../../../shared/measurements/header.js';
import type { Quantities } from './units.js';

export function splitCsvLine(line: string, separator = ','): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (quoted) {
      if (c === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === separator) {
      cells.push(cell);
      cell = '';
    } else cell += c;
  }
  cells.push(cell);
  return cells.map((s) => s.trim());
}

/** The header row (first non-empty line, BOM stripped), or [] for an empty file. */
export function csvHeader(text: string): string[] {
  const first = text.replace(/^\uFEFF/, '').split(/\r?\n/).find((l) => l.trim() !== '');
  return first === undefined ? [] : splitCsvLine(first, detectSeparator(first)).filter((c) => c !== '');
}

/** A first guess at the mapping: a column whose name (without unit or note) equals an input or output, any case. */
export function guessMapping(columns: readonly string[], names: readonly string[]): Record<string, string> {
  const mapping: Record<string, string> = {};
  const lower = new Map(names.map((n) => [n.toLowerCase(), n]));
  for (const c of columns) {
    const bare = parseColumnHeader(c).name.replace(/\s*\(.*\)\s*$/, '').trim().toLowerCase();
    const hit = lower.get(bare);
    if (hit) mapping[c] = hit;
  }
  return mapping;
}

/** Why a mapping cannot be uploaded yet, or null. The API wants at least one output Nu or h. */
export function mappingProblem(mapping: Record<string, string>): string | null {
  const targets = Object.values(mapping).filter(Boolean);
  if (!targets.some((t) => t === 'Nu' || t === 'h')) return 'map at least one column to Nu or h';
  const seen = new Set<string>();
  for (const t of targets) {
    if (seen.has(t)) return `two columns are mapped to ${t}`;
    seen.add(t);
  }
  return null;
}

/**
 * What the server will say about a mapped column's unit, before the upload: a dimensional
 * quantity needs its unit in the header, a dimensionless one takes none. Null when fine.
 */
export function unitProblem(column: string, name: string, quantities: Quantities): string | null {
  const { unit } = parseColumnHeader(column);
  const si = quantities(name).si;
  if (si === '1') return isDimensionlessUnit(unit) ? null : `${name} is dimensionless: write no unit or [-]`;
  if (si === undefined) return null;
  if (isDimensionlessUnit(unit)) return `${name} has a unit (SI: ${si}): write it in the header, e.g. “${name} [${si === 'K' ? 'degC' : si}]”`;
  return null;
}

/** The unit a column header gives (`degC` of `fluid_temperature [degC]`), if any. */
export function headerUnit(column: string): string | undefined {
  return parseColumnHeader(column).unit;
}
