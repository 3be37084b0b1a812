// Honest dimensional answers (issue 9): internal-flow energy balances from the inlet, the
// flux forms of methods, heating/cooling, entrance regions, tube banks with their pressure
// drop, over-specified points, radiation beside convection and the surface temperature a
// surface reaches when it must shed a given power. Each check names its source: textbook
// worked examples (values from memory where marked) or hand calculations from the
// textbook equations ("common practice"), with properties read here from the same fluid
// tables so that the check is of the engine's bookkeeping, not of the tables.
import { describe, expect, it } from 'vitest';
import { solvePoint } from '../shared/physics/engine.js';
import { getMethod } from '../shared/physics/catalogue.js';
import { getFluid } from '../shared/physics/fluids/index.js';
import { STEFAN_BOLTZMANN } from '../shared/physics/radiation.js';
import { InputError } from '../shared/physics/types.js';
import { compileSolver } from '../shared/physics/engine.js';

const water = getFluid('water');
const air = getFluid('air');
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const C = 273.15;

describe('internal flow: the energy balance from the inlet (uniform wall temperature)', () => {
  // The case: water in a 10 mm tube at 0.01 m/s, 10 m long, in at 20 °C, wall at 40 °C.
  const inputs = { diameter: 0.01, length: 10, velocity: 0.01, fluid_temperature: 20 + C, surface_temperature: 40 + C };
  const [row] = solvePoint({ configuration: 'pipe', methods: ['laminar-developed'], fluid: 'water' }, inputs);
  const o = row.outputs;
  const mdot = water.properties(20 + C).rho * 0.01 * (Math.PI * 0.01 ** 2) / 4;

  it('never carries more heat than the stream can absorb, ṁ·c_p·(T_s − T_in)', () => {
    const cp = water.properties(o.mean_bulk_temperature).cp;
    expect(o.mass_flow).toBeCloseTo(mdot, 12);
    expect(o.heat_rate).toBeLessThanOrEqual(mdot * cp * 20);
    // Before this balance the engine reported h·A·(T_s − T_in) = 1375 W here; the stream holds ~66 W.
    expect(o.heat_rate).toBeGreaterThan(60);
    expect(o.heat_rate).toBeLessThan(70);
  });

  it('is within 1 % of the exponential balance worked by hand (Incropera 7th ed. eq. 8.41b, common practice)', () => {
    // By hand: properties at the mean bulk temperature, h = Nu·k/D, NTU = hPL/(ṁc_p).
    const Tm = o.mean_bulk_temperature;
    const p = water.properties(Tm);
    const h = (getMethod('pipe', 'laminar-developed').evaluate({ Re: 1000 }).outputs.Nu * p.k) / 0.01;
    const ntu = (h * Math.PI * 0.01 * 10) / (mdot * p.cp);
    const Tout = 40 + C - 20 * Math.exp(-ntu);
    const Q = mdot * p.cp * (Tout - (20 + C));
    expect(rel(o.heat_rate, Q)).toBeLessThan(0.01);
    expect(Math.abs(o.outlet_temperature - Tout)).toBeLessThan(1e-3);
    expect(Math.abs(Tm - (20 + C + o.outlet_temperature) / 2)).toBeLessThan(1e-6);
  });

  it('gives the log-mean temperature difference with heat_rate = h·A·ΔT_lm (Incropera eq. 8.44)', () => {
    const dTin = 20;
    const dTout = 40 + C - o.outlet_temperature;
    // Long tube: ΔT_out is tiny, so compare through the identity rather than the logarithm.
    expect(rel(o.heat_rate, o.h * o.surface_area * o.log_mean_temperature_difference)).toBeLessThan(1e-9);
    expect(o.log_mean_temperature_difference).toBeLessThan(dTin);
    expect(o.log_mean_temperature_difference).toBeGreaterThan(dTout);
    expect(o.q).toBeCloseTo(o.heat_rate / o.surface_area, 9);
  });

  it('a short, fast tube: LMTD by its textbook formula and the same balance', () => {
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' },
      { diameter: 0.02, length: 2, velocity: 1, fluid_temperature: 20 + C, surface_temperature: 80 + C },
    );
    const dTin = 60;
    const dTout = 80 + C - r.outputs.outlet_temperature;
    expect(rel(r.outputs.log_mean_temperature_difference, (dTin - dTout) / Math.log(dTin / dTout))).toBeLessThan(1e-9);
    const cp = water.properties(r.outputs.mean_bulk_temperature).cp;
    expect(rel(r.outputs.heat_rate, r.outputs.mass_flow * cp * (r.outputs.outlet_temperature - (20 + C)))).toBeLessThan(1e-12);
    expect(rel(r.outputs.heat_rate, r.outputs.h * r.outputs.surface_area * r.outputs.log_mean_temperature_difference)).toBeLessThan(1e-6);
    expect(r.outputs.property_temperature).toBeCloseTo(r.outputs.mean_bulk_temperature, 9);
  });

  it('reads the bulk properties at the mean bulk temperature and μ_s at the wall (Sieder–Tate)', () => {
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['sieder-tate'], fluid: 'water' },
      { diameter: 0.025, length: 2, velocity: 1, fluid_temperature: 40 + C, surface_temperature: 60 + C },
    );
    const Tm = r.outputs.mean_bulk_temperature;
    expect(r.outputs.property_temperature).toBe(Tm);
    expect(r.outputs.viscosity_ratio).toBeCloseTo(water.properties(Tm).mu / water.properties(60 + C).mu, 12);
    // Re from the inlet mass flux at the mean viscosity: Re = ρ_in·u·D/μ_m.
    expect(r.outputs.Re).toBeCloseTo((water.properties(40 + C).rho * 1 * 0.025) / water.properties(Tm).mu, 6);
  });

  it('flags a point whose balance cannot be closed in the fluid table (outlet beyond its range): out-of-range, no number', () => {
    const rows = compileSolver({ configuration: 'pipe', methods: ['laminar-developed'], fluid: 'engine-oil' })({
      diameter: 0.01, length: 200, velocity: 0.05, fluid_temperature: 300, heat_flux: 5e4,
    });
    expect(rows[0].flags).toContain('out-of-range:property_temperature');
    expect(rows[0].outputs.Nu).toBeUndefined();
  });
});

