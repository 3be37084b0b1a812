// exportRun: dispatch by format, media types, and units taken from the catalogue's specs.
// The catalogue is replaced by a small stand-in so this test checks the wiring alone
// (the catalogue's own units are the correlation helpers' to test).
import { describe, expect, it, vi } from 'vitest';
import type { RunExport } from '../shared/export/types.js';
import { InputError } from '../shared/physics/types.js';

vi.mock('../shared/physics/catalogue.js', async () => {
  const { InputError: Err } = await import('../shared/physics/types.js');
  return {
    getMethod(configuration: string, id: string) {
      if (configuration === 'pipe' && id === 'gnielinski') {
        return {
          id,
          configuration,
          inputs: [{ name: 'roughness_ratio', description: '', unit: '1', required: false }],
          outputs: [
            { name: 'Nu', description: '', unit: '1' },
            { name: 'wall_shear', description: '', unit: 'Pa' },
          ],
        };
      }
      throw new Err(`unknown method '${id}'`);
    },
  };
});

const { exportRun } = await import('../shared/export/index.js');

const data: RunExport = {
  run: {
    id: 1,
    study: 's',
    study_version: 1,
    title: null,
    configuration: 'pipe',
    status: 'done',
    started_at: null,
    finished_at: null,
    git_commit: null,
    host: 'h',
    workers: 1,
    points_total: 1,
    points_done: 1,
    results_count: 2,
    flagged_count: 0,
    methods: [
      { id: 'gnielinski', version: 1 },
      { id: 'retired-method', version: 3 },
    ],
    yaml_hash: 'ab',
  },
  rows: [
    { method: 'gnielinski', inputs: { Re: 1e5, Pr: 5, roughness_ratio: 0 }, outputs: { Nu: 520.5, wall_shear: 12.5 }, flags: [] },
    { method: 'retired-method', inputs: { Re: 1e5, Pr: 5, roughness_ratio: 0 }, outputs: { Nu: 500, odd: 1 }, flags: [] },
  ],
};

describe('exportRun', () => {
  it('takes units from the catalogue and falls back to the local table', async () => {
    const csv = await exportRun(data, 'csv');
    expect(csv.extension).toBe('csv');
    expect(csv.mediaType).toMatch(/^text\/csv/);
    expect(String(csv.body).split('\r\n')[0]).toBe(
      'method,Re [-],Pr [-],roughness_ratio [-],Nu [-],wall_shear [Pa],odd [?],flags',
    );
  });

  it('renders every format', async () => {
    const json = await exportRun(data, 'json');
    expect(JSON.parse(String(json.body)).rows).toHaveLength(2);
    expect(json.mediaType).toBe('application/json');
    const md = await exportRun(data, 'md', { columns: ['method', 'Nu', 'wall_shear'] });
    expect(String(md.body)).toContain('| method | Nu [-] | wall_shear [Pa] |');
    const tex = await exportRun(data, 'tex');
    expect(String(tex.body)).toContain('\\begin{tabular}');
    const xlsx = await exportRun(data, 'xlsx');
    expect(Buffer.isBuffer(xlsx.body)).toBe(true);
    expect(xlsx.extension).toBe('xlsx');
  });

  it('refuses an unknown format', async () => {
    await expect(exportRun(data, 'pdf' as never)).rejects.toThrow(InputError);
  });
});
