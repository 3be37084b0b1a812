// One point of a study, every method, with the design answers the study asks for: the
// forward rows (or a target's solved rows), their bands, and the summary across methods.
// Pure and synchronous: the worker threads, `solve` and tests call the same function.
import { getMethod } from '../physics/catalogue.js';
import { compileSolver, type ResultRow, type SolvePlan } from '../physics/engine.js';
import type { Inputs } from '../physics/types.js';
import { drawPoint, forwardBands, targetBands } from './bands.js';
import type { MethodEvaluator } from './method-factor.js';
import { explainSummary, summaryFacts, type MethodUncertainty, type SummaryFacts } from './summary.js';
import { SummaryEncoder } from './stored-summaries.js';
import { targetRow } from './target.js';
import type { DesignSpec, PointSummary } from './types.js';

export interface DesignedPoint {
  /** One row per method, in `methodIds` order. */
  rows: ResultRow[];
  /** The summary across methods: its facts (what the store keeps) … */
  facts: SummaryFacts;
  /** … and in words (built when read). */
  readonly summary: PointSummary;
}

export type PointDesigner = ((point: Inputs, index: number) => DesignedPoint) & {
  /** An encoder of the stored summaries of this designer's points (the workers' columnar form). */
  summaryEncoder(): SummaryEncoder;
};

/** A point's rows; the facts and their wording are worked out only when read (the workers never read them). */
class Designed implements DesignedPoint {
  private known?: SummaryFacts;

  constructor(
    readonly rows: ResultRow[],
    private readonly fractions: readonly number[],
    private readonly uncertainties: readonly MethodUncertainty[],
    private readonly adjust: string | undefined,
  ) {}

  get facts(): SummaryFacts {
    return (this.known ??= summaryFacts(this.rows, this.fractions, this.adjust));
  }

  get summary(): PointSummary {
    return explainSummary(this.facts, this.uncertainties, this.rows);
  }
}

/**
 * Compiles the plan once per method. `design` undefined (or empty): the plain forward
 * rows and their summary. `index` is the point's id in the sweep: it seeds the point's
 * Monte Carlo draws, so a point's band does not depend on which worker computes it.
 */
export function compilePointDesigner(plan: SolvePlan, methodIds: readonly string[], design?: DesignSpec): PointDesigner {
  const all = compileSolver({ ...plan, methods: [...methodIds] }, { strict: false });
  const uncertainties: MethodUncertainty[] = methodIds.map((id) => ({ id, fraction: getMethod(plan.configuration, id).uncertainty.fraction }));
  const adjust = design?.target?.adjust;
  const fractions = uncertainties.map((u) => u.fraction);
  const designed = (rows: ResultRow[]): DesignedPoint => new Designed(rows, fractions, uncertainties, adjust);
  const withEncoder = (designer: (point: Inputs, index: number) => DesignedPoint): PointDesigner =>
    Object.assign(designer, { summaryEncoder: () => new SummaryEncoder(methodIds, fractions, adjust) });
  const needsMethods = design !== undefined && (design.target !== undefined || design.uncertainty !== undefined);
  if (!needsMethods) {
    return withEncoder((point) => designed(all(point)));
  }
  const evaluators: MethodEvaluator[] = methodIds.map((id) => {
    const solve = compileSolver({ ...plan, methods: [id] }, { strict: false });
    return (inputs) => solve(inputs)[0];
  });
  return withEncoder((point, index) => {
    const draws = design.uncertainty ? drawPoint(design, index) : { draws: [] };
    const rows = methodIds.map((id, m) => {
      const evaluate = evaluators[m];
      const row = design.target ? targetRow(id, evaluate, point, design.target) : evaluate(point);
      if (!design.uncertainty) return row;
      const fraction = uncertainties[m].fraction;
      const band = design.target
        ? targetBands(evaluate, point, row, fraction, design, design.target, draws)
        : forwardBands(evaluate, point, row, fraction, design, draws);
      return { ...row, outputs: { ...row.outputs, ...band.outputs }, flags: [...row.flags, ...band.flags] };
    });
    return designed(rows);
  });
}
