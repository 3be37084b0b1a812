// Studies, runs and their data through the API of a real server: upload (valid, invalid,
// too large, wrong type, too many points), the background run and its mail, results paging
// / sorting / filtering checked against getRunRows (both off the run's table and off the
// JSON columns of a run stored before run tables), chart downsampling, measurements and their overlay MAD, comparison,
// reference marks, exports, audit, and `filmsweep push` end to end with the compiled CLI;
// on SQLite and, when FILMSWEEP_TEST_PG_URL is set, on PostgreSQL.
import { execFile } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getRunRows } from '../shared/db/index.js';
import { hasRunTable, runTableName } from '../shared/db/result-table.js';
import { storeAsBeforeRunTables } from './helpers/legacy.js';
import { CAUTION } from '../shared/export/index.js';
import { solvePoint, type ResultRow } from '../shared/physics/engine.js';
import type { Inputs } from '../shared/physics/types.js';
import { cliPath, repoRoot } from './helpers/cli.js';
import { Client, startTestServer, waitForRun, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';
import type { Store } from '../shared/db/index.js';

async function countOf(store: Store, query: string, ...params: unknown[]): Promise<number> {
  const [row] = await store.dialect.all<{ n: unknown }>(query, params);
  return Number(row.n);
}

describe.each(STORE_KINDS)('on %s', (kind) => {
let database: TestDatabase;
let s: TestServer;
let researcher: Client;
let viewer: Client;
let lead: Client;

const PIPE = (name: string, pr = '[0.7, 5, 50]', count = 30) => `name: ${name}
title: Pipe sweep for the dashboard tests
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: true
sweep:
  over:
    Re: {from: 2.0e3, to: 1.0e6, count: ${count}, spacing: log}
    Pr: ${pr}
`;

function yamlForm(text: string, filename = 'study.yaml', type = 'application/yaml'): FormData {
  const form = new FormData();
  form.append('file', new Blob([text], { type }), filename);
  return form;
}

async function upload(text: string, filename?: string, type?: string) {
  return researcher.json('POST', '/api/studies', { form: yamlForm(text, filename, type) });
}

let runA: number;
let studyA: number;

beforeAll(async () => {
  database = await createTestDatabase(kind, 'dashboard');
  s = await startTestServer({ maxPoints: 50_000 }, database.location);
  researcher = await s.signIn(s.emails.researcher);
  viewer = await s.signIn(s.emails.viewer);
  lead = await s.signIn(s.emails.lead);
  const up = await upload(PIPE('dash-pipe'));
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  runA = up.body.run.id;
  studyA = up.body.study.id;
  await waitForRun(viewer, runA);
}, 60_000);
afterAll(async () => {
  await s?.close();
  await database?.drop();
});

describe('uploading studies', () => {
  it('answers 201 with the study, version and run, runs it in the background and mails whoever started it', async () => {
    const up = await upload(PIPE('dash-upload', '[0.7, 5]', 12));
    expect(up.status).toBe(201);
    expect(up.body.study).toMatchObject({ name: 'dash-upload', configuration: 'pipe', title: 'Pipe sweep for the dashboard tests' });
    expect(up.body.version).toMatchObject({ version: 1 });
    expect(up.body.version.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(up.body.run).toMatchObject({ study: 'dash-upload', points_total: 24, started_by: s.emails.researcher, reference: false, git_commit: null });
    const done = await waitForRun(viewer, up.body.run.id);
    expect(done.run).toMatchObject({ status: 'done', points_done: 24, results_count: 48 });
    expect(done.error).toBeNull();
    expect(done.columns.inputs).toEqual(expect.arrayContaining(['Re', 'Pr', 'heating']));
    expect(done.columns.outputs).toEqual(expect.arrayContaining(['Nu']));
    expect(done.summary.map((m: any) => m.method)).toEqual(['gnielinski', 'dittus-boelter']);
    // The mail is sent right after the run ends: allow it a moment.
    let mail;
    for (let i = 0; i < 40 && !mail; i++) {
      mail = (await lead.json('GET', '/api/outbox')).body.messages.find((m: any) => m.subject.includes(`run ${up.body.run.id}`));
      if (!mail) await new Promise((r) => setTimeout(r, 50));
    }
    expect(mail).toMatchObject({ to: s.emails.researcher });
    expect(mail.text).toMatch(/ended: done/);
    const audit = (await lead.json('GET', '/api/audit')).body.entries.map((e: any) => e.action);
    expect(audit).toEqual(expect.arrayContaining(['upload', 'run-started']));
    const studies = (await viewer.json('GET', '/api/studies?q=upload')).body.studies;
    expect(studies).toHaveLength(1);
    expect(studies[0]).toMatchObject({ name: 'dash-upload', versions: 1, last_run: { id: up.body.run.id } });
    // The run names its study's id, so the run page links and lists measurements without a search.
    expect(done.study_id).toBe(studies[0].id);
    // … and its configuration's regime, the chart's default abscissa (a pipe: forced, internal).
    expect(done.regime).toBe('internal');
    const detail = (await viewer.json('GET', `/api/studies/${studies[0].id}`)).body;
    expect(detail.versions[0].yaml).toBe(PIPE('dash-upload', '[0.7, 5]', 12));
    expect(detail.runs.map((r: any) => r.id)).toEqual([up.body.run.id]);
    expect((await viewer.json('GET', `/api/runs?study=${studies[0].id}&status=done`)).body.runs).toHaveLength(1);
  });

  it('refuses an invalid study with 400 and its diagnostics (file, line, column), running nothing', async () => {
    const before = await countOf(s.store, 'select count(*) as n from runs');
    const bad = await upload('name: broken\nconfiguration: pipe\nmethods: [gnielinski, no-such-method]\nsweep:\n  over:\n    Re: [1.0e4]\n', 'broken.yaml');
    expect(bad.status).toBe(400);
    const d = bad.body.error.details.diagnostics;
    expect(d.length).toBeGreaterThan(0);
    const unknown = d.find((x: any) => /no-such-method/.test(x.message));
    expect(unknown).toMatchObject({ file: 'broken.yaml', line: 3 });
    expect(unknown.column).toBeGreaterThan(1);
    expect(d.every((x: any) => x.file === 'broken.yaml' && x.line >= 1 && x.column >= 1)).toBe(true);
    expect(await countOf(s.store, 'select count(*) as n from runs')).toBe(before);
  });

  it('refuses sweeps over the server\'s point limit before running', async () => {
    const big = await upload(PIPE('too-big', '{from: 0.7, to: 100, count: 1000}', 1000));
    expect(big.status).toBe(400);
    expect(JSON.stringify(big.body.error.details.diagnostics)).toMatch(/50,?000|points/);
  });

  it('limits upload size (413) and type (415)', async () => {
    const huge = `# ${'x'.repeat(300 * 1024)}\n${PIPE('huge')}`;
    expect((await upload(huge)).status).toBe(413);
    expect((await upload(PIPE('wrong-ext'), 'study.txt')).status).toBe(415);
    expect((await upload(PIPE('wrong-type'), 'study.yaml', 'image/png')).status).toBe(415);
    expect((await upload(`${PIPE('binary')}\u0000`, 'study.yaml')).status).toBe(415);
    expect((await researcher.json('POST', '/api/studies', { json: { yaml: PIPE('json') } })).status).toBe(415);
  });
});

/** The run's rows with point index, as getRunRows gives them (complete points, method order). */
async function expectedRows(runId: number) {
  const { run, rows } = await getRunRows(s.store, runId);
  const M = run.methods.length;
  return rows.map((r, k) => ({ point: Math.floor(k / M), methodIdx: k % M, ...r }));
}

type Row = Awaited<ReturnType<typeof expectedRows>>[number];
const value = (r: Row, name: string) => (name in r.outputs ? r.outputs[name] : (r.inputs[name] as number | undefined));

function expectedPage(rows: Row[], q: { sort: string; order: 'asc' | 'desc'; filter?: [string, number?, number?][]; method?: string[]; flagged?: 'yes' | 'no' }) {
  let out = rows.filter((r) => !q.method || q.method.includes(r.method));
  if (q.flagged) out = out.filter((r) => (r.flags.length > 0) === (q.flagged === 'yes'));
  for (const [name, min, max] of q.filter ?? []) {
    out = out.filter((r) => {
      const v = value(r, name);
      return v !== undefined && (min === undefined || v >= min) && (max === undefined || v <= max);
    });
  }
  const key = (r: Row) => (q.sort === 'point' ? r.point : q.sort === 'method' ? r.methodIdx : value(r, q.sort));
  out.sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    // A missing value sorts first (SQLite's NULL order), then point, then method.
    const c = ka === kb ? 0 : ka === undefined ? -1 : kb === undefined ? 1 : (ka as number) - (kb as number);
    return c || (q.sort === 'method' ? a.point - b.point : a.point - b.point || a.methodIdx - b.methodIdx);
  });
  if (q.order === 'desc') out.reverse();
  return out;
}

describe('results: paging, sorting, filtering', () => {
  const cases: { label: string; qs: string; q: Parameters<typeof expectedPage>[1]; page: number; pageSize: number }[] = [
    { label: 'default order', qs: '', q: { sort: 'point', order: 'asc' }, page: 2, pageSize: 25 },
    { label: 'sort by Nu descending', qs: 'sort=Nu&order=desc', q: { sort: 'Nu', order: 'desc' }, page: 1, pageSize: 40 },
    { label: 'filter on an input, sort by output', qs: 'filter=Re:1e4:2e5&sort=Nu', q: { sort: 'Nu', order: 'asc', filter: [['Re', 1e4, 2e5]] }, page: 2, pageSize: 10 },
    {
      label: 'two filters (open ends), one method',
      qs: 'filter=Re:5e4:&filter=Pr::10&method=gnielinski&sort=Re&order=desc',
      q: { sort: 'Re', order: 'desc', filter: [['Re', 5e4], ['Pr', undefined, 10]], method: ['gnielinski'] },
      page: 1,
      pageSize: 500,
    },
    { label: 'flagged only, by method', qs: 'flagged=yes&sort=method', q: { sort: 'method', order: 'asc', flagged: 'yes' }, page: 1, pageSize: 30 },
    { label: 'not flagged, deep page', qs: 'flagged=no&sort=Pr&order=desc', q: { sort: 'Pr', order: 'desc', flagged: 'no' }, page: 3, pageSize: 7 },
  ];

  for (const stored of ['table', 'json'] as const) {
    it(`matches getRunRows ${stored === 'table' ? "off the run's table" : 'off the JSON columns of a run stored before run tables'}`, async () => {
      if (stored === 'json') await storeAsBeforeRunTables(s.store, runA);
      expect(await hasRunTable(s.store, runA)).toBe(stored === 'table');
      const rows = await expectedRows(runA);
      expect(rows.some((r) => r.flags.length > 0)).toBe(true);
      for (const c of cases) {
        const r = await viewer.json('GET', `/api/runs/${runA}/results?page=${c.page}&pageSize=${c.pageSize}&${c.qs}`);
        expect(r.status, c.label).toBe(200);
        const want = expectedPage(rows, c.q);
        expect(r.body.total, c.label).toBe(want.length);
        expect(r.body.page).toBe(c.page);
        expect(r.body.pageSize).toBe(c.pageSize);
        const slice = want.slice((c.page - 1) * c.pageSize, c.page * c.pageSize);
        expect(r.body.rows.length, c.label).toBe(slice.length);
        expect(r.body.rows.map((x: any) => [x.point, x.method, x.inputs, x.outputs, x.flags]), c.label).toEqual(
          slice.map((x) => [x.point, x.method, x.inputs, x.outputs, x.flags]),
        );
      }
    });
  }

  it('refuses unknown names, bad filters and oversized pages with 400', async () => {
    for (const qs of ['sort=Nope', 'filter=Re:abc:', 'filter=Re', 'pageSize=501', 'method=no-such', "sort=Nu'--", 'flagged=maybe', 'extra=1']) {
      const r = await viewer.json('GET', `/api/runs/${runA}/results?${qs}`);
      expect(r.status, qs).toBe(400);
    }
    expect((await viewer.json('GET', '/api/runs/424242/results')).status).toBe(404);
  });
});

describe('charts', () => {
  it('returns every point when few, and a downsampled envelope bounded by max when many', async () => {
    const rows = await expectedRows(runA);
    const all = await viewer.json('GET', `/api/runs/${runA}/chart?x=Re&y=Nu`);
    expect(all.status).toBe(200);
    expect(all.body).toMatchObject({ x: 'Re', y: 'Nu', total: rows.length, downsampled: false });
    expect(all.body.series.map((x: any) => x.method)).toEqual(['gnielinski', 'dittus-boelter']);
    expect(all.body.uncertainty.gnielinski).toBeGreaterThan(0);
    const flat = all.body.series.flatMap((x: any) => x.points);
    expect(flat).toHaveLength(rows.length);

    for (const max of [10, 40, 100]) {
      const d = await viewer.json('GET', `/api/runs/${runA}/chart?x=Re&y=Nu&max=${max}`);
      expect(d.body.downsampled).toBe(true);
      expect(d.body.total).toBe(rows.length);
      const points = d.body.series.flatMap((x: any) => x.points);
      expect(points.length).toBeLessThanOrEqual(max);
      for (const series of d.body.series) {
        const own = rows.filter((r) => r.method === series.method);
        // Every point is a real result, and the envelope (lowest and highest Nu) survives.
        for (const [x, y, f] of series.points) {
          expect(own.some((r) => r.inputs.Re === x && r.outputs.Nu === y && (r.flags.length > 0 ? 1 : 0) === f)).toBe(true);
        }
        const ys = series.points.map((p: number[]) => p[1]);
        expect(Math.max(...ys)).toBe(Math.max(...own.map((r) => r.outputs.Nu)));
        expect(Math.min(...ys)).toBe(Math.min(...own.map((r) => r.outputs.Nu)));
      }
    }
    const byPr = await viewer.json('GET', `/api/runs/${runA}/chart?x=Re&y=Nu&series=Pr&method=gnielinski`);
    expect(byPr.body.series).toHaveLength(3);
    expect(byPr.body.series.every((x: any) => x.method === 'gnielinski' && x.points.length === 30)).toBe(true);
  });
});

describe('measurements', () => {
  it('stores a mapped CSV and overlays it with the mean absolute deviation of each method', async () => {
    const up = await upload(`name: dash-overlay
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: true
  Pr: 5
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e5, count: 10, spacing: log}
`);
    expect(up.status).toBe(201);
    await waitForRun(viewer, up.body.run.id);
    const csv = 'Reynolds,Nusselt,note\r\n12000,90,"a, b"\r\n30000,190,\r\n80000,420,x\r\n';
    const form = new FormData();
    form.append('file', new Blob([csv], { type: 'text/csv' }), 'bench.csv');
    form.append('mapping', JSON.stringify({ Reynolds: 'Re', Nusselt: 'Nu' }));
    const made = await researcher.json('POST', `/api/studies/${up.body.study.id}/measurements`, { form });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.measurement).toMatchObject({ name: 'bench.csv', rows: 3, columns: { Reynolds: 'Re', Nusselt: 'Nu' } });
    const list = (await viewer.json('GET', `/api/studies/${up.body.study.id}/measurements`)).body.measurements;
    expect(list).toHaveLength(1);
    const one = (await viewer.json('GET', `/api/measurements/${list[0].id}`)).body;
    expect(one.rows).toEqual([{ values: { Re: 12000, Nu: 90 } }, { values: { Re: 30000, Nu: 190 } }, { values: { Re: 80000, Nu: 420 } }]);

    const chart = await viewer.json('GET', `/api/runs/${up.body.run.id}/chart?x=Re&y=Nu&measurement=${list[0].id}`);
    expect(chart.status, JSON.stringify(chart.body)).toBe(200);
    expect(chart.body.measured.points).toEqual([[12000, 90], [30000, 190], [80000, 420]]);
    for (const method of ['gnielinski', 'dittus-boelter']) {
      // The method solved at each measured Re (engine's one-point solve, as `filmsweep solve`).
      const devs = one.rows.map((r: any) => {
        // heating is an input of Dittus–Boelter only (exponent 0.4 or 0.3).
        const inputs: Inputs = method === 'dittus-boelter' ? { Re: r.values.Re, Pr: 5, heating: true } : { Re: r.values.Re, Pr: 5 };
        const [res] = solvePoint({ configuration: 'pipe', methods: [method] }, inputs, { strict: false }) as ResultRow[];
        return Math.abs(res.outputs.Nu - r.values.Nu) / r.values.Nu;
      });
      const mad = devs.reduce((a: number, b: number) => a + b, 0) / devs.length;
      expect(chart.body.measured.mad[method]).toBeCloseTo(mad, 12);
      expect(mad).toBeGreaterThan(0);
    }
    // Mapping without Nu or h, a missing column, a non-number, a non-CSV file.
    const bad = async (mapping: unknown, body = csv, name = 'bench.csv') => {
      const f = new FormData();
      f.append('file', new Blob([body], { type: 'text/csv' }), name);
      f.append('mapping', JSON.stringify(mapping));
      return (await researcher.json('POST', `/api/studies/${up.body.study.id}/measurements`, { form: f })).status;
    };
    expect(await bad({ Reynolds: 'Re' })).toBe(400);
    expect(await bad({ Missing: 'Nu' })).toBe(400);
    expect(await bad({ note: 'Nu' })).toBe(400);
    expect(await bad({ Nusselt: 'Nu' }, csv, 'bench.xlsx')).toBe(415);
    expect(await bad({ Nusselt: 'Nu' }, 'Nusselt\n' + '1\n'.repeat(1_100_000))).toBe(413);
    expect((await viewer.json('POST', `/api/studies/${up.body.study.id}/measurements`, { form: yamlForm(csv) })).status).toBe(403);
  });
});

describe('push, compare, reference and exports', () => {
  it('compares a run with a pushed copy whose one value was changed', async () => {
    const { rows, run } = await getRunRows(s.store, runA);
    const [{ yaml }] = await s.store.dialect.all<{ yaml: string }>('select v.yaml from runs r join study_versions v on v.id = r.study_version_id where r.id = ?', [runA]);
    const changed = rows.map((r) => ({ method: r.method, inputs: r.inputs, outputs: { ...r.outputs }, flags: r.flags }));
    changed[7].outputs.Nu *= 1.1;
    const { token } = (await researcher.json('POST', '/api/tokens', { json: { name: 'test' } })).body;
    const body = { study: { name: run.study, title: run.title, configuration: run.configuration }, yaml, hash: run.yaml_hash, run, rows: changed };
    const bad = await s.anonymous().json('POST', '/api/runs/push', { headers: { authorization: `Bearer ${token}` }, json: { ...body, hash: 'f'.repeat(64) } });
    expect(bad.status).toBe(400);
    const pushed = await s.anonymous().json('POST', '/api/runs/push', { headers: { authorization: `Bearer ${token}` }, json: body });
    expect(pushed.status, JSON.stringify(pushed.body)).toBe(201);
    const b = pushed.body.run.id;
    expect(pushed.body.run).toMatchObject({ status: 'done', results_count: rows.length, started_by: s.emails.researcher, study: run.study });

    const all = (await viewer.json('GET', `/api/compare?a=${runA}&b=${b}&output=Nu&pageSize=500`)).body;
    expect(all).toMatchObject({ output: 'Nu', total: rows.length, changed: 1, only_a: 0, only_b: 0 });
    expect(all.a.id).toBe(runA);
    expect(all.b.id).toBe(b);
    const diff = (await viewer.json('GET', `/api/compare?a=${runA}&b=${b}&changed=yes`)).body;
    expect(diff.total).toBe(1);
    expect(diff.rows[0]).toMatchObject({ method: rows[7].method, inputs: rows[7].inputs, a: rows[7].outputs.Nu });
    expect(diff.rows[0].rel_diff).toBeCloseTo(0.1, 12);

    // Runs of a different sweep pair only where the inputs agree.
    const other = await upload(PIPE('dash-pipe', '[5, 50, 100]'));
    await waitForRun(viewer, other.body.run.id);
    const partial = (await viewer.json('GET', `/api/compare?a=${runA}&b=${other.body.run.id}`)).body;
    expect(partial).toMatchObject({ total: 120, changed: 0, only_a: 60, only_b: 60 });
  });

  it('lets a lead mark a reference run', async () => {
    expect((await researcher.json('POST', `/api/runs/${runA}/reference`, { json: { reference: true } })).status).toBe(403);
    const r = await lead.json('POST', `/api/runs/${runA}/reference`, { json: { reference: true } });
    expect(r.body.run).toMatchObject({ id: runA, reference: true });
    expect((await viewer.json('GET', `/api/runs/${runA}`)).body.run.reference).toBe(true);
  });

  it('exports every format as an attachment with its type, the caution in all but CSV, and audits it', async () => {
    const expected: Record<string, RegExp> = {
      csv: /^text\/csv/,
      json: /^application\/json/,
      md: /^text\/markdown/,
      tex: /^application\/x-tex/,
      xlsx: /^application\/vnd\.openxmlformats-officedocument\.spreadsheetml\.sheet/,
    };
    for (const [format, type] of Object.entries(expected)) {
      const res = await viewer.request('GET', `/api/runs/${runA}/export?format=${format}`);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toMatch(type);
      expect(res.headers.get('content-disposition')).toMatch(new RegExp(`^attachment; filename="?run-${runA}\\.${format}"?$`));
      const bytes = Buffer.from(await res.arrayBuffer());
      if (format === 'xlsx') expect(bytes.subarray(0, 2).toString()).toBe('PK');
      else if (format === 'csv') expect(bytes.toString().split('\r\n')[0]).toMatch(/Re/);
      else if (format === 'json') expect(JSON.parse(bytes.toString()).caution).toBe(CAUTION);
      else expect(bytes.toString()).toContain('engineering estimates');
    }
    expect((await viewer.json('GET', `/api/runs/${runA}/export?format=pdf`)).status).toBe(400);
    const exports = (await lead.json('GET', '/api/audit?action=export')).body.entries;
    expect(exports.filter((e: any) => e.user === s.emails.viewer && e.detail.run === runA).map((e: any) => e.detail.format).sort()).toEqual(
      ['csv', 'json', 'md', 'tex', 'xlsx'],
    );
  });
});

describe('filmsweep push (compiled CLI) against the real server', () => {
  function cli(args: string[], env: Record<string, string> = {}): Promise<{ code: number; stdout: string; stderr: string }> {
    return new Promise((resolve) => {
      execFile(process.execPath, [entry(), ...args], { cwd: repoRoot, env: { ...process.env, NO_COLOR: '1', ...env }, timeout: 60_000 }, (err, stdout, stderr) =>
        resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr }),
      );
    });
  }
  // bin/filmsweep.js once the lead has wired `push` into cli/index.ts; until then an entry
  // with the same error-to-exit-code handling around the compiled push and run commands.
  let entryFile: string | undefined;
  function entry(): string {
    return entryFile!;
  }

  it('sends a local run; refuses a bad token with exit 1 and an unreachable server with exit 2', async () => {
    const wired = await new Promise<boolean>((resolve) =>
      execFile(process.execPath, [cliPath, 'push', '--help'], { cwd: repoRoot }, (_e, out) => resolve(/--token/.test(out))),
    );
    if (wired) entryFile = cliPath;
    else {
      entryFile = join(s.dir, 'filmsweep-entry.mjs');
      const dist = (p: string) => JSON.stringify(new URL(`../dist/${p}`, import.meta.url).href);
      writeFileSync(
        entryFile,
        `import { Command } from ${JSON.stringify(pathToFileURL(createRequire(import.meta.url).resolve('commander')).href)};
import { register as push } from ${dist('cli/commands/push.js')};
import { register as run } from ${dist('cli/commands/run.js')};
import { ExitError } from ${dist('cli/errors.js')};
const program = new Command().exitOverride();
run(program); push(program);
try { await program.parseAsync(process.argv); }
catch (e) { process.stderr.write('filmsweep: ' + e.message + '\\n'); process.exit(e instanceof ExitError ? e.code : 1); }
`,
      );
    }
    const db = join(s.dir, 'local.db');
    const study = join(s.dir, 'local.yaml');
    writeFileSync(study, PIPE('local-pipe', '[0.7, 7]', 8));
    const ran = await cli(['run', study, '--db', db, '--workers', '1', '--json']);
    expect(ran.code, ran.stderr).toBe(0);

    const { token } = (await researcher.json('POST', '/api/tokens', { json: { name: 'cli' } })).body;
    const ok = await cli(['push', 'latest', '--server', s.url, '--token', token, '--db', db]);
    expect(ok.code, ok.stderr).toBe(0);
    const id = Number(/as run (\d+)/.exec(ok.stdout)![1]);
    const there = (await viewer.json('GET', `/api/runs/${id}`)).body.run;
    expect(there).toMatchObject({ study: 'local-pipe', status: 'done', results_count: 32, points_done: 16, started_by: s.emails.researcher });
    const rows = await viewer.json('GET', `/api/runs/${id}/results?pageSize=500`);
    expect(rows.body.total).toBe(32);

    const refused = await cli(['push', 'latest', '--server', s.url, '--token', 'fsw_not-a-token', '--db', db]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/API token is not valid/);
    const unreachable = await cli(['push', 'latest', '--server', 'http://127.0.0.1:9', '--token', token, '--db', db]);
    expect(unreachable.code).toBe(2);
    expect(unreachable.stderr).toMatch(/cannot reach/);
  }, 60_000);
});

