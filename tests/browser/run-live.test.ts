// Live runs and per-run state in a real Chromium. A CLI run writes into the server's
// database while its page is open: counters, table and chart follow the batches and show
// the end state when the run finishes, without a reload. (The CLI process is paused with
// SIGSTOP and resumed with SIGCONT, so the page is checked against a known state however
// fast the machine is.) And filters and chart choices belong to one run: opening another
// run starts clean and never sends the previous run's filter.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page, Request } from 'playwright-core';
import { cli, hasChromium, repo, startDashboard, type Dashboard } from '../helpers/dashboard-browser.js';

// Laminar wedge flows (invented scenario: a map of accelerated boundary layers over the
// Fernbrook field station's fin profiles), slow enough to watch: exact similarity solves.
const WEDGE = `name: live-wedge-map
title: Wedge flows, watched while they run
configuration: wedge
methods: [similarity]
sweep:
  over:
    m: {from: 0, to: 1, count: 60}
    Pr: {from: 0.7, to: 50, count: 50, spacing: log}
    Re: [1.0e4]
`;
const PIPE = (extra: string) => `name: live-pipe
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  L_over_D: 60
sweep:
  over:
    Re: [5000, 2.0e4, 1.0e5${extra}]
    Pr: [0.7, 7]
`;

const factText = (page: Page, id: string) => page.getByTestId(id).textContent();
/** The first (grouped) integer of a text: 1,234 of "1,234 (0 flagged)". */
const count = (text: string | null) => Number((/\d[\d,]*/.exec(text ?? '')?.[0] ?? 'NaN').replace(/,/g, ''));
const grouped = (n: number) => n.toLocaleString('en-US');

