import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import {
  countPoints,
  entryLength,
  entryValues,
  expandPoints,
  iteratePoints,
  latinHypercube,
  pointAt,
  zipProblem,
  type Sweep,
  type SweepEntry,
  type SweepSource,
} from '../shared/study/sweep.js';

const list = (...values: (number | string | boolean)[]): SweepEntry => ({ kind: 'list', values });
const range = (from: number, to: number, count: number, spacing: 'linear' | 'log' = 'linear'): SweepEntry => ({
  kind: 'range',
  from,
  to,
  count,
  spacing,
});
const source = (sweep: Partial<Sweep> & { over: Record<string, SweepEntry> }, inputs = {}): SweepSource => ({
  inputs,
  sweep: { design: 'grid', seed: 1, ...sweep },
});

describe('sweep entries', () => {
  it('spaces linear ranges evenly with both ends exact', () => {
    expect(entryValues(range(0, 1, 5))).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });

  it('spaces log ranges evenly in log10, decades exact', () => {
    const v = entryValues(range(1e4, 1e6, 21, 'log')) as number[];
    expect(v).toHaveLength(21);
    expect(v[0]).toBe(1e4);
    expect(v[10]).toBe(1e5);
    expect(v[20]).toBe(1e6);
    for (let i = 1; i < 21; i++) expect(Math.log10(v[i] / v[i - 1])).toBeCloseTo(0.1, 12);
  });

  it('includes `to` in step sequences when it lands on it within 1e-9', () => {
    // 0.1 is not exact in binary: 10 steps of it miss 1 by ~1e-16, which still counts as landing.
    const tenths = entryValues({ kind: 'step', from: 0, to: 1, step: 0.1 }) as number[];
    expect(tenths).toHaveLength(11);
    expect(tenths[10]).toBe(1);
    expect(entryValues({ kind: 'step', from: 0, to: 1, step: 0.3 })).toHaveLength(4); // 0, 0.3, 0.6, 0.9
    expect(entryValues({ kind: 'step', from: 10, to: 0, step: -5 })).toEqual([10, 5, 0]);
    expect(entryValues({ kind: 'step', from: 2, to: 2, step: 1 })).toEqual([2]);
  });

  it('counts a step entry without listing it', () => {
    expect(entryLength({ kind: 'step', from: 0, to: 1, step: 1e-12 })).toBe(1e12 + 1);
  });
});

describe('grid', () => {
  it('is a full factorial with the last key varying fastest', () => {
    const s = source({ over: { a: list(1, 2), b: list('x', 'y', 'z') } }, { fixed: 9 });
    expect(countPoints(s)).toBe(6);
    expect(expandPoints(s)).toEqual([
      { fixed: 9, a: 1, b: 'x' },
      { fixed: 9, a: 1, b: 'y' },
      { fixed: 9, a: 1, b: 'z' },
      { fixed: 9, a: 2, b: 'x' },
      { fixed: 9, a: 2, b: 'y' },
      { fixed: 9, a: 2, b: 'z' },
    ]);
  });

  it('keeps the file order of keys in each point', () => {
    const s = source({ over: { z: list(1), a: list(2) } }, { m: 0 });
    expect(Object.keys(expandPoints(s)[0])).toEqual(['m', 'z', 'a']);
  });

  it('gives the same point from pointAt as from full expansion, and resumes mid-way', () => {
    const s = source({ over: { a: range(0, 1, 3), b: list(true, false), c: range(1, 100, 4, 'log') } });
    const all = expandPoints(s);
    expect(all).toHaveLength(24);
    all.forEach((p, i) => expect(pointAt(s, i)).toEqual(p));
    expect(Array.from(iteratePoints(s, 20))).toEqual(all.slice(20));
    expect(() => pointAt(s, 24)).toThrow(RangeError);
  });

  it('is one point of the fixed inputs when nothing is swept', () => {
    const s = source({ over: {} }, { Re: 1e5 });
    expect(countPoints(s)).toBe(1);
    expect(expandPoints(s)).toEqual([{ Re: 1e5 }]);
  });

  it('counts a 1e4 × 1e4 grid instantly, without expanding it', () => {
    const s = source({ over: { a: range(0, 1, 10_000), b: range(0, 1, 10_000) } });
    const t0 = performance.now();
    expect(countPoints(s)).toBe(1e8);
    expect(pointAt(s, 1e8 - 1)).toEqual({ a: 1, b: 1 });
    expect(performance.now() - t0).toBeLessThan(50);
  });
});

