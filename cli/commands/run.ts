// `filmsweep run FILE…`: validate every file first (nothing is written when one is bad),
// then sweep each across the worker pool into one run per file.
import { InvalidArgumentError, type Command } from 'commander';
import { closeStore, getRecommendationCounts, getRun, getRunSummary, openStore, resolveDbPath, type Store } from '../../shared/db/index.js';
import {
  captureInterrupts,
  defaultWorkers,
  prepareStudy,
  runStudy,
  type RunOptions,
  type RunOutcome,
} from '../../shared/runner/index.js';
import { loadStudyFile } from '../../shared/study/index.js';
import { InputError } from '../../shared/physics/types.js';
import { parseQueueUrl } from '../../shared/queue/target.js';
import { EXIT, ExitError } from '../errors.js';
import { printJson } from '../format.js';
import { createProgress } from '../progress.js';
import { runReport } from './show.js';

export function parseWholeNumber(raw: string): number {
  const n = Number(raw);
  if (!/^\s*\d+\s*$/.test(raw) || !Number.isSafeInteger(n) || n < 1) throw new InvalidArgumentError('expected a whole number ≥ 1');
  return n;
}

/** What `run --json` and `resume --json` print per run. */
export function outcomeJson(o: RunOutcome) {
  return {
    id: o.id,
    study: o.study,
    status: o.status,
    points_total: o.points_total,
    points_done: o.points_done,
    results: o.results,
    flagged: o.flagged,
    seconds: Math.round(o.seconds * 1000) / 1000,
  };
}

export interface SweepCommandOptions {
  json?: boolean;
  workers?: number;
  batchSize?: number;
  /** The --queue URL of a queued run (for the resume hint). */
  queue?: string;
}

/**
 * Runs `work` (one or more runs) with Ctrl-C/SIGTERM captured, progress on stderr and,
 * per finished run, the summary on stdout; then the JSON document or the exit code.
 */
export async function sweepWithReporting(
  store: Store,
  opts: SweepCommandOptions,
  work: (options: RunOptions, interrupted: () => boolean) => AsyncGenerator<RunOutcome>,
): Promise<void> {
  const progress = createProgress({ enabled: !opts.json || Boolean(process.stderr.isTTY) });
  const interrupts = captureInterrupts((message) => {
    progress.stop();
    process.stderr.write(`filmsweep: ${message}\n`);
  });
  const outcomes: RunOutcome[] = [];
  try {
    const options: RunOptions = {
      workers: opts.workers,
      batchSize: opts.batchSize,
      stop: interrupts.stop,
      cancel: interrupts.cancel,
      onStart: (info) => progress.start(info),
      onProgress: (p) => progress.update(p),
    };
    for await (const outcome of work(options, () => interrupts.stop.aborted)) {
      progress.stop();
      outcomes.push(outcome);
      if (!opts.json) {
        const run = (await getRun(store, outcome.id))!;
        process.stdout.write(runReport(run, await getRunSummary(store, outcome.id), outcome.seconds, await getRecommendationCounts(store, outcome.id)));
      }
    }
  } finally {
    progress.stop();
    interrupts.dispose();
  }
  if (opts.json) printJson({ runs: outcomes.map(outcomeJson) });
  const bad = outcomes.filter((o) => o.status !== 'done');
  if (bad.length) {
    const what = bad.map((o) => `run ${o.id} ${o.status}${o.error ? `: ${o.error}` : ''}`).join('; ');
    const onQueue = opts.queue === undefined ? '' : ` --queue ${parseQueueUrl(opts.queue).display}`;
    const hint = bad.some((o) => o.status === 'interrupted') ? ` (finish with \`filmsweep resume ${bad[0].id}${onQueue}\`)` : '';
    throw new ExitError(EXIT.runFailed, `${what}${hint}`);
  }
  if (interrupts.received) throw new ExitError(EXIT.runFailed, `interrupted by ${interrupts.received}`);
}

/** Messages of a queued run (no worker connected yet, …) on stderr, beside the progress. */
export function queueNotice(message: string): void {
  process.stderr.write(`filmsweep: ${message}\n`);
}

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
      // BullMQ is loaded only with --queue, not by every `filmsweep` start.
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
            yield target ? await queue!.runOnQueue(store, study, target, { ...options, notify: queueNotice }) : await runStudy(store, study, options);
          }
        });
      } finally {
        await closeStore(store);
      }
    });
}
