// Filmsweep's look in one place: the palette and the type of the app and of every
// exported figure. styles.css declares the same values as Tailwind theme variables (CSS
// cannot import this file); tests/web-theme.test.ts keeps the two in step.
//
// The idea: a thin fluid film between cold fluid and a hot wall. "Coolant" teal carries
// structure and action (links, primary buttons, the first data series), "ember" marks the
// hot side (the active page, accents, changed values), on a warm paper ground. The type is
// Atkinson Hyperlegible Next and Mono (Braille Institute, shipped with the app through
// @fontsource): letterforms made to be told apart — 0/O, 1/l/I, 5/S, 8/B — which is what a
// page of numbers needs.

export const FONT_SANS = '"Atkinson Hyperlegible Next Variable", "Atkinson Hyperlegible Next", system-ui, sans-serif';
export const FONT_MONO = '"Atkinson Hyperlegible Mono Variable", "Atkinson Hyperlegible Mono", ui-monospace, monospace';

/** Named colours (hex), the CSS theme's `--color-<name>` values. */
export const PALETTE = {
  paper: '#f1efe8',
  sheet: '#fbfaf6',
  line: '#d9d4c6',
  'ink-50': '#e9f0ef',
  'ink-100': '#d3e0de',
  'ink-200': '#adc3c1',
  'ink-400': '#5c7c7e',
  'ink-600': '#34585c',
  'ink-700': '#0f5f66',
  'ink-800': '#124a50',
  'ink-900': '#0f2629',
  'ember-100': '#f8e2d7',
  'ember-500': '#c8431a',
  'ember-700': '#8f2c0e',
  'moss-100': '#e2ecd9',
  'moss-700': '#3b6a2c',
  'brick-100': '#f5dcdc',
  'brick-700': '#9b2c2c',
} as const;

/**
 * Data series, in order of use: coolant, ember, then hues spaced around the wheel at
 * similar weight so no series shouts; neighbours differ in lightness as well as hue.
 */
export const SERIES_COLOURS = ['#0f6d76', '#c8431a', '#5b4a9e', '#9a7a0a', '#2f7d3a', '#b0346b', '#3a6ea5', '#6b5a44', '#d08a1c', '#4d5b63'];

/** Measured data drawn over the series. */
export const MEASURED_COLOUR = PALETTE['ink-900'];

/** Text and rules of exported figures. */
export const FIGURE = {
  text: PALETTE['ink-900'],
  muted: PALETTE['ink-600'],
  background: '#ffffff',
} as const;
