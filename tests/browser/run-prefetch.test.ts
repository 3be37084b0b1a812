// The run page asks for its data while its own code (and ECharts, about 200 kB gzip) is
// still loading: the route prefetches the run, the catalogue, the axis facts, the first
// results page and the default chart (App.tsx), and the page then finds them in the query
// cache instead of asking again. Tested by holding the run page's chunk back: every request
// must already have gone out while it is held, and none is asked twice. Opened straight at
// a run, they go out before the app's own code has loaded (web/src/early.ts), and the app
// takes their answers.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM, repo, signedIn, startDashboard, type Dashboard } from './harness.js';

const probe = readFileSync(path.join(repo, 'studies', 'probe-in-duct.yaml'), 'utf8');

/**
 * Records the API paths a page asks for (without their query strings), all of them and those
 * asked while the script chunk matching `chunk` is held back (1.5 s: long enough for the API
 * answers, short enough for the test).
 */
async function holdChunk(page: Page, base: string, chunk: RegExp) {
  const seen = { api: [] as string[], whileHeld: [] as string[], held: true };
  page.on('request', (r) => {
    const url = r.url().slice(base.length);
    if (!url.startsWith('/api/')) return;
    const path = url.split('?')[0];
    seen.api.push(path);
    if (seen.held) seen.whileHeld.push(path);
  });
  await page.route(chunk, async (route) => {
    await new Promise((r) => setTimeout(r, 1500));
    seen.held = false;
    await route.continue();
  });
  return seen;
}

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
    const seen = await holdChunk(page, d.base, /\/assets\/RunPage-[^/]+\.js$/);
    const run = d.runs[0];
    await page.goto(`${d.base}/#/runs/${run}`);
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    await page.getByTestId('chart').locator('svg').waitFor();

    for (const wanted of [`/api/runs/${run}`, '/api/methods', `/api/runs/${run}/chart/axes`, `/api/runs/${run}/results`, `/api/runs/${run}/chart`]) {
      expect(seen.whileHeld, `${wanted} asked while the page code was held`).toContain(wanted);
      expect(seen.api.filter((u) => u === wanted), `${wanted} asked once`).toHaveLength(1);
    }
    await context.close();
  });

  it('opened straight at a run (a link, a reload), asks for its data and starting chart before the app\'s code has loaded, and only once', async () => {
    const { context } = await signedIn(d, 'viewer');
    // A new tab: the page loads from scratch, as from a link or a reload.
    const page = await context.newPage();
    const run = d.runs[0];
    // The app itself (React, the router, the query cache): the early requests (web/src/early.ts) must not need it.
    const seen = await holdChunk(page, d.base, /\/assets\/boot-[^/]+\.js$/);
    await page.goto(`${d.base}/#/runs/${run}`);
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    await page.locator('[data-testid="chart"][data-drawn] svg').waitFor();
    expect(seen.held, "the app's code was held and then let through").toBe(false);
    for (const wanted of ['/api/session', `/api/runs/${run}`, `/api/runs/${run}/chart/axes`, `/api/runs/${run}/results`, `/api/runs/${run}/chart`, '/api/methods']) {
      expect(seen.whileHeld, `${wanted} asked while the app's code was held`).toContain(wanted);
      expect(seen.api.filter((u) => u === wanted), `${wanted} asked once`).toHaveLength(1);
    }
    await context.close();
  });
});
