// The numerical building blocks of the similarity solvers, on problems with known answers.
import { describe, expect, it } from 'vitest';
import { integrate } from '../shared/physics/similarity/dormandPrince.js';
import { adaptiveQuadrature } from '../shared/physics/similarity/quadrature.js';
import { TraceBuilder } from '../shared/physics/similarity/trace.js';

describe('Dormand–Prince integration', () => {
  it('integrates y″ = −y over ten periods to the tolerance', () => {
    const r = integrate(
      (_t, y, dy) => {
        dy[0] = y[1];
        dy[1] = -y[0];
      },
      0,
      20 * Math.PI,
      Float64Array.of(0, 1),
      { rtol: 1e-12, atol: 1e-14 },
    );
    expect(r.status).toBe('done');
    expect(Math.abs(r.y[0])).toBeLessThan(1e-9);
    expect(Math.abs(r.y[1] - 1)).toBeLessThan(1e-9);
  });

  it('stops when the step callback says so', () => {
    const r = integrate((_t, y, dy) => void (dy[0] = y[0] * y[0]), 0, 2, Float64Array.of(1), {
      rtol: 1e-10,
      atol: 1e-12,
      onStep: (_t, y) => y[0] < 1e3,
    });
    // y = 1/(1 − t) blows up at t = 1.
    expect(r.status).toBe('stopped');
    expect(r.t).toBeLessThan(1);
    expect(r.y[0]).toBeGreaterThanOrEqual(1e3);
    expect(Math.abs(r.y[0] - 1 / (1 - r.t)) / r.y[0]).toBeLessThan(1e-7);
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

describe('Hermite trace', () => {
  it('reproduces a smooth function and its derivatives between coarse nodes', () => {
    // F = sin: derivatives cycle sin, cos, −sin, −cos.
    const b = new TraceBuilder();
    for (let x = 0; x <= 3.0001; x += 0.25) b.push(x, [Math.sin(x), Math.cos(x), -Math.sin(x), -Math.cos(x), Math.sin(x), Math.cos(x)]);
    const t = b.build();
    let worst = 0;
    for (let x = 0; x < 3; x += 0.0137) {
      worst = Math.max(worst, Math.abs(t.F(x) - Math.sin(x)), Math.abs(t.derivative(1, x) - Math.cos(x)));
      worst = Math.max(worst, Math.abs(t.derivative(2, x) + Math.sin(x)), Math.abs(t.derivative(3, x) + Math.cos(x)));
    }
    // Degree-7 (F, f, f′) and degree-5 (f″) two-point Hermite on steps of 0.25.
    expect(worst).toBeLessThan(1e-7);
  });
});
