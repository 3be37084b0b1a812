// Reading a study file: YAML with positions, the zod schema for structure, then the
// checks that need the catalogue (configuration, methods, inputs, fluid) and the sweep
// size limit. Every problem found is collected and thrown together as one StudyError,
// before anything runs.
import { LineCounter, isAlias, parseDocument, visit, type Document } from 'yaml';
import type { z } from '#zod';
import { getMethod, methodsFor, requireConfiguration } from '../physics/catalogue.js';
import { dimensionalInputsOf } from '../physics/configurations.js';
import { conflictMessage, inputConflicts } from '../physics/point-inputs.js';
import { derivableInputs, missingInputs, resolveFluid, unknownInputs, type FluidSpec, type SolvePlan } from '../physics/engine.js';
import { dimensionalNames } from '../physics/quantities.js';
import { InputError, type InputSpec, type InputValue, type Inputs, type Method } from '../physics/types.js';
import { StudyError, type Diagnostic } from './errors.js';
import { PositionFinder, type Path } from './positions.js';
import { checkSchema, inputValueSchema, studySchema, sweepEntrySchema, sweepSchema, type StudyFile } from './schema.js';
import { sha256Hex } from './sha256.js';
import { countPoints, entryLength, stepProblem, zipProblem, type Sweep, type SweepEntry } from './sweep.js';
import type { LoadedStudy, Study, StudyCheck, Tolerance } from './types.js';
import { UnitError, differenceToSI, hasUnits, isDimensional, quantityToSI, valueInUnit } from './units.js';
import type { DesignSpec } from '../design/types.js';
import { makeUnitLookup } from '../export/units.js';
import { outputValueToSI, resolveDesign } from './design-blocks.js';
import { issueMessages } from './zod-issues.js';

/** Default ceiling on the number of points of one study. */
export const DEFAULT_MAX_POINTS = 5_000_000;
/** YAML aliases resolved per document before the file is taken for an alias bomb. */
export const MAX_ALIAS_COUNT = 100;

export interface ParseOptions {
  /** Refuse sweeps with more points than this (counted without expanding). Default 5,000,000. */
  maxPoints?: number;
}

export function parseStudy(text: string, file: string, options: ParseOptions = {}): LoadedStudy {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false, uniqueKeys: true });
  const where = new PositionFinder(doc, lines);
  const diagnostics: Diagnostic[] = [];
  const fail = (): never => {
    throw new StudyError(diagnostics);
  };

  for (const e of doc.errors) {
    diagnostics.push({ file, ...where.at(e.pos[0]), message: `YAML: ${e.message}` });
  }
  if (diagnostics.length) fail();

  let raw: unknown;
  try {
    raw = doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (e) {
    const message =
      e instanceof ReferenceError && /alias/i.test(e.message)
        ? `YAML aliases expand too much (limit ${MAX_ALIAS_COUNT}): the file looks like an alias bomb and was not read`
        : `YAML: ${(e as Error).message}`;
    diagnostics.push({ file, ...firstAlias(doc, where), message });
    fail();
  }
  if (raw === null || raw === undefined) {
    diagnostics.push({ file, line: 1, column: 1, message: 'the file is empty; a study needs at least name and configuration' });
    fail();
  }

  const report = (path: Path, message: string, key = false) => diagnostics.push({ file, ...where.find(path, { key }), message });
  const parsed = studySchema.safeParse(raw);
  if (!parsed.success) {
    for (const m of issueMessages(parsed.error.issues, raw)) report(m.path, m.message, m.key);
  }
  // Keep going with the top-level fields that are well formed, so one run reports everything.
  const study = raw !== null && typeof raw === 'object' && !Array.isArray(raw) ? resolve(raw as Record<string, unknown>, report, where, options) : undefined;
  if (diagnostics.length) fail();
  if (!study) throw new Error(`internal: study '${file}' was refused without a diagnostic`);
  return { file, text, hash: sha256Hex(text), study };
}

type Report = (path: Path, message: string, key?: boolean) => void;

