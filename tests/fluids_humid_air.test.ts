// Humid air: the shipped table (IAPWS humid-air formulation through python3-iapws) checked
// - between its nodes, against states computed straight from the formulation at random
//   (pressure, relative humidity, temperature): tests/fixtures/humid_air_reference.json,
//   written by tests/fixtures/humid_air_reference.py;
// - in the dry limit, against the dry-air table we ship (Lemmon et al. 2000);
// - against PsychroLib (npm `psychrolib`, the ASHRAE Handbook — Fundamentals 2017 ch. 1
//   psychrometric equations, ideal-gas moist air): density and the pressure effect.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { FluidRangeError, getFluid, resolveFluidSpec } from '../shared/physics/fluids/index.js';
import { InputError } from '../shared/physics/types.js';

const require = createRequire(import.meta.url);
const psychrolib = require('psychrolib') as {
  SetUnitSystem(u: number): void;
  SI: number;
  GetHumRatioFromRelHum(T: number, RH: number, P: number): number;
  GetMoistAirDensity(T: number, W: number, P: number): number;
  GetSatVapPres(T: number): number;
};
psychrolib.SetUnitSystem(psychrolib.SI);

interface Point {
  region: 'all' | 'near-boiling';
  pressure: number;
  relative_humidity: number;
  T: number;
  /** Boiling point of water at the point's pressure, K. */
  Tb: number;
  rho: number;
  cp: number;
  mu: number;
  k: number;
  beta: number;
}

const reference = JSON.parse(readFileSync(new URL('./fixtures/humid_air_reference.json', import.meta.url), 'utf8')) as {
  points: Point[];
};

// Within 10 K below the boiling point at the point's pressure (or above it) and at 50 % or
// more, the saturation mole fraction nears 1 and bends sharply: the table's hard corner.
const nearBoiling = (p: Point) => p.relative_humidity >= 0.5 && p.T > p.Tb - 10;

const humidAir = (relative_humidity: number, pressure?: number) =>
  resolveFluidSpec({ name: 'humid-air', relative_humidity, ...(pressure !== undefined && { pressure }) });

function worst(points: Point[]) {
  const w: Record<string, number> = {};
  for (const p of points) {
    const got = humidAir(p.relative_humidity, p.pressure).properties(p.T);
    for (const key of ['rho', 'cp', 'mu', 'k', 'beta'] as const) {
      w[key] = Math.max(w[key] ?? 0, Math.abs(got[key] / p[key] - 1));
    }
  }
  return w;
}

describe('humid air between table nodes against the IAPWS humid-air formulation', () => {
  it('has random points over the whole table and points near the boiling line', () => {
    expect(reference.points.filter((p) => p.region === 'all').length).toBeGreaterThanOrEqual(50);
    expect(reference.points.filter((p) => p.region === 'near-boiling').length).toBeGreaterThanOrEqual(10);
  });

  // Found: ρ 0.018 %, cp 0.028 %, μ 0.023 %, k 0.017 %, β 0.005 %.
  it('matches within 0.05 % away from the boiling line', () => {
    const away = reference.points.filter((p) => !nearBoiling(p));
    expect(away.length).toBeGreaterThan(45);
    const w = worst(away);
    for (const [key, value] of Object.entries(w)) expect(value, key).toBeLessThan(5e-4);
  });

  // Where relative humidity near 100 % meets the boiling point at a low pressure, the
  // saturation mole fraction reaches 1 with a kink that the cubics round off. Found: ρ 1.5 %,
  // cp 2.5 %, μ 2.0 %, k 0.6 %, β 0.3 %. The README states it.
  it('matches within 3 % near the boiling line at low pressure and high humidity', () => {
    const w = worst(reference.points.filter(nearBoiling));
    for (const [key, value] of Object.entries(w)) expect(value, key).toBeLessThan(0.03);
  });
});

