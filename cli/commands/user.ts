// `filmsweep user add EMAIL --role R [--password P] [--name N] [--db FILE]`: an account for
// the dashboard (the first lead is made this way; later ones can be invited).
import { randomBytes } from 'node:crypto';
import { Option, type Command } from 'commander';
import { ROLES, type Role } from '../../shared/db/schema.js';
import { MIN_PASSWORD_LENGTH } from '../../shared/db/users.js';
import { InputError } from '../../shared/physics/types.js';

export function register(program: Command) {
  const user = program.command('user').description('manage dashboard accounts');
  user
    .command('add')
    .description('create a dashboard account; prints a generated password when none is given')
    .argument('<email>', 'e-mail address (the sign-in name)')
    .addOption(new Option('-r, --role <role>', 'viewer (browse, export), researcher (also upload and run), lead (also team and reference runs)').choices([...ROLES]).makeOptionMandatory())
    .option('--password <password>', `password, at least ${MIN_PASSWORD_LENGTH} characters (default: generated and printed)`)
    .option('--name <name>', 'display name (default: the part of the e-mail before @)')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .action(async (email: string, opts: { role: Role; password?: string; name?: string; db?: string }) => {
      if (!/^[^@\s]+@[^@\s]+$/.test(email)) throw new InputError(`'${email}' is not an e-mail address`);
      if (opts.password !== undefined && opts.password.length < MIN_PASSWORD_LENGTH) {
        throw new InputError(`--password: at least ${MIN_PASSWORD_LENGTH} characters`);
      }
      const password = opts.password ?? randomBytes(12).toString('base64url');
      const { closeStore, openStore, resolveDbPath } = await import('../../shared/db/index.js');
      const { DuplicateUserError, createUser } = await import('../../shared/db/users.js');
      const store = await openStore(resolveDbPath(opts.db));
      try {
        const made = await createUser(store, { email, role: opts.role, name: opts.name, password });
        process.stdout.write(`created ${made.role} ${made.email}${opts.password === undefined ? `\npassword: ${password}` : ''}\n`);
      } catch (e) {
        if (e instanceof DuplicateUserError) throw new InputError(e.message);
        throw e;
      } finally {
        await closeStore(store);
      }
    });
}
