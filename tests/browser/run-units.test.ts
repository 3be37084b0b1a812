// Units on the run page in a real Chromium: every column header, axis title, tooltip and
// exported figure carries its unit; temperatures show in °C or K by the user's choice,
// remembered per user; one number format (thousands separators, never a bare 40000);
// run facts are never cut with an ellipsis.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { hasChromium, hoverSymbol, startDashboard, tooltipOf, type Dashboard } from '../helpers/dashboard-browser.js';
import { SERIES_COLOURS } from '../../web/src/lib/theme.js';

// An invented probe sheath in the Fernbrook field station's battery-room duct, on a
// winter night and a summer noon.
const PROBE = `name: units-probe
title: Probe sheath in the battery-room duct, winter and summer air
configuration: cylinder
methods: [churchill-bernstein, hilpert]
fluid: air
inputs:
  diameter: 12.7 mm
  length: 94 mm
  surface_temperature: 128.4 degC
sweep:
  over:
    velocity: [1 m/s, 2 m/s, 5 m/s, 10 m/s, 20 m/s]
    fluid_temperature: [-10 degC, 26.2 degC]
`;

const header = (page: Page, name: string) => page.getByRole('table', { name: 'Results' }).locator('thead th').filter({ has: page.locator(`span.font-mono:text-is("${name}")`) });
const chartTexts = (page: Page) => page.getByTestId('chart').locator('svg text').allTextContents();

describe.skipIf(!hasChromium)('units on the run page (Chromium)', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let run: number;
  beforeAll(async () => {
    d = await startDashboard();
    run = d.runStudy('units-probe', PROBE);
  }, 240_000);
  afterAll(async () => d?.close());

  it('puts units on headers, axes, tooltips and the exported SVG; °C by default and K by choice, remembered per user', async () => {
    const { context, page } = await d.signedIn('lead');
    await page.goto(`${d.base}/#/runs/${run}`);
    const table = page.getByRole('table', { name: 'Results' });
    await table.locator('tbody tr').first().waitFor();

    // Headers: name and unit.
    await expect.poll(() => header(page, 'h').textContent()).toContain('[W/(m²·K)]');
    expect(await header(page, 'velocity').textContent()).toContain('[m/s]');
    expect(await header(page, 'fluid_temperature').textContent()).toContain('[°C]');
    expect(await header(page, 'Re').textContent()).toContain('[-]');
    expect(await header(page, 'heat_rate').textContent()).toContain('[W]');
    // The study says 26.2 °C; the store holds 299.35 K; the table shows °C.
    const temperatures = await table.locator('tbody td').allTextContents();
    expect(temperatures).toContain('26.2');
    expect(temperatures).toContain('-10');

    // Chart: Nu against Re by default, units in the axis titles.
    await page.getByTestId('chart').locator('svg').waitFor();
    await expect.poll(() => chartTexts(page)).toContain('Re [-]');
    expect(await chartTexts(page)).toContain('Nu [-]');
    await page.getByRole('combobox', { name: 'y axis' }).selectOption('h');
    await page.getByRole('combobox', { name: 'x axis' }).selectOption('fluid_temperature');
    await expect.poll(() => chartTexts(page)).toContain('fluid_temperature [°C]');
    expect(await chartTexts(page)).toContain('h [W/(m²·K)]');

    // A tooltip names the point's values with their units.
    await hoverSymbol(page, SERIES_COLOURS[0]);
    await expect.poll(() => tooltipOf(page).textContent()).toMatch(/fluid_temperature = -?[\d.,]+ °C.*h = [\d.,]+ W\/\(m²·K\)/);
    // The crosshair read-out follows the pointer, with units.
    await expect.poll(() => page.getByTestId('crosshair').textContent()).toMatch(/fluid_temperature = -?[\d.,]+ °C · h = [\d.,]+ W\/\(m²·K\)/);

    // The exported figure carries the same units.
    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Chart as SVG' }).click()]);
    const svgText = readFileSync((await svg.path())!, 'utf8');
    expect(svgText).toContain('h [W/(m²·K)]');
    expect(svgText).toContain('fluid_temperature [°C]');

    // K by choice: headers, cells, axes; the API stays SI.
    await page.getByTestId('temperature-unit').getByLabel('K').check();
    await expect.poll(() => header(page, 'fluid_temperature').textContent()).toContain('[K]');
    // 26.2 °C is stored as 26.2 + 273.15 = 299.34999999999997 K, shown to 4 digits.
    await expect.poll(() => table.locator('tbody td').allTextContents()).toContain('299.3');
    await expect.poll(() => chartTexts(page)).toContain('fluid_temperature [K]');
    const api = (await page.evaluate(async (id) => (await fetch(`/api/runs/${id}/results?pageSize=1`)).json(), run)) as { rows: { inputs: Record<string, number> }[] };
    expect([263.15, 299.35]).toContain(api.rows[0].inputs.fluid_temperature);

    // Remembered: after a reload, and per user (another user in the same browser keeps °C).
    await page.reload();
    await expect.poll(() => header(page, 'fluid_temperature').textContent()).toContain('[K]');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByLabel('E-mail').fill('researcher@fernbrook.example');
    await page.getByLabel('Password').fill('a long enough test password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
    await page.goto(`${d.base}/#/runs/${run}`);
    await expect.poll(() => header(page, 'fluid_temperature').textContent()).toContain('[°C]');
    await context.close();
  });

  it('writes numbers one way (thousands separators) and never cuts a fact', async () => {
    const { context, page } = await d.signedIn('viewer');
    await page.goto(`${d.base}/#/runs/${run}`);
    const table = page.getByRole('table', { name: 'Results' });
    await table.locator('tbody tr').first().waitFor();
    const cells = await table.locator('tbody td').allTextContents();
    // Re reaches 16,000 here: grouped, never "16190" beside "1,225".
    expect(cells.some((c) => /^\d{1,3}(,\d{3})+$/.test(c))).toBe(true);
    expect(cells.filter((c) => /^\d{5,}(\.\d+)?$/.test(c))).toEqual([]);
    const facts = await page.getByRole('region', { name: 'Run facts' }).locator('dd').evaluateAll((els) =>
      els.map((e) => ({ text: e.textContent, ellipsis: (globalThis as unknown as { getComputedStyle(e: unknown): { textOverflow: string } }).getComputedStyle(e).textOverflow === 'ellipsis', overflow: e.scrollWidth > e.clientWidth + 1 })),
    );
    expect(facts.length).toBeGreaterThan(4);
    for (const f of facts) expect(f, f.text ?? '').toMatchObject({ ellipsis: false, overflow: false });
    await context.close();
  });
});
