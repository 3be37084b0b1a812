// Design targets: the value of one input at which an output meets a requirement, per
// point and method. The interval is scanned for sign changes (33 values, geometric
// when it spans more than a decade), then Brent's method refines the first (smallest)
// bracket to a relative tolerance of 1e-9 on the input (shared/physics/numerics/roots.ts).
// A requirement the method cannot meet anywhere in the interval is flagged
// `target-not-reached` with the range of the output seen over the scan; several sign
// changes take the smallest root and flag `target-several-roots`.
import type { ResultRow } from '../physics/engine.js';
import { brent, scanForBracket } from '../physics/numerics/roots.js';
import type { Flag, Inputs, Outputs } from '../physics/types.js';
import { maxName, minName, TARGET_NOT_REACHED, TARGET_SEVERAL_ROOTS } from './names.js';
import type { DesignTarget } from './types.js';

/** Relative tolerance on the adjusted input (issue 11). */
export const TARGET_REL_TOL = 1e-9;
/** Intervals of the bracket scan. */
export const SCAN_STEPS = 32;

export type TargetSolution =
  | { status: 'solved'; x: number; severalRoots: boolean }
  | { status: 'not-reached'; min: number; max: number }
  | { status: 'not-converged' };

/**
 * The smallest x in `within` with output(x) = value. `output` returns the output at x
 * (NaN or undefined where the method gives none: such values are skipped by the scan).
 */
export function solveTargetValue(output: (x: number) => number | undefined, value: number, within: readonly [number, number]): TargetSolution {
  const f = (x: number) => {
    const y = output(x);
    return y === undefined ? NaN : y - value;
  };
  const scan = scanForBracket(f, within[0], within[1], SCAN_STEPS);
  const bracket = scan.bracket;
  if (!bracket) return { status: 'not-reached', min: scan.min + value, max: scan.max + value };
  const severalRoots = bracket.signChanges > 1;
  if (bracket.lo === bracket.hi) return { status: 'solved', x: bracket.lo, severalRoots };
  const r = brent(f, bracket.lo, bracket.hi, { relTol: TARGET_REL_TOL });
  return r.status === 'converged' ? { status: 'solved', x: r.x, severalRoots } : { status: 'not-converged' };
}

/** Relative tolerance of a band sample's root: far below the spread of the samples. */
export const SAMPLE_REL_TOL = 1e-7;

/**
 * The root for one Monte Carlo sample of a band, which lies near the nominal root x0:
 * first a bracket of x0 ÷× 1.25, then ÷× 2, each clipped to `within`, then the full scan.
 * On a monotone output it is the same root `solveTargetValue` finds, at a third of the cost.
 */
export function solveTargetNear(output: (x: number) => number | undefined, value: number, within: readonly [number, number], x0: number): number | undefined {
  const f = (x: number) => {
    const y = output(x);
    return y === undefined ? NaN : y - value;
  };
  if (x0 > 0) {
    for (const factor of [1.25, 2]) {
      const lo = Math.max(within[0], x0 / factor);
      const hi = Math.min(within[1], x0 * factor);
      const flo = f(lo);
      const fhi = f(hi);
      if (Number.isFinite(flo) && Number.isFinite(fhi) && Math.sign(flo) !== Math.sign(fhi)) {
        const r = brent(f, lo, hi, { relTol: SAMPLE_REL_TOL });
        if (r.status === 'converged') return r.x;
      }
    }
  }
  const s = solveTargetValue(output, value, within);
  return s.status === 'solved' ? s.x : undefined;
}

/**
 * A method's result row for a target at one point: solved input in `inputs` and (under
 * its own name) in `outputs`, the method's outputs and flags at that input; or, when the
 * target is out of reach, the achievable range as `<output>_min`/`<output>_max`.
 */
export function targetRow(method: string, evaluate: (inputs: Inputs) => ResultRow, point: Inputs, target: DesignTarget): ResultRow {
  const at = (x: number): Inputs => ({ ...point, [target.adjust]: x });
  const solution = solveTargetValue((x) => evaluate(at(x)).outputs[target.output], target.value, target.within);
  if (solution.status === 'solved') {
    const row = evaluate(at(solution.x));
    const flags: Flag[] = [...row.flags];
    if (solution.severalRoots) flags.push(TARGET_SEVERAL_ROOTS);
    return { ...row, method, inputs: at(solution.x), outputs: { ...row.outputs, [target.adjust]: solution.x }, flags };
  }
  if (solution.status === 'not-converged') return { method, inputs: point, outputs: {}, flags: ['not-converged'] };
  const outputs: Outputs = {};
  if (Number.isFinite(solution.min) && Number.isFinite(solution.max)) {
    outputs[minName(target.output)] = solution.min;
    outputs[maxName(target.output)] = solution.max;
    return { method, inputs: point, outputs, flags: [TARGET_NOT_REACHED] };
  }
  // No value anywhere in the interval: the method's own flags at the low end say why
  // (e.g. domain-error: Gnielinski below Re = 1000).
  const why = evaluate(at(target.within[0])).flags.filter((f) => f !== TARGET_NOT_REACHED);
  return { method, inputs: point, outputs, flags: [TARGET_NOT_REACHED, ...why] };
}
