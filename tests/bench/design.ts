// Design answers: what a target sweep and a banded sweep cost against the plain forward
// sweep of the same points, measured in one run, through the pure per-point designer the
// worker threads call (shared/design/point.ts), so pool start-up and the store do not
// blur the ratio. The points: the probe of studies/probe-air-speed.yaml (three cylinder
// correlations, air), 40 diameters × 3 air temperatures.
import { compilePointDesigner, type DesignSpec } from '../../shared/design/index.js';
import type { SolvePlan } from '../../shared/physics/engine.js';
import type { Inputs } from '../../shared/physics/types.js';
import { fmt, time, type BenchContext } from './timing.js';

const plan: SolvePlan = { configuration: 'cylinder', methods: ['churchill-bernstein', 'hilpert', 'zukauskas'], fluid: 'air' };
const methodIds = plan.methods!;

function points(withVelocity: boolean): Inputs[] {
  const out: Inputs[] = [];
  for (let i = 0; i < 40; i++) {
    for (const T of [283.15, 299.35, 313.15]) {
      const p: Inputs = { diameter: 0.004 + i * 0.0005, length: 0.094, fluid_temperature: T, surface_temperature: 401.55 };
      if (withVelocity) p.velocity = 3;
      out.push(p);
    }
  }
  return out;
}

const target = { output: 'h', value: 50, adjust: 'velocity', within: [0.1, 30] as [number, number] };
const tolerances = { diameter: { absolute: 1e-4 }, fluid_temperature: { absolute: 1 } };

export function benchDesign(_ctx: BenchContext) {
  const samples = 400;
  const cases: { label: string; design?: DesignSpec; velocity: boolean }[] = [
    { label: 'forward (plain sweep)', velocity: true },
    { label: 'forward + stated-uncertainty band (exact, no sampling)', design: { tolerances: {}, uncertainty: { samples, seed: 1 } }, velocity: true },
    { label: `forward + tolerance band (${samples} Monte Carlo samples)`, design: { tolerances, uncertainty: { samples, seed: 1 } }, velocity: true },
    { label: 'target (velocity for h = 50 W/(m² K))', design: { tolerances: {}, target }, velocity: false },
    { label: 'target + stated-uncertainty band on the solved input', design: { tolerances: {}, target, uncertainty: { samples, seed: 1 } }, velocity: false },
    { label: `target + tolerance band (${samples} Monte Carlo samples)`, design: { tolerances, target, uncertainty: { samples, seed: 1 } }, velocity: false },
  ];
  let base = 0;
  for (const c of cases) {
    const designer = compilePointDesigner(plan, methodIds, c.design);
    const pts = points(c.velocity);
    // Repeat cheap cases so each timing lasts at least ~0.3 s.
    const rounds = c.design?.uncertainty && Object.keys(c.design.tolerances).length ? 1 : c.design?.target ? 5 : 200;
    const t = time(() => {
      for (let r = 0; r < rounds; r++) pts.forEach((p, i) => designer(p, i));
    });
    const perPoint = t.seconds / (rounds * pts.length);
    if (base === 0) base = perPoint;
    console.log(`${c.label}: ${fmt(perPoint * 1e6)} µs per point (${methodIds.length} methods), ${fmt(perPoint / base)}× the forward sweep`);
  }
}