describe('shutdown', () => {
  it('stops a background run when the server closes: batches in flight commit, the run ends interrupted, the pool is gone', async () => {
    const ownDb = await createTestDatabase(kind, 'shutdown');
    const own = await startTestServer({ maxPoints: 2_000_000 }, ownDb.location);
    const c = await own.signIn(own.emails.researcher);
    const form = yamlForm(PIPE('long-run', '{from: 0.7, to: 100, count: 1000}', 1000));
    const up = await c.json('POST', '/api/studies', { form });
    expect(up.status).toBe(201);
    const id = up.body.run.id;
    const store = own.store;
    const { getRun } = await import('../shared/db/index.js');
    await own.app.shutdown(); // resolves only once the runner has destroyed its pool
    expect(own.app.context.background.active).toBe(0);
    const after = await getRun(store, id);
    expect(after!.status).toBe('interrupted');
    expect(after!.points_done).toBeLessThan(1_000_000);
    expect(await countOf(store, `select count(*) as n from ${runTableName(id)} where seq % 2 = 0`)).toBe(after!.points_done);
    // A new upload is refused while shutting down.
    expect((await c.json('POST', '/api/studies', { form: yamlForm(PIPE('late')) })).status).toBe(503);
    await own.close();
    await ownDb.drop();
  }, 30_000);
});
});
