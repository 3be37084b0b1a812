// How many points go into the next batch. Each batch is one worker task and one database
// transaction: too small and the per-task and per-commit costs dominate, too large and an
// interrupt waits long, progress stalls and the last batches are shared out unevenly.
// Batching never changes results, only throughput.

/** Compute time a batch should take once the per-point cost is known. */
export const TARGET_BATCH_MS = 200;
export const MIN_BATCH = 16;
/**
 * Results (points × methods) in one batch at most: what bounds a batch's memory (a few MB
 * with a dimensional run's twenty-odd output columns) and its transaction. Cheap points
 * reach it long before 0.2 s: 16,000 two-method correlation points take about 25 ms. It
 * was 2,000 points whatever the methods; per batch the pool, the messages and the commit
 * cost about 1.5 ms on this 2-core machine, so the 1e6-result bench run took 1.90–2.04 s
 * with 2,000 points and 1.77–1.80 s with 16,000 (`npm run bench -- e2e`, same run).
 */
export const MAX_BATCH_RESULTS = 32_000;

/** Points per batch at most for a study of `methods` methods. */
export function maxBatchPoints(methods: number): number {
  return Math.max(MIN_BATCH, Math.floor(MAX_BATCH_RESULTS / Math.max(1, methods)));
}

export class BatchSizer {
  private msPerPoint: number | undefined;
  /** Points per batch at most. */
  private readonly max: number;

  /**
   * `fixed`: always that size. Otherwise start at MIN_BATCH and adapt, in multiples of
   * `align`: the length of a grid's innermost sweep entry, so that the points sharing
   * the outer values (e.g. one Falkner–Skan m across a Pr sweep) land in one worker and
   * its cached momentum solution is not solved again by another. `methods`: the study's,
   * for the cap on a batch's results.
   */
  constructor(
    private readonly points: number,
    private readonly workers: number,
    private readonly fixed?: number,
    private readonly align = 1,
    methods = 1,
  ) {
    this.max = maxBatchPoints(methods);
    if (fixed !== undefined && !(Number.isInteger(fixed) && fixed >= 1)) {
      throw new RangeError(`batch size must be a whole number ≥ 1, got ${fixed}`);
    }
  }

  next(): number {
    if (this.fixed !== undefined) return this.fixed;
    if (this.msPerPoint === undefined) return this.aligned(MIN_BATCH);
    const ideal = Math.round(TARGET_BATCH_MS / Math.max(this.msPerPoint, 1e-6));
    // At least four batches per worker, so the tail of the sweep is shared evenly.
    const share = Math.ceil(this.points / (this.workers * 4));
    return this.aligned(Math.max(MIN_BATCH, Math.min(this.max, ideal, share)));
  }

  private aligned(n: number): number {
    if (this.align <= 1 || this.align > this.max) return n;
    return Math.max(this.align, Math.round(n / this.align) * this.align);
  }

  /** Feeds back a finished batch's compute time (smoothed). */
  observe(points: number, computeMs: number): void {
    if (points <= 0) return;
    const perPoint = computeMs / points;
    this.msPerPoint = this.msPerPoint === undefined ? perPoint : 0.7 * this.msPerPoint + 0.3 * perPoint;
  }
}
