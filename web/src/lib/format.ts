// Number and time formatting for tables and labels.

/** A number with `digits` significant digits; exponent form outside 1e-3 … 1e6. */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined) return '—';
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-3) return value.toExponential(digits - 1).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return String(Number(value.toPrecision(digits)));
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
