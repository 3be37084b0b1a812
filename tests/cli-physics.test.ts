// The physics commands as a user runs them: help, methods, fluid, solve, and their errors.
import { describe, expect, it } from 'vitest';
import { runCli } from './helpers/cli.js';

describe('filmsweep --help', () => {
  it('prints usage and exits 0', () => {
    const r = runCli(['--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Usage: filmsweep');
    for (const c of ['methods', 'fluid', 'solve']) expect(r.stdout).toContain(c);
  });
  it('an unknown command exits 1', () => {
    const r = runCli(['frobnicate']);
    expect(r.status).toBe(1);
  });
});

describe('filmsweep methods', () => {
  it('lists the catalogue as JSON with ranges, uncertainty and source', () => {
    const r = runCli(['methods', '--json']);
    expect(r.status).toBe(0);
    const data = JSON.parse(r.stdout);
    const ids = data.methods.map((m: { configuration: string; id: string }) => `${m.configuration}/${m.id}`);
    for (const id of [
      'flat-plate/similarity', 'wedge/similarity', 'vertical-plate/similarity',
      'flat-plate/laminar', 'flat-plate/churchill-ozoe', 'flat-plate/turbulent', 'flat-plate/mixed',
      'cylinder/churchill-bernstein', 'cylinder/hilpert', 'cylinder/zukauskas',
      'sphere/whitaker', 'sphere/ranz-marshall', 'tube-bank/zukauskas-bank',
      'pipe/laminar-developed', 'pipe/hausen', 'pipe/sieder-tate-laminar', 'pipe/dittus-boelter',
      'pipe/sieder-tate', 'pipe/gnielinski', 'vertical-plate/churchill-chu', 'vertical-plate/churchill-chu-laminar',
      'horizontal-plate/hot-side-up', 'horizontal-plate/hot-side-down',
      'horizontal-cylinder/churchill-chu', 'horizontal-cylinder/morgan', 'sphere-free/churchill',
    ]) expect(ids).toContain(id);
    for (const m of data.methods) {
      expect(m.source.length, `${m.configuration}/${m.id} source`).toBeGreaterThan(10);
      expect(m.uncertainty.fraction, `${m.configuration}/${m.id} uncertainty`).toBeGreaterThan(0);
      expect(m.version).toBeGreaterThanOrEqual(1);
      expect(m.outputs.length).toBeGreaterThan(0);
    }
  });
  it('filters by configuration and rejects an unknown one', () => {
    const r = runCli(['methods', '--configuration', 'pipe', '--json']);
    expect(r.status).toBe(0);
    const data = JSON.parse(r.stdout);
    expect(new Set(data.methods.map((m: { configuration: string }) => m.configuration))).toEqual(new Set(['pipe']));
    const bad = runCli(['methods', '--configuration', 'teapot']);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/unknown configuration 'teapot'; expected one of: .*pipe/);
    expect(bad.stderr).not.toMatch(/at .*\.js:\d+/); // no stack trace
  });
});

describe('filmsweep fluid', () => {
  it('prints the documented JSON keys in SI', () => {
    const r = runCli(['fluid', 'water', '--temperature', '80 degC', '--json']);
    expect(r.status).toBe(0);
    const p = JSON.parse(r.stdout);
    expect(Object.keys(p).sort()).toEqual(['Pr', 'alpha', 'beta', 'cp', 'fluid', 'k', 'mu', 'nu', 'rho', 'temperature'].sort());
    expect(p.fluid).toBe('water');
    expect(p.temperature).toBeCloseTo(353.15, 9);
    // IAPWS-95 at 353.15 K, 1 atm: ρ = 971.8 kg/m³ (Wagner & Pruß 2002; printed 4 figures, from memory).
    expect(p.rho).toBeGreaterThan(971.0);
    expect(p.rho).toBeLessThan(972.6);
    expect(p.nu).toBeCloseTo(p.mu / p.rho, 12);
  });
  it('refuses a temperature outside the range and an unknown fluid, exit 1', () => {
    const hot = runCli(['fluid', 'engine-oil', '--temperature', '900 K']);
    expect(hot.status).toBe(1);
    expect(hot.stderr).toMatch(/outside the range of fluid 'engine-oil'/);
    const unknown = runCli(['fluid', 'mercury-vapour', '--temperature', '300']);
    expect(unknown.status).toBe(1);
    expect(unknown.stderr).toMatch(/water/);
    const badUnit = runCli(['fluid', 'air', '--temperature', '3 m/s']);
    expect(badUnit.status).toBe(1);
    expect(badUnit.stderr).toMatch(/wrong dimension/);
  });
});

