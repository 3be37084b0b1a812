// `filmsweep fluid NAME --temperature T`: a fluid's properties at one temperature;
// `filmsweep fluid` alone lists the catalogue fluids with their ranges and parameters.
import type { Command } from 'commander';
import { catalogueFluids, parametricFluids, resolveFluidSpec } from '../../shared/physics/fluids/index.js';
import { STANDARD_PRESSURE } from '../../shared/physics/fluids/humidAir.js';
import { InputError } from '../../shared/physics/types.js';
import { quantityToSI } from '../../shared/study/units.js';
import { fluidSpecFrom } from '../fluid-spec.js';
import { formatNumber, printJson, table } from '../format.js';
import { parseTemperature } from '../values.js';

const rows: [key: string, label: string, unit: string][] = [
  ['rho', 'density ρ', 'kg/m³'],
  ['cp', 'specific heat cp', 'J/(kg·K)'],
  ['mu', 'dynamic viscosity μ', 'Pa·s'],
  ['k', 'thermal conductivity k', 'W/(m·K)'],
  ['nu', 'kinematic viscosity ν', 'm²/s'],
  ['alpha', 'thermal diffusivity α', 'm²/s'],
  ['Pr', 'Prandtl number Pr', '-'],
  ['beta', 'expansion coefficient β', '1/K'],
];

interface FluidCommandOptions {
  temperature?: string;
  concentration?: string;
  relativeHumidity?: string;
  pressure?: string;
  json?: boolean;
}

/** The catalogue as `fluid` lists it: name, temperature range, parameters, source. */
function catalogueListing() {
  const kelvin = (T: number) => `${formatNumber(T)} K (${formatNumber(T - 273.15)} °C)`;
  return [
    ...catalogueFluids.map((f) => ({
      name: f.name,
      title: f.title,
      temperature_range: `${kelvin(f.Tmin)} to ${kelvin(f.Tmax)}`,
      Tmin: f.Tmin,
      Tmax: f.Tmax,
      parameters: [] as { name: string; range: string; default?: string }[],
      source: f.source,
    })),
    ...parametricFluids.map((f) => ({
      name: f.name,
      title: f.title,
      temperature_range: f.temperatureRange,
      parameters: f.parameters.map((p) => ({
        name: p.name,
        range: p.rangeText,
        ...(p.default !== undefined && { default: p.format(p.default) }),
      })),
      source: f.source,
    })),
  ];
}

export function register(program: Command) {
  program
    .command('fluid')
    .description(
      'properties of a catalogue fluid at a temperature (SI); refuses temperatures outside its data range. ' +
        'Without a name: the list of fluids with their ranges',
    )
    .argument('[name]', 'fluid name: air, water, engine-oil, propylene-glycol-water, humid-air, sodium, … (omit to list them)')
    .option('-t, --temperature <T>', 'temperature: kelvin, or with units such as "80 degC" (required with a name)')
    .option('--concentration <c>', 'glycol mass concentration of a glycol–water solution, 10% to 60%')
    .option('--relative-humidity <phi>', 'relative humidity of humid-air, 0% to 100%')
    .option('--pressure <p>', 'pressure of humid-air, e.g. "85 kPa" (default 1 atm)')
    .option('--json', 'print JSON: {fluid, temperature, rho, cp, mu, k, nu, alpha, Pr, beta}; without a name {fluids: [...]}')
    .action((name: string | undefined, opts: FluidCommandOptions) => {
      if (name === undefined) {
        const listing = catalogueListing();
        if (opts.json) {
          printJson({ fluids: listing });
          return;
        }
        const body = listing.map((f) => [
          f.name,
          f.temperature_range,
          f.parameters.length ? f.parameters.map((p) => `${p.name} ${p.range}${p.default ? ` (default ${p.default})` : ''}`).join('; ') : '-',
        ]);
        process.stdout.write(`${table(['fluid', 'temperature range', 'parameters'], body)}\n`);
        process.stdout.write('\nsources: `filmsweep fluid --json`; properties: filmsweep fluid NAME --temperature T\n');
        return;
      }
      if (opts.temperature === undefined) throw new InputError("required option '-t, --temperature <T>' not specified");
      if (opts.pressure !== undefined && name !== 'humid-air') {
        throw new InputError(`--pressure applies to humid-air only (air scales with pressure in a study or solve; liquids ignore it)`);
      }
      const pressure = opts.pressure === undefined ? undefined : pressureInPa(opts.pressure);
      const spec = fluidSpecFrom(name, opts, pressure ?? STANDARD_PRESSURE);
      const fluid = resolveFluidSpec(spec);
      const T = parseTemperature(opts.temperature);
      const p = fluid.properties(T);
      const { name: _, ...parameters } = typeof spec === 'string' ? { name } : (spec as { name: string });
      if (opts.json) {
        printJson({ fluid: fluid.name, ...parameters, temperature: T, ...p });
        return;
      }
      process.stdout.write(`${fluid.title} at ${formatNumber(T)} K (${formatNumber(T - 273.15)} °C)\n\n`);
      process.stdout.write(`${table(['property', 'value', 'unit'], rows.map(([k, label, unit]) => [label, p[k as keyof typeof p], unit]))}\n`);
      process.stdout.write(`\nvalid ${formatNumber(fluid.Tmin)}–${formatNumber(fluid.Tmax)} K; data: ${fluid.source}\n`);
    });
}

function pressureInPa(raw: string): number {
  const text = raw.trim();
  const n = Number(text);
  try {
    return quantityToSI('pressure', text !== '' && Number.isFinite(n) ? n : text);
  } catch (e) {
    throw new InputError(`--pressure: ${(e as Error).message}`);
  }
}
