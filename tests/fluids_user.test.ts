// The catalogue API, range errors, user-defined fluids and their validation, the derived
// properties' consistency and the per-point cost of properties(T). Values here are
// constructed, not physical data ("common practice" checks of the API contract).
import { describe, expect, it } from 'vitest';
import { InputError } from '../shared/physics/types.js';
import {
  FluidRangeError,
  catalogueFluids,
  fluidNames,
  getFluid,
  makeConstantFluid,
  parametricFluids,
  makeTableFluid,
  type FluidColumns,
} from '../shared/physics/fluids/index.js';

describe('catalogue', () => {
  it('knows air, water, engine oil, ethylene glycol and sodium, then the mixtures', () => {
    expect(fluidNames).toEqual([
      'air',
      'water',
      'engine-oil',
      'ethylene-glycol',
      'sodium',
      'ethylene-glycol-water',
      'propylene-glycol-water',
      'humid-air',
    ]);
    expect(catalogueFluids.map((f) => f.name)).toEqual(fluidNames.slice(0, 5));
    expect(parametricFluids.map((f) => f.name)).toEqual(fluidNames.slice(5));
    for (const f of catalogueFluids) {
      expect(getFluid(f.name)).toBe(f);
      expect(f.source.length).toBeGreaterThan(20);
      expect(f.Tmin).toBeLessThan(f.Tmax);
    }
  });

  it('rejects an unknown name with the list of known ones', () => {
    expect(() => getFluid('glycerol')).toThrow(InputError);
    expect(() => getFluid('glycerol')).toThrow(/unknown fluid 'glycerol'.*air, water, engine-oil, ethylene-glycol, sodium, ethylene-glycol-water, propylene-glycol-water, humid-air/);
  });

  it('throws FluidRangeError outside [Tmin, Tmax] and for non-finite T, never extrapolates', () => {
    for (const f of catalogueFluids) {
      expect(() => f.properties(f.Tmin)).not.toThrow();
      expect(() => f.properties(f.Tmax)).not.toThrow();
      for (const T of [f.Tmin - 1e-9, f.Tmax + 1e-9, Number.NaN, Infinity, -Infinity]) {
        let error: unknown;
        try {
          f.properties(T);
        } catch (e) {
          error = e;
        }
        expect(error, `${f.name} at ${T}`).toBeInstanceOf(FluidRangeError);
        const rangeError = error as FluidRangeError;
        expect([rangeError.fluid, rangeError.Tmin, rangeError.Tmax]).toEqual([f.name, f.Tmin, f.Tmax]);
      }
    }
    expect(() => getFluid('engine-oil').properties(431)).toThrow(/outside the range of fluid 'engine-oil'/);
  });

  it('derives nu, alpha and Pr consistently: nu = mu/rho, alpha = k/(rho cp), Pr = nu/alpha', () => {
    for (const f of catalogueFluids) {
      for (let j = 0; j <= 40; j++) {
        const T = f.Tmin + ((f.Tmax - f.Tmin) * j) / 40;
        const p = f.properties(T);
        expect(p.nu).toBeCloseTo(p.mu / p.rho, 15);
        expect(p.alpha / (p.k / (p.rho * p.cp)) - 1).toBeCloseTo(0, 14);
        expect(p.Pr / (p.nu / p.alpha) - 1).toBeCloseTo(0, 14);
        expect(p.Pr / ((p.mu * p.cp) / p.k) - 1).toBeCloseTo(0, 12);
      }
    }
  });

  it('reproduces each table node exactly', () => {
    const oil = getFluid('engine-oil').properties(300);
    expect([oil.rho, oil.cp, oil.k]).toEqual([884.1, 1909, 0.145]);
    expect(oil.mu).toBeCloseTo(0.486, 12);
  });

  it('costs well under a microsecond per call', () => {
    const water = getFluid('water');
    const n = 200_000;
    let sink = 0;
    const start = performance.now();
    for (let i = 0; i < n; i++) sink += water.properties(280 + (i % 3000) * 0.1).Pr;
    const perCall = ((performance.now() - start) * 1e3) / n; // µs
    expect(sink).toBeGreaterThan(0);
    // Typically ~0.05 µs; the bound leaves room for slow CI machines.
    expect(perCall).toBeLessThan(2);
  });
});

