// Units on screen: which unit every input and output name carries (the one lookup of
// shared/export/units.ts, over the catalogue's method specs, the dimensional quantities
// and the engine's derived outputs) and how a value is shown. The store and the API stay
// SI; only absolute temperatures change with the user's choice of °C or K.
import { isAbsoluteTemperature, makeUnitLookup, type UnitLookup } from '../../../shared/export/units.js';
import type { MethodInfo } from '../api/types.js';
import { formatNumber } from './format.js';

export type TemperatureUnit = 'degC' | 'K';
export const TEMPERATURE_UNITS: readonly TemperatureUnit[] = ['degC', 'K'];

const KELVIN_AT_0_DEGC = 273.15; // SI brochure, 9th ed., §2.3.1

/** How one name is shown: its unit as written on screen and the SI ↔ display conversion. */
export interface Quantity {
  name: string;
  /** SI unit as the catalogue writes it (`W/(m^2·K)`, `1`), or undefined when nothing declares it. */
  si: string | undefined;
  /** The unit as shown: `W/(m²·K)`, `°C`, `-` for dimensionless, `?` when undeclared. */
  unit: string;
  /** An absolute temperature (offset between °C and K). */
  temperature: boolean;
  toDisplay(si: number): number;
  fromDisplay(shown: number): number;
}

export type Quantities = (name: string) => Quantity;

/** Superscripts and a middle dot for units as printed (`m^2` → `m²`, `W/(m^2 K)` → `W/(m²·K)`). */
export function prettyUnit(unit: string): string {
  const sup: Record<string, string> = { '-': '⁻', '1': '¹', '2': '²', '3': '³', '4': '⁴' };
  return unit
    .replace(/\^(-?\d)/g, (_, e: string) => [...e].map((c) => sup[c] ?? c).join(''))
    .replace(/(?<=[A-Za-z²³⁴)]) (?=[A-Za-z(])/g, '·');
}

const identity = (v: number) => v;

/** The display rule for a run's names, given its methods' specs and the temperature choice. */
export function makeQuantities(methods: readonly Pick<MethodInfo, 'inputs' | 'outputs'>[], temperature: TemperatureUnit): Quantities {
  return quantitiesFrom(makeUnitLookup(methods), temperature);
}

export function quantitiesFrom(unitOf: UnitLookup, temperature: TemperatureUnit): Quantities {
  const cache = new Map<string, Quantity>();
  return (name) => {
    let q = cache.get(name);
    if (q) return q;
    const si = unitOf(name);
    const absolute = isAbsoluteTemperature(name, si);
    const inCelsius = absolute && temperature === 'degC';
    q = {
      name,
      si,
      unit: si === undefined ? '?' : si === '1' || si === '' ? '-' : inCelsius ? '°C' : prettyUnit(si),
      temperature: absolute,
      toDisplay: inCelsius ? (v) => v - KELVIN_AT_0_DEGC : identity,
      fromDisplay: inCelsius ? (v) => v + KELVIN_AT_0_DEGC : identity,
    };
    cache.set(name, q);
    return q;
  };
}

/** `h [W/(m²·K)]`: a column header, axis title or legend label. */
export function labelWithUnit(q: Quantity): string {
  return `${q.name} [${q.unit}]`;
}

/** A value with its unit: `26.2 °C`, `55.2 W/(m²·K)`, `4,024` for a dimensionless number. */
export function formatQuantity(q: Quantity, si: number | null | undefined, digits = 4): string {
  if (si === null || si === undefined) return '—';
  const text = formatNumber(q.toDisplay(si), digits);
  return q.unit === '-' || q.unit === '?' ? text : `${text} ${q.unit}`;
}
