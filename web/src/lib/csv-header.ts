// The column names of a CSV file, read in the browser so the user can map them to
// inputs and outputs before upload. RFC 4180 quoting: "a,b" and "say ""hi""".

export function splitCsvLine(line: string): string[] {
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
    else if (c === ',') {
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
  return first === undefined ? [] : splitCsvLine(first).filter((c) => c !== '');
}

/** A first guess at the mapping: a column whose name equals an input or output (case-insensitive). */
export function guessMapping(columns: readonly string[], names: readonly string[]): Record<string, string> {
  const mapping: Record<string, string> = {};
  const lower = new Map(names.map((n) => [n.toLowerCase(), n]));
  for (const c of columns) {
    const bare = c.replace(/\s*[[(].*[\])]\s*$/, '').trim().toLowerCase();
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
