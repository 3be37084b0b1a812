// Liquid metals (Pr ≪ 1: sodium, NaK, lead–bismuth, mercury) in fully developed turbulent
// flow through a smooth circular pipe. Heat moves mostly by molecular conduction even in
// turbulent flow, so Nu depends on the Péclet number Pe = Re·Pr and tends to a constant
// at low Pe. Re, Nu and L/D are on the inner diameter; properties at the bulk temperature.
// These are `pipe` methods: the catalogue registers them with the other pipe correlations.
import { rangeFlags } from '../ranges.js';
import type { InputSpec, Method, OutputSpec, ValidityRange } from '../types.js';
import { turbulentEntryFlag } from './entry-length.js';
import { optionalLengthRatio, petukhovFrictionFactor, withPressureDrop } from './friction.js';
import { readInputs } from './method-inputs.js';

const CONFIGURATION = 'pipe';

// Seban, R.A. & Shimazaki, T.T. (1951) Trans. ASME 73:803–809: uniform wall temperature.
export function sebanShimazakiNusselt(Pe: number): number {
  return 5.0 + 0.025 * Pe ** 0.8;
}

// Skupinski, E., Tortel, J. & Vautrey, L. (1965) Int. J. Heat Mass Transfer 8:937–951: uniform heat flux.
export function skupinskiNusselt(Pe: number): number {
  return 4.82 + 0.0185 * Pe ** 0.827;
}

const inputs: InputSpec[] = [
  { name: 'Re', description: 'Reynolds number on the inner diameter, u_m D/ν', unit: '1', required: true },
  { name: 'Pr', description: 'Prandtl number at the bulk temperature (liquid metals: about 0.003–0.05)', unit: '1', required: true },
  {
    name: 'L_over_D',
    description: 'tube length over inner diameter, L/D (optional: gives pressure_drop_coefficient and the L/D range check)',
    unit: '1',
    required: false,
  },
];
const outputs: OutputSpec[] = [
  { name: 'Nu', description: 'Nusselt number on D, hD/k', unit: '1' },
  { name: 'Pe', description: 'Péclet number Re·Pr', unit: '1' },
  { name: 'f', description: 'Darcy friction factor, Petukhov (0.790 ln Re − 1.64)^−2 for smooth tubes (momentum transfer does not depend on Pr)', unit: '1' },
  { name: 'pressure_drop_coefficient', description: 'K = f·L/D, so that Δp = K·½ρu_m² (only when L_over_D is given)', unit: '1' },
];

const liquidMetalPr: ValidityRange = { input: 'Pr', max: 0.1, note: 'liquid metals; ordinary fluids have Pr ≳ 0.7 and other methods' };
const developed: ValidityRange = { input: 'L_over_D', note: 'fully developed: flagged entry-region below L/D = 10' };
const liquidMetalUncertainty = {
  fraction: 0.25,
  note: 'Common practice: liquid-metal data scatter widely (wetting of the wall, oxides, entrained gas); the sources state no single figure.',
};

/** The entry-region flag of a fully developed turbulent form (no short-tube factor: Hausen's is for ordinary fluids). */
const withEntry = (flags: string[], LD: number | undefined) => {
  const entry = turbulentEntryFlag(LD, false);
  return entry ? [...flags, entry] : flags;
};

const sebanShimazaki: Method = {
  id: 'seban-shimazaki',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Seban–Shimazaki (liquid metals, uniform wall temperature)',
  description:
    'Fully developed turbulent flow of a liquid metal in a smooth tube with a uniform wall temperature. Nu depends on the Péclet number only; at low Pe it tends to 5, where conduction across the tube dominates.',
  equation: '\\mathrm{Nu}_D = 5.0 + 0.025\\,\\mathrm{Pe}_D^{0.8},\\quad \\mathrm{Pe}_D = \\mathrm{Re}_D\\,\\mathrm{Pr} > 100',
  inputs,
  outputs,
  ranges: [{ input: 'Pe', min: 100, note: 'Pe = Re·Pr (derived)' }, liquidMetalPr, developed],
  wallConditions: ['temperature'],
  uncertainty: liquidMetalUncertainty,
  source:
    'Seban, R.A. & Shimazaki, T.T. (1951) Heat transfer to a fluid flowing turbulently in a smooth pipe with walls at constant temperature, Trans. ASME 73:803–809; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 8.65 (equation number from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(sebanShimazaki, raw);
    const Re = input.number('Re');
    const Pe = Re * input.number('Pr');
    const LD = optionalLengthRatio(input);
    const out = withPressureDrop(sebanShimazakiNusselt(Pe), petukhovFrictionFactor(Re), LD);
    return { outputs: { ...out, Pe }, flags: withEntry(rangeFlags(sebanShimazaki.ranges, { ...input.values, Pe }), LD) };
  },
};

const skupinski: Method = {
  id: 'skupinski',
  configuration: CONFIGURATION,
  kind: 'correlation',
  title: 'Skupinski (liquid metals, uniform heat flux)',
  description:
    'Fully developed turbulent flow of a liquid metal (the data: sodium–potassium alloys) in a smooth tube with a uniform wall heat flux. Nu depends on the Péclet number only.',
  equation: '\\mathrm{Nu}_D = 4.82 + 0.0185\\,\\mathrm{Pe}_D^{0.827},\\quad 3.6\\times10^3 \\le \\mathrm{Re}_D \\le 9.05\\times10^5,\\ 10^2 \\le \\mathrm{Pe}_D \\le 10^4',
  inputs,
  outputs,
  ranges: [
    { input: 'Re', min: 3.6e3, max: 9.05e5 },
    { input: 'Pe', min: 100, max: 1e4, note: 'Pe = Re·Pr (derived)' },
    liquidMetalPr,
    developed,
  ],
  wallConditions: ['flux'],
  uncertainty: liquidMetalUncertainty,
  source:
    'Skupinski, E., Tortel, J. & Vautrey, L. (1965) Détermination des coefficients de convection d’un alliage sodium-potassium dans un tube circulaire, Int. J. Heat Mass Transfer 8:937–951; as given in Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., eq. 8.64 (equation number from memory)',
  version: 1,
  evaluate(raw) {
    const input = readInputs(skupinski, raw);
    const Re = input.number('Re');
    const Pe = Re * input.number('Pr');
    const LD = optionalLengthRatio(input);
    const out = withPressureDrop(skupinskiNusselt(Pe), petukhovFrictionFactor(Re), LD);
    return { outputs: { ...out, Pe }, flags: withEntry(rangeFlags(skupinski.ranges, { ...input.values, Pe }), LD) };
  },
};

export const liquidMetalPipeMethods: Method[] = [sebanShimazaki, skupinski];
