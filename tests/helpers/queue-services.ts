// The Redis and PostgreSQL servers of the queue tests (started by .ci/services.sh). A test
// without its server is skipped with the reason in its name, except in CI (CI set), where a
// missing server is a failure: CI must never pass by skipping.
import { randomBytes } from 'node:crypto';
import pg from 'pg';

export function serviceUrl(variable: 'FILMSWEEP_TEST_REDIS_URL' | 'FILMSWEEP_TEST_PG_URL'): string | undefined {
  const url = process.env[variable];
  if (!url && process.env.CI) throw new Error(`${variable} is not set: CI must start the servers (eval "$(bash .ci/services.sh)")`);
  return url || undefined;
}

export function skipReason(variable: string, url: string | undefined): string {
  return url ? '' : ` (skipped: ${variable} is not set; eval "$(bash .ci/services.sh)")`;
}

/** A queue URL with a prefix of its own, so tests never see each other's jobs. */
export function uniqueQueueUrl(redisUrl: string): string {
  const url = new URL(redisUrl);
  url.searchParams.set('prefix', `fstest-${randomBytes(5).toString('hex')}`);
  return url.href;
}

/** A fresh, empty PostgreSQL database on the test server; `drop` removes it again. */
export async function freshPgDatabase(serverUrl: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `filmsweep_t_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: serverUrl });
  await admin.connect();
  try {
    await admin.query(`create database ${name}`);
  } finally {
    await admin.end();
  }
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return {
    url: url.href,
    async drop() {
      const c = new pg.Client({ connectionString: serverUrl });
      await c.connect();
      try {
        await c.query(`drop database if exists ${name} with (force)`);
      } finally {
        await c.end();
      }
    },
  };
}
