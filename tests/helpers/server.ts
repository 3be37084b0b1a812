// A real dashboard server for the server-*.test.ts files: a SQLite file in a temp folder
// (or a given database),
// app.listen(0) on 127.0.0.1, one account per role (bcrypt cost 4), and a small fetch
// client that keeps the session cookie and sends the CSRF token.
import { mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { closeStore, openStore, type Store } from '../../shared/db/index.js';
import type { Role } from '../../shared/db/schema.js';
import { createUser } from '../../shared/db/users.js';
import { createApp, type FilmsweepApp } from '../../server/app.js';
import type { ServerOptions } from '../../server/context.js';

export const PASSWORD = 'correct horse battery';

export interface TestServer {
  url: string;
  app: FilmsweepApp;
  store: Store;
  dir: string;
  emails: Record<Role, string>;
  signIn(email: string, password?: string): Promise<Client>;
  anonymous(): Client;
  close(): Promise<void>;
}

export interface RequestOptions {
  json?: unknown;
  form?: FormData;
  headers?: Record<string, string>;
  /** Send the session's CSRF token on state-changing requests (default true). */
  csrf?: boolean;
}

export class Client {
  cookie?: string;
  csrfToken?: string;
  lastSetCookie?: string;

  constructor(readonly base: string) {}

  async request(method: string, path: string, options: RequestOptions = {}): Promise<Response> {
    const headers: Record<string, string> = { ...(options.headers ?? {}) };
    if (this.cookie) headers.cookie = this.cookie;
    if (this.csrfToken && options.csrf !== false && method !== 'GET') headers['x-csrf-token'] = this.csrfToken;
    let body: string | FormData | undefined;
    if (options.json !== undefined) {
      headers['content-type'] = 'application/json';
      body = JSON.stringify(options.json);
    } else if (options.form) body = options.form;
    const res = await fetch(this.base + path, { method, headers, body, redirect: 'manual' });
    const set = res.headers.get('set-cookie');
    if (set) {
      this.lastSetCookie = set;
      const m = /filmsweep_session=([^;]*)/.exec(set);
      if (m) this.cookie = m[1] ? `filmsweep_session=${m[1]}` : undefined;
    }
    return res;
  }

  async json<T = any>(method: string, path: string, options: RequestOptions = {}): Promise<{ status: number; body: T }> {
    const res = await this.request(method, path, options);
    const text = await res.text();
    return { status: res.status, body: text ? (JSON.parse(text) as T) : (undefined as T) };
  }
}

/** `db`: a database to serve instead of a fresh SQLite file (a postgres:// URL, say). */
export async function startTestServer(options: Partial<ServerOptions> = {}, db?: string): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'filmsweep-server-'));
  const store = await openStore(db ?? join(dir, 'dashboard.db'));
  const emails: Record<Role, string> = { viewer: 'vera@example.org', researcher: 'rafael@example.org', lead: 'lena@example.org' };
  for (const [role, email] of Object.entries(emails) as [Role, string][]) {
    await createUser(store, { email, role, password: PASSWORD, cost: 4, name: role });
  }
  const app = createApp({ store, bcryptCost: 4, dev: true, webDir: null, workers: 1, log: () => {}, ...options });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    url,
    app,
    store,
    dir,
    emails,
    anonymous: () => new Client(url),
    async signIn(email, password = PASSWORD) {
      const c = new Client(url);
      const r = await c.json('POST', '/api/session', { json: { email, password } });
      if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
      c.csrfToken = r.body.csrfToken;
      return c;
    },
    async close() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await app.shutdown();
      await closeStore(store);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Polls until the run is no longer running. */
export async function waitForRun(client: Client, id: number, timeoutMs = 30_000): Promise<any> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const r = await client.json('GET', `/api/runs/${id}`);
    if (r.status !== 200) throw new Error(`GET /api/runs/${id}: ${r.status}`);
    if (r.body.run.status !== 'running' && r.body.run.status !== 'queued') return r.body;
    if (Date.now() > end) throw new Error(`run ${id} still ${r.body.run.status}`);
    await new Promise((res) => setTimeout(res, 50));
  }
}
