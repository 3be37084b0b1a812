// The first page loads under 300 kB of script (gzip), and ECharts and KaTeX load only
// with the pages that use them. Builds the web app into a temp folder (its own build, so
// the numbers are of the sources as they are), serves it, opens the first page signed out
// and signed in in real Chromium, and adds up the gzip size of every script it fetched.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chromium, type Browser, type Page } from 'playwright-core';
import { CHROMIUM, PASSWORD, repo, USERS } from './harness.js';

const LIMIT = 300 * 1024;

describe.skipIf(!existsSync(CHROMIUM))('the web bundle', { timeout: 180_000 }, () => {
  let dir: string;
  let web: string;
  let server: { url: string; close(): Promise<void>; app: { context: { store: unknown } } };
  let browser: Browser;

  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'filmsweep-bundle-'));
    web = path.join(dir, 'web');
    const { build } = await import('vite');
    const env = process.env.NODE_ENV;
    process.env.NODE_ENV = 'production'; // vitest's NODE_ENV=test would give React's development build
    try {
      await build({ configFile: path.join(repo, 'vite.config.ts'), mode: 'production', logLevel: 'warn', build: { outDir: web, emptyOutDir: true } });
    } finally {
      process.env.NODE_ENV = env;
    }
    const dist = (p: string) => import(pathToFileURL(path.join(repo, 'dist', p)).href);
    const { startServer } = await dist('server/index.js');
    const { createUser } = await dist('shared/db/users.js');
    server = await startServer({ db: path.join(dir, 'bundle.db'), port: 0, host: '127.0.0.1', dev: true, bcryptCost: 4, webDir: web, log: () => {} });
    await createUser(server.app.context.store, { email: USERS.viewer.email, role: 'viewer', name: 'Vera', password: PASSWORD, cost: 4 });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run'] });
  }, 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  /** The scripts a page fetched while `act` ran: name and gzip size of the built file. */
  async function scriptsDuring(page: Page, act: () => Promise<void>) {
    const urls: string[] = [];
    const listener = (r: { url(): string; resourceType(): string }) => {
      if (r.resourceType() === 'script') urls.push(r.url());
    };
    page.on('request', listener);
    await act();
    await page.waitForLoadState('networkidle');
    page.off('request', listener);
    return urls.map((u) => {
      const file = path.join(web, new URL(u).pathname);
      const text = readFileSync(file);
      return { name: path.basename(file), gzip: gzipSync(text, { level: 9 }).length, text: text.toString('utf8') };
    });
  }

  const total = (s: { gzip: number }[]) => s.reduce((a, b) => a + b.gzip, 0);
  const hasECharts = (s: { text: string }[]) => s.some((x) => x.text.includes('ECharts'));
  const hasKaTeX = (s: { text: string }[]) => s.some((x) => x.text.includes('katex'));

  it('loads under 300 kB of script on the first page, signed out and signed in, without ECharts or KaTeX', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const signedOut = await scriptsDuring(page, async () => {
      await page.goto(`${server.url}/`);
      await page.getByLabel('E-mail').waitFor();
    });
    await page.getByLabel('E-mail').fill(USERS.viewer.email);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Studies' }).waitFor();
    const signedIn = await scriptsDuring(page, async () => {
      await page.reload();
      await page.getByRole('heading', { name: 'Studies' }).waitFor();
    });
    const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;
    console.log(`first page, signed out: ${signedOut.map((s) => `${s.name} ${kb(s.gzip)}`).join(', ')} = ${kb(total(signedOut))} gzip`);
    console.log(`first page, signed in: ${signedIn.map((s) => `${s.name} ${kb(s.gzip)}`).join(', ')} = ${kb(total(signedIn))} gzip`);
    for (const scripts of [signedOut, signedIn]) {
      expect(scripts.length).toBeGreaterThan(0);
      expect(total(scripts)).toBeLessThan(LIMIT);
      expect(hasECharts(scripts)).toBe(false);
      expect(hasKaTeX(scripts)).toBe(false);
    }

    // The pages that need them fetch them.
    const catalogue = await scriptsDuring(page, async () => {
      await page.goto(`${server.url}/#/catalogue`);
      await page.getByTestId('equation').first().locator('.katex').waitFor();
    });
    expect(hasKaTeX(catalogue)).toBe(true);
    expect(hasECharts(catalogue)).toBe(false);
    const compare = await scriptsDuring(page, async () => {
      await page.goto(`${server.url}/#/compare`);
      await page.getByRole('heading', { name: 'Compare two runs' }).waitFor();
    });
    expect(hasECharts(compare)).toBe(true);
    await context.close();
  });
});
