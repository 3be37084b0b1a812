// Progress of a run on stderr: a bar with points per second and time left on a terminal,
// plain lines at most once a second otherwise (CI logs, pipes). stdout stays free for
// the summary table or the --json document.
import type cliProgress from 'cli-progress';
import type { RunProgress } from '../shared/runner/index.js';

export interface ProgressReporter {
  start(info: { runId: number; study: string; total: number; done: number }): void;
  update(p: RunProgress): void;
  stop(): void;
}

export interface ProgressOptions {
  stream?: NodeJS.WriteStream;
  /** false: report nothing (e.g. --json without a terminal). */
  enabled?: boolean;
}

const LINE_INTERVAL_MS = 1000;

/** Points per second over this process's own work, and seconds left at that rate. */
export function rateAndEta(p: Pick<RunProgress, 'done' | 'total' | 'doneAtStart' | 'elapsedMs'>): { rate: number; eta: number | undefined } {
  const rate = p.elapsedMs > 0 ? ((p.done - p.doneAtStart) * 1000) / p.elapsedMs : 0;
  const eta = rate > 0 ? (p.total - p.done) / rate : undefined;
  return { rate, eta };
}

export function formatDuration(seconds: number | undefined): string {
  if (seconds === undefined || !Number.isFinite(seconds)) return '?';
  if (seconds < 60) return `${Math.ceil(seconds)} s`;
  const m = Math.floor(seconds / 60);
  if (m < 60) return `${m} min ${Math.round(seconds - 60 * m)} s`;
  return `${Math.floor(m / 60)} h ${m % 60} min`;
}

export async function createProgress(options: ProgressOptions = {}): Promise<ProgressReporter> {
  const stream = options.stream ?? process.stderr;
  if (options.enabled === false) return { start() {}, update() {}, stop() {} };
  // The bar's package is loaded only for a terminal.
  return stream.isTTY ? barReporter(stream, (await import('cli-progress')).default) : lineReporter(stream);
}

function barReporter(stream: NodeJS.WriteStream, bars: typeof cliProgress): ProgressReporter {
  let bar: InstanceType<typeof cliProgress.SingleBar> | undefined;
  return {
    start(info) {
      bar = new bars.SingleBar(
        {
          stream,
          format: `run ${info.runId} ${info.study} |{bar}| {percentage}% {value}/{total} points | {rate} points/s | {left} left`,
          barCompleteChar: '█',
          barIncompleteChar: '░',
          hideCursor: true,
          fps: 10,
        },
        bars.Presets.shades_classic,
      );
      bar.start(info.total, info.done, { rate: '–', left: '?' });
    },
    update(p) {
      const { rate, eta } = rateAndEta(p);
      bar?.update(p.done, { rate: Math.round(rate).toLocaleString('en-US'), left: formatDuration(eta) });
    },
    stop() {
      bar?.stop();
      bar = undefined;
    },
  };
}

function lineReporter(stream: NodeJS.WriteStream): ProgressReporter {
  let last = 0;
  let latest: RunProgress | undefined;
  const print = (p: RunProgress) => {
    const { rate, eta } = rateAndEta(p);
    const pct = p.total ? Math.floor((100 * p.done) / p.total) : 100;
    stream.write(
      `run ${p.runId} ${p.study}: ${p.done}/${p.total} points (${pct} %), ${Math.round(rate)} points/s, ${formatDuration(eta)} left\n`,
    );
    last = performance.now();
  };
  return {
    start(info) {
      stream.write(`run ${info.runId} ${info.study}: ${info.total} points${info.done ? `, ${info.done} already done` : ''}\n`);
      last = performance.now();
      latest = undefined;
    },
    update(p) {
      latest = p;
      if (performance.now() - last >= LINE_INTERVAL_MS) print(p);
    },
    stop() {
      // Where an unfinished run stopped; a finished one is told by the summary.
      if (latest && latest.done < latest.total) print(latest);
      latest = undefined;
    },
  };
}
