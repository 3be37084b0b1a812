// The fluids the program knows by name.

import { InputError } from '../types.js';
import type { Fluid } from './types.js';
import { fluidFromTable } from './tableFluid.js';
import { airTable } from './data/air.js';
import { waterTable } from './data/water.js';
import { engineOilTable } from './data/engineOil.js';
import { ethyleneGlycolTable } from './data/ethyleneGlycol.js';

export const catalogueFluids: Fluid[] = [airTable, waterTable, engineOilTable, ethyleneGlycolTable].map(
  fluidFromTable,
);

export const fluidNames: string[] = catalogueFluids.map((f) => f.name);

const byName = new Map(catalogueFluids.map((f) => [f.name, f]));

/** The catalogue fluid of that name; InputError listing the known names otherwise. */
export function getFluid(name: string): Fluid {
  const fluid = byName.get(name);
  if (!fluid) {
    throw new InputError(`unknown fluid '${name}' (known fluids: ${fluidNames.join(', ')})`);
  }
  return fluid;
}
