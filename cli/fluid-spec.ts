// The fluid a command line names: `--fluid NAME` (or `fluid NAME`) with a mixture's
// `--concentration 40%`, `--relative-humidity 60%` and, for humid air, the pressure.
import type { FluidSpec } from '../shared/physics/fluids/index.js';
import { InputError } from '../shared/physics/types.js';
import { percentPattern } from '../shared/study/schema.js';

export interface FluidOptions {
  concentration?: string;
  relativeHumidity?: string;
}

/** "40%", "40 %" or a fraction "0.4" → 0.4; anything else is an InputError naming the flag. */
export function parseFraction(raw: string, flag: string): number {
  const text = raw.trim();
  if (percentPattern.test(text)) return Number.parseFloat(text) / 100;
  const n = Number(text);
  if (text === '' || !Number.isFinite(n)) {
    throw new InputError(`${flag}: expected a percentage such as 40% or a fraction such as 0.4, got '${raw}'`);
  }
  if (n > 1) throw new InputError(`${flag}: ${text} reads as a fraction (${n * 100} %); write ${text}% or ${n / 100}`);
  return n;
}

/** The spec for a name and the mixture flags; `pressure` (Pa) only reaches humid air. */
export function fluidSpecFrom(name: string, options: FluidOptions, pressure?: number): FluidSpec {
  const spec: { name: string; concentration?: number; relative_humidity?: number; pressure?: number } = { name };
  if (options.concentration !== undefined) spec.concentration = parseFraction(options.concentration, '--concentration');
  if (options.relativeHumidity !== undefined) {
    spec.relative_humidity = parseFraction(options.relativeHumidity, '--relative-humidity');
  }
  if (name === 'humid-air' && pressure !== undefined) spec.pressure = pressure;
  const parameters = Object.keys(spec).length > 1;
  return parameters ? spec : name;
}
