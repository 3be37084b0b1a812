// Which Redis and which queue: `--queue redis://[user:password@]host[:port][/db][?prefix=P]`
// (`rediss://` for TLS). Every `run --queue` and `worker` given the same URL shares one
// queue; `prefix` separates independent groups (or tests) on one Redis.
import type { ConnectionOptions } from 'bullmq';
import { InputError } from '../physics/types.js';

/** The BullMQ queue every producer and worker of one prefix shares. */
export const QUEUE_NAME = 'batches';
export const DEFAULT_PREFIX = 'filmsweep';

export interface QueueTarget {
  /** The URL without its password, for messages and logs. */
  display: string;
  connection: ConnectionOptions;
  prefix: string;
  name: string;
}

export function parseQueueUrl(raw: string): QueueTarget {
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    throw new InputError(`--queue: expected redis://host[:port][/db], got '${raw}'`);
  }
  if (url.protocol !== 'redis:' && url.protocol !== 'rediss:') {
    throw new InputError(`--queue: expected a redis:// or rediss:// URL, got '${raw}'`);
  }
  if (!url.hostname) throw new InputError(`--queue: no host in '${raw}'`);
  const dbText = url.pathname.replace(/^\/+/, '');
  if (dbText !== '' && !/^\d+$/.test(dbText)) throw new InputError(`--queue: the path must be a database number, got '/${dbText}'`);
  for (const key of url.searchParams.keys()) {
    if (key !== 'prefix') throw new InputError(`--queue: unknown URL option '${key}' (only 'prefix' is understood)`);
  }
  const prefix = url.searchParams.get('prefix') ?? DEFAULT_PREFIX;
  if (!/^[A-Za-z0-9_.-]+$/.test(prefix)) throw new InputError(`--queue: prefix may hold only letters, digits and _ . -, got '${prefix}'`);
  const host = url.hostname.replace(/^\[(.*)\]$/, '$1'); // IPv6 literal without brackets
  const connection: ConnectionOptions = {
    host,
    port: url.port ? Number(url.port) : 6379,
    db: dbText ? Number(dbText) : 0,
    ...(url.username ? { username: decodeURIComponent(url.username) } : {}),
    ...(url.password ? { password: decodeURIComponent(url.password) } : {}),
    ...(url.protocol === 'rediss:' ? { tls: {} } : {}),
  };
  const shown = new URL(url.href);
  if (shown.password) shown.password = '***';
  return { display: shown.href, connection, prefix, name: QUEUE_NAME };
}

const CONNECT_TIMEOUT_MS = 10_000;

/**
 * Waits for a BullMQ object to be connected, or fails with a plain message: ioredis would
 * otherwise retry an unreachable Redis for ever without a word.
 */
export async function whenReachable(ready: Promise<unknown>, target: QueueTarget, lastError: () => Error | undefined): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => {
      const why = lastError() ? `: ${lastError()!.message}` : '';
      reject(new InputError(`cannot reach the queue at ${target.display} within ${CONNECT_TIMEOUT_MS / 1000} s${why}`));
    }, CONNECT_TIMEOUT_MS);
  });
  try {
    await Promise.race([ready, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