describe('internal flow: uniform heat flux selects the flux form', () => {
  it('Çengel & Ghajar, Heat and Mass Transfer, Example 8-4 (values from memory): water 15 → 65 °C, wall at the exit 115 °C', () => {
    // Water at 10 L/min heated from 15 °C in a 3 cm tube, 5 m long, by a uniform flux: the book
    // finds Q = 34.6 kW, q″ = 73.4 kW/m², Re = 10 760, Nu = 69.4 (Dittus–Boelter), h = 1 460 W/m²K,
    // and T_s at the exit = 115 °C. Here the flux is given and the outlet follows.
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['dittus-boelter'], fluid: 'water' },
      { diameter: 0.03, length: 5, flow_rate: 10 / 60000, fluid_temperature: 15 + C, heat_flux: 73.4e3 },
    );
    const o = r.outputs;
    // ṁ from ρ at the inlet (999.1 kg/m³) where the book used ρ at 40 °C (992.1): 0.7 % more flow.
    expect(Math.abs(o.outlet_temperature - (65 + C))).toBeLessThan(0.6);
    expect(rel(o.heat_rate, 34.6e3)).toBeLessThan(0.005);
    expect(rel(o.Nu, 69.4)).toBeLessThan(0.01);
    expect(rel(o.h, 1460)).toBeLessThan(0.015);
    expect(Math.abs(o.surface_temperature_outlet - (115 + C))).toBeLessThan(1.5);
    expect(o.surface_temperature_outlet).toBeCloseTo(o.outlet_temperature + 73.4e3 / o.h, 9);
    expect(o.q).toBe(73.4e3);
    // A wall at 115 °C boils water at 1 atm (T_sat = 100 °C): the book's loop must be pressurised.
    expect(r.flags).toEqual(['boiling-possible']);
    const [pressurised] = solvePoint(
      { configuration: 'pipe', methods: ['dittus-boelter'], fluid: 'water' },
      { diameter: 0.03, length: 5, flow_rate: 10 / 60000, fluid_temperature: 15 + C, heat_flux: 73.4e3, pressure: 2.5e5 },
    );
    expect(pressurised.flags).toEqual([]);
  });

  it('gives the laminar uniform-flux Nu 48/11 = 4.364 (Shah & London 1978) and the outlet wall temperature', () => {
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['laminar-developed'], fluid: 'water' },
      { diameter: 0.01, length: 10, velocity: 0.01, fluid_temperature: 20 + C, heat_flux: 500 },
    );
    const o = r.outputs;
    expect(o.Nu).toBeCloseTo(4.364, 3);
    // Outlet by hand: T_out = T_in + q″·πDL/(ṁc_p) with c_p at the mean (Incropera eq. 8.40, common practice).
    const mdot = water.properties(20 + C).rho * 0.01 * (Math.PI * 1e-4) / 4;
    const cp = water.properties(o.mean_bulk_temperature).cp;
    expect(Math.abs(o.outlet_temperature - (20 + C + (500 * Math.PI * 0.01 * 10) / (mdot * cp)))).toBeLessThan(1e-5);
    expect(o.surface_temperature_outlet).toBeCloseTo(o.outlet_temperature + 500 / o.h, 9);
    expect(o.surface_temperature_outlet).toBeGreaterThan(o.surface_temperature);
    expect(o.heat_rate).toBeCloseTo(500 * Math.PI * 0.01 * 10, 9);
  });

  it('says so when a method has no flux form (Hausen: wall temperature only), never silently the isothermal value', () => {
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['hausen'], fluid: 'water' },
      { diameter: 0.01, length: 1, velocity: 0.05, fluid_temperature: 20 + C, heat_flux: 500 },
    );
    expect(r.flags).toContain('no-flux-form');
  });

  it('passes wall_condition: flux to the duct and the flat plate (Churchill–Ozoe), and flags isothermal-only plates', () => {
    const [duct] = solvePoint(
      { configuration: 'duct', methods: ['laminar-rectangular'], fluid: 'water' },
      { width: 0.01, height: 0.01, length: 5, velocity: 0.02, fluid_temperature: 20 + C, heat_flux: 300 },
    );
    expect(duct.outputs.Nu).toBeCloseTo(3.608, 3); // Shah & London Nu_H1 for a square duct
    const plate = solvePoint(
      { configuration: 'flat-plate', methods: ['churchill-ozoe', 'laminar', 'laminar-uniform-flux'], fluid: 'air' },
      { length: 0.5, width: 0.2, velocity: 3, fluid_temperature: 20 + C, heat_flux: 200 },
    );
    const co = plate.find((x) => x.method === 'churchill-ozoe')!;
    const direct = getMethod('flat-plate', 'churchill-ozoe').evaluate({ Re: co.outputs.Re, Pr: co.outputs.Pr, wall_condition: 'flux' });
    expect(co.outputs.Nu).toBeCloseTo(direct.outputs.Nu, 10);
    expect(co.flags).toEqual([]);
    expect(plate.find((x) => x.method === 'laminar')!.flags).toContain('no-flux-form');
    expect(plate.find((x) => x.method === 'laminar-uniform-flux')!.flags).toEqual([]);
    // And the other way round: a flux-only method under a given wall temperature.
    const [flux] = solvePoint(
      { configuration: 'flat-plate', methods: ['laminar-uniform-flux'], fluid: 'air' },
      { length: 0.5, velocity: 3, fluid_temperature: 20 + C, surface_temperature: 40 + C },
    );
    expect(flux.flags).toContain('no-temperature-form');
  });
});

