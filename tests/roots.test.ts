// Brent's method and the bracket scan, against closed-form roots (common practice).
import { describe, expect, it } from 'vitest';
import { brent, scanForBracket } from '../shared/physics/numerics/roots.js';

describe('brent', () => {
  it('finds √2 of x² − 2 to 1e-14 relative', () => {
    const r = brent((x) => x * x - 2, 0, 2, { relTol: 1e-14 });
    expect(r.status).toBe('converged');
    expect(Math.abs(r.x - Math.SQRT2) / Math.SQRT2).toBeLessThan(1e-14);
  });
  it('finds the root of cos x − x (Dottie number 0.7390851332151607, from memory)', () => {
    const r = brent((x) => Math.cos(x) - x, 0, 1, { relTol: 1e-15 });
    expect(r.x).toBeCloseTo(0.7390851332151607, 14);
  });
  it('handles a steep, badly scaled function (x^9 − 1e-9) within 60 evaluations', () => {
    let n = 0;
    const r = brent((x) => (n++, x ** 9 - 1e-9), 0, 4, { relTol: 1e-12 });
    expect(r.status).toBe('converged');
    expect(Math.abs(r.x - 0.1) / 0.1).toBeLessThan(1e-11);
    expect(n).toBeLessThan(60);
  });
  it('says not-bracketed when the ends share a sign', () => {
    expect(brent((x) => x * x + 1, -1, 1).status).toBe('not-bracketed');
  });
  it('says non-finite when f is NaN at an end', () => {
    expect(brent(() => NaN, 0, 1).status).toBe('non-finite');
  });
});

describe('scanForBracket', () => {
  it('brackets the smallest of several roots and counts them', () => {
    const s = scanForBracket((x) => Math.sin(x), 1, 10, 50); // roots π, 2π, 3π
    expect(s.bracket!.lo).toBeLessThan(Math.PI);
    expect(s.bracket!.hi).toBeGreaterThan(Math.PI);
    expect(s.bracket!.signChanges).toBe(3);
  });
  it('reports the achievable range when there is no root', () => {
    const s = scanForBracket((x) => x * x + 1, 0, 2, 8);
    expect(s.bracket).toBeUndefined();
    expect(s.min).toBe(1);
    expect(s.max).toBe(5);
  });
  it('scans geometrically over decades', () => {
    const s = scanForBracket((x) => Math.log10(x) - 3.3, 1, 1e6, 12);
    expect(s.bracket!.lo).toBeLessThan(10 ** 3.3);
    expect(s.bracket!.hi).toBeGreaterThan(10 ** 3.3);
    expect(s.bracket!.hi / s.bracket!.lo).toBeCloseTo(10 ** 0.5, 10);
  });
});
