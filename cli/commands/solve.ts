// `filmsweep solve CONFIGURATION`: one point without a study file, every applicable
// method side by side (or only --method), in the row format of exports; with --target
// the input that meets a requirement, with --tolerance/--bands uncertainty bands, and
// always the summary across methods (applicable, spread, recommended).
import type { Command } from 'commander';
import { InputError } from '../../shared/physics/types.js';
import type { DesignOptions } from '../design-options.js';
import { formatNumber, printJson, table } from '../format.js';
import { parseWholeNumber } from '../options.js';

const collect = (v: string, acc: string[]) => [...acc, v];

function parseSeed(raw: string): number {
  const n = Number(raw);
  if (!Number.isSafeInteger(n)) throw new InputError(`--seed ${raw}: expected a whole number`);
  return n;
}

interface SolveOptions extends DesignOptions {
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
    .option('--target <output=value>', 'find the input (--adjust) at which an output equals a value, e.g. h="50 W/(m^2 K)"')
    .option('--adjust <input>', 'the input a --target solves for (not also --set)')
    .option('--within <lo..hi>', 'search interval of --adjust, e.g. "0.1 m/s..30 m/s" (plain numbers are SI)')
    .option('--tolerance <name=value>', "95 % half-width of a --set input: velocity=5% or diameter=\"0.1 mm\" (repeatable); adds _low/_high bands", collect, [])
    .option('--bands', "add _low/_high bands from the methods' stated uncertainty (implied by --tolerance)")
    .option('--samples <n>', 'Monte Carlo samples of the bands with --tolerance (default 400)', parseWholeNumber)
    .option('--seed <n>', 'seed of the Monte Carlo samples (default 1)', parseSeed)
    .option('--json', 'print JSON: {"rows": [{"method", "inputs", "outputs", "flags"}], "summary": {"applicable", "spread", "spread_of", "recommended", "reason", "flags"}}')
    .addHelpText(
      'after',
      '\nExamples:\n  filmsweep solve flat-plate --set Re=1e5 --set Pr=0.7\n' +
        '  filmsweep solve pipe --fluid water --set diameter="25 mm" --set velocity="1 m/s" \\\n' +
        '      --set fluid_temperature="40 degC" --set surface_temperature="60 degC" --set length="2 m"\n' +
        '  filmsweep solve pipe --fluid propylene-glycol-water --concentration 40% --set diameter="25 mm" …\n' +
        '  filmsweep solve cylinder --fluid air --set diameter="12.7 mm" --set fluid_temperature="26 degC" \\\n' +
        '      --set surface_temperature="128 degC" --target h="100 W/(m^2 K)" --adjust velocity --within "0.2 m/s..40 m/s"',
    )
    .action(async (configuration: string, opts: SolveOptions) => {
      // Each command loads its dependencies when it runs, not with every `filmsweep` start;
      // the study schema (for --fluid and the design options) only when they are given.
      const { compilePointDesigner } = await import('../../shared/design/point.js');
      const { summarizePoint } = await import('../../shared/design/summary.js');
      const { getMethod } = await import('../../shared/physics/catalogue.js');
      const { missingInputs, solvePoint } = await import('../../shared/physics/engine.js');
      const { displayUnit, makeUnitLookup } = await import('../../shared/export/units.js');
      const { parseSets } = await import('../values.js');
      const inputs = parseSets(opts.set);
      if (opts.profiles) inputs.profiles = true;
      const methods = opts.method.flatMap((m) => m.split(',')).filter(Boolean);
      if (opts.fluid === undefined && (opts.concentration !== undefined || opts.relativeHumidity !== undefined)) {
        throw new InputError('--concentration and --relative-humidity describe a --fluid: give --fluid too');
      }
      // Humid air reads the pressure input into its composition (fluids/humidAir.ts).
      const pressure = typeof inputs.pressure === 'number' ? inputs.pressure : undefined;
      const fluid = opts.fluid === undefined ? undefined : (await import('../fluid-spec.js')).fluidSpecFrom(opts.fluid, opts, pressure);
      const plan = { configuration, methods, fluid };
      // Any design option (designFromOptions checks them together); none: no design, nothing more to load.
      const { target, adjust, within, tolerance, bands, samples, seed } = opts;
      const asksDesign = [target, adjust, within, bands, samples, seed].some((o) => o !== undefined) || tolerance.length > 0;
      const design = asksDesign ? (await import('../design-options.js')).designFromOptions(opts, plan, inputs) : undefined;
      const names = [...Object.keys(inputs), ...(design?.target ? [design.target.adjust] : [])];
      const skipped = methods.length ? [] : missingInputs(plan, names);
      // A target's probe at the low end of its interval only checks the names: a method
      // refusing that end (Gnielinski at low Re) is the target's business, not an error.
      let rows = design?.target ? solvePoint(plan, { ...inputs, [design.target.adjust]: design.target.within[0] }, { strict: false }) : solvePoint(plan, inputs);
      const used = rows.map((r) => r.method);
      let summary = summarizePoint(rows, used.map((id) => ({ id, fraction: getMethod(configuration, id).uncertainty.fraction })));
      if (design) {
        // The plain solve above made the usual checks (unknown and missing inputs, fluid
        // ranges), for a target at the lower end of its interval; now the design answers.
        ({ rows, summary } = compilePointDesigner({ ...plan, methods: used }, used, design)(inputs, 0));
      }
      for (const s of skipped) process.stderr.write(`note: skipped ${s.method} (needs ${s.missing.join(', ')})\n`);
      if (opts.json) {
        printJson({ rows, summary });
        return;
      }
      const outputNames = [...new Set(rows.flatMap((r) => Object.keys(r.outputs)))];
      // Every value with its SI unit (`-` dimensionless), as the exports' headers give them.
      const unitOf = makeUnitLookup(used.map((id) => getMethod(configuration, id)));
      const body = outputNames.map((n) => [n, displayUnit(unitOf(n) ?? '?'), ...rows.map((r) => r.outputs[n])]);
      body.push(['flags', '', ...rows.map((r) => (r.flags.length ? r.flags.join(' ') : '-'))]);
      process.stdout.write(`${table(['output', 'unit', ...rows.map((r) => r.method)], body)}\n`);
      for (const r of rows) {
        if (!r.profiles) continue;
        const keys = Object.keys(r.profiles);
        const n = r.profiles[keys[0]]?.length ?? 0;
        process.stdout.write(`\nprofiles (${r.method}):\n`);
        process.stdout.write(`${table(keys, Array.from({ length: n }, (_, i) => keys.map((k) => r.profiles![k][i])))}\n`);
      }
      const spread = summary.spread === null ? '' : `; spread of ${summary.spread_of} ${formatNumber(summary.spread * 100, 3)} %`;
      process.stdout.write(
        `\nrecommended: ${summary.recommended ?? 'none (no-applicable-method)'} — ${summary.reason}${spread}\n` +
          'Engineering estimates: correlations carry 10–25 % uncertainty and hold only inside their ranges (flags).\n',
      );
    });
}
