// What the browser tests of the layout, comparison, bundle and screenshots share: the
// compiled app and server (as `filmsweep serve --dev` runs them) on a temp SQLite file
// with study files run by the compiled runner, one account per role, real Chromium
// (playwright-core on /usr/bin/chromium, nothing downloaded), and a watch on the console
// and the network of a page.
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export const repo = fileURLToPath(new URL('../..', import.meta.url));
export const CHROMIUM = '/usr/bin/chromium';
export const PASSWORD = 'a long enough test password';
export const USERS = {
  lead: { email: 'lead@fernbrook.example', role: 'lead', name: 'Lena Lead' },
  researcher: { email: 'researcher@fernbrook.example', role: 'researcher', name: 'Rui Researcher' },
  viewer: { email: 'viewer@fernbrook.example', role: 'viewer', name: 'Vera Viewer' },
} as const;
export type Who = keyof typeof USERS;

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1440, height: 900 };

const launchArgs = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

function newest(dir: string): number {
  return readdirSync(dir).reduce((t, name) => {
    const p = path.join(dir, name);
    const s = statSync(p);
    return Math.max(t, s.isDirectory() ? newest(p) : s.mtimeMs);
  }, 0);
}

/** Builds the web app when dist/web is missing or older than its sources. */
export async function ensureWebBuild(force = false) {
  const index = path.join(repo, 'dist', 'web', 'index.html');
  const sources = Math.max(newest(path.join(repo, 'web')), statSync(path.join(repo, 'vite.config.ts')).mtimeMs);
  if (!force && existsSync(index) && statSync(index).mtimeMs >= sources) return;
  const { build } = await import('vite');
  // Vitest sets NODE_ENV=test, which would give React's development build.
  const env = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ configFile: path.join(repo, 'vite.config.ts'), mode: 'production', logLevel: 'warn' });
  } finally {
    process.env.NODE_ENV = env;
  }
}

export const dist = (p: string) => import(pathToFileURL(path.join(repo, 'dist', p)).href);

export interface Dashboard {
  base: string;
  dir: string;
  /** Run ids in the order the study files were given. */
  runs: number[];
  store: any;
  browser: Browser;
  close(): Promise<void>;
}

/** Runs the study files (name → YAML) in order, starts the server and Chromium. */
export async function startDashboard(studies: [string, string][]): Promise<Dashboard> {
  await ensureWebBuild();
  const dir = mkdtempSync(path.join(tmpdir(), 'filmsweep-browser-'));
  const db = path.join(dir, 'dash.db');
  const { runStudyFile } = await dist('shared/runner/index.js');
  const runs: number[] = [];
  for (const [name, yaml] of studies) {
    const file = path.join(dir, `${name}.yaml`);
    writeFileSync(file, yaml);
    runs.push((await runStudyFile(file, { db, workers: 1 })).id);
  }
  const { startServer } = await dist('server/index.js');
  const { createUser } = await dist('shared/db/users.js');
  const server = await startServer({ db, port: 0, host: '127.0.0.1', dev: true, bcryptCost: 4, webDir: path.join(repo, 'dist', 'web'), log: () => {} });
  const store = server.app.context.store;
  for (const u of Object.values(USERS)) await createUser(store, { email: u.email, role: u.role, name: u.name, password: PASSWORD, cost: 4 });
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: launchArgs });
  return {
    base: server.url,
    dir,
    runs,
    store,
    browser,
    async close() {
      await browser.close();
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A fresh browser context signed in through the sign-in page. */
export async function signedIn(d: Dashboard, who: Who, viewport = DESKTOP): Promise<{ context: BrowserContext; page: Page }> {
  const context = await d.browser.newContext({ viewport, acceptDownloads: true });
  context.setDefaultTimeout(20_000);
  const page = await context.newPage();
  await page.goto(`${d.base}/#/sign-in`);
  await page.getByLabel('E-mail').fill(USERS[who].email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Studies', exact: true }).waitFor();
  return { context, page };
}

export interface Watch {
  /** Console errors and warnings, uncaught page errors. */
  console: string[];
  /** Responses with status ≥ 400 and requests that failed outright. */
  failed: string[];
  /** Every request URL (path and query). */
  requests: string[];
}

/** Records what the console and the network of a page say from now on. */
export function watch(page: Page, base: string): Watch {
  const w: Watch = { console: [], failed: [], requests: [] };
  const short = (url: string) => url.replace(base, '');
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') w.console.push(`${m.type()}: ${m.text()}`);
  });
  page.on('pageerror', (e) => w.console.push(`pageerror: ${e.message}`));
  page.on('request', (r) => w.requests.push(short(r.url())));
  page.on('requestfailed', (r) => {
    // A download that the test leaves unread is aborted by the browser, not failed.
    if (!r.failure()?.errorText.includes('ERR_ABORTED')) w.failed.push(`${r.method()} ${short(r.url())}: ${r.failure()?.errorText}`);
  });
  page.on('response', (r) => {
    if (r.status() >= 400) w.failed.push(`${r.request().method()} ${short(r.url())}: ${r.status()}`);
  });
  return w;
}

/** How far the page scrolls sideways (0 when nothing sticks out). */
export function horizontalOverflow(page: Page): Promise<number> {
  // (The tests are compiled without the DOM library; this runs in the page.)
  return page.evaluate('Math.max(document.documentElement.scrollWidth, document.body.scrollWidth) - document.documentElement.clientWidth') as Promise<number>;
}

/** Elements sticking out on the right (outside any box that scrolls them), for failure messages. */
export function overflowing(page: Page): Promise<string[]> {
  return page.evaluate(`(() => {
    const out = [];
    const width = document.documentElement.clientWidth;
    const scrolls = (el) => { for (let p = el.parentElement; p; p = p.parentElement) { const o = getComputedStyle(p).overflowX; if (o === 'auto' || o === 'scroll' || o === 'hidden') return true; } return false; };
    for (const el of document.body.querySelectorAll('*')) {
      const r = el.getBoundingClientRect();
      if (r.right > width + 0.5 && !scrolls(el)) out.push(el.tagName.toLowerCase() + (el.id ? '#' + el.id : '') + '.' + String(el.className).slice(0, 60) + ' right=' + Math.round(r.right));
    }
    return out.slice(0, 8);
  })()`) as Promise<string[]>;
}

/** Waits until no request of the page has been in flight for `quietMs`. */
export async function settle(page: Page, quietMs = 400): Promise<void> {
  await page.waitForLoadState('networkidle', { timeout: 20_000 }).catch(() => undefined);
  await page.waitForTimeout(quietMs);
}
