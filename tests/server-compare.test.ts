// GET /api/compare on a real server (SQLite, and PostgreSQL when FILMSWEEP_TEST_PG_URL is
// set): points paired by chosen inputs, exactly or within a tolerance; the counts of
// paired and unpaired results and points; pages across the count pass's chunks; the
// limits (413, 422, 503); the YAML of both study versions; and the latency of another
// request while two runs of 240,000 results are compared.
//
// The runs are written straight through the store (createRun + batch writer) with
// invented outputs, so each scenario is exactly what it tests; every expectation is
// recomputed here from the stored rows (getRunRows), independently of the SQL.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBatchWriter, createRun, finishRun, getRunRows, type Store } from '../shared/db/index.js';
import { COMPARE_MAX_RESULTS } from '../shared/db/compare-query.js';
import { MAX_WAITING, ReadThreadBusyError, readOffThread } from '../shared/db/read-thread.js';
import { sha256Hex } from '../shared/study/sha256.js';
import type { Inputs } from '../shared/physics/types.js';
import { startTestServer, type Client, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

type Output = (inputs: Inputs, method: string) => number | undefined;

/** Stores a finished run of the given points (every method at every point) and returns its id. */
async function storeRun(store: Store, study: string, tag: string, methods: string[], points: Inputs[], nu: Output): Promise<number> {
  const yaml = `name: ${study}\nconfiguration: pipe\n# ${tag}\n`;
  const id = await createRun(store, {
    study: { name: study, title: null, configuration: 'pipe' },
    yaml,
    hash: sha256Hex(yaml),
    sourceFile: null,
    methods: methods.map((m) => ({ id: m, version: 1 })),
    pointsTotal: points.length,
    workers: 1,
    host: 'test',
    pid: 0,
    gitCommit: null,
  });
  const writer = createBatchWriter(store, id, methods);
  for (let start = 0; start < points.length; start += 5000) {
    const idx = Array.from({ length: Math.min(5000, points.length - start) }, (_, i) => start + i);
    const outputs = idx.flatMap((p) =>
      methods.map((m) => {
        const v = nu(points[p], m);
        return JSON.stringify(v === undefined ? { h: 1 } : { Nu: v, h: 2 * v });
      }),
    );
    await writer.write({ points: idx, inputs: idx.map((p) => JSON.stringify(points[p])), outputs, flags: outputs.map(() => '[]') });
  }
  await finishRun(store, id, 'done');
  return id;
}

const grid = (res: number[], prs: number[], fixed: Inputs = {}): Inputs[] => res.flatMap((Re) => prs.map((Pr) => ({ ...fixed, Re, Pr })));
const RE = [800, 2000, 5000, 1e4, 3e4, 1e5, 3e5, 1.1e3, 4.4e4, 2.5e5];
const nuOf = (p: Inputs, m: string) => (m === 'hausen' ? 3.66 + 0.01 * Number(p.Re) : 0.023 * Number(p.Re) ** 0.8 * Number(p.Pr) ** 0.4 * (1 + 1 / Number(p.L_over_D ?? 1e9)));

interface Expected {
  pairs: { method: string; inputs: Inputs; inputs_b: Inputs; a: number | null; b: number | null; changed: boolean }[];
  onlyA: number;
  onlyB: number;
}

/** The comparison worked out from the stored rows: pairs by method and the inputs `by`, relative tolerance `tol`. */
async function expectedPairs(store: Store, a: number, b: number, by: string[], tol = 0): Promise<Expected> {
  const [ra, rb] = [(await getRunRows(store, a)).rows, (await getRunRows(store, b)).rows];
  const same = (x: unknown, y: unknown) =>
    typeof x === 'number' && typeof y === 'number' ? Math.abs(x - y) <= tol * Math.max(Math.abs(x), Math.abs(y)) : x !== undefined && x === y;
  const used = new Set<number>();
  const pairs: Expected['pairs'] = [];
  // Exact pairing looks b's rows up by key; a tolerance compares every pair (small runs only).
  const keyOf = (r: { method: string; inputs: Inputs }) => (by.every((n) => r.inputs[n] !== undefined) ? JSON.stringify([r.method, ...by.map((n) => r.inputs[n])]) : undefined);
  const byKey = new Map(rb.map((s, i) => [keyOf(s), i]));
  byKey.delete(undefined);
  for (const r of ra) {
    const k =
      tol === 0
        ? (byKey.get(keyOf(r)) ?? -1)
        : rb.findIndex((s, i) => !used.has(i) && s.method === r.method && by.every((n) => same(r.inputs[n], s.inputs[n])));
    if (k < 0) continue;
    used.add(k);
    const [av, bv] = [r.outputs.Nu ?? null, rb[k].outputs.Nu ?? null];
    const changed = av === null || bv === null ? av !== bv : Math.abs(bv - av) > 1e-12 * Math.max(Math.abs(av), Math.abs(bv));
    pairs.push({ method: r.method, inputs: r.inputs, inputs_b: rb[k].inputs, a: av, b: bv, changed });
  }
  return { pairs, onlyA: ra.length - pairs.length, onlyB: rb.length - pairs.length };
}

async function allPages(client: Client, query: string, pageSize: number) {
  const rows: any[] = [];
  for (let page = 1; ; page++) {
    const r = await client.json('GET', `/api/compare?${query}&page=${page}&pageSize=${pageSize}`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    rows.push(...r.body.rows);
    if (r.body.rows.length < pageSize) return { rows, last: r.body };
  }
}

describe.each(STORE_KINDS)('comparison on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let viewer: Client;
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'compare');
    s = await startTestServer({}, database.location);
    viewer = await s.signIn(s.emails.viewer);
    const st = s.store;
    // Version 1 and 2 of a study: v2 halves L/D (every value changes), adds Re = 6e5 and drops hausen.
    ids.v1 = await storeRun(st, 'cmp-tube', 'v1', ['gnielinski', 'hausen'], grid(RE, [0.7, 7], { L_over_D: 60 }), nuOf);
    ids.v2 = await storeRun(st, 'cmp-tube', 'v2', ['gnielinski'], grid([...RE, 6e5], [0.7, 7], { L_over_D: 30 }), nuOf);
    // v1 again with every Re off by one part in 1e9 (as a rounding elsewhere would leave it) and one value changed.
    const NUDGE = 1 + 1e-9;
    ids.nudged = await storeRun(st, 'cmp-tube', 'nudged', ['gnielinski', 'hausen'], grid(RE.map((r) => r * NUDGE), [0.7, 7], { L_over_D: 60 }), (p, m) =>
      nuOf({ ...p, Re: Number(p.Re) / NUDGE }, m) * (m === 'hausen' && p.Pr === 7 && Math.abs(Number(p.Re) - 5000) < 1 ? 1.05 : 1),
    );
    // A grid whose Re values lie 5 % apart, and one with string inputs.
    ids.close = await storeRun(st, 'cmp-close', 'v1', ['gnielinski'], grid([1000, 1050, 1100], [1]), nuOf);
    ids.fluidA = await storeRun(st, 'cmp-fluid', 'a', ['gnielinski'], ['water', 'air'].flatMap((fluid) => grid([1e4, 2e4], [1], { fluid })), nuOf);
    ids.fluidB = await storeRun(st, 'cmp-fluid', 'b', ['gnielinski'], ['air', 'oil'].flatMap((fluid) => grid([1e4, 2e4], [1], { fluid })), (p, m) => nuOf(p, m) * 2);
    // 5000 points (three chunks of the count pass) with a few values changed across chunk borders.
    const many = Array.from({ length: 5000 }, (_, i) => ({ Re: 1000 + i }));
    const changedAt = new Set([5, 2047, 2048, 4100, 4999]);
    ids.manyA = await storeRun(st, 'cmp-many', 'a', ['gnielinski'], many, (p) => Number(p.Re) / 7);
    ids.manyB = await storeRun(st, 'cmp-many', 'b', ['gnielinski'], many, (p) => (Number(p.Re) / 7) * (changedAt.has(Number(p.Re) - 1000) ? 1.5 : 1));
  }, 120_000);

  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  it('pairs nothing by default when a fixed input changed, and says so in the counts', async () => {
    const r = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&output=Nu`);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ by: ['L_over_D', 'Pr', 'Re'], tolerance: 0, total: 0, paired: 0, changed: 0, only_a: 40, only_b: 22 });
    expect(r.body.points).toEqual({ paired: 0, only_a: 20, only_b: 22 });
  });

  it('pairs by the chosen inputs: counts, every page and the changed filter agree with the stored rows', async () => {
    const exp = await expectedPairs(s.store, ids.v1, ids.v2, ['Re', 'Pr']);
    expect(exp.pairs.length).toBe(20); // 20 gnielinski points; hausen is only in v1, Re = 6e5 only in v2
    const q = `a=${ids.v1}&b=${ids.v2}&output=Nu&by=Re,Pr`;
    const { rows, last } = await allPages(viewer, q, 7);
    expect(last).toMatchObject({ by: ['Re', 'Pr'], total: 20, paired: 20, changed: exp.pairs.filter((p) => p.changed).length, only_a: exp.onlyA, only_b: exp.onlyB });
    expect(last.points).toEqual({ paired: 20, only_a: 0, only_b: 2 });
    expect(rows.map((r) => [r.method, r.inputs, r.inputs_b, r.a, r.b])).toEqual(exp.pairs.map((p) => [p.method, p.inputs, p.inputs_b, p.a, p.b]));
    for (const r of rows) expect(r.rel_diff).toBeCloseTo((r.b - r.a) / Math.abs(r.a), 12);
    const changedOnly = await allPages(viewer, `${q}&changed=yes`, 500);
    expect(changedOnly.rows.length).toBe(exp.pairs.filter((p) => p.changed).length);
  });

  it('pairs within a relative tolerance, and only within it', async () => {
    const q = `a=${ids.v1}&b=${ids.nudged}&output=Nu&by=Re,Pr`;
    const exact = (await viewer.json('GET', `/api/compare?${q}`)).body;
    expect(exact).toMatchObject({ paired: 0, only_a: 40, only_b: 40 });
    for (const tolerance of ['1e-6', '0.0001%']) {
      const exp = await expectedPairs(s.store, ids.v1, ids.nudged, ['Re', 'Pr'], 1e-6);
      const { rows, last } = await allPages(viewer, `${q}&tolerance=${encodeURIComponent(tolerance)}`, 500);
      expect(last).toMatchObject({ tolerance: 1e-6, paired: 40, changed: 1, only_a: 0, only_b: 0 });
      expect(rows.map((r) => [r.method, r.inputs.Re, r.inputs_b.Re, r.b])).toEqual(exp.pairs.map((p) => [p.method, p.inputs.Re, p.inputs_b.Re, p.b]));
      expect(rows.every((r) => r.inputs.Re !== r.inputs_b.Re)).toBe(true);
    }
    const diff = (await viewer.json('GET', `/api/compare?${q}&tolerance=1e-6&changed=yes`)).body;
    expect(diff.rows).toHaveLength(1);
    expect(diff.rows[0]).toMatchObject({ method: 'hausen', inputs: { Re: 5000, Pr: 7 } });
    expect(diff.rows[0].rel_diff).toBeCloseTo(0.05, 12);
    // 1e-10 is tighter than the nudge: nothing pairs.
    expect((await viewer.json('GET', `/api/compare?${q}&tolerance=1e-10`)).body).toMatchObject({ paired: 0 });
  });

  it('pairs strings only when equal, with or without a tolerance', async () => {
    for (const tol of ['', '&tolerance=0.01']) {
      const r = await viewer.json('GET', `/api/compare?a=${ids.fluidA}&b=${ids.fluidB}&by=fluid,Re${tol}`);
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      expect(r.body).toMatchObject({ paired: 2, changed: 2, only_a: 2, only_b: 2 });
      expect(r.body.rows.every((row: any) => row.inputs.fluid === 'air' && row.inputs_b.fluid === 'air')).toBe(true);
    }
  });

  it('pages across the chunks of a 5000-point run, all pairs and changed ones', async () => {
    const q = `a=${ids.manyA}&b=${ids.manyB}&by=Re`;
    const exp = await expectedPairs(s.store, ids.manyA, ids.manyB, ['Re']);
    for (const page of [1, 20, 21, 41, 50]) {
      const r = (await viewer.json('GET', `/api/compare?${q}&page=${page}&pageSize=100`)).body;
      expect(r.total).toBe(5000);
      expect(r.rows.map((x: any) => x.inputs.Re)).toEqual(exp.pairs.slice((page - 1) * 100, page * 100).map((p) => p.inputs.Re));
    }
    const changed = await allPages(viewer, `${q}&changed=yes`, 2);
    expect(changed.rows.map((x) => x.inputs.Re - 1000)).toEqual([5, 2047, 2048, 4100, 4999]);
    expect(changed.last.total).toBe(5);
  });

  it('refuses choices it cannot honour with 422 and a message that says what to do', async () => {
    const byRe = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re`);
    expect(byRe.status).toBe(422);
    expect(byRe.body.error.message).toMatch(/does not tell points of run a .* apart: points \d+ and \d+ would pair as one \(Pr 0\.7 \/ 7\)\. Pair by more inputs\./);
    const coarse = await viewer.json('GET', `/api/compare?a=${ids.close}&b=${ids.close}&by=Re,Pr&tolerance=6%25`);
    expect(coarse.status).toBe(422);
    expect(coarse.body.error.message).toContain('Use a smaller tolerance than the spacing of Re');
    // 4 % is finer than the 5 % spacing: every point pairs with itself.
    expect((await viewer.json('GET', `/api/compare?a=${ids.close}&b=${ids.close}&by=Re,Pr&tolerance=4%25`)).body).toMatchObject({ paired: 3, changed: 0 });
    const unknown = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re,Gr`);
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.message).toBe('neither run has the input Gr; they have: L_over_D, Pr, Re');
    for (const t of ['0.2', '-0.01', '20%25']) {
      const r = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re,Pr&tolerance=${t}`);
      expect(r.status).toBe(422);
      expect(r.body.error.message).toMatch(/tolerance .* is outside 0 … 0\.1/);
    }
    expect((await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&tolerance=abc`)).status).toBe(400);
  });

  it('refuses a run above the size limit with 413', async () => {
    const [{ n }] = await s.store.dialect.all<{ n: number }>('select results_count as n from runs where id = ?', [ids.v2]);
    await s.store.dialect.run('update runs set results_count = ? where id = ?', [COMPARE_MAX_RESULTS + 1, ids.v2]);
    try {
      const r = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re,Pr`);
      expect(r.status).toBe(413);
      expect(r.body.error.message).toBe(`run b (#${ids.v2}) has 1,000,001 results; a comparison reads at most 1,000,000 per run. Export both runs and compare them offline.`);
    } finally {
      await s.store.dialect.run('update runs set results_count = ? where id = ?', [n, ids.v2]);
    }
  });

  it('sends both study versions\' YAML on request', async () => {
    const r = await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re,Pr&pageSize=1&yaml=yes`);
    expect(r.body.yaml).toEqual({ a: 'name: cmp-tube\nconfiguration: pipe\n# v1\n', b: 'name: cmp-tube\nconfiguration: pipe\n# v2\n' });
    expect((await viewer.json('GET', `/api/compare?a=${ids.v1}&b=${ids.v2}&by=Re,Pr&pageSize=1`)).body.yaml).toBeUndefined();
  });

  it('refuses long reads beyond the waiting line instead of queueing them without bound', async () => {
    const slow = kind === 'sqlite' ? 'with recursive c(i) as (select 1 union all select i + 1 from c where i < 400000) select count(*) as n from c' : 'select pg_sleep(0.3) is null as n';
    const outcomes = await Promise.allSettled(Array.from({ length: MAX_WAITING + 4 }, () => readOffThread(s.store, slow)));
    const refused = outcomes.filter((o) => o.status === 'rejected');
    expect(refused.length).toBeGreaterThanOrEqual(3);
    for (const o of refused) expect((o as PromiseRejectedResult).reason).toBeInstanceOf(ReadThreadBusyError);
    expect(outcomes.filter((o) => o.status === 'fulfilled').length).toBeGreaterThanOrEqual(MAX_WAITING);
  });
});

describe.each(STORE_KINDS)('another request while two 240,000-result runs are compared on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let viewer: Client;
  let a: number;
  let b: number;
  let changedPoints: number;

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'compare-big');
    s = await startTestServer({}, database.location);
    viewer = await s.signIn(s.emails.viewer);
    const points = grid(
      Array.from({ length: 400 }, (_, i) => 1e4 * 100 ** (i / 399)),
      Array.from({ length: 300 }, (_, i) => 0.7 * (100 / 0.7) ** (i / 299)),
    );
    changedPoints = points.filter((p) => Number(p.Pr) > 50).length;
    a = await storeRun(s.store, 'cmp-big', 'a', ['dittus-boelter', 'gnielinski'], points, nuOf);
    b = await storeRun(s.store, 'cmp-big', 'b', ['dittus-boelter', 'gnielinski'], points, (p, m) => nuOf(p, m) * (Number(p.Pr) > 50 ? 1.01 : 1));
  }, 300_000);

  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  it('answers the other request promptly (the comparison runs off the event loop)', async () => {
    const t0 = performance.now();
    let done = false;
    const comparison = viewer.json('GET', `/api/compare?a=${a}&b=${b}&output=Nu&changed=yes`).finally(() => (done = true));
    const latencies: number[] = [];
    while (!done) {
      const t = performance.now();
      const r = await viewer.json('GET', '/api/studies');
      expect(r.status).toBe(200);
      latencies.push(performance.now() - t);
      await new Promise((res) => setTimeout(res, 20));
    }
    const compareMs = performance.now() - t0;
    const c = await comparison;
    expect(c.status, JSON.stringify(c.body)).toBe(200);
    const worst = Math.max(...latencies);
    console.log(`${kind}: comparison of 2 × 240,000 results took ${compareMs.toFixed(0)} ms; ${latencies.length} other requests meanwhile, slowest ${worst.toFixed(0)} ms`);
    // The comparison is long enough for the measurement to mean something (on run tables it
    // takes about half a second on SQLite, 1.6 s on PostgreSQL)…
    expect(compareMs).toBeGreaterThan(250);
    // …and no other request waited for it (before: the whole comparison, 6 s on a 240,000-result pair).
    expect(worst).toBeLessThan(Math.min(750, compareMs / 3));
    expect(latencies.length).toBeGreaterThan(3);
    expect(c.body).toMatchObject({ total: 2 * changedPoints, changed: 2 * changedPoints, paired: 240_000, only_a: 0, only_b: 0 });
  }, 120_000);
});
