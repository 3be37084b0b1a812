// Runs whose process died: a `running` run records the host and process id that compute
// it; when that process is gone (killed, power loss, a crashed server) nothing will ever
// finish the run. `serve` and `worker` call reconcileDeadRuns at start-up: each such run
// of this host is marked `interrupted` (its stored results stay; `filmsweep resume` or the
// dashboard's POST /api/runs/:id/resume finishes it), and a push the server had not
// finished is deleted (a push is all or nothing). Runs of other hosts are left alone: their
// processes cannot be checked from here.
import { recordAudit } from './audit.js';
import type { Store } from './store.js';

export interface ReconcileResult {
  interrupted: number[];
  /** Pushed runs whose push never finished, removed. */
  removed: number[];
}

/**
 * `isAlive(host, pid)` says whether a process may still be running (the runner's
 * processAlive). `selfPid` is this process: a run recorded with it was left by an earlier
 * process that had the same id, since nothing has started here yet.
 */
export async function reconcileDeadRuns(
  store: Store,
  host: string,
  isAlive: (host: string, pid: number) => boolean,
  selfPid = process.pid,
): Promise<ReconcileResult> {
  const running = await store.db
    .selectFrom('runs')
    .select(['id', 'pid', 'pushed_from'])
    .where('status', '=', 'running')
    .where('host', '=', host)
    .execute();
  const result: ReconcileResult = { interrupted: [], removed: [] };
  for (const run of running) {
    if (run.pid !== null && run.pid !== selfPid && isAlive(host, run.pid)) continue;
    // The same conditions again in the statement: a resume that claimed the run meanwhile wins.
    const pid = run.pid ?? -1;
    if (run.pushed_from !== null) {
      const r = await store.db
        .deleteFrom('runs')
        .where('id', '=', run.id)
        .where('status', '=', 'running')
        .where((eb) => eb.fn.coalesce('pid', eb.val(-1)), '=', pid)
        .executeTakeFirst();
      if (Number(r.numDeletedRows) === 1) result.removed.push(run.id);
    } else {
      const r = await store.db
        .updateTable('runs')
        .set({
          status: 'interrupted',
          finished_at: new Date().toISOString(),
          error: `the process computing it (pid ${run.pid ?? '?'} on ${host}) ended without finishing the run; resume it to compute the missing points`,
        })
        .where('id', '=', run.id)
        .where('status', '=', 'running')
        .where((eb) => eb.fn.coalesce('pid', eb.val(-1)), '=', pid)
        .executeTakeFirst();
      if (Number(r.numUpdatedRows) === 1) result.interrupted.push(run.id);
    }
  }
  return result;
}

/** reconcileDeadRuns at the start of `serve` or `worker`, with an audit entry when it changed anything. */
export async function reconcileAtStart(
  store: Store,
  by: 'serve' | 'worker',
  host: string,
  isAlive: (host: string, pid: number) => boolean,
): Promise<ReconcileResult> {
  const result = await reconcileDeadRuns(store, host, isAlive);
  if (result.interrupted.length || result.removed.length) {
    await recordAudit(store, { action: 'runs-reconciled', detail: { by, host, interrupted: result.interrupted, removed_unfinished_pushes: result.removed } });
  }
  return result;
}
