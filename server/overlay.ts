// Measured data on a run's chart, and how far each method lies from it: for every measured
// row the method is solved at that row's inputs (the study's fixed inputs, with the
// measured values in place of the swept ones), and the mean absolute relative deviation
// |predicted − measured| / |measured| is averaged over the rows where both exist.
import { getRunSource, type RunInfo } from '../shared/db/index.js';
import type { MeasurementRow } from '../shared/db/measurements.js';
import type { Store } from '../shared/db/store.js';
import { compileSolver } from '../shared/physics/engine.js';
import type { Inputs } from '../shared/physics/types.js';
import { entryLength, parseStudy, pointAt } from '../shared/study/index.js';

export interface MeasuredOverlay {
  name: string;
  points: [number, number][];
  /** Per method; a method is absent when no measured row could be predicted. */
  mad: Record<string, number>;
}

export async function measuredOverlay(
  store: Store,
  run: RunInfo,
  measurement: { name: string; rows: MeasurementRow[] },
  x: string,
  y: string,
): Promise<MeasuredOverlay> {
  const points = measurement.rows
    .filter((r) => Number.isFinite(r.values[x]) && Number.isFinite(r.values[y]))
    .map((r) => [r.values[x], r.values[y]] as [number, number])
    .sort((a, b) => a[0] - b[0]);
  return { name: measurement.name, points, mad: await meanAbsoluteDeviation(store, run, measurement.rows, y) };
}

async function meanAbsoluteDeviation(store: Store, run: RunInfo, rows: MeasurementRow[], y: string): Promise<Record<string, number>> {
  const source = await getRunSource(store, run.id);
  if (!source) return {};
  const { study } = parseStudy(source.yaml, source.sourceFile ?? `run-${run.id}.yaml`, { maxPoints: Math.max(source.pointsTotal, 1) });
  const varying = Object.entries(study.sweep.over)
    .filter(([, entry]) => entryLength(entry) > 1)
    .map(([name]) => name);
  const base: Inputs = source.pointsTotal > 0 ? pointAt(study, 0) : { ...study.inputs };
  const solve = compileSolver({ configuration: study.configuration, methods: study.methods, fluid: study.fluid }, { strict: false });
  const sums = new Map<string, { sum: number; n: number }>();
  for (const row of rows) {
    const measured = row.values[y];
    if (!Number.isFinite(measured) || measured === 0) continue;
    // A row that does not give every swept input cannot be placed in the sweep.
    if (!varying.every((name) => Number.isFinite(row.values[name]))) continue;
    const inputs: Inputs = { ...base };
    for (const name of Object.keys(base)) if (Number.isFinite(row.values[name])) inputs[name] = row.values[name];
    let results;
    try {
      results = solve(inputs);
    } catch {
      continue; // inputs the engine cannot use (e.g. a fluid temperature out of range)
    }
    for (const r of results) {
      const predicted = r.outputs[y];
      if (!Number.isFinite(predicted)) continue;
      const s = sums.get(r.method) ?? { sum: 0, n: 0 };
      s.sum += Math.abs(predicted - measured) / Math.abs(measured);
      s.n += 1;
      sums.set(r.method, s);
    }
  }
  return Object.fromEntries([...sums].map(([m, s]) => [m, s.sum / s.n]));
}
