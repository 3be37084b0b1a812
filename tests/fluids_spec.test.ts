// Fluid specs (a name, a mixture with parameters, user fluids) as the engine, study files and
// the command line give them, and what a sweep does below a solution's freezing point. The
// values here are the API contract (common practice), not physical data.
import { describe, expect, it } from 'vitest';
import { compileSolver, resolveFluid, solvePoint } from '../shared/physics/engine.js';
import { FluidRangeError, getFluid, resolveFluidSpec } from '../shared/physics/fluids/index.js';
import { InputError } from '../shared/physics/types.js';
import { StudyError } from '../shared/study/errors.js';
import { parseStudy } from '../shared/study/parse.js';

describe('resolveFluidSpec', () => {
  it('resolves names, mixtures and user fluids; the engine delegates to it', () => {
    expect(resolveFluidSpec('water')).toBe(getFluid('water'));
    expect(resolveFluidSpec({ name: 'sodium' })).toBe(getFluid('sodium'));
    const pg = resolveFluidSpec({ name: 'propylene-glycol-water', concentration: 0.4 });
    expect(pg.name).toBe('propylene-glycol-water');
    expect(pg.title).toBe('Propylene glycol–water solution, 40 % by mass');
    expect(resolveFluid({ name: 'propylene-glycol-water', concentration: 0.4 })).toBe(pg); // same spec, same fluid
    expect(resolveFluidSpec({ constant: { rho: 1, cp: 1, mu: 1, k: 1 } }).name).toBe('user');
  });

  it.each([
    ['propylene-glycol-water', /fluid 'propylene-glycol-water' is a mixture: give its concentration \(glycol mass fraction 10 % to 60 % by mass\), e\.g\. \{name: propylene-glycol-water, concentration: 40 %\} or --concentration 40%/],
    [{ name: 'ethylene-glycol-water' }, /fluid 'ethylene-glycol-water' is a mixture: give its concentration/],
    [{ name: 'propylene-glycol-water', concentration: 0.65 }, /concentration 65 % is outside 10 % to 60 % by mass/],
    [{ name: 'propylene-glycol-water', concentration: 0.05 }, /concentration 5 % is outside 10 % to 60 % by mass/],
    [{ name: 'propylene-glycol-water', concentration: '40%' }, /concentration must be a number, got "40%"/],
    [{ name: 'water', concentration: 0.4 }, /fluid 'water' takes no parameters \(got concentration\)/],
    [{ name: 'propylene-glycol-water', concentration: 0.4, relative_humidity: 0.5 }, /has no parameter 'relative_humidity'/],
    [{ name: 'brine', concentration: 0.2 }, /unknown fluid 'brine'/],
  ])('refuses %o with the reason', (spec, message) => {
    expect(() => resolveFluidSpec(spec as never)).toThrow(InputError);
    expect(() => resolveFluidSpec(spec as never)).toThrow(message);
  });
});

describe('the engine with a glycol solution', () => {
  const plan = { configuration: 'pipe', methods: ['gnielinski'], fluid: { name: 'propylene-glycol-water', concentration: 0.4 } };
  const point = { diameter: 0.025, velocity: 1, length: 3, fluid_temperature: 283.15, surface_temperature: 303.15 };

  it('solves a point with the solution\'s properties', () => {
    const [row] = solvePoint(plan, point);
    const props = resolveFluidSpec(plan.fluid).properties(293.15); // pipe: bulk-temperature properties
    expect(row.outputs.Re).toBeGreaterThan(0);
    // Re from the inlet mass flux over μ at the property temperature (the mean bulk): both from the solution.
    const T = row.outputs.property_temperature;
    const inlet = resolveFluidSpec(plan.fluid).properties(point.fluid_temperature);
    expect(row.outputs.Re).toBeCloseTo((inlet.rho * 1 * 0.025) / resolveFluidSpec(plan.fluid).properties(T).mu, 6);
    expect(props.Pr).toBeGreaterThan(20);
  });

  it('flags a sweep point below the freezing point and refuses it in solve', () => {
    const cold = { ...point, fluid_temperature: 273.15 - 25, surface_temperature: 273.15 - 24 };
    const rows = compileSolver(plan)(cold);
    expect(rows[0].flags).toEqual(['out-of-range:property_temperature']);
    expect(rows[0].outputs).toEqual({});
    expect(() => solvePoint(plan, cold)).toThrow(FluidRangeError);
    expect(() => solvePoint(plan, cold)).toThrow(/the 40 % solution freezes at 252\.05 K/);
  });
});

