// The plots of the trade in a real Chromium: Nu against Re on a dimensional run by
// default, a second input as line styles with a legend sorted by value, a clear message
// and a suggestion instead of a few dozen series, a local-output method listed as left
// out with the reason, the flag tooltip naming the broken range, and measured data with a
// `[degC]` column uploaded through the form: converted, overlaid, compared per point with
// bias and mean absolute deviation, a parity plot, and the band and measured data in the
// exported figure's legend.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { hasChromium, hoverSymbol, startDashboard, tooltipOf, type Dashboard } from '../helpers/dashboard-browser.js';

// The Fernbrook field station's inverter cold plate in an oil stream (invented scenario).
const PLATE = `name: plots-oil-plate
title: Inverter plate in an oil stream
configuration: flat-plate
methods: [laminar, mixed, similarity]
fluid: engine-oil
inputs:
  width: 1 m
  fluid_temperature: 60 degC
  surface_temperature: 20 degC
sweep:
  over:
    length: [0.5 m, 1 m, 2 m, 5 m]
    velocity: [0.5 m/s, 1 m/s, 2 m/s, 4 m/s]
`;
// A pipe map whose Pr has many values (too many series to draw one per value).
const MAP = `name: plots-pipe-map
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  L_over_D: 60
sweep:
  over:
    Re: {from: 3000, to: 3.0e5, count: 12, spacing: log}
    Pr: {from: 0.7, to: 100, count: 50, spacing: log}
`;
// The battery room's probe in air, with a measured bench series in degrees Celsius.
const PROBE = `name: plots-probe
configuration: cylinder
methods: [churchill-bernstein, hilpert, zukauskas]
fluid: air
inputs:
  diameter: 12.7 mm
  length: 94 mm
  surface_temperature: 128.4 degC
sweep:
  over:
    velocity: [1 m/s, 2 m/s, 4 m/s, 8 m/s, 16 m/s]
    fluid_temperature: [20 degC, 30 degC]
`;

const texts = (page: Page, testId = 'chart') => page.getByTestId(testId).locator('svg text').allTextContents();

