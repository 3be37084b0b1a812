// `filmsweep methods --json` lists the everyday-catalogue methods of issue 13 under their
// contracted configuration and method ids, each with an equation, ranges and a source.
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { methods } from '../shared/physics/catalogue.js';
import { runCli } from './helpers/cli.js';

const contracted = [
  'annulus/laminar-annulus',
  'annulus/turbulent-annulus',
  'parallel-plates/laminar-parallel-plates',
  'parallel-plates/turbulent-parallel-plates',
  'pipe/seban-shimazaki',
  'pipe/skupinski',
  'vertical-channel/elenbaas',
  'vertical-channel/bar-cohen-rohsenow',
  'plate-fin-heat-sink/elenbaas',
  'plate-fin-heat-sink/bar-cohen-rohsenow',
  'plate-fin-heat-sink/teertstra',
  'enclosure/berkovsky-polevikov',
  'enclosure/macgregor-emery',
  'enclosure/globe-dropkin',
  'enclosure/hollands',
  'inclined-plate/churchill-chu',
  'inclined-plate/churchill-chu-laminar',
  'impinging-jet/martin',
];

describe('filmsweep methods: the everyday catalogue', () => {
  it('lists every new method with its equation, ranges, uncertainty and source', () => {
    const r = runCli(['methods', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const data = JSON.parse(r.stdout) as {
      configurations: { id: string }[];
      methods: { configuration: string; id: string; equation: string; ranges: unknown[]; source: string; uncertainty: { fraction: number } }[];
    };
    const byId = new Map(data.methods.map((m) => [`${m.configuration}/${m.id}`, m]));
    for (const id of contracted) {
      const m = byId.get(id);
      expect(m, id).toBeDefined();
      expect(m!.equation.length, id).toBeGreaterThan(20);
      expect(m!.ranges.length, id).toBeGreaterThan(0);
      expect(m!.source, id).toMatch(/\(\d{4}\)/);
      expect(m!.uncertainty.fraction, id).toBeGreaterThan(0);
    }
    const configurations = data.configurations.map((c) => c.id);
    for (const c of ['annulus', 'parallel-plates', 'vertical-channel', 'plate-fin-heat-sink', 'enclosure', 'inclined-plate', 'impinging-jet']) {
      expect(configurations).toContain(c);
    }
  });

  it('prints a configuration in text with its inputs and ranges', () => {
    const r = runCli(['methods', '--configuration', 'enclosure']);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toContain('enclosure — Rectangular enclosure, free convection');
    expect(r.stdout).toMatch(/hollands .*\n\s+inputs:\s+Ra height_over_gap \[tilt\]/);
    expect(r.stdout).toContain('0 ≤ tilt ≤ 60');
  });
});

describe('catalogue equations', () => {
  it('every equation renders in KaTeX (the dashboard renderer) without an error', () => {
    for (const m of methods) {
      expect(() => katex.renderToString(m.equation, { throwOnError: true, strict: 'error' }), `${m.configuration}/${m.id}`).not.toThrow();
    }
  });
});
