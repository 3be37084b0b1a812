// The dashboard in a real Chromium against the real server (the compiled app of
// `filmsweep serve`, started in-process on a free port with a temp database), one user
// per role, and two small demo runs made by the CLI. Screenshots
// of the main views go to test-output/screenshots/ at 1280×800.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const cli = path.join(repo, 'bin', 'filmsweep.js');
const CHROMIUM = '/usr/bin/chromium';
const shots = path.join(repo, 'test-output', 'screenshots');
const PASSWORD = 'a long enough test password';
const users = {
  lead: { email: 'lead@fernbrook.example', role: 'lead' },
  researcher: { email: 'researcher@fernbrook.example', role: 'researcher' },
  viewer: { email: 'viewer@fernbrook.example', role: 'viewer' },
} as const;

// An invented demo study: pipe correlations over Re and Pr; version 2 adds Re = 6e5
// (the other points pair up between the two runs).
const demoStudy = (lOverD: number, extraRe = '') => `name: demo-heater-tube
title: Demo heater tube, pipe methods over Re and Pr
configuration: pipe
methods: [laminar-developed, hausen, dittus-boelter, gnielinski]
inputs:
  L_over_D: ${lOverD}
sweep:
  design: grid
  over:
    Re: [800, 2000, 5000, 1.0e4, 3.0e4, 1.0e5, 3.0e5${extraRe}]
    Pr: [0.7, 7]
`;

function run(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, [cli, ...args], { cwd: repo, encoding: 'utf8', timeout: 120_000, env: { ...process.env, NO_COLOR: '1', ...env } });
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

