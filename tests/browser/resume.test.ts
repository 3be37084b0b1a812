// The run page's "Resume run" button (POST /api/runs/:id/resume) in real Chromium: shown
// to a researcher on an interrupted run, not to a viewer nor on a finished run; pressing
// it finishes the run in the background and the page follows it to `done` with every point.
import { existsSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHROMIUM, DESKTOP, dist, signedIn, startDashboard, type Dashboard } from './harness.js';

const STUDY = `name: resume-sweep
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: 300, spacing: log}
    Pr: [0.7, 5, 50]
`;

describe.skipIf(!existsSync(CHROMIUM))('resuming an interrupted run from the run page', { timeout: 180_000 }, () => {
  let d: Dashboard;
  let stopped: number;

  beforeAll(async () => {
    d = await startDashboard([['resume-sweep-done', STUDY.replace('resume-sweep', 'resume-sweep-done')]]);
    // The same sweep stopped after its first batch (as Ctrl-C leaves it): `interrupted`.
    const { prepareStudy, runStudy } = await dist('shared/runner/index.js');
    const { parseStudy } = await dist('shared/study/index.js');
    const stop = new AbortController();
    const outcome = await runStudy(d.store, prepareStudy(parseStudy(STUDY, 'resume-sweep.yaml')), { workers: 1, batchSize: 50, stop: stop.signal, onProgress: () => stop.abort() });
    expect(outcome.status).toBe('interrupted');
    expect(outcome.points_done).toBeLessThan(900);
    stopped = outcome.id;
  }, 180_000);

  afterAll(async () => {
    await d?.close();
  });

  it('is offered to a researcher on an interrupted run only, and finishes the run', async () => {
    const viewer = await signedIn(d, 'viewer', DESKTOP);
    await viewer.page.goto(`${d.base}/#/runs/${stopped}`);
    await expect.poll(() => viewer.page.getByTestId('run-status').first().textContent()).toBe('interrupted');
    expect(await viewer.page.getByRole('button', { name: 'Resume run' }).count()).toBe(0);
    await viewer.context.close();

    const { context, page } = await signedIn(d, 'researcher', DESKTOP);
    await page.goto(`${d.base}/#/runs/${d.runs[0]}`);
    await expect.poll(() => page.getByTestId('run-status').first().textContent()).toBe('done');
    expect(await page.getByRole('button', { name: 'Resume run' }).count()).toBe(0);
    await page.goto(`${d.base}/#/runs/${stopped}`);
    await page.getByRole('button', { name: 'Resume run' }).click();
    await expect.poll(() => page.getByTestId('run-status').first().textContent(), { timeout: 60_000 }).toBe('done');
    expect(await page.getByRole('button', { name: 'Resume run' }).count()).toBe(0);
    const run = await page.evaluate(async (id) => ((await (await fetch(`/api/runs/${id}`)).json()) as { run: { points_done: number; results_count: number } }).run, stopped);
    expect(run).toMatchObject({ points_done: 900, results_count: 1800 });
    await context.close();
  });
});
