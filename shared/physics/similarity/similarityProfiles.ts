// Profiles for a point given as method inputs, without evaluating the method's outputs.
import { InputError, type Inputs } from '../types.js';
import { flatPlateSimilarity, wedgeSimilarity, verticalPlateSimilarity } from './methods.js';

/**
 * Velocity and temperature profiles (`eta`, `f_prime`, `theta`; see forcedFlowProfiles and
 * freeConvectionProfiles for the scalings) for configuration `flat-plate`, `wedge` or
 * `vertical-plate` and that method's inputs. Empty when the point has no solution (see `flags`).
 */
export function similarityProfiles(configuration: string, inputs: Inputs): { profiles: Record<string, number[]>; flags: string[] } {
  const method = [flatPlateSimilarity, wedgeSimilarity, verticalPlateSimilarity].find((m) => m.configuration === configuration);
  if (!method) throw new InputError(`no similarity solution for configuration '${configuration}'`);
  const r = method.evaluate({ ...inputs, profiles: true });
  return { profiles: r.profiles ?? {}, flags: r.flags };
}
