// Listening: opens the store, mounts the app, and on close (or SIGINT/SIGTERM) stops the
// background runs before the database is closed.
import type { AddressInfo } from 'node:net';
import { closeStore, openStore } from '../shared/db/index.js';
import { createApp, type FilmsweepApp } from './app.js';
import type { ServerOptions } from './context.js';
import { DEFAULT_HOST, DEFAULT_PORT } from './defaults.js';

export { DEFAULT_HOST, DEFAULT_PORT };

export interface RunningServer {
  url: string;
  app: FilmsweepApp;
  close(): Promise<void>;
}

export async function startServer(
  options: Omit<ServerOptions, 'store'> & { db: string; port?: number; host?: string },
): Promise<RunningServer> {
  const store = await openStore(options.db);
  const app = createApp({ ...options, store });
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
  return { url: `http://${host.includes(':') ? `[${host}]` : host}:${port}`, app, close };
}
