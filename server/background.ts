// Studies uploaded to the dashboard run here, in the server's process, with the same
// runner as the CLI (its worker pool lives only as long as the run). shutdown() stops
// scheduling batches, lets those in flight commit, and waits for every pool to close;
// such a run ends `interrupted` and `filmsweep resume` can finish it.
import { getUser } from '../shared/db/users.js';
import { setRunStartedBy } from '../shared/db/studies.js';
import type { Store } from '../shared/db/store.js';
import { runStudy, type PreparedStudy, type RunOutcome } from '../shared/runner/index.js';
import { HttpError } from './http-error.js';
import type { Mailer } from './mail.js';

export class BackgroundRuns {
  private readonly running = new Map<number, { stop: AbortController; done: Promise<RunOutcome | undefined> }>();
  private closing = false;

  constructor(
    private readonly store: Store,
    private readonly mailer: Mailer,
    private readonly settings: { workers: number; maxConcurrent: number; publicUrl?: string },
    private readonly log: (e: unknown) => void,
  ) {}

  get active(): number {
    return this.running.size;
  }

  /** Starts the run; resolves with its id once it exists in the database. */
  start(prepared: PreparedStudy, user: { id: number; email: string }, linkBase: string): Promise<number> {
    if (this.closing) throw new HttpError(503, 'the server is shutting down');
    if (this.running.size >= this.settings.maxConcurrent) {
      throw new HttpError(429, `${this.running.size} runs are in progress; try again when one has finished`);
    }
    const stop = new AbortController();
    return new Promise<number>((resolveId, rejectId) => {
      let runId: number | undefined;
      const done = runStudy(this.store, prepared, {
        workers: this.settings.workers,
        stop: stop.signal,
        onStart: ({ runId: id }) => {
          runId = id;
          // An uploaded file has no folder: no git commit. Written synchronously, between batches.
          setRunStartedBy(this.store, id, user.id, null).catch(this.log);
          this.running.set(id, { stop, done });
          resolveId(id);
        },
      })
        .then(async (outcome) => {
          await this.finished(outcome, user.id, linkBase).catch(this.log);
          return outcome;
        })
        .catch((e: unknown) => {
          if (runId === undefined) rejectId(e);
          else this.log(e);
          return undefined;
        })
        .finally(() => {
          if (runId !== undefined) this.running.delete(runId);
        });
    });
  }

  private async finished(outcome: RunOutcome, userId: number, linkBase: string) {
    const user = await getUser(this.store, userId);
    if (!user || user.disabled) return;
    const base = this.settings.publicUrl ?? linkBase;
    const lines = [
      `Run ${outcome.id} of study ${outcome.study} ended: ${outcome.status}.`,
      `Points: ${outcome.points_done} of ${outcome.points_total}; results: ${outcome.results}, of which flagged: ${outcome.flagged}.`,
      ...(outcome.error ? [`Error: ${outcome.error}`] : []),
      '',
      `See it at ${base}/runs/${outcome.id}`,
    ];
    await this.mailer.send({ to: user.email, subject: `Filmsweep: run ${outcome.id} (${outcome.study}) ${outcome.status}`, text: lines.join('\n') });
  }

  /** Waits for a run started here to end (tests, shutdown). */
  async wait(runId: number): Promise<RunOutcome | undefined> {
    return this.running.get(runId)?.done;
  }

  async shutdown(): Promise<void> {
    this.closing = true;
    for (const r of this.running.values()) r.stop.abort();
    await Promise.all([...this.running.values()].map((r) => r.done));
  }
}
