// The similarity solutions as catalogue methods: flat plate (Blasius–Pohlhausen with blowing
// and dissipation), wedge (Falkner–Skan) and isothermal vertical plate (Ostrach).
import { InputError, type Inputs, type Method, type MethodResult, type OutputSpec, type InputSpec, type ValidityRange } from '../types.js';
import { rangeFlags } from '../ranges.js';
import { solveFalknerSkan, type FalknerSkanSolution } from './falknerSkan.js';
import { recoveryFactor, thermalSolution } from './thermal.js';
import { solveFreeConvection } from './freeConvection.js';
import { forcedFlowProfiles, freeConvectionProfiles } from './profiles.js';

const VERSION = 2;

const UNCERTAINTY = {
  fraction: 1e-6,
  note:
    'numerical accuracy of the similarity solution (checked against SciPy to 1e-6); the model itself assumes ' +
    'steady laminar boundary-layer flow with constant properties, so real plates differ by the property ' +
    'variation and any free-stream disturbance',
};

const spec = (name: string, description: string, required: boolean, dflt?: number): InputSpec => ({
  name,
  description,
  unit: '1',
  type: 'number',
  required,
  ...(dflt === undefined ? {} : { default: dflt }),
});
const out = (name: string, description: string, unit = '1'): OutputSpec => ({ name, description, unit });

const PR_FORCED: ValidityRange = { input: 'Pr', min: 1e-3, max: 1e4, note: 'range verified against the SciPy reference' };
const RE_LAMINAR: ValidityRange = {
  input: 'Re',
  min: 1e3,
  max: 5e5,
  note:
    'laminar layer: transition is usually taken near Re_x = 5e5; below Re_x = 1e3 the boundary-layer approximation ' +
    '(δ/x ≈ 5·Re_x^−½ ≪ 1) no longer holds (both common practice)',
};

const BLOWING_NOTE =
  'wall_blowing = (v_w/U)·Re_x^½ (negative: suction); a uniform value is what keeps the layer self-similar. ' +
  'The layer is blown off (flag `separation`) above about 0.619 on the flat plate';

// -------------------------------------------------------------------------- input checks

/** Input names per method, built once (the methods are evaluated in hot loops). */
const inputNames = new WeakMap<object, Set<string>>();

function readNumbers(method: { id: string; configuration: string; inputs: InputSpec[] }, inputs: Inputs): Record<string, number> {
  let known = inputNames.get(method);
  if (!known) inputNames.set(method, (known = new Set(method.inputs.map((s) => s.name))));
  for (const name of Object.keys(inputs)) {
    if (name === 'profiles') {
      if (typeof inputs.profiles !== 'boolean') throw new InputError(`input 'profiles' must be true or false`);
      continue;
    }
    if (!known.has(name)) {
      throw new InputError(
        `unknown input '${name}' for ${method.configuration}/${method.id}; expected one of: ${[...known].join(', ')}`,
      );
    }
  }
  const values: Record<string, number> = {};
  for (const s of method.inputs) {
    const v = inputs[s.name] ?? s.default;
    if (v === undefined) {
      if (s.required) throw new InputError(`${method.configuration}/${method.id} needs input '${s.name}'`);
      continue;
    }
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new InputError(`input '${s.name}': expected a finite number, got ${JSON.stringify(v)}`);
    }
    values[s.name] = v;
  }
  return values;
}

function positive(values: Record<string, number>, name: string): number {
  const v = values[name];
  if (!(v > 0)) throw new InputError(`input '${name}' must be positive (got ${v})`);
  return v;
}

function failed(flags: string[], flag: string): MethodResult {
  return { outputs: {}, flags: [...flags, flag] };
}

// -------------------------------------------------------------------------- forced flow

/** Outputs shared by the flat plate and the wedge, from Hartree-scaled f''(0), θ'(0), η99. */
function forcedOutputs(m: number, Re: number, mom: FalknerSkanSolution, thetaP0: number) {
  const sqRe = Math.sqrt(Re);
  const CfRe = mom.wallShear * Math.sqrt(2 * (m + 1));
  const NuRe = -thetaP0 * Math.sqrt((m + 1) / 2);
  const dRe = mom.eta99 * Math.sqrt(2 / (m + 1));
  return {
    Nu_x: NuRe * sqRe,
    Nu_x_Re_half: NuRe,
    Cf_x: CfRe / sqRe,
    Cf_x_Re_half: CfRe,
    delta99_x: dRe / sqRe,
    delta99_x_Re_half: dRe,
  };
}

