// The design-answer blocks of a study file (issue 11), checked against the
// configuration: `target` (an output to meet by solving one input), `tolerances` (95 %
// half-widths of inputs) and `uncertainty` (Monte Carlo samples and seed). Every problem
// is reported at its line and column; the result is the DesignSpec the runner uses.
//
// Decision: the adjusted input must be neither fixed nor swept. The solver replaces its
// value at every point, so a value written in the file would be silently ignored; the
// error says so instead.
import { derivedUnits, makeUnitLookup } from '../export/units.js';
import type { DesignSpec, DesignTarget, InputTolerance } from '../design/types.js';
import type { InputSpec, InputValue, Method } from '../physics/types.js';
import type { Path } from './positions.js';
import { percentPattern } from './schema.js';
import { UnitError, differenceInUnit, differenceToSI, hasUnits, isDimensional, valueInUnit } from './units.js';

type Report = (path: Path, message: string, key?: boolean) => void;

export interface DesignContext {
  configuration: string;
  methods: Method[];
  /** Dimensional inputs the configuration understands. */
  configurationInputs: Set<string>;
  /** Method input specs by name. */
  specs: Map<string, InputSpec[]>;
  fixedNames: string[];
  sweptNames: string[];
  /** Whether the study gives dimensional inputs (the engine then adds h, q, heat_rate, …). */
  dimensional: boolean;
  report: Report;
  /** Converts a value of an input to SI (reports and returns undefined on error). */
  convert: (path: Path, name: string, value: InputValue) => InputValue | undefined;
  /** `inputs, line N` or `sweep, line N`: where a name is written. */
  whereIs: (name: string) => string;
}

export interface RawDesignBlocks {
  target?: { output: string; value: number | string; adjust: string; within: (number | string)[] };
  tolerances?: Record<string, number | string>;
  uncertainty?: { samples: number; seed: number };
}

/** The output names a target or a check may name: the methods' outputs, and with dimensional inputs the engine's. */
export function knownOutputs(methods: readonly Method[], dimensional: boolean): Set<string> {
  const names = new Set(methods.flatMap((m) => m.outputs.map((o) => o.name)));
  if (dimensional) for (const n of Object.keys(derivedUnits)) names.add(n);
  return names;
}

/** An output's value in SI: `unit` is its SI unit ('1' for dimensionless). */
export function outputValueToSI(name: string, unit: string | undefined, value: number | string): number {
  if (typeof value === 'number') return value;
  if (unit === undefined || unit === '1') {
    throw new UnitError(hasUnits(value) ? `is dimensionless: give a plain number, not '${value}'` : `expected a number, got ${JSON.stringify(value)}`);
  }
  const si = unit.replace(/·/g, ' ');
  // A temperature difference ("5 degC" is 5 K), not an absolute temperature.
  return name.endsWith('_difference') ? differenceInUnit(si, value) : valueInUnit(si, value);
}

/** Where a tolerance value is a percentage ("5 %"), its fraction. */
function percentOf(value: number | string): number | undefined {
  return typeof value === 'string' && percentPattern.test(value) ? Number.parseFloat(value.trim()) / 100 : undefined;
}

