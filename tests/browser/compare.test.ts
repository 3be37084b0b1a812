// The comparison page in real Chromium on two versions of the demo tube study (v2 halves
// L/D and adds Re = 2e6) and a copy of v1 whose Re values are off by a few parts in 10⁹:
// nothing paired is said as such (never "nothing changed"); pairing by the swept inputs
// pairs them, with counts that agree with the API; the YAML diff shows the changed lines;
// a tolerance pairs the nudged copy; a choice that cannot identify points is explained.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM, DESKTOP, repo, signedIn, startDashboard, type Dashboard } from './harness.js';

const v1 = readFileSync(path.join(repo, 'studies', 'tube-loop-map.yaml'), 'utf8');
const v2 = v1.replace('L_over_D: 60', 'L_over_D: 30').replace('3.0e5, 1.0e6]', '3.0e5, 1.0e6, 2.0e6]');
// The same points as v1 with Re as another tool might have rounded it (relative 1e-9 … 4e-9).
const nudged = v1.replace(
  'Re: [500, 1000, 2000, 5000, 10760, 2.0e4, 5.0e4, 1.0e5, 3.0e5, 1.0e6]',
  'Re: [500.0000005, 1000.000002, 2000.000004, 5000.00001, 10760.00002, 20000.00004, 50000.0001, 100000.0002, 300000.0006, 1000000.002]',
);

const count = (n: number) => n.toLocaleString('en');

describe.skipIf(!existsSync(CHROMIUM))('comparison page', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let a: number;
  let b: number;
  let c: number;
  /** Methods of the pipe configuration that the study runs (every one: it names none). */
  let M: number;

  beforeAll(async () => {
    expect(v2).not.toBe(v1);
    expect(nudged).not.toBe(v1);
    d = await startDashboard([
      ['tube-loop-map', v1],
      ['tube-loop-map-v2', v2],
      ['tube-loop-map-nudged', nudged],
    ]);
    [a, b, c] = d.runs;
    const [row] = await d.store.dialect.all('select methods from runs where id = ?', [a]);
    M = JSON.parse(row.methods).length;
  }, 180_000);

  afterAll(async () => {
    await d?.close();
  });

  it('says that nothing paired when a fixed input changed, then pairs by the swept inputs', async () => {
    const { context, page } = await signedIn(d, 'researcher', DESKTOP);
    await page.goto(`${d.base}/#/compare?a=${a}&b=${b}&output=Nu`);
    const verdict = page.getByTestId('compare-verdict');
    await expect.poll(() => verdict.textContent(), { timeout: 20_000 }).toContain('Nothing paired');
    expect(await verdict.textContent()).toContain('no point of run a has the same L_over_D, Pr, Re, heating, viscosity_ratio (equal values) as a point of run b');
    // Never "nothing changed", no empty chart or table pretending there is nothing to show.
    expect(await page.getByText(/None of the|No paired point changed/).count()).toBe(0);
    expect(await page.getByRole('table', { name: 'Compared points' }).count()).toBe(0);
    await expect.poll(() => page.getByTestId('compare-counts').textContent()).toMatch(new RegExp(`paired\\s*0 results at 0 points.*only in a\\s*${count(50 * M)} results, 50 points.*only in b\\s*${count(55 * M)} results, 55 points`));
    // The study files' diff shows what differs.
    const diff = page.getByTestId('yaml-diff');
    await diff.waitFor();
    expect(await diff.locator('[data-kind=del]').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining('L_over_D: 60')]));
    expect(await diff.locator('[data-kind=add]').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining('L_over_D: 30'), expect.stringContaining('2.0e6')]));

    // Untick L/D: the points pair by Re, Pr (and the unchanged fixed inputs).
    await page.getByRole('checkbox', { name: 'L_over_D' }).uncheck();
    await expect.poll(() => verdict.textContent(), { timeout: 20_000 }).toMatch(new RegExp(`paired results? of ${count(50 * M)} changed Nu`));
    const api = await page.evaluate(async ([x, y]) => (await (await fetch(`/api/compare?a=${x}&b=${y}&output=Nu&by=Pr,Re,heating,viscosity_ratio&pageSize=1`)).json()) as Record<string, any>, [a, b]);
    expect(api).toMatchObject({ paired: 50 * M, only_a: 0, only_b: 5 * M });
    const counts = (await page.getByTestId('compare-counts').textContent())!;
    expect(counts).toMatch(new RegExp(`paired\\s*${count(50 * M)} results at 50 points\\s*changed\\s*${count(api.changed)}\\s*only in a\\s*0 results, 0 points\\s*only in b\\s*${count(5 * M)} results, 5 points`));
    expect(page.url()).toContain('by=Pr%2CRe%2Cheating%2Cviscosity_ratio');
    // The table lists the changed pairs with b's L/D beside a's.
    const table = page.getByRole('table', { name: 'Compared points' });
    await table.locator('tbody tr').first().waitFor();
    expect(await table.locator('thead th').allTextContents()).toEqual(expect.arrayContaining(['L_over_D [-] in b', 'run a: Nu [-]', '(b − a)/|a| [%]']));
    await expect.poll(() => page.getByTestId('page-status').textContent()).toContain(`${count(api.changed)} rows`);
    await page.getByTestId('chart').locator('svg').waitFor();
    await context.close();
  });

  it('pairs rounded inputs within a tolerance, and only then', async () => {
    const { context, page } = await signedIn(d, 'viewer', DESKTOP);
    await page.goto(`${d.base}/#/compare?a=${a}&b=${c}&output=Nu`);
    const verdict = page.getByTestId('compare-verdict');
    await expect.poll(() => verdict.textContent(), { timeout: 20_000 }).toContain('Nothing paired');
    await page.getByLabel('numbers match within').selectOption({ label: '1 in 10⁶' });
    await expect.poll(() => page.getByTestId('compare-counts').textContent(), { timeout: 20_000 }).toMatch(new RegExp(`paired\\s*${count(50 * M)} results at 50 points.*only in a\\s*0 results.*only in b\\s*0 results`));
    expect(await verdict.textContent()).toContain('(within 1 in 10⁶)');
    // Both Re columns: a's and b's (they differ in the last digits).
    await page.getByLabel('show').selectOption('any');
    const table = page.getByRole('table', { name: 'Compared points' });
    await table.locator('tbody tr').first().waitFor();
    expect(await table.locator('thead th').allTextContents()).toEqual(expect.arrayContaining(['Re [-] in b']));
    await context.close();
  });

  it('explains a pairing that cannot tell points apart', async () => {
    const { context, page } = await signedIn(d, 'viewer', DESKTOP);
    await page.goto(`${d.base}/#/compare?a=${a}&b=${b}&output=Nu&by=Re`);
    await expect.poll(() => page.getByRole('alert').first().textContent(), { timeout: 20_000 }).toMatch(/The runs could not be compared\..*does not tell points of run a .* apart.*Pair by more inputs\./);
    await context.close();
  });
});
