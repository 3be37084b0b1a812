// Water and air against their reference formulations, at temperatures between the nodes of the
// shipped tables. Reference values: tests/fixtures/fluids_reference.json, written by
// tests/fixtures/fluids_reference.py from iapws 1.5.2 (IAPWS-95, IAPWS 2008 viscosity, IAPWS 2011
// conductivity for water; Lemmon et al. 2000 with Lemmon & Jacobsen 2004 transport for air).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getFluid } from '../shared/physics/fluids/index.js';

interface ReferencePoint {
  T: number;
  rho: number;
  cp: number;
  mu: number;
  k: number;
  Pr: number;
  beta: number;
}

const reference = JSON.parse(readFileSync(new URL('./fixtures/fluids_reference.json', import.meta.url), 'utf8')) as {
  water: { Tb: number; points: ReferencePoint[] };
  air: { points: ReferencePoint[] };
};

const PROPERTIES = ['rho', 'cp', 'mu', 'k', 'Pr'] as const;

function worstRelativeErrors(fluidName: string, points: ReferencePoint[]): Record<string, number> {
  const fluid = getFluid(fluidName);
  const worst: Record<string, number> = {};
  for (const p of points) {
    const got = fluid.properties(p.T);
    for (const key of PROPERTIES) {
      worst[key] = Math.max(worst[key] ?? 0, Math.abs(got[key] / p[key] - 1));
    }
  }
  return worst;
}

describe('water against IAPWS-95 / IAPWS 2008 / IAPWS 2011', () => {
  it('has reference points on both sides of the boiling point', () => {
    const Ts = reference.water.points.map((p) => p.T);
    expect(Math.min(...Ts)).toBeLessThan(280);
    expect(Ts.some((T) => T > reference.water.Tb && T < reference.water.Tb + 1)).toBe(true);
    expect(Math.max(...Ts)).toBeGreaterThan(595);
  });

  // The brief asks for 1 %; the 2 K table interpolates to about 1e-4, so hold it to 0.1 %.
  it('matches rho, cp, mu, k and Pr within 0.1 % between table nodes', () => {
    const worst = worstRelativeErrors('water', reference.water.points);
    for (const key of PROPERTIES) expect(worst[key], key).toBeLessThan(1e-3);
  });

  it('matches beta within 1e-6 1/K, including its sign change near 277 K', () => {
    const water = getFluid('water');
    for (const p of reference.water.points) {
      expect(Math.abs(water.properties(p.T).beta - p.beta), `T = ${p.T}`).toBeLessThan(1e-6);
    }
    expect(water.properties(274).beta).toBeLessThan(0);
    expect(water.properties(280).beta).toBeGreaterThan(0);
  });

  it('covers 273.15 K to 600 K', () => {
    const water = getFluid('water');
    expect(water.Tmin).toBe(273.15);
    expect(water.Tmax).toBe(600);
  });
});

describe('dry air against Lemmon et al. 2000 and Lemmon & Jacobsen 2004', () => {
  it('matches rho, cp, mu, k and Pr within 0.1 % between table nodes', () => {
    const worst = worstRelativeErrors('air', reference.air.points);
    for (const key of PROPERTIES) expect(worst[key], key).toBeLessThan(1e-3);
  });

  it('matches beta within 0.1 %', () => {
    const air = getFluid('air');
    for (const p of reference.air.points) {
      expect(Math.abs(air.properties(p.T).beta / p.beta - 1), `T = ${p.T}`).toBeLessThan(1e-3);
    }
  });

  it('covers 100 K to 1000 K', () => {
    const air = getFluid('air');
    expect([air.Tmin, air.Tmax]).toEqual([100, 1000]);
  });
});
