// `filmsweep resume RUN`: finish an interrupted (or killed) run from its stored study
// version, computing only the points that have no results yet.
import type { Command } from 'commander';
import { defaultWorkers } from '../../shared/runner/environment.js';
import { parseWholeNumber } from '../options.js';
import type { SweepCommandOptions } from '../sweep-report.js';

export function register(program: Command) {
  program
    .command('resume')
    .description('finish an interrupted run without repeating or losing points (refuses a done run or one still running)')
    .argument('<run>', "run id, or 'latest'")
    .option('-w, --workers <n>', `worker threads (default: the number of CPUs, ${defaultWorkers()})`, parseWholeNumber)
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--batch-size <n>', 'points per batch and transaction (default: adaptive)', parseWholeNumber)
    .option('--force', 'take over a run marked running even if its process may be alive (other host, reused pid)')
    .option('--queue <url>', 'put the missing batches on the Redis queue of `filmsweep worker` processes and follow the run')
    .option('--json', 'print only one JSON document on stdout, shaped as for `run --json`')
    .action(async (ref: string, opts: SweepCommandOptions & { db?: string; force?: boolean }) => {
      const { closeStore, openStore, resolveDbPath, resolveRunRef } = await import('../../shared/db/index.js');
      const { resumeRun } = await import('../../shared/runner/index.js');
      const { InputError } = await import('../../shared/physics/types.js');
      const { queueNotice, sweepWithReporting } = await import('../sweep-report.js');
      // BullMQ is loaded only with --queue.
      const queue = opts.queue === undefined ? undefined : await import('../../shared/queue/index.js');
      const target = opts.queue === undefined ? undefined : queue!.parseQueueUrl(opts.queue);
      if (target && opts.workers !== undefined) throw new InputError('--workers: with --queue, each `filmsweep worker` sets its own threads');
      const store = await openStore(resolveDbPath(opts.db), { create: false });
      try {
        const run = await resolveRunRef(store, ref);
        await sweepWithReporting(store, opts, async function* (options) {
          yield target
            ? await queue!.resumeOnQueue(store, run.id, target, { ...options, force: opts.force, notify: queueNotice })
            : await resumeRun(store, run.id, { ...options, force: opts.force });
        });
      } finally {
        await closeStore(store);
      }
    });
}
