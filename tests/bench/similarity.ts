// Similarity solves per second at the 1e-6 accuracy the tests prove: Falkner–Skan + energy from
// scratch over a sweep of m and wall blowing against SciPy's solve_bvp on the same sweep (the
// peer, tests/bench/similarity_peer.py, run with /usr/bin/python3 in the same bench), free
// convection from scratch over Pr, the momentum solution cached (a Pr sweep), and the
// 100 m × 100 Pr sweep.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { getMethod } from '../../shared/physics/catalogue.js';
import { clearSimilarityCaches, resetSimilaritySolveCounts, similaritySolveCounts } from '../../shared/physics/similarity/cache.js';
import { fmt, time, type BenchContext } from './timing.js';

const wedge = getMethod('wedge', 'similarity');
const free = getMethod('vertical-plate', 'similarity');

const PYTHON = '/usr/bin/python3';
// The script sits in the source tree (tests/bench/), not in dist/.
const PEER_SCRIPT = fileURLToPath(new URL('../../../tests/bench/similarity_peer.py', import.meta.url));

function logspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => 10 ** (Math.log10(a) + ((Math.log10(b) - Math.log10(a)) * i) / (n - 1)));
}

/** The forced-flow sweep: m outer, wall blowing inner, as a study's grid runs it; all attached. */
function forcedSweep(mFrom: number): [number, number][] {
  const points: [number, number][] = [];
  for (let i = 0; i < 16; i++) for (let j = 0; j < 16; j++) points.push([mFrom + 0.2 * i, -1 + 0.1 * j]);
  return points;
}
const PR_FORCED = 0.7;
const FREE_PRS = logspace(1e-2, 1e4, 40);
/** Our sweeps take milliseconds and now and then meet a garbage collection: more of them. */
const ROUNDS = 15;
/** The peer's runs take seconds and vary little. */
const PEER_ROUNDS = 5;
const WARM_UP_SWEEPS = 8;

interface PeerRun {
  seconds: number;
  cpu_seconds: number;
  scipy: string;
  results: { status: string; Cf_x_Re_half: number; Nu_x_Re_half: number }[];
}

/** The SciPy peer on the same points, or why it could not run. */
function runPeer(points: [number, number][], continuation: boolean): PeerRun | string {
  if (!existsSync(PYTHON)) return `${PYTHON} not found`;
  const job = JSON.stringify({ Pr: PR_FORCED, points, continuation });
  // One thread, like our solver (NumPy's BLAS would otherwise start a pool).
  const env = { ...process.env, OPENBLAS_NUM_THREADS: '1', OMP_NUM_THREADS: '1', MKL_NUM_THREADS: '1' };
  const r = spawnSync(PYTHON, [PEER_SCRIPT], { input: job, encoding: 'utf8', maxBuffer: 64 << 20, env });
  if (r.status !== 0) {
    if (/No module named .?scipy/.test(r.stderr)) return `SciPy is not installed for ${PYTHON}`;
    return `the peer script failed: ${r.stderr.trim().split('\n').pop()}`;
  }
  return JSON.parse(r.stdout) as PeerRun;
}

/** The best of several runs: on a shared machine the other runs measure the neighbours' load. */
const best = (xs: number[]) => Math.max(...xs);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Wall and CPU time of fn (the machine is shared: CPU time is what load does not stretch). */
function timed<T>(fn: () => T): { value: T; seconds: number; cpuSeconds: number } {
  const c0 = process.cpuUsage();
  const run = time(fn);
  const c = process.cpuUsage(c0);
  return { ...run, cpuSeconds: (c.user + c.system) / 1e6 };
}

/** "wall rate (CPU-time rate)" in solves/s. */
const rates = (wall: number[], cpu: number[]) => `${fmt(best(wall))} solves/s (CPU time: ${fmt(best(cpu))} solves/s)`;

