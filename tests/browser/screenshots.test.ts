// The screenshots in docs/screenshots/ (README, "The dashboard"): every view at 1440 and
// 390 px wide in real Chromium, on two versions of the demo's tube-loop study and the
// probe study, and the probe air-speed design run (target, bands, point view). Writes into the repository, so it runs only when asked:
//   npm run screenshots        (FILMSWEEP_SCREENSHOTS=1 vitest run tests/browser/screenshots.test.ts)
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { CHROMIUM, DESKTOP, PHONE, repo, settle, signedIn, startDashboard, USERS, type Dashboard } from './harness.js';

const out = path.join(repo, 'docs', 'screenshots');
const tubeLoop = readFileSync(path.join(repo, 'studies', 'tube-loop-map.yaml'), 'utf8');
// Version 2 of the tube study: shorter tubes and one more Reynolds number.
const tubeLoopV2 = tubeLoop.replace('L_over_D: 60', 'L_over_D: 30').replace('3.0e5, 1.0e6]', '3.0e5, 1.0e6, 2.0e6]');
const probe = readFileSync(path.join(repo, 'studies', 'probe-in-duct.yaml'), 'utf8');
// A design run (target and bands): the run page's solved-input chart and the point view.
const airSpeed = readFileSync(path.join(repo, 'studies', 'probe-air-speed.yaml'), 'utf8');
/** Long pages are cut at this many screen heights: the top shows the view, the rest is more of the same rows. */
const MAX_SCREENS = 3;

