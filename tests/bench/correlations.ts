// Correlation evaluations per second: every correlation of the catalogue on points
// inside its ranges, straight through Method.evaluate (no engine, no store).
import { methods } from '../../shared/physics/catalogue.js';
import type { Inputs } from '../../shared/physics/types.js';
import { fmt, time, type BenchContext } from './timing.js';

// A valid point for each method: defaults, then range midpoints (geometric for wide ranges).
function samplePoint(m: (typeof methods)[number], k: number): Inputs {
  const p: Inputs = {};
  for (const s of m.inputs) {
    if (s.default !== undefined) p[s.name] = s.default;
  }
  for (const r of m.ranges) {
    if (!m.inputs.some((s) => s.name === r.input)) continue;
    const lo = r.min ?? (r.max !== undefined ? r.max / 100 : 1);
    const hi = r.max ?? lo * 100;
    const t = ((k * 0.618034) % 1) * 0.8 + 0.1;
    p[r.input] = lo > 0 && hi / lo > 10 ? lo * (hi / lo) ** t : lo + (hi - lo) * t;
  }
  for (const s of m.inputs) {
    if (p[s.name] === undefined && s.type !== 'boolean' && s.type !== 'string') p[s.name] = s.name === 'rows' ? 10 : 1;
    if (p[s.name] === undefined && s.choices) p[s.name] = s.choices[0];
  }
  return p;
}

export function benchCorrelations(_ctx: BenchContext) {
  const correlations = methods.filter((m) => m.kind === 'correlation');
  const points = correlations.map((m) => Array.from({ length: 64 }, (_, k) => samplePoint(m, k)));
  // Skip points a method refuses (so the loop measures evaluation, not exceptions).
  const usable = correlations.map((m, i) =>
    points[i].filter((p) => {
      try {
        m.evaluate(p);
        return true;
      } catch {
        return false;
      }
    }),
  );
  let evaluations = 0;
  const rounds = 400;
  const t = time(() => {
    for (let r = 0; r < rounds; r++) {
      for (let i = 0; i < correlations.length; i++) {
        const m = correlations[i];
        for (const p of usable[i]) {
          m.evaluate(p);
          evaluations++;
        }
      }
    }
  });
  console.log(`correlations: ${fmt(evaluations / t.seconds)} evaluations/s (${correlations.length} methods, ${fmt(evaluations)} evaluations)`);
}
