// `filmsweep migrate`: bring the database schema up to date (every command also does so
// when it opens the database; this one says what it applied).
import type { Command } from 'commander';

export function register(program: Command) {
  program
    .command('migrate')
    .description('create the database or apply pending schema migrations, and print what was applied')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .action(async (opts: { db?: string }) => {
      const { closeStore, migrateToLatest, openStore, resolveDbPath } = await import('../../shared/db/index.js');
      const path = resolveDbPath(opts.db);
      const store = await openStore(path, { migrate: false });
      try {
        const applied = await migrateToLatest(store.db);
        const lines = applied.length ? applied.map((name) => `applied ${name}`) : ['schema is up to date; nothing to apply'];
        process.stdout.write(`${lines.join('\n')}\n${store.path}\n`);
      } finally {
        await closeStore(store);
      }
    });
}
