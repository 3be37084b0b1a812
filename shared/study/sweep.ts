// Sweep expansion: the swept entries of a study (lists and ranges, already in SI) turned
// into points, in a fixed order so that a point's index is its id. Counting never
// expands, so a sweep too large to run is refused before any memory is spent on it.
import seedrandom from 'seedrandom';
import { InputError, type InputValue, type Inputs } from '../physics/types.js';

export type SweepDesign = 'grid' | 'zip' | 'latin-hypercube';
export const sweepDesigns: readonly SweepDesign[] = ['grid', 'zip', 'latin-hypercube'];

/** One swept input, values in SI. */
export type SweepEntry =
  | { kind: 'list'; values: InputValue[] }
  /** `count` values from `from` to `to`, both included; log spacing is even in log10. */
  | { kind: 'range'; from: number; to: number; count: number; spacing: 'linear' | 'log' }
  /** `from`, `from + step`, … up to `to` (included when it lands on it within 1e-9). */
  | { kind: 'step'; from: number; to: number; step: number };

export interface Sweep {
  design: SweepDesign;
  /** Seed of the sampling designs; the same seed gives the same points on every machine. */
  seed: number;
  /** Number of points of a latin-hypercube sweep. */
  samples?: number;
  /** Swept inputs in the order written in the file. */
  over: Record<string, SweepEntry>;
}

/** What expansion needs from a study: its fixed inputs and its sweep. */
export interface SweepSource {
  inputs: Inputs;
  sweep: Sweep;
}

/** Relative tolerance within which a step sequence is taken to land on `to`. */
const LANDS_ON_TO = 1e-9;

/** Number of values of one entry (for a step entry, without listing them). */
export function entryLength(entry: SweepEntry): number {
  switch (entry.kind) {
    case 'list':
      return entry.values.length;
    case 'range':
      return entry.count;
    case 'step':
      return stepLayout(entry).count;
  }
}

/** The i-th value of an entry (0-based), computed directly. */
export function entryValueAt(entry: SweepEntry, i: number): InputValue {
  const n = entryLength(entry);
  if (!Number.isInteger(i) || i < 0 || i >= n) throw new RangeError(`value index ${i} outside 0..${n - 1}`);
  switch (entry.kind) {
    case 'list':
      return entry.values[i];
    case 'range': {
      const { from, to } = entry;
      if (i === 0) return from;
      if (i === n - 1) return to;
      const t = i / (n - 1);
      if (entry.spacing === 'log') {
        // log10 keeps decades exact: 1e4 to 1e6 in 21 steps hits 1e5 exactly.
        const a = Math.log10(from);
        return 10 ** (a + (Math.log10(to) - a) * t);
      }
      return from + (to - from) * t;
    }
    case 'step': {
      const { landsOnTo } = stepLayout(entry);
      if (landsOnTo && i === n - 1) return entry.to;
      return entry.from + i * entry.step;
    }
  }
}

export function entryValues(entry: SweepEntry): InputValue[] {
  const n = entryLength(entry);
  const out = new Array<InputValue>(n);
  for (let i = 0; i < n; i++) out[i] = entryValueAt(entry, i);
  return out;
}

/**
 * Why a step entry cannot be expanded (zero step, or one pointing away from `to`),
 * or undefined when it is fine.
 */
export function stepProblem(entry: { from: number; to: number; step: number }): string | undefined {
  if (entry.step === 0) return 'step must not be zero';
  if (entry.to !== entry.from && Math.sign(entry.to - entry.from) !== Math.sign(entry.step)) {
    return `step ${entry.step} does not lead from ${entry.from} to ${entry.to}`;
  }
  return undefined;
}

function stepLayout(entry: { from: number; to: number; step: number }): { count: number; landsOnTo: boolean } {
  const problem = stepProblem(entry);
  if (problem) throw new InputError(problem);
  const { from, to, step } = entry;
  if (from === to) return { count: 1, landsOnTo: true };
  const k = (to - from) / step;
  const m = Math.round(k);
  const scale = Math.max(Math.abs(to), Math.abs(to - from));
  if (Math.abs(from + m * step - to) <= LANDS_ON_TO * scale) return { count: m + 1, landsOnTo: true };
  return { count: Math.floor(k) + 1, landsOnTo: false };
}

/** Why the entries of a zip sweep cannot be zipped (unequal lengths), or undefined. */
export function zipProblem(over: Record<string, SweepEntry>): string | undefined {
  const lengths = Object.entries(over).map(([name, e]) => [name, entryLength(e)] as const);
  if (new Set(lengths.map(([, n]) => n)).size <= 1) return undefined;
  return `zip needs entries of equal length; got ${lengths.map(([name, n]) => `${name}: ${n}`).join(', ')}`;
}

/** Number of points, from the entries' lengths alone. */
export function countPoints(study: SweepSource): number {
  const { design, over, samples } = study.sweep;
  const lengths = Object.values(over).map(entryLength);
  switch (design) {
    case 'grid':
      return lengths.reduce((a, b) => a * b, 1);
    case 'zip': {
      const problem = zipProblem(over);
      if (problem) throw new InputError(problem);
      return lengths.length ? lengths[0] : 1;
    }
    case 'latin-hypercube':
      if (samples === undefined) throw new InputError('a latin-hypercube sweep needs samples');
      return samples;
  }
}

