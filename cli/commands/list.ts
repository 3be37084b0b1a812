// `filmsweep list`: the runs in the database, newest first.
import { existsSync } from 'node:fs';
import type { Command } from 'commander';
import { isDatabaseUrl, resolveDbPath } from '../../shared/db/path.js';
import { printJson, table } from '../format.js';

export function register(program: Command) {
  program
    .command('list')
    .description('list the runs in the database, newest first')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--study <name>', 'only runs of this study')
    .option('--json', 'print JSON: {"runs": [{"id", "study", "status", "points_total", "points_done", "started_at", "finished_at"}]}')
    .action(async (opts: { db?: string; study?: string; json?: boolean }) => {
      const path = resolveDbPath(opts.db);
      if (!isDatabaseUrl(path) && !existsSync(path)) {
        // Listing creates nothing: no file simply means no runs.
        if (opts.json) printJson({ runs: [] });
        else process.stdout.write(`no runs yet (no database at ${path})\n`);
        return;
      }
      const { closeStore, listRuns, openStore } = await import('../../shared/db/index.js');
      const store = await openStore(path);
      try {
        const runs = await listRuns(store, { study: opts.study });
        if (opts.json) {
          printJson({
            runs: runs.map(({ id, study, status, points_total, points_done, started_at, finished_at }) => ({
              id, study, status, points_total, points_done, started_at, finished_at,
            })),
          });
          return;
        }
        if (runs.length === 0) {
          process.stdout.write('no runs yet: `filmsweep run studies/FILE.yaml` makes one\n');
          return;
        }
        const rows = runs.map((r) => [
          r.id,
          r.study,
          r.study_version,
          r.status,
          `${r.points_done}/${r.points_total}`,
          r.flagged_count,
          r.started_at ?? '',
          r.finished_at ?? '',
        ]);
        process.stdout.write(`${table(['id', 'study', 'version', 'status', 'points', 'flagged', 'started', 'finished'], rows)}\n`);
      } finally {
        await closeStore(store);
      }
    });
}
