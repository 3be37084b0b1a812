// Engine oil, unused, saturated liquid, 273 K to 430 K.
// Every column (T, rho, cp, mu, k, beta) is Table A.5 "Thermophysical properties of saturated
// liquids" of Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer
// (6th ed., 2007), converted to SI base units. Values written FROM MEMORY, not read from the
// book; each row was checked to reproduce the table's own nu, alpha and Pr columns within 1 %
// (tests/fluids_handbook.test.ts). The table gives beta = 0.70e-3 1/K at every temperature.
import type { FluidTableData } from '../tableFluid.js';

export const engineOilTable: FluidTableData = {
  name: 'engine-oil',
  title: 'Engine oil (unused)',
  source:
    'Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., Table A.5 ' +
    '(values transcribed from memory; checked against the table\'s own nu, alpha and Pr)',
  // [T K, rho kg/m³, cp J/(kg·K), mu Pa·s, k W/(m·K), beta 1/K]
  rows: [
    [273, 899.1, 1796, 3.85, 0.147, 0.70e-3],
    [280, 895.3, 1827, 2.17, 0.144, 0.70e-3],
    [290, 890.0, 1868, 0.999, 0.145, 0.70e-3],
    [300, 884.1, 1909, 0.486, 0.145, 0.70e-3],
    [310, 877.9, 1951, 0.253, 0.145, 0.70e-3],
    [320, 871.8, 1993, 0.141, 0.143, 0.70e-3],
    [330, 865.8, 2035, 0.0836, 0.141, 0.70e-3],
    [340, 859.9, 2076, 0.0531, 0.139, 0.70e-3],
    [350, 853.9, 2118, 0.0356, 0.138, 0.70e-3],
    [360, 847.8, 2161, 0.0252, 0.138, 0.70e-3],
    [370, 841.8, 2206, 0.0186, 0.137, 0.70e-3],
    [380, 836.0, 2250, 0.0141, 0.136, 0.70e-3],
    [390, 830.6, 2294, 0.0110, 0.135, 0.70e-3],
    [400, 825.1, 2337, 0.00874, 0.134, 0.70e-3],
    [410, 818.9, 2381, 0.00698, 0.133, 0.70e-3],
    [420, 812.1, 2427, 0.00564, 0.133, 0.70e-3],
    [430, 806.5, 2471, 0.00470, 0.132, 0.70e-3],
  ],
};