describe('dry limit against the shipped dry-air table (Lemmon et al. 2000)', () => {
  it('0 % relative humidity at 1 atm is dry air within 0.02 %', () => {
    const dry = humidAir(0);
    const air = getFluid('air');
    for (let T = 273.15; T <= 373.15; T += 3.7) {
      const a = dry.properties(T);
      const b = air.properties(T);
      for (const key of ['rho', 'cp', 'mu', 'k', 'beta'] as const) {
        expect(Math.abs(a[key] / b[key] - 1), `${key} at ${T}`).toBeLessThan(2e-4);
      }
    }
  });
});

describe('against PsychroLib (ASHRAE Fundamentals 2017 ch. 1, ideal-gas moist air)', () => {
  // PsychroLib: W from relative humidity without the enhancement factor, ρ = p/(R_da T
  // (1 + 1.607858 W))·(1 + W). The real-gas formulation differs by the compressibility and
  // the enhancement factor (a few per mille); most where the air is half steam (80 °C
  // saturated at 1 atm, where steam's compressibility factor is about 0.993). Found 0.35 %.
  it('density within 0.5 % from 0 °C to 80 °C, 10–100 % relative humidity, 60–200 kPa', () => {
    let largest = 0;
    for (const p of [60_000, 85_000, 101_325, 150_000, 200_000]) {
      for (const phi of [0.1, 0.5, 0.9, 1]) {
        const fluid = humidAir(phi, p);
        for (const tC of [0, 15, 30, 50, 65, 80]) {
          if (phi * psychrolib.GetSatVapPres(tC) > 0.5 * p) continue; // leave the near-steam corner
          const W = psychrolib.GetHumRatioFromRelHum(tC, phi, p);
          const ref = psychrolib.GetMoistAirDensity(tC, W, p);
          const got = fluid.properties(tC + 273.15).rho;
          largest = Math.max(largest, Math.abs(got / ref - 1));
          expect(Math.abs(got / ref - 1), `${p} Pa, ${phi}, ${tC} °C`).toBeLessThan(5e-3);
        }
      }
    }
    expect(largest).toBeGreaterThan(0); // the two are different formulations
  });

  it('moist air is lighter than dry air and its cp higher, more so when warm', () => {
    for (const T of [283.15, 313.15, 343.15]) {
      let previous = humidAir(0).properties(T);
      for (const phi of [0.25, 0.5, 0.75, 1]) {
        const p = humidAir(phi).properties(T);
        expect(p.rho).toBeLessThan(previous.rho);
        expect(p.cp).toBeGreaterThan(previous.cp);
        previous = p;
      }
    }
    const warm = humidAir(1).properties(343.15).rho / humidAir(0).properties(343.15).rho;
    const cool = humidAir(1).properties(283.15).rho / humidAir(0).properties(283.15).rho;
    expect(warm).toBeLessThan(cool);
  });
});

describe('parameters and range', () => {
  it('defaults to 1 atm, and the pressure changes the state', () => {
    expect(humidAir(0.6).properties(300)).toEqual(humidAir(0.6, 101_325).properties(300));
    const low = humidAir(0.6, 80_000).properties(300);
    const atm = humidAir(0.6).properties(300);
    expect(low.rho / atm.rho).toBeCloseTo(80_000 / 101_325, 2);
  });

  it('covers 273.15 K to 373.15 K and refuses colder or hotter air', () => {
    const f = humidAir(0.5);
    expect([f.Tmin, f.Tmax]).toEqual([273.15, 373.15]);
    expect(() => f.properties(273.1)).toThrow(FluidRangeError);
    expect(() => f.properties(373.2)).toThrow(FluidRangeError);
  });

  it.each([
    [{ name: 'humid-air' }, /fluid 'humid-air' is a mixture: give its relative_humidity/],
    [{ name: 'humid-air', relative_humidity: 1.2 }, /relative_humidity 120 % is outside 0 % to 100 %/],
    [{ name: 'humid-air', relative_humidity: 0.5, pressure: 250_000 }, /pressure 250 kPa is outside 60 kPa to 200 kPa/],
    [{ name: 'humid-air', relative_humidity: 0.5, concentration: 0.4 }, /has no parameter 'concentration'/],
  ])('refuses %o', (spec, message) => {
    expect(() => resolveFluidSpec(spec)).toThrow(InputError);
    expect(() => resolveFluidSpec(spec)).toThrow(message);
  });
});
