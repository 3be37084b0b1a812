// Values with units in study files ("25 mm", "80 degC", "1.5 L/min"), converted to the
// SI unit of the named quantity with mathjs. A problem is thrown as a UnitError whose
// message the study parser places at the value's line and column.
import { unit, type Unit } from 'mathjs';
import { findQuantity, type QuantitySpec } from '../physics/quantities.js';

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