describe('heating or cooling follows the temperatures', () => {
  const base = { diameter: 0.02, length: 3, velocity: 1.5, fluid_temperature: 60 + C };
  it('Dittus–Boelter cools with n = 0.3 (Incropera eq. 8.60) when the wall is colder than the stream', () => {
    const [r] = solvePoint({ configuration: 'pipe', methods: ['dittus-boelter'], fluid: 'water' }, { ...base, surface_temperature: 20 + C });
    expect(r.outputs.Nu).toBeCloseTo(0.023 * r.outputs.Re ** 0.8 * r.outputs.Pr ** 0.3, 9);
    expect(r.outputs.heat_rate).toBeLessThan(0);
    expect(r.outputs.outlet_temperature).toBeLessThan(60 + C);
    const [heated] = solvePoint({ configuration: 'pipe', methods: ['dittus-boelter'], fluid: 'water' }, { ...base, surface_temperature: 90 + C });
    expect(heated.outputs.Nu).toBeCloseTo(0.023 * heated.outputs.Re ** 0.8 * heated.outputs.Pr ** 0.4, 9);
  });
  it('refuses a fixed heating value that contradicts the temperatures (solve) and flags it in sweeps', () => {
    const plan = { configuration: 'pipe', methods: ['dittus-boelter'], fluid: 'water' };
    expect(() => solvePoint(plan, { ...base, surface_temperature: 20 + C, heating: true })).toThrow(/heating: true contradicts/);
    const [row] = compileSolver(plan)({ ...base, surface_temperature: 20 + C, heating: true });
    expect(row.flags).toEqual(['conflict:heating']);
    expect(row.outputs).toEqual({});
    // Agreeing is fine.
    expect(solvePoint(plan, { ...base, surface_temperature: 20 + C, heating: false })[0].flags).toEqual([]);
  });
});

