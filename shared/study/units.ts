// Values with units in study files ("25 mm", "80 degC", "1.5 L/min"), converted to the
// SI unit of the named quantity with mathjs. A problem is thrown as a UnitError whose
// message the study parser places at the value's line and column.
//
// mathjs is loaded on the first value that has units, not with this module: its ES module
// build takes 0.5–1 s to load, which every `filmsweep` command and every dimensionless
// study would pay for nothing. Its single-file build (`mathjs/lib/browser/math.js`, the
// same library, about 0.1 s) is loaded synchronously through require.
import { createRequire } from 'node:module';
import type { BigNumber, Unit } from 'mathjs';
import { findQuantity, type QuantitySpec } from '../physics/quantities.js';

type MathJs = typeof import('mathjs');
let mathjs: MathJs | undefined;
const math = (): MathJs => (mathjs ??= createRequire(import.meta.url)('mathjs/lib/browser/math.js') as MathJs);
/** mathjs's `unit` and `bignumber`, loading mathjs on the first call. */
const unit = ((...args: unknown[]) => (math().unit as (...a: unknown[]) => Unit)(...args)) as MathJs['unit'];
const bignumber = ((...args: unknown[]) => (math().bignumber as (...a: unknown[]) => BigNumber)(...args)) as MathJs['bignumber'];

export class UnitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UnitError';
  }
}

/** Whether a name is a dimensional quantity (quantities.ts) that accepts units. */
export function isDimensional(name: string): boolean {
  return findQuantity(name) !== undefined;
}

/**
 * A value of a dimensional input in its SI unit. Numbers are taken as SI already;
 * strings are read by mathjs, whose `degC`/`degF` are absolute temperatures with
 * offsets (80 degC → 353.15 K).
 */
export function quantityToSI(name: string, value: number | string): number {
  const q = findQuantity(name);
  if (!q) throw new UnitError(`'${name}' is not a dimensional quantity`);
  return valueInUnit(q.unit, value, describe(q));
}

/**
 * A difference of a dimensional input (a sweep step) in SI: the offset of degC/degF
 * does not apply, so `10 degC` is a step of 10 K and `9 degF` one of 5 K.
 */
export function differenceToSI(name: string, value: number | string): number {
  const q = findQuantity(name);
  if (!q) throw new UnitError(`'${name}' is not a dimensional quantity`);
  return differenceInUnit(q.unit, value, describe(q));
}

/** A difference in a given SI unit: offsets do not apply (`5 degC` is 5 K). */
export function differenceInUnit(siUnit: string, value: number | string, what = siUnit): number {
  if (typeof value === 'number') return finite(value, value);
  const u = readUnit(value);
  checkDimension(u, siUnit, value, what);
  return finite(u.toNumber(siUnit) - unit(0, u.formatUnits()).toNumber(siUnit), value);
}

/** A value in a given SI unit (fluid properties: `kg/m^3`, `J/(kg K)` …). */
export function valueInUnit(siUnit: string, value: number | string, what = siUnit): number {
  let si: number;
  if (typeof value === 'number') si = value;
  else {
    const u = readUnit(value);
    checkDimension(u, siUnit, value, what);
    si = u.toNumber(siUnit);
  }
  // An absolute temperature below 0 K (-300 degC, or -5 meant as degC) is a typo, not a state.
  if (siUnit === 'K' && si < 0) {
    throw new UnitError(`${JSON.stringify(value)} is below absolute zero (${si} K); plain numbers are kelvin`);
  }
  return finite(si, value);
}

/**
 * Values written in `unitText` (a unit alone, as in a CSV header `[degC]`) converted to
 * `siUnit`. mathjs reads and checks the unit once and gives the affine map si = a + b·v
 * in exact decimal arithmetic (BigNumber), so 26.2 degC → 299.34999999999997 K agrees with
 * unit(26.2, 'degC') to the last bit while a value costs one multiply and one add.
 */
export function converterToSI(siUnit: string, unitText: string, what = siUnit): (v: number) => number {
  // Export headers write products with a middle dot (W/(m^2·K)); mathjs reads a space.
  const si = siUnit.replace(/·/g, ' ');
  let zero: Unit;
  let one: Unit;
  try {
    zero = unit(bignumber(0), unitText);
    one = unit(bignumber(1), unitText);
  } catch (e) {
    throw new UnitError(`cannot read '${unitText}' as a unit (${(e as Error).message})`);
  }
  if (!zero.equalBase(unit(si))) throw new UnitError(`'${unitText}' has the wrong dimension: expected ${what}`);
  const a = zero.toNumeric(si) as BigNumber;
  const b = (one.toNumeric(si) as BigNumber).minus(a);
  const [offset, scale] = [a.toNumber(), b.toNumber()];
  return offset === 0 ? (v) => v * scale : scale === 1 ? (v) => v + offset : (v) => offset + scale * v;
}

/** True when the text is a number followed by a unit that mathjs knows. */
export function hasUnits(text: string): boolean {
  try {
    const u = unit(text);
    return u.value !== null && u.units.length > 0;
  } catch {
    return false;
  }
}

function readUnit(text: string): Unit {
  let u: Unit;
  try {
    u = unit(text);
  } catch (e) {
    throw new UnitError(`cannot read '${text}' as a number with units (${(e as Error).message})`);
  }
  if (u.value === null) throw new UnitError(`'${text}' has a unit but no number`);
  if (u.units.length === 0) throw new UnitError(`'${text}' is a string without units; give a plain number for SI`);
  return u;
}

function checkDimension(u: Unit, siUnit: string, text: string, what: string) {
  if (!u.equalBase(unit(siUnit))) {
    throw new UnitError(`'${text}' has the wrong dimension: expected ${what}`);
  }
}

function finite(v: number, original: number | string): number {
  if (!Number.isFinite(v)) throw new UnitError(`'${original}' is not a finite number`);
  return v;
}

function describe(q: QuantitySpec): string {
  return `a value convertible to ${q.unit} (${q.name}: ${q.description})`;
}
