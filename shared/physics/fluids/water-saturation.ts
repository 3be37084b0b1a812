// Saturation temperature of water, for the boiling check of liquid water at a pressure.
// IAPWS-IF97 (2007 revision), region 4, backward equation T_sat(p), eq. 31 with Table 34's
// coefficients; valid from the triple-point pressure 611.213 Pa to the critical 22.064 MPa.
// Checked against python3-iapws (iapws97._TSat_P) in tests/engine-boiling.test.ts.
const N = [
  0.11670521452767e4, -0.72421316598410e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7,
  0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
] as const;

export const WATER_TRIPLE_PRESSURE = 611.213; // Pa
export const WATER_CRITICAL_PRESSURE = 22.064e6; // Pa

/** T_sat in K at absolute pressure p in Pa (IAPWS-IF97 eq. 31); NaN outside the saturation line. */
export function waterSaturationTemperature(p: number): number {
  if (!(p >= WATER_TRIPLE_PRESSURE && p <= WATER_CRITICAL_PRESSURE)) return NaN;
  const beta = Math.pow(p / 1e6, 0.25);
  const E = beta * beta + N[2] * beta + N[5];
  const F = N[0] * beta * beta + N[3] * beta + N[6];
  const G = N[1] * beta * beta + N[4] * beta + N[7];
  const D = (2 * G) / (-F - Math.sqrt(F * F - 4 * E * G));
  const s = N[9] + D;
  return (s - Math.sqrt(s * s - 4 * (N[8] + N[9] * D))) / 2;
}