describe('study files', () => {
  const study = (fluid: string, inputs = 'inputs: {diameter: 25 mm, velocity: 1 m/s, fluid_temperature: 10 degC}\n', extra = '') =>
    `name: loop\nconfiguration: pipe\nmethods: [gnielinski]\nfluid: ${fluid}\n${inputs}${extra}`;
  const diagnostics = (text: string) => {
    try {
      parseStudy(text, 'loop.yaml');
    } catch (e) {
      if (e instanceof StudyError) return e.diagnostics.map((d) => `${d.line}:${d.column} ${d.message}`);
      throw e;
    }
    return [];
  };

  it('reads {name, concentration: 40 %} and a fraction 0.4 alike', () => {
    for (const c of ['40 %', '40%', '0.4']) {
      const s = parseStudy(study(`{name: propylene-glycol-water, concentration: ${c}}`), 'loop.yaml').study;
      expect(s.fluid).toEqual({ name: 'propylene-glycol-water', concentration: 0.4 });
    }
  });

  it('says a mixture needs its concentration, and where', () => {
    expect(diagnostics(study('propylene-glycol-water'))).toEqual([
      expect.stringMatching(/^4:8 fluid 'propylene-glycol-water' is a mixture: give its concentration \(glycol mass fraction 10 % to 60 % by mass\)/),
    ]);
    expect(diagnostics(study('{name: propylene-glycol-water}'))).toEqual([
      expect.stringMatching(/^4:8 fluid 'propylene-glycol-water' is a mixture: give its concentration/),
    ]);
  });

  it('refuses a concentration outside 10–60 % with the range, and a bare 40', () => {
    expect(diagnostics(study('{name: ethylene-glycol-water, concentration: 70 %}'))).toEqual([
      expect.stringMatching(/^4:8 fluid 'ethylene-glycol-water': concentration 70 % is outside 10 % to 60 % by mass/),
    ]);
    expect(diagnostics(study('{name: ethylene-glycol-water, concentration: 40}'))).toEqual([
      '4:53 concentration: 40 reads as a fraction (4000 %); write "40 %" or 0.4',
    ]);
    expect(diagnostics(study('{name: ethylene-glycol-water, concentration: forty}'))).toEqual([
      expect.stringMatching(/^4:53 expected a percentage such as "40 %" or a fraction such as 0\.4/),
    ]);
  });

  it('gives humid air the fixed pressure input, 1 atm without one, and refuses a swept pressure', () => {
    const fixed = parseStudy(
      study('{name: humid-air, relative_humidity: 60 %}', 'inputs: {diameter: 25 mm, velocity: 1 m/s, fluid_temperature: 30 degC, pressure: 85 kPa}\n'),
      'loop.yaml',
    ).study;
    expect(fixed.fluid).toEqual({ name: 'humid-air', relative_humidity: 0.6, pressure: 85000 });
    const atm = parseStudy(study('{name: humid-air, relative_humidity: 60 %}'), 'loop.yaml').study;
    expect(atm.fluid).toEqual({ name: 'humid-air', relative_humidity: 0.6 });
    expect(diagnostics(study('{name: humid-air, relative_humidity: 60 %}', undefined, 'sweep:\n  over:\n    pressure: [80 kPa, 100 kPa]\n'))).toEqual([
      "8:5 humid-air takes one pressure per study (its composition at a relative humidity depends on it): fix 'pressure' under inputs",
    ]);
  });
});
