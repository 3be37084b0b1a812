// `filmsweep serve [--port P] [--host H] [--db FILE|URL] [--dev]`: the dashboard and its API.
import { InvalidArgumentError, type Command } from 'commander';
import { redactUrl, resolveDbPath } from '../../shared/db/path.js';
import { DEFAULT_HOST, DEFAULT_PORT } from '../../server/defaults.js';
import { parsePublicUrl } from '../../server/routes/links.js';
import { parseWholeNumber } from '../options.js';

function parsePort(raw: string): number {
  const n = Number(raw);
  if (!/^\s*\d+\s*$/.test(raw) || n < 0 || n > 65535) throw new InvalidArgumentError('expected a port number 0–65535');
  return n;
}

function publicUrlOption(raw: string): string {
  try {
    return parsePublicUrl(raw);
  } catch (e) {
    throw new InvalidArgumentError((e as Error).message.replace(/^--public-url: /, ''));
  }
}

export function register(program: Command) {
  program
    .command('serve')
    .description('serve the dashboard (the built web app) and its JSON API under /api')
    .option('-p, --port <port>', `port to listen on (0 picks a free one)`, parsePort, DEFAULT_PORT)
    .option('-H, --host <host>', 'address to listen on; 0.0.0.0 for every interface (put an HTTPS proxy in front)', DEFAULT_HOST)
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--dev', 'development mode: leads can read the local mail outbox at /api/outbox (it holds live reset and invite links; every read is audited)')
    .option('--trust-proxy <hops>', 'behind a reverse proxy: trust this many hops of X-Forwarded-* (HTTPS detection, client address)', parseWholeNumber)
    .option('--public-url <url>', 'address users reach the dashboard at (https://…), the base of links in e-mails (default: the address it listens on; never a request header)', publicUrlOption)
    .option('-w, --workers <n>', 'worker threads per uploaded study run (default 2)', parseWholeNumber)
    .option('--max-points <n>', 'refuse uploaded studies with more points than this (default 1,000,000)', parseWholeNumber)
    .action(
      async (opts: { port: number; host: string; db?: string; dev?: boolean; trustProxy?: number; publicUrl?: string; workers?: number; maxPoints?: number }) => {
        // The server (Express and the rest) is loaded only when it is started.
        const { startServer } = await import('../../server/index.js');
        const server = await startServer({
          db: resolveDbPath(opts.db),
          port: opts.port,
          host: opts.host,
          dev: opts.dev ? true : undefined,
          trustProxy: opts.trustProxy,
          publicUrl: opts.publicUrl,
          workers: opts.workers,
          maxPoints: opts.maxPoints,
        });
        process.stderr.write(`filmsweep: dashboard at ${server.url} (database ${redactUrl(resolveDbPath(opts.db))}); Ctrl-C stops\n`);
        const { interrupted, removed } = server.reconciled;
        if (interrupted.length) {
          process.stderr.write(`filmsweep: run${interrupted.length === 1 ? '' : 's'} ${interrupted.join(', ')} had lost ${interrupted.length === 1 ? 'its' : 'their'} process; marked interrupted (resume from the run page or with \`filmsweep resume\`)\n`);
        }
        if (removed.length) process.stderr.write(`filmsweep: removed unfinished push${removed.length === 1 ? '' : 'es'}: run ${removed.join(', ')}\n`);
        // Last: the start-up report is complete once this line is out (tests and scripts wait for it).
        process.stderr.write(
          server.links.from === 'public-url'
            ? `filmsweep: links in e-mails: ${server.links.base} (--public-url)\n`
            : `filmsweep: links in e-mails: ${server.links.base} (the address it listens on; pass --public-url https://… when users reach it by another name)\n`,
        );
        await new Promise<void>((resolve) => {
          const stop = () => {
            process.off('SIGINT', stop);
            process.off('SIGTERM', stop);
            process.stderr.write('filmsweep: stopping (runs in progress end interrupted; `filmsweep resume` finishes them)\n');
            server.close().then(resolve, resolve);
          };
          process.on('SIGINT', stop);
          process.on('SIGTERM', stop);
        });
      },
    );
}