describe('entrance regions', () => {
  it('flags fully developed methods in short tubes: laminar L/D < 0.05·Re·Pr, turbulent L/D < 10 (Incropera eqs. 8.3, 8.23)', () => {
    const lam = getMethod('pipe', 'laminar-developed');
    expect(lam.evaluate({ Re: 1000, Pr: 7, L_over_D: 300 }).flags).toEqual(['entry-region']); // 0.05·1000·7 = 350
    expect(lam.evaluate({ Re: 1000, Pr: 7, L_over_D: 400 }).flags).toEqual([]);
    expect(lam.evaluate({ Re: 1000, Pr: 0.7, L_over_D: 40 }).flags).toEqual(['entry-region']); // hydrodynamic 0.05·Re = 50
    for (const id of ['dittus-boelter', 'sieder-tate', 'gnielinski']) {
      expect(getMethod('pipe', id).evaluate({ Re: 5e4, Pr: 5, L_over_D: 8 }).flags, id).toEqual(['entry-region']);
      expect(getMethod('pipe', id).evaluate({ Re: 5e4, Pr: 5, L_over_D: 12 }).flags, id).toEqual([]);
    }
    expect(getMethod('duct', 'turbulent-rectangular').evaluate({ Re: 5e4, Pr: 5, L_over_D: 8 }).flags).toEqual(['entry-region']);
  });
  it('offers the short-tube factor 1 + (D/L)^(2/3) (Hausen 1959) as a switch, which replaces the flag', () => {
    const g = getMethod('pipe', 'gnielinski');
    const plain = g.evaluate({ Re: 5e4, Pr: 5, L_over_D: 8 });
    const corrected = g.evaluate({ Re: 5e4, Pr: 5, L_over_D: 8, short_tube_correction: true });
    expect(corrected.outputs.Nu / plain.outputs.Nu).toBeCloseTo(1 + (1 / 8) ** (2 / 3), 12);
    expect(corrected.flags).toEqual([]);
    expect(() => g.evaluate({ Re: 5e4, Pr: 5, short_tube_correction: true })).toThrow(InputError);
  });
  it('gets the thermal entry check in dimensional runs (Pr derived from the fluid)', () => {
    const [r] = solvePoint(
      { configuration: 'pipe', methods: ['laminar-developed'], fluid: 'water' },
      { diameter: 0.01, length: 1, velocity: 0.05, fluid_temperature: 20 + C, surface_temperature: 40 + C },
    );
    expect(r.flags).toContain('entry-region'); // L/D = 100 against 0.05·Re·Pr ≈ 0.05·600·6
  });
});