describe.skipIf(!hasChromium)('plots of the trade (Chromium)', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let plate: number;
  let map: number;
  let probe: number;
  beforeAll(async () => {
    d = await startDashboard();
    plate = d.runStudy('plots-oil-plate', PLATE);
    map = d.runStudy('plots-pipe-map', MAP);
    probe = d.runStudy('plots-probe', PROBE);
  }, 240_000);
  afterAll(async () => d?.close());

  it('draws Nu against Re on a dimensional run, lengths as line styles sorted by value, similarity left out with the reason', async () => {
    const { context, page } = await d.signedIn('viewer');
    await page.goto(`${d.base}/#/runs/${plate}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    expect(await page.getByRole('combobox', { name: 'x axis' }).inputValue()).toBe('Re');
    expect(await page.getByRole('combobox', { name: 'y axis' }).inputValue()).toBe('Nu');
    expect(await page.getByRole('combobox', { name: 'series' }).inputValue()).toBe('length');
    await expect.poll(() => texts(page)).toContain('Re [-]');
    const legend = (await texts(page)).filter((t) => t.startsWith('length = '));
    expect(legend).toEqual(['length = 0.5 m', 'length = 1 m', 'length = 2 m', 'length = 5 m']);
    // The similarity solution gives Nu_x only: listed, with a way to see it.
    const left = page.getByTestId('left-out');
    await expect.poll(() => left.textContent()).toMatch(/similarity.*local values at x = L.*not the average Nu/);
    await left.getByRole('button', { name: 'Plot Nu_x' }).click();
    await expect.poll(() => texts(page)).toContain('Nu_x [-]');
    await expect.poll(() => page.getByTestId('left-out').count()).toBe(0);
    await context.close();
  });

  it('says which range a flagged point broke, in its tooltip', async () => {
    const { context, page } = await d.signedIn('viewer');
    await page.goto(`${d.base}/#/runs/${map}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    // Dittus–Boelter holds from Re = 1e4: its points below are hollow diamonds.
    await page.getByRole('combobox', { name: 'series' }).selectOption('method');
    // Hollow diamonds: flagged points of any method; hover each until Dittus–Boelter's.
    const tips: string[] = [];
    for (let i = 0; i < 60 && !tips.some((t) => t.startsWith('dittus-boelter')); i++) {
      if ((await hoverSymbol(page, '#ffffff', i).catch(() => 0)) === 0) break;
      await page.waitForTimeout(150);
      await expect.poll(() => tooltipOf(page).textContent()).toContain('flagged: ');
      tips.push((await tooltipOf(page).textContent())!);
    }
    expect(tips.some((t) => /^dittus-boelter.*flagged: Re [\d,.e]+ < 10,000/.test(t))).toBe(true);
    await context.close();
  });

  it('refuses a few dozen series with a message and a suggestion, and small multiples draw', async () => {
    const { context, page } = await d.signedIn('viewer');
    await page.goto(`${d.base}/#/runs/${map}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await page.getByRole('combobox', { name: 'series' }).selectOption('Pr');
    const problem = page.getByTestId('series-problem');
    await expect.poll(() => problem.textContent()).toMatch(/Pr has 50 values.*range filter on Pr/);
    expect(await page.getByTestId('chart').count()).toBe(0);
    await problem.getByRole('button', { name: 'Put Pr on x' }).click();
    await expect.poll(() => texts(page)).toContain('Pr [-]');
    // A second input with few values in panels: one titled panel per value.
    await page.goto(`${d.base}/#/runs/${plate}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await page.getByLabel('small multiples').check();
    await expect.poll(async () => (await texts(page)).filter((t) => /^length = /.test(t))).toEqual(['length = 0.5 m', 'length = 1 m', 'length = 2 m', 'length = 5 m']);
    await context.close();
  });

  it('uploads a [degC] measurement through the form and compares it: deviation, bias, MAD, parity plot, legend of the exported figure', async () => {
    const { context, page } = await d.signedIn('researcher');
    await page.goto(`${d.base}/#/studies`);
    await page.getByRole('link', { name: 'plots-probe' }).click();
    const csv = path.join(d.dir, 'bench-probe.csv');
    writeFileSync(csv, 'velocity [m/s];fluid_temperature [degC];h [W/(m^2 K)]\n2;20;41\n8;20;84\n4;30;57\n');
    const form = page.getByRole('form', { name: 'Upload measurements' });
    await form.locator('input[type=file]').setInputFiles(csv);
    await expect.poll(() => form.getByTestId('column-mapping').allTextContents()).toContainEqual(expect.stringContaining('read in degC, stored in SI (K)'));
    await form.getByRole('button', { name: 'Upload measurements' }).click();
    await page.getByText('Measurements stored.').waitFor();
    // Stored in SI: 20 °C is 293.15 K (mathjs, as in study files).
    const list = (await page.evaluate(async () => (await fetch('/api/studies')).json())) as { studies: { id: number; name: string }[] };
    const study = list.studies.find((s) => s.name === 'plots-probe')!;
    const ms = (await page.evaluate(async (id) => (await fetch(`/api/studies/${id}/measurements`)).json(), study.id)) as { measurements: { id: number }[] };
    const rows = (await page.evaluate(async (id) => (await fetch(`/api/measurements/${id}`)).json(), ms.measurements[0].id)) as { rows: { values: Record<string, number> }[] };
    expect(rows.rows.map((r) => r.values.fluid_temperature)).toEqual([293.15, 293.15, 303.15]);

    await page.goto(`${d.base}/#/runs/${probe}`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await page.getByRole('combobox', { name: 'y axis' }).selectOption('h');
    await page.getByRole('combobox', { name: 'measured data' }).selectOption({ label: 'bench-probe.csv (3 rows)' });
    const mad = page.getByRole('table', { name: 'Deviation per method' });
    await mad.locator('tbody tr').first().waitFor();
    expect(await mad.locator('tbody tr').count()).toBe(3);
    expect(await mad.locator('tbody tr').first().textContent()).toMatch(/churchill-bernstein3[+-][\d.]+ %[\d.]+ %/);
    await page.getByTestId('parity-chart').locator('svg').waitFor();
    await expect.poll(() => texts(page, 'parity-chart')).toContain('±10 %');
    expect(await texts(page, 'parity-chart')).toContain('measured h [W/(m²·K)]');
    const perPoint = page.getByRole('table', { name: 'Deviation at each measured point' });
    expect(await perPoint.locator('tbody tr').count()).toBe(3);
    // The measured points sit at the Re the engine derives for their velocity and temperature.
    await expect.poll(() => texts(page)).toContain('measured: bench-probe.csv');

    // Band on: the exported figure's legend keeps the band and the measured data.
    await page.getByRole('combobox', { name: 'series' }).selectOption('fluid_temperature');
    await page.getByRole('combobox', { name: 'uncertainty band' }).selectOption('hilpert');
    await expect.poll(() => texts(page)).toContain('±20 % band: hilpert');
    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Chart as SVG' }).click()]);
    const svgText = readFileSync((await svg.path())!, 'utf8');
    expect(svgText).toContain('±20 % band: hilpert');
    expect(svgText).toContain('measured: bench-probe.csv');
    expect(svgText).toContain('licensed engineer');
    const [parity] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Parity plot as SVG' }).click()]);
    expect(readFileSync((await parity.path())!, 'utf8')).toContain('predicted h [W/(m²·K)]');
    await context.close();
  });
});
