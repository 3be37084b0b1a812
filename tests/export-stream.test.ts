// Streamed exports (shared/export/stream.ts) write exactly what the whole-run exports
// write, however the rows are sliced: JSON's commas, Markdown's lines and LaTeX's table
// floats (whose continuation captions name their rows) across slice boundaries, XLSX
// read back cell by cell; and a writer waits for a slow output rather than buffering.
// Synthetic rows: formatting, not physics.
import { PassThrough, Writable } from 'node:stream';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { exportRun, makeUnitLookup, rowsOf, writeRunExport, type RunExport } from '../shared/export/index.js';

function run(n: number): RunExport {
  const rows = Array.from({ length: n }, (_, p) => ({
    method: p % 2 ? 'gnielinski' : 'dittus-boelter',
    inputs: { Re: 1e4 + 137 * Math.floor(p / 2), Pr: 5, heating: p % 4 < 2, arrangement: 'inline' },
    outputs: { Nu: 0.37 * p - 4, f: 1e-7 * (p + 1) },
    flags: p % 5 ? [] : ['out-of-range:Re'],
  }));
  return {
    run: {
      id: 9, study: 'sliced', study_version: 1, title: null, configuration: 'pipe', status: 'done',
      started_at: '2025-02-03T04:05:06.000Z', finished_at: '2025-02-03T04:05:07.000Z', git_commit: null, host: 'h', workers: 1,
      points_total: n, points_done: n, results_count: n, flagged_count: 0,
      methods: [{ id: 'dittus-boelter', version: 1 }, { id: 'gnielinski', version: 1 }], yaml_hash: 'b'.repeat(64),
    },
    rows,
  };
}

async function streamed(data: RunExport, format: 'csv' | 'json' | 'md' | 'tex' | 'xlsx', slice: number, rowsPerTable?: number): Promise<Buffer> {
  const out = new PassThrough();
  const parts: Buffer[] = [];
  out.on('data', (b: Buffer) => parts.push(b));
  const ended = new Promise((resolve) => out.on('end', resolve));
  await writeRunExport(data.run, rowsOf(data.rows, slice), format, out, makeUnitLookup([]), { rowsPerTable });
  await ended;
  return Buffer.concat(parts);
}

describe('streamed exports', () => {
  for (const n of [0, 1, 12, 13, 41]) {
    for (const slice of [1, 4, 7, 1000]) {
      it(`write the same text as the whole-run export: ${n} rows in slices of ${slice}`, async () => {
        const data = run(n);
        const unitOf = makeUnitLookup([]);
        for (const format of ['csv', 'json', 'md'] as const) {
          expect((await streamed(data, format, slice)).toString('utf8'), format).toBe((await exportRun(data, format, { unitOf })).body);
        }
        expect((await streamed(data, 'tex', slice, 4)).toString('utf8')).toBe((await exportRun(data, 'tex', { unitOf, rowsPerTable: 4 })).body);
      });
    }
  }

  it('write the same XLSX cells as the whole-run export', async () => {
    const data = run(23);
    const read = async (b: Buffer) => {
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.load(b as unknown as ArrayBuffer);
      return wb.worksheets.map((ws) => ({ name: ws.name, rows: ws.getSheetValues().map((r) => (Array.isArray(r) ? [...r] : r)) }));
    };
    const whole = (await exportRun(data, 'xlsx', { unitOf: makeUnitLookup([]) })).body as Buffer;
    expect(await read(await streamed(data, 'xlsx', 5))).toEqual(await read(whole));
  });

  it('wait for a slow output instead of buffering the run', async () => {
    const data = run(4000);
    let received = 0;
    let maxBuffered = 0;
    const slow = new Writable({
      highWaterMark: 16 * 1024,
      write(chunk: Buffer, _enc, done) {
        received += chunk.length;
        setTimeout(done, 1);
      },
    });
    const watch = setInterval(() => (maxBuffered = Math.max(maxBuffered, slow.writableLength)), 1);
    await writeRunExport(data.run, rowsOf(data.rows, 100), 'json', slow, makeUnitLookup([]));
    clearInterval(watch);
    const whole = Buffer.byteLength((await exportRun(data, 'json')).body as string);
    expect(received).toBe(whole);
    // At most about one slice (100 rows, ~15 kB) beyond the output's own buffer, never the whole run.
    expect(maxBuffered).toBeLessThan(64 * 1024);
    expect(whole).toBeGreaterThan(400 * 1024);
  });
});
