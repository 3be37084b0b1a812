// Listening: opens the store, settles runs left `running` by a process that died (this
// host's only), mounts the app, and on close (or SIGINT/SIGTERM) stops the background
// runs before the database is closed.
import type { AddressInfo } from 'node:net';
import { closeStore, openStore } from '../shared/db/index.js';
import { reconcileAtStart, type ReconcileResult } from '../shared/db/reconcile.js';
import { hostName, processAlive } from '../shared/runner/index.js';
import { createApp, type FilmsweepApp } from './app.js';
import type { ServerOptions } from './context.js';
import { originOf } from './routes/links.js';

export const DEFAULT_PORT = 4173;
export const DEFAULT_HOST = '127.0.0.1';

export interface RunningServer {
  url: string;
  app: FilmsweepApp;
  /** Runs found `running` with a dead process at start-up: marked interrupted, or removed (unfinished pushes). */
  reconciled: ReconcileResult;
  /** Where links in e-mails point, and why (for the start-up message). */
  links: { base: string; from: 'public-url' | 'listen-address' };
  close(): Promise<void>;
}

const WILDCARD_HOSTS = new Set(['0.0.0.0', '::', '']);


export async function startServer(
  options: Omit<ServerOptions, 'store'> & { db: string; port?: number; host?: string },
): Promise<RunningServer> {
  const store = await openStore(options.db);
  let reconciled: ReconcileResult;
  let app: FilmsweepApp;
  try {
    reconciled = await reconcileAtStart(store, 'serve', hostName(), processAlive);
    app = createApp({ ...options, store });
  } catch (e) {
    await closeStore(store);
    throw e;
  }
  const host = options.host ?? DEFAULT_HOST;
  const server = await new Promise<import('node:http').Server>((resolve, reject) => {
    const s = app.listen(options.port ?? DEFAULT_PORT, host, () => resolve(s));
    s.once('error', reject);
  }).catch(async (e) => {
    await closeStore(store);
    throw e;
  });
  const { port } = server.address() as AddressInfo;
  let closing: Promise<void> | undefined;
  const close = () =>
    (closing ??= (async () => {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await app.shutdown();
      await closeStore(store);
    })());
  const url = originOf(host, port);
  const publicUrl = app.context.options.publicUrl;
  const links: RunningServer['links'] = publicUrl
    ? { base: publicUrl, from: 'public-url' }
    : { base: WILDCARD_HOSTS.has(host) ? originOf(`<this machine's address>`, port) : url, from: 'listen-address' };
  return { url, app, reconciled, links, close };
}
