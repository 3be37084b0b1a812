// Study files: the design-answer blocks (target, tolerances, uncertainty) and
// latin-hypercube ranges without count, each error at its line and column.
import { describe, expect, it } from 'vitest';
import { StudyError, parseStudy, type Diagnostic } from '../shared/study/index.js';

function diagnosticsOf(text: string): string[] {
  try {
    parseStudy(text, 'study.yaml');
  } catch (e) {
    if (e instanceof StudyError) return e.diagnostics.map((d: Diagnostic) => `${d.line}:${d.column} ${d.message}`);
    throw e;
  }
  throw new Error('expected the study to be refused');
}

const probe = (extra: string, inputs = '  diameter: 12.7 mm\n') =>
  `name: p\nconfiguration: cylinder\nmethods: [hilpert]\nfluid: air\ninputs:\n${inputs}  fluid_temperature: 26.2 degC\n  surface_temperature: 128.4 degC\n${extra}`;

describe('target, tolerances and uncertainty', () => {
  it('reads them into SI', () => {
    const { study } = parseStudy(
      probe(
        'target:\n  output: h\n  value: 100 W/(m^2 K)\n  adjust: velocity\n  within: [0.2 m/s, 40 m/s]\n' +
          'tolerances:\n  diameter: 0.1 mm\n  fluid_temperature: 1 degC\n  surface_temperature: 2 %\n' +
          'uncertainty: {samples: 200, seed: 3}\n' +
          'checks:\n  - at: {diameter: 12.7 mm}\n    method: hilpert\n    expect: {velocity: 11.8 m/s}\n    tolerance: 3%\n',
      ),
      'study.yaml',
    );
    expect(study.design).toEqual({
      target: { output: 'h', value: 100, adjust: 'velocity', within: [0.2, 40] },
      tolerances: { diameter: { absolute: 0.0001 }, fluid_temperature: { absolute: 1 }, surface_temperature: { relative: 0.02 } },
      uncertainty: { samples: 200, seed: 3 },
    });
    expect(study.checks[0].expect).toEqual({ velocity: 11.8 });
  });

  it('an output temperature target converts degC as a temperature (35 degC = 308.15 K)', () => {
    const { study } = parseStudy(
      `name: p\nconfiguration: pipe\nmethods: [gnielinski]\nfluid: water\ninputs:\n  diameter: 25 mm\n  velocity: 1 m/s\n  fluid_temperature: 20 degC\n  surface_temperature: 60 degC\ntarget:\n  output: outlet_temperature\n  value: 35 degC\n  adjust: length\n  within: [0.5 m, 20 m]\n`,
      'study.yaml',
    );
    expect(study.design?.target?.value).toBeCloseTo(308.15, 12);
    expect(study.design?.uncertainty).toBeUndefined();
  });

  it('uncertainty alone asks for bands from the stated uncertainty (400 samples, seed 1 by default)', () => {
    const { study } = parseStudy(probe('  velocity: 5 m/s\nuncertainty: {}\n'), 'study.yaml');
    expect(study.design).toEqual({ tolerances: {}, uncertainty: { samples: 400, seed: 1 } });
  });

  it('refuses an adjusted input that is also fixed or swept, saying why', () => {
    expect(diagnosticsOf(probe('  velocity: 5 m/s\ntarget:\n  output: h\n  value: 100 W/(m^2 K)\n  adjust: diameter\n  within: [1 mm, 40 mm]\n'))).toEqual([
      "13:11 'diameter' is the target's adjusted input and also given (inputs, line 6): the solver sets it at every point within 'within', so remove it from inputs",
    ]);
    expect(
      diagnosticsOf(probe('sweep:\n  over:\n    velocity: [1 m/s, 2 m/s]\ntarget:\n  output: h\n  value: 100 W/(m^2 K)\n  adjust: velocity\n  within: [0.2 m/s, 40 m/s]\n')),
    ).toEqual([
      "15:11 'velocity' is the target's adjusted input and also given (sweep, line 11): the solver sets it at every point within 'within', so remove it from the sweep",
    ]);
  });

  it('refuses unknown outputs and inputs, wrong dimensions, a reversed interval and bad tolerances, all at once', () => {
    const ds = diagnosticsOf(
      probe(
        '  velocity: 3 m/s\ntarget:\n  output: hh\n  value: 100 W/(m^2 K)\n  adjust: colour\n  within: [40 m/s, 0.2 m/s]\n' +
          'tolerances:\n  diameter: 0.1 kg\n  colour: 5 %\n  velocity: -1 m/s\nuncertainty: {samples: 5}\n',
      ),
    );
    expect(ds).toEqual([
      "11:11 'hh' is not an output of configuration 'cylinder' (its methods give Nu, and from the dimensional engine h, q, heat_rate, pressure_drop, surface_temperature, outlet_temperature, …)",
      expect.stringMatching(/^13:11 'colour' is not a numeric input of configuration 'cylinder' \(its inputs: velocity, diameter, length, .*Re, Pr\)$/),
      "16:13 diameter: '0.1 kg' has the wrong dimension: expected a value convertible to m (diameter: cylinder, sphere or tube diameter)",
      "17:3 tolerance on 'colour', which is not an input of this study (inputs: diameter, fluid_temperature, surface_temperature, velocity)",
      '18:13 velocity: a tolerance is a half-width: expected a value ≥ 0, got "-1 m/s"',
      '19:24 expected a whole number from 20 to 100000',
    ]);
  });

  it('refuses a value of the wrong dimension and a reversed interval', () => {
    expect(diagnosticsOf(probe('target:\n  output: h\n  value: 100 W\n  adjust: velocity\n  within: [40 m/s, 0.2 m/s]\n'))).toEqual([
      "11:10 h: '100 W' has the wrong dimension: expected W/(m^2 K)",
      '13:11 expected [low, high] with low < high, got [40, 0.2] (SI)',
    ]);
  });
});

describe('latin-hypercube ranges', () => {
  const pipe = (over: string, design = 'latin-hypercube') => `name: t\nconfiguration: pipe\nmethods: [gnielinski]\nsweep:\n  design: ${design}\n  samples: 20\n  over:\n${over}`;

  it('need no count: samples sets the number of points', () => {
    const { study } = parseStudy(pipe('    Re: {from: 1.0e4, to: 5.0e4, spacing: log}\n    Pr: {from: 1, to: 5}\n'), 'study.yaml');
    expect(study.sweep.samples).toBe(20);
    expect(study.sweep.over.Re).toMatchObject({ kind: 'range', from: 1e4, to: 5e4, spacing: 'log' });
  });

  it('refuse a count, saying that samples sets the number', () => {
    expect(diagnosticsOf(pipe('    Re: {from: 1.0e4, to: 5.0e4, count: 5}\n    Pr: [1, 5]\n'))).toEqual([
      '8:34 Re: a latin-hypercube sweep takes its number of points from samples; remove count',
    ]);
  });

  it('other designs still need count or step', () => {
    expect(diagnosticsOf(pipe('    Re: {from: 1.0e4, to: 5.0e4}\n    Pr: [1, 5]\n', 'grid'))).toEqual([
      '8:9 Re: a range needs count (the number of values, both ends included) or step; only a latin-hypercube sweep leaves it out (samples sets the number)',
    ]);
  });
});