describe.skipIf(!existsSync(CHROMIUM) || process.env.FILMSWEEP_SCREENSHOTS !== '1')('screenshots of every view', { timeout: 300_000 }, () => {
  let d: Dashboard;

  beforeAll(async () => {
    mkdirSync(out, { recursive: true });
    expect(tubeLoopV2).not.toBe(tubeLoop);
    d = await startDashboard([
      ['tube-loop-map', tubeLoop],
      ['tube-loop-map-v2', tubeLoopV2],
      ['probe-in-duct', probe],
      ['probe-air-speed', airSpeed],
    ]);
  }, 300_000);

  afterAll(async () => {
    await d?.close();
  });

  async function shoot(page: Page, name: string, width: number) {
    await settle(page);
    const screen = page.viewportSize()!;
    const height = await page.evaluate(() => document.documentElement.scrollHeight);
    const clip = height > MAX_SCREENS * screen.height ? { x: 0, y: 0, width: screen.width, height: MAX_SCREENS * screen.height } : undefined;
    await page.screenshot({ path: path.join(out, `${name}-${width}.png`), fullPage: true, ...(clip ? { clip } : {}) });
  }

  for (const viewport of [DESKTOP, PHONE]) {
    it(`every view at ${viewport.width} px`, async () => {
      const w = viewport.width;
      const [tubeV1, tubeV2, probeRun, designRun] = d.runs;
      const signIn = await d.browser.newContext({ viewport });
      const anon = await signIn.newPage();
      await anon.goto(`${d.base}/#/sign-in`);
      await anon.getByLabel('E-mail').waitFor();
      await shoot(anon, 'sign-in', w);
      await signIn.close();

      const { context, page } = await signedIn(d, 'lead', viewport);
      // A measurement on the tube study, for the measurement view and the run chart.
      const studyId = await page.evaluate(async () => {
        const list = (await (await fetch('/api/studies?q=tube-loop-map')).json()) as { studies: { id: number; name: string }[] };
        return list.studies.find((s) => s.name === 'tube-loop-map')!.id;
      });
      if (w === DESKTOP.width) {
        const status = await page.evaluate(async (id) => {
          const session = (await (await fetch('/api/session')).json()) as { csrfToken: string };
          const form = new FormData();
          const csv = 'Reynolds,Prandtl,Nusselt\r\n12000,4.32,74\r\n30000,4.32,160\r\n80000,4.32,350\r\n200000,4.32,760\r\n';
          form.append('file', new File([csv], 'heater-bench-2024.csv', { type: 'text/csv' }));
          form.append('mapping', JSON.stringify({ Reynolds: 'Re', Prandtl: 'Pr', Nusselt: 'Nu' }));
          return (await fetch(`/api/studies/${id}/measurements`, { method: 'POST', body: form, headers: { 'X-CSRF-Token': session.csrfToken } })).status;
        }, studyId);
        expect(status).toBe(201);
      }

      await shoot(page, 'studies', w);
      await page.goto(`${d.base}/#/studies/${studyId}`);
      await page.getByTestId('study-yaml').waitFor();
      await shoot(page, 'study', w);

      await page.goto(`${d.base}/#/runs/${tubeV1}`);
      await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
      await page.getByTestId('chart').locator('svg').waitFor();
      await shoot(page, 'run', w);
      await page.goto(`${d.base}/#/runs/${probeRun}`);
      await page.getByTestId('chart').locator('svg').waitFor();
      await shoot(page, 'run-dimensional', w);
      await page.goto(`${d.base}/#/runs/${designRun}`);
      await page.getByTestId('chart').locator('svg').waitFor();
      await shoot(page, 'run-target', w);
      await page.goto(`${d.base}/#/runs/${designRun}/points/1`);
      await page.getByRole('table', { name: 'Outputs at this point' }).waitFor();
      await shoot(page, 'point', w);

      await page.goto(`${d.base}/#/compare?a=${tubeV1}&b=${tubeV2}&output=Nu`);
      await page.getByTestId('compare-verdict').waitFor();
      await shoot(page, 'compare-nothing-paired', w);
      await page.goto(`${d.base}/#/compare?a=${tubeV1}&b=${tubeV2}&output=Nu&by=Pr,Re`);
      await page.getByTestId('yaml-diff').waitFor();
      await page.getByRole('table', { name: 'Compared points' }).locator('tbody tr').first().waitFor();
      await shoot(page, 'compare', w);

      await page.goto(`${d.base}/#/catalogue`);
      await page.getByTestId('equation').first().locator('.katex').waitFor();
      await shoot(page, 'catalogue', w);

      const measurement = await page.evaluate(async (id) => ((await (await fetch(`/api/studies/${id}/measurements`)).json()) as { measurements: { id: number }[] }).measurements[0].id, studyId);
      await page.goto(`${d.base}/#/measurements/${measurement}`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, 'measurement', w);

      await page.goto(`${d.base}/#/team`);
      await page.getByRole('table', { name: 'Team members' }).getByRole('cell', { name: USERS.viewer.email, exact: true }).waitFor();
      if (w === DESKTOP.width) {
        await page.getByLabel('E-mail').fill('newcomer@fernbrook.example');
        await page.getByLabel('Role', { exact: true }).selectOption('researcher');
        await page.getByRole('button', { name: 'Send invitation' }).click();
        await page.getByRole('table', { name: 'Invitations' }).getByRole('cell', { name: 'newcomer@fernbrook.example', exact: true }).waitFor();
      }
      await shoot(page, 'team', w);
      await page.goto(`${d.base}/#/tokens`);
      await page.getByRole('table', { name: 'API tokens' }).waitFor();
      await shoot(page, 'tokens', w);
      await page.goto(`${d.base}/#/outbox`);
      await page.getByTestId('mail-text').waitFor();
      await shoot(page, 'outbox', w);
      const link = (await page.getByTestId('mail-text').locator('a').first().getAttribute('href'))!;
      await page.goto(`${d.base}/#/no-such-page`);
      await shoot(page, 'not-found', w);
      if (w === PHONE.width) {
        await page.getByRole('button', { name: 'Menu' }).click();
        await shoot(page, 'menu-open', w);
      }
      await context.close();

      const fresh = await d.browser.newContext({ viewport });
      const newcomer = await fresh.newPage();
      await newcomer.goto(link);
      await newcomer.getByLabel('Your name').waitFor();
      await shoot(newcomer, 'invite', w);
      await newcomer.goto(`${d.base}/#/reset/not-a-real-token`);
      await newcomer.getByRole('heading', { level: 1 }).waitFor();
      await shoot(newcomer, 'reset-password', w);
      await fresh.close();
    });
  }
});