function resolve(raw: Record<string, unknown>, report: Report, where: PositionFinder, options: ParseOptions): Study | undefined {
  // Every piece is parsed on its own, so a broken entry does not hide problems elsewhere;
  // the full-schema pass has already reported what is wrong with the broken pieces.
  let complete = true;
  const piece = <T>(schema: z.ZodType<T>, value: unknown): T | undefined => {
    const r = schema.safeParse(value);
    if (!r.success) complete = false;
    return r.success ? r.data : undefined;
  };
  const shape = studySchema.shape;
  const name = piece(shape.name, raw.name);
  const title = piece(shape.title, raw.title);
  const configuration = piece(shape.configuration, raw.configuration);
  const listedMethods = piece(shape.methods, raw.methods);
  const rawFluid = piece(shape.fluid, raw.fluid);
  const rawBaseline = piece(shape.baseline, raw.baseline);
  const rawInputs = entriesOf(raw.inputs, inputValueSchema, piece);
  const sweepRaw = isRecord(raw.sweep) ? raw.sweep : {};
  if (raw.sweep !== undefined && !isRecord(raw.sweep)) complete = false;
  const design = piece(sweepSchema.shape.design, sweepRaw.design);
  const seed = piece(sweepSchema.shape.seed, sweepRaw.seed);
  const samples = piece(sweepSchema.shape.samples, sweepRaw.samples);
  const rawOver = entriesOf(sweepRaw.over, sweepEntrySchema, piece);
  const rawTarget = piece(shape.target, raw.target);
  const rawTolerances = piece(shape.tolerances, raw.tolerances);
  const rawUncertainty = piece(shape.uncertainty, raw.uncertainty);
  const rawChecks = Array.isArray(raw.checks) ? raw.checks.map((c) => piece(checkSchema, c)) : (piece(shape.checks, raw.checks) ?? []);
  // Names as written, whether or not their values are well formed.
  const fixedNames = isRecord(raw.inputs) ? Object.keys(raw.inputs) : [];
  const sweptNames = isRecord(sweepRaw.over) ? Object.keys(sweepRaw.over) : [];
  let sweepComplete = sweepSchema.safeParse(raw.sweep ?? {}).success;

  // Configuration and methods: what the remaining checks are measured against.
  let methods: Method[] | undefined;
  let configurationInputs: Set<string> | undefined;
  if (configuration !== undefined) {
    try {
      const c = requireConfiguration(configuration);
      // characteristic_length overrides the length of any configuration (engine.ts).
      configurationInputs = new Set(dimensionalInputsOf(c));
      const resolved = resolveMethods(configuration, listedMethods, raw.methods !== undefined, report);
      methods = resolved.methods;
      if (!resolved.ok) complete = false;
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      report(['configuration'], e.message);
    }
  }
  if (!methods) complete = false;
  const specs = new Map<string, InputSpec[]>();
  for (const m of methods ?? []) for (const s of m.inputs) specs.set(s.name, [...(specs.get(s.name) ?? []), s]);
  const convert = (path: Path, name: string, value: InputValue): InputValue | undefined => {
    try {
      return convertValue(name, value, methods ? specs.get(name) ?? [] : undefined);
    } catch (e) {
      if (!(e instanceof UnitError)) throw e;
      report(path, `${name}: ${e.message}`);
      complete = false;
      return undefined;
    }
  };

  // Fixed inputs.
  const inputs: Inputs = {};
  for (const [key, value] of Object.entries(rawInputs)) {
    const v = convert(['inputs', key], key, value);
    if (v !== undefined) inputs[key] = v;
  }

  // Sweep entries, in SI.
  const over: Record<string, SweepEntry> = {};
  for (const key of sweptNames) {
    const base = ['sweep', 'over', key];
    if (fixedNames.includes(key)) {
      report(base, `'${key}' is both fixed (inputs, line ${where.find(['inputs', key], { key: true }).line}) and swept`, true);
      complete = false;
    }
    const entry = rawOver[key];
    const e = entry === undefined ? undefined : convertEntry(base, key, entry, convert, methods ? specs.get(key) ?? [] : undefined, report, design ?? 'grid', samples);
    if (e) over[key] = e;
    else sweepComplete = complete = false;
  }

  // Fluid, with constant properties and mixture parameters in SI.
  const fluid = rawFluid === undefined ? undefined : convertFluid(rawFluid, report, { inputs, sweptNames });
  if (rawFluid !== undefined && fluid === undefined) complete = false;

  // Names against the catalogue: unknown, missing, and whether a fluid is needed. A
  // target's adjusted input is part of every point (design-blocks.ts checks its name).
  const adjustKnown = (n: string) => (isDimensional(n) ? configurationInputs?.has(n) : specs.has(n));
  const adjusted = rawTarget && adjustKnown(rawTarget.adjust) && !fixedNames.includes(rawTarget.adjust) && !sweptNames.includes(rawTarget.adjust) ? [rawTarget.adjust] : [];
  const names = [...fixedNames, ...sweptNames, ...adjusted];
  const pathOf = (n: string): Path => (fixedNames.includes(n) ? ['inputs', n] : sweptNames.includes(n) ? ['sweep', 'over', n] : ['target', 'adjust']);
  if (configurationInputs) {
    for (const n of names.filter((x) => isDimensional(x) && !configurationInputs.has(x))) {
      report(pathOf(n), `input '${n}' has no meaning for configuration '${configuration}' (its dimensional inputs: ${[...configurationInputs].join(', ')})`, true);
      complete = false;
    }
  }
  if (methods && configuration !== undefined) {
    const plan: SolvePlan = { configuration, methods: methods.map((m) => m.id), fluid };
    for (const unknown of unknownInputs(plan, names)) {
      const hint = closest(unknown, knownNames(methods));
      report(pathOf(unknown), `unknown input '${unknown}': no method of '${configuration}' uses it${hint ? `; did you mean '${hint}'?` : ''}`, true);
      complete = false;
    }
    // Without a usable fluid, what the engine could derive is unknown: report the fluid only.
    const fluidSettled = fluid !== undefined || (raw.fluid === undefined && !names.some(isDimensional));
    if (fluidSettled) {
      for (const { method, missing } of missingInputs(plan, names)) {
        report(methodPath(method, listedMethods), `method '${method}' needs ${missing.map((n) => `'${n}'`).join(', ')}, which the study neither gives nor lets the engine derive`);
        complete = false;
      }
    }
  }
  // One thing said once: velocity with Re, heat_flux with surface_temperature, Pr with a fluid …
  for (const c of inputConflicts(names, raw.fluid !== undefined)) {
    report(pathOf(c.second), conflictMessage(c), true);
    complete = false;
  }
  const dimensional = names.filter(isDimensional);
  if (dimensional.length && raw.fluid === undefined) {
    report(pathOf(dimensional[0]), `dimensional inputs (${dimensional.join(', ')}) need a fluid: add fluid: water, air, … or {constant: {...}}`, true);
    complete = false;
  }
  if (raw.fluid !== undefined && !names.includes('fluid_temperature')) {
    report(['fluid'], 'a fluid needs fluid_temperature (fixed or swept) to read its properties', true);
    complete = false;
  }

  // Design answers: target, tolerances, uncertainty.
  let designSpec: DesignSpec | undefined;
  if (methods && configurationInputs && configuration !== undefined) {
    const resolved = resolveDesign(
      { target: rawTarget, tolerances: rawTolerances, uncertainty: rawUncertainty },
      {
        configuration,
        methods,
        configurationInputs,
        specs,
        fixedNames,
        sweptNames,
        dimensional: names.some(isDimensional),
        report,
        convert,
        whereIs: (n) => (fixedNames.includes(n) ? `inputs, line ${where.find(['inputs', n], { key: true }).line}` : `sweep, line ${where.find(['sweep', 'over', n], { key: true }).line}`),
      },
    );
    designSpec = resolved.design;
    if (!resolved.ok) complete = false;
  }
  if ((raw.target !== undefined && !rawTarget) || (raw.tolerances !== undefined && !rawTolerances) || (raw.uncertainty !== undefined && !rawUncertainty)) complete = false;

  const resolvedSweep: Sweep = { design: design ?? 'grid', seed: seed ?? 1, over };
  if (samples !== undefined) resolvedSweep.samples = samples;
  if (sweepComplete && !checkSweepSize(resolvedSweep, inputs, report, options.maxPoints ?? DEFAULT_MAX_POINTS)) complete = false;

  const checks: StudyCheck[] = [];
  rawChecks.forEach((c, i) => {
    if (!c) return;
    const base = ['checks', i];
    const method = methods?.find((m) => m.id === c.method);
    // `at` picks rows of the run by input values, or by outputs such as a derived Re.
    const pickable = new Set([...names, ...(method?.inputs.map((s) => s.name) ?? []), ...(method?.outputs.map((o) => o.name) ?? [])]);
    if (configuration !== undefined && methods) for (const d of derivableInputs(configuration, names, fluid !== undefined)) pickable.add(d);
    const at: Inputs = {};
    for (const [key, value] of Object.entries(c.at)) {
      if (method && !pickable.has(key)) {
        report([...base, 'at', key], `'${key}' is neither an input of this study nor an input or output of '${method.id}'; 'at' picks a point by such values`, true);
        complete = false;
        continue;
      }
      const v = convert([...base, 'at', key], key, value);
      if (v !== undefined) at[key] = v;
    }
    if (methods && !method) {
      report([...base, 'method'], `method '${c.method}' is not one of this study's methods (${methods.map((m) => m.id).join(', ')})`);
      complete = false;
    }
    const expect: Record<string, number> = {};
    const unitOf = methods ? makeUnitLookup(methods) : () => undefined;
    for (const [out, value] of Object.entries(c.expect)) {
      try {
        expect[out] = isDimensional(out) && typeof value === 'string' ? quantityToSI(out, value) : outputValueToSI(out, unitOf(out), value);
      } catch (e) {
        if (!(e instanceof UnitError)) throw e;
        report([...base, 'expect', out], `${out}: ${e.message}`);
        complete = false;
      }
    }
    if (method && dimensional.length === 0) {
      // Dimensionless studies give exactly the method's outputs (and the design layer's
      // bands and solved input); dimensional ones add h, q, … (engine.ts).
      const designNames = designOutputNames(designSpec);
      for (const out of Object.keys(c.expect)) {
        if (!method.outputs.some((o) => o.name === out) && !designNames(out)) {
          report([...base, 'expect', out], `method '${method.id}' has no output '${out}' (outputs: ${method.outputs.map((o) => o.name).join(', ')})`, true);
          complete = false;
        }
      }
    }
    if (Object.keys(c.expect).length === 0) {
      report([...base, 'expect'], 'a check needs at least one expected output');
      complete = false;
    }
    const { line, column } = where.find(base);
    checks.push({ at, method: c.method, expect, tolerance: toleranceOf(c.tolerance), line, column });
  });

  if (!complete || name === undefined || configuration === undefined || !methods) return undefined;
  return {
    name,
    ...(title !== undefined && { title }),
    configuration,
    methods: methods.map((m) => m.id),
    ...(fluid !== undefined && { fluid }),
    inputs,
    sweep: resolvedSweep,
    checks,
    baseline: { tolerance: relativeOf(rawBaseline?.tolerance ?? 1e-9) },
    ...(designSpec !== undefined && { design: designSpec }),
  };
}

