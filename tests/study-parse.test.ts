import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { methodsFor } from '../shared/physics/catalogue.js';
import {
  StudyError,
  countPoints,
  expandPoints,
  loadStudyFile,
  parseStudy,
  starterStudy,
  type Diagnostic,
} from '../shared/study/index.js';

const fixture = (name: string) => fileURLToPath(new URL(`./fixtures/studies/${name}`, import.meta.url));

function diagnosticsOf(text: string, options?: { maxPoints?: number }): Diagnostic[] {
  try {
    parseStudy(text, 'study.yaml', options);
  } catch (e) {
    if (e instanceof StudyError) return e.diagnostics;
    throw e;
  }
  throw new Error('expected the study to be refused');
}

/** Diagnostics as `line:column message` for compact exact comparisons. */
const at = (ds: Diagnostic[]) => ds.map((d) => `${d.line}:${d.column} ${d.message}`);

const dimensionless = (body: string) => `name: t\nconfiguration: pipe\nmethods: [gnielinski]\n${body}`;

describe('valid study files', () => {
  it('reads the DESIGN.md section 5 example (real method ids)', () => {
    const loaded = loadStudyFile(fixture('design-example.yaml'));
    const text = readFileSync(fixture('design-example.yaml'), 'utf8');
    expect(loaded.hash).toBe(createHash('sha256').update(text).digest('hex'));
    const s = loaded.study;
    expect(s.name).toBe('glycol-heater-tube');
    expect(s.title).toBe('Heater tube, 30 % glycol');
    expect(s.methods).toEqual(['gnielinski', 'dittus-boelter']);
    expect(s.fluid).toBeUndefined();
    expect(s.inputs).toEqual({ L_over_D: 80 });
    expect(s.sweep).toEqual({
      design: 'grid',
      seed: 7,
      samples: 200,
      over: {
        Re: { kind: 'range', from: 1e4, to: 1e6, count: 21, spacing: 'log' },
        Pr: { kind: 'list', values: [0.7, 5, 50] },
      },
    });
    expect(s.checks).toEqual([
      { at: { Re: 1e5, Pr: 5 }, method: 'gnielinski', expect: { Nu: 520 }, tolerance: { relative: 0.03 }, line: 19, column: 5 },
    ]);
    expect(s.baseline).toEqual({ tolerance: 1e-9 });
    expect(countPoints(s)).toBe(63);
    const points = expandPoints(s);
    expect(points[0]).toEqual({ L_over_D: 80, Re: 1e4, Pr: 0.7 });
    expect(points[1].Pr).toBe(5); // last key fastest
    expect(points[31]).toEqual({ L_over_D: 80, Re: 1e5, Pr: 5 });
  });

  it('converts units in fixed inputs, steps and lists to SI', () => {
    const s = loadStudyFile(fixture('dimensional-units.yaml')).study;
    expect(s.inputs.length).toBeCloseTo(0.15, 15);
    expect(s.inputs.fluid_temperature).toBeCloseTo(298.15, 10);
    expect(s.inputs.surface_temperature).toBeCloseTo(353.15, 10);
    const points = expandPoints(s);
    expect(points.map((p) => p.velocity)).toEqual([1, 2, 3, 4, 5]);
    // 1 bar = 1e5 Pa, 1 atm = 101325 Pa exactly (SI Brochure, Table 8 and CGPM 1954).
    const p = points.map((x) => x.pressure as number);
    [1e5, 101325, 9e4, 95000, 101325].forEach((want, i) => expect(p[i]).toBeCloseTo(want, 6));
    expect(s.baseline.tolerance).toBeCloseTo(0.001, 15);
  });

  it('runs every method of the configuration when methods is left out', () => {
    const s = parseStudy('name: t\nconfiguration: pipe\ninputs: {Re: 1.0e5, Pr: 5, L_over_D: 60}\n', 't.yaml').study;
    expect(s.methods).toEqual(methodsFor('pipe').map((m) => m.id));
    expect(s.methods.length).toBeGreaterThan(1);
    expect(countPoints(s)).toBe(1);
  });

  it('steps temperatures in kelvin differences, whatever the unit', () => {
    const s = parseStudy(
      'name: t\nconfiguration: pipe\nmethods: [gnielinski]\nfluid: water\ninputs: {diameter: 25 mm, velocity: 1 m/s}\n' +
        'sweep:\n  over:\n    fluid_temperature: {from: 20 degC, to: 80 degC, step: 10 degC}\n',
      't.yaml',
    ).study;
    const T = expandPoints(s).map((p) => p.fluid_temperature as number);
    expect(T).toHaveLength(7);
    expect(T[0]).toBeCloseTo(293.15, 9);
    expect(T[6]).toBe(353.15);
  });

  it('converts constant fluid properties with units to SI', () => {
    const s = parseStudy(
      'name: t\nconfiguration: pipe\nmethods: [gnielinski]\n' +
        'fluid: {constant: {rho: 1.1 g/cm^3, cp: 3.5 kJ/(kg K), mu: 3 mPa s, k: 0.4, beta: 5e-4 /K}}\n' +
        'inputs: {diameter: 25 mm, velocity: 1 m/s, fluid_temperature: 300}\n',
      't.yaml',
    ).study;
    const c = (s.fluid as { constant: Record<string, number> }).constant;
    expect(c.rho).toBeCloseTo(1100, 9);
    expect(c.cp).toBeCloseTo(3500, 9);
    expect(c.mu).toBeCloseTo(0.003, 15);
    expect(c.k).toBe(0.4);
    expect(c.beta).toBeCloseTo(5e-4, 15);
  });

  it('reads every tolerance form', () => {
    const s = parseStudy(
      dimensionless(
        'sweep:\n  over:\n    Re: [1.0e5]\n    Pr: [5]\nchecks:\n' +
          '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: 3%}\n' +
          '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: 0.05}\n' +
          '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: {absolute: 2}}\n' +
          '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: {relative: 0.01, absolute: 1}}\n',
      ),
      't.yaml',
    ).study;
    expect(s.checks.map((c) => c.tolerance)).toEqual([{ relative: 0.03 }, { relative: 0.05 }, { absolute: 2 }, { relative: 0.01, absolute: 1 }]);
    expect(s.checks.map((c) => c.line)).toEqual([9, 10, 11, 12]);
  });

  it('writes a starter file that validates', () => {
    const text = starterStudy('my-new-study');
    const s = parseStudy(text, 'my-new-study.yaml').study;
    expect(s.name).toBe('my-new-study');
    expect(s.configuration).toBe('pipe');
    expect(countPoints(s)).toBe(11);
    expect(() => starterStudy('Not a slug')).toThrow(/not a slug/);
  });
});