/** Resolves the three blocks; undefined when the study has none of them. `ok` false when something was reported. */
export function resolveDesign(raw: RawDesignBlocks, ctx: DesignContext): { design?: DesignSpec; ok: boolean } {
  if (raw.target === undefined && raw.tolerances === undefined && raw.uncertainty === undefined) return { ok: true };
  let ok = true;
  const fail = (path: Path, message: string, key = false) => {
    ctx.report(path, message, key);
    ok = false;
  };
  const numericInput = (name: string) =>
    (isDimensional(name) && ctx.configurationInputs.has(name)) ||
    (!isDimensional(name) && (ctx.specs.get(name) ?? []).length > 0 && (ctx.specs.get(name) ?? []).every((s) => (s.type ?? 'number') === 'number'));
  const inputList = () => [...new Set([...ctx.configurationInputs, ...ctx.specs.keys()])].filter(numericInput).join(', ');

  let target: DesignTarget | undefined;
  if (raw.target) {
    const t = raw.target;
    const outputs = knownOutputs(ctx.methods, ctx.dimensional);
    const unitOf = makeUnitLookup(ctx.methods);
    let value: number | undefined;
    if (!outputs.has(t.output)) {
      const methodOutputs = [...new Set(ctx.methods.flatMap((m) => m.outputs.map((o) => o.name)))];
      const engine = ctx.dimensional ? ', and from the dimensional engine h, q, heat_rate, pressure_drop, surface_temperature, outlet_temperature, …' : '';
      fail(['target', 'output'], `'${t.output}' is not an output of configuration '${ctx.configuration}' (its methods give ${methodOutputs.join(', ')}${engine})`);
    } else {
      try {
        value = outputValueToSI(t.output, unitOf(t.output), t.value);
      } catch (e) {
        if (!(e instanceof UnitError)) throw e;
        fail(['target', 'value'], `${t.output}: ${e.message}`);
      }
    }
    const adjustOk = numericInput(t.adjust);
    if (!adjustOk) {
      fail(['target', 'adjust'], `'${t.adjust}' is not a numeric input of configuration '${ctx.configuration}' (its inputs: ${inputList()})`);
    } else if (ctx.fixedNames.includes(t.adjust) || ctx.sweptNames.includes(t.adjust)) {
      fail(
        ['target', 'adjust'],
        `'${t.adjust}' is the target's adjusted input and also given (${ctx.whereIs(t.adjust)}): the solver sets it at every point within 'within', so remove it from ${ctx.fixedNames.includes(t.adjust) ? 'inputs' : 'the sweep'}`,
      );
    }
    const within = adjustOk ? t.within.map((v, i) => ctx.convert(['target', 'within', i], t.adjust, v)) : [];
    if (adjustOk && within.every((v) => typeof v === 'number')) {
      const [lo, hi] = within as number[];
      if (!(lo < hi)) fail(['target', 'within'], `expected [low, high] with low < high, got [${lo}, ${hi}] (SI)`);
      else if (value !== undefined) target = { output: t.output, value, adjust: t.adjust, within: [lo, hi] };
    } else ok = false;
  }

  const tolerances: Record<string, InputTolerance> = {};
  const given = [...ctx.fixedNames, ...ctx.sweptNames];
  for (const [name, rawValue] of Object.entries(raw.tolerances ?? {})) {
    const path: Path = ['tolerances', name];
    if (raw.target && name === raw.target.adjust && numericInput(name)) {
      fail(path, `'${name}' is the target's adjusted input: its value is solved, not given, so it has no tolerance (its band comes out as ${name}_low/_high)`, true);
      continue;
    }
    if (!given.includes(name)) {
      fail(path, `tolerance on '${name}', which is not an input of this study (inputs: ${given.join(', ') || 'none'})`, true);
      continue;
    }
    if (!numericInput(name)) {
      fail(path, `'${name}' is not a numeric input: only numbers can vary by a tolerance`, true);
      continue;
    }
    const fraction = percentOf(rawValue);
    if (fraction !== undefined) {
      tolerances[name] = { relative: fraction };
      continue;
    }
    try {
      const spec = ctx.specs.get(name)?.[0];
      const absolute = isDimensional(name)
        ? differenceToSI(name, rawValue)
        : typeof rawValue === 'number'
          ? rawValue
          : spec && spec.unit !== '1' && hasUnits(rawValue)
            ? valueInUnit(spec.unit, rawValue)
            : (() => {
                throw new UnitError(`expected a percentage such as "5 %" or a plain number (${name} is dimensionless), got ${JSON.stringify(rawValue)}`);
              })();
      if (!(absolute >= 0)) throw new UnitError(`a tolerance is a half-width: expected a value ≥ 0, got ${JSON.stringify(rawValue)}`);
      tolerances[name] = { absolute };
    } catch (e) {
      if (!(e instanceof UnitError)) throw e;
      fail(path, `${name}: ${e.message}`);
    }
  }

  const banded = raw.tolerances !== undefined || raw.uncertainty !== undefined;
  const design: DesignSpec = { tolerances };
  if (target) design.target = target;
  if (banded) design.uncertainty = { samples: raw.uncertainty?.samples ?? 400, seed: raw.uncertainty?.seed ?? 1 };
  return { design, ok };
}