const forcedOutputSpecs = [
  out('Nu_x', 'local Nusselt number h_x·x/k'),
  out('Nu_x_Re_half', 'Nu_x/Re_x^½ (independent of Re)'),
  out('Cf_x', 'local skin friction τ_w/(½ρU²), U the local outer velocity'),
  out('Cf_x_Re_half', 'Cf_x·Re_x^½ (independent of Re)'),
  out('delta99_x', 'δ99/x, where u = 0.99 U'),
  out('delta99_x_Re_half', 'δ99/x·Re_x^½ (independent of Re)'),
];

const flatPlateInputs: InputSpec[] = [
  spec('Re', 'local Reynolds number Re_x = U x/ν', true),
  spec('Pr', 'Prandtl number', true),
  spec('wall_blowing', BLOWING_NOTE, false, 0),
  spec('Ec', 'Eckert number U²/(c_p (T_w − T∞)); 0 neglects viscous dissipation', false, 0),
];

const flatPlateRanges: ValidityRange[] = [RE_LAMINAR, PR_FORCED];

export const flatPlateSimilarity: Method = {
  id: 'similarity',
  configuration: 'flat-plate',
  kind: 'similarity',
  title: 'Blasius–Pohlhausen similarity solution (exact laminar, with blowing and dissipation)',
  description:
    'Exact laminar boundary layer on an isothermal flat plate at zero pressure gradient, solved numerically ' +
    'for any Pr, with uniform wall suction or blowing and viscous dissipation. Nu_x is based on T_w − T_aw ' +
    '(T_aw = T∞ + r·U²/(2c_p)), so it does not depend on Ec; Nu_x_freestream is the same heat flux over ' +
    'T_w − T∞. Local values at distance x from the leading edge.',
  equation:
    "f''' + f f'' = 0,\\; \\theta'' + \\mathrm{Pr}\\, f\\, \\theta' = 0,\\; \\eta = y\\sqrt{U/(2\\nu x)},\\; " +
    "f(0) = -\\sqrt{2}\\,\\frac{v_w}{U}\\mathrm{Re}_x^{1/2},\\; \\mathrm{Nu}_x = -\\theta'(0)\\sqrt{\\mathrm{Re}_x/2}",
  inputs: flatPlateInputs,
  outputs: [
    ...forcedOutputSpecs,
    out('recovery_factor', 'r = (T_aw − T∞)/(U²/(2c_p)), adiabatic wall with viscous dissipation'),
    out('adiabatic_wall_excess', '(T_aw − T∞)/(T_w − T∞) = r·Ec/2'),
    out('Nu_x_freestream', 'q x/(k (T_w − T∞)) = Nu_x·(1 − r·Ec/2): the heat flux over the wall-to-free-stream difference'),
    out('Nu_x_freestream_Re_half', 'Nu_x_freestream/Re_x^½'),
  ],
  ranges: flatPlateRanges,
  wallConditions: ['temperature'],
  uncertainty: UNCERTAINTY,
  source:
    'Blasius, H. (1908) Grenzschichten in Flüssigkeiten mit kleiner Reibung, Z. Math. Phys. 56, 1–37; ' +
    'Pohlhausen, E. (1921) ZAMM 1, 115–121 (heat transfer and recovery factor); Emmons, H. W. & Leigh, D. C. ' +
    '(1954) ARC CP 157 (suction and blowing). Checked against SciPy (tests/fixtures/similarity_reference.py) and ' +
    'White, Viscous Fluid Flow.',
  version: VERSION,
  evaluate(inputs: Inputs): MethodResult {
    const v = readNumbers(this, inputs);
    const Re = positive(v, 'Re');
    const Pr = positive(v, 'Pr');
    const wb = v.wall_blowing;
    const Ec = v.Ec;
    const flags = rangeFlags(this.ranges, inputs);
    const mom = solveFalknerSkan(0, wb);
    if (mom.status === 'separation') return failed(flags, 'separation');
    if (mom.status !== 'attached') return failed(flags, 'not-converged');
    const th = thermalSolution(mom, Pr);
    if (th.status !== 'ok') return failed(flags, 'not-converged');
    const outputs: Record<string, number> = forcedOutputs(0, Re, mom, th.wallGradient);
    const rec = recoveryFactor(mom, Pr);
    if (rec.status === 'ok') {
      const r = rec.recoveryFactor;
      outputs.recovery_factor = r;
      outputs.adiabatic_wall_excess = (r * Ec) / 2;
      outputs.Nu_x_freestream = outputs.Nu_x * (1 - (r * Ec) / 2);
      outputs.Nu_x_freestream_Re_half = outputs.Nu_x_Re_half * (1 - (r * Ec) / 2);
    } else {
      // Strong blowing at high Pr: r ∝ e^{Pr·|F_min|} leaves the double range (or did not converge).
      flags.push(rec.status === 'overflow' ? 'overflow:recovery_factor' : 'not-converged');
    }
    const result: MethodResult = { outputs, flags };
    if (inputs.profiles === true) result.profiles = forcedFlowProfiles(mom, Pr);
    return result;
  },
};

