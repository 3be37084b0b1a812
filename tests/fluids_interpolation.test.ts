// The monotone cubic against SciPy's PchipInterpolator (values and derivatives written to
// tests/fixtures/fluids_reference.json by tests/fixtures/fluids_reference.py, SciPy 1.10.1).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MonotoneCubic, intervalIndex } from '../shared/physics/fluids/monotoneCubic.js';

interface PchipCase {
  name: string;
  x: number[];
  y: number[];
  at: number[];
  value: number[];
  derivative: number[];
}

const { pchip } = JSON.parse(readFileSync(new URL('./fixtures/fluids_reference.json', import.meta.url), 'utf8')) as {
  pchip: { cases: PchipCase[] };
};

describe('monotone cubic (PCHIP) against SciPy', () => {
  it('has the awkward cases: flat runs, turning points, two and three nodes', () => {
    expect(pchip.cases.map((c) => c.name)).toEqual(
      expect.arrayContaining(['turning-and-flat', 'end-sign-change', 'three-points', 'two-points']),
    );
  });

  for (const c of pchip.cases) {
    it(`matches values and derivatives: ${c.name}`, () => {
      const curve = new MonotoneCubic(c.x, c.y);
      const scale = Math.max(...c.y.map(Math.abs), 1);
      c.at.forEach((t, j) => {
        expect(Math.abs(curve.value(t) - c.value[j]) / scale, `value at ${t}`).toBeLessThan(1e-12);
        const dScale = Math.max(Math.abs(c.derivative[j]), 1);
        expect(Math.abs(curve.derivative(t) - c.derivative[j]) / dScale, `slope at ${t}`).toBeLessThan(1e-9);
      });
    });
  }

  it('never leaves the range of the two neighbouring nodes', () => {
    const c = pchip.cases.find((k) => k.name === 'turning-and-flat')!;
    const curve = new MonotoneCubic(c.x, c.y);
    for (let i = 0; i + 1 < c.x.length; i++) {
      const lo = Math.min(c.y[i], c.y[i + 1]);
      const hi = Math.max(c.y[i], c.y[i + 1]);
      for (let f = 0; f <= 1; f += 0.05) {
        const v = curve.value(c.x[i] + f * (c.x[i + 1] - c.x[i]));
        expect(v).toBeGreaterThanOrEqual(lo - 1e-12);
        expect(v).toBeLessThanOrEqual(hi + 1e-12);
      }
    }
  });

  it('refuses to extrapolate', () => {
    const curve = new MonotoneCubic([1, 2, 3], [1, 4, 9]);
    expect(() => curve.value(0.999)).toThrow(RangeError);
    expect(() => curve.value(3.001)).toThrow(RangeError);
    expect(() => curve.value(Number.NaN)).toThrow(RangeError);
  });

  it('finds the interval by binary search, ends included', () => {
    const x = [0, 1, 2, 5, 9];
    expect(intervalIndex(x, 0)).toBe(0);
    expect(intervalIndex(x, 1)).toBe(1);
    expect(intervalIndex(x, 4.9)).toBe(2);
    expect(intervalIndex(x, 9)).toBe(3);
  });
});
