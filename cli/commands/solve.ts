// `filmsweep solve CONFIGURATION`: one point without a study file, every applicable
// method side by side (or only --method), in the row format of exports.
import type { Command } from 'commander';
import { missingInputs, solvePoint } from '../../shared/physics/engine.js';
import { InputError } from '../../shared/physics/types.js';
import { fluidSpecFrom } from '../fluid-spec.js';
import { printJson, table } from '../format.js';
import { parseSets } from '../values.js';

const collect = (v: string, acc: string[]) => [...acc, v];

interface SolveOptions {
  method: string[];
  set: string[];
  fluid?: string;
  concentration?: string;
  relativeHumidity?: string;
  profiles?: boolean;
  json?: boolean;
}

export function register(program: Command) {
  program
    .command('solve')
    .description('solve one point with every method of a configuration (or --method), without a study file')
    .argument('<configuration>', 'configuration id, e.g. flat-plate, pipe, cylinder (see `filmsweep methods`)')
    .option('-m, --method <id>', 'only this method (repeatable)', collect, [])
    .option('-s, --set <name=value>', 'an input, e.g. Re=1e5, Pr=0.7, diameter="25 mm" (repeatable)', collect, [])
    .option('-f, --fluid <name>', 'catalogue fluid for dimensional inputs (air, water, …)')
    .option('--concentration <c>', 'glycol mass concentration of a glycol–water --fluid, 10% to 60%')
    .option('--relative-humidity <phi>', 'relative humidity of --fluid humid-air, 0% to 100% (its pressure: --set pressure=…, default 1 atm)')
    .option('--profiles', 'include velocity and temperature profiles (similarity methods)')
    .option('--json', 'print JSON: {"rows": [{"method", "inputs", "outputs", "flags"}]}')
    .addHelpText(
      'after',
      '\nExamples:\n  filmsweep solve flat-plate --set Re=1e5 --set Pr=0.7\n' +
        '  filmsweep solve pipe --fluid water --set diameter="25 mm" --set velocity="1 m/s" \\\n' +
        '      --set fluid_temperature="40 degC" --set surface_temperature="60 degC" --set length="2 m"\n' +
        '  filmsweep solve pipe --fluid propylene-glycol-water --concentration 40% --set diameter="25 mm" …',
    )
    .action((configuration: string, opts: SolveOptions) => {
      const inputs = parseSets(opts.set);
      if (opts.profiles) inputs.profiles = true;
      const methods = opts.method.flatMap((m) => m.split(',')).filter(Boolean);
      if (opts.fluid === undefined && (opts.concentration !== undefined || opts.relativeHumidity !== undefined)) {
        throw new InputError('--concentration and --relative-humidity describe a --fluid: give --fluid too');
      }
      // Humid air reads the pressure input into its composition (fluids/humidAir.ts).
      const pressure = typeof inputs.pressure === 'number' ? inputs.pressure : undefined;
      const fluid = opts.fluid === undefined ? undefined : fluidSpecFrom(opts.fluid, opts, pressure);
      const plan = { configuration, methods, fluid };
      const rows = solvePoint(plan, inputs);
      const skipped = methods.length ? [] : missingInputs(plan, Object.keys(inputs));
      for (const s of skipped) process.stderr.write(`note: skipped ${s.method} (needs ${s.missing.join(', ')})\n`);
      if (opts.json) {
        printJson({ rows });
        return;
      }
      const names = [...new Set(rows.flatMap((r) => Object.keys(r.outputs)))];
      const body = names.map((n) => [n, ...rows.map((r) => r.outputs[n])]);
      body.push(['flags', ...rows.map((r) => (r.flags.length ? r.flags.join(' ') : '-'))]);
      process.stdout.write(`${table(['output', ...rows.map((r) => r.method)], body)}\n`);
      for (const r of rows) {
        if (!r.profiles) continue;
        const keys = Object.keys(r.profiles);
        const n = r.profiles[keys[0]]?.length ?? 0;
        process.stdout.write(`\nprofiles (${r.method}):\n`);
        process.stdout.write(`${table(keys, Array.from({ length: n }, (_, i) => keys.map((k) => r.profiles![k][i])))}\n`);
      }
      process.stdout.write(
        '\nEngineering estimates: correlations carry 10–25 % uncertainty and hold only inside their ranges (flags).\n',
      );
    });
}
