// Rough-pipe friction (Colebrook) and Gnielinski's laminar–turbulent transition for the
// pipe methods, checked against SciPy (tests/fixtures/colebrook_reference.py, the Graetz
// solution in graetz_reference.py) and published values (named beside each; "from memory"
// where recalled).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getMethod } from '../shared/physics/catalogue.js';
import { colebrookFrictionFactor } from '../shared/physics/correlations/colebrook.js';
import { gnielinskiNusselt } from '../shared/physics/correlations/pipe.js';
import { gnielinskiLaminarMean, intermittency, transitionNusselt } from '../shared/physics/correlations/pipe-transition.js';
import { derivableInputs, solvePoint } from '../shared/physics/engine.js';
import { InputError, type Inputs } from '../shared/physics/types.js';

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

describe('pipe: gnielinski (version 3) — transition blend and rough walls', () => {
  const g = getMethod('pipe', 'gnielinski');
  const nu = (inputs: Inputs) => g.evaluate(inputs).outputs.Nu;

  it('is continuous at both ends of the blend', () => {
    for (const Pr of [0.7, 5, 100]) {
      expect(relErr(nu({ Re: 1e4 - 1e-6, Pr }), nu({ Re: 1e4, Pr }))).toBeLessThan(1e-8);
      expect(nu({ Re: 2300 + 1e-9, Pr })).toBeCloseTo(3.66, 8);
      expect(nu({ Re: 2300 + 1e-9, Pr, wall_condition: 'flux' })).toBeCloseTo(4.354, 8);
    }
  });

  it('halfway (Re = 6150) is the mean of the laminar 3.66 and its own turbulent value at 1e4', () => {
    // Hand value at Pr = 5 (calculator): f(1e4) = 0.031 480, Nu_turb = (0.003 935 0·9000·5)/(1 + 12.7·0.062 729·1.924 01)
    // = 177.07/2.532 79 = 69.912; the blend at γ = ½: (3.66 + 69.912)/2 = 36.786.
    const r = g.evaluate({ Re: 6150, Pr: 5 });
    expect(r.outputs.intermittency).toBeCloseTo(0.5, 12);
    expect(r.outputs.Nu).toBeCloseTo((3.66 + nu({ Re: 1e4, Pr: 5 })) / 2, 10);
    expect(nu({ Re: 1e4, Pr: 5 })).toBeCloseTo(69.912, 2);
    expect(r.outputs.Nu).toBeCloseTo(36.786, 2);
    expect(r.flags).toEqual([]);
    // (Version 2, the 1976 form down to Re = 3000, gave 44.12 here.)
  });

  it('with short_tube_correction both anchors are means over the tube: his laminar composite at L/D and 1 + (D/L)^⅔', () => {
    const LD = 30;
    const r = g.evaluate({ Re: 6150, Pr: 5, L_over_D: LD, short_tube_correction: true });
    const laminar = gnielinskiLaminarMean(2300, 5, LD, 'temperature');
    const turbulent = nu({ Re: 1e4, Pr: 5 }) * (1 + (1 / LD) ** (2 / 3));
    expect(r.outputs.Nu).toBeCloseTo((laminar + turbulent) / 2, 10);
    expect(r.flags).toEqual([]);
    // Uncorrected, a 30-diameter tube is shorter than the laminar entry at Re = 2300: flagged.
    expect(g.evaluate({ Re: 6150, Pr: 5, L_over_D: LD }).flags).toEqual(['entry-region']);
  });

  it('a rough wall: the Colebrook f in Gnielinski\'s equation and the pressure drop', () => {
    const f = colebrookFrictionFactor(1e5, 0.001).f;
    const r = g.evaluate({ Re: 1e5, Pr: 0.7, relative_roughness: 0.001, L_over_D: 50 });
    expect(r.outputs.f).toBeCloseTo(f, 14);
    expect(r.outputs.Nu).toBeCloseTo(gnielinskiNusselt(1e5, 0.7, f), 10);
    expect(r.outputs.pressure_drop_coefficient).toBeCloseTo(f * 50, 12);
    expect(r.flags).toEqual([]);
    // Rougher than Norris' limit f/f_smooth ≈ 4 (ε/D = 0.05 at Re = 1e6: 0.0716/0.0117): flagged.
    expect(g.evaluate({ Re: 1e6, Pr: 0.7, relative_roughness: 0.05 }).flags).toEqual(['out-of-range:relative_roughness']);
  });

  it('the smooth-tube correlations take the rough f for the pressure drop and flag their Nu', () => {
    const r = getMethod('pipe', 'dittus-boelter').evaluate({ Re: 1e5, Pr: 0.7, relative_roughness: 0.001 });
    const smooth = getMethod('pipe', 'dittus-boelter').evaluate({ Re: 1e5, Pr: 0.7 });
    expect(r.outputs.f).toBeCloseTo(colebrookFrictionFactor(1e5, 0.001).f, 14);
    expect(r.outputs.Nu).toBe(smooth.outputs.Nu);
    expect(r.flags).toEqual(['out-of-range:relative_roughness']);
    expect(smooth.flags).toEqual([]);
  });

  it('dimensional: roughness with units becomes ε/D, and a study point needs no relative_roughness of its own', () => {
    const inputs = { diameter: 0.05, length: 10, roughness: 4.5e-5, velocity: 2, fluid_temperature: 293.15, surface_temperature: 333.15 };
    const [r] = solvePoint({ configuration: 'pipe', fluid: 'water', methods: ['gnielinski'] }, inputs);
    expect(r.outputs.relative_roughness).toBeCloseTo(9e-4, 14);
    expect(r.outputs.f).toBeCloseTo(colebrookFrictionFactor(r.outputs.Re, 9e-4).f, 12);
    expect(derivableInputs('pipe', Object.keys(inputs), true).has('relative_roughness')).toBe(true);
  });
});