/** The point with the given index (its id): fixed inputs plus the swept values, in SI. */
export function pointAt(study: SweepSource, index: number): Inputs {
  const n = countPoints(study);
  if (!Number.isInteger(index) || index < 0 || index >= n) {
    throw new RangeError(`point index ${index} outside 0..${n - 1}`);
  }
  const { design, over } = study.sweep;
  const names = Object.keys(over);
  const point: Inputs = { ...study.inputs };
  if (design === 'latin-hypercube') {
    const columns = latinHypercube(study.sweep);
    names.forEach((name, j) => (point[name] = columns[j][index]));
  } else if (design === 'zip') {
    for (const name of names) point[name] = entryValueAt(over[name], index);
  } else {
    // Grid: mixed-radix digits of the index, the last key varying fastest.
    let rest = index;
    const digits = new Array<number>(names.length);
    for (let j = names.length - 1; j >= 0; j--) {
      const len = entryLength(over[names[j]]);
      digits[j] = rest % len;
      rest = Math.floor(rest / len);
    }
    names.forEach((name, j) => (point[name] = entryValueAt(over[name], digits[j])));
  }
  return point;
}

/** Points from index `start` on, in id order, without building the whole list. */
export function* iteratePoints(study: SweepSource, start = 0): Generator<Inputs> {
  const n = countPoints(study);
  const { design, over } = study.sweep;
  const names = Object.keys(over);
  if (design === 'latin-hypercube') {
    const columns = latinHypercube(study.sweep);
    for (let i = start; i < n; i++) {
      const point: Inputs = { ...study.inputs };
      names.forEach((name, j) => (point[name] = columns[j][i]));
      yield point;
    }
    return;
  }
  const values = names.map((name) => cachedEntryValues(over[name]));
  const digits = new Array<number>(names.length);
  for (let i = start; i < n; i++) {
    if (design === 'zip') digits.fill(i);
    else {
      // Grid: mixed-radix digits of the index, the last key varying fastest.
      let rest = i;
      for (let j = names.length - 1; j >= 0; j--) {
        digits[j] = rest % values[j].length;
        rest = Math.floor(rest / values[j].length);
      }
    }
    const point: Inputs = { ...study.inputs };
    for (let j = 0; j < names.length; j++) point[names[j]] = values[j][digits[j]];
    yield point;
  }
}

/**
 * An entry's values, listed once per entry object: a worker walks the same sweep once per
 * batch, and a log range's values cost a power each.
 */
const entryValueLists = new WeakMap<SweepEntry, InputValue[]>();
function cachedEntryValues(entry: SweepEntry): InputValue[] {
  let values = entryValueLists.get(entry);
  if (!values) entryValueLists.set(entry, (values = entryValues(entry)));
  return values;
}

/** Every point in id order. */
export function expandPoints(study: SweepSource): Inputs[] {
  return Array.from(iteratePoints(study));
}

const hypercubeCache = new WeakMap<Sweep, InputValue[][]>();

/**
 * Latin hypercube (McKay, Beckman & Conover 1979): each input's range is cut into
 * `samples` equal strata, each stratum used once, strata paired across inputs by
 * independent random permutations. Ranges (count or step form) are sampled uniformly
 * within their stratum (log ranges in log10 space); a list entry takes the item under
 * the stratum's midpoint, so items are used as evenly as the sample count allows.
 * Random numbers come from seedrandom's alea generator seeded with the study's seed,
 * drawn input by input in file order: permutation first, then one draw per sample.
 * Returns one column of values per input.
 */
export function latinHypercube(sweep: Sweep): InputValue[][] {
  const cached = hypercubeCache.get(sweep);
  if (cached) return cached;
  const n = sweep.samples;
  if (n === undefined || !Number.isInteger(n) || n < 1) throw new InputError('a latin-hypercube sweep needs samples ≥ 1');
  const random = seedrandom.alea(String(sweep.seed));
  const columns = Object.values(sweep.over).map((entry) => {
    const strata = permutation(n, random);
    const column = new Array<InputValue>(n);
    if (entry.kind === 'list') {
      const L = entry.values.length;
      for (let i = 0; i < n; i++) column[i] = entry.values[Math.floor(((strata[i] + 0.5) * L) / n)];
      return column;
    }
    const { from, to } = entry;
    const log = entry.kind === 'range' && entry.spacing === 'log';
    const a = log ? Math.log10(from) : from;
    const b = log ? Math.log10(to) : to;
    for (let i = 0; i < n; i++) {
      const u = (strata[i] + random()) / n;
      const x = a + (b - a) * u;
      column[i] = log ? 10 ** x : x;
    }
    return column;
  });
  hypercubeCache.set(sweep, columns);
  return columns;
}

// Fisher–Yates shuffle of 0..n-1 (Knuth, TAOCP vol. 2, Algorithm P).
function permutation(n: number, random: () => number): number[] {
  const p = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    const t = p[i];
    p[i] = p[j];
    p[j] = t;
  }
  return p;
}