export function benchSimilarity(_ctx: BenchContext) {
  const points = forcedSweep(0);
  const solveSweep = () => points.map(([m, wb]) => wedge.evaluate({ Re: 1e5, Pr: PR_FORCED, m, wall_blowing: wb }).outputs);
  // Warm the JIT to its steady state on other points, as a long sweep runs (V8 needs some two
  // thousand solves; the peer's imports and SciPy's compiled code are not timed either).
  for (let round = 0; round < WARM_UP_SWEEPS; round++) {
    clearSimilarityCaches();
    for (const [m, wb] of forcedSweep(0.1 + 0.01 * round)) wedge.evaluate({ Re: 1e5, Pr: PR_FORCED, m, wall_blowing: wb });
    for (const Pr of logspace(2e-2, 5e3, 10)) {
      clearSimilarityCaches();
      free.evaluate({ Gr: 1e8, Pr: Pr * (1 + 0.01 * round) });
    }
  }

  // From scratch: caches emptied before the sweep, and every point is a new momentum solve.
  const ours = { wall: [] as number[], cpu: [] as number[] };
  const peer = { wall: [] as number[], cpu: [] as number[] };
  const peerCold = { wall: [] as number[], cpu: [] as number[] };
  let peerNote = '';
  let values: Record<string, number>[] = [];
  let peerValues: PeerRun['results'] = [];
  for (let round = 0; round < ROUNDS; round++) {
    clearSimilarityCaches();
    resetSimilaritySolveCounts();
    const run = timed(solveSweep);
    const counts = similaritySolveCounts();
    if (counts.momentumSolves !== points.length || counts.momentumCacheHits !== 0) throw new Error('the sweep did not solve every point from scratch');
    ours.wall.push(points.length / run.seconds);
    ours.cpu.push(points.length / run.cpuSeconds);
    values = run.value;
  }
  for (let round = 0; round < PEER_ROUNDS; round++) {
    for (const [continuation, into] of [[true, peer], [false, peerCold]] as const) {
      const p = runPeer(points, continuation);
      if (typeof p === 'string') peerNote = p;
      else {
        into.wall.push(points.length / p.seconds);
        into.cpu.push(points.length / p.cpu_seconds);
        if (continuation) peerValues = p.results;
        peerNote = `SciPy ${p.scipy}`;
      }
    }
  }
  const sweepNote = `${points.length} points: m 0..3 × wall_blowing −1..0.5, Pr ${PR_FORCED}; best of ${ROUNDS} runs, median ${fmt(median(ours.wall))} solves/s`;
  console.log(`Falkner–Skan + energy from scratch: ${rates(ours.wall, ours.cpu)}`);
  console.log(`  (${sweepNote}; every point a new momentum solve, no continuation between points)`);
  if (peer.wall.length === 0) {
    console.log(`  SciPy peer NOT RUN (${peerNote}): no ratio`);
  } else {
    let worst = 0;
    peerValues.forEach((r, i) => {
      if (r.status !== 'ok') return;
      worst = Math.max(worst, Math.abs(r.Cf_x_Re_half / values[i].Cf_x_Re_half - 1), Math.abs(r.Nu_x_Re_half / values[i].Nu_x_Re_half - 1));
    });
    console.log(`  SciPy solve_bvp peer, tol 1e-6 (${peerNote}, ${PYTHON}, one thread; best of ${PEER_ROUNDS} runs):`);
    console.log(`    with continuation from the previous point: ${rates(peer.wall, peer.cpu)}`);
    console.log(`    each point from a generic profile:         ${rates(peerCold.wall, peerCold.cpu)}`);
    console.log(`    largest relative difference, peer vs ours (Cf, Nu): ${worst.toExponential(1)}`);
    const ratio = (a: number[], b: number[]) => fmt(best(a) / best(b));
    console.log(`  ratio ours / peer with continuation:      ${ratio(ours.wall, peer.wall)}× (CPU time: ${ratio(ours.cpu, peer.cpu)}×)  goal ≥ 50×`);
    console.log(`  ratio ours / peer from a generic profile: ${ratio(ours.wall, peerCold.wall)}× (CPU time: ${ratio(ours.cpu, peerCold.cpu)}×)  goal ≥ 50×`);
  }

  // Free convection from scratch: caches emptied before every solve.
  const freeRates = { wall: [] as number[], cpu: [] as number[] };
  for (let round = 0; round < ROUNDS; round++) {
    const run = timed(() => {
      for (const Pr of FREE_PRS) {
        clearSimilarityCaches();
        free.evaluate({ Gr: 1e8, Pr });
      }
    });
    freeRates.wall.push(FREE_PRS.length / run.seconds);
    freeRates.cpu.push(FREE_PRS.length / run.cpuSeconds);
  }
  console.log(`free convection (coupled), from scratch: ${rates(freeRates.wall, freeRates.cpu)}  goal ≥ 1,000 solves/s`);
  console.log(`  (${FREE_PRS.length} Pr values 1e-2..1e4, log-spaced, caches emptied before each; best of ${ROUNDS} runs)`);

  // Cached momentum: one m, a sweep over Pr (the thermal quadrature is the work).
  const prs = logspace(1e-3, 1e4, 200);
  const cachedRates: number[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    clearSimilarityCaches();
    wedge.evaluate({ Re: 1e5, m: 0.5, Pr: 1 });
    const cached = time(() => {
      for (const Pr of prs) wedge.evaluate({ Re: 1e5, m: 0.5, Pr });
    });
    cachedRates.push(prs.length / cached.seconds);
  }
  console.log(`wedge similarity, momentum cached (Pr sweep):  ${fmt(best(cachedRates))} solves/s (${prs.length} Pr values 1e-3..1e4, best of ${ROUNDS} runs)`);
  console.log(`  ratio cached / from scratch:                 ${fmt(best(cachedRates) / best(ours.wall))}×`);
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
