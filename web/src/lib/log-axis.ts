// Ticks and labels of a logarithmic axis as engineers read them: ticks at 1…9 × 10^k,
// labels at the decades and, where the axis spans few decades, at 2 and 5 (or every
// integer multiple) too, so a reading between decades needs no counting of lines.

export interface LogTicks {
  /** Axis bounds: whole decades around the data. */
  min: number;
  max: number;
  /** Tick (and grid line) positions. */
  ticks: number[];
  /** Labelled positions: decades (major) and the minor labels. */
  labels: number[];
}

const round = (v: number) => Number(v.toPrecision(12));

export function logTicks(dataMin: number, dataMax: number): LogTicks | null {
  if (!(dataMin > 0) || !(dataMax > 0) || !Number.isFinite(dataMin) || !Number.isFinite(dataMax)) return null;
  let lo = Math.floor(Math.log10(dataMin) + 1e-12);
  let hi = Math.ceil(Math.log10(dataMax) - 1e-12);
  if (hi <= lo) hi = lo + 1;
  const decades = hi - lo;
  // Labels between decades: every multiple on one decade, 2 and 5 up to three, none beyond.
  const minorLabels = decades <= 1 ? [2, 3, 4, 5, 6, 7, 8, 9] : decades <= 3 ? [2, 5] : [];
  // Many decades: label every other (or third) decade, tick only the decades.
  const step = decades > 12 ? 3 : decades > 7 ? 2 : 1;
  const ticks: number[] = [];
  const labels: number[] = [];
  for (let k = lo; k <= hi; k++) {
    const decade = round(10 ** k);
    ticks.push(decade);
    if ((k - lo) % step === 0) labels.push(decade);
    if (k === hi || decades > 6) continue;
    for (let m = 2; m <= 9; m++) {
      const v = round(m * 10 ** k);
      ticks.push(v);
      if (minorLabels.includes(m)) labels.push(v);
    }
  }
  // Bounds: the nearest labelled value or decade around the data (keeps the plot full).
  const bounds = [...new Set([...labels, ...ticks.filter(isDecade)])].sort((a, b) => a - b);
  const min = bounds.filter((v) => v <= dataMin * (1 + 1e-12)).pop() ?? bounds[0];
  const max = bounds.find((v) => v >= dataMax * (1 - 1e-12)) ?? bounds[bounds.length - 1];
  return { min, max, ticks: ticks.filter((v) => v >= min && v <= max), labels: labels.filter((v) => v >= min && v <= max) };
}

/** Whether a labelled value is a decade (drawn as a major label). */
export function isDecade(v: number): boolean {
  const e = Math.log10(v);
  return Math.abs(e - Math.round(e)) < 1e-9;
}
