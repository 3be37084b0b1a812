// `filmsweep demo`: what `npm start` runs — the demo studies into the database, one demo
// account per role (passwords printed once, for local use only), then the dashboard.
import { randomBytes } from 'node:crypto';
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Command } from 'commander';
import { DEFAULT_HOST, DEFAULT_PORT } from '../../server/defaults.js';
import { parseWholeNumber } from '../options.js';

const studiesDir = fileURLToPath(new URL('../../../studies/', import.meta.url));
// Invented accounts on a reserved domain (RFC 2606): no real person or company.
const demoEmail = (role: string) => `${role}@fernbrook.example`;

export function register(program: Command) {
  program
    .command('demo')
    .description('run the demo studies, create one demo account per role (printed once), and serve the dashboard in development mode')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('-p, --port <port>', 'port to listen on', parseWholeNumber, DEFAULT_PORT)
    .action(async (opts: { db?: string; port: number }) => {
      const { closeStore, isDatabaseUrl, listRuns, openStore, redactUrl, resolveDbPath } = await import('../../shared/db/index.js');
      const { ROLES } = await import('../../shared/db/schema.js');
      const { createUser, listUsers } = await import('../../shared/db/users.js');
      const { prepareStudy, runStudy } = await import('../../shared/runner/index.js');
      const { loadStudyFile } = await import('../../shared/study/index.js');
      const { startServer } = await import('../../server/index.js');
      const db = resolveDbPath(opts.db);
      const files = readdirSync(studiesDir).filter((f) => f.endsWith('.yaml')).sort().map((f) => join(studiesDir, f));
      const store = await openStore(db);
      try {
        const done = new Set((await listRuns(store)).filter((r) => r.status === 'done').map((r) => r.study));
        for (const file of files) {
          const prepared = prepareStudy(loadStudyFile(file));
          if (done.has(prepared.loaded.study.name)) continue;
          const outcome = await runStudy(store, prepared, { workers: 2 });
          process.stderr.write(`demo: ran ${prepared.loaded.study.name} (run ${outcome.id}, ${outcome.results} results)\n`);
        }
        if ((await listUsers(store)).length === 0) {
          const lines = ['demo accounts (local use only; shown once, not stored in clear):'];
          for (const role of ROLES) {
            const password = randomBytes(9).toString('base64url');
            await createUser(store, { email: demoEmail(role), role, password, name: `Demo ${role}` });
            lines.push(`  ${role.padEnd(10)} ${demoEmail(role).padEnd(28)} ${password}`);
          }
          process.stdout.write(`${lines.join('\n')}\n`);
        } else {
          process.stdout.write('accounts exist already (add one with `filmsweep user add EMAIL --role R`)\n');
        }
      } finally {
        await closeStore(store);
      }
      const server = await startServer({ db, port: opts.port, host: DEFAULT_HOST, dev: true });
      process.stdout.write(`dashboard: ${server.url}  (database ${isDatabaseUrl(db) ? redactUrl(db) : resolve(db)}; Ctrl-C stops)\n`);
      await new Promise<void>((done) => {
        const stop = () => void server.close().then(done, done);
        process.once('SIGINT', stop);
        process.once('SIGTERM', stop);
      });
    });
}
