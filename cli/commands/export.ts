// `filmsweep export RUN|latest --format csv|json|md|tex|xlsx [--out FILE]`.
import { Option, type Command } from 'commander';
import { closeStore, getRunRows, openStore, resolveDbPath, resolveRunRef } from '../../shared/db/index.js';
import { exportFormats, exportRun, type ExportFormat } from '../../shared/export/index.js';
import { InputError } from '../../shared/physics/types.js';
import { writeFileAtomic } from '../write-file.js';

export function register(program: Command) {
  program
    .command('export')
    .description('export a run as a table: CSV or JSON for machines, Markdown or LaTeX for memos, XLSX for spreadsheets')
    .argument('<run>', "run id, or 'latest'")
    .addOption(new Option('-f, --format <format>', 'output format').choices([...exportFormats]).default('csv'))
    .option('-o, --out <file>', 'write to this file (default: standard output; xlsx needs --out or a pipe)')
    .option('--columns <names>', 'Markdown/LaTeX: comma-separated columns to show (default: varying inputs, Re/Ra, Nu, h, flags)')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .action(async (ref: string, opts: { format: ExportFormat; out?: string; columns?: string; db?: string }) => {
      if (opts.format === 'xlsx' && !opts.out && process.stdout.isTTY) {
        throw new InputError('--format xlsx writes a binary file: give --out FILE.xlsx or redirect standard output');
      }
      const store = await openStore(resolveDbPath(opts.db), { create: false });
      try {
        const run = await resolveRunRef(store, ref);
        const data = await getRunRows(store, run.id, { recommended: true });
        const columns = opts.columns?.split(',').map((c) => c.trim()).filter(Boolean);
        const result = await exportRun(data, opts.format, { columns });
        if (opts.out) {
          writeFileAtomic(opts.out, result.body);
          process.stderr.write(`wrote run ${run.id} (${data.rows.length} rows) to ${opts.out}\n`);
        } else {
          process.stdout.write(result.body);
        }
      } finally {
        await closeStore(store);
      }
    });
}
