// Every column the newer configurations produce (their derived groups, the heat sink's own
// outputs) has a declared unit in export headers: no `[?]`. A new output without a unit in
// quantities.ts (engineOutputSpecs) or the method's OutputSpec makes this fail.
import { describe, expect, it } from 'vitest';
import { methodsFor } from '../shared/physics/catalogue.js';
import { compileSolver } from '../shared/physics/engine.js';
import { makeUnitLookup } from '../shared/export/units.js';
import type { Inputs } from '../shared/physics/types.js';

const cases: { configuration: string; fluid: string; inputs: Inputs }[] = [
  { configuration: 'annulus', fluid: 'water', inputs: { inner_diameter: 0.016, outer_diameter: 0.028, length: 1.2, flow_rate: 5e-4, fluid_temperature: 288.15, heat_flux: 2e4 } },
  { configuration: 'parallel-plates', fluid: 'air', inputs: { gap: 0.01, width: 0.3, length: 1, velocity: 5, fluid_temperature: 300, surface_temperature: 350 } },
  { configuration: 'pipe', fluid: 'water', inputs: { diameter: 0.05, length: 10, roughness: 4.5e-5, velocity: 0.15, fluid_temperature: 293.15, surface_temperature: 333.15 } },
  { configuration: 'vertical-channel', fluid: 'air', inputs: { gap: 0.008, height: 0.2, width: 0.1, fluid_temperature: 300, surface_temperature: 350 } },
  {
    configuration: 'plate-fin-heat-sink',
    fluid: 'air',
    inputs: { fin_count: 12, fin_height: 0.03, fin_thickness: 0.002, gap: 0.008, length: 0.2, fin_conductivity: 200, velocity: 1, emissivity: 0.8, fluid_temperature: 300, surface_temperature: 340 },
  },
  { configuration: 'enclosure', fluid: 'air', inputs: { gap: 0.025, height: 0.8, width: 2, fluid_temperature: 275.15, surface_temperature: 285.15, tilt: 30 } },
  { configuration: 'inclined-plate', fluid: 'air', inputs: { length: 0.5, width: 0.25, fluid_temperature: 300, surface_temperature: 340, tilt: 30, hot_side: 'up' } },
  { configuration: 'impinging-jet', fluid: 'air', inputs: { diameter: 0.01, height: 0.05, radius: 0.04, pitch: 0.06, velocity: 20, fluid_temperature: 300, surface_temperature: 350 } },
];

describe('export units of the newer configurations', () => {
  for (const { configuration, fluid, inputs } of cases) {
    it(`knows the unit of every input and output of ${configuration}`, () => {
      const rows = compileSolver({ configuration, fluid })(inputs);
      expect(rows.length).toBe(methodsFor(configuration).length);
      const unitOf = makeUnitLookup(methodsFor(configuration));
      const names = new Set(rows.flatMap((r) => [...Object.keys(r.inputs), ...Object.keys(r.outputs)]));
      expect([...names].filter((n) => unitOf(n) === undefined)).toEqual([]);
      expect(rows.some((r) => r.outputs.h !== undefined)).toBe(true);
    });
  }
  it('gives the heat sink outputs their units', () => {
    const unitOf = makeUnitLookup(methodsFor('plate-fin-heat-sink'));
    expect(unitOf('thermal_resistance')).toBe('K/W');
    expect(unitOf('optimum_gap')).toBe('m');
    expect(unitOf('fin_efficiency')).toBe('1');
    expect(unitOf('fin_conductivity')).toBe('W/(m K)');
  });
});
