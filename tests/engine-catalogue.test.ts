// The dimensional side of the newer configurations: sizes → characteristic length, areas and
// the groups their methods take; the heat sink's fin efficiency, heat rates and thermal
// resistance. Checks are hand balances with the engine's own fluid properties, plus the
// Çengel & Ghajar heat-sink example (named inline, from memory).
import { describe, expect, it } from 'vitest';
import { getMethod } from '../shared/physics/catalogue.js';
import { missingInputs, solvePoint } from '../shared/physics/engine.js';
import { getFluid } from '../shared/physics/fluids/index.js';
import { STEFAN_BOLTZMANN } from '../shared/physics/radiation.js';
import { InputError, type Inputs } from '../shared/physics/types.js';

const air = getFluid('air');
const water = getFluid('water');
const G = 9.80665;
const one = (configuration: string, fluid: string, method: string, inputs: Inputs) => solvePoint({ configuration, fluid, methods: [method] }, inputs)[0];
const relErr = (value: number, reference: number) => Math.abs(value / reference - 1);

describe('annulus', () => {
  const base = { inner_diameter: 0.016, outer_diameter: 0.028, length: 1.2, fluid_temperature: 288.15 };

  it('D_h = D_o − D_i, D_i/D_o and the annular flow area; the heated wall sets the heated area', () => {
    const inner = one('annulus', 'water', 'laminar-annulus', { ...base, velocity: 0.05, surface_temperature: 330 });
    const Dh = 0.012;
    expect(inner.outputs.diameter_ratio).toBeCloseTo(16 / 28, 14);
    expect(inner.outputs.L_over_D).toBeCloseTo(1.2 / Dh, 10);
    const rhoIn = water.properties(288.15).rho;
    const area = (Math.PI / 4) * (0.028 ** 2 - 0.016 ** 2);
    expect(inner.outputs.mass_flow).toBeCloseTo(rhoIn * 0.05 * area, 12);
    const bulk = water.properties(inner.outputs.mean_bulk_temperature);
    expect(inner.outputs.Re).toBeCloseTo((rhoIn * 0.05 * Dh) / bulk.mu, 8);
    expect(inner.outputs.h).toBeCloseTo((inner.outputs.Nu * bulk.k) / Dh, 9);
    expect(inner.outputs.surface_area).toBeCloseTo(Math.PI * 0.016 * 1.2, 12);
    // The balance: the stream carries what the heated wall gives, ṁ c_p (T_out − T_in) = h A ΔT_lm.
    expect(inner.outputs.heat_rate).toBeCloseTo(inner.outputs.h * inner.outputs.surface_area * inner.outputs.log_mean_temperature_difference, 6);
    const outer = one('annulus', 'water', 'laminar-annulus', { ...base, velocity: 0.05, surface_temperature: 330, heated_wall: 'outer' });
    expect(outer.outputs.surface_area).toBeCloseTo(Math.PI * 0.028 * 1.2, 12);
    // The method at the derived groups (its own wall: the outer table).
    const direct = getMethod('annulus', 'laminar-annulus').evaluate({ Re: outer.outputs.Re, diameter_ratio: 16 / 28, heated_wall: 'outer' });
    expect(outer.outputs.Nu).toBe(direct.outputs.Nu);
  });

  it('a heat flux on the heater rod: heat_rate = q″·π·D_i·L and the flux form of the table', () => {
    const r = one('annulus', 'water', 'laminar-annulus', { ...base, velocity: 0.05, heat_flux: 5000 });
    expect(r.outputs.heat_rate).toBeCloseTo(5000 * Math.PI * 0.016 * 1.2, 8);
    const flux = getMethod('annulus', 'laminar-annulus').evaluate({ Re: r.outputs.Re, diameter_ratio: 16 / 28, wall_condition: 'flux' });
    expect(r.outputs.Nu).toBe(flux.outputs.Nu);
    expect(r.outputs.surface_temperature).toBeGreaterThan(r.outputs.mean_bulk_temperature);
  });

  it('refuses an inner diameter that does not fit', () => {
    expect(() => one('annulus', 'water', 'laminar-annulus', { ...base, inner_diameter: 0.03, velocity: 0.05, surface_temperature: 330 })).toThrow(InputError);
  });
});

