// The header of a measurement CSV, read the same way by the server (server/csv.ts) and by
// the browser's column mapping: the separator (comma, semicolon or tab, whichever the
// header line has most of outside quotes) and a column's unit, written in square
// brackets after its name: `fluid_temperature [degC]`, `h [W/(m^2 K)]`, `Nu [-]`.

export const SEPARATORS = [',', ';', '\t'] as const;
export type Separator = (typeof SEPARATORS)[number];

export function detectSeparator(headerLine: string): Separator {
  const unquoted = headerLine.replace(/"(?:[^"]|"")*"/g, '');
  let best: Separator = ',';
  let most = 0;
  for (const s of SEPARATORS) {
    const n = unquoted.split(s).length - 1;
    if (n > most) {
      most = n;
      best = s;
    }
  }
  return best;
}

export interface ColumnHeader {
  /** The header without its unit, trimmed. */
  name: string;
  /** The text between the square brackets, trimmed; undefined when the header has none. */
  unit?: string;
}

export function parseColumnHeader(header: string): ColumnHeader {
  const m = /^(.*?)\s*\[([^\]]*)\]\s*$/.exec(header.trim());
  return m ? { name: m[1].trim(), unit: m[2].trim() } : { name: header.trim() };
}

/** Units that mean "dimensionless" in a header. */
export function isDimensionlessUnit(unit: string | undefined): boolean {
  return unit === undefined || unit === '' || unit === '-' || unit === '1';
}