/** Whether a name is one the design layer adds to rows: the solved input, or a band or range end. */
function designOutputNames(design: DesignSpec | undefined): (name: string) => boolean {
  return (name) =>
    design !== undefined &&
    ((design.target !== undefined && (name === design.target.adjust || /_(min|max)$/.test(name))) || (design.uncertainty !== undefined && /_(low|high)$/.test(name)));
}

// The methods to run: those listed, or all of the configuration. Bad ids are reported
// (ok false) while the good ones still serve to check the rest of the file.
function resolveMethods(configuration: string, listed: string[] | undefined, written: boolean, report: Report): { methods?: Method[]; ok: boolean } {
  if (!listed) {
    if (written) return { ok: false }; // malformed list, already reported
    const all = methodsFor(configuration);
    if (all.length === 0) {
      report(['configuration'], `configuration '${configuration}' has no methods in the catalogue`);
      return { ok: false };
    }
    return { methods: all, ok: true };
  }
  const methods: Method[] = [];
  let ok = true;
  listed.forEach((id, i) => {
    if (listed.indexOf(id) !== i) {
      report(['methods', i], `method '${id}' is listed twice`);
      ok = false;
      return;
    }
    try {
      methods.push(getMethod(configuration, id));
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      report(['methods', i], e.message);
      ok = false;
    }
  });
  return { methods: methods.length ? methods : undefined, ok };
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

// The entries of a mapping whose values parse with the schema (the others are left out).
function entriesOf<T>(value: unknown, schema: z.ZodType<T>, piece: (s: z.ZodType<T>, v: unknown) => T | undefined): Record<string, T> {
  const out: Record<string, T> = {};
  if (value === undefined) return out;
  if (!isRecord(value)) {
    piece(schema, value); // marks the study incomplete
    return out;
  }
  for (const [k, v] of Object.entries(value)) {
    const parsed = piece(schema, v);
    if (parsed !== undefined) out[k] = parsed;
  }
  return out;
}

function methodPath(method: string, listed: string[] | undefined): Path {
  const i = listed?.indexOf(method) ?? -1;
  return i >= 0 ? ['methods', i] : ['configuration'];
}

/**
 * One value of an input in SI. Dimensional quantities take numbers (SI) or strings
 * with units; a method input takes what its InputSpec declares (a number, true/false,
 * or one of its words). `specs` undefined: the methods are unknown, only units are read.
 */
function convertValue(name: string, value: InputValue, specs: InputSpec[] | undefined): InputValue {
  if (isDimensional(name)) {
    if (typeof value === 'boolean') throw new UnitError(`expected a number (SI) or a string with units, got ${value}`);
    return quantityToSI(name, value);
  }
  let out = value;
  for (const spec of specs ?? []) {
    const type = spec.type ?? 'number';
    if (type === 'boolean' && typeof value !== 'boolean') throw new UnitError(`expected true or false, got ${JSON.stringify(value)}`);
    if (type === 'string') {
      const words = spec.choices ? `one of: ${spec.choices.join(', ')}` : 'a word';
      if (typeof value !== 'string' || (spec.choices && !spec.choices.includes(value))) {
        throw new UnitError(`expected ${words}, got ${JSON.stringify(value)}`);
      }
    }
    if (type === 'number' && typeof value !== 'number') {
      if (typeof value === 'string' && spec.unit !== '1' && hasUnits(value)) out = valueInUnit(spec.unit, value);
      else if (typeof value === 'string' && hasUnits(value)) {
        throw new UnitError(`is dimensionless: give a plain number, not '${value}'`);
      } else throw new UnitError(`expected a number, got ${JSON.stringify(value)}`);
    }
  }
  return out;
}

type RawEntry = z.output<typeof sweepEntrySchema>;

function convertEntry(
  base: Path,
  name: string,
  entry: RawEntry,
  convert: (path: Path, name: string, value: InputValue) => InputValue | undefined,
  specs: InputSpec[] | undefined,
  report: Report,
  design: Sweep['design'],
  samples: number | undefined,
): SweepEntry | undefined {
  if (Array.isArray(entry)) {
    const values = entry.map((v, i) => convert([...base, i], name, v));
    return values.every((v) => v !== undefined) ? { kind: 'list', values: values as InputValue[] } : undefined;
  }
  const nonNumeric = specs?.find((s) => (s.type ?? 'number') !== 'number');
  if (nonNumeric) {
    report(base, `${name}: a range needs a numeric input; give a list of values instead`);
    return undefined;
  }
  const from = convert([...base, 'from'], name, entry.from);
  const to = convert([...base, 'to'], name, entry.to);
  if (typeof from !== 'number' || typeof to !== 'number') return undefined;
  if (!('step' in entry)) {
    // A latin hypercube samples the interval: `samples` sets the number of points, so a
    // count there would be ignored; any other design needs one.
    if (design === 'latin-hypercube' && entry.count !== undefined) {
      report([...base, 'count'], `${name}: a latin-hypercube sweep takes its number of points from samples; remove count`, true);
      return undefined;
    }
    if (design !== 'latin-hypercube' && entry.count === undefined) {
      report(base, `${name}: a range needs count (the number of values, both ends included) or step; only a latin-hypercube sweep leaves it out (samples sets the number)`);
      return undefined;
    }
    if (entry.spacing === 'log' && !(from > 0 && to > 0)) {
      report([...base, 'spacing'], `${name}: log spacing needs from and to > 0, got ${from} and ${to}`);
      return undefined;
    }
    // In a latin hypercube the count only sizes the entry (the sampler uses from, to, spacing).
    return { kind: 'range', from, to, count: entry.count ?? Math.max(2, samples ?? 2), spacing: entry.spacing };
  }
  let step: number;
  try {
    step = isDimensional(name) ? differenceToSI(name, entry.step) : plainNumber(entry.step);
  } catch (e) {
    if (!(e instanceof UnitError)) throw e;
    report([...base, 'step'], `${name}: ${e.message}`);
    return undefined;
  }
  const problem = stepProblem({ from, to, step });
  if (problem) {
    report([...base, 'step'], `${name}: ${problem}`);
    return undefined;
  }
  return { kind: 'step', from, to, step };
}

function plainNumber(v: number | string): number {
  if (typeof v === 'number') return v;
  throw new UnitError(hasUnits(v) ? `is dimensionless: give a plain number, not '${v}'` : `expected a number, got ${JSON.stringify(v)}`);
}

// SI units of the `{constant: {...}}` properties, as mathjs spells them.
const propertyUnits = { rho: 'kg/m^3', cp: 'J/(kg K)', mu: 'Pa s', k: 'W/(m K)', beta: 'K^-1' } as const;

function convertFluid(
  raw: NonNullable<StudyFile['fluid']>,
  report: Report,
  study: { inputs: Inputs; sweptNames: string[] },
): FluidSpec | undefined {
  let spec: FluidSpec;
  if (typeof raw === 'string' || 'table' in raw) spec = raw;
  else if ('name' in raw) {
    const mixture = convertMixture(raw, report, study);
    if (!mixture) return undefined;
    spec = mixture;
  } else {
    const constant: Record<string, number> = {};
    let ok = true;
    for (const [key, value] of Object.entries(raw.constant)) {
      if (value === undefined) continue;
      try {
        constant[key] = valueInUnit(propertyUnits[key as keyof typeof propertyUnits], value);
      } catch (e) {
        if (!(e instanceof UnitError)) throw e;
        report(['fluid', 'constant', key], `${key}: ${e.message}`);
        ok = false;
      }
    }
    if (!ok) return undefined;
    spec = { constant: constant as { rho: number; cp: number; mu: number; k: number; beta?: number } };
  }
  try {
    resolveFluid(spec);
    return spec;
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    report(['fluid'], e.message);
    return undefined;
  }
}

type RawMixture = Extract<NonNullable<StudyFile['fluid']>, { name: string }>;

// `{name, concentration: 40 %}` or `{name: humid-air, relative_humidity: 60 %}` in SI
// fractions. Humid air takes the study's fixed `pressure` input (default 1 atm, see
// fluids/humidAir.ts): its composition at a given relative humidity depends on the
// pressure, and a study resolves its fluid once, so a swept pressure is refused.
function convertMixture(raw: RawMixture, report: Report, study: { inputs: Inputs; sweptNames: string[] }): FluidSpec | undefined {
  const spec: { name: string; concentration?: number; relative_humidity?: number; pressure?: number } = { name: raw.name };
  let ok = true;
  for (const key of ['concentration', 'relative_humidity'] as const) {
    const value = raw[key];
    if (value === undefined) continue;
    if (typeof value === 'number' && value > 1) {
      report(['fluid', key], `${key}: ${value} reads as a fraction (${value * 100} %); write "${value} %" or ${value / 100}`);
      ok = false;
      continue;
    }
    spec[key] = relativeOf(value);
  }
  if (raw.name === 'humid-air') {
    if (study.sweptNames.includes('pressure')) {
      report(['sweep', 'over', 'pressure'], "humid-air takes one pressure per study (its composition at a relative humidity depends on it): fix 'pressure' under inputs", true);
      ok = false;
    }
    const pressure = study.inputs.pressure;
    if (typeof pressure === 'number') spec.pressure = pressure;
  }
  return ok ? spec : undefined;
}

/** Design rules and the point limit, from entry lengths alone; false when something was reported. */
function checkSweepSize(sweep: Sweep, inputs: Inputs, report: Report, maxPoints: number): boolean {
  const entries = Object.entries(sweep.over);
  const refuse = (path: Path, message: string) => {
    report(path, message, true);
    return false;
  };
  if (sweep.design === 'zip') {
    const problem = zipProblem(sweep.over);
    if (problem) return refuse(['sweep', 'over'], problem);
  }
  if (sweep.design === 'latin-hypercube') {
    if (sweep.samples === undefined) return refuse(['sweep', 'design'], 'a latin-hypercube sweep needs samples (the number of points)');
    if (entries.length === 0) return refuse(['sweep', 'design'], 'a latin-hypercube sweep needs at least one entry under over');
  }
  const n = countPoints({ inputs, sweep });
  if (n > maxPoints) {
    const fmt = (x: number) => x.toLocaleString('en-US');
    const factors = sweep.design === 'grid' && entries.length > 1 ? ` (${entries.map(([, e]) => fmt(entryLength(e))).join(' × ')})` : '';
    return refuse(['sweep'], `the sweep has ${fmt(n)} points${factors}, more than the limit of ${fmt(maxPoints)}`);
  }
  return true;
}

type RawTolerance = StudyFile['checks'][number]['tolerance'];

function toleranceOf(t: RawTolerance): Tolerance {
  if (typeof t === 'string' || typeof t === 'number') return { relative: relativeOf(t) };
  const out: Tolerance = {};
  if (t.relative !== undefined) out.relative = t.relative;
  if (t.absolute !== undefined) out.absolute = t.absolute;
  return out;
}

/** `3%` → 0.03; a number is already a fraction. */
function relativeOf(t: string | number): number {
  return typeof t === 'number' ? t : Number.parseFloat(t.trim()) / 100;
}

function knownNames(methods: Method[]): string[] {
  return [...new Set(methods.flatMap((m) => m.inputs.map((s) => s.name)))];
}

// The known name closest to a typo (at most 2 edits), for a "did you mean" hint.
function closest(name: string, known: string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = 3;
  for (const k of [...known, ...dimensionalNames]) {
    const d = editDistance(name.toLowerCase(), k.toLowerCase());
    if (d < bestDistance) {
      best = k;
      bestDistance = d;
    }
  }
  return best;
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0];
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j];
      row[j] = Math.min(row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length];
}

function firstAlias(doc: Document, where: PositionFinder): { line: number; column: number } {
  let offset: number | undefined;
  visit(doc, {
    Alias(_, node) {
      if (isAlias(node) && node.range) {
        offset = node.range[0];
        return visit.BREAK;
      }
    },
  });
  return offset === undefined ? { line: 1, column: 1 } : where.at(offset);
}
