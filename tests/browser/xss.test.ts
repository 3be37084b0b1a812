// Stored XSS through chart tooltips (issue 10, item 1), in a real Chromium: a researcher
// uploads a measurement named `<img src=x onerror=…>` and pushes a run whose string input
// values and flags are markup (the server checks a pushed run's method ids against its
// study, so those cannot carry markup any more); a lead hovers the measured point and the
// hostile series and nothing runs: no dialog opens, the script's window flag stays unset,
// and the tooltip shows the text as text. (The server's Content-Security-Policy would also
// stop inline handlers; the test checks the text, which only escaping gets right.)
import { pathToFileURL } from 'node:url';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hasChromium, hoverSymbol, repo, startDashboard, tooltipOf, type Dashboard } from '../helpers/dashboard-browser.js';
import { MEASURED_COLOUR, SERIES_COLOURS } from '../../web/src/lib/theme.js';

const PROBE = `name: xss-probe
configuration: cylinder
methods: [churchill-bernstein, hilpert]
fluid: air
inputs:
  diameter: 12.7 mm
  length: 94 mm
  fluid_temperature: 26.2 degC
  surface_temperature: 128.4 degC
sweep:
  over:
    velocity: [1 m/s, 4 m/s, 16 m/s]
`;
// The greenhouse heat-recovery coil (invented), both tube arrangements.
const COIL = `name: xss-coil
configuration: tube-bank
methods: [zukauskas-bank]
fluid: air
inputs:
  diameter: 16.4 mm
  length: 1 m
  ST_over_D: 1.9085
  SL_over_D: 2.0915
  rows: 7
  fluid_temperature: 15 degC
  surface_temperature: 70 degC
sweep:
  over:
    arrangement: [aligned, staggered]
    velocity: [2 m/s, 6 m/s, 10 m/s]
`;

const flag = (what: string) => `window.__xss=(window.__xss||[]).concat('${what}');alert('${what}')`;
const MEASUREMENT = `<img src=x onerror="${flag('measurement')}">`;
const FLAG = `<img src=y onerror="${flag('flag')}">`;
const VALUE = `<svg onload="${flag('input')}"></svg>`;

