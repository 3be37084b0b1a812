// XLSX export read back with exceljs: Results sheet with a frozen header row of names and
// units, numbers stored as numbers, and a Run sheet with the metadata and the caution.
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../shared/export/caution.js';
import type { RunExport } from '../shared/export/types.js';
import { makeUnitLookup } from '../shared/export/units.js';
import { toXlsx } from '../shared/export/xlsx.js';

const unitOf = makeUnitLookup([]);

const data: RunExport = {
  run: {
    id: 7,
    study: 'probe-in-duct',
    study_version: 1,
    title: null,
    configuration: 'cylinder',
    status: 'done',
    started_at: '2025-03-01T10:00:00.000Z',
    finished_at: '2025-03-01T10:00:02.000Z',
    git_commit: null,
    host: 'ci',
    workers: 1,
    points_total: 2,
    points_done: 2,
    results_count: 2,
    flagged_count: 1,
    methods: [{ id: 'churchill-bernstein', version: 2 }],
    yaml_hash: '0123456789abcdef'.repeat(4),
  },
  rows: [
    {
      method: 'churchill-bernstein',
      inputs: { velocity: 3, diameter: 0.006, heating: true },
      outputs: { Re: 1148.1234567890123, Nu: 16.283746, h: 71.23456789 },
      flags: [],
    },
    {
      method: 'churchill-bernstein',
      inputs: { velocity: 30, diameter: 0.006, heating: false },
      outputs: { Re: 11481.234567890123, Nu: 60.1, h: 263.9 },
      flags: ['out-of-range:Re', 'separation'],
    },
  ],
};

async function readBack(buffer: Buffer) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(buffer as unknown as ArrayBuffer);
  return wb;
}

describe('XLSX', () => {
  it('writes a Results sheet with a frozen unit header and numbers as numbers', async () => {
    const buffer = await toXlsx(data, unitOf);
    expect(Buffer.isBuffer(buffer)).toBe(true);
    expect(buffer.subarray(0, 2).toString()).toBe('PK'); // a zip container
    const wb = await readBack(buffer);
    const sheet = wb.getWorksheet('Results')!;
    expect(sheet).toBeDefined();
    expect(sheet.getRow(1).values).toEqual([
      undefined, // exceljs rows are 1-based
      'method',
      'velocity [m/s]',
      'diameter [m]',
      'heating',
      'Re [-]',
      'Nu [-]',
      'h [W/(m^2·K)]',
      'flags',
    ]);
    expect(sheet.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
    expect(sheet.rowCount).toBe(3);
    const re = sheet.getRow(2).getCell(5);
    expect(re.type).toBe(ExcelJS.ValueType.Number);
    expect(re.value).toBe(1148.1234567890123); // full precision, not the 4-figure memo form
    expect(sheet.getRow(3).getCell(4).value).toBe(false);
    expect(sheet.getRow(2).getCell(4).value).toBe(true);
    expect(sheet.getRow(3).getCell(8).value).toBe('out-of-range:Re;separation');
    expect(sheet.getRow(2).getCell(8).value).toBe('');
  });

  it('writes a Run sheet with the metadata and the caution', async () => {
    const wb = await readBack(await toXlsx(data, unitOf));
    const sheet = wb.getWorksheet('Run')!;
    const fields = new Map<string, unknown>();
    sheet.eachRow((row, n) => {
      if (n > 1) fields.set(String(row.getCell(1).value), row.getCell(2).value);
    });
    expect(fields.get('caution')).toBe(CAUTION);
    expect(fields.get('run id')).toBe(7);
    expect(fields.get('study')).toBe('probe-in-duct');
    expect(fields.get('study file sha256')).toBe(data.run.yaml_hash);
    expect(fields.get('method churchill-bernstein')).toBe('version 2');
    expect(fields.get('flagged results')).toBe(1);
    expect(wb.created.toISOString()).toBe('2025-03-01T10:00:02.000Z');
  });
});

describe('XLSX limits', () => {
  it('refuses a run longer than a worksheet instead of writing a broken file', async () => {
    const row = data.rows[0];
    const huge = { ...data, rows: new Array(1_048_576).fill(row) };
    await expect(toXlsx(huge, unitOf)).rejects.toThrow(/at most 1048575: export CSV or JSON instead/);
  });
});
