// The dashboard's frame in real Chromium: at phone width (390 px) no view scrolls
// sideways, the navigation folds into a menu, and wide tables scroll inside their card
// with the method column pinned; the console stays clean (no 401 from the session probe,
// no request for run -1, no error or warning) across every view; and every view has its
// loading, empty and error states (slow and failing API answers are staged with
// page.route, the rest is the real server).
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { CHROMIUM, DESKTOP, horizontalOverflow, overflowing, PHONE, repo, settle, signedIn, startDashboard, watch, type Dashboard } from './harness.js';

const tubeLoop = readFileSync(path.join(repo, 'studies', 'tube-loop-map.yaml'), 'utf8');
const probe = readFileSync(path.join(repo, 'studies', 'probe-in-duct.yaml'), 'utf8');

describe.skipIf(!existsSync(CHROMIUM))('layout, console and states', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let tube: number;
  let probeRun: number;
  let studyId: number;

  beforeAll(async () => {
    d = await startDashboard([
      ['tube-loop-map', tubeLoop],
      ['tube-loop-map-v2', tubeLoop.replace('L_over_D: 60', 'L_over_D: 30')],
      ['probe-in-duct', probe],
    ]);
    [tube, , probeRun] = d.runs;
    const [row] = await d.store.dialect.all("select id from studies where name = 'tube-loop-map'");
    studyId = row.id;
  }, 180_000);

  afterAll(async () => {
    await d?.close();
  });

  /** Every signed-in view, with what shows that it has loaded. */
  const views = (): [string, (p: Page) => Promise<unknown>][] => [
    ['/studies', (p) => p.getByRole('table', { name: 'Studies' }).locator('tbody tr').first().waitFor()],
    [`/studies/${studyId}`, (p) => p.getByTestId('study-yaml').waitFor()],
    [`/runs/${tube}`, (p) => p.getByTestId('chart').locator('svg').waitFor()],
    [`/runs/${probeRun}`, (p) => p.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor()],
    [`/compare?a=${tube}&b=${d.runs[1]}&by=Pr,Re`, (p) => p.getByRole('table', { name: 'Compared points' }).locator('tbody tr').first().waitFor()],
    ['/compare', (p) => p.getByText('Choose two runs').waitFor()],
    ['/catalogue', (p) => p.getByTestId('equation').first().locator('.katex').waitFor()],
    ['/team', (p) => p.getByRole('table', { name: 'Team members' }).locator('tbody tr').first().waitFor()],
    ['/tokens', (p) => p.getByRole('table', { name: 'API tokens' }).waitFor()],
    ['/outbox', (p) => p.getByRole('heading', { name: 'Outbox' }).waitFor()],
    ['/no-such-page', (p) => p.getByText('No page here').waitFor()],
  ];

  it('never scrolls sideways at 390 px; the navigation folds into a menu', async () => {
    const { context, page } = await signedIn(d, 'lead', PHONE);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const [route, loaded] of views()) {
      await page.goto(`${d.base}/#${route}`);
      await loaded(page);
      await settle(page, 200);
      expect(await horizontalOverflow(page), `sideways scroll on ${route}: ${(await overflowing(page)).join('; ')}`).toBeLessThanOrEqual(0);
      expect(await nav.isVisible(), `navigation shown unfolded on ${route}`).toBe(false);
    }
    // The menu opens, lists the sections and the user, and closes on navigating.
    await page.getByRole('button', { name: 'Menu' }).click();
    await nav.getByRole('link', { name: 'Catalogue' }).waitFor();
    expect(await page.getByTestId('current-user').isVisible()).toBe(true);
    expect(await horizontalOverflow(page)).toBeLessThanOrEqual(0);
    await nav.getByRole('link', { name: 'Catalogue' }).click();
    await page.getByRole('heading', { name: 'Catalogue' }).waitFor();
    await expect.poll(() => nav.isVisible()).toBe(false);
    // The sign-in page too.
    const anon = await d.browser.newContext({ viewport: PHONE });
    const signIn = await anon.newPage();
    await signIn.goto(`${d.base}/`);
    await signIn.getByLabel('E-mail').waitFor();
    expect(await horizontalOverflow(signIn)).toBeLessThanOrEqual(0);
    await anon.close();
    await context.close();
  });

  it('shows the navigation without a menu on a desktop screen', async () => {
    const { context, page } = await signedIn(d, 'viewer', DESKTOP);
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Compare' }).isVisible()).toBe(true);
    expect(await page.getByRole('button', { name: 'Menu' }).isVisible()).toBe(false);
    await context.close();
  });

  it('scrolls a wide table inside its card at 390 px, with the method column pinned', async () => {
    const { context, page } = await signedIn(d, 'viewer', PHONE);
    await page.goto(`${d.base}/#/runs/${tube}`);
    const table = page.getByRole('table', { name: 'Results' });
    await table.locator('tbody tr').first().waitFor();
    const box = table.locator('xpath=..');
    const sizes = await box.evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
    expect(sizes.scroll).toBeGreaterThan(sizes.client + 100); // wider than the card: it scrolls inside it
    const method = table.locator('tbody tr').first().locator('td.pinned');
    expect(await method.textContent()).toBe('laminar-developed');
    const last = table.locator('tbody tr').first().locator('td').last();
    const before = { method: (await method.boundingBox())!, last: (await last.boundingBox())!, box: (await box.boundingBox())! };
    await box.evaluate((el) => el.scrollBy({ left: 400 }));
    await page.waitForTimeout(100);
    const after = { method: (await method.boundingBox())!, last: (await last.boundingBox())! };
    expect(before.last.x - after.last.x).toBeGreaterThan(300); // the table moved…
    expect(after.method.x).toBeGreaterThanOrEqual(before.box.x - 1); // …the method column stayed in view
    expect(after.method.x).toBeLessThanOrEqual(before.box.x + 2);
    expect(await horizontalOverflow(page)).toBeLessThanOrEqual(0);
    await context.close();
  });

  it('keeps the console clean: no 401 on load, no request for run -1, no error or warning on any view', async () => {
    const context = await d.browser.newContext({ viewport: DESKTOP });
    const page = await context.newPage();
    const w = watch(page, d.base);
    // Signed out, first visit: the sign-in page, and nothing refused on the way.
    await page.goto(`${d.base}/`);
    await page.getByLabel('E-mail').waitFor();
    await settle(page);
    expect(w.failed).toEqual([]);
    expect(w.requests.filter((r) => r.startsWith('/api/'))).toEqual([]);
    await page.reload();
    await page.getByLabel('E-mail').waitFor();
    await settle(page);
    expect(w.failed).toEqual([]);
    await context.close();

    const { context: ctx, page: p } = await signedIn(d, 'lead', DESKTOP);
    const seen = watch(p, d.base);
    for (const [route, loaded] of views()) {
      await p.goto(`${d.base}/#${route}`);
      await loaded(p);
      await settle(p, 200);
    }
    await p.reload(); // a signed-in reload probes the session once, successfully
    await p.getByText('No page here').waitFor();
    await settle(p);
    expect(seen.failed).toEqual([]);
    expect(seen.console).toEqual([]);
    expect(seen.requests.filter((r) => /\/api\/runs\/-|undefined|NaN/.test(r))).toEqual([]);
    expect(seen.requests.filter((r) => r === '/api/session').length).toBeGreaterThan(0);
    await ctx.close();
  });

  it('says so when a search matches nothing, when nothing is chosen, and when something is not there', async () => {
    const { context, page } = await signedIn(d, 'viewer', DESKTOP);
    await page.getByLabel('Search by name, title or configuration').fill('no-such-study');
    await page.getByText('No study matches “no-such-study”.').waitFor();
    await page.goto(`${d.base}/#/catalogue`);
    await page.getByLabel('Search methods').fill('quasar');
    await page.getByText('No method matches “quasar”.', { exact: false }).waitFor();
    expect(await page.getByTestId('method-card').count()).toBe(0);
    expect(await page.getByTestId('catalogue-count').textContent()).toMatch(/^0 of \d+ methods shown$/);
    await page.getByRole('button', { name: 'Clear the search' }).click();
    await expect.poll(() => page.getByTestId('method-card').count()).toBeGreaterThan(10);
    await page.goto(`${d.base}/#/compare`);
    await page.getByText('Choose two runs.').waitFor();
    await page.goto(`${d.base}/#/runs/987654`);
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/not found/i);
    await page.goto(`${d.base}/#/studies/987654`);
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/not found/i);
    await page.goto(`${d.base}/#/measurements/987654`);
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/not found/i);
    await context.close();
  });

  it('shows a loading state while the API is slow and an error state when it fails, on every view', async () => {
    const { context, page } = await signedIn(d, 'lead', DESKTOP);
    const cases: [string, RegExp, RegExp][] = [
      ['/studies', /\/api\/studies(\?.*)?$/, /Loading studies/],
      [`/studies/${studyId}`, new RegExp(`/api/studies/${studyId}$`), /Loading the study/],
      [`/runs/${tube}`, new RegExp(`/api/runs/${tube}$`), /Loading the run/],
      [`/compare?a=${tube}&b=${d.runs[1]}&by=Pr,Re`, /\/api\/compare\?/, /Pairing the points/],
      ['/catalogue', /\/api\/methods$/, /Loading the catalogue/],
      ['/team', /\/api\/users$/, /Loading the members/],
      ['/tokens', /\/api\/tokens$/, /Loading your tokens/],
      ['/outbox', /\/api\/outbox$/, /Loading the outbox/],
    ];
    // Each step loads the app afresh (goto, then reload), so no cached answer hides the state.
    const open = async (route: string) => {
      await page.goto(`${d.base}/#${route}`);
      await page.reload();
    };
    for (const [route, pattern, loading] of cases) {
      // Slow: the loading state shows, then the page.
      let release!: () => void;
      const held = new Promise<void>((r) => (release = r));
      await page.route(pattern, async (r) => {
        await held;
        await r.continue();
      });
      await open(route);
      await page.getByRole('status').filter({ hasText: loading }).waitFor();
      release();
      await expect.poll(() => page.getByRole('status').filter({ hasText: loading }).count(), { timeout: 15_000 }).toBe(0);
      expect(await page.getByRole('alert').count(), `an error after the slow answer on ${route}`).toBe(0);
      await page.unroute(pattern);
      // Failing: the error state names what could not be done and why.
      await page.route(pattern, (r) => r.fulfill({ status: 500, contentType: 'application/json', body: JSON.stringify({ error: { message: 'the database is away (staged)' } }) }));
      await open(route);
      await expect.poll(() => page.getByRole('alert').first().textContent(), { timeout: 15_000 }).toContain('the database is away (staged)');
      await page.unroute(pattern);
    }
    await context.close();
  });
});
