// Velocity and temperature profiles of the similarity solutions, on a grid that resolves both
// the velocity layer and the (possibly much thinner or thicker) thermal layer.
import { adaptiveQuadrature } from './quadrature.js';
import { expIntegral } from './thermal.js';
import type { SolutionTrace } from './trace.js';
import type { FalknerSkanSolution } from './falknerSkan.js';
import type { FreeConvectionSolution } from './freeConvection.js';

const POINTS_PER_LAYER = 101;

/** θ(η) = 1 − ∫₀^η e^{−P(F−Fref)} / ∫₀^∞ e^{−P(F−Fref)} at sorted η (the isothermal-wall profile). */
function thetaAt(trace: SolutionTrace, P: number, Fref: number, etas: readonly number[], total: number): number[] {
  const integrand = (x: number) => Math.exp(-P * (trace.F(x) - Fref));
  const theta: number[] = [];
  let cumulative = 0;
  let prev = 0;
  for (const x of etas) {
    if (x > prev) cumulative += adaptiveQuadrature(integrand, [prev, x], 1e-12).value;
    prev = x;
    theta.push(Math.max(0, 1 - cumulative / total));
  }
  return theta;
}

/** Smallest η where θ falls to `level`, by bisection on the cumulative integral. */
function thetaEdge(trace: SolutionTrace, P: number, Fref: number, total: number, level: number, hi: number): number {
  const integrand = (x: number) => Math.exp(-P * (trace.F(x) - Fref));
  const target = (1 - level) * total;
  while (adaptiveQuadrature(integrand, [0, hi], 1e-10).value < target) hi *= 2;
  let lo = 0;
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (adaptiveQuadrature(integrand, [0, mid], 1e-10).value < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Union of two uniform grids, each across 1.5 times one layer's thickness. */
function grid(edgeA: number, edgeB: number): number[] {
  const set = new Set<number>();
  for (const edge of [edgeA, edgeB]) for (let i = 0; i < POINTS_PER_LAYER; i++) set.add((1.5 * edge * i) / (POINTS_PER_LAYER - 1));
  return [...set].sort((a, b) => a - b);
}

/**
 * Forced-flow profiles (flat plate or wedge): `eta` = (y/x)·Re_x^½ = y√(U/(νx)), `f_prime` = u/U,
 * `theta` = (T − T∞)/(T_w − T∞) for the isothermal wall without dissipation.
 */
export function forcedFlowProfiles(sol: FalknerSkanSolution, Pr: number): Record<string, number[]> {
  if (sol.status !== 'attached' || !sol.trace) throw new Error(`no attached solution to take profiles from (status ${sol.status})`);
  const trace = sol.trace;
  const gMin = sol.etaFMin > 0 ? trace.derivative(2, sol.etaFMin) : 0;
  const total = expIntegral(trace, Pr, 0, sol.FMin, sol.etaFMin, gMin).value;
  const thermalEdge = thetaEdge(trace, Pr, sol.FMin, total, 0.01, sol.eta99);
  const etaH = grid(sol.eta99, thermalEdge);
  const toPhysical = Math.sqrt(2 / (sol.m + 1)); // Hartree η → y√(U/(νx))
  return {
    eta: etaH.map((x) => x * toPhysical),
    f_prime: etaH.map((x) => trace.derivative(2, x)),
    theta: thetaAt(trace, Pr, sol.FMin, etaH, total),
  };
}

/**
 * Free-convection profiles: `eta` = (y/x)(Gr_x/4)^¼, `f_prime` = u/U_c with U_c = 2√(gβΔT x),
 * `theta` = (T − T∞)/(T_w − T∞).
 */
export function freeConvectionProfiles(sol: FreeConvectionSolution): Record<string, number[]> {
  if (sol.status !== 'ok' || !sol.trace) throw new Error(`no converged solution to take profiles from (status ${sol.status})`);
  const trace = sol.trace;
  const P = 3 * sol.Pr;
  const total = -1 / sol.wallGradient; // θ = 1 + θ'(0)·J, so J(∞) = −1/θ'(0)
  const thermalEdge = thetaEdge(trace, P, 0, total, 0.01, sol.eta99);
  const etas = grid(sol.eta99, thermalEdge).filter((x) => x <= trace.lastEta);
  return {
    eta: etas,
    f_prime: etas.map((x) => trace.derivative(2, x)),
    theta: thetaAt(trace, P, 0, etas, total),
  };
}
