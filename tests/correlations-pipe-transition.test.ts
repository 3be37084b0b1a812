// Rough-pipe friction (Colebrook) and Gnielinski's laminar–turbulent transition for the
// pipe methods, checked against SciPy (tests/fixtures/colebrook_reference.py, the Graetz
// solution in graetz_reference.py) and published values (named beside each; "from memory"
// where recalled).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { colebrookFrictionFactor } from '../shared/physics/correlations/colebrook.js';
import { gnielinskiLaminarMean, intermittency, transitionNusselt } from '../shared/physics/correlations/pipe-transition.js';
import { InputError } from '../shared/physics/types.js';

const fixture = <T>(name: string): T => JSON.parse(readFileSync(new URL(`./fixtures/${name}`, import.meta.url), 'utf8')) as T;
const colebrook = fixture<{ points: { Re: number; relative_roughness: number; f: number }[] }>('colebrook_reference.json');
const graetz = fixture<{ points: { Gz: number; Nu_mean: number }[] }>('graetz_reference.json');
const relErr = (value: number, reference: number) => Math.abs(value / reference - 1);

describe('Colebrook friction factor', () => {
  it('matches SciPy over Re = 3000–1e8 and ε/D = 0–0.05 to 1e-10', () => {
    let worst = 0;
    for (const p of colebrook.points) {
      const r = colebrookFrictionFactor(p.Re, p.relative_roughness);
      expect(r.status).toBe('converged');
      worst = Math.max(worst, relErr(r.f, p.f));
    }
    expect(colebrook.points.length).toBeGreaterThan(150);
    expect(worst).toBeLessThan(1e-10);
  });

  it('reads the Moody chart: f = 0.0222 at Re = 1e5, ε/D = 0.001 (textbook value, from memory)', () => {
    expect(colebrookFrictionFactor(1e5, 0.001).f).toBeCloseTo(0.0222, 4);
  });

  it('refuses negative roughness and Re ≤ 0', () => {
    expect(() => colebrookFrictionFactor(1e5, -1e-4)).toThrow(InputError);
    expect(() => colebrookFrictionFactor(0, 1e-4)).toThrow(InputError);
  });
});

describe("Gnielinski's laminar composite and transition blend", () => {
  it('the laminar mean for a uniform wall temperature follows the exact Graetz solution within 1 %', () => {
    // Thermal entry only (the velocity developed): Pr → ∞ removes the developing-velocity term.
    let worst = 0;
    for (const p of graetz.points) {
      const Pr = 1e8;
      worst = Math.max(worst, relErr(gnielinskiLaminarMean((p.Gz * 1000) / Pr, Pr, 1000, 'temperature'), p.Nu_mean));
    }
    expect(worst).toBeLessThan(0.01); // largest seen: 1.0 % at Gz = 1e4, 0.4 % below Gz = 300
  });

  it('tends to the fully developed 3.66 and 4.354 for long tubes', () => {
    expect(gnielinskiLaminarMean(2300, 5, undefined, 'temperature')).toBe(3.66);
    expect(gnielinskiLaminarMean(2300, 5, undefined, 'flux')).toBe(4.354);
    // The (1.615 Gz^⅓ − 0.7)³ term cancels 0.7³ only slowly (as Gz^⅓).
    expect(gnielinskiLaminarMean(2300, 0.7, 1e15, 'temperature')).toBeCloseTo(3.66, 4);
    expect(gnielinskiLaminarMean(2300, 0.7, 1e15, 'flux')).toBeCloseTo(4.354, 4);
  });

  it('the flux composite by hand at Re = 2300, Pr = 5, L/D = 100 (calculator)', () => {
    // Gz = 115: 1.953·115^⅓ = 9.4973; 0.924·5^⅓·(23)^½ = 7.5775;
    // Nu = (4.354³ + 0.6³ + 8.8973³ + 7.5775³)^⅓ = 1222.18^⅓ = 10.6917.
    expect(gnielinskiLaminarMean(2300, 5, 100, 'flux')).toBeCloseTo(10.6917, 3);
  });

  it('γ runs linearly from 0 at Re = 2300 to 1 at 1e4, and the blend meets both ends', () => {
    expect(intermittency(2300)).toBe(0);
    expect(intermittency(1e4)).toBe(1);
    expect(intermittency(6150)).toBeCloseTo(0.5, 12);
    expect(intermittency(1000)).toBe(0);
    expect(intermittency(5e4)).toBe(1);
    expect(transitionNusselt(2300, 4, 40)).toBe(4);
    expect(transitionNusselt(1e4, 4, 40)).toBe(40);
    expect(transitionNusselt(6150, 4, 40)).toBeCloseTo(22, 12);
  });
});
