// Studies uploaded to the dashboard run here, in the server's process, with the same
// runner as the CLI (its worker pool lives only as long as the run); so do runs a
// researcher resumes from the run page. shutdown() stops scheduling batches, lets those in
// flight commit, and waits for every pool to close; such a run ends `interrupted` and can
// be resumed (`filmsweep resume`, or POST /api/runs/:id/resume). A run left `running` by
// a server that was killed is marked `interrupted` at the next start (shared/db/reconcile.ts).
import { getUser } from '../shared/db/users.js';
import { ensureResultsCache } from '../shared/db/results-cache.js';
import { setRunStartedBy } from '../shared/db/studies.js';
import type { Store } from '../shared/db/store.js';
import { resumeRun, runStudy, type PreparedStudy, type RunOptions, type RunOutcome } from '../shared/runner/index.js';
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

  /** Whether this server is computing the run now. */
  has(runId: number): boolean {
    return this.running.has(runId);
  }

  /** Starts the run; resolves with its id once it exists in the database. */
  start(prepared: PreparedStudy, user: { id: number; email: string }, linkBase: string): Promise<number> {
    return this.launch((options) => runStudy(this.store, prepared, options), user, linkBase, true);
  }

  /**
   * Resumes an unfinished run (the runner's own checks: not done, not alive elsewhere, the
   * same study and method versions); resolves with its id once it is claimed.
   */
  resume(runId: number, user: { id: number; email: string }, linkBase: string): Promise<number> {
    if (this.running.has(runId)) throw new HttpError(409, `run ${runId} is already running on this server`);
    return this.launch((options) => resumeRun(this.store, runId, options), user, linkBase, false);
  }

  private launch(
    execute: (options: RunOptions) => Promise<RunOutcome>,
    user: { id: number; email: string },
    linkBase: string,
    recordStarter: boolean,
  ): Promise<number> {
    if (this.closing) throw new HttpError(503, 'the server is shutting down');
    if (this.running.size >= this.settings.maxConcurrent) {
      throw new HttpError(429, `${this.running.size} runs are in progress; try again when one has finished`);
    }
    const stop = new AbortController();
    return new Promise<number>((resolveId, rejectId) => {
      let runId: number | undefined;
      const done = execute({
        workers: this.settings.workers,
        stop: stop.signal,
        onStart: ({ runId: id }) => {
          runId = id;
          // An uploaded file has no folder: no git commit. Written synchronously, between batches.
          if (recordStarter) setRunStartedBy(this.store, id, user.id, null).catch(this.log);
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
    // Build the results cache now rather than on someone's first query of a large run.
    try {
      await ensureResultsCache(this.store, outcome.id);
    } catch (e) {
      this.log(e);
    }
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
