// `filmsweep fluid NAME --temperature T`: a fluid's properties at one temperature.
import type { Command } from 'commander';
import { formatNumber, printJson, table } from '../format.js';

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

export function register(program: Command) {
  program
    .command('fluid')
    .description('properties of a catalogue fluid at a temperature (SI); refuses temperatures outside its data range')
    .argument('<name>', 'fluid name: air, water, engine-oil, ethylene-glycol, …')
    .requiredOption('-t, --temperature <T>', 'temperature: kelvin, or with units such as "80 degC"')
    .option('--json', 'print JSON: {fluid, temperature, rho, cp, mu, k, nu, alpha, Pr, beta}')
    .action(async (name: string, opts: { temperature: string; json?: boolean }) => {
      const { getFluid } = await import('../../shared/physics/fluids/index.js');
      const { parseTemperature } = await import('../values.js');
      const fluid = getFluid(name);
      const T = parseTemperature(opts.temperature);
      const p = fluid.properties(T);
      if (opts.json) {
        printJson({ fluid: fluid.name, temperature: T, ...p });
        return;
      }
      process.stdout.write(`${fluid.title} at ${formatNumber(T)} K (${formatNumber(T - 273.15)} °C)\n\n`);
      process.stdout.write(`${table(['property', 'value', 'unit'], rows.map(([k, label, unit]) => [label, p[k as keyof typeof p], unit]))}\n`);
      process.stdout.write(`\nvalid ${formatNumber(fluid.Tmin)}–${formatNumber(fluid.Tmax)} K; data: ${fluid.source}\n`);
    });
}
