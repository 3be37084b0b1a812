// Filmsweep's look is defined once (web/src/lib/theme.ts) and restated in styles.css for
// Tailwind: the two must agree, the charts must draw with the theme's colours and type,
// and the type must ship with the app (no font fetched from anywhere else).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { FONT_MONO, FONT_SANS, PALETTE, SERIES_COLOURS } from '../web/src/lib/theme.js';
import { buildChartOption, SERIES_COLOURS as CHART_COLOURS } from '../web/src/lib/chart-option.js';
import { buildCompareOption } from '../web/src/lib/compare-chart.js';
import { makeQuantities } from '../web/src/lib/units.js';

const css = readFileSync(new URL('../web/src/styles.css', import.meta.url), 'utf8');
const main = readFileSync(new URL('../web/src/main.tsx', import.meta.url), 'utf8');

describe('the theme', () => {
  it('has the same colours and fonts in theme.ts and styles.css', () => {
    const declared = Object.fromEntries([...css.matchAll(/--color-([a-z0-9-]+):\s*(#[0-9a-f]{6});/g)].map((m) => [m[1], m[2]]));
    expect(declared).toEqual(PALETTE);
    expect(css).toContain(`--font-sans: ${FONT_SANS};`);
    expect(css).toContain(`--font-mono: ${FONT_MONO};`);
  });

  it('draws charts and comparison charts in the theme', () => {
    expect(CHART_COLOURS).toEqual(SERIES_COLOURS);
    const option = buildChartOption(
      { x: 'Re', y: 'Nu', total: 1, downsampled: false, series_by: 'method', series: [{ name: 'm', method: 'm', points: [[1, 2, 0]] }], uncertainty: { m: 0.1 }, flag_details: [], left_out: [] },
      { xLog: true, yLog: true, bandMethod: null, quantities: makeQuantities([], 'K') },
    ) as { textStyle: { fontFamily: string } };
    expect(option.textStyle.fontFamily).toBe(FONT_SANS);
    const compare = buildCompareOption([{ method: 'm', inputs: { Re: 1 }, inputs_b: { Re: 1 }, a: 1, b: 2, rel_diff: 1 }], 'Re', 'Nu', { xLog: true }) as { textStyle: { fontFamily: string }; series: { color: string }[] };
    expect(compare.textStyle.fontFamily).toBe(FONT_SANS);
    expect(compare.series[0].color).toBe(SERIES_COLOURS[0]);
  });

  it('ships its type with the app: the fonts come from installed packages, named as they declare them', () => {
    for (const pkg of ['atkinson-hyperlegible-next', 'atkinson-hyperlegible-mono']) {
      expect(main).toContain(`@fontsource-variable/${pkg}/wght.css`);
      const face = readFileSync(new URL(`../node_modules/@fontsource-variable/${pkg}/wght.css`, import.meta.url), 'utf8');
      const family = /font-family: '([^']+)'/.exec(face)![1];
      expect(pkg.endsWith('mono') ? FONT_MONO : FONT_SANS).toContain(`"${family}"`);
      expect(face).not.toMatch(/url\(\s*['"]?https?:/);
    }
    expect(css).not.toMatch(/https?:\/\//);
  });
});
