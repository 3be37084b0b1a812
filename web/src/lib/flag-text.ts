// A flag in words, with the value that broke the range: `Re 3.2e5 > 2e5`,
// `fluid_temperature −20 °C < 0 °C`. Plain text (callers escape it for HTML sinks).
import type { FlagDetail } from '../api/types.js';
import { formatNumber } from './format.js';
import type { Quantities } from './units.js';

// The flags of the catalogue (README, "The method catalogue"), in words.
const WORDS: Record<string, string> = {
  separation: 'the boundary layer separates (no value)',
  'not-converged': 'a solver or energy balance missed its tolerance (no value)',
  'domain-error': 'outside the method’s domain (no value)',
  'entry-region': 'the tube is shorter than the entry length of this fully developed method',
  'no-flux-form': 'the method has no uniform-flux form',
  'no-temperature-form': 'the method has no uniform-temperature form',
  'boiling-possible': 'liquid water above its saturation temperature in the layer',
  'target-not-reached': 'the target is not reached within the allowed range',
  'target-several-roots': 'several inputs meet the target (the smallest is shown)',
  'no-applicable-method': 'no method holds here',
  'band-incomplete': 'some band samples gave no number; the band is from the rest',
};
const PREFIXES: [RegExp, (name: string) => string][] = [
  [/^out-of-chart:(.+)$/, (n) => `${n} beyond the pressure-drop charts (χ = 1 used)`],
  [/^conflict:(.+)$/, (n) => `the fixed ${n} contradicts the temperatures`],
  [/^non-finite:(.+)$/, (n) => `${n} is not a finite number (left out)`],
  [/^overflow:(.+)$/, (n) => `${n} overflows (left out)`],
  [/^band-inputs-only:(.+)$/, (n) => `the band of ${n} holds the input tolerances only`],
];

export function flagText(d: FlagDetail, quantities: Quantities): string {
  if (!d.name) {
    for (const [re, say] of PREFIXES) {
      const m = re.exec(d.flag);
      if (m) return say(m[1]);
    }
    return WORDS[d.flag] ?? d.flag;
  }
  const q = quantities(d.name);
  const shown = (v: number) => formatNumber(q.toDisplay(v), 3) + (q.unit === '-' || q.unit === '?' ? '' : ` ${q.unit}`);
  if (d.name === 'property_temperature') return 'the property temperature is outside the fluid’s data (no value)';
  if (d.value === undefined) {
    const range = [d.min !== undefined ? `${shown(d.min)} ≤` : '', d.name, d.max !== undefined ? `≤ ${shown(d.max)}` : ''].filter(Boolean).join(' ');
    return d.min === undefined && d.max === undefined ? `${d.name} outside the method’s range` : `${d.name} outside ${range}`;
  }
  if (d.max !== undefined && (d.value > d.max || (d.inclusive === false && d.value >= d.max))) return `${d.name} ${shown(d.value)} ${d.value > d.max ? '>' : '≥'} ${shown(d.max)}`;
  if (d.min !== undefined && (d.value < d.min || (d.inclusive === false && d.value <= d.min))) return `${d.name} ${shown(d.value)} ${d.value < d.min ? '<' : '≤'} ${shown(d.min)}`;
  return `${d.name} ${shown(d.value)} outside the method’s range`;
}
