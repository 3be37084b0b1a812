// The normal quantile behind every Monte Carlo draw and every 95 % half-width.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { normalQuantile, sortedQuantile, Z95 } from '../shared/design/normal.js';

const reference = JSON.parse(readFileSync(new URL('./fixtures/normal_quantile_reference.json', import.meta.url), 'utf8')) as {
  values: { p: number; z: number }[];
};

describe('normal quantile', () => {
  it('matches SciPy norm.ppf to Acklam’s stated 1.15e-9 relative (tests/fixtures/normal_quantile_reference.py)', () => {
    for (const { p, z } of reference.values) {
      if (z === 0) expect(Math.abs(normalQuantile(p))).toBeLessThan(1e-15);
      else expect(Math.abs(normalQuantile(p) - z) / Math.abs(z)).toBeLessThan(1.2e-9);
    }
  });

  it('Z95 is Φ⁻¹(0.975) (SciPy: 1.959963984540054)', () => {
    expect(Z95).toBe(reference.values.find((v) => v.p === 0.975)!.z);
  });

  it('refuses p outside (0, 1)', () => {
    expect(() => normalQuantile(0)).toThrow(RangeError);
    expect(() => normalQuantile(1)).toThrow(RangeError);
  });

  it('sample quantiles interpolate like NumPy (definition 7): numpy.quantile([1,2,3,4], 0.025) = 1.075', () => {
    expect(sortedQuantile([1, 2, 3, 4], 0.025)).toBeCloseTo(1.075, 14);
    expect(sortedQuantile([1, 2, 3, 4], 0.975)).toBeCloseTo(3.925, 14);
    expect(sortedQuantile([5], 0.5)).toBe(5);
  });
});
