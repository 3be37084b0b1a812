// `filmsweep run FILE…`: validate every file first (nothing is written when one is bad),
// then sweep each across the worker pool into one run per file.
import type { Command } from 'commander';
import { defaultWorkers } from '../../shared/runner/environment.js';
import { parseWholeNumber } from '../options.js';
import type { SweepPool } from '../../shared/runner/pool.js';
import type { SweepCommandOptions } from '../sweep-report.js';

export function register(program: Command) {
  program
    .command('run')
    .description('validate study files, sweep every point across worker threads and store one run per file')
    .argument('<files...>', 'study files (YAML)')
    .option('-w, --workers <n>', `worker threads (default: the number of CPUs, ${defaultWorkers()})`, parseWholeNumber)
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--max-points <n>', 'refuse a study with more points than this', parseWholeNumber)
    .option('--batch-size <n>', 'points per batch and transaction (default: adapts to about 0.2 s per batch)', parseWholeNumber)
    .option('--queue <url>', 'put the batches on a Redis queue for `filmsweep worker` processes and follow the run: redis://host[:port][/db][?prefix=NAME]')
    .option(
      '--json',
      'print only one JSON document on stdout: {"runs": [{"id", "study", "status", "points_total", "points_done", "results", "flagged", "seconds"}]}',
    )
    .action(async (files: string[], opts: SweepCommandOptions & { db?: string; maxPoints?: number }) => {
      // The compute threads start first and load their code while this thread loads the
      // rest and checks the files (with --queue, `filmsweep worker` processes compute).
      const { createPool } = await import('../../shared/runner/pool.js');
      const pool = opts.queue === undefined ? createPool(opts.workers ?? defaultWorkers()) : undefined;
      try {
        await runFiles(files, opts, pool);
      } finally {
        await pool?.destroy();
      }
    });
}

async function runFiles(files: string[], opts: SweepCommandOptions & { db?: string; maxPoints?: number }, pool: SweepPool | undefined) {
  // Each command loads its dependencies when it runs, not with every `filmsweep` start.
  const { closeStore, openStore, resolveDbPath } = await import('../../shared/db/index.js');
  const { prepareStudy, runStudy } = await import('../../shared/runner/index.js');
  const { loadStudyFile } = await import('../../shared/study/index.js');
  const { InputError } = await import('../../shared/physics/types.js');
  const { queueNotice, sweepWithReporting } = await import('../sweep-report.js');
  // BullMQ is loaded only with --queue.
  const queue = opts.queue === undefined ? undefined : await import('../../shared/queue/index.js');
  const target = opts.queue === undefined ? undefined : queue!.parseQueueUrl(opts.queue);
  if (target && opts.workers !== undefined) throw new InputError('--workers: with --queue, each `filmsweep worker` sets its own threads');
  // Every file is read, validated and expanded before the database is opened.
  const prepared = files.map((file) => prepareStudy(loadStudyFile(file, { maxPoints: opts.maxPoints })));
  const store = await openStore(resolveDbPath(opts.db));
  try {
    await sweepWithReporting(store, opts, async function* (options, interrupted) {
      for (const study of prepared) {
        if (interrupted()) break;
        yield target ? await queue!.runOnQueue(store, study, target, { ...options, notify: queueNotice }) : await runStudy(store, study, { ...options, pool });
      }
    });
  } finally {
    await closeStore(store);
  }
}
