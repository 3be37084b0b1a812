// The dimensional engine: derived groups, property temperatures, h/q/heat rate, and
// the rules for which temperature is used. Checks are identities (the engine must
// reproduce by hand what the method and fluid give) plus worked examples named inline.
import { describe, expect, it } from 'vitest';
import { compileSolver, derivableInputs, missingInputs, solvePoint, unknownInputs } from '../shared/physics/engine.js';
import { getMethod } from '../shared/physics/catalogue.js';
import { getFluid } from '../shared/physics/fluids/index.js';

const water = getFluid('water');
const air = getFluid('air');

describe('forced internal flow (pipe)', () => {
  // fluid_temperature is the inlet; bulk properties at the mean of inlet and outlet (the
  // balance itself is tested in engine-balances.test.ts).
  const inputs = { diameter: 0.025, length: 2, velocity: 1, fluid_temperature: 313.15, surface_temperature: 333.15 };
  const [row] = solvePoint({ configuration: 'pipe', methods: ['sieder-tate'], fluid: 'water' }, inputs);
  const Tm = row.outputs.mean_bulk_temperature;
  const bulk = water.properties(Tm);
  const wall = water.properties(333.15);

  it('reads properties at the mean bulk temperature and the wall for μ_s', () => {
    expect(Tm).toBeGreaterThan(313.15);
    expect(Tm).toBeCloseTo((313.15 + row.outputs.outlet_temperature) / 2, 6);
    expect(row.outputs.property_temperature).toBe(Tm);
    expect(row.outputs.Re).toBeCloseTo((water.properties(313.15).rho * 1 * 0.025) / bulk.mu, 6);
    expect(row.outputs.Pr).toBeCloseTo(bulk.Pr, 12);
    expect(row.outputs.viscosity_ratio).toBeCloseTo(bulk.mu / wall.mu, 12);
    expect(row.outputs.L_over_D).toBeCloseTo(80, 12);
  });
  it('is the dimensionless method evaluated at the derived groups', () => {
    const direct = getMethod('pipe', 'sieder-tate').evaluate({
      Re: row.outputs.Re, Pr: row.outputs.Pr, viscosity_ratio: row.outputs.viscosity_ratio, L_over_D: 80,
    });
    expect(row.outputs.Nu).toBe(direct.outputs.Nu);
    expect(row.outputs.h).toBeCloseTo((direct.outputs.Nu * bulk.k) / 0.025, 9);
    expect(row.outputs.heat_rate).toBeCloseTo(row.outputs.h * Math.PI * 0.025 * 2 * row.outputs.log_mean_temperature_difference, 6);
    // Δp = f·(L/D)·G²/(2ρ_m), G = ρ_in·u the mass flux of the stream.
    const G = water.properties(313.15).rho * 1;
    expect(row.outputs.pressure_drop).toBeCloseTo((direct.outputs.f * 80 * G * G) / (2 * bulk.rho), 6);
  });
  it('turns a volumetric flow rate into the mean velocity', () => {
    const Q = 1 * (Math.PI * 0.025 ** 2) / 4;
    const { velocity: _v, ...rest } = inputs;
    const [byFlow] = solvePoint({ configuration: 'pipe', methods: ['sieder-tate'], fluid: 'water' }, { ...rest, flow_rate: Q });
    expect(byFlow.outputs.Re).toBeCloseTo(row.outputs.Re, 8);
  });
});

