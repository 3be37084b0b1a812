// Uncertainty bands: `<output>_low` and `<output>_high` are the 2.5 % and 97.5 % points
// of an output when the inputs vary by their tolerances (normal, the tolerance read as a
// 95 % half-width) and the method's stated uncertainty acts on Nu as an independent
// factor F ~ N(1, (fraction/1.96)²) (method-factor.ts).
//
// How: with no tolerances the only random quantity is F, and every banded output is a
// monotone function of F, so its 2.5 % and 97.5 % points are the outputs at F = 1 ∓
// fraction, computed exactly (two solves, no sampling): the band is the stated uncertainty.
// With tolerances, seeded Monte Carlo: the outputs are nonlinear in the inputs (power
// laws, properties read at a temperature that moves, energy balances, a target's root),
// the band is often asymmetric, and the engine offers no derivatives, so a first-order
// propagation would be neither exact nor cheaper to make exact. The draws are a Latin
// hypercube in probability (McKay, Beckman & Conover 1979: each variable's N strata used
// once), which steadies the 2.5 % and 97.5 % points for the same N. Each point draws its own
// stream, seeded with the study's seed and the point's index (seedrandom's alea), so a
// point's band is the same on any worker count and machine; all methods of a point share
// the input draws, so their bands compare like with like.
import seedrandom from 'seedrandom';
import type { ResultRow } from '../physics/engine.js';
import type { Flag, Inputs, Outputs } from '../physics/types.js';
import { evaluateWithFactor, factorRule, uncoveredOutputs, type MethodEvaluator } from './method-factor.js';
import { BAND_INCOMPLETE, BANDED_OUTPUTS, bandInputsOnly, highName, lowName } from './names.js';
import { normalQuantile, sortedQuantile, Z95 } from './normal.js';
import { solveTargetNear, solveTargetValue } from './target.js';
import type { DesignSpec, DesignTarget, InputTolerance } from './types.js';

/** Standard normal draws of one point: one per tolerance (file order) and one for F, per sample. */
export interface PointDraws {
  /** draws[s][j]: sample s, tolerance j (the last column is the method factor's). */
  draws: Float64Array[];
}

/** The seeded draws of point `index`; none without tolerances. */
export function drawPoint(spec: DesignSpec, index: number): PointDraws {
  const names = Object.keys(spec.tolerances);
  if (!spec.uncertainty || names.length === 0) return { draws: [] };
  const random = seedrandom.alea(`${spec.uncertainty.seed}:${index}`);
  const n = spec.uncertainty.samples;
  const draws = Array.from({ length: n }, () => new Float64Array(names.length + 1));
  // Column by column: a shuffle of the strata, then one uniform within each stratum.
  for (let j = 0; j <= names.length; j++) {
    const strata = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const k = Math.floor(random() * (i + 1)); // Fisher–Yates (Knuth, TAOCP vol. 2, Algorithm P)
      [strata[i], strata[k]] = [strata[k], strata[i]];
    }
    for (let s = 0; s < n; s++) {
      let u = (strata[s] + random()) / n;
      if (u <= 0) u = 0.5 / n; // alea gives [0, 1): keep Φ⁻¹ finite
      draws[s][j] = normalQuantile(u);
    }
  }
  return { draws };
}

function perturbed(value: number, tolerance: InputTolerance, z: number): number {
  return 'relative' in tolerance ? value * (1 + (tolerance.relative / Z95) * z) : value + (tolerance.absolute / Z95) * z;
}

function sampleInputs(point: Inputs, spec: DesignSpec, draw: Float64Array): Inputs {
  const inputs: Inputs = { ...point };
  Object.entries(spec.tolerances).forEach(([name, tol], j) => {
    const v = point[name];
    if (typeof v === 'number') inputs[name] = perturbed(v, tol, draw[j]);
  });
  return inputs;
}

const factorOf = (fraction: number, z: number) => 1 + (fraction / Z95) * z;

interface BandResult {
  outputs: Outputs;
  flags: Flag[];
}

function collect(names: readonly string[]): Map<string, number[]> {
  return new Map(names.map((n) => [n, []]));
}