describe('tube bank: the bank balance and Žukauskas pressure drop', () => {
  // Incropera et al., 7th ed., Example 7.7 (values from memory): air at 15 °C and 6 m/s across a
  // staggered bank, D = 16.4 mm, S_T = 31.3 mm, S_L = 34.3 mm, N_L = 7 rows of N_T = 8 tubes at
  // 70 °C. The book: Re_max = 13 943, Nu = 87.9, h = 135.6 W/m²K, T_o = 25.5 °C (from
  // T_s − T_o = (T_s − T_i)exp(−πDNh/(ρVN_T S_T c_p)) = 55·e^−0.2126), ΔT_lm = 49.6 K,
  // q′ = 19.4 kW per metre of tube, Δp = 246 N/m² (f ≈ 0.35, χ ≈ 1.04 read off Fig. 7.15).
  const [r] = solvePoint(
    { configuration: 'tube-bank', methods: ['zukauskas-bank'], fluid: 'air' },
    {
      diameter: 0.0164, length: 1, velocity: 6, fluid_temperature: 15 + C, surface_temperature: 70 + C,
      ST_over_D: 31.3 / 16.4, SL_over_D: 34.3 / 16.4, arrangement: 'staggered', rows: 7, tubes_per_row: 8,
    },
  );
  const o = r.outputs;
  it('gives the outlet, ΔT_lm and heat rate of the example (properties at the mean temperature, the book at the inlet: 3 %)', () => {
    expect(Math.abs(o.outlet_temperature - (25.5 + C))).toBeLessThan(0.5);
    expect(rel(o.log_mean_temperature_difference, 49.6)).toBeLessThan(0.01);
    expect(rel(o.heat_rate, 19.4e3)).toBeLessThan(0.035);
    expect(rel(o.Nu, 87.9)).toBeLessThan(0.01);
    expect(o.surface_area).toBeCloseTo(56 * Math.PI * 0.0164, 12);
  });
  it('closes its own balance: ṁc_p(T_o − T_i) = h·A·ΔT_lm, and the outlet by the bank formula (Incropera eq. 7.64)', () => {
    const props = air.properties(o.mean_bulk_temperature);
    const mdot = air.properties(15 + C).rho * 6 * 8 * 0.0313 * 1;
    expect(o.mass_flow).toBeCloseTo(mdot, 12);
    expect(rel(o.heat_rate, mdot * props.cp * (o.outlet_temperature - (15 + C)))).toBeLessThan(1e-12);
    expect(rel(o.heat_rate, o.h * o.surface_area * o.log_mean_temperature_difference)).toBeLessThan(1e-6);
    const expo = Math.exp((-Math.PI * 0.0164 * 56 * o.h) / (mdot / (8 * 0.0313) * 8 * 0.0313 * props.cp));
    expect(Math.abs(o.outlet_temperature - (70 + C - 55 * expo))).toBeLessThan(1e-5);
  });
  it('gives the pressure drop within 10 % of the example (chart reading and χ ≈ 1.04 the example applies)', () => {
    expect(rel(o.pressure_drop, 246)).toBeLessThan(0.1);
    expect(o.pressure_drop_coefficient).toBeCloseTo(7 * o.f, 12);
    // S_T/S_L = 0.91 is 21 % off the chart's equilateral layout (1.155): χ is not applied, and it says so.
    expect(r.flags).toEqual(['out-of-chart:pitch_ratio']);
  });
  it('flags Re and pitch outside the charts', () => {
    const bank = getMethod('tube-bank', 'zukauskas-bank');
    expect(bank.evaluate({ Re: 50, Pr: 0.7, ST_over_D: 2.5, SL_over_D: 2.5 * Math.sqrt(3) / 2, arrangement: 'staggered' }).flags).toContain('out-of-chart:Re');
    expect(bank.evaluate({ Re: 1e4, Pr: 0.7, ST_over_D: 3, SL_over_D: 3, arrangement: 'aligned' }).flags).toContain('out-of-chart:pitch');
    expect(bank.evaluate({ Re: 1e4, Pr: 0.7, ST_over_D: 1.5, SL_over_D: 1.5, arrangement: 'aligned' }).flags).toEqual([]);
  });
  it('runs the balance per metre when the tube length is not given (no heat rate then)', () => {
    const [perMetre] = solvePoint(
      { configuration: 'tube-bank', methods: ['zukauskas-bank'], fluid: 'air' },
      { diameter: 0.0164, velocity: 6, fluid_temperature: 15 + C, surface_temperature: 70 + C, ST_over_D: 31.3 / 16.4, SL_over_D: 34.3 / 16.4, arrangement: 'staggered', rows: 7, tubes_per_row: 8 },
    );
    expect(perMetre.outputs.outlet_temperature).toBeCloseTo(o.outlet_temperature, 9);
    expect(perMetre.outputs.heat_rate).toBeUndefined();
  });
});

