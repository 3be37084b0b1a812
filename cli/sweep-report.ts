// What `run`, `check` and `resume` share around the sweep itself: Ctrl-C/SIGTERM captured,
// progress on stderr, per finished run the summary on stdout (or one JSON document), and
// the exit code. Loaded by those commands' actions only.
import { getRecommendationCounts, getRun, getRunSummary, type Store } from '../shared/db/index.js';
import { parseQueueUrl } from '../shared/queue/target.js';
import { captureInterrupts, type RunOptions, type RunOutcome } from '../shared/runner/index.js';
import { EXIT, ExitError } from './errors.js';
import { printJson } from './format.js';
import { createProgress } from './progress.js';
import { runReport } from './commands/show.js';

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
  const progress = await createProgress({ enabled: !opts.json || Boolean(process.stderr.isTTY) });
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
