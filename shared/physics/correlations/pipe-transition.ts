// The laminar–turbulent transition in a smooth or rough circular tube as Gnielinski
// published it: between Re = 2300 and 1e4 the mean Nusselt number is interpolated
// linearly in Re between the laminar value at Re = 2300 and the turbulent value at 1e4
// (an intermittency factor γ), instead of leaving a gap between the laminar and the
// turbulent correlations. The laminar anchor is his composite for the mean over a tube of
// length L with both velocity and temperature developing.
import type { WallCondition } from './pipe.js';

/** Re below which the flow is laminar, and above which fully turbulent (Gnielinski 1995, 2013). */
export const TRANSITION_RE = { laminar: 2300, turbulent: 1e4 } as const;

// Gnielinski, V. (1995) Forsch. Ingenieurwes. 61:240–248; (2013) Int. J. Heat Mass Transfer 63:134–140,
// eq. for γ (from memory): γ = (Re − 2300)/(1e4 − 2300), 0 ≤ γ ≤ 1.
export function intermittency(Re: number): number {
  const g = (Re - TRANSITION_RE.laminar) / (TRANSITION_RE.turbulent - TRANSITION_RE.laminar);
  return Math.min(1, Math.max(0, g));
}

/** Nu = (1 − γ)·Nu_lam(2300) + γ·Nu_turb(1e4). */
export function transitionNusselt(Re: number, laminarAt2300: number, turbulentAt1e4: number): number {
  const g = intermittency(Re);
  return (1 - g) * laminarAt2300 + g * turbulentAt1e4;
}

// Gnielinski's laminar mean Nu over a tube of length L (VDI Heat Atlas, 2nd ed. (2010), ch. G1
// §3.1–3.2; Gnielinski 2013, from memory), with Gz = Re·Pr·D/L:
//   uniform wall temperature: [3.66³ + 0.7³ + (1.615 Gz^⅓ − 0.7)³ + ((2/(1 + 22Pr))^⅙ Gz^½)³]^⅓
//   uniform heat flux:        [4.354³ + 0.6³ + (1.953 Gz^⅓ − 0.6)³ + (0.924 Pr^⅓ (Re D/L)^½)³]^⅓
// Without a length (L/D → ∞) both reduce to the fully developed 3.66 and 4.354.
export function gnielinskiLaminarMean(Re: number, Pr: number, L_over_D: number | undefined, condition: WallCondition): number {
  if (L_over_D === undefined) return condition === 'temperature' ? 3.66 : 4.354;
  const Gz = (Re * Pr) / L_over_D;
  if (condition === 'temperature') {
    const developing = (2 / (1 + 22 * Pr)) ** (1 / 6) * Math.sqrt(Gz);
    return Math.cbrt(3.66 ** 3 + 0.7 ** 3 + (1.615 * Math.cbrt(Gz) - 0.7) ** 3 + developing ** 3);
  }
  const developing = 0.924 * Math.cbrt(Pr) * Math.sqrt(Re / L_over_D);
  return Math.cbrt(4.354 ** 3 + 0.6 ** 3 + (1.953 * Math.cbrt(Gz) - 0.6) ** 3 + developing ** 3);
}
