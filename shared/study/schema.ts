// The study file format (DESIGN.md section 5), written once: this zod schema checks the
// structure of a file and is also printed as JSON Schema by `filmsweep schema` for
// editors. It describes the file as written (numbers or strings with units); turning
// values into SI and checking them against the catalogue happens in parse.ts.
import { z } from '#zod';

/** Lowercase words joined by hyphens, used in file names, URLs and the database. */
export const slugPattern = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
/** A percentage such as `3%` or `0.5 %`. */
export const percentPattern = /^\s*(\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?\s*%\s*$/;

// A strict object whose unknown-key message lists the keys it does accept.
function strict<T extends z.ZodRawShape>(shape: T) {
  const known = Object.keys(shape).join(', ');
  return z.strictObject(shape, {
    error: (issue) => (issue.code === 'unrecognized_keys' ? `expected one of: ${known}` : 'expected a mapping'),
  });
}

const finiteNumber = z.number({ error: 'expected a finite number' });

/** An SI number, or a string with units converted to the SI unit of the quantity. */
const quantity = z
  .union([finiteNumber, z.string()], { error: 'expected a number (SI) or a string with units such as "25 mm"' })
  .describe('SI number, or a number with units such as "25 mm", "80 degC", "2 m/s", "1.5 L/min"');

export const inputValueSchema = z
  .union([finiteNumber, z.string(), z.boolean()], {
    error: 'expected a number (SI), a string with units, a boolean or a word',
  })
  .describe('SI number, string with units ("25 mm"), boolean switch (heating: true) or word (arrangement: staggered)');

const nonNegative = z.number({ error: 'expected a number' }).min(0, { error: 'expected a number ≥ 0' });

const percent = z.string().regex(percentPattern, { error: 'expected a percentage such as "3%"' });

/**
 * Tolerance of a check: `3%` or a plain number (a relative fraction, 0.03), or
 * `{relative: r}`, or `{absolute: a}` in the SI unit of the output. With both keys a
 * value passes when it is within either bound.
 */
export const toleranceSchema = z
  .union(
    [
      percent,
      nonNegative,
      strict({ relative: nonNegative, absolute: nonNegative.optional() }),
      strict({ absolute: nonNegative, relative: nonNegative.optional() }),
    ],
    { error: 'expected a tolerance: "3%", a relative fraction (0.03), {relative: r} or {absolute: a}' },
  )
  .describe('"3%", a relative fraction such as 0.03, {relative: r} or {absolute: a} (SI unit of the output)');

const constantFluid = strict({
  rho: quantity.describe('density, kg/m^3'),
  cp: quantity.describe('specific heat, J/(kg K)'),
  mu: quantity.describe('dynamic viscosity, Pa s'),
  k: quantity.describe('thermal conductivity, W/(m K)'),
  beta: quantity.optional().describe('volumetric expansion coefficient, 1/K (free convection)'),
});

const column = z.array(finiteNumber, { error: 'expected a list of numbers' }).min(2, { error: 'expected at least 2 rows' });
const tableFluid = strict({
  T: column.describe('temperatures, K, increasing'),
  rho: column.describe('density, kg/m^3'),
  cp: column.describe('specific heat, J/(kg K)'),
  mu: column.describe('dynamic viscosity, Pa s'),
  k: column.describe('thermal conductivity, W/(m K)'),
  beta: column.optional().describe('volumetric expansion coefficient, 1/K'),
});

// A mixture's parameter: a percentage ("40 %") or a fraction (0.4).
const fractionError = 'expected a percentage such as "40 %" or a fraction such as 0.4';
const fraction = z
  .union([z.string().regex(percentPattern, { error: fractionError }), z.number({ error: fractionError })], { error: fractionError })
  .describe('a percentage such as "40 %", or a fraction such as 0.4');

const mixtureFluid = strict({
  name: z.string({ error: 'expected a fluid name such as propylene-glycol-water' }).describe('catalogue fluid name'),
  concentration: fraction.optional().describe('glycol mass fraction of a glycol–water solution, 10 % to 60 %'),
  relative_humidity: fraction
    .optional()
    .describe('relative humidity of humid-air, 0 % to 100 % (its pressure is the pressure input, default 1 atm)'),
});

export const fluidSchema = z
  .union([z.string(), strict({ constant: constantFluid }), strict({ table: tableFluid }), mixtureFluid], {
    error:
      'expected a catalogue fluid name, {name: propylene-glycol-water, concentration: 40 %}, ' +
      '{name: humid-air, relative_humidity: 60 %}, {constant: {rho, cp, mu, k}} or {table: {T, rho, cp, mu, k}}',
  })
  .describe(
    'a catalogue fluid (water, air, …), a mixture {name: ethylene-glycol-water | propylene-glycol-water, concentration: 40 %} ' +
      'or {name: humid-air, relative_humidity: 60 %}, {constant: {rho, cp, mu, k, beta?}} or {table: {T: [...], rho: [...], cp, mu, k, beta?}}',
  );

const count = z
  .number({ error: 'expected a whole number ≥ 2' })
  .int({ error: 'expected a whole number ≥ 2' })
  .min(2, { error: 'expected a whole number ≥ 2' });

export const sweepEntrySchema = z
  .union(
    [
      z.array(inputValueSchema, { error: 'expected a list of values' }).min(1, { error: 'expected at least one value' }),
      strict({
        from: quantity,
        to: quantity,
        // Required except in a latin-hypercube sweep, whose `samples` sets the number of
        // points (parse.ts says which); optional here so both forms share one shape.
        count: count.optional().describe('number of values, both ends included (leave out in a latin-hypercube sweep)'),
        spacing: z
          .enum(['linear', 'log'], { error: 'expected linear or log' })
          .default('linear')
          .describe('linear, or log (even in log10; needs from and to > 0)'),
      }),
      strict({
        from: quantity,
        to: quantity,
        step: quantity.describe('increment; `to` is included when the steps land on it'),
      }),
    ],
    { error: 'expected a list, {from, to, count, spacing?} or {from, to, step}' },
  )
  .describe('a list of values, {from, to, count, spacing: linear|log} or {from, to, step}; latin-hypercube: {from, to, spacing?}');

export const sweepSchema = strict({
  design: z
    .enum(['grid', 'zip', 'latin-hypercube'], { error: 'expected grid, zip or latin-hypercube' })
    .default('grid')
    .describe('grid: every combination, last key varying fastest; zip: entries side by side; latin-hypercube: seeded sampling'),
  seed: z
    .number({ error: 'expected a whole number' })
    .int({ error: 'expected a whole number' })
    .default(1)
    .describe('seed of the sampling designs'),
  samples: z
    .number({ error: 'expected a whole number ≥ 1' })
    .int({ error: 'expected a whole number ≥ 1' })
    .min(1, { error: 'expected a whole number ≥ 1' })
    .optional()
    .describe('number of points of a latin-hypercube sweep'),
  over: z
    .record(z.string(), sweepEntrySchema, { error: 'expected a mapping of input names to sweep entries' })
    .default({})
    .describe('swept inputs, in order'),
});

export const checkSchema = strict({
  at: z
    .record(z.string(), inputValueSchema, { error: 'expected a mapping of input or output names to values' })
    .describe('values that pick one point: swept or fixed inputs, or outputs such as Re (units allowed)'),
  method: z.string({ error: 'expected a method id' }).describe('method id'),
  expect: z
    .record(z.string(), quantity, { error: 'expected a mapping of output names to values' })
    .describe('expected outputs (or a target\'s solved input): SI numbers or strings with units such as "3.2 m/s"'),
  tolerance: toleranceSchema,
});

// Design answers (issue 11): the input that meets a requirement, the inputs' tolerances
// and the Monte Carlo settings of the uncertainty bands. Units and names are checked in
// parse.ts against the configuration.
export const targetSchema = strict({
  output: z.string({ error: 'expected an output name such as h, heat_rate or outlet_temperature' }).describe('the output to meet'),
  value: quantity.describe('the required value of the output (units allowed: "50 W/(m^2 K)", "35 degC")'),
  adjust: z.string({ error: 'expected an input name such as velocity or length' }).describe('the input solved for; neither fixed nor swept'),
  within: z
    .array(quantity, { error: 'expected [low, high], e.g. [0.1 m/s, 30 m/s]' })
    .min(2, { error: 'expected two values [low, high]' })
    .max(2, { error: 'expected two values [low, high]' })
    .describe('the search interval [low, high] of the adjusted input'),
});

/** A tolerance of an input: `5 %` (relative) or a value with units (absolute), a 95 % half-width. */
export const inputToleranceSchema = z
  .union([finiteNumber, z.string()], { error: 'expected a percentage such as "5 %" or a value with units such as "0.1 mm"' })
  .describe('95 % half-width: "5 %" (relative), or a value with units such as "0.1 mm" or "2 K" (absolute; plain numbers are SI)');

export const uncertaintySchema = strict({
  samples: z
    .number({ error: 'expected a whole number from 20 to 100000' })
    .int({ error: 'expected a whole number from 20 to 100000' })
    .min(20, { error: 'expected a whole number from 20 to 100000' })
    .max(100_000, { error: 'expected a whole number from 20 to 100000' })
    .default(400)
    .describe('Monte Carlo samples per point and method (used when tolerances are given)'),
  seed: z
    .number({ error: 'expected a whole number' })
    .int({ error: 'expected a whole number' })
    .default(1)
    .describe('seed of the samples; with the point index it fixes every draw, on any machine and worker count'),
});

export const studySchema = strict({
  name: z
    .string({ error: 'expected a slug such as glycol-heater-tube' })
    .regex(slugPattern, { error: 'expected a slug: lowercase letters and digits joined by hyphens' })
    .describe('slug: lowercase letters and digits joined by hyphens'),
  title: z.string({ error: 'expected a string' }).optional(),
  configuration: z.string({ error: 'expected a configuration id such as pipe' }).describe('configuration id from the catalogue'),
  methods: z
    .array(z.string({ error: 'expected a method id' }), { error: 'expected a list of method ids' })
    .min(1, { error: 'expected at least one method (or leave methods out for all)' })
    .optional()
    .describe('method ids; default every method of the configuration'),
  fluid: fluidSchema.optional(),
  inputs: z
    .record(z.string(), inputValueSchema, { error: 'expected a mapping of input names to values' })
    .default({})
    .describe('fixed inputs'),
  sweep: sweepSchema.optional(),
  target: targetSchema.optional().describe('solve, per point and method, the input that makes an output equal a value'),
  tolerances: z
    .record(z.string(), inputToleranceSchema, { error: 'expected a mapping of input names to tolerances' })
    .optional()
    .describe('95 % half-widths of inputs; results get <output>_low/_high bands'),
  uncertainty: uncertaintySchema.optional().describe('uncertainty bands: Monte Carlo samples and seed'),
  checks: z.array(checkSchema, { error: 'expected a list of checks' }).default([]),
  baseline: strict({
    tolerance: z
      .union([percent, nonNegative], { error: 'expected a relative tolerance: a number such as 1e-9 or "0.1%"' })
      .default(1e-9)
      .describe('relative tolerance when comparing with the committed baseline'),
  })
    .optional()
    .describe('comparison with the committed baseline'),
});

/** A study file as written, after structural checks and defaults. */
export type StudyFile = z.output<typeof studySchema>;

/** The JSON Schema of study files (draft 2020-12), for editors and `filmsweep schema`. */
export function studyJsonSchema(): object {
  return {
    ...z.toJSONSchema(studySchema, { io: 'input' }),
    title: 'Filmsweep study file',
    description: 'A parametric convection heat-transfer study: configuration, methods, fluid, fixed and swept inputs, checks.',
  };
}