describe('refused study files, with file, line and column', () => {
  it('refuses over-specified points, naming both inputs at the second one', () => {
    const text = 'name: t\nconfiguration: pipe\nmethods: [gnielinski]\nfluid: water\ninputs:\n  diameter: 25 mm\n  velocity: 1 m/s\n  fluid_temperature: 40 degC\n  surface_temperature: 60 degC\nsweep:\n  over:\n    Re: [1.0e4, 2.0e4]\n    Pr: [5]\n';
    expect(at(diagnosticsOf(text))).toEqual([
      "12:5 over-specified point: 'velocity' and 'Re' both given; Re follows from the velocity and the fluid",
      "13:5 over-specified point: a fluid and 'Pr' both given; Pr follows from the fluid at its property temperature",
    ]);
    const flux = 'name: t\nconfiguration: vertical-plate\nmethods: [churchill-chu]\nfluid: air\ninputs:\n  height: 0.5 m\n  fluid_temperature: 20 degC\n  surface_temperature: 40 degC\n  heat_flux: 100 W/m^2\n';
    expect(at(diagnosticsOf(flux))).toEqual([
      "8:3 over-specified point: 'heat_flux' and 'surface_temperature' both given; with a heat flux the surface temperature is solved for (give one of them)",
    ]);
  });

  it('reports every problem of a file at once', () => {
    const e = (() => {
      try {
        loadStudyFile(fixture('many-errors.yaml'));
      } catch (err) {
        return err as StudyError;
      }
      throw new Error('expected a StudyError');
    })();
    expect(e).toBeInstanceOf(StudyError);
    const lines = at(e.diagnostics);
    expect(lines).toEqual([
      '1:7 expected a slug: lowercase letters and digits joined by hyphens',
      expect.stringMatching(/^3:42 unknown method 'churchill-bernstein' for configuration 'pipe'; expected one of: .*gnielinski/),
      expect.stringMatching(/^4:1 unknown key 'colour'; expected one of: name, title, configuration, methods, fluid, inputs, sweep, target, tolerances, uncertainty, checks, baseline$/),
      expect.stringMatching(/^6:3 dimensional inputs \(diameter\) need a fluid/),
      expect.stringMatching(/^6:13 diameter: '2 kg' has the wrong dimension: expected a value convertible to m/),
      "7:7 Re: is dimensionless: give a plain number, not '1e5 m'",
      '9:19 wall_condition: expected one of: temperature, flux, got "lukewarm"',
      "10:3 unknown input 'Prandtl': no method of 'pipe' uses it",
      "14:5 'Pr' is both fixed (inputs, line 8) and swept",
      '15:15 L_over_D: a range needs count (the number of values, both ends included) or step; only a latin-hypercube sweep leaves it out (samples sets the number)',
      '20:16 expected a percentage such as "3%"',
    ]);
    const file = fixture('many-errors.yaml');
    expect(e.format().split('\n')[0]).toBe(`${file}:1:7: expected a slug: lowercase letters and digits joined by hyphens`);
    expect(e.message).toBe(e.format());
  });

  it('names a missing required key and what it expects', () => {
    expect(at(diagnosticsOf('title: x\nconfiguration: pipe\nmethods: [gnielinski]\ninputs: {Re: 1.0e5, Pr: 5}\n'))).toEqual([
      "1:1 missing required key 'name': expected a slug such as glycol-heater-tube",
    ]);
    expect(at(diagnosticsOf('name: x\nsweep:\n  over:\n    Re: {from: 1, to: 2}\n'))).toEqual([
      "1:1 missing required key 'configuration': expected a configuration id such as pipe",
      '4:9 Re: a range needs count (the number of values, both ends included) or step; only a latin-hypercube sweep leaves it out (samples sets the number)',
    ]);
  });

  it('reports unknown keys at the key, nested ones included', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {Pr: 5}\nsweep:\n  desing: zip\n  over:\n    Re: {from: 1.0e4, to: 1.0e5, cout: 5}\n')))).toEqual([
      "6:3 unknown key 'desing'; expected one of: design, seed, samples, over",
      "8:34 unknown key 'cout'; expected one of: from, to, count, spacing",
    ]);
  });

  it('reports wrong types at the value', () => {
    expect(at(diagnosticsOf('name: t\nconfiguration: pipe\nmethods: gnielinski\nsweep:\n  seed: 1.5\n  design: random\n'))).toEqual([
      '3:10 expected a list of method ids',
      '5:9 expected a whole number',
      '6:11 expected grid, zip or latin-hypercube',
    ]);
    expect(at(diagnosticsOf(dimensionless('inputs: {Re: true, Pr: [5]}\n')))).toEqual([
      '4:14 Re: expected a number, got true',
      '4:24 expected a number (SI), a string with units, a boolean or a word',
    ]);
  });

  it('refuses an unknown configuration, listing the known ones', () => {
    expect(at(diagnosticsOf('name: t\nconfiguration: pipes\n'))).toEqual([
      expect.stringMatching(/^2:16 unknown configuration 'pipes'; expected one of: flat-plate, .*pipe/),
    ]);
  });

  it('refuses a method of another configuration', () => {
    expect(at(diagnosticsOf('name: t\nconfiguration: pipe\nmethods:\n  - gnielinski\n  - churchill-bernstein\ninputs: {Re: 1.0e5, Pr: 5}\n'))).toEqual([
      expect.stringMatching(/^5:5 unknown method 'churchill-bernstein' for configuration 'pipe'/),
    ]);
  });

  it('names inputs a method needs but the study lacks, at the method', () => {
    expect(at(diagnosticsOf('name: t\nconfiguration: pipe\nmethods: [gnielinski, hausen]\ninputs: {Re: 1000, Pr: 5}\n'))).toEqual([
      "3:23 method 'hausen' needs 'L_over_D', which the study neither gives nor lets the engine derive",
    ]);
    expect(at(diagnosticsOf('name: t\nconfiguration: pipe\nmethods: [gnielinski]\ninputs: {Re: 1000}\n'))).toEqual([
      "3:11 method 'gnielinski' needs 'Pr', which the study neither gives nor lets the engine derive",
    ]);
  });

  it('refuses input names no method uses, with a hint for typos', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {Re: 1.0e5, Pr: 5, L_over_d: 10}\n')))).toEqual([
      "4:28 unknown input 'L_over_d': no method of 'pipe' uses it; did you mean 'L_over_D'?",
    ]);
  });

  it('refuses a dimensional input the configuration has no use for', () => {
    expect(at(diagnosticsOf(dimensionless('fluid: water\ninputs: {diameter: 25 mm, velocity: 1, fluid_temperature: 300 K, height: 1 m}\n')))).toEqual([
      expect.stringMatching(/^5:66 input 'height' has no meaning for configuration 'pipe'/),
    ]);
  });

  it('refuses a swept input that is also fixed', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {Re: 1.0e5, Pr: 5}\nsweep:\n  over:\n    Re: [1.0e4, 1.0e5]\n')))).toEqual([
      "7:5 'Re' is both fixed (inputs, line 4) and swept",
    ]);
  });

  it('refuses units on a dimensionless input and a wrong dimension on a dimensional one', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {Re: 1e5 m/s, Pr: 5}\n')))).toEqual([
      "4:14 Re: is dimensionless: give a plain number, not '1e5 m/s'",
    ]);
    expect(at(diagnosticsOf(dimensionless('fluid: water\ninputs: {diameter: 25 K, velocity: 1, fluid_temperature: 300}\n')))).toEqual([
      expect.stringMatching(/^5:20 diameter: '25 K' has the wrong dimension: expected a value convertible to m/),
    ]);
    expect(at(diagnosticsOf(dimensionless('fluid: water\ninputs: {diameter: 25 mm, velocity: 1, fluid_temperature: 80 degC}\nsweep:\n  over:\n    surface_temperature: {from: 300 K, to: 350 K, step: 10 m}\n')))).toEqual([
      expect.stringMatching(/^8:57 surface_temperature: '10 m' has the wrong dimension: expected a value convertible to K/),
    ]);
  });

  it('refuses dimensional inputs without a fluid, and a fluid without a temperature', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {diameter: 25 mm, velocity: 1 m/s, Pr: 5}\n')))).toEqual([
      expect.stringMatching(/^4:10 dimensional inputs \(diameter, velocity\) need a fluid/),
    ]);
    expect(at(diagnosticsOf(dimensionless('fluid: water\ninputs: {Re: 1.0e5, Pr: 5}\n')))).toEqual([
      '4:1 a fluid needs fluid_temperature (fixed or swept) to read its properties',
    ]);
  });

  it('refuses unknown fluids and bad fluid properties at their place', () => {
    expect(at(diagnosticsOf(dimensionless('fluid: mercury\ninputs: {diameter: 1 cm, velocity: 1, fluid_temperature: 300}\n')))).toEqual([
      expect.stringMatching(/^4:8 unknown fluid 'mercury'/),
    ]);
    expect(at(diagnosticsOf(dimensionless('fluid: {constant: {rho: 1000 kg, cp: 4180, mu: 1e-3, k: 0.6}}\ninputs: {diameter: 1 cm, velocity: 1, fluid_temperature: 300}\n')))).toEqual([
      expect.stringMatching(/^4:25 rho: '1000 kg' has the wrong dimension: expected kg\/m\^3/),
    ]);
    expect(at(diagnosticsOf(dimensionless('fluid: {constant: {rho: 1000, cp: 4180, mu: 1e-3}}\ninputs: {diameter: 1 cm, velocity: 1, fluid_temperature: 300}\n')))).toEqual([
      "4:19 missing required key 'k': expected a number (SI) or a string with units such as \"25 mm\"",
    ]);
  });

  it('checks the checks: method, point names, outputs, tolerance', () => {
    const text = dimensionless(
      'sweep:\n  over:\n    Re: [1.0e5]\n    Pr: [5]\nchecks:\n' +
        '  - {at: {Re: 1.0e5, Prandtl: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: 3%}\n' +
        '  - {at: {Re: 1.0e5, Pr: 5}, method: dittus-boelter, expect: {Nu: 515}, tolerance: 3%}\n' +
        '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nusselt: 515}, tolerance: 3%}\n' +
        '  - {at: {Re: 1.0e5, Pr: 5}, method: gnielinski, expect: {Nu: 515}, tolerance: 3 percent}\n',
    );
    expect(at(diagnosticsOf(text))).toEqual([
      expect.stringMatching(/^9:22 'Prandtl' is neither an input of this study nor an input or output of 'gnielinski'/),
      "10:38 method 'dittus-boelter' is not one of this study's methods (gnielinski)",
      expect.stringMatching(/^11:59 method 'gnielinski' has no output 'Nusselt' \(outputs: Nu, /),
      '12:80 expected a percentage such as "3%"',
    ]);
  });

  it('reports YAML syntax errors and duplicate keys with their position', () => {
    expect(at(diagnosticsOf('name: t\nconfiguration: pipe\ninputs: {Re: 1.0e5, Pr: 5\n'))).toEqual([
      '4:1 YAML: Flow map in block collection must be sufficiently indented and end with a }',
    ]);
    expect(at(diagnosticsOf('name: t\nname: u\nconfiguration: pipe\n'))).toEqual(['2:1 YAML: Map keys must be unique']);
  });

  it('refuses an empty file and a file that is not a mapping', () => {
    expect(at(diagnosticsOf(''))).toEqual(['1:1 the file is empty; a study needs at least name and configuration']);
    expect(at(diagnosticsOf('- name: t\n'))).toEqual(['1:1 expected a mapping']);
  });

  it('refuses a missing file', () => {
    expect(() => loadStudyFile(fixture('no-such-study.yaml'))).toThrow(/no-such-study\.yaml:1:1: cannot read the study file: no such file/);
  });
});