describe('filmsweep methods: the inputs and outputs of the engine per configuration', () => {
  it('lists the inlet convention, the radiation inputs and the new outputs', () => {
    const data = JSON.parse(runCli(['methods', '--json']).stdout);
    const conf = (id: string) => data.configurations.find((c: { id: string }) => c.id === id);
    expect(conf('pipe').conventions).toMatch(/INLET/);
    expect(conf('pipe').engineOutputs).toEqual(expect.arrayContaining(['outlet_temperature', 'mean_bulk_temperature', 'mass_flow', 'log_mean_temperature_difference', 'surface_temperature_outlet']));
    expect(conf('vertical-plate').engineInputs).toContain('emissivity');
    expect(conf('vertical-plate').dimensionalInputs).toEqual(expect.arrayContaining(['surroundings_temperature', 'heat_rate']));
    expect(conf('vertical-plate').engineOutputs).toEqual(expect.arrayContaining(['h_radiation', 'q_radiation', 'q_total', 'heat_rate_radiation', 'heat_rate_total', 'radiation_fraction']));
    expect(conf('tube-bank').engineInputs).toContain('tubes_per_row');
    const text = runCli(['methods', '--configuration', 'pipe']).stdout;
    expect(text).toMatch(/convention: fluid_temperature is the INLET/);
  });
});

