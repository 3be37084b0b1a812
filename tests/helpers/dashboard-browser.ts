// A real dashboard for browser tests: the compiled server (as `filmsweep serve --dev`
// runs it) on a free loopback port over a temporary SQLite file, studies run into it by
// the compiled CLI, one account per role, and Debian's Chromium through playwright-core.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export const repo = fileURLToPath(new URL('../..', import.meta.url));
export const cli = path.join(repo, 'bin', 'filmsweep.js');
export const CHROMIUM = '/usr/bin/chromium';
export const hasChromium = existsSync(CHROMIUM);
export const PASSWORD = 'a long enough test password';
export const launchArgs = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

export const users = {
  lead: { email: 'lead@fernbrook.example', role: 'lead' },
  researcher: { email: 'researcher@fernbrook.example', role: 'researcher' },
  viewer: { email: 'viewer@fernbrook.example', role: 'viewer' },
} as const;
export type Who = keyof typeof users;

/** Runs the compiled CLI; its stdout, or an error with its stderr. */
export function runCli(args: string[]): string {
  const r = spawnSync(process.execPath, [cli, ...args], { cwd: repo, encoding: 'utf8', timeout: 180_000, env: { ...process.env, NO_COLOR: '1' } });
  if (r.status !== 0) throw new Error(`filmsweep ${args.join(' ')} failed (${r.status}): ${r.stderr}`);
  return r.stdout;
}

function newest(dir: string): number {
  return readdirSync(dir).reduce((t, name) => {
    const p = path.join(dir, name);
    const s = statSync(p);
    return Math.max(t, s.isDirectory() ? newest(p) : s.mtimeMs);
  }, 0);
}

/** Builds the web app when dist/web is missing or older than its sources (web/ and shared/). */
export async function ensureWebBuild() {
  const index = path.join(repo, 'dist', 'web', 'index.html');
  const sources = Math.max(newest(path.join(repo, 'web')), newest(path.join(repo, 'shared')), statSync(path.join(repo, 'vite.config.ts')).mtimeMs);
  if (existsSync(index) && statSync(index).mtimeMs >= sources) return;
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

export interface Dashboard {
  dir: string;
  db: string;
  base: string;
  browser: Browser;
  store: any;
  /** Writes a study file into the test folder and runs it with the CLI; the new run's id. */
  runStudy(name: string, yaml: string, extra?: string[]): number;
  studyFile(name: string, yaml: string): string;
  signedIn(who: Who, viewport?: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page }>;
  close(): Promise<void>;
}

const dist = (p: string) => import(pathToFileURL(path.join(repo, 'dist', p)).href);

export async function startDashboard(): Promise<Dashboard> {
  const dir = mkdtempSync(path.join(tmpdir(), 'filmsweep-browser-'));
  const db = path.join(dir, 'dash.db');
  await ensureWebBuild();
  const { startServer } = await dist('server/index.js');
  const { createUser } = await dist('shared/db/users.js');
  const server = await startServer({ db, port: 0, host: '127.0.0.1', dev: true, bcryptCost: 4, webDir: path.join(repo, 'dist', 'web'), log: () => {} });
  const store = server.app.context.store;
  for (const u of Object.values(users)) await createUser(store, { email: u.email, role: u.role, name: `Test ${u.role}`, password: PASSWORD, cost: 4 });
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: launchArgs });
  const studyFile = (name: string, yaml: string) => {
    const file = path.join(dir, `${name}.yaml`);
    writeFileSync(file, yaml);
    return file;
  };
  return {
    dir,
    db,
    base: server.url,
    browser,
    store,
    studyFile,
    runStudy(name, yaml, extra = []) {
      const out = JSON.parse(runCli(['run', studyFile(name, yaml), '--db', db, '--json', ...extra])) as { runs: { id: number }[] };
      return out.runs[0].id;
    },
    async signedIn(who, viewport = { width: 1280, height: 900 }) {
      const context = await browser.newContext({ viewport, acceptDownloads: true });
      context.setDefaultTimeout(15_000);
      const page = await context.newPage();
      await page.goto(`${server.url}/#/sign-in`);
      await page.getByLabel('E-mail').fill(users[who].email);
      await page.getByLabel('Password').fill(PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { name: 'Studies' }).waitFor();
      return { context, page };
    },
    async close() {
      await browser.close();
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The ECharts tooltip of a chart (its own absolutely placed div), not the chart's SVG text. */
export function tooltipOf(page: Page, testId = 'chart') {
  return page.getByTestId(testId).locator('div[style*="z-index: 9999999"]');
}

/**
 * Hovers the centre of a drawn data symbol (an SVG path with one of these fills, scaled by
 * ECharts), not a legend icon. A flagged point is a hollow diamond: fill #ffffff.
 */
export async function hoverSymbol(page: Page, fill: string | string[], index = 0, testId = 'chart'): Promise<number> {
  const chart = page.getByTestId(testId);
  await chart.scrollIntoViewIfNeeded();
  const fills = (Array.isArray(fill) ? fill : [fill]).map((f) => `[fill="${f}"]`).join(', ');
  const symbols = chart.locator(`svg path[transform^="matrix"]:is(${fills})`);
  const n = await symbols.count();
  if (n <= index) throw new Error(`no data symbol ${index} filled ${fill} (found ${n})`);
  const box = (await symbols.nth(index).boundingBox())!;
  await page.mouse.move(box.x + box.width / 2 + 0.5, box.y + box.height / 2 + 0.5);
  return n;
}
