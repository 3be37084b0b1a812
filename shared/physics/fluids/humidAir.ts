// Humid air at a relative humidity and a pressure, 273.15 K to 373.15 K, from the table
// generated out of the IAPWS humid-air formulation (data/humidAir.ts, written by
// data/generate_humid_air.py). One fluid is one (relative humidity, pressure): at every
// temperature node the table is interpolated by monotone cubics in relative humidity and then
// in ln(pressure); the resulting temperature table is an ordinary table fluid (monotone cubic in
// T, ln μ for viscosity). Density is interpolated as ρ/p, which the ideal-gas law makes nearly
// constant in pressure (ρ itself is exponential in ln p and would lose 0.1 % between nodes).

import { InputError } from '../types.js';
import { humidAirGrid, humidAirSourceVersion, type HumidAirGrid } from './data/humidAir.js';
import { MonotoneCubic } from './monotoneCubic.js';
import { fluidFromTable, type TableRow } from './tableFluid.js';
import type { Fluid } from './types.js';

export const HUMID_AIR_PRESSURE_MIN = humidAirGrid.pressures[0];
export const HUMID_AIR_PRESSURE_MAX = humidAirGrid.pressures[humidAirGrid.pressures.length - 1];
/** Standard atmosphere, Pa: the pressure when a study gives none. */
export const STANDARD_PRESSURE = 101325;

export const humidAirSource =
  `IAPWS G8-10 (2010) humid-air formulation (rho, cp, beta) with Wilke (mu) and Mason–Saxena (k) mixing of ` +
  `Lemmon & Jacobsen 2004 dry air and IAPWS 2008/2011 water vapour, tabulated with ${humidAirSourceVersion} ` +
  `(60–200 kPa, 0–100 % relative humidity over liquid water, 273.15–373.15 K)`;

const PROPERTIES = ['rho', 'cp', 'mu', 'k', 'beta'] as const;

/** Humid air at relative humidity phi (0…1) and pressure p (Pa); InputError outside the table. */
export function makeHumidAir(phi: number, pressure: number, grid: HumidAirGrid = humidAirGrid): Fluid {
  if (!(phi >= 0 && phi <= 1)) {
    throw new InputError(`fluid 'humid-air': relative_humidity must be 0 % to 100 %, got ${formatPercent(phi)}`);
  }
  const pMin = grid.pressures[0];
  const pMax = grid.pressures[grid.pressures.length - 1];
  if (!(pressure >= pMin && pressure <= pMax)) {
    throw new InputError(
      `fluid 'humid-air': pressure ${formatKPa(pressure)} is outside its table (${formatKPa(pMin)} to ${formatKPa(pMax)})`,
    );
  }
  const nPhi = grid.relativeHumidities.length;
  const lnP = grid.pressures.map(Math.log);
  const rows: TableRow[] = grid.temperatures.map((T, ti) => {
    const values = PROPERTIES.map((name) => {
      const table = grid[name];
      const perPressure = name === 'rho' ? (pi: number) => 1 / grid.pressures[pi] : () => 1;
      const atPressureNodes = grid.pressures.map((_, pi) => {
        const column = grid.relativeHumidities.map((__, fi) => table[pi * nPhi + fi][ti] * perPressure(pi));
        return new MonotoneCubic(grid.relativeHumidities, column).value(phi);
      });
      const value = new MonotoneCubic(lnP, atPressureNodes).value(Math.log(pressure));
      return name === 'rho' ? value * pressure : value;
    });
    return [T, ...values] as unknown as TableRow;
  });
  return fluidFromTable({
    name: 'humid-air',
    title: `Humid air, ${formatPercent(phi)} relative humidity at ${formatKPa(pressure)}`,
    source: humidAirSource,
    rows,
  });
}

function formatPercent(fraction: number): string {
  return `${Number((fraction * 100).toPrecision(6))} %`;
}

function formatKPa(pressure: number): string {
  return `${Number((pressure / 1000).toPrecision(6))} kPa`;
}
