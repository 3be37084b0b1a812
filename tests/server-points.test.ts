// GET /api/runs/:id/points/:point: every method's row at one point with its band, flags
// and stated uncertainty, and the point's summary (stored, or computed for runs without).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { methodsFor } from '../shared/physics/catalogue.js';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getPointSummaryFacts } from '../shared/db/index.js';
import { explainSummary } from '../shared/design/index.js';
import { getMethod } from '../shared/physics/catalogue.js';
import { prepareStudy, runStudy } from '../shared/runner/index.js';
import { loadStudyFile } from '../shared/study/index.js';
import { startTestServer, type Client, type TestServer } from './helpers/server.js';

const STUDY = `name: points-api
configuration: pipe
inputs:
  L_over_D: 40
sweep:
  over:
    Re: [1000, 1.0e5]
    Pr: [5, 20000]
uncertainty: {}
`;

let s: TestServer;
let viewer: Client;
let runId: number;
let dir: string;

beforeAll(async () => {
  s = await startTestServer();
  viewer = await s.signIn(s.emails.viewer);
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-points-'));
  writeFileSync(join(dir, 'points.yaml'), STUDY);
  runId = (await runStudy(s.store, prepareStudy(loadStudyFile(join(dir, 'points.yaml'))), { workers: 1 })).id;
});
afterAll(async () => {
  await s.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('GET /api/runs/:id/points/:point', () => {
  it('gives every method with its band, flags, stated uncertainty and the stored summary', async () => {
    const { status, body } = await viewer.json('GET', `/api/runs/${runId}/points/2`);
    expect(status).toBe(200);
    expect(body.point).toBe(2);
    expect(body.inputs).toEqual({ L_over_D: 40, Re: 1e5, Pr: 5 });
    expect(body.rows.map((r: { method: string }) => r.method)).toEqual(methodsFor('pipe').map((m) => m.id));
    const gnielinski = body.rows.find((r: { method: string }) => r.method === 'gnielinski');
    expect(gnielinski.uncertainty.fraction).toBe(0.1);
    expect(gnielinski.outputs.Nu_low).toBeCloseTo(gnielinski.outputs.Nu * 0.9, 10);
    expect(gnielinski.outputs.Nu_high).toBeCloseTo(gnielinski.outputs.Nu * 1.1, 10);
    expect(gnielinski.recommended).toBe(true);
    const fractions = body.rows.map((r: { method: string }) => ({ id: r.method, fraction: getMethod('pipe', r.method).uncertainty.fraction }));
    expect(body.summary).toEqual(explainSummary((await getPointSummaryFacts(s.store, runId, 2))!, fractions, body.rows));
    expect(body.summary.recommended).toBe('gnielinski');
    expect(body.summary_source).toBe('stored');
    expect(body.rows.find((r: { method: string }) => r.method === 'laminar-developed').flags).toContain('out-of-range:Re');
  });

  it('says no-applicable-method where no method holds (Pr = 20000 at Re = 1e5 is past every pipe correlation)', async () => {
    const { body } = await viewer.json('GET', `/api/runs/${runId}/points/3`);
    expect(body.summary.recommended).toBeNull();
    expect(body.summary.flags).toEqual(['no-applicable-method']);
    expect(body.rows.every((r: { recommended: boolean }) => !r.recommended)).toBe(true);
  });

  it('computes the summary for a run stored without summaries', async () => {
    await s.store.db.deleteFrom('point_summaries').where('run_id', '=', runId).execute();
    const { body } = await viewer.json('GET', `/api/runs/${runId}/points/2`);
    expect(body.summary_source).toBe('computed');
    expect(body.summary.recommended).toBe('gnielinski');
  });

  it('answers 404 for a missing point or run, 400 for a bad index, 401 without a session', async () => {
    expect((await viewer.json('GET', `/api/runs/${runId}/points/4`)).status).toBe(404);
    expect((await viewer.json('GET', `/api/runs/999/points/0`)).status).toBe(404);
    expect((await viewer.json('GET', `/api/runs/${runId}/points/-1`)).status).toBe(400);
    expect((await s.anonymous().json('GET', `/api/runs/${runId}/points/0`)).status).toBe(401);
  });
});