// -------------------------------------------------------------------------- wedge

export const wedgeSimilarity: Method = {
  id: 'similarity',
  configuration: 'wedge',
  kind: 'similarity',
  title: 'Falkner–Skan wedge-flow similarity solution (exact laminar)',
  description:
    'Exact laminar boundary layer under an outer flow U = C x^m (wedge of half-angle βπ/2, β = 2m/(m+1)) on an ' +
    'isothermal wall, with uniform wall suction or blowing. m = 0 is the flat plate, m = 1 plane stagnation ' +
    'flow. Only the attached branch; below the separation value (m ≈ −0.0904 without blowing) the result is ' +
    'flagged `separation`. Re_x, Cf_x and Nu_x use the local outer velocity U(x).',
  equation:
    "f''' + f f'' + \\beta(1 - f'^2) = 0,\\; \\beta = \\frac{2m}{m+1},\\; \\theta'' + \\mathrm{Pr}\\, f\\,\\theta' = 0,\\; " +
    "\\eta = y\\sqrt{\\frac{(m+1)U}{2\\nu x}},\\; \\mathrm{Nu}_x = -\\theta'(0)\\sqrt{\\tfrac{m+1}{2}\\mathrm{Re}_x}",
  inputs: [
    spec('Re', 'local Reynolds number Re_x = U(x) x/ν', true),
    spec('Pr', 'Prandtl number', true),
    spec('m', 'exponent of the outer velocity U = C x^m (must exceed −1)', true),
    spec('wall_blowing', BLOWING_NOTE.replace('on the flat plate', 'for m = 0'), false, 0),
  ],
  outputs: forcedOutputSpecs,
  ranges: [
    RE_LAMINAR,
    PR_FORCED,
    { input: 'm', min: -0.0904, max: 4, note: 'from just above separation (m = −0.09043) to strongly accelerated flow' },
  ],
  wallConditions: ['temperature'],
  uncertainty: UNCERTAINTY,
  source:
    'Falkner, V. M. & Skan, S. W. (1931) Phil. Mag. 12, 865–896; Hartree, D. R. (1937) Proc. Camb. Phil. Soc. ' +
    '33, 223–239 (wall shear and separation, β = −0.1988); thermal solution as in Eckert (1942). Checked against ' +
    'SciPy (tests/fixtures/similarity_reference.py) and the Hartree table in White, Viscous Fluid Flow.',
  version: VERSION,
  evaluate(inputs: Inputs): MethodResult {
    const v = readNumbers(this, inputs);
    const Re = positive(v, 'Re');
    const Pr = positive(v, 'Pr');
    const m = v.m;
    if (!(m > -1)) throw new InputError(`input 'm' must exceed -1 (got ${m}): U = C x^m has no wedge-flow form there`);
    const flags = rangeFlags(this.ranges, inputs);
    const mom = solveFalknerSkan(m, v.wall_blowing);
    if (mom.status === 'separation') return failed(flags, 'separation');
    if (mom.status !== 'attached') return failed(flags, 'not-converged');
    const th = thermalSolution(mom, Pr);
    if (th.status !== 'ok') return failed(flags, 'not-converged');
    const result: MethodResult = { outputs: forcedOutputs(m, Re, mom, th.wallGradient), flags };
    if (inputs.profiles === true) result.profiles = forcedFlowProfiles(mom, Pr);
    return result;
  },
};

// -------------------------------------------------------------------------- free convection

const RA_LAMINAR: ValidityRange = {
  input: 'Ra',
  max: 1e9,
  note: 'laminar: transition on a vertical plate is usually taken near Ra_x = 1e9 (common practice)',
};
const GR_BOUNDARY_LAYER: ValidityRange = {
  input: 'Gr',
  min: 1e4,
  note: 'below Gr_x = 1e4 the layer is too thick for the boundary-layer approximation (common practice)',
};