describe('external flow and free convection', () => {
  it('uses the film temperature for Churchill–Bernstein, the free stream for Žukauskas', () => {
    const rows = solvePoint(
      { configuration: 'cylinder', methods: ['churchill-bernstein', 'zukauskas'], fluid: 'air' },
      { diameter: 0.0127, length: 0.094, velocity: 10, fluid_temperature: 299.35, surface_temperature: 401.55 },
    );
    expect(rows[0].outputs.property_temperature).toBeCloseTo((299.35 + 401.55) / 2, 9);
    expect(rows[1].outputs.property_temperature).toBeCloseTo(299.35, 9);
    // Incropera et al. 6th ed., Example 7.4 (from memory): Re_D = 6071 at the film temperature
    // 350 K (ν = 20.92e-6 m²/s), Churchill–Bernstein Nu_D = 40.6; the book
    // rounds its properties to a 350 K table row, we read them at 350.45 K.
    expect(rows[0].outputs.Re).toBeGreaterThan(6071 * 0.98);
    expect(rows[0].outputs.Re).toBeLessThan(6071 * 1.02);
    expect(rows[0].outputs.Nu).toBeGreaterThan(40.6 * 0.98);
    expect(rows[0].outputs.Nu).toBeLessThan(40.6 * 1.02);
    // The book's h from Churchill–Bernstein: 40.6 × 0.030 W/(m·K) / 12.7 mm = 95.9 W/(m²·K).
    expect(rows[0].outputs.h).toBeGreaterThan(95.9 * 0.97);
    expect(rows[0].outputs.h).toBeLessThan(95.9 * 1.03);
  });
  it('derives Gr and Ra from β at the film temperature', () => {
    const [row] = solvePoint(
      { configuration: 'vertical-plate', methods: ['churchill-chu'], fluid: 'air' },
      { height: 0.71, width: 1.02, fluid_temperature: 296.15, surface_temperature: 505.15 },
    );
    const p = air.properties((296.15 + 505.15) / 2);
    const Gr = (9.80665 * p.beta * (505.15 - 296.15) * 0.71 ** 3) / p.nu ** 2;
    expect(row.outputs.Gr).toBeCloseTo(Gr, 0);
    expect(row.outputs.Ra / Gr).toBeCloseTo(p.Pr, 12);
    // Incropera et al. 6th ed., Example 9.2 (glass fireplace door; from memory): Ra_L ≈ 1.8e9, Nu_L ≈ 147.
    expect(row.outputs.Ra).toBeGreaterThan(1.7e9);
    expect(row.outputs.Ra).toBeLessThan(1.95e9);
    expect(row.outputs.Nu).toBeGreaterThan(147 * 0.97);
    expect(row.outputs.Nu).toBeLessThan(147 * 1.03);
    expect(row.outputs.heat_rate).toBeCloseTo(row.outputs.h * 209 * 0.71 * 1.02, 6);
  });
  it('solves a given heat flux for the surface temperature (fixed point)', () => {
    const plan = { configuration: 'vertical-plate', methods: ['churchill-chu'], fluid: 'air' };
    const [row] = solvePoint(plan, { height: 0.5, fluid_temperature: 300, heat_flux: 200 });
    const Ts = row.outputs.surface_temperature;
    expect(row.flags).not.toContain('not-converged');
    const [check] = solvePoint(plan, { height: 0.5, fluid_temperature: 300, surface_temperature: Ts });
    expect(check.outputs.h * (Ts - 300)).toBeCloseTo(200, 4);
  });
});

describe('sweeps keep going where a single solve stops', () => {
  it('flags a property temperature outside the fluid range in non-strict mode', () => {
    const solve = compileSolver({ configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' });
    const [row] = solve({ diameter: 0.02, velocity: 1, fluid_temperature: 700 });
    expect(row.flags).toEqual(['out-of-range:property_temperature']);
    expect(row.outputs).toEqual({});
    expect(() => solvePoint({ configuration: 'pipe', methods: ['gnielinski'], fluid: 'water' }, { diameter: 0.02, velocity: 1, fluid_temperature: 700 })).toThrow(/outside the range/);
  });
  it('flags a method that refuses the point (Gnielinski on a duct\'s D_h below Re = 1000)', () => {
    // (The pipe's gnielinski gives his laminar composite there since version 3.)
    const solve = compileSolver({ configuration: 'duct', methods: ['turbulent-rectangular'] });
    const [row] = solve({ Re: 500, Pr: 5 });
    expect(row.flags).toEqual(['domain-error']);
  });
});

describe('validation helpers', () => {
  it('knows what it can derive', () => {
    const d = derivableInputs('pipe', ['velocity', 'diameter', 'length', 'fluid_temperature', 'surface_temperature'], true);
    for (const n of ['Re', 'Pr', 'Pr_s', 'viscosity_ratio', 'L_over_D']) expect(d.has(n)).toBe(true);
    expect(derivableInputs('pipe', ['velocity', 'diameter'], false).size).toBe(0);
  });
  it('reports missing and unknown inputs', () => {
    expect(missingInputs({ configuration: 'pipe', methods: ['gnielinski'] }, ['Pr'])).toEqual([{ method: 'gnielinski', missing: ['Re'] }]);
    expect(unknownInputs({ configuration: 'pipe' }, ['Re', 'Reynold'])).toEqual(['Reynold']);
  });
  it('runs only the applicable methods when none is named', () => {
    const rows = solvePoint({ configuration: 'pipe' }, { Re: 5e4, Pr: 3 });
    const ids = rows.map((r) => r.method);
    expect(ids).toContain('gnielinski');
    expect(ids).not.toContain('hausen'); // needs L_over_D
  });
});
