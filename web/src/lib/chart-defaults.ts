// The run chart's starting choices, from facts about the run's inputs and outputs
// (GET /api/runs/:id/chart/axes): x is the trade's usual abscissa when it varies (Re for
// forced convection, Ra for free), else the swept input with the widest range; y is Nu,
// else h (never a constant); a second swept input with few values becomes line styles.
// A target run starts on its answer instead: the solved input (y) against the swept input
// with the widest range (x).
import type { TargetFacts } from '../../../shared/chart/types.js';
import type { AxisFacts } from '../api/types.js';
import type { ChartQuery, FlaggedFilter, RangeFilter } from './result-query.js';

/** A second input drawn as line styles and markers: at most this many values. */
export const MAX_STYLED_VALUES = 8;
/** Small multiples: at most this many panels. */
export const MAX_PANELS = 12;
/** Above this many series a chart is refused with a suggestion ("a few dozen"). */
export const MAX_DRAWN_SERIES = 36;

export type SeriesLayout = 'style' | 'panels';

export interface ChartChoice {
  x: string;
  y: string;
  /** `method` or the second input. */
  by: string;
  layout: SeriesLayout;
}

/** A numeric name whose values differ (it can be an axis). */
export function varies(f: AxisFacts | undefined): boolean {
  return !!f && f.distinct > 1 && f.min !== null && f.max !== null && f.min < f.max;
}

/** A name with numbers (text-valued choices can split series but not be an axis). */
export function numeric(f: AxisFacts): boolean {
  return f.min !== null;
}

/** Decades covered (positive values), else a nominal one: log axes are the default. */
function spread(f: AxisFacts): number {
  if (f.min === null || f.max === null) return 0;
  return f.min > 0 ? Math.log10(f.max / f.min) : 1;
}

/** `methods`: how many methods draw; a split that would pass MAX_DRAWN_SERIES is not a default. */
export function defaultChoice(facts: readonly AxisFacts[], regime: string | undefined, target?: TargetFacts, methods = 1): ChartChoice {
  const byName = new Map(facts.map((f) => [f.name, f]));
  const classic = regime === 'free' ? ['Ra', 'Gr'] : regime ? ['Re'] : ['Re', 'Ra'];
  const swept = facts.filter((f) => f.role === 'input' && varies(f));
  const widest = [...swept].sort((a, b) => spread(b) - spread(a))[0];
  const solved = target && byName.get(target.adjust);
  if (solved && numeric(solved) && (widest || swept.length === 0)) {
    const x = widest?.name ?? facts.find((f) => f.name !== solved.name && varies(f))?.name ?? facts.find((f) => f.name !== solved.name)?.name ?? '';
    return { x, y: solved.name, by: secondBy(facts, swept, x, methods), layout: 'style' };
  }
  const x =
    classic.find((n) => varies(byName.get(n))) ??
    widest?.name ??
    facts.find((f) => varies(f))?.name ??
    facts[0]?.name ??
    '';
  const outputs = facts.filter((f) => f.role === 'output' && f.name !== x);
  const y =
    ['Nu', 'h', 'Nu_x', 'h_x'].find((n) => varies(byName.get(n)) && byName.get(n)!.role === 'output') ??
    outputs.find((f) => varies(f))?.name ??
    outputs[0]?.name ??
    '';
  return { x, y, by: secondBy(facts, swept, x, methods), layout: 'style' };
}

/** The second input that splits the series by default, or `method`. */
function secondBy(facts: readonly AxisFacts[], swept: readonly AxisFacts[], x: string, methods: number): string {
  // With one swept input, x is that input or derived from it alone: splitting by it would
  // leave one point per series.
  const second = swept.length + secondInputs(facts, x).filter((f) => !varies(f)).length >= 2 ? secondInputs(facts, x).sort((a, b) => a.distinct - b.distinct)[0] : undefined;
  // A default never lands on the "too many series" message: eight pipe methods × five Pr
  // values start as one series per method.
  return second && second.distinct <= MAX_STYLED_VALUES && second.distinct * Math.max(1, methods) <= MAX_DRAWN_SERIES ? second.name : 'method';
}

