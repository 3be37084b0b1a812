// The commented starter file that `filmsweep init NAME` writes: a small, valid,
// dimensional pipe study that shows every key of the format.
import { slugPattern } from './schema.js';
import { InputError } from '../physics/types.js';

export function starterStudy(name: string): string {
  if (!slugPattern.test(name)) {
    throw new InputError(`study name '${name}' is not a slug: use lowercase letters and digits joined by hyphens`);
  }
  return `# Filmsweep study file. Check it with \`filmsweep run ${name}.yaml\`; for completion in
# editors, save the output of \`filmsweep schema\` and point your YAML plugin at it.
# Values are SI numbers or strings with units ("25 mm", "80 degC", "1.5 L/min").
# Results are engineering estimates (correlations carry 10-25 % uncertainty); where a
# design can hurt someone, follow the applicable codes and a licensed engineer.

name: ${name}                     # slug: lowercase letters, digits and hyphens
title: Water in a heated tube     # free text, shown in tables and the dashboard
configuration: pipe               # see \`filmsweep methods\` for configurations and methods

# Leave methods out to run every method of the configuration side by side.
methods: [gnielinski, dittus-boelter, sieder-tate]

# A catalogue fluid (water, air, ...), or your own:
#   fluid: {constant: {rho: 998 kg/m^3, cp: 4182 J/(kg K), mu: 1.0 mPa s, k: 0.6 W/(m K)}}
fluid: water

inputs:                           # fixed for every point
  diameter: 25 mm
  length: 2 m
  fluid_temperature: 40 degC      # bulk temperature: properties are read here
  surface_temperature: 60 degC    # gives the viscosity ratio for Sieder-Tate
  heating: true                   # Dittus-Boelter exponent n = 0.4

sweep:
  design: grid                    # grid | zip | latin-hypercube (then also samples: N)
  seed: 1                         # for latin-hypercube
  over:                           # swept inputs; a list or a range
    velocity: {from: 0.5 m/s, to: 3 m/s, count: 11}
    # Re and Pr can be swept directly in a dimensionless study without a fluid:
    #   Re: {from: 1.0e4, to: 1.0e6, count: 21, spacing: log}
    #   Pr: [0.7, 5, 50]

# Checks compare a result with a value you trust (a handbook example, a measurement).
# "at" picks one point (by inputs, or outputs such as Re); tolerance: 3%, 0.03, {relative: r} or {absolute: a}.
checks: []
#  - at: {velocity: 2 m/s}
#    method: gnielinski
#    expect: {Nu: 300}            # replace with your reference value
#    tolerance: 5%

baseline:
  tolerance: 1.0e-9               # relative; used by \`filmsweep check\` against the committed baseline
`;
}
