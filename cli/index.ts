// The `filmsweep` command: commander with one module per command in cli/commands/.
import { Command, CommanderError } from 'commander';
import { InputError } from '../shared/physics/types.js';
import { FluidRangeError } from '../shared/physics/fluids/types.js';
import { UnitError } from '../shared/study/units.js';
import { StudyError } from '../shared/study/errors.js';
import { EXIT, ExitError } from './errors.js';
import { register as registerRun } from './commands/run.js';
import { register as registerCheck } from './commands/check.js';
import { register as registerResume } from './commands/resume.js';
import { register as registerList } from './commands/list.js';
import { register as registerShow } from './commands/show.js';
import { register as registerExport } from './commands/export.js';
import { register as registerMethods } from './commands/methods.js';
import { register as registerFluid } from './commands/fluid.js';
import { register as registerSolve } from './commands/solve.js';
import { register as registerSchema } from './commands/schema.js';
import { register as registerInit } from './commands/init.js';
import { register as registerMigrate } from './commands/migrate.js';
import { register as registerServe } from './commands/serve.js';
import { register as registerUser } from './commands/user.js';
import { register as registerPush } from './commands/push.js';
import { register as registerDemo } from './commands/demo.js';
import { register as registerWorker } from './commands/worker.js';

const program = new Command();
program
  .name('filmsweep')
  .description('Parametric convection heat-transfer sweeps: similarity solutions and correlations side by side')
  .version('0.1.0')
  .showHelpAfterError('(run with --help for usage)')
  .exitOverride();

// Order of `--help`: the sweep loop first, then browsing, then the physics tools.
for (const register of [registerRun, registerCheck, registerResume, registerWorker, registerList, registerShow, registerExport, registerMethods, registerFluid, registerSolve, registerSchema, registerInit, registerServe, registerUser, registerPush, registerDemo, registerMigrate]) register(program);

function fail(code: number, message: string): never {
  process.stderr.write(`filmsweep: ${message}\n`);
  process.exit(code);
}

try {
  await program.parseAsync(process.argv);
} catch (e) {
  if (e instanceof CommanderError) {
    // --help and --version end here with exit code 0; usage errors were already printed.
    process.exit(e.exitCode === 0 ? EXIT.ok : EXIT.badInput);
  }
  if (e instanceof ExitError) fail(e.code, e.message);
  if (e instanceof InputError || e instanceof FluidRangeError || e instanceof UnitError) fail(EXIT.badInput, e.message);
  if (e instanceof StudyError) fail(EXIT.badInput, `invalid study file (nothing was run or written)\n${e.format()}`);
  // Anything else is a bug in Filmsweep: say so plainly, keep the detail for a report.
  const err = e as Error;
  process.stderr.write(`filmsweep: internal error: ${err?.message ?? String(e)}\n`);
  if (process.env.FILMSWEEP_DEBUG) process.stderr.write(`${err?.stack}\n`);
  process.exit(EXIT.runFailed);
}