describe('makeConstantFluid', () => {
  const oilLike = { rho: 880, cp: 1900, mu: 0.5, k: 0.145, beta: 7e-4 };

  it('returns the given properties and the derived groups at any temperature', () => {
    const f = makeConstantFluid(oilLike);
    expect(f.name).toBe('user');
    for (const T of [1, 300, 5000]) {
      const p = f.properties(T);
      expect(p).toMatchObject(oilLike);
      expect(p.nu).toBeCloseTo(0.5 / 880, 15);
      expect(p.alpha).toBeCloseTo(0.145 / (880 * 1900), 15);
      expect(p.Pr).toBeCloseTo((0.5 * 1900) / 0.145, 9);
    }
  });

  it('gives beta NaN when it is not stated, so it cannot be used unnoticed', () => {
    expect(makeConstantFluid({ rho: 1000, cp: 4180, mu: 1e-3, k: 0.6 }).properties(300).beta).toBeNaN();
  });

  it('honours Tmin/Tmax and refuses non-finite T', () => {
    const f = makeConstantFluid({ ...oilLike, name: 'bath-oil', Tmin: 280, Tmax: 350 });
    expect(f.name).toBe('bath-oil');
    expect(() => f.properties(279.9)).toThrow(FluidRangeError);
    expect(() => f.properties(350.1)).toThrow(FluidRangeError);
    expect(() => makeConstantFluid(oilLike).properties(Number.NaN)).toThrow(FluidRangeError);
    expect(() => makeConstantFluid(oilLike).properties(Infinity)).toThrow(FluidRangeError);
  });

  it('returns a fresh object, so a caller cannot corrupt the fluid', () => {
    const f = makeConstantFluid(oilLike);
    f.properties(300).rho = -1;
    expect(f.properties(300).rho).toBe(880);
  });

  it.each([
    [{ ...oilLike, rho: 0 }, /'rho' must be a positive finite number, got 0/],
    [{ ...oilLike, mu: -1e-3 }, /'mu' must be a positive/],
    [{ ...oilLike, k: Number.NaN }, /'k' must be a positive/],
    [{ ...oilLike, cp: '1900' }, /'cp' must be a positive finite number, got "1900"/],
    [{ rho: 880, cp: 1900, mu: 0.5 }, /'k' is missing/],
    [{ ...oilLike, beta: Infinity }, /'beta' must be a finite number/],
    [{ ...oilLike, Tmin: 300, Tmax: 300 }, /'Tmax' must be above Tmin/],
    [{ ...oilLike, Tmin: -5 }, /'Tmin' must be a finite temperature/],
    [{ ...oilLike, viscosity: 0.5 }, /unknown field 'viscosity'/],
  ])('rejects %o', (options, message) => {
    expect(() => makeConstantFluid(options as never)).toThrow(InputError);
    expect(() => makeConstantFluid(options as never)).toThrow(message);
  });
});

