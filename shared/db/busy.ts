// Two processes on one database: SQLite lets one writer in at a time. The connection's
// busy timeout makes a writer wait; if it still finds the database locked (a long batch
// elsewhere, or a read transaction that cannot be upgraded), the whole transaction is
// retried from the start after a short pause.

/** How long one statement waits for a lock before SQLite reports SQLITE_BUSY. */
export const BUSY_TIMEOUT_MS = 10_000;
const RETRIES = 6;

export function isBusyError(e: unknown): boolean {
  const code = (e as { code?: unknown } | null)?.code;
  return typeof code === 'string' && (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED'));
}

function pause(ms: number): void {
  // Synchronous on purpose: the hot-path writer is synchronous (better-sqlite3).
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

export function retryBusySync<T>(fn: () => T): T {
  for (let attempt = 0; ; attempt++) {
    try {
      return fn();
    } catch (e) {
      if (!isBusyError(e) || attempt >= RETRIES) throw e;
      pause(50 * 2 ** attempt + Math.random() * 50);
    }
  }
}

export async function retryBusy<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await fn();
    } catch (e) {
      if (!isBusyError(e) || attempt >= RETRIES) throw e;
      await new Promise((r) => setTimeout(r, 50 * 2 ** attempt + Math.random() * 50));
    }
  }
}
