// Every migration, listed explicitly: works the same from the TypeScript sources (tests)
// and from dist/ (the installed command), with no directory scan or dynamic import.
// Names sort in the order they apply; add new files as 0002_…, 0003_… below.
import type { Migration } from '#kysely';
import * as m0001 from './0001_initial.js';
import * as m0002 from './0002_dashboard.js';
import * as m0003 from './0003_security.js';
import * as m0004 from './0004_point_summaries.js';
import * as m0005 from './0005_run_tables.js';

export const migrations: Record<string, Migration> = {
  '0001_initial': m0001,
  '0002_dashboard': m0002,
  '0003_security': m0003,
  '0004_point_summaries': m0004,
  '0005_run_tables': m0005,
};