describe('sweep rules before anything runs', () => {
  it('refuses a zip of unequal lengths, naming them', () => {
    expect(at(diagnosticsOf(dimensionless('sweep:\n  design: zip\n  over:\n    Re: {from: 1.0e4, to: 1.0e6, count: 21, spacing: log}\n    Pr: [0.7, 5, 50]\n')))).toEqual([
      '6:3 zip needs entries of equal length; got Re: 21, Pr: 3',
    ]);
  });

  it('refuses a latin hypercube without samples', () => {
    expect(at(diagnosticsOf(dimensionless('sweep:\n  design: latin-hypercube\n  over:\n    Re: {from: 1.0e4, to: 1.0e6, spacing: log}\n    Pr: [0.7, 5]\n')))).toEqual([
      '5:3 a latin-hypercube sweep needs samples (the number of points)',
    ]);
  });

  it('refuses log spacing through zero and steps that never reach `to`', () => {
    expect(at(diagnosticsOf(dimensionless('inputs: {Pr: 5}\nsweep:\n  over:\n    Re: {from: 0, to: 1.0e6, count: 5, spacing: log}\n')))).toEqual([
      '7:49 Re: log spacing needs from and to > 0, got 0 and 1000000',
    ]);
    expect(at(diagnosticsOf(dimensionless('inputs: {Pr: 5}\nsweep:\n  over:\n    Re: {from: 1.0e4, to: 1.0e3, step: 100}\n')))).toEqual([
      '7:40 Re: step 100 does not lead from 10000 to 1000',
    ]);
  });

  it('refuses a 1e4 × 1e4 grid instantly, with its count, without expanding it', () => {
    const t0 = performance.now();
    const ds = (() => {
      try {
        loadStudyFile(fixture('huge-grid.yaml'));
      } catch (e) {
        return (e as StudyError).diagnostics;
      }
      throw new Error('expected a StudyError');
    })();
    expect(performance.now() - t0).toBeLessThan(500);
    expect(at(ds)).toEqual(['4:1 the sweep has 100,000,000 points (10,000 × 10,000), more than the limit of 5,000,000']);
  });

  it('honours a lower maxPoints', () => {
    const text = readFileSync(fixture('design-example.yaml'), 'utf8');
    expect(at(diagnosticsOf(text, { maxPoints: 50 }))).toEqual(['11:1 the sweep has 63 points (21 × 3), more than the limit of 50']);
    expect(parseStudy(text, 'x.yaml', { maxPoints: 63 }).study.name).toBe('glycol-heater-tube');
  });
});

describe('YAML limits', () => {
  it('refuses an alias bomb quickly and says why', () => {
    const t0 = performance.now();
    let error: StudyError | undefined;
    try {
      loadStudyFile(fixture('alias-bomb.yaml'));
    } catch (e) {
      error = e as StudyError;
    }
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(error).toBeInstanceOf(StudyError);
    expect(at(error!.diagnostics)).toEqual([
      '5:8 YAML aliases expand too much (limit 100): the file looks like an alias bomb and was not read',
    ]);
  });

  it('still reads a file with a few aliases', () => {
    const s = parseStudy(
      'name: t\nconfiguration: pipe\nmethods: [gnielinski]\nsweep:\n  design: zip\n  over:\n    Re: &v [1.0e4, 2.0e4]\n    Pr: *v\n',
      't.yaml',
    ).study;
    expect(expandPoints(s)).toEqual([
      { Re: 1e4, Pr: 1e4 },
      { Re: 2e4, Pr: 2e4 },
    ]);
  });
});
