// Ethylene glycol, C2H4(OH)2, pure, saturated liquid, 273 K to 373 K.
// Every column (T, rho, cp, mu, k, beta) is Table A.5 "Thermophysical properties of saturated
// liquids" of Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer
// (6th ed., 2007), converted to SI base units. Values written FROM MEMORY, not read from the
// book; each row was checked to reproduce the table's own nu, alpha and Pr columns within 1 %
// (tests/fluids_handbook.test.ts). The table gives beta = 0.65e-3 1/K at every temperature;
// its density steps (300 to 310 K, 370 to 373 K) are uneven, so beta is taken from the
// table rather than from the slope of rho.
import type { FluidTableData } from '../tableFluid.js';

export const ethyleneGlycolTable: FluidTableData = {
  name: 'ethylene-glycol',
  title: 'Ethylene glycol (pure)',
  source:
    'Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., Table A.5 ' +
    '(values transcribed from memory; checked against the table\'s own nu, alpha and Pr)',
  // [T K, rho kg/m³, cp J/(kg·K), mu Pa·s, k W/(m·K), beta 1/K]
  rows: [
    [273, 1130.8, 2294, 0.0651, 0.242, 0.65e-3],
    [280, 1125.8, 2323, 0.0420, 0.244, 0.65e-3],
    [290, 1118.8, 2368, 0.0247, 0.248, 0.65e-3],
    [300, 1114.4, 2415, 0.0157, 0.252, 0.65e-3],
    [310, 1103.7, 2460, 0.0107, 0.255, 0.65e-3],
    [320, 1096.2, 2505, 0.00757, 0.258, 0.65e-3],
    [330, 1089.5, 2549, 0.00561, 0.260, 0.65e-3],
    [340, 1083.8, 2592, 0.00431, 0.261, 0.65e-3],
    [350, 1079.0, 2637, 0.00342, 0.261, 0.65e-3],
    [360, 1074.0, 2682, 0.00278, 0.261, 0.65e-3],
    [370, 1066.7, 2728, 0.00228, 0.262, 0.65e-3],
    [373, 1058.5, 2742, 0.00215, 0.263, 0.65e-3],
  ],
};
