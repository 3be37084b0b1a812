// bcrypt, bounded. bcryptjs is JavaScript on the main thread, in slices of up to 100 ms
// between which the event loop runs; with dozens of hashes at once every slice of every
// hash runs before the next turn of the loop, and any other request waits seconds. So one
// process-wide queue (p-limit) runs at most HASH_CONCURRENCY hashes at once, and refuses
// new work when MAX_WAITING are already queued, rather than letting the queue (and every
// sign-in's wait) grow without end. Sign-in, invite acceptance, password reset and
// `filmsweep user add` all go through it.
import bcrypt from 'bcryptjs';
import pLimit from 'p-limit';

/** Hashes computed at once in this process. One: a second would only interleave with the first. */
export const HASH_CONCURRENCY = 1;
/** Hashes that may wait for their turn; beyond this the caller is told to come back later. */
export const MAX_WAITING = 16;

/** Too many password checks are queued: try again shortly (the server answers 503). */
export class PasswordHashingBusyError extends Error {
  constructor() {
    super('the server is busy checking passwords; try again in a few seconds');
    this.name = 'PasswordHashingBusyError';
  }
}

const limit = pLimit(HASH_CONCURRENCY);

function bounded<T>(fn: () => Promise<T>): Promise<T> {
  if (limit.pendingCount >= MAX_WAITING) return Promise.reject(new PasswordHashingBusyError());
  return limit(fn);
}

export function bcryptHash(password: string, cost: number): Promise<string> {
  return bounded(() => bcrypt.hash(password, cost));
}

export function bcryptCompare(password: string, hash: string): Promise<boolean> {
  return bounded(() => bcrypt.compare(password, hash));
}

/** Hashes running and waiting now (tests, diagnostics). */
export function hashingLoad(): { active: number; waiting: number } {
  return { active: limit.activeCount, waiting: limit.pendingCount };
}
