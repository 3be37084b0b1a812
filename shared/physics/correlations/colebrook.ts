// The Colebrook friction factor of a commercially rough pipe: Darcy f from the implicit
// equation, solved with Brent's method (numerics/roots.ts). Used by the pipe correlations
// when a point gives a wall roughness; smooth tubes keep Petukhov's explicit fit.
import { brent } from '../numerics/roots.js';
import { InputError, type Flag, type InputSpec } from '../types.js';
import { petukhovFrictionFactor } from './friction.js';

export interface ColebrookResult {
  f: number;
  /** 'converged', or why not (the caller flags `not-converged`). */
  status: string;
}

// Colebrook, C.F. (1939) J. Inst. Civil Eng. 11:133–156:
// 1/√f = −2 log10(ε/(3.7D) + 2.51/(Re √f)), ε/D the relative roughness.
export function colebrookFrictionFactor(Re: number, relativeRoughness: number): ColebrookResult {
  if (!(Re > 0)) throw new InputError(`Colebrook friction factor: Re must be > 0, got ${Re}`);
  if (!(relativeRoughness >= 0) || !Number.isFinite(relativeRoughness)) {
    throw new InputError(`relative_roughness ε/D must be ≥ 0, got ${relativeRoughness}`);
  }
  // In x = 1/√f the residual is monotone; f between 1e-4 and 1 brackets every pipe (x from 1 to 100).
  const residual = (x: number) => x + 2 * Math.log10(relativeRoughness / 3.7 + (2.51 * x) / Re);
  const r = brent(residual, 1, 100, { relTol: 1e-14 });
  return { f: r.status === 'converged' ? 1 / (r.x * r.x) : NaN, status: r.status };
}

/** The pipe methods' optional roughness input (the engine derives it from `roughness` and `diameter`). */
export const roughnessInput: InputSpec = {
  name: 'relative_roughness',
  description: 'ε/D, wall roughness over inner diameter (0, the default: a smooth tube with Petukhov\'s f; > 0 the Colebrook f)',
  unit: '1',
  required: false,
  default: 0,
};

/** Beyond f/f_smooth ≈ 4 roughness no longer raises h as it raises f (Norris 1971, from memory). */
export const NORRIS_FRICTION_RATIO_LIMIT = 4;

/**
 * The turbulent Darcy f of a pipe method: Petukhov's smooth-tube fit, or Colebrook's when the
 * wall is rough. Flags `not-converged` if the Colebrook solve fails (f is then NaN), and
 * `out-of-range:relative_roughness` past Norris' limit when `forHeatTransfer`.
 */
export function pipeFrictionFactor(Re: number, relativeRoughness: number | undefined, forHeatTransfer: boolean): { f: number; flags: Flag[] } {
  const smooth = petukhovFrictionFactor(Re);
  if (relativeRoughness === undefined || relativeRoughness === 0) return { f: smooth, flags: [] };
  const r = colebrookFrictionFactor(Re, relativeRoughness);
  if (r.status !== 'converged') return { f: NaN, flags: ['not-converged'] };
  const flags: Flag[] = [];
  if (forHeatTransfer && r.f / smooth > NORRIS_FRICTION_RATIO_LIMIT) flags.push('out-of-range:relative_roughness');
  return { f: r.f, flags };
}
