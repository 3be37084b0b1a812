// The CLI's design answers as a user runs them (compiled build, real child processes):
// `solve --target/--tolerance`, `run` + `show` with the recommendation counts.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { solvePoint } from '../shared/physics/engine.js';
import { runCli } from './helpers/cli.js';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-design-cli-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const probe = ['--fluid', 'air', '--set', 'diameter=12.7 mm', '--set', 'fluid_temperature=26.2 degC', '--set', 'surface_temperature=128.4 degC'];

describe('filmsweep solve with design options', () => {
  it('--target finds the speed for h = 50 W/(m² K) per method; a forward solve there gives h to 1e-9', () => {
    const r = runCli(['solve', 'cylinder', ...probe, '--target', 'h=50 W/(m^2 K)', '--adjust', 'velocity', '--within', '0.1 m/s..30 m/s', '--json']);
    expect(r.status).toBe(0);
    const { rows, summary } = JSON.parse(r.stdout);
    expect(rows.map((x: { method: string }) => x.method)).toEqual(['churchill-bernstein', 'hilpert', 'zukauskas']);
    for (const row of rows) {
      const [forward] = solvePoint({ configuration: 'cylinder', methods: [row.method], fluid: 'air' }, { diameter: 0.0127, fluid_temperature: 299.35, surface_temperature: 401.55, velocity: row.inputs.velocity });
      expect(Math.abs(forward.outputs.h - 50) / 50).toBeLessThan(1e-9);
    }
    expect(summary.spread_of).toBe('velocity');
    expect(summary.recommended).toBe('churchill-bernstein');
  });

  it('--tolerance adds bands; the table names the recommended method and why', () => {
    const r = runCli(['solve', 'pipe', '--set', 'Re=1e5', '--set', 'Pr=5', '--set', 'L_over_D=40', '--tolerance', 'Re=5%', '--samples', '100']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Nu_low\s/);
    expect(r.stdout).toMatch(/Nu_high\s/);
    expect(r.stdout).toContain('recommended: gnielinski — smallest stated uncertainty');
  });

  it('refuses an adjusted input that is also set, and a target without its interval (exit 1)', () => {
    const both = runCli(['solve', 'cylinder', ...probe, '--set', 'velocity=3', '--target', 'h=50', '--adjust', 'velocity', '--within', '0.1..30']);
    expect(both.status).toBe(1);
    expect(both.stderr).toContain('--adjust velocity: also given with --set');
    const partial = runCli(['solve', 'cylinder', ...probe, '--target', 'h=50', '--adjust', 'velocity']);
    expect(partial.status).toBe(1);
    expect(partial.stderr).toContain('a target needs all three');
    const unit = runCli(['solve', 'cylinder', ...probe, '--target', 'h=50 W', '--adjust', 'velocity', '--within', '0.1..30']);
    expect(unit.status).toBe(1);
    expect(unit.stderr).toContain('wrong dimension');
  });
});

describe('run, show and check with design answers', () => {
  it('show prints how often each method was recommended; check asserts on the solved input', () => {
    const file = join(dir, 'probe.yaml');
    writeFileSync(
      file,
      `name: cli-probe\nconfiguration: cylinder\nmethods: [hilpert, zukauskas]\nfluid: air\ninputs:\n  length: 94 mm\n  fluid_temperature: 26.2 degC\n  surface_temperature: 128.4 degC\nsweep:\n  over:\n    diameter: [6.35 mm, 12.7 mm]\ntarget:\n  output: h\n  value: 50 W/(m^2 K)\n  adjust: velocity\n  within: [0.1 m/s, 30 m/s]\nchecks:\n  - at: {diameter: 12.7 mm}\n    method: hilpert\n    expect: {velocity: 3.37 m/s}   # hand calculation in studies/probe-air-speed.yaml\n    tolerance: 3%\n  - at: {diameter: 12.7 mm}\n    method: hilpert\n    expect: {velocity: 4.2 m/s}    # wrong on purpose\n    tolerance: 3%\n`,
    );
    const db = join(dir, 'cli.db');
    const check = runCli(['check', file, '--db', db, '--workers', '1', '--update-baseline']);
    expect(check.status).toBe(3);
    expect(check.stdout).toContain('checks 1/2');
    expect(check.stdout).toMatch(/velocity = 3\.3\d+, expected 4\.2/);
    const show = runCli(['show', 'latest', '--db', db, '--json']);
    expect(show.status).toBe(0);
    const { recommended } = JSON.parse(show.stdout);
    expect(recommended).toEqual({ points: 2, byMethod: { hilpert: 2 }, none: 0 });
    const text = runCli(['show', 'latest', '--db', db]);
    expect(text.stdout).toMatch(/recommended\n/);
    expect(text.stdout).toMatch(/hilpert\s+1\s+2\s+0\s+\S+\s+\S+\s+2\n/);
  });
});
