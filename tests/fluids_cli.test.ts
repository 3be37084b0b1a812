// The new fluids as a user meets them on the command line: `filmsweep fluid` (listing and one
// fluid with its parameters) and `solve --fluid … --concentration`. Spawns the built CLI.
import { describe, expect, it } from 'vitest';
import { resolveFluidSpec } from '../shared/physics/fluids/index.js';
import { runCli } from './helpers/cli.js';

describe('filmsweep fluid', () => {
  it('lists every fluid with its range and parameters when given no name', () => {
    const r = runCli(['fluid']);
    expect(r.status).toBe(0);
    for (const name of ['air', 'water', 'sodium', 'ethylene-glycol-water', 'propylene-glycol-water', 'humid-air']) {
      expect(r.stdout).toContain(name);
    }
    expect(r.stdout).toMatch(/propylene-glycol-water\s+freezing point \(-3\.3 °C at 10 %, -51\.1 °C at 60 %\) to 100 °C\s+concentration 10 % to 60 % by mass/);
    expect(r.stdout).toMatch(/sodium\s+371 K \(97\.85 °C\) to 1100 K/);
    const json = JSON.parse(runCli(['fluid', '--json']).stdout) as { fluids: { name: string; source: string }[] };
    expect(json.fluids.find((f) => f.name === 'humid-air')?.source).toMatch(/IAPWS G8-10/);
  });

  it('gives a glycol solution at a concentration and temperature', () => {
    const r = runCli(['fluid', 'propylene-glycol-water', '--concentration', '40%', '--temperature', '20degC', '--json']);
    expect(r.status).toBe(0);
    const p = JSON.parse(r.stdout);
    expect(p).toMatchObject({ fluid: 'propylene-glycol-water', concentration: 0.4, temperature: 293.15 });
    expect(p.Pr).toBeCloseTo(resolveFluidSpec({ name: 'propylene-glycol-water', concentration: 0.4 }).properties(293.15).Pr, 9);
    const text = runCli(['fluid', 'propylene-glycol-water', '--concentration', '40 %', '-t', '20 degC']);
    expect(text.stdout).toContain('Propylene glycol–water solution, 40 % by mass at 293.15 K (20 °C)');
    expect(text.stdout).toMatch(/valid 252\.05–373\.15 K; data: Conde/);
  });

  it('gives humid air at a relative humidity and pressure (default 1 atm)', () => {
    const r = runCli(['fluid', 'humid-air', '--relative-humidity', '60%', '--pressure', '85 kPa', '-t', '30degC', '--json']);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ fluid: 'humid-air', relative_humidity: 0.6, pressure: 85000 });
    const atm = JSON.parse(runCli(['fluid', 'humid-air', '--relative-humidity', '0.6', '-t', '303.15', '--json']).stdout);
    expect(atm.pressure).toBe(101325);
  });

  it.each([
    [['fluid', 'propylene-glycol-water', '-t', '20degC'], /is a mixture: give its concentration .*--concentration 40%/],
    [['fluid', 'propylene-glycol-water', '--concentration', '70%', '-t', '20degC'], /concentration 70 % is outside 10 % to 60 % by mass/],
    [['fluid', 'propylene-glycol-water', '--concentration', '40', '-t', '20degC'], /--concentration: 40 reads as a fraction \(4000 %\); write 40% or 0\.4/],
    [['fluid', 'propylene-glycol-water', '--concentration', '40%', '-t', '-30degC'], /the 40 % solution freezes at 252\.05 K \(-21\.1 °C\)/],
    [['fluid', 'water', '--pressure', '2 bar', '-t', '300'], /--pressure applies to humid-air only/],
    [['fluid', 'water'], /required option '-t, --temperature <T>' not specified/],
  ])('refuses %j with exit 1 and the reason', (args, message) => {
    const r = runCli(args as string[]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(message);
    expect(r.stdout).toBe('');
  });
});

describe('filmsweep solve with a mixture', () => {
  const base = ['solve', 'pipe', '--method', 'gnielinski', '--set', 'diameter=28 mm', '--set', 'velocity=1.5 m/s', '--set', 'length=6 m'];
  it('takes --fluid propylene-glycol-water --concentration 40%', () => {
    const r = runCli([...base, '--set', 'fluid_temperature=20 degC', '--set', 'surface_temperature=50 degC', '--fluid', 'propylene-glycol-water', '--concentration', '40%', '--json']);
    expect(r.status).toBe(0);
    const [row] = JSON.parse(r.stdout).rows;
    // The demo study's hand calculation at the mean bulk temperature (the inlet is 20 °C).
    expect(row.outputs.Re).toBeCloseTo(12275, -1);
    expect(row.outputs.h).toBeCloseTo(2518, -1);
    expect(row.outputs.outlet_temperature).toBeCloseTo(302.471, 2);
  });

  it('refuses a mixture without its concentration, and the flag without a fluid', () => {
    const none = runCli([...base, '--set', 'fluid_temperature=20 degC', '--fluid', 'ethylene-glycol-water']);
    expect(none.status).toBe(1);
    expect(none.stderr).toMatch(/fluid 'ethylene-glycol-water' is a mixture: give its concentration/);
    const orphan = runCli([...base, '--set', 'Re=1e4', '--set', 'Pr=7', '--concentration', '40%']);
    expect(orphan.status).toBe(1);
    expect(orphan.stderr).toMatch(/give --fluid too/);
  });

  it('gives humid air the --set pressure (its composition and density follow it)', () => {
    const plate = ['solve', 'flat-plate', '--method', 'laminar', '--set', 'length=0.3 m', '--set', 'velocity=2 m/s', '--set', 'fluid_temperature=40 degC', '--set', 'surface_temperature=60 degC', '--fluid', 'humid-air', '--relative-humidity', '80%', '--json'];
    const atm = JSON.parse(runCli(plate).stdout).rows[0];
    const low = JSON.parse(runCli([...plate, '--set', 'pressure=70 kPa']).stdout).rows[0];
    const nu = (p?: number) => resolveFluidSpec({ name: 'humid-air', relative_humidity: 0.8, ...(p && { pressure: p }) }).properties(323.15).nu;
    expect(atm.outputs.Re).toBeCloseTo((2 * 0.3) / nu(), 6);
    expect(low.outputs.Re).toBeCloseTo((2 * 0.3) / nu(70_000), 6);
    expect(low.outputs.Re / atm.outputs.Re).toBeLessThan(0.72); // thinner air, and moister
  });

  it('is an error below the freezing point', () => {
    const r = runCli([...base, '--set', 'fluid_temperature=-30 degC', '--fluid', 'propylene-glycol-water', '--concentration', '40%']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/outside the range of fluid 'propylene-glycol-water 40 %'.*freezes/);
  });
});
