// The numerical building blocks of the similarity solvers, on problems with known answers.
import { describe, expect, it } from 'vitest';
import { adaptiveQuadrature } from '../shared/physics/similarity/quadrature.js';
import { horner, orderFor, radiusStep, SERIES_LENGTH } from '../shared/physics/similarity/taylor.js';
import { TraceBuilder } from '../shared/physics/similarity/trace.js';

/** Taylor coefficients of sin about x0 (derivatives cycle sin, cos, −sin, −cos), `n` of them. */
function sinSeries(x0: number, n: number, shift = 0): Float64Array {
  const a = new Float64Array(SERIES_LENGTH);
  let factorial = 1;
  for (let k = 0; k < n; k++) {
    if (k > 0) factorial *= k;
    const phase = (k + shift) % 4;
    const d = phase === 0 ? Math.sin(x0) : phase === 1 ? Math.cos(x0) : phase === 2 ? -Math.sin(x0) : -Math.cos(x0);
    a[k] = d / factorial;
  }
  return a;
}

describe('Taylor-series steps', () => {
  it('integrate y′ = −λy to e^{−λt} at the chosen order and step, for slow and fast decay', () => {
    for (const lambda of [0.3, 1, 25]) {
      for (const eps of [1e-6, 1e-13]) {
        const p = orderFor(eps);
        const epsRoot = Math.pow(eps, 1 / p);
        const a = new Float64Array(SERIES_LENGTH);
        let t = 0;
        let y = 1;
        let steps = 0;
        while (t < 10 / lambda) {
          a[0] = y;
          for (let k = 0; k < p; k++) a[k + 1] = (-lambda * a[k]) / (k + 1);
          const h = Math.min(radiusStep(Math.max(1, Math.abs(y)), Math.abs(a[p - 1]), Math.abs(a[p]), p, epsRoot), 10 / lambda - t);
          y = horner(a, 0, p + 1, h);
          t += h;
          steps++;
        }
        // Each step errs by about ε (absolute, as y ≤ 1), so the end value keeps about steps·ε.
        expect(Math.abs(y - Math.exp(-10)), `λ ${lambda}, ε ${eps}`).toBeLessThan(10 * steps * eps);
        // The step scales with 1/λ: the same number of steps whatever the rate.
        expect(steps).toBeLessThan(40);
      }
    }
  });

  it('picks a higher order for a tighter tolerance', () => {
    expect(orderFor(1e-5)).toBeLessThan(orderFor(1e-9));
    expect(orderFor(1e-9)).toBeLessThan(orderFor(1e-13));
    expect(orderFor(1e-40)).toBe(28);
  });
});

describe('solution trace', () => {
  it('reproduces the solution and its derivatives between coarse nodes, and continues it as the outer flow', () => {
    // F = sin on steps of 0.5, each stored as its Taylor series (22 terms).
    const terms = 22;
    const b = new TraceBuilder(terms);
    for (let x = 0; x < 3; x += 0.5) b.push(x, sinSeries(x, terms));
    const t = b.build(3);
    let worst = 0;
    for (let x = 0; x < 3; x += 0.0137) {
      for (let k = 0; k < 6; k++) {
        const phase = k % 4;
        const exact = phase === 0 ? Math.sin(x) : phase === 1 ? Math.cos(x) : phase === 2 ? -Math.sin(x) : -Math.cos(x);
        worst = Math.max(worst, Math.abs(t.derivative(k, x) - exact));
      }
    }
    expect(worst).toBeLessThan(1e-12);
    expect(t.length).toBe(7);
    expect(t.node(1, 6)).toBeCloseTo(Math.cos(3), 13);
    // Beyond the last node: f'' = 0, F quadratic.
    const tau = 2;
    expect(t.F(3 + tau)).toBeCloseTo(Math.sin(3) + Math.cos(3) * tau - 0.5 * Math.sin(3) * tau * tau, 12);
    expect(t.derivative(3, 3 + tau)).toBe(0);
  });

  it('moves the stored solution along its sensitivities: y + δ·∂y/∂s', () => {
    // y(η; s) = s·sin η: ∂y/∂s = sin η, so y(s = 1) moved by δ = 0.25 is 1.25·sin η.
    const terms = 22;
    const b = new TraceBuilder(terms, 1);
    for (let x = 0; x < 2; x += 0.5) b.push(x, sinSeries(x, terms), [sinSeries(x, terms)]);
    const t = b.build(2, [0.25]);
    for (let x = 0; x < 2; x += 0.1) {
      expect(t.F(x)).toBeCloseTo(1.25 * Math.sin(x), 13);
      expect(t.derivative(2, x)).toBeCloseTo(-1.25 * Math.sin(x), 13);
    }
  });
});

describe('Gauss–Kronrod quadrature', () => {
  it('is exact for polynomials of degree 22 on one panel', () => {
    const q = adaptiveQuadrature((x) => 23 * x ** 22, [0, 1], 1e-15);
    expect(Math.abs(q.value - 1)).toBeLessThan(1e-14);
  });

  it('integrates a sharp peak once breakpoints bracket it', () => {
    const sigma = 1e-3;
    const q = adaptiveQuadrature((x) => Math.exp(-0.5 * ((x - 0.3) / sigma) ** 2), [0, 0.3, 1], 1e-13);
    expect(Math.abs(q.value / (sigma * Math.sqrt(2 * Math.PI)) - 1)).toBeLessThan(1e-12);
  });
});
