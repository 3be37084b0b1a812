// Long read-only statements (a comparison of two large runs) off the main thread. On
// SQLite, better-sqlite3 runs a statement synchronously, so one slow read stalls every
// other request of the server; here it runs in a worker thread on its own read-only
// connection (read-thread-worker.ts). PostgreSQL statements already run in the database
// server's process and go through the store's pool. Either way at most `MAX_WAITING`
// statements wait behind the running one; more are refused (ReadThreadBusyError), so a
// burst of expensive requests cannot queue up unbounded work.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import pLimit from 'p-limit';
import { Piscina } from 'piscina';
import type pg from 'pg';
import { numberPlaceholders } from './dialect.js';
import type { ReadTask } from './read-thread-worker.js';
import type { Store } from './store.js';

/** Statements that may wait while one runs; one more is refused. */
export const MAX_WAITING = 6;

export class ReadThreadBusyError extends Error {
  constructor() {
    super(`the server is already working on ${MAX_WAITING + 1} long reads; try again in a moment`);
    this.name = 'ReadThreadBusyError';
  }
}

/** Workers load plain JavaScript: the compiled file beside this one, or dist/ when running from sources (vitest). */
function workerFile(): string {
  const beside = fileURLToPath(new URL('./read-thread-worker.js', import.meta.url));
  if (existsSync(beside)) return beside;
  const built = fileURLToPath(new URL('../../dist/shared/db/read-thread-worker.js', import.meta.url));
  if (existsSync(built)) return built;
  throw new Error(`read-thread worker not found at ${beside} or ${built}: run \`npm run build\` first`);
}

let pool: Piscina<ReadTask, unknown[]> | undefined;
const limiters = new WeakMap<Store, ReturnType<typeof pLimit>>();

/** Rows of a read-only statement with `?` placeholders, off the main thread where that matters. */
export async function readOffThread<T>(store: Store, sql: string, params: unknown[] = []): Promise<T[]> {
  if (store.kind === 'sqlite' && store.path !== ':memory:') {
    // One thread: long reads take turns (the machine's other cores serve the requests).
    pool ??= new Piscina<ReadTask, unknown[]>({ filename: workerFile(), minThreads: 0, maxThreads: 1, maxQueue: MAX_WAITING, idleTimeout: 30_000 });
    try {
      return (await pool.run({ path: store.path, sql, params })) as T[];
    } catch (e) {
      if (/queue is at limit/i.test(String((e as Error)?.message))) throw new ReadThreadBusyError();
      throw e;
    }
  }
  let limit = limiters.get(store);
  if (!limit) limiters.set(store, (limit = pLimit(1)));
  if (limit.pendingCount >= MAX_WAITING) throw new ReadThreadBusyError();
  return limit(() => (store.pool ? readPostgres<T>(store.pool, sql, params) : store.dialect.all<T>(sql, params)));
}

/**
 * One statement in its own transaction with hash joins only and room to sort in memory.
 * Long reads join whole runs; a run written a moment ago has no planner statistics yet,
 * and PostgreSQL then guesses a few rows and picks a nested loop, which over two runs of
 * 120,000 points is hours instead of seconds (seen in tests/server-compare.test.ts).
 */
async function readPostgres<T>(pool: pg.Pool, sql: string, params: unknown[]): Promise<T[]> {
  const client = await pool.connect();
  try {
    await client.query('begin read only');
    await client.query("set local enable_nestloop = off; set local work_mem = '64MB'");
    const { rows } = await client.query(numberPlaceholders(sql), params);
    await client.query('commit');
    return rows as T[];
  } catch (e) {
    await client.query('rollback').catch(() => undefined);
    throw e;
  } finally {
    client.release();
  }
}