describe('parallel-plates', () => {
  const base = { gap: 0.01, width: 0.3, length: 1, velocity: 5, fluid_temperature: 300, surface_temperature: 350 };
  it('D_h = 2·gap; the flow area gap·width; heated area 2·width·length or width·length', () => {
    const both = one('parallel-plates', 'air', 'turbulent-parallel-plates', base);
    expect(both.outputs.L_over_D).toBeCloseTo(50, 12);
    expect(both.outputs.mass_flow).toBeCloseTo(air.properties(300).rho * 5 * 0.01 * 0.3, 12);
    expect(both.outputs.surface_area).toBeCloseTo(0.6, 12);
    const bulk = air.properties(both.outputs.mean_bulk_temperature);
    expect(both.outputs.Re).toBeCloseTo((air.properties(300).rho * 5 * 0.02) / bulk.mu, 8);
    const oneWall = one('parallel-plates', 'air', 'turbulent-parallel-plates', { ...base, heated_walls: 'one' });
    expect(oneWall.outputs.surface_area).toBeCloseTo(0.3, 12);
    expect(oneWall.outputs.heat_rate).toBeLessThan(both.outputs.heat_rate);
  });
  it('needs the width for an energy balance over a length', () => {
    const { width: _w, ...noWidth } = base;
    expect(() => one('parallel-plates', 'air', 'turbulent-parallel-plates', noWidth)).toThrow(/needs input 'width'/);
  });
});

describe('vertical-channel', () => {
  const inputs = { gap: 0.008, height: 0.2, width: 0.1, fluid_temperature: 300, surface_temperature: 350 };
  it('Ra on the gap at the film temperature, S/L, heat rate over both plates and the optimum gap in metres', () => {
    const r = one('vertical-channel', 'air', 'bar-cohen-rohsenow', inputs);
    const p = air.properties(325);
    expect(r.outputs.property_temperature).toBe(325);
    expect(r.outputs.Ra).toBeCloseTo((G * p.beta * 50 * 0.008 ** 3) / (p.nu * p.alpha), 6);
    expect(r.outputs.gap_over_height).toBeCloseTo(0.04, 14);
    expect(r.outputs.heat_rate).toBeCloseTo(r.outputs.h * 2 * 0.2 * 0.1 * 50, 10);
    expect(r.outputs.optimum_gap).toBeCloseTo(r.outputs.optimum_gap_over_height * 0.2, 14);
    // S_opt = 2.714 L Ra_L^−¼ with Ra_L on the height (Bar-Cohen & Rohsenow).
    const RaL = (G * p.beta * 50 * 0.2 ** 3) / (p.nu * p.alpha);
    expect(r.outputs.optimum_gap).toBeCloseTo(2.714 * 0.2 * RaL ** -0.25, 9);
  });
  it('refuses an emissivity: facing plates radiate to each other, not modelled', () => {
    expect(() => one('vertical-channel', 'air', 'elenbaas', { ...inputs, emissivity: 0.9 })).toThrow(/radiation between facing plates/);
  });
  it('the study checks know which groups the sizes give', () => {
    const plan = { configuration: 'vertical-channel', fluid: 'air' };
    expect(missingInputs(plan, Object.keys(inputs))).toEqual([]);
    expect(missingInputs(plan, ['gap', 'fluid_temperature', 'surface_temperature'])).toEqual([
      { method: 'elenbaas', missing: ['gap_over_height'] },
      { method: 'bar-cohen-rohsenow', missing: ['gap_over_height'] },
    ]);
  });
});

