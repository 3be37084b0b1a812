// Similarity solves per second at the 1e-6 accuracy the tests prove, with the momentum
// solution cached (a Pr sweep) and from scratch; and the 100 m × 100 Pr sweep.
import { getMethod } from '../../shared/physics/catalogue.js';
import { clearSimilarityCaches } from '../../shared/physics/similarity/cache.js';
import { fmt, time, type BenchContext } from './timing.js';

const wedge = getMethod('wedge', 'similarity');
const free = getMethod('vertical-plate', 'similarity');

function logspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => 10 ** (Math.log10(a) + ((Math.log10(b) - Math.log10(a)) * i) / (n - 1)));
}

export function benchSimilarity(_ctx: BenchContext) {
  const prs = logspace(1e-3, 1e4, 200);
  // From scratch: every solve starts with empty caches (momentum + thermal).
  const n0 = 60;
  const scratch = time(() => {
    for (let i = 0; i < n0; i++) {
      clearSimilarityCaches();
      wedge.evaluate({ Re: 1e5, m: (i % 30) * 0.1, Pr: prs[(i * 7) % prs.length] });
    }
  });
  // Cached momentum: one m, a sweep over Pr (the thermal quadrature is the work).
  clearSimilarityCaches();
  wedge.evaluate({ Re: 1e5, m: 0.5, Pr: 1 });
  const cached = time(() => {
    for (const Pr of prs) wedge.evaluate({ Re: 1e5, m: 0.5, Pr });
  });
  const nFree = 20;
  const freeScratch = time(() => {
    for (let i = 0; i < nFree; i++) {
      clearSimilarityCaches();
      free.evaluate({ Gr: 1e8, Pr: logspace(1e-2, 1e4, nFree)[i] });
    }
  });
  const scratchRate = n0 / scratch.seconds;
  const cachedRate = prs.length / cached.seconds;
  console.log(`wedge/flat-plate similarity, from scratch:     ${fmt(scratchRate)} solves/s (${n0} solves, m 0..2.9, Pr 1e-3..1e4)`);
  console.log(`wedge similarity, momentum cached (Pr sweep):  ${fmt(cachedRate)} solves/s (${prs.length} Pr values)`);
  console.log(`  ratio cached / from scratch:                 ${fmt(cachedRate / scratchRate)}×`);
  console.log(`free convection (coupled), from scratch:       ${fmt(nFree / freeScratch.seconds)} solves/s (${nFree} Pr values 1e-2..1e4)`);
}

export function benchSimilaritySweep(_ctx: BenchContext) {
  // 100 m × 100 Pr, in sweep order (m outer, Pr inner), as a study's grid would run it.
  const ms = Array.from({ length: 100 }, (_, i) => -0.09 + (4.09 * i) / 99);
  const prs = logspace(1e-3, 1e4, 100);
  clearSimilarityCaches();
  const sweep = time(() => {
    for (const m of ms) for (const Pr of prs) wedge.evaluate({ Re: 1e5, m, Pr });
  });
  // Solving every point from scratch, timed on a sample and scaled to the 10 000 points.
  const sample = 100;
  const scratch = time(() => {
    for (let i = 0; i < sample; i++) {
      clearSimilarityCaches();
      wedge.evaluate({ Re: 1e5, m: ms[(i * 37) % 100], Pr: prs[(i * 53) % 100] });
    }
  });
  const scratchTotal = (scratch.seconds / sample) * 10_000;
  console.log(`similarity sweep 100 m × 100 Pr (cached momentum): ${fmt(sweep.seconds)} s`);
  console.log(`every point from scratch (${sample}-point sample, scaled): ${fmt(scratchTotal)} s`);
  console.log(`  ratio sweep / from scratch: ${fmt(sweep.seconds / scratchTotal)} (speed-up ${fmt(scratchTotal / sweep.seconds)}×)`);
}
