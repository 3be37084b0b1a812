// The results and chart queries of a run as plain data, and their URL query strings
// (`filter=NAME:min:max` repeatable, empty bounds left open), per the API contract.

export interface RangeFilter {
  name: string;
  /** Text as typed; empty means open. */
  min: string;
  max: string;
}

export type FlaggedFilter = 'any' | 'yes' | 'no';

export interface ResultQuery {
  page: number;
  pageSize: number;
  sort?: string;
  order?: 'asc' | 'desc';
  methods: string[];
  flagged: FlaggedFilter;
  filters: RangeFilter[];
}

export const defaultResultQuery: ResultQuery = { page: 1, pageSize: 50, methods: [], flagged: 'any', filters: [] };

/** True when the text is empty or a finite number (1e5, -3.2, 0.7). */
export function isBound(text: string): boolean {
  const t = text.trim();
  return t === '' || Number.isFinite(Number(t));
}

/**
 * A bound's text converted between SI and the units shown (°C ↔ K), rounded to 12
 * significant digits so 26.2 °C reads back as 26.2; empty and invalid text kept as is.
 */
export function convertBound(text: string, convert: (v: number) => number): string {
  const t = text.trim();
  if (t === '' || !isBound(t)) return text;
  return String(Number(convert(Number(t)).toPrecision(12)));
}

/** The `filter` values worth sending: named, with valid bounds, at least one bound set. */
export function filterParams(filters: readonly RangeFilter[]): string[] {
  return filters
    .filter((f) => f.name && isBound(f.min) && isBound(f.max) && (f.min.trim() !== '' || f.max.trim() !== ''))
    .map((f) => `${f.name}:${f.min.trim()}:${f.max.trim()}`);
}

function append(sp: URLSearchParams, key: string, value: string | number | undefined) {
  if (value === undefined || value === '') return;
  sp.append(key, String(value));
}

export function resultsSearch(q: ResultQuery): string {
  const sp = new URLSearchParams();
  append(sp, 'page', q.page);
  append(sp, 'pageSize', q.pageSize);
  if (q.sort) {
    append(sp, 'sort', q.sort);
    append(sp, 'order', q.order ?? 'asc');
  }
  if (q.methods.length) append(sp, 'method', q.methods.join(','));
  if (q.flagged !== 'any') append(sp, 'flagged', q.flagged);
  for (const f of filterParams(q.filters)) sp.append('filter', f);
  return sp.toString();
}

export interface ChartQuery {
  x: string;
  y: string;
  /** `method` or the name of a second input. */
  series: string;
  methods: string[];
  flagged?: FlaggedFilter;
  filters: RangeFilter[];
  max: number;
  measurement?: number;
}

export function chartSearch(q: ChartQuery): string {
  const sp = new URLSearchParams();
  append(sp, 'x', q.x);
  append(sp, 'y', q.y);
  append(sp, 'series', q.series);
  if (q.methods.length) append(sp, 'method', q.methods.join(','));
  if (q.flagged && q.flagged !== 'any') append(sp, 'flagged', q.flagged);
  for (const f of filterParams(q.filters)) sp.append('filter', f);
  append(sp, 'max', q.max);
  append(sp, 'measurement', q.measurement);
  return sp.toString();
}