describe('plate-fin-heat-sink', () => {
  // Çengel & Ghajar, Heat and Mass Transfer, ch. 9, "optimum fin spacing of a heat sink" (from
  // memory): 12 cm × 18 cm base at 80 °C in 30 °C air, fins 1 mm thick, 24 mm high, 18 cm long
  // (vertical): S_opt = 7.45 mm, 14 fins, h = 4.86 W/m²K, Q = h·(2nLH)·ΔT = 29.4 W (fin faces only,
  // fin efficiency 1). Air properties at 55 °C in the book: k = 0.02772 W/m·K, ν = 1.847e-5 m²/s.
  const sink = {
    fin_count: 14,
    fin_height: 0.024,
    fin_thickness: 0.001,
    gap: 0.00745,
    length: 0.18,
    fin_conductivity: 200,
    fluid_temperature: 303.15,
    surface_temperature: 353.15,
  };
  const r = one('plate-fin-heat-sink', 'air', 'bar-cohen-rohsenow', sink);

  it('reproduces the example: S_opt = 7.45 mm and h = 4.86 W/m²K within the 2 % our air properties differ by', () => {
    expect(relErr(r.outputs.optimum_gap, 0.00745)).toBeLessThan(0.02);
    expect(relErr(r.outputs.h, 4.86)).toBeLessThan(0.02);
    expect(r.outputs.base_width).toBeCloseTo(14 * 0.001 + 13 * 0.00745, 12);
  });

  it('heat rate: the example\'s fin faces, plus the fin tips (L_c = H + t/2) and the base between fins, times the efficiencies', () => {
    const faces = r.outputs.h * 2 * 14 * 0.18 * 0.024 * 50; // the book's Q with our h
    expect(relErr(faces, 29.4)).toBeLessThan(0.02);
    const tips = r.outputs.h * 2 * 14 * 0.18 * 0.0005 * 50;
    const base = r.outputs.h * 13 * 0.00745 * 0.18 * 50;
    expect(r.outputs.heat_rate).toBeCloseTo(r.outputs.fin_efficiency * (faces + tips) + base, 9);
    // Aluminium fins 24 mm high: m L_c = (2h/(k t))^½·24.5 mm ≈ 0.17, η_f ≈ 0.99.
    expect(r.outputs.fin_parameter).toBeCloseTo(Math.sqrt((2 * r.outputs.h) / (200 * 0.001)) * 0.0245, 12);
    expect(r.outputs.fin_efficiency).toBeGreaterThan(0.98);
    expect(r.outputs.heat_rate_total).toBe(r.outputs.heat_rate);
    expect(r.outputs.thermal_resistance).toBeCloseTo(50 / r.outputs.heat_rate, 12);
  });

  it('with an emissivity: radiation from the envelope at the base temperature', () => {
    const hot = one('plate-fin-heat-sink', 'air', 'bar-cohen-rohsenow', { ...sink, emissivity: 0.85, surroundings_temperature: 293.15 });
    const envelope = r.outputs.base_width * 0.18 + 2 * 0.024 * 0.18;
    const radiated = 0.85 * STEFAN_BOLTZMANN * (353.15 ** 4 - 293.15 ** 4) * envelope;
    expect(hot.outputs.radiating_area).toBeCloseTo(envelope, 12);
    expect(hot.outputs.heat_rate_radiation).toBeCloseTo(radiated, 9);
    expect(hot.outputs.heat_rate_total).toBeCloseTo(hot.outputs.heat_rate + radiated, 9);
    expect(hot.outputs.radiation_fraction).toBeCloseTo(radiated / hot.outputs.heat_rate_total, 12);
    expect(hot.outputs.thermal_resistance).toBeCloseTo(50 / hot.outputs.heat_rate_total, 12);
  });

  it('forced flow: Re on the gap with the channel velocity V(1 + t/S) for the developing-channel method', () => {
    const f = one('plate-fin-heat-sink', 'air', 'teertstra', { ...sink, velocity: 2 });
    const p = air.properties(328.15);
    const channel = 2 * (1 + 0.001 / 0.00745);
    expect(f.outputs.channel_velocity).toBeCloseTo(channel, 12);
    expect(f.outputs.Re).toBeCloseTo((channel * 0.00745) / p.nu, 8);
    expect(f.outputs.Re_star).toBeCloseTo(f.outputs.Re * (0.00745 / 0.18), 8);
    expect(f.outputs.h).toBeGreaterThan(3 * r.outputs.h);
  });

  it('asks for the base temperature instead of a power, and for every size', () => {
    const { surface_temperature: _t, ...noTemperature } = sink;
    expect(() => one('plate-fin-heat-sink', 'air', 'bar-cohen-rohsenow', { ...noTemperature, heat_rate: 30 })).toThrow(/give the base temperature/);
    const { fin_conductivity: _k, ...noConductivity } = sink;
    expect(() => one('plate-fin-heat-sink', 'air', 'bar-cohen-rohsenow', noConductivity)).toThrow(/fin_conductivity/);
    expect(() => one('plate-fin-heat-sink', 'air', 'bar-cohen-rohsenow', { ...sink, fin_count: 1 })).toThrow(/fin_count/);
  });
});

