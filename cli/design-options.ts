// The design options of `filmsweep solve` (--target, --adjust, --within, --tolerance,
// --bands, --samples, --seed) turned into the DesignSpec of shared/design, with the same
// checks a study file gets (shared/study/design-blocks.ts), as InputErrors naming the option.
import type { DesignSpec, DesignTarget, InputTolerance } from '../shared/design/types.js';
import { makeUnitLookup } from '../shared/export/units.js';
import { knownInputs, type SolvePlan } from '../shared/physics/engine.js';
import { getMethod, methodsFor } from '../shared/physics/catalogue.js';
import { InputError, type Inputs } from '../shared/physics/types.js';
import { knownOutputs, outputValueToSI } from '../shared/study/design-blocks.js';
import { percentPattern } from '../shared/study/schema.js';
import { UnitError, differenceToSI, isDimensional, quantityToSI } from '../shared/study/units.js';

export interface DesignOptions {
  target?: string;
  adjust?: string;
  within?: string;
  tolerance: string[];
  bands?: boolean;
  samples?: number;
  seed?: number;
}

function split(pair: string, option: string, example: string): [string, string] {
  const eq = pair.indexOf('=');
  if (eq <= 0 || eq === pair.length - 1) throw new InputError(`${option} ${pair}: expected NAME=VALUE, e.g. ${option} ${example}`);
  return [pair.slice(0, eq).trim(), pair.slice(eq + 1).trim()];
}

const asNumberOrText = (raw: string): number | string => (raw !== '' && Number.isFinite(Number(raw)) ? Number(raw) : raw);

function inUnits<T>(option: string, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof UnitError) throw new InputError(`${option}: ${e.message}`);
    throw e;
  }
}

/** The design asked for on the command line, or undefined when none of its options is given. */
export function designFromOptions(opts: DesignOptions, plan: SolvePlan, inputs: Inputs): DesignSpec | undefined {
  const anyTarget = opts.target !== undefined || opts.adjust !== undefined || opts.within !== undefined;
  const banded = opts.bands || opts.tolerance.length > 0 || opts.samples !== undefined || opts.seed !== undefined;
  if (!anyTarget && !banded) return undefined;
  const methods = plan.methods?.length ? plan.methods.map((id) => getMethod(plan.configuration, id)) : methodsFor(plan.configuration);
  const design: DesignSpec = { tolerances: {} };

  if (anyTarget) {
    if (opts.target === undefined || opts.adjust === undefined || opts.within === undefined) {
      throw new InputError('a target needs all three: --target OUTPUT=VALUE --adjust INPUT --within LO..HI');
    }
    const [output, rawValue] = split(opts.target, '--target', 'h="50 W/(m^2 K)"');
    const dimensional = Object.keys(inputs).some(isDimensional) || isDimensional(opts.adjust);
    const outputs = knownOutputs(methods, dimensional);
    if (!outputs.has(output)) throw new InputError(`--target ${output}: not an output of '${plan.configuration}' (outputs: ${[...outputs].join(', ')})`);
    const value = inUnits(`--target ${output}`, () => outputValueToSI(output, makeUnitLookup(methods)(output), asNumberOrText(rawValue)));
    const adjust = opts.adjust;
    if (!knownInputs(plan).includes(adjust)) throw new InputError(`--adjust ${adjust}: not an input of '${plan.configuration}'`);
    if (adjust in inputs) throw new InputError(`--adjust ${adjust}: also given with --set; the solver sets it within --within, so leave the --set out`);
    const ends = opts.within.split('..');
    if (ends.length !== 2) throw new InputError(`--within ${opts.within}: expected LO..HI, e.g. --within "0.1 m/s..30 m/s" or 0.1..30 (SI)`);
    const within = ends.map((e) =>
      inUnits('--within', () => (isDimensional(adjust) ? quantityToSI(adjust, asNumberOrText(e.trim())) : Number(e.trim()))),
    );
    if (!within.every(Number.isFinite) || !(within[0] < within[1])) throw new InputError(`--within ${opts.within}: expected two numbers LO < HI`);
    const target: DesignTarget = { output, value, adjust, within: [within[0], within[1]] };
    design.target = target;
  }

  for (const pair of opts.tolerance) {
    const [name, raw] = split(pair, '--tolerance', 'velocity=5%');
    if (typeof inputs[name] !== 'number') throw new InputError(`--tolerance ${name}: give ${name} with --set first (a tolerance varies a given number)`);
    let tolerance: InputTolerance;
    if (percentPattern.test(raw)) tolerance = { relative: Number.parseFloat(raw) / 100 };
    else {
      const absolute = inUnits(`--tolerance ${name}`, () => (isDimensional(name) ? differenceToSI(name, asNumberOrText(raw)) : Number(raw)));
      if (!(absolute >= 0)) throw new InputError(`--tolerance ${pair}: expected "5%" or a half-width ≥ 0 (units allowed for dimensional inputs)`);
      tolerance = { absolute };
    }
    design.tolerances[name] = tolerance;
  }
  if (banded) design.uncertainty = { samples: opts.samples ?? 400, seed: opts.seed ?? 1 };
  return design;
}
