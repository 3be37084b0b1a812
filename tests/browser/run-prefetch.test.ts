// The run page asks for its data while its own code (and ECharts, about 200 kB gzip) is
// still loading: the route prefetches the run, the catalogue, the axis facts, the first
// results page and the default chart (App.tsx), and the page then finds them in the query
// cache instead of asking again. Tested by holding the run page's chunk back: every request
// must already have gone out while it is held, and none is asked twice. Opened straight at
// a run, they go out before the app's own code has loaded (web/src/early.ts), and the app
// takes their answers.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM, repo, signedIn, startDashboard, type Dashboard } from './harness.js';

const probe = readFileSync(path.join(repo, 'studies', 'probe-in-duct.yaml'), 'utf8');

describe.skipIf(!existsSync(CHROMIUM))('run page data prefetched by its route', { timeout: 120_000 }, () => {
  let d: Dashboard;
  beforeAll(async () => {
    d = await startDashboard([['probe-in-duct', probe]]);
  }, 120_000);
  afterAll(async () => d?.close());

  it('asks for the run, its first page and its default chart while the page code loads, and only once', async () => {
    const { context, page } = await signedIn(d, 'viewer');
    await page.goto(`${d.base}/#/studies`);
    await page.getByRole('table', { name: 'Studies' }).waitFor();
    const api: string[] = [];
    let held = true;
    const seenWhileHeld: string[] = [];
    page.on('request', (r) => {
      const url = r.url().slice(d.base.length);
      if (!url.startsWith('/api/')) return;
      api.push(url);
      if (held) seenWhileHeld.push(url);
    });
    await page.route(/\/assets\/RunPage-[^/]+\.js$/, async (route) => {
      // Long enough for the API answers, short enough for the test.
      await new Promise((r) => setTimeout(r, 1500));
      held = false;
      await route.continue();
    });
    const run = d.runs[0];
    await page.goto(`${d.base}/#/runs/${run}`);
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    await page.getByTestId('chart').locator('svg').waitFor();

    const base = (u: string) => u.split('?')[0];
    for (const wanted of [`/api/runs/${run}`, '/api/methods', `/api/runs/${run}/chart/axes`, `/api/runs/${run}/results`, `/api/runs/${run}/chart`]) {
      expect(seenWhileHeld.map(base), `${wanted} asked while the page code was held`).toContain(wanted);
      expect(api.map(base).filter((u) => u === wanted), `${wanted} asked once`).toHaveLength(1);
    }
    await context.close();
  });

  it('opened straight at a run (a link, a reload), asks for its data and starting chart before the app\'s code has loaded, and only once', async () => {
    const { context } = await signedIn(d, 'viewer');
    // A new tab: the page loads from scratch, as from a link or a reload.
    const page = await context.newPage();
    const run = d.runs[0];
    const api: string[] = [];
    let held = true;
    const seenWhileHeld: string[] = [];
    page.on('request', (r) => {
      const url = r.url().slice(d.base.length);
      if (!url.startsWith('/api/')) return;
      api.push(url.split('?')[0]);
      if (held) seenWhileHeld.push(url.split('?')[0]);
    });
    // The app itself (React, the router, the query cache): the early requests (web/src/early.ts) must not need it.
    await page.route(/\/assets\/boot-[^/]+\.js$/, async (route) => {
      await new Promise((r) => setTimeout(r, 1500));
      held = false;
      await route.continue();
    });
    await page.goto(`${d.base}/#/runs/${run}`);
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    await page.locator('[data-testid="chart"][data-drawn] svg').waitFor();
    expect(held, "the app's code was held and then let through").toBe(false);
    for (const wanted of ['/api/session', `/api/runs/${run}`, `/api/runs/${run}/chart/axes`, `/api/runs/${run}/results`, `/api/runs/${run}/chart`, '/api/methods']) {
      expect(seenWhileHeld, `${wanted} asked while the app's code was held`).toContain(wanted);
      expect(api.filter((u) => u === wanted), `${wanted} asked once`).toHaveLength(1);
    }
    await context.close();
  });
});
