// Values typed on the command line (`--set diameter="25 mm"`, `--temperature 80degC`).
import { InputError, type InputValue, type Inputs } from '../shared/physics/types.js';
import { isDimensional, quantityToSI, UnitError, valueInUnit } from '../shared/study/units.js';

/** A temperature: plain numbers are kelvin, strings may carry units (`80 degC`). */
export function parseTemperature(raw: string, what = '--temperature'): number {
  const text = raw.trim();
  const n = Number(text);
  try {
    return valueInUnit('K', text !== '' && Number.isFinite(n) ? n : text, 'a temperature (K, degC, degF)');
  } catch (e) {
    throw new InputError(`${what}: ${(e as Error).message}`);
  }
}

/** One `NAME=VALUE` of `--set`: units for dimensional inputs, booleans, numbers or words. */
export function parseSet(pair: string): [string, InputValue] {
  const eq = pair.indexOf('=');
  if (eq <= 0) throw new InputError(`--set ${pair}: expected NAME=VALUE, e.g. --set Re=1e5 or --set diameter="25 mm"`);
  const name = pair.slice(0, eq).trim();
  const raw = pair.slice(eq + 1).trim();
  if (raw === '') throw new InputError(`--set ${name}: expected a value after '='`);
  const n = Number(raw);
  const numeric = Number.isFinite(n);
  try {
    if (isDimensional(name)) return [name, quantityToSI(name, numeric ? n : raw)];
  } catch (e) {
    if (e instanceof UnitError) throw new InputError(`--set ${name}: ${e.message}`);
    throw e;
  }
  if (numeric) return [name, n];
  if (raw === 'true' || raw === 'false') return [name, raw === 'true'];
  if (/^[-+.\d]/.test(raw)) throw new InputError(`--set ${name}=${raw}: expected a number (dimensionless input)`);
  return [name, raw];
}

export function parseSets(pairs: string[]): Inputs {
  const inputs: Inputs = {};
  for (const p of pairs) {
    const [k, v] = parseSet(p);
    if (k in inputs) throw new InputError(`--set ${k} given twice`);
    inputs[k] = v;
  }
  return inputs;
}