describe('consistent inputs', () => {
  it('refuses an over-specified point, naming both inputs', () => {
    const pipe = { configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' };
    const point = { diameter: 0.02, length: 2, fluid_temperature: 300, surface_temperature: 320 };
    expect(() => solvePoint(pipe, { ...point, velocity: 1, Re: 2e4 })).toThrow(/'velocity' and 'Re'/);
    expect(() => solvePoint(pipe, { ...point, velocity: 1, flow_rate: 3e-4 })).toThrow(/'flow_rate' and 'velocity'/);
    expect(() => solvePoint(pipe, { ...point, velocity: 1, Pr: 5 })).toThrow(/a fluid and 'Pr'/);
    expect(() => solvePoint(pipe, { ...point, velocity: 1, heat_flux: 1e4 })).toThrow(/'heat_flux' and 'surface_temperature'/);
  });
  it('refuses a pressure a liquid cannot use, uses it for water (boiling) and air (density)', () => {
    expect(() =>
      solvePoint({ configuration: 'pipe', methods: ['gnielinski'], fluid: 'engine-oil' }, { diameter: 0.02, velocity: 1, fluid_temperature: 320, pressure: 2e5 }),
    ).toThrow(/pressure/);
    const hot = { diameter: 0.02, length: 1, velocity: 1, fluid_temperature: 80 + C, surface_temperature: 110 + C };
    const plan = { configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' };
    // Saturation 373.124 K at 1 atm, 393.36 K at 2 bar (IAPWS-IF97, python3-iapws _TSat_P(0.1013), (0.2)).
    expect(solvePoint(plan, hot)[0].flags).toContain('boiling-possible');
    expect(solvePoint(plan, { ...hot, pressure: 2e5 })[0].flags).not.toContain('boiling-possible');
  });
  it('reads wall properties only for methods that need them: a wall outside the table flags only those', () => {
    const rows = compileSolver({ configuration: 'pipe', methods: ['sieder-tate', 'gnielinski'], fluid: 'engine-oil' })({
      diameter: 0.02, velocity: 3, fluid_temperature: 400, surface_temperature: 440,
    });
    expect(rows[0].flags).toEqual(['out-of-range:surface_temperature']);
    expect(rows[1].flags.filter((f) => f.startsWith('out-of-range'))).toEqual([]);
    expect(rows[1].outputs.Nu).toBeGreaterThan(0);
  });
  it('flags a non-finite output and leaves the number out (Hausen at Re = Pr = 1e300)', () => {
    const [r] = solvePoint({ configuration: 'pipe', methods: ['hausen'] }, { Re: 1e300, Pr: 1e300, L_over_D: 10 });
    expect(r.flags).toContain('non-finite:Nu');
    expect('Nu' in r.outputs).toBe(false);
    expect(JSON.stringify(r)).not.toMatch(/null|NaN/);
  });
  it('flags the boundary-layer lower bounds: Re_x < 1e3 (plates, similarity), Gr_x < 1e4 (free-convection similarity)', () => {
    expect(getMethod('flat-plate', 'similarity').evaluate({ Re: 500, Pr: 0.7 }).flags).toContain('out-of-range:Re');
    expect(getMethod('flat-plate', 'laminar').evaluate({ Re: 500, Pr: 0.7 }).flags).toContain('out-of-range:Re');
    expect(getMethod('vertical-plate', 'similarity').evaluate({ Gr: 5e3, Pr: 0.7 }).flags).toContain('out-of-range:Gr');
    expect(getMethod('vertical-plate', 'similarity').evaluate({ Gr: 5e4, Pr: 0.7 }).flags).toEqual([]);
  });
});

describe('viscous dissipation in dimensional similarity runs', () => {
  // Air at 300 K past a plate at 330 K at 300 m/s, 0.1 m from the leading edge.
  const plan = { configuration: 'flat-plate', methods: ['similarity'], fluid: 'air' };
  const point = { length: 0.1, velocity: 300, fluid_temperature: 300 };
  it('derives Ec from the velocity, c_p and the temperatures, so T_aw and Nu_x_freestream are real', () => {
    const [r] = solvePoint(plan, { ...point, surface_temperature: 330 });
    const o = r.outputs;
    const cp = air.properties(315).cp;
    expect(o.Ec).toBeCloseTo(300 ** 2 / (cp * 30), 9);
    expect(o.adiabatic_wall_excess).toBeCloseTo((o.recovery_factor * o.Ec) / 2, 12);
    // The identity (T_aw − T∞)/(T_s − T∞) = r·Ec/2 (Pohlhausen 1921), from the engine's own T_aw.
    expect(o.adiabatic_wall_excess).toBeCloseTo((o.adiabatic_wall_temperature - 300) / 30, 9);
    expect(o.adiabatic_wall_temperature).toBeGreaterThan(330); // this wall is heated by the flow
    expect(o.q).toBeLessThan(0);
    expect(o.Nu_x_freestream).toBeCloseTo(o.Nu_x * (1 - o.adiabatic_wall_excess), 9);
  });
  it('solves the heat-flux wall against the adiabatic wall temperature, T_s = T_aw + q/h', () => {
    const [r] = solvePoint(plan, { ...point, heat_flux: 2000 });
    const o = r.outputs;
    expect(o.surface_temperature).toBeCloseTo(o.adiabatic_wall_temperature + 2000 / o.h_x, 7);
    expect(o.q).toBeCloseTo(2000, 6);
  });
});

describe('radiation beside convection', () => {
  it('adds h_rad = εσ(T_s² + T_sur²)(T_s + T_sur) and the radiative flux (Incropera eqs. 1.7, 1.9)', () => {
    const [r] = solvePoint(
      { configuration: 'vertical-plate', methods: ['churchill-chu'], fluid: 'air' },
      { height: 0.5, width: 0.4, fluid_temperature: 300, surface_temperature: 340, emissivity: 0.8, surroundings_temperature: 290 },
    );
    const o = r.outputs;
    expect(o.q_radiation).toBeCloseTo(0.8 * 5.670374419e-8 * (340 ** 4 - 290 ** 4), 9);
    expect(o.h_radiation).toBeCloseTo(0.8 * 5.670374419e-8 * (340 ** 2 + 290 ** 2) * (340 + 290), 9);
    expect(o.q_total).toBeCloseTo(o.q + o.q_radiation, 9);
    expect(o.heat_rate_total).toBeCloseTo(o.q_total * 0.2, 9);
    expect(o.radiation_fraction).toBeCloseTo(o.q_radiation / o.q_total, 12);
  });

  it('solves the surface temperature of a radiating plate from the power it sheds; the balance closes to 1e-6', () => {
    // A 0.5 m × 0.5 m wall shedding 60 W, ε = 0.9, to 25 °C air and surroundings.
    const inputs = { height: 0.5, width: 0.5, fluid_temperature: 25 + C, heat_rate: 60, emissivity: 0.9 };
    const [r] = solvePoint({ configuration: 'vertical-plate', methods: ['churchill-chu'], fluid: 'air' }, inputs);
    const Ts = r.outputs.surface_temperature;
    // Independent re-evaluation at that T_s: film properties, Churchill–Chu, and the balance by hand.
    const film = air.properties((Ts + 25 + C) / 2);
    const Ra = (9.80665 * film.beta * (Ts - 25 - C) * 0.5 ** 3) / (film.nu * film.alpha);
    const Nu = getMethod('vertical-plate', 'churchill-chu').evaluate({ Ra, Pr: film.Pr }).outputs.Nu;
    const h = (Nu * film.k) / 0.5;
    const shed = h * (Ts - 25 - C) + 0.9 * STEFAN_BOLTZMANN * (Ts ** 4 - (25 + C) ** 4);
    expect(rel(shed, 60 / 0.25)).toBeLessThan(1e-6);
    expect(rel(r.outputs.heat_rate_total, 60)).toBeLessThan(1e-9);
    expect(r.outputs.heat_rate + r.outputs.heat_rate_radiation).toBeCloseTo(60, 6);
  });

  it('sheds the same power hotter without radiation, and refuses a heat rate without an area', () => {
    const plan = { configuration: 'vertical-plate', methods: ['churchill-chu'], fluid: 'air' };
    const withRad = solvePoint(plan, { height: 0.5, width: 0.5, fluid_temperature: 300, heat_rate: 60, emissivity: 0.9 })[0];
    const without = solvePoint(plan, { height: 0.5, width: 0.5, fluid_temperature: 300, heat_rate: 60 })[0];
    expect(without.outputs.surface_temperature).toBeGreaterThan(withRad.outputs.surface_temperature + 10);
    expect(without.outputs.q).toBeCloseTo(240, 6);
    expect(() => solvePoint(plan, { height: 0.5, fluid_temperature: 300, heat_rate: 60 })).toThrow(/heat_rate needs the surface area/);
    expect(() => solvePoint(plan, { height: 0.5, width: 0.5, fluid_temperature: 300, surface_temperature: 320, emissivity: 1.2 })).toThrow(/emissivity/);
  });

  it('is offered to external and free configurations only', () => {
    expect(() =>
      solvePoint({ configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' }, { diameter: 0.02, velocity: 1, fluid_temperature: 300, surface_temperature: 320, emissivity: 0.5 }),
    ).toThrow(/unknown input 'emissivity'/);
  });
});
