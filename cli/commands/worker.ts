// `filmsweep worker --queue redis://…`: a long-running process that takes batches of
// runs started with `run --queue` from the queue, computes them on its own worker
// threads and writes them to the shared database. Start as many as there are machines;
// SIGINT/SIGTERM finishes the jobs in hand first (a second signal quits at once, and
// those jobs go back to the queue once their lock expires). At start it marks this host's
// runs whose process died `interrupted` (shared/db/reconcile.ts), as `serve` does.
import { InvalidArgumentError, type Command } from 'commander';
import { closeStore, openStore, resolveDbPath } from '../../shared/db/index.js';
import { reconcileAtStart } from '../../shared/db/reconcile.js';
import { DEFAULT_LOCK_DURATION_MS, DEFAULT_MAX_STALLED, DEFAULT_STALLED_INTERVAL_MS } from '../../shared/queue/defaults.js';
import { defaultWorkers, hostName, processAlive } from '../../shared/runner/index.js';
import type { QueueWorkerHandle } from '../../shared/queue/index.js';
import { EXIT } from '../errors.js';
import { parseWholeNumber } from './run.js';

interface WorkerCommandOptions {
  queue: string;
  db?: string;
  workers?: number;
  concurrency?: number;
  lockDuration?: number;
  stalledInterval?: number;
  maxStalled?: number;
}

function parseSeconds(raw: string): number {
  const s = Number(raw);
  if (!/^\s*\d+(\.\d+)?\s*$/.test(raw) || !(s >= 0.5) || s > 86_400) throw new InvalidArgumentError('expected seconds, 0.5 … 86400');
  return s;
}

const line = (text: string) => process.stdout.write(`${new Date().toISOString()} ${text}\n`);

export function register(program: Command) {
  program
    .command('worker')
    .description('take batches of `run --queue` runs from a Redis queue, compute them on local threads and store them')
    .requiredOption('--queue <url>', 'Redis of the queue: redis://[user:password@]host[:port][/db][?prefix=NAME]')
    .option('--db <file|url>', 'the database the runs are in, the same as `run --queue` uses (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('-w, --workers <n>', `worker threads (default: the number of CPUs, ${defaultWorkers()})`, parseWholeNumber)
    .option('--concurrency <n>', 'batches in hand at once (default: 2 × threads)', parseWholeNumber)
    .option(
      '--lock-duration <s>',
      `seconds a batch stays reserved for this worker without news from it; renewed every half of it while the worker lives (default ${DEFAULT_LOCK_DURATION_MS / 1000})`,
      parseSeconds,
    )
    .option(
      '--stalled-interval <s>',
      `seconds between this worker's checks for batches whose worker died (default ${DEFAULT_STALLED_INTERVAL_MS / 1000})`,
      parseSeconds,
    )
    .option('--max-stalled <n>', `times one batch may be taken back from a dead worker before it fails (default ${DEFAULT_MAX_STALLED})`, parseWholeNumber)
    .action(async (opts: WorkerCommandOptions) => {
      // BullMQ is loaded only by the commands that use it, not by every `filmsweep` start.
      const { parseQueueUrl, startQueueWorker } = await import('../../shared/queue/index.js');
      const target = parseQueueUrl(opts.queue);
      const store = await openStore(resolveDbPath(opts.db));
      const workers = opts.workers ?? defaultWorkers();
      let handle: QueueWorkerHandle;
      try {
        const { interrupted, removed } = await reconcileAtStart(store, 'worker', hostName(), processAlive);
        if (interrupted.length) line(`runs ${interrupted.join(', ')} had lost their process on this host: marked interrupted (resume them)`);
        if (removed.length) line(`unfinished pushes removed: run ${removed.join(', ')}`);
        handle = await startQueueWorker({
          target,
          store,
          workers,
          concurrency: opts.concurrency,
          lockDurationMs: opts.lockDuration && opts.lockDuration * 1000,
          stalledIntervalMs: opts.stalledInterval && opts.stalledInterval * 1000,
          maxStalledCount: opts.maxStalled,
          log: line,
        });
      } catch (e) {
        await closeStore(store);
        throw e;
      }
      line(
        `worker ${process.pid} on ${target.display} (prefix ${target.prefix}), database ${store.path}, ${workers} thread${workers === 1 ? '' : 's'}, ${handle.concurrency} batches at once`,
      );
      const signal = await new Promise<NodeJS.Signals>((resolve) => {
        process.once('SIGINT', resolve);
        process.once('SIGTERM', resolve);
      });
      line(`${signal}: finishing the batches in hand (again to quit now)`);
      const quit = () => {
        process.stderr.write('filmsweep: worker stopped; its batches go back to the queue when their lock expires\n');
        process.exit(EXIT.runFailed);
      };
      process.once('SIGINT', quit);
      process.once('SIGTERM', quit);
      await handle.close();
      await closeStore(store);
      line('worker stopped');
    });
}
