// Aqueous glycol solutions: property correlations and freezing curves.
//
// Properties: Conde, M. R. (2011) "Thermophysical properties of brines — Models", M. Conde
// Engineering, Zurich, which fits each property of the ethylene glycol (MEG) and propylene
// glycol (MPG) solutions as
//     Y = A1 + A2·ξ + A3·Θ + A4·ξ·Θ + A5·Θ²,   ξ = glycol mass fraction, Θ = 273.15 K / T,
// with Y = ρ (kg/m³), cp (kJ/(kg·K)), k (W/(m·K)) and ln(μ / Pa·s). The coefficients below are
// written FROM MEMORY, not read from the report. No library with a published glycol
// formulation exists in Debian or npm (checked: `apt-cache search coolprop`, the npm list), so
// they are checked instead against the IAPWS water table at ξ = 0 and against handbook values
// (tests/fluids_glycol.test.ts, which states the deviations found).
//
// Freezing points: ASHRAE Handbook — Fundamentals (2009), ch. 31, Tables 2 (ethylene glycol)
// and 8 (propylene glycol), mass-per-cent columns, °C. Values written FROM MEMORY.

export interface GlycolSolutionData {
  name: string;
  glycol: string;
  /** [A1, A2, A3, A4, A5] per property, Conde (2011). */
  rho: readonly number[];
  cp: readonly number[];
  k: readonly number[];
  lnMu: readonly number[];
  /** [mass fraction, freezing point °C], ASHRAE Fundamentals ch. 31. */
  freezing: readonly (readonly [number, number])[];
  source: string;
}

const CONDE = 'Conde, M. R. (2011) Thermophysical properties of brines — Models, M. Conde Engineering, Zurich';
const ASHRAE = 'ASHRAE Handbook — Fundamentals (2009), ch. 31';

export const ethyleneGlycolWater: GlycolSolutionData = {
  name: 'ethylene-glycol-water',
  glycol: 'ethylene glycol',
  rho: [658.49825, -54.81501, 664.71643, 232.72605, -322.61661],
  cp: [5.36449, 0.78863, -2.59001, -2.73187, 1.43759],
  k: [0.83818, -1.3762, -0.07629, 1.0772, -0.20174],
  lnMu: [-4.63024, -2.14817, -12.70106, 5.40536, 10.9899],
  freezing: [
    [0, 0],
    [0.05, -1.4],
    [0.1, -3.2],
    [0.15, -5.4],
    [0.2, -7.8],
    [0.25, -10.7],
    [0.3, -14.1],
    [0.35, -17.9],
    [0.4, -22.3],
    [0.45, -27.5],
    [0.5, -33.8],
    [0.55, -41.1],
    [0.6, -48.3],
  ],
  source: `${CONDE}, MEG correlations (rho, cp, k, mu); freezing points ${ASHRAE} Table 2 (all coefficients and values from memory)`,
};

export const propyleneGlycolWater: GlycolSolutionData = {
  name: 'propylene-glycol-water',
  glycol: 'propylene glycol',
  rho: [508.41109, -182.4082, 965.76507, 280.29104, -472.2251],
  cp: [4.47642, 0.60863, -0.71497, -1.93855, 0.47873],
  k: [1.18886, -1.4911, -0.69682, 1.13633, 0.06735],
  lnMu: [-1.02798, -10.03298, -19.93497, 14.65802, 14.6205],
  freezing: [
    [0, 0],
    [0.05, -1.6],
    [0.1, -3.3],
    [0.15, -5.1],
    [0.2, -7.1],
    [0.25, -9.6],
    [0.3, -12.7],
    [0.35, -16.4],
    [0.4, -21.1],
    [0.45, -26.7],
    [0.5, -33.5],
    [0.55, -41.1],
    [0.6, -51.1],
  ],
  source: `${CONDE}, MPG correlations (rho, cp, k, mu); freezing points ${ASHRAE} Table 8 (all coefficients and values from memory)`,
};
