// Every output the real engine and catalogue produce gets a declared unit in export
// headers (no `[?]`), for dimensional points of several configurations. A new derived
// output without a unit in shared/export/units.ts makes this fail.
import { describe, expect, it } from 'vitest';
import { exportRun } from '../shared/export/index.js';
import type { RunExport } from '../shared/export/types.js';
import { methodsFor } from '../shared/physics/catalogue.js';
import { compileSolver } from '../shared/physics/engine.js';
import type { Inputs } from '../shared/physics/types.js';

const cases: { configuration: string; inputs: Inputs }[] = [
  { configuration: 'pipe', inputs: { velocity: 1, diameter: 0.025, length: 2, fluid_temperature: 330, surface_temperature: 350 } },
  { configuration: 'cylinder', inputs: { velocity: 5, diameter: 0.01, length: 0.5, fluid_temperature: 300, surface_temperature: 350 } },
  { configuration: 'flat-plate', inputs: { velocity: 3, length: 0.5, width: 0.2, fluid_temperature: 300, surface_temperature: 340 } },
  { configuration: 'vertical-plate', inputs: { height: 0.3, width: 0.2, fluid_temperature: 300, surface_temperature: 340 } },
];

function runOf(configuration: string, rows: RunExport['rows']): RunExport {
  return {
    run: {
      id: 1,
      study: configuration,
      study_version: 1,
      title: null,
      configuration,
      status: 'done',
      started_at: null,
      finished_at: null,
      git_commit: null,
      host: 'test',
      workers: 1,
      points_total: 1,
      points_done: 1,
      results_count: rows.length,
      flagged_count: rows.filter((r) => r.flags.length).length,
      methods: methodsFor(configuration).map((m) => ({ id: m.id, version: m.version })),
      yaml_hash: '',
    },
    rows,
  };
}

describe('export units from the catalogue', () => {
  for (const { configuration, inputs } of cases) {
    it(`knows the unit of every column for ${configuration}`, async () => {
      const rows = compileSolver({ configuration, fluid: 'air' })(inputs);
      expect(rows.length).toBe(methodsFor(configuration).length);
      const header = String((await exportRun(runOf(configuration, rows), 'csv')).body).split('\r\n')[0].split(',');
      expect(header.filter((h) => h.endsWith('[?]'))).toEqual([]);
      expect(header).toContain('h [W/(m^2·K)]');
      expect(header).toContain('fluid_temperature [K]');
    });
  }
});
