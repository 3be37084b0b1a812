// Number and time formatting: one number format for every table, label, tooltip and
// exported figure of the dashboard.
//
// Values (formatNumber): rounded to significant digits first, then written with
// thousands separators between 0.001 and 100,000 ("40,000", "1,913", "0.01235") and in
// exponent form outside ("3.2e5", "1.5e-4"), the form the filter fields also accept.
// Counts (formatCount): exact integers with thousands separators ("1,000,000").

const grouped = new Map<number, Intl.NumberFormat>();
function groupedFormat(digits: number): Intl.NumberFormat {
  let f = grouped.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { maximumSignificantDigits: digits, useGrouping: true });
    grouped.set(digits, f);
  }
  return f;
}

/** Exponent form is used from this magnitude up (after rounding) and below 1e-3. */
export const EXPONENT_FROM = 1e5;

/** A number with `digits` significant digits (see the rule above); '—' for none. */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined) return '—';
  if (Number.isNaN(value)) return 'NaN';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : '-∞';
  if (value === 0) return '0';
  // Round first, so 99,999 at 4 digits is judged as the 1e5 it is written as.
  const rounded = Number(value.toPrecision(digits));
  const abs = Math.abs(rounded);
  if (abs >= EXPONENT_FROM || abs < 1e-3) return rounded.toExponential(digits - 1).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return groupedFormat(digits).format(rounded);
}

/** A count (points, rows, results): an integer with thousands separators. */
export function formatCount(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return '—';
  return Math.round(n).toLocaleString('en-US');
}

export function formatValue(value: unknown, digits = 4): string {
  if (typeof value === 'number') return formatNumber(value, digits);
  if (value === null || value === undefined) return '—';
  return String(value);
}

/** A relative difference as a signed percentage. */
export function formatPercent(fraction: number | null | undefined, digits = 3): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '—';
  const pct = fraction * 100;
  return `${pct > 0 ? '+' : ''}${formatNumber(pct, digits)} %`;
}

/** ISO-8601 as a short local date and time; the ISO text stays in the title attribute. */
export function formatTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Seconds between two timestamps as "1 min 12 s". */
export function formatDuration(from: string | null, to: string | null): string {
  if (!from || !to) return '—';
  const s = (new Date(to).getTime() - new Date(from).getTime()) / 1000;
  if (!Number.isFinite(s) || s < 0) return '—';
  if (s < 60) return `${formatNumber(s, 2)} s`;
  const m = Math.floor(s / 60);
  return `${m} min ${Math.round(s - 60 * m)} s`;
}