describe('makeTableFluid', () => {
  // A made-up, smooth liquid: density falling 0.6 kg/m³ per K.
  const columns = (): FluidColumns => ({
    T: [280, 300, 320, 340],
    rho: [1012, 1000, 988, 976],
    cp: [4000, 4010, 4030, 4060],
    mu: [2e-3, 1e-3, 6e-4, 4e-4],
    k: [0.55, 0.58, 0.6, 0.61],
  });

  it('interpolates inside the table and refuses to leave it', () => {
    const f = makeTableFluid({ name: 'coolant-x', columns: columns() });
    expect([f.name, f.Tmin, f.Tmax]).toEqual(['coolant-x', 280, 340]);
    const p = f.properties(310);
    expect(p.rho).toBeCloseTo(994, 9); // a straight line stays straight
    expect(p.mu).toBeLessThan(1e-3);
    expect(p.mu).toBeGreaterThan(6e-4);
    expect(() => f.properties(279.99)).toThrow(FluidRangeError);
    expect(() => f.properties(340.01)).toThrow(FluidRangeError);
  });

  it('derives beta = -(1/rho) drho/dT when no beta column is given', () => {
    const f = makeTableFluid({ columns: columns() });
    expect(f.name).toBe('user');
    expect(f.properties(310).beta).toBeCloseTo(0.6 / 994, 12);
  });

  it('uses a beta column when given, negative values allowed', () => {
    const f = makeTableFluid({ columns: { ...columns(), beta: [-5e-5, 2.6e-4, 4e-4, 5e-4] } });
    expect(f.properties(280).beta).toBe(-5e-5);
    expect(f.properties(300).beta).toBe(2.6e-4);
  });

  it('accepts two rows (straight lines)', () => {
    const f = makeTableFluid({ columns: { T: [300, 400], rho: [2, 1], cp: [1000, 1100], mu: [1e-5, 4e-5], k: [0.02, 0.03] } });
    expect(f.properties(350).rho).toBeCloseTo(1.5, 12);
    expect(f.properties(350).mu).toBeCloseTo(2e-5, 15); // ln(mu) linear: geometric mean
  });

  it.each([
    [(c: FluidColumns) => ({ ...c, T: [280, 300, 300, 340] }), /'T' must be strictly increasing: T\[2\] = 300 follows T\[1\] = 300/],
    [(c: FluidColumns) => ({ ...c, T: [280, 300, 290, 340] }), /'T' must be strictly increasing/],
    [(c: FluidColumns) => ({ ...c, k: [0.55, 0.58, 0.6] }), /column 'k' has 3 values but column 'T' has 4/],
    [(c: FluidColumns) => ({ ...c, mu: [2e-3, 0, 6e-4, 4e-4] }), /mu\[1\] must be positive, got 0/],
    [(c: FluidColumns) => ({ ...c, rho: [1012, -1, 988, 976] }), /rho\[1\] must be positive/],
    [(c: FluidColumns) => ({ ...c, cp: [4000, Number.NaN, 4030, 4060] }), /cp\[1\] must be a finite number/],
    [(c: FluidColumns) => ({ ...c, T: [-1, 300, 320, 340] }), /T\[0\] must be positive/],
    [(c: FluidColumns) => ({ ...c, beta: [1e-4, 2e-4] }), /column 'beta' has 2 values/],
    [(c: FluidColumns) => ({ ...c, beta: [1e-4, 2e-4, null, 3e-4] }), /beta\[2\] must be a finite number, got null/],
    [(c: FluidColumns) => ({ T: c.T, rho: c.rho, cp: c.cp, k: c.k }), /column 'mu' is missing/],
    [(c: FluidColumns) => ({ ...c, k: 0.6 }), /column 'k' must be an array of numbers/],
    [(c: FluidColumns) => ({ ...c, nu: [1, 2, 3, 4] }), /unknown column 'nu'/],
    [() => ({ T: [300], rho: [1], cp: [1], mu: [1], k: [1] }), /needs at least 2 rows, column 'T' has 1/],
    [() => [1, 2, 3], /columns must be an object/],
  ])('rejects a bad table (%#)', (mutate, message) => {
    const bad = (mutate as (c: FluidColumns) => unknown)(columns()) as FluidColumns;
    expect(() => makeTableFluid({ name: 'bad', columns: bad })).toThrow(InputError);
    expect(() => makeTableFluid({ name: 'bad', columns: bad })).toThrow(message);
    expect(() => makeTableFluid({ name: 'bad', columns: bad })).toThrow(/^table fluid 'bad': /);
  });
});
