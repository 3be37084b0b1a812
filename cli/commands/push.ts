// `filmsweep push RUN --server URL --token T [--db FILE]`: send a local run (its study text
// and every result) to the team's dashboard, as a new run there. Exit 1 when the server
// refuses (its message is printed), 2 when it cannot be reached.
import type { Command } from 'commander';
import { InputError } from '../../shared/physics/types.js';
import { EXIT, ExitError } from '../errors.js';

export function register(program: Command) {
  program
    .command('push')
    .description('send a finished run to the team dashboard (needs an API token of a researcher or lead)')
    .argument('<run>', "run id, or 'latest'")
    .requiredOption('--server <url>', 'dashboard address, e.g. https://filmsweep.example.org')
    .option('--token <token>', 'API token (default: $FILMSWEEP_TOKEN)')
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .action(async (ref: string, opts: { server: string; token?: string; db?: string }) => {
      const token = opts.token ?? process.env.FILMSWEEP_TOKEN;
      if (!token) throw new InputError('--token: give an API token (or set FILMSWEEP_TOKEN); make one on the dashboard under API tokens');
      let base: URL;
      try {
        base = new URL(opts.server);
      } catch {
        throw new InputError(`--server: '${opts.server}' is not a URL`);
      }
      const { closeStore, getRunRows, getRunSource, openStore, resolveDbPath, resolveRunRef } = await import('../../shared/db/index.js');
      const store = await openStore(resolveDbPath(opts.db));
      let body: string;
      let runId: number;
      try {
        const run = await resolveRunRef(store, ref);
        runId = run.id;
        if (run.status === 'running' || run.status === 'queued') throw new InputError(`run ${run.id} is ${run.status}; push it once it has ended`);
        const source = (await getRunSource(store, run.id))!;
        const { rows } = await getRunRows(store, run.id);
        body = JSON.stringify({
          study: { name: run.study, title: run.title, configuration: run.configuration },
          yaml: source.yaml,
          hash: source.hash,
          run,
          rows: rows.map((r) => ({ method: r.method, inputs: r.inputs, outputs: r.outputs, flags: r.flags })),
        });
      } finally {
        await closeStore(store);
      }
      let res: Response;
      try {
        res = await fetch(new URL('/api/runs/push', base), {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${token}` },
          body,
        });
      } catch (e) {
        const cause = (e as { cause?: { message?: string } }).cause?.message ?? (e as Error).message;
        throw new ExitError(EXIT.runFailed, `cannot reach ${base.origin}: ${cause}`);
      }
      const text = await res.text();
      let answer: { run?: { id: number }; error?: { message?: string } } = {};
      try {
        answer = JSON.parse(text);
      } catch {
        // not JSON: reported below with the status
      }
      if (!res.ok) {
        const message = answer.error?.message ?? `HTTP ${res.status}`;
        throw new ExitError(res.status >= 500 ? EXIT.runFailed : EXIT.badInput, `the server refused run ${runId}: ${message} (HTTP ${res.status})`);
      }
      process.stdout.write(`pushed run ${runId} as run ${answer.run?.id} on ${base.origin}\n`);
    });
}