export const verticalPlateSimilarity: Method = {
  id: 'similarity',
  configuration: 'vertical-plate',
  kind: 'similarity',
  title: 'Ostrach similarity solution (exact laminar free convection, isothermal vertical plate)',
  description:
    'Exact laminar free-convection boundary layer on an isothermal vertical plate (Boussinesq, constant ' +
    'properties), coupled momentum and energy solved numerically for any Pr. Give Gr_x or Ra_x (Gr = Ra/Pr); ' +
    'a cooled plate (negative Gr) gives the same magnitudes with the flow downwards. Cf_x is τ_w/(½ρU_c²) ' +
    'on the reference velocity U_c = 2√(gβΔT x) = (2ν/x)·Gr_x^½; δ99 is where the velocity has fallen to 1 % ' +
    'of its maximum.',
  equation:
    "f''' + 3 f f'' - 2 f'^2 + \\theta = 0,\\; \\theta'' + 3\\,\\mathrm{Pr}\\, f\\,\\theta' = 0,\\; " +
    "\\eta = \\frac{y}{x}\\left(\\frac{\\mathrm{Gr}_x}{4}\\right)^{1/4},\\; \\mathrm{Nu}_x = -\\theta'(0)\\left(\\frac{\\mathrm{Gr}_x}{4}\\right)^{1/4}",
  inputs: [
    spec('Gr', 'local Grashof number Gr_x = gβ(T_w − T∞)x³/ν² (give Gr or Ra)', false),
    spec('Ra', 'local Rayleigh number Ra_x = Gr_x·Pr (give Gr or Ra)', false),
    spec('Pr', 'Prandtl number', true),
  ],
  outputs: [
    out('Nu_x', 'local Nusselt number h_x·x/k'),
    out('Nu_x_Gr_quarter', 'Nu_x/(Gr_x/4)^¼ = −θ′(0) (independent of Gr)'),
    out('Cf_x', 'local skin friction τ_w/(½ρU_c²), U_c = 2√(gβΔT x)'),
    out('Cf_x_Gr_quarter', 'Cf_x·(Gr_x/4)^¼ = f″(0)/2 (independent of Gr)'),
    out('delta99_x', 'δ/x, where u has fallen to 1 % of its maximum'),
    out('delta99_x_Gr_quarter', 'δ/x·(Gr_x/4)^¼ (independent of Gr)'),
  ],
  ranges: [RA_LAMINAR, GR_BOUNDARY_LAYER, { input: 'Pr', min: 1e-2, max: 1e4, note: 'range verified against the SciPy reference' }],
  wallConditions: ['temperature'],
  uncertainty: UNCERTAINTY,
  source:
    'Ostrach, S. (1953) An analysis of laminar free-convection flow and heat transfer about a flat plate parallel ' +
    'to the direction of the generating body force, NACA Report 1111. Checked against SciPy ' +
    '(tests/fixtures/similarity_reference.py).',
  version: VERSION,
  evaluate(inputs: Inputs): MethodResult {
    const v = readNumbers(this, inputs);
    const Pr = positive(v, 'Pr');
    let Gr: number;
    if (v.Gr !== undefined && v.Ra !== undefined) {
      if (Math.abs(v.Gr * Pr - v.Ra) > 1e-9 * Math.abs(v.Ra)) {
        throw new InputError(`inputs 'Gr' and 'Ra' disagree: Gr·Pr = ${v.Gr * Pr}, Ra = ${v.Ra}; give one of them`);
      }
      Gr = v.Gr;
    } else if (v.Gr !== undefined) Gr = v.Gr;
    else if (v.Ra !== undefined) Gr = v.Ra / Pr;
    else throw new InputError(`${this.configuration}/${this.id} needs input 'Gr' or 'Ra'`);
    if (Gr === 0) throw new InputError(`input 'Gr' (or 'Ra') must be non-zero: without buoyancy there is no free convection`);
    const GrAbs = Math.abs(Gr);
    const flags = rangeFlags(this.ranges, { ...inputs, Gr: GrAbs, Ra: GrAbs * Pr });
    const sol = solveFreeConvection(Pr);
    if (sol.status !== 'ok') return failed(flags, 'not-converged');
    const q = Math.pow(GrAbs / 4, 0.25);
    const result: MethodResult = {
      outputs: {
        Nu_x: -sol.wallGradient * q,
        Nu_x_Gr_quarter: -sol.wallGradient,
        Cf_x: sol.wallShear / (2 * q),
        Cf_x_Gr_quarter: sol.wallShear / 2,
        delta99_x: sol.eta99 / q,
        delta99_x_Gr_quarter: sol.eta99,
      },
      flags,
    };
    if (inputs.profiles === true) result.profiles = freeConvectionProfiles(sol);
    return result;
  },
};

export const similarityMethods: Method[] = [flatPlateSimilarity, wedgeSimilarity, verticalPlateSimilarity];