describe('enclosure', () => {
  const window = { gap: 0.025, height: 0.8, width: 2, fluid_temperature: 275.15, surface_temperature: 285.15 };
  it('Ra on the gap with ΔT between the walls, properties at their mean, heat across height × width', () => {
    const r = one('enclosure', 'air', 'macgregor-emery', window);
    const p = air.properties(280.15);
    expect(r.outputs.property_temperature).toBeCloseTo(280.15, 12);
    expect(r.outputs.Ra).toBeCloseTo((G * p.beta * 10 * 0.025 ** 3) / (p.nu * p.alpha), 6);
    expect(r.outputs.height_over_gap).toBeCloseTo(32, 12);
    expect(r.outputs.heat_rate).toBeCloseTo((r.outputs.Nu * p.k * 10 * 0.8 * 2) / 0.025, 9);
  });
  it('a given heat rate with the walls\' effective emissivity: the hot wall temperature follows', () => {
    const { surface_temperature: _t, ...cold } = window;
    const r = one('enclosure', 'air', 'macgregor-emery', { ...cold, heat_rate: 30, emissivity: 0.8 });
    expect(r.outputs.heat_rate_total).toBeCloseTo(30, 6);
    const Th = r.outputs.surface_temperature;
    expect(r.outputs.heat_rate_radiation).toBeCloseTo(0.8 * STEFAN_BOLTZMANN * (Th ** 4 - 275.15 ** 4) * 1.6, 6);
  });
});

describe('inclined-plate and impinging-jet', () => {
  it('inclined plate: Ra on the length along the slope, W/L for the hot-side-up rule', () => {
    const r = one('inclined-plate', 'air', 'churchill-chu', { length: 0.5, width: 0.25, fluid_temperature: 300, surface_temperature: 340, tilt: 30, hot_side: 'up' });
    expect(r.outputs.width_over_length).toBeCloseTo(0.5, 14);
    expect(r.outputs.heat_rate).toBeCloseTo(r.outputs.h * 0.125 * 40, 10);
    expect(r.outputs.h).toBeCloseTo((r.outputs.Nu * air.properties(320).k) / 0.5, 10);
  });
  it('single jet: H/D and r/D from the sizes, heat over the disc of radius r', () => {
    const r = one('impinging-jet', 'air', 'martin', { diameter: 0.01, height: 0.05, radius: 0.04, velocity: 20, fluid_temperature: 300, surface_temperature: 350 });
    expect(r.outputs.H_over_D).toBeCloseTo(5, 12);
    expect(r.outputs.r_over_D).toBeCloseTo(4, 12);
    expect(r.outputs.Re).toBeCloseTo((20 * 0.01) / air.properties(325).nu, 8);
    expect(r.outputs.surface_area).toBeCloseTo(Math.PI * 0.04 ** 2, 14);
  });
  it('jet array: S/D from the pitch, heat over length × width', () => {
    const r = one('impinging-jet', 'air', 'martin', {
      diameter: 0.01, height: 0.05, pitch: 0.06, length: 0.3, width: 0.3, nozzles: 'hexagonal-array', velocity: 20, fluid_temperature: 300, surface_temperature: 350,
    });
    expect(r.outputs.pitch_over_D).toBeCloseTo(6, 12);
    expect(r.outputs.nozzle_area_ratio).toBeCloseTo(Math.PI / (2 * Math.sqrt(3) * 36), 12);
    expect(r.outputs.surface_area).toBeCloseTo(0.09, 14);
  });
});

describe('liquid metals in a pipe (sodium)', () => {
  const pipe = { diameter: 0.02, length: 2, velocity: 2, fluid_temperature: 673.15 };
  it('a heat flux selects Skupinski and flags Seban–Shimazaki (uniform wall temperature only)', () => {
    const rows = solvePoint({ configuration: 'pipe', fluid: 'sodium', methods: ['skupinski', 'seban-shimazaki'] }, { ...pipe, heat_flux: 2e5 });
    expect(rows[0].flags).toEqual([]);
    expect(rows[0].outputs.Pe).toBeCloseTo(rows[0].outputs.Re * rows[0].outputs.Pr, 9);
    expect(rows[0].outputs.heat_rate).toBeCloseTo(2e5 * Math.PI * 0.02 * 2, 6);
    expect(rows[1].flags).toContain('no-flux-form');
  });
  it('a wall temperature: Seban–Shimazaki, h = Nu·k/D at the mean bulk temperature', () => {
    const [r] = solvePoint({ configuration: 'pipe', fluid: 'sodium', methods: ['seban-shimazaki'] }, { ...pipe, surface_temperature: 723.15 });
    const k = getFluid('sodium').properties(r.outputs.mean_bulk_temperature).k;
    expect(r.outputs.h).toBeCloseTo((r.outputs.Nu * k) / 0.02, 9);
    expect(r.outputs.Nu).toBeCloseTo(5 + 0.025 * r.outputs.Pe ** 0.8, 12);
    expect(r.flags).toEqual([]);
  });
});