/** Builds the web app when dist/web is missing or older than its sources. */
async function ensureWebBuild() {
  const index = path.join(repo, 'dist', 'web', 'index.html');
  const sources = Math.max(newest(path.join(repo, 'web')), statSync(path.join(repo, 'vite.config.ts')).mtimeMs);
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

const launchArgs = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

describe.skipIf(!existsSync(CHROMIUM))('dashboard in Chromium', { timeout: 120_000 }, () => {
  let dir: string;
  let db: string;
  let base: string;
  let server: { url: string; close(): Promise<void>; app: { context: { store: unknown } } };
  let browser: Browser;
  let runA: number;
  let runB: number;
  // Content-Security-Policy violations reported in any page's console (issue 10, item 1).
  const cspViolations: string[] = [];

  beforeAll(async () => {
    mkdirSync(shots, { recursive: true });
    dir = mkdtempSync(path.join(tmpdir(), 'filmsweep-web-'));
    db = path.join(dir, 'dash.db');
    await ensureWebBuild();
    writeFileSync(path.join(dir, 'demo-heater-tube.yaml'), demoStudy(60));
    run(['run', path.join(dir, 'demo-heater-tube.yaml'), '--db', db]);
    writeFileSync(path.join(dir, 'demo-heater-tube.yaml'), demoStudy(60, ', 6.0e5'));
    run(['run', path.join(dir, 'demo-heater-tube.yaml'), '--db', db]);
    // The compiled server, as `filmsweep serve --dev` runs it (npm test builds first).
    const dist = (p: string) => import(pathToFileURL(path.join(repo, 'dist', p)).href);
    const { startServer } = await dist('server/index.js');
    const { createUser } = await dist('shared/db/users.js');
    const { listRuns } = await dist('shared/db/queries.js');
    server = await startServer({ db, port: 0, host: '127.0.0.1', dev: true, bcryptCost: 4, webDir: path.join(repo, 'dist', 'web'), log: () => {} });
    base = server.url;
    const store = server.app.context.store;
    for (const u of Object.values(users)) await createUser(store, { email: u.email, role: u.role, name: u.role === 'lead' ? 'Lena Lead' : `Test ${u.role}`, password: PASSWORD, cost: 4 });
    const ids = ((await listRuns(store)) as { id: number }[]).map((r) => r.id).sort((x, y) => x - y);
    [runA, runB] = ids;
    browser = await chromium.launch({ executablePath: CHROMIUM, args: launchArgs });
    const newContext = browser.newContext.bind(browser);
    browser.newContext = async (...args: Parameters<Browser['newContext']>) => {
      const context = await newContext(...args);
      context.on('console', (m) => {
        if (/Content Security Policy|Refused to (load|execute|apply|connect|frame)/i.test(m.text())) cspViolations.push(`${m.location().url}: ${m.text()}`);
      });
      return context;
    };
  }, 180_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  async function signedIn(who: keyof typeof users): Promise<{ context: BrowserContext; page: Page }> {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
    context.setDefaultTimeout(15_000);
    const page = await context.newPage();
    await page.goto(`${base}/#/sign-in`);
    await page.getByLabel('E-mail').fill(users[who].email);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Studies' }).waitFor();
    return { context, page };
  }

  const shot = (page: Page, name: string) => page.screenshot({ path: path.join(shots, `${name}.png`) });

  it('refuses a wrong password, then signs in', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    context.setDefaultTimeout(15_000);
    const page = await context.newPage();
    await page.goto(`${base}/`);
    await page.getByLabel('E-mail').waitFor();
    await shot(page, 'sign-in');
    await page.getByLabel('E-mail').fill(users.lead.email);
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').textContent(), { timeout: 10_000 }).toContain('Sign-in failed');
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Studies' }).waitFor();
    expect(await page.getByTestId('current-user').textContent()).toContain('lead');
    await expect.poll(() => page.getByTestId('caution').textContent(), { timeout: 10_000 }).toContain('licensed engineer');
    await page.getByRole('table', { name: 'Studies' }).getByRole('link', { name: 'demo-heater-tube' }).waitFor();
    await shot(page, 'studies');
    await context.close();
  });

  it('opens a run, filters it, draws the chart and exports CSV', async () => {
    const { context, page } = await signedIn('lead');
    await page.getByRole('link', { name: 'demo-heater-tube' }).click();
    await page.getByTestId('study-yaml').waitFor();
    await expect.poll(() => page.getByTestId('study-yaml').textContent(), { timeout: 10_000 }).toContain('6.0e5');
    await shot(page, 'study');
    await page.getByRole('link', { name: `#${runA}`, exact: true }).click();
    await page.getByRole('heading', { name: `Run #${runA}` }).waitFor();
    const results = page.getByRole('table', { name: 'Results' });
    await results.locator('tbody tr').first().waitFor();
    // 14 points × 4 methods.
    await expect.poll(() => page.getByTestId('page-status').textContent(), { timeout: 10_000 }).toContain('56 rows');

    // Chart: an SVG with one path-drawn series per method, named in the legend.
    const chart = page.getByTestId('chart');
    await chart.locator('svg').waitFor();
    await expect.poll(() => chart.locator('svg path').count(), { timeout: 10_000 }).toBeGreaterThan(10);
    for (const m of ['gnielinski', 'dittus-boelter', 'hausen', 'laminar-developed']) expect(await chart.locator('svg text', { hasText: m }).count()).toBeGreaterThan(0);
    await shot(page, 'run');
    await page.locator('section[aria-labelledby=chart-heading]').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await shot(page, 'run-chart');

    // Filter Re ≥ 1e4 on gnielinski: 4 Re values × 2 Pr = 8 rows; the API agrees.
    await page.getByRole('checkbox', { name: 'gnielinski' }).check();
    await page.getByRole('button', { name: 'Add a range' }).click();
    await page.getByRole('combobox', { name: 'quantity' }).selectOption('Re');
    await page.getByLabel('from').fill('1e4');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await expect.poll(() => page.getByTestId('page-status').textContent(), { timeout: 10_000 }).toContain('8 rows');
    const api = (await page.evaluate(async (id) => (await fetch(`/api/runs/${id}/results?method=gnielinski&filter=Re:1e4:`)).json(), runA)) as { total: number };
    expect(api.total).toBe(8);
    const reCells = await results.locator('tbody tr td:nth-child(4)').allTextContents();
    expect(reCells.length).toBe(8);

    // CSV export: a download whose header names the columns.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId(`export-csv-${runA}`).click()]);
    expect(download.suggestedFilename()).toBe(`run-${runA}.csv`);
    const csv = readFileSync((await download.path())!, 'utf8');
    const header = csv.split(/\r?\n/)[0];
    expect(header).toContain('method');
    expect(header).toContain('Re');
    expect(header).toContain('Nu');
    expect(csv.split(/\r?\n/).filter(Boolean).length).toBe(57);

    // Chart as SVG: a download carrying the run id and the caution.
    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Chart as SVG' }).click()]);
    const svgText = readFileSync((await svg.path())!, 'utf8');
    expect(svgText).toMatch(/^<svg[\s>]/);
    expect(svgText).toContain(`run #${runA}`);
    expect(svgText).toContain('licensed engineer');
    await context.close();
  });

  it('compares the two runs', async () => {
    const { context, page } = await signedIn('researcher');
    await page.goto(`${base}/#/compare?a=${runA}&b=${runB}&output=Nu`);
    // Same code, same points: nothing changed; run b has Re = 6e5 for 2 Pr × 4 methods more.
    await expect.poll(() => page.getByTestId('compare-counts').textContent(), { timeout: 10_000 }).toMatch(/changed\s*0.*only in a\s*0.*only in b\s*8/);
    await page.getByLabel('show').selectOption('any');
    const table = page.getByRole('table', { name: 'Compared points' });
    await table.locator('tbody tr').first().waitFor();
    await expect.poll(() => page.getByTestId('page-status').textContent(), { timeout: 10_000 }).toContain('56 rows');
    await page.getByTestId('chart').locator('svg').waitFor();
    await expect.poll(() => page.getByTestId('chart').locator('svg path').count(), { timeout: 10_000 }).toBeGreaterThan(4);
    await shot(page, 'compare');
    await context.close();
  });

  it('shows an invalid study upload with its line numbers', async () => {
    const { context, page } = await signedIn('researcher');
    const bad = path.join(repo, 'tests', 'fixtures', 'studies', 'many-errors.yaml');
    // The diagnostics the CLI's parser gives for this file, to compare with the form.
    const { parseStudy, StudyError } = await import('../../shared/study/portable.js');
    let expected: { line: number; column: number; message: string }[] = [];
    try {
      parseStudy(readFileSync(bad, 'utf8'), 'many-errors.yaml');
    } catch (e) {
      if (e instanceof StudyError) expected = e.diagnostics;
    }
    expect(expected.length).toBeGreaterThan(1);
    const form = page.getByTestId('study-upload');
    await form.locator('input[type=file]').setInputFiles(bad);
    await form.getByRole('button', { name: 'Upload and run' }).click();
    const list = page.getByTestId('diagnostics');
    await list.waitFor();
    for (const d of expected) await expect.poll(() => list.textContent(), { timeout: 10_000 }).toContain(`line ${d.line}, column ${d.column}`);
    await expect.poll(() => list.textContent(), { timeout: 10_000 }).toContain(expected[0].message);
    await context.close();
  });

  it('hides upload from a viewer, and the API refuses it with 403', async () => {
    const { context, page } = await signedIn('viewer');
    await page.getByRole('table', { name: 'Studies' }).locator('tbody tr').first().waitFor();
    expect(await page.getByTestId('study-upload').count()).toBe(0);
    expect(await page.getByRole('link', { name: 'Team' }).count()).toBe(0);
    const status = await page.evaluate(async (yaml) => {
      const session = (await (await fetch('/api/session')).json()) as { csrfToken: string };
      const form = new FormData();
      form.append('file', new File([yaml], 'demo.yaml', { type: 'text/yaml' }));
      const res = await fetch('/api/studies', { method: 'POST', body: form, headers: { 'X-CSRF-Token': session.csrfToken } });
      return res.status;
    }, demoStudy(10));
    expect(status).toBe(403);
    await context.close();
  });

  it('renders the catalogue, team, tokens and outbox', async () => {
    const { context, page } = await signedIn('lead');
    await page.getByRole('link', { name: 'Catalogue' }).click();
    await page.getByTestId('equation').first().locator('.katex').waitFor();
    await shot(page, 'catalogue');

    await page.getByRole('link', { name: 'Team' }).click();
    await page.getByRole('table', { name: 'Team members' }).getByRole('cell', { name: users.viewer.email, exact: true }).waitFor();
    await page.getByLabel('E-mail').fill('newcomer@fernbrook.example');
    await page.getByLabel('Role', { exact: true }).selectOption('researcher');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByRole('table', { name: 'Invitations' }).getByRole('cell', { name: 'newcomer@fernbrook.example', exact: true }).waitFor();
    await shot(page, 'team');

    await page.getByRole('link', { name: 'API tokens' }).click();
    await page.getByLabel('What it is for').fill('CI on main');
    await page.getByRole('button', { name: 'Create token' }).click();
    const token = (await page.getByTestId('new-token').textContent())!;
    expect(token.length).toBeGreaterThan(20);
    await page.getByRole('table', { name: 'API tokens' }).getByRole('cell', { name: 'CI on main', exact: true }).waitFor();
    await shot(page, 'tokens');
    // The token works as a Bearer token and is shown nowhere again.
    const res = await fetch(`${base}/api/runs`, { headers: { Authorization: `Bearer ${token}` } });
    expect(res.status).toBe(200);
    await page.reload();
    await page.getByRole('table', { name: 'API tokens' }).getByRole('cell', { name: 'CI on main', exact: true }).waitFor();
    expect(await page.getByTestId('new-token').count()).toBe(0);

    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('button', { name: /invit/i }).first().waitFor();
    await expect.poll(() => page.getByTestId('mail-text').textContent(), { timeout: 10_000 }).toContain('invite');
    await shot(page, 'outbox');

    // The mailed link (path form) opens the invitation page; accepting signs the newcomer in.
    const link = (await page.getByTestId('mail-text').locator('a').first().getAttribute('href'))!;
    expect(link).toMatch(/\/invite\//);
    const fresh = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    fresh.setDefaultTimeout(15_000);
    const newcomer = await fresh.newPage();
    await newcomer.goto(link);
    await newcomer.getByLabel('Your name').fill('Nora Newcomer');
    await newcomer.getByLabel(/^Password/).fill('another long password');
    await newcomer.getByRole('button', { name: 'Create my account' }).click();
    await newcomer.getByRole('heading', { name: 'Studies' }).waitFor();
    await expect.poll(() => newcomer.getByTestId('current-user').textContent()).toContain('researcher');
    await fresh.close();
    await context.close();
  });

  it('ran every page above under the Content-Security-Policy with no violation in the console', () => {
    expect(cspViolations).toEqual([]);
  });
});
