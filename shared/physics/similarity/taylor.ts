// Helpers for Taylor-series integration of polynomial ODE systems: the solvers compute each
// step's normalised Taylor coefficients y(η₀ + τ) = Σ a_k τ^k by the systems' own recurrences
// (automatic differentiation of products by Cauchy convolution), and these pick the order and
// the step as in Jorba, À. & Zou, M. (2005) A software package for the numerical integration of
// ODEs by means of high-order Taylor methods, Experimental Mathematics 14, 99–117 (from memory).

/** Highest order any solver uses; series buffers hold MAX_ORDER + 2 coefficients. */
export const MAX_ORDER = 28;
export const SERIES_LENGTH = MAX_ORDER + 2;

/**
 * Order for a local relative error ε per step: p = ⌈−½ ln ε⌉ + 1 about minimises the work per
 * unit length (Jorba & Zou 2005): the step then comes out near ρ/e², ρ the radius of convergence.
 */
export function orderFor(eps: number): number {
  return Math.min(MAX_ORDER, Math.max(4, Math.ceil(-0.5 * Math.log(eps)) + 1));
}

/**
 * Step length from the last two coefficients of the error-controlling series: with
 * ρ = min over k ∈ {p−1, p} of (scale/|a_k|)^{1/k}, the estimated radius of convergence
 * (`scale` = max(1, |y(η₀)|), `previous` and `last` the largest |a_{p−1}| and |a_p|), the step
 * h = 0.9·ρ·ε^{1/p} makes the first neglected term about ε·scale. `epsRoot` is ε^{1/p}.
 */
export function radiusStep(scale: number, previous: number, last: number, p: number, epsRoot: number): number {
  const r2 = last > 0 ? Math.pow(scale / last, 1 / p) : Infinity;
  // r1 < r2 exactly when |a_{p−1}| > |a_p|·r2 (as r2^{p−1} = scale/(|a_p|·r2)): only then is the
  // second root needed.
  const r1 = previous > 0 && (last === 0 || previous > last * r2) ? Math.pow(scale / previous, 1 / (p - 1)) : Infinity;
  return 0.9 * Math.min(r1, r2) * epsRoot;
}

/**
 * STABILITY[q]: the largest x with |Σ_{k≤q} (−y)^k/k!| ≤ 1 for all 0 ≤ y ≤ x, the stability
 * interval of a Taylor series of order q on y' = −λy (x = λh). A series carried at a lower order
 * than the steps were sized for (the variational equations) must keep λh inside it, or a fast
 * decaying mode (here e^{−∫f}) grows from rounding errors.
 */
export const STABILITY: readonly number[] = Array.from({ length: MAX_ORDER + 1 }, (_, q) => {
  const bounded = (y: number) => {
    let term = 1;
    let sum = 1;
    for (let k = 1; k <= q; k++) {
      term *= -y / k;
      sum += term;
    }
    return Math.abs(sum) <= 1;
  };
  let x = 0;
  while (x < 40 && bounded(x + 0.01)) x += 0.01;
  return x;
});

/** Σ_{k<n} a_{o+k} τ^k. */
export function horner(a: Float64Array, o: number, n: number, tau: number): number {
  let acc = a[o + n - 1];
  for (let k = n - 2; k >= 0; k--) acc = acc * tau + a[o + k];
  return acc;
}

/** d/dτ Σ_{k<n} a_{o+k} τ^k. */
export function hornerDerivative(a: Float64Array, o: number, n: number, tau: number): number {
  let acc = (n - 1) * a[o + n - 1];
  for (let k = n - 2; k >= 1; k--) acc = acc * tau + k * a[o + k];
  return acc;
}

/** d²/dτ² Σ_{k<n} a_{o+k} τ^k. */
export function hornerSecondDerivative(a: Float64Array, o: number, n: number, tau: number): number {
  let acc = (n - 1) * (n - 2) * a[o + n - 1];
  for (let k = n - 2; k >= 2; k--) acc = acc * tau + k * (k - 1) * a[o + k];
  return acc;
}
