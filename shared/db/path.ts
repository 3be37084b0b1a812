// Where the database lives: --db FILE, else $FILMSWEEP_DB, else ./filmsweep.db.
import { resolve } from 'node:path';

export const DEFAULT_DB_FILE = 'filmsweep.db';

export function resolveDbPath(option?: string): string {
  const chosen = option || process.env.FILMSWEEP_DB || DEFAULT_DB_FILE;
  return chosen === ':memory:' ? chosen : resolve(chosen);
}