describe.skipIf(!hasChromium)('live runs and per-run state (Chromium)', { timeout: 240_000 }, () => {
  let d: Dashboard;
  let getRun: (store: unknown, id: number) => Promise<{ status: string; results_count: number; points_done: number } | undefined>;
  let listRuns: (store: unknown) => Promise<{ id: number; study: string }[]>;
  beforeAll(async () => {
    d = await startDashboard();
    ({ getRun, listRuns } = await import(pathToFileURL(path.join(repo, 'dist', 'shared', 'db', 'queries.js')).href));
  }, 240_000);
  afterAll(async () => d?.close());

  async function until<T>(what: string, fn: () => Promise<T | undefined | false>, timeoutMs = 120_000): Promise<T> {
    const end = Date.now() + timeoutMs;
    for (;;) {
      const v = await fn();
      if (v) return v;
      if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
      await new Promise((r) => setTimeout(r, 5));
    }
  }

  it('follows a run while a CLI run writes it, and shows its end without a reload', async () => {
    // Signed in first: a paused CLI may hold the database's write lock, and signing in writes a session.
    const { context, page } = await d.signedIn('viewer');
    const file = d.studyFile('live-wedge-map', WEDGE);
    const child: ChildProcess = spawn(process.execPath, [cli, 'run', file, '--db', d.db, '--workers', '1', '--batch-size', '20'], { cwd: repo, env: { ...process.env, NO_COLOR: '1' }, stdio: 'ignore' });
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      // Paused as soon as the run exists: usually before its first batch is written.
      const id = await until('the run to start', async () => (await listRuns(d.store)).find((r) => r.study === 'live-wedge-map')?.id, 120_000);
      child.kill('SIGSTOP');
      const first = (await getRun(d.store, id))!;
      expect(first.status).toBe('running');

      await page.goto(`${d.base}/#/runs/${id}`);
      await page.evaluate(() => ((globalThis as unknown as { __samePage: boolean }).__samePage = true));
      await expect.poll(() => page.getByTestId('run-status').textContent()).toBe('running');
      await expect.poll(async () => count(await factText(page, 'fact-results'))).toBe(first.results_count);
      if (first.results_count === 0) {
        await expect.poll(() => page.locator('section[aria-labelledby=chart-heading]').textContent()).toContain('No results to plot yet');
      }

      // More batches land: the counters, the table and the chart follow.
      child.kill('SIGCONT');
      await until('more batches', async () => ((await getRun(d.store, id))?.results_count ?? 0) >= first.results_count + 200);
      child.kill('SIGSTOP');
      const second = (await getRun(d.store, id))!;
      expect(second.status).toBe('running');
      await expect.poll(async () => count(await factText(page, 'fact-results')), { timeout: 15_000 }).toBe(second.results_count);
      await expect.poll(() => page.getByTestId('page-status').textContent(), { timeout: 15_000 }).toContain(`${grouped(second.results_count)} rows`);
      await expect.poll(() => page.getByTestId('chart-note').textContent(), { timeout: 15_000 }).toContain(`${grouped(second.results_count)} results`);

      // The run ends: the page shows its end state, still the same page.
      child.kill('SIGCONT');
      expect(await exited).toBe(0);
      const last = (await getRun(d.store, id))!;
      expect(last.status).toBe('done');
      await expect.poll(() => page.getByTestId('run-status').textContent(), { timeout: 15_000 }).toBe('done');
      await expect.poll(() => factText(page, 'fact-results'), { timeout: 15_000 }).toContain(grouped(last.results_count));
      await expect.poll(() => page.getByTestId('page-status').textContent(), { timeout: 15_000 }).toContain(`${grouped(last.results_count)} rows`);
      await expect.poll(() => page.getByTestId('chart-note').textContent(), { timeout: 15_000 }).toContain(`${grouped(last.results_count)} results`);
      expect(await page.evaluate(() => (globalThis as unknown as { __samePage?: boolean }).__samePage)).toBe(true);
      await context.close();
    } finally {
      if (child.exitCode === null) {
        child.kill('SIGCONT');
        child.kill('SIGTERM');
      }
    }
  });

  it("starts another run clean: no filter or chart choice of the previous run, in the page or its requests", async () => {
    const a = d.runStudy('live-pipe', PIPE(''));
    const b = d.runStudy('live-pipe', PIPE(', 3.0e5'));
    const { context, page } = await d.signedIn('researcher');
    await page.goto(`${d.base}/#/runs/${a}`);
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    // Run a: one method, Re from 1e4, Pr on x.
    await page.getByRole('checkbox', { name: 'gnielinski' }).check();
    await page.getByRole('button', { name: 'Add a range' }).click();
    await page.getByRole('combobox', { name: 'quantity' }).selectOption('Re');
    await page.getByLabel('from').fill('1e4');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await expect.poll(() => page.getByTestId('page-status').textContent()).toContain('4 rows');
    await page.getByRole('combobox', { name: 'x axis' }).selectOption('Pr');
    await expect.poll(() => page.getByTestId('chart').locator('svg text').allTextContents()).toContain('Pr [-]');

    // To run b in the same page (an edited address or a link between runs keeps the run
    // view mounted), watching every request for b.
    const requests: string[] = [];
    page.on('request', (r: Request) => {
      if (r.url().includes(`/api/runs/${b}/`)) requests.push(decodeURIComponent(r.url()));
    });
    await page.evaluate((id) => ((globalThis as unknown as { location: { hash: string } }).location.hash = `#/runs/${id}`), b);
    await page.getByRole('heading', { name: `Run #${b}` }).waitFor();
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    // 4 Re × 2 Pr × 2 methods, unfiltered.
    await expect.poll(() => page.getByTestId('page-status').textContent()).toContain('16 rows');
    expect(await page.getByRole('checkbox', { name: 'gnielinski' }).isChecked()).toBe(false);
    expect(await page.getByTestId('range-filter').count()).toBe(0);
    await expect.poll(() => page.getByRole('combobox', { name: 'x axis' }).inputValue()).toBe('Re');
    await page.getByTestId('chart').locator('svg').waitFor();
    const data = requests.filter((u) => /\/(results|chart)\?/.test(u));
    expect(data.length).toBeGreaterThan(1);
    for (const u of data) {
      expect(u).not.toContain('filter=');
      expect(u).not.toContain('method=');
      expect(u).not.toMatch(/[?&]x=Pr/);
    }
    await context.close();
  });
});