describe.skipIf(!hasChromium)('no script from names in chart tooltips (Chromium)', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let probe: number;
  let pushed: number;

  beforeAll(async () => {
    d = await startDashboard();
    probe = d.runStudy('xss-probe', PROBE);
    const coil = d.runStudy('xss-coil', COIL);

    // A researcher uploads the hostile measurement and pushes a hostile copy of the coil run, through the API.
    const { context, page } = await d.signedIn('researcher');
    const { getRunRows } = await import(pathToFileURL(path.join(repo, 'dist', 'shared', 'db', 'queries.js')).href);
    const { rows, run } = await getRunRows(d.store, coil);
    const [{ yaml }] = await d.store.dialect.all('select v.yaml from runs r join study_versions v on v.id = r.study_version_id where r.id = ?', [coil]);
    const body = {
      study: { name: run.study, title: run.title, configuration: run.configuration },
      yaml,
      hash: run.yaml_hash,
      run,
      rows: rows.map((r: { inputs: Record<string, unknown>; flags: string[] }) => ({
        ...r,
        flags: [...r.flags, FLAG],
        inputs: { ...r.inputs, arrangement: r.inputs.arrangement === 'staggered' ? VALUE : r.inputs.arrangement },
      })),
    };
    const result = await page.evaluate(
      async ({ body, studyName, csv, name }) => {
        const session = (await (await fetch('/api/session')).json()) as { csrfToken: string };
        const headers = { 'X-CSRF-Token': session.csrfToken };
        const token = (await (await fetch('/api/tokens', { method: 'POST', headers: { ...headers, 'Content-Type': 'application/json' }, body: JSON.stringify({ name: 'push' }) })).json()) as { token: string };
        const push = await fetch('/api/runs/push', { method: 'POST', headers: { Authorization: `Bearer ${token.token}`, 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
        const studies = (await (await fetch('/api/studies')).json()) as { studies: { id: number; name: string }[] };
        const study = studies.studies.find((s) => s.name === studyName)!;
        const form = new FormData();
        form.append('file', new File([csv], 'rig.csv', { type: 'text/csv' }));
        form.append('mapping', JSON.stringify({ 'velocity [m/s]': 'velocity', 'h [W/(m^2 K)]': 'h' }));
        form.append('name', name);
        const upload = await fetch(`/api/studies/${study.id}/measurements`, { method: 'POST', headers, body: form });
        return { push: push.status, pushed: ((await push.json()) as { run: { id: number } }).run?.id, upload: upload.status };
      },
      { body, studyName: 'xss-probe', csv: 'velocity [m/s],h [W/(m^2 K)]\n4,70\n', name: MEASUREMENT },
    );
    expect(result).toMatchObject({ push: 201, upload: 201 });
    pushed = result.pushed;
    await context.close();
  }, 240_000);
  afterAll(async () => d?.close());

  async function leadPage() {
    const { context, page } = await d.signedIn('lead');
    const dialogs: string[] = [];
    page.on('dialog', (dialog) => {
      dialogs.push(dialog.message());
      void dialog.dismiss();
    });
    return { context, page, dialogs, ran: () => page.evaluate(() => (globalThis as unknown as { __xss?: string[] }).__xss ?? []) };
  }

  it('shows a hostile measurement name as text when a lead hovers the measured point', async () => {
    const { context, page, dialogs, ran } = await leadPage();
    await page.goto(`${d.base}/#/runs/${probe}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await page.getByRole('combobox', { name: 'y axis' }).selectOption('h');
    await page.getByRole('combobox', { name: 'measured data' }).selectOption({ index: 1 });
    await page.getByTestId('measured-comparison').waitFor();
    await hoverSymbol(page, MEASURED_COLOUR);
    await expect.poll(() => tooltipOf(page).textContent()).toContain(`measured: ${MEASUREMENT}`);
    // Give any handler time to fire.
    await page.waitForTimeout(500);
    expect(dialogs).toEqual([]);
    expect(await ran()).toEqual([]);
    expect(await page.locator('img[src=x]').count()).toBe(0);
    await context.close();
  });

  it("shows a pushed run's hostile input value and flag as text in the tooltip", async () => {
    const { context, page, dialogs, ran } = await leadPage();
    await page.goto(`${d.base}/#/runs/${pushed}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await page.getByRole('combobox', { name: 'series' }).selectOption('arrangement');
    await page.getByRole('table', { name: 'Results' }).locator('tbody tr').first().waitFor();
    // Every drawn point (all flagged now): the tooltips name the hostile flag and both arrangements.
    const tips: string[] = [];
    for (let i = 0; i < 12; i++) {
      // Filled or hollow (the coil's points may carry flags).
      if ((await hoverSymbol(page, [SERIES_COLOURS[0], '#ffffff'], i).catch(() => 0)) === 0) break;
      await page.waitForTimeout(150);
      await expect.poll(() => tooltipOf(page).textContent()).toContain(FLAG);
      tips.push((await tooltipOf(page).textContent())!);
    }
    expect(tips.some((t) => t.includes(`arrangement = ${VALUE}`)), tips.join('\n')).toBe(true);
    // The legend names the hostile value as text too (SVG text, not markup).
    await expect.poll(() => page.getByTestId('chart').locator('svg text').allTextContents()).toContain(`arrangement = ${VALUE}`);
    await page.waitForTimeout(500);
    expect(dialogs).toEqual([]);
    expect(await ran()).toEqual([]);
    expect(await page.locator('img[src=y], svg[onload]').count()).toBe(0);
    // The results table shows the flag as text too (React escapes).
    expect(await page.getByRole('table', { name: 'Results' }).getByTestId('flag').allTextContents()).toContain(FLAG);
    await context.close();
  });
});
