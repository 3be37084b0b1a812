// Where the database lives: --db FILE|URL, else $FILMSWEEP_DB, else ./filmsweep.db.
// A postgres:// or postgresql:// URL selects PostgreSQL; anything else is an SQLite file.
import { resolve } from 'node:path';

export const DEFAULT_DB_FILE = 'filmsweep.db';

export function isDatabaseUrl(location: string): boolean {
  return /^postgres(ql)?:\/\//i.test(location);
}

export function resolveDbPath(option?: string): string {
  const chosen = option || process.env.FILMSWEEP_DB || DEFAULT_DB_FILE;
  return chosen === ':memory:' || isDatabaseUrl(chosen) ? chosen : resolve(chosen);
}

/** The URL as messages may show it: the password replaced by `***`. */
export function redactUrl(url: string): string {
  if (!isDatabaseUrl(url)) return url;
  try {
    const u = new URL(url);
    if (u.password) u.password = '***';
    return u.toString();
  } catch {
    return url.replace(/:[^:@/]*@/, ':***@');
  }
}