describe('filmsweep solve', () => {
  it('solves how hot a radiating wall gets when it sheds a given power', () => {
    const r = runCli([
      'solve', 'vertical-plate', '--method', 'churchill-chu', '--fluid', 'air', '--set', 'height=0.6 m', '--set', 'width=0.75 m',
      '--set', 'fluid_temperature=25 degC', '--set', 'heat_rate=150 W', '--set', 'emissivity=0.9', '--json',
    ]);
    expect(r.status, r.stderr).toBe(0);
    const [row] = JSON.parse(r.stdout).rows;
    expect(row.outputs.heat_rate_total).toBeCloseTo(150, 6);
    expect(row.outputs.surface_temperature).toBeGreaterThan(298.15);
  });
  it('solves a dimensionless point with every method of the configuration', () => {
    const r = runCli(['solve', 'flat-plate', '--set', 'Re=1e5', '--set', 'Pr=0.7', '--json']);
    expect(r.status).toBe(0);
    const { rows } = JSON.parse(r.stdout);
    const methods = rows.map((x: { method: string }) => x.method);
    expect(methods).toContain('similarity');
    expect(methods).toContain('laminar');
    const sim = rows.find((x: { method: string }) => x.method === 'similarity');
    const lam = rows.find((x: { method: string }) => x.method === 'laminar');
    // Local similarity Nu_x = 0.29268 Re_x^½ at Pr = 0.7 (Pohlhausen 1921 table; from memory) vs the
    // correlation's 0.332 Re_x^½ Pr^⅓ = 0.2948 Re_x^½: the two agree within 1 %.
    expect(sim.outputs.Nu_x / Math.sqrt(1e5)).toBeCloseTo(0.29268, 4);
    expect(Math.abs(lam.outputs.Nu_x / sim.outputs.Nu_x - 1)).toBeLessThan(0.01);
    for (const row of rows) {
      expect(row.inputs).toEqual({ Re: 1e5, Pr: 0.7 });
      expect(Array.isArray(row.flags)).toBe(true);
    }
  });
  it("prints each output of its table with the output's SI unit", () => {
    const r = runCli([
      'solve', 'pipe', '--method', 'laminar-developed', '--fluid', 'water', '--set', 'velocity=0.01 m/s', '--set', 'diameter=10 mm',
      '--set', 'length=10 m', '--set', 'fluid_temperature=20 degC', '--set', 'surface_temperature=40 degC',
    ]);
    expect(r.status, r.stderr).toBe(0);
    const unitOf = (name: string) => new RegExp(`^${name}\\s+(\\S+)\\s`, 'm').exec(r.stdout)?.[1];
    expect(r.stdout).toMatch(/^output\s+unit\s+laminar-developed/m);
    expect([unitOf('heat_rate'), unitOf('h'), unitOf('outlet_temperature'), unitOf('mass_flow'), unitOf('pressure_drop'), unitOf('Nu')]).toEqual([
      'W', 'W/(m^2·K)', 'K', 'kg/s', 'Pa', '-',
    ]);
  });
  it('derives Re, Pr and h from a fluid and units', () => {
    const r = runCli([
      'solve', 'pipe', '--method', 'gnielinski', '--fluid', 'water',
      '--set', 'diameter=25 mm', '--set', 'length=2 m', '--set', 'velocity=1 m/s',
      '--set', 'fluid_temperature=40 degC', '--set', 'surface_temperature=60 degC', '--json',
    ]);
    expect(r.status, r.stderr).toBe(0);
    const [row] = JSON.parse(r.stdout).rows;
    expect(row.inputs.diameter).toBeCloseTo(0.025, 12);
    // 40 °C is the inlet: bulk properties at the mean of inlet and outlet.
    const Tm = row.outputs.mean_bulk_temperature;
    const props = JSON.parse(runCli(['fluid', 'water', '--temperature', String(Tm), '--json']).stdout);
    const inlet = JSON.parse(runCli(['fluid', 'water', '--temperature', '313.15', '--json']).stdout);
    expect(row.outputs.property_temperature).toBeCloseTo(Tm, 9);
    expect(row.outputs.Re).toBeCloseTo((inlet.rho * 1 * 0.025) / props.mu, 6);
    expect(row.outputs.h).toBeCloseTo((row.outputs.Nu * props.k) / 0.025, 6);
    expect(row.outputs.q).toBeCloseTo(row.outputs.h * row.outputs.log_mean_temperature_difference, 6);
    expect(row.outputs.heat_rate).toBeLessThan(row.outputs.mass_flow * props.cp * 20);
    expect(row.outputs.pressure_drop).toBeGreaterThan(0);
  });
  it('gives clear errors for bad input, exit 1, no stack trace', () => {
    const cases: [string[], RegExp][] = [
      [['solve', 'teapot'], /unknown configuration 'teapot'/],
      [['solve', 'pipe', '--method', 'magic', '--set', 'Re=1e4', '--set', 'Pr=1'], /unknown method 'magic'.*gnielinski/],
      [['solve', 'pipe', '--set', 'Re=lots', '--set', 'Pr=1'], /'Re' must be a finite number/],
      [['solve', 'pipe', '--set', 'diameter=3 kg'], /wrong dimension/],
      [['solve', 'pipe', '--fluid', 'unobtainium', '--set', 'Re=1e4'], /unknown fluid|unobtainium/],
      [['solve', 'pipe', '--set', 'Re'], /expected NAME=VALUE/],
      [['solve', 'pipe', '--set', 'Reynolds=1e4', '--set', 'Pr=1'], /unknown input 'Reynolds'/],
      [['solve', 'pipe', '--method', 'gnielinski', '--set', 'Pr=1'], /missing input.*Re|needs.*Re/],
      [['solve', 'pipe', '--fluid', 'water', '--method', 'gnielinski', '--set', 'diameter=25 mm',
        '--set', 'velocity=1 m/s', '--set', 'fluid_temperature=500 degC'], /outside the range of fluid 'water'/],
      // Over-specified points name both inputs.
      [['solve', 'pipe', '--fluid', 'water', '--method', 'gnielinski', '--set', 'diameter=25 mm', '--set', 'velocity=1 m/s',
        '--set', 'Re=2e4', '--set', 'fluid_temperature=40 degC'], /over-specified point: 'velocity' and 'Re' both given/],
      [['solve', 'vertical-plate', '--fluid', 'air', '--set', 'height=0.5 m', '--set', 'fluid_temperature=20 degC',
        '--set', 'surface_temperature=40 degC', '--set', 'heat_flux=100 W/m^2'], /'heat_flux' and 'surface_temperature' both given/],
      [['solve', 'pipe', '--fluid', 'water', '--set', 'diameter=25 mm', '--set', 'velocity=1 m/s',
        '--set', 'fluid_temperature=40 degC', '--set', 'surroundings_temperature=20 degC'], /has no meaning for configuration 'pipe'/],
    ];
    for (const [args, pattern] of cases) {
      const r = runCli(args);
      expect(r.status, `${args.join(' ')}: ${r.stderr}`).toBe(1);
      expect(r.stderr, args.join(' ')).toMatch(pattern);
      expect(r.stderr).not.toMatch(/\n\s+at /);
    }
  }, 180_000); // a dozen CLI starts
});