function bandsFrom(values: Map<string, number[]>, exact: boolean): Outputs {
  const out: Outputs = {};
  for (const [name, list] of values) {
    if (list.length === 0) continue;
    list.sort((a, b) => a - b);
    out[lowName(name)] = exact ? list[0] : sortedQuantile(list, 0.025);
    out[highName(name)] = exact ? list[list.length - 1] : sortedQuantile(list, 0.975);
  }
  return out;
}

/** Bands on a forward row's outputs (h, q, heat_rate, Nu, …, where the row has them). */
export function forwardBands(evaluate: MethodEvaluator, point: Inputs, nominal: ResultRow, fraction: number, spec: DesignSpec, draws: PointDraws): BandResult {
  const names = BANDED_OUTPUTS.filter((n) => Number.isFinite(nominal.outputs[n]));
  if (names.length === 0) return { outputs: {}, flags: [] };
  const rule = factorRule(point, nominal.outputs);
  const uncovered = uncoveredOutputs(rule, nominal.outputs);
  const flags: Flag[] = uncovered.map(bandInputsOnly);
  const values = collect(names);
  let incomplete = false;
  const add = (outputs: Outputs) => {
    for (const n of names) {
      const v = outputs[n];
      if (Number.isFinite(v)) values.get(n)!.push(v);
      else incomplete = true;
    }
  };
  const exact = draws.draws.length === 0;
  if (exact) {
    // Two solves at F = 1 ∓ fraction: the 2.5 % and 97.5 % points of a monotone function of F.
    for (const F of [1 - fraction, 1 + fraction]) {
      if (F > 0) add(evaluateWithFactor(evaluate, point, F, rule).outputs);
    }
    // An output F does not reach keeps its nominal value (zero width, flagged above).
    for (const n of uncovered) values.set(n, [nominal.outputs[n]]);
  } else {
    for (const draw of draws.draws) {
      const F = factorOf(fraction, draw[draw.length - 1]);
      if (!(F > 0)) {
        incomplete = true;
        continue;
      }
      add(evaluateWithFactor(evaluate, sampleInputs(point, spec, draw), F, rule).outputs);
    }
  }
  if (incomplete) flags.push(BAND_INCOMPLETE);
  return { outputs: bandsFrom(values, exact), flags };
}

/** The band on a target's solved input: the input needed when inputs and the method's Nu vary. */
export function targetBands(evaluate: MethodEvaluator, point: Inputs, solved: ResultRow, fraction: number, spec: DesignSpec, target: DesignTarget, draws: PointDraws): BandResult {
  const x0 = solved.outputs[target.adjust];
  if (!Number.isFinite(x0)) return { outputs: {}, flags: [] };
  const rule = factorRule(solved.inputs, solved.outputs);
  const flags: Flag[] = [];
  // The target's output must be one F reaches, or the band would hold the tolerances only.
  if (uncoveredOutputs(rule, solved.outputs).includes(target.output)) flags.push(bandInputsOnly(target.adjust));
  const values = collect([target.adjust]);
  let incomplete = false;
  const output = (inputs: Inputs, F: number) => (x: number) => evaluateWithFactor(evaluate, { ...inputs, [target.adjust]: x }, F, rule).outputs[target.output];
  // The band's ends (no tolerances) to the target's own 1e-9; Monte Carlo samples near x0.
  const solveExact = (inputs: Inputs, F: number) => {
    const s = solveTargetValue(output(inputs, F), target.value, target.within);
    if (s.status === 'solved') values.get(target.adjust)!.push(s.x);
    else incomplete = true;
  };
  const solveSample = (inputs: Inputs, F: number) => {
    const x = solveTargetNear(output(inputs, F), target.value, target.within, x0);
    if (x !== undefined) values.get(target.adjust)!.push(x);
    else incomplete = true;
  };
  const exact = draws.draws.length === 0;
  if (exact) {
    for (const F of [1 - fraction, 1 + fraction]) if (F > 0) solveExact(point, F);
  } else {
    for (const draw of draws.draws) {
      const F = factorOf(fraction, draw[draw.length - 1]);
      if (F > 0) solveSample(sampleInputs(point, spec, draw), F);
      else incomplete = true;
    }
  }
  if (incomplete) flags.push(BAND_INCOMPLETE);
  return { outputs: bandsFrom(values, exact), flags };
}