/** Inputs that can split the series: swept, not x, a countable number of values (numbers or choices). */
export function secondInputs(facts: readonly AxisFacts[], x: string): AxisFacts[] {
  return facts.filter((f) => f.role === 'input' && f.name !== x && f.swept && f.distinct > 1 && f.distinct < 1000 && (varies(f) || (f.labels?.length ?? 0) > 1));
}

/**
 * Why a series choice cannot be drawn well, with what to do instead; null when it can.
 * `methods`: how many methods draw.
 */
export function seriesProblem(facts: readonly AxisFacts[], choice: ChartChoice, methods: number): string | null {
  if (choice.by === 'method') return null;
  const f = facts.find((x) => x.name === choice.by);
  if (!f) return null;
  const values = f.distinct;
  const count = values * Math.max(1, methods);
  const fewer = `tick fewer methods, add a range filter on ${f.name} to keep a few of its ${values} values, or put ${f.name} on x`;
  if (choice.layout === 'panels') {
    if (values > MAX_PANELS) return `${f.name} has ${values} values: more than ${MAX_PANELS} panels would be too small to read. ${cap(fewer)}.`;
    if (count > MAX_DRAWN_SERIES) return `${values} panels × ${methods} methods would draw ${count} series. To read them, ${fewer}.`;
    return null;
  }
  if (values > MAX_STYLED_VALUES) {
    return `${f.name} has ${values} values: more than ${MAX_STYLED_VALUES} line styles cannot be told apart. Try small multiples${values <= MAX_PANELS ? '' : ' after filtering'}, or ${fewer}.`;
  }
  if (count > MAX_DRAWN_SERIES) return `${values} values × ${methods} methods would draw ${count} series, more than a few dozen. ${cap(fewer)}.`;
  return null;
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Points a run chart asks for at most. */
export const CHART_MAX_POINTS = 2000;

/**
 * The chart request for a choice, or null when it cannot be drawn (no axes yet, or too
 * many series). One function for the chart itself and for the run page's route, which asks
 * for the default chart while the page's code loads: the same query, the same cache entry.
 */
export function chartQueryFor(
  facts: readonly AxisFacts[],
  choice: ChartChoice,
  view: { methods: string[]; drawnMethods: number; flagged: FlaggedFilter; filters: RangeFilter[]; measurement?: number },
): ChartQuery | null {
  const problem = facts.length ? seriesProblem(facts, choice, view.drawnMethods) : null;
  if (!choice.x || !choice.y || problem) return null;
  return { x: choice.x, y: choice.y, series: choice.by, methods: view.methods, flagged: view.flagged, filters: view.filters, max: CHART_MAX_POINTS, measurement: view.measurement };
}

/** The starting choice with its fallbacks (a `by` that is x, or not a name of the run, is `method`). */
export function startingChoice(facts: readonly AxisFacts[], defaults: ChartChoice, chosen: Partial<ChartChoice>): ChartChoice {
  const choice: ChartChoice = { ...defaults, ...chosen };
  if (choice.by !== 'method' && (choice.by === choice.x || !facts.some((f) => f.name === choice.by))) choice.by = 'method';
  return choice;
}

/**
 * The chart a run page starts on, from the run (its regime and methods) and its axis facts:
 * what RunChart asks for before any choice, for the route's prefetch and the early requests.
 */
export function defaultChartQuery(run: { run: { methods: readonly unknown[] }; regime?: string | null }, axes: { names: AxisFacts[]; target?: TargetFacts }): ChartQuery | null {
  const facts = axes.names;
  const methods = run.run.methods.length;
  const choice = startingChoice(facts, defaultChoice(facts, run.regime ?? undefined, axes.target, methods), {});
  return chartQueryFor(facts, choice, { methods: [], flagged: 'any', filters: [], drawnMethods: methods });
}