describe('zip', () => {
  it('pairs entries index by index', () => {
    const s = source({ design: 'zip', over: { a: list(1, 2, 3), b: range(10, 30, 3) } });
    expect(expandPoints(s)).toEqual([
      { a: 1, b: 10 },
      { a: 2, b: 20 },
      { a: 3, b: 30 },
    ]);
  });

  it('refuses entries of unequal length, naming the lengths', () => {
    const over = { Re: range(1, 2, 21), Pr: list(0.7, 5, 50) };
    expect(zipProblem(over)).toBe('zip needs entries of equal length; got Re: 21, Pr: 3');
    expect(() => countPoints(source({ design: 'zip', over }))).toThrow(/Re: 21, Pr: 3/);
  });
});

describe('latin-hypercube', () => {
  const sweep: Sweep = {
    design: 'latin-hypercube',
    seed: 7,
    samples: 5,
    over: {
      Re: range(1e4, 1e6, 2, 'log'),
      Pr: { kind: 'step', from: 0.7, to: 50, step: 1 },
      arrangement: list('aligned', 'staggered'),
    },
  };

  it('uses the alea generator as documented by seedrandom', () => {
    // seedrandom 3.0.5 README: "new alea('hello.')() // Always 0.4783254903741181".
    expect(seedrandom.alea('hello.')()).toBe(0.4783254903741181);
  });

  it('gives exactly the same points for the same seed on every machine', () => {
    // Values recorded from this implementation when it was written (alea, seed 7, draws in
    // file order: permutation then one draw per sample). Any change to the generator, the
    // draw order or the stratum formula changes them and must be deliberate.
    expect(latinHypercube({ ...sweep, over: { ...sweep.over } })).toEqual([
      [73493.02075325373, 444630.51187525666, 213119.80573651317, 13275.585405930546, 53498.696427078015],
      [9.917316849017515, 33.71134937634226, 10.644330054069869, 42.10011129034683, 21.302671958231365],
      ['staggered', 'aligned', 'staggered', 'staggered', 'aligned'],
    ]);
    const other = latinHypercube({ ...sweep, seed: 8, over: { ...sweep.over } });
    expect(other[0]).not.toEqual(latinHypercube(sweep)[0]);
  });

  it('uses each stratum of each range exactly once (log ranges in log10)', () => {
    const n = 200;
    const big: Sweep = { ...sweep, samples: n, over: { Re: range(1e4, 1e6, 2, 'log'), Pr: range(0.7, 50, 2), L: list(1, 2, 3, 4) } };
    const [re, pr, l] = latinHypercube(big) as [number[], number[], number[]];
    const strata = (xs: number[], f: (x: number) => number) => xs.map((x) => Math.floor(f(x) * n)).sort((a, b) => a - b);
    const all = Array.from({ length: n }, (_, i) => i);
    expect(strata(re, (x) => (Math.log10(x) - 4) / 2)).toEqual(all);
    expect(strata(pr, (x) => (x - 0.7) / 49.3)).toEqual(all);
    // A 4-item list over 200 samples: each item exactly 50 times.
    for (const item of [1, 2, 3, 4]) expect(l.filter((x) => x === item)).toHaveLength(50);
  });

  it('expands to `samples` points of fixed plus sampled inputs', () => {
    const s: SweepSource = { inputs: { heating: true }, sweep };
    const points = expandPoints(s);
    expect(points).toHaveLength(5);
    expect(points[2]).toEqual({ heating: true, Re: 213119.80573651317, Pr: 10.644330054069869, arrangement: 'staggered' });
    expect(pointAt(s, 2)).toEqual(points[2]);
  });
});
