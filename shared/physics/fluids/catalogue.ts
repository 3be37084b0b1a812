// The fluids the program knows by name: fixed fluids (a name is enough) and mixtures (a name
// and parameters: a glycol concentration, a relative humidity and pressure).

import { InputError } from '../types.js';
import type { Fluid } from './types.js';
import { fluidFromTable } from './tableFluid.js';
import { airTable } from './data/air.js';
import { waterTable } from './data/water.js';
import { engineOilTable } from './data/engineOil.js';
import { ethyleneGlycolTable } from './data/ethyleneGlycol.js';
import { ethyleneGlycolWater, propyleneGlycolWater, type GlycolSolutionData } from './data/glycolWater.js';
import {
  GLYCOL_CONCENTRATION_MAX,
  GLYCOL_CONCENTRATION_MIN,
  GLYCOL_TMAX,
  freezingPoint,
  makeGlycolWater,
} from './glycolWater.js';
import { HUMID_AIR_PRESSURE_MAX, HUMID_AIR_PRESSURE_MIN, STANDARD_PRESSURE, humidAirSource, makeHumidAir } from './humidAir.js';
import { sodium } from './sodium.js';

export const catalogueFluids: Fluid[] = [
  ...[airTable, waterTable, engineOilTable, ethyleneGlycolTable].map(fluidFromTable),
  sodium,
];

/** One parameter of a mixture, in SI (fractions 0…1, Pa). */
export interface FluidParameter {
  name: 'concentration' | 'relative_humidity' | 'pressure';
  /** What the parameter is, for messages: "glycol mass fraction". */
  label: string;
  min: number;
  max: number;
  /** Used when the spec leaves the parameter out; required when undefined. */
  default?: number;
  /** The value as a user reads it, with its unit: "40 %", "101.325 kPa". */
  format(value: number): string;
  /** The range as a user reads it: "10 % to 60 %". */
  rangeText: string;
  /** How to give it, for the error that says it is missing. */
  example: string;
}

/** A fluid named with parameters: glycol–water solutions, humid air. */
export interface ParametricFluid {
  name: string;
  title: string;
  source: string;
  parameters: FluidParameter[];
  /** The temperature range, which may depend on the parameters (freezing point). */
  temperatureRange: string;
  make(values: Record<string, number>): Fluid;
}

const percent = (v: number) => `${Number((v * 100).toPrecision(6))} %`;
const kPa = (v: number) => `${Number((v / 1000).toPrecision(6))} kPa`;

function glycolFamily(data: GlycolSolutionData, title: string): ParametricFluid {
  const lowest = freezingPoint(data, GLYCOL_CONCENTRATION_MAX);
  return {
    name: data.name,
    title,
    source: data.source,
    parameters: [
      {
        name: 'concentration',
        label: 'glycol mass fraction',
        min: GLYCOL_CONCENTRATION_MIN,
        max: GLYCOL_CONCENTRATION_MAX,
        format: percent,
        rangeText: `${percent(GLYCOL_CONCENTRATION_MIN)} to ${percent(GLYCOL_CONCENTRATION_MAX)} by mass`,
        example: `{name: ${data.name}, concentration: 40 %} or --concentration 40%`,
      },
    ],
    temperatureRange: `freezing point (${(freezingPoint(data, GLYCOL_CONCENTRATION_MIN) - 273.15).toFixed(1)} °C at 10 %, ${(lowest - 273.15).toFixed(1)} °C at 60 %) to ${(GLYCOL_TMAX - 273.15).toFixed(0)} °C`,
    make: (values) => makeGlycolWater(data, values.concentration),
  };
}

export const parametricFluids: ParametricFluid[] = [
  glycolFamily(ethyleneGlycolWater, 'Ethylene glycol–water solution'),
  glycolFamily(propyleneGlycolWater, 'Propylene glycol–water solution'),
  {
    name: 'humid-air',
    title: 'Humid air',
    source: humidAirSource,
    parameters: [
      {
        name: 'relative_humidity',
        label: 'relative humidity over liquid water',
        min: 0,
        max: 1,
        format: percent,
        rangeText: '0 % to 100 %',
        example: '{name: humid-air, relative_humidity: 60 %} or --relative-humidity 60%',
      },
      {
        name: 'pressure',
        label: 'pressure',
        min: HUMID_AIR_PRESSURE_MIN,
        max: HUMID_AIR_PRESSURE_MAX,
        default: STANDARD_PRESSURE,
        format: kPa,
        rangeText: `${kPa(HUMID_AIR_PRESSURE_MIN)} to ${kPa(HUMID_AIR_PRESSURE_MAX)}`,
        example: 'the pressure input, e.g. pressure: 85 kPa',
      },
    ],
    temperatureRange: '0 °C to 100 °C',
    make: (values) => makeHumidAir(values.relative_humidity, values.pressure),
  },
];

/** Names of the fixed fluids, then the mixtures. */
export const fluidNames: string[] = [...catalogueFluids.map((f) => f.name), ...parametricFluids.map((f) => f.name)];

const byName = new Map(catalogueFluids.map((f) => [f.name, f]));

/**
 * The fixed catalogue fluid of that name. A mixture's name alone is an InputError saying
 * which parameter it needs (resolveFluidSpec takes the parameters); an unknown name lists
 * the known ones.
 */
export function getFluid(name: string): Fluid {
  const fluid = byName.get(name);
  if (fluid) return fluid;
  const family = parametricFluids.find((f) => f.name === name);
  if (family) {
    const needed = family.parameters.filter((p) => p.default === undefined);
    const p = needed[0];
    throw new InputError(`fluid '${name}' is a mixture: give its ${p.name} (${p.label} ${p.rangeText}), e.g. ${p.example}`);
  }
  throw new InputError(`unknown fluid '${name}' (known fluids: ${fluidNames.join(', ')})`);
}
