// The catalogue: every method Filmsweep knows, keyed by configuration and id.
import { configurations, findConfiguration } from './configurations.js';
import { flatPlateMethods } from './correlations/flat-plate.js';
import { cylinderMethods } from './correlations/cylinder.js';
import { sphereMethods } from './correlations/sphere.js';
import { tubeBankMethods } from './correlations/tube-bank.js';
import { pipeMethods } from './correlations/pipe.js';
import { ductMethods } from './correlations/duct.js';
import {
  verticalPlateFreeMethods,
  horizontalPlateMethods,
  horizontalCylinderMethods,
  sphereFreeMethods,
} from './correlations/free-convection.js';
import { annulusMethods } from './correlations/annulus.js';
import { parallelPlatesMethods } from './correlations/parallel-plates.js';
import { liquidMetalPipeMethods } from './correlations/pipe-liquid-metal.js';
import { verticalChannelMethods } from './correlations/vertical-channel.js';
import { plateFinHeatSinkMethods } from './correlations/plate-fin-heat-sink.js';
import { enclosureMethods } from './correlations/enclosure.js';
import { inclinedPlateMethods } from './correlations/inclined-plate.js';
import { impingingJetMethods } from './correlations/impinging-jet.js';
import { similarityMethods } from './similarity/index.js';
import { InputError, type Method, type MethodInfo } from './types.js';

export const methods: Method[] = [
  ...similarityMethods,
  ...flatPlateMethods,
  ...cylinderMethods,
  ...sphereMethods,
  ...tubeBankMethods,
  ...pipeMethods,
  ...ductMethods,
  ...verticalPlateFreeMethods,
  ...horizontalPlateMethods,
  ...horizontalCylinderMethods,
  ...sphereFreeMethods,
  ...liquidMetalPipeMethods,
  ...annulusMethods,
  ...parallelPlatesMethods,
  ...verticalChannelMethods,
  ...plateFinHeatSinkMethods,
  ...enclosureMethods,
  ...inclinedPlateMethods,
  ...impingingJetMethods,
];

const byKey = new Map(methods.map((m) => [`${m.configuration}/${m.id}`, m]));

export function methodsFor(configuration: string): Method[] {
  return methods.filter((m) => m.configuration === configuration);
}

/** The method, or an InputError that lists what the configuration offers. */
export function getMethod(configuration: string, id: string): Method {
  requireConfiguration(configuration);
  const m = byKey.get(`${configuration}/${id}`);
  if (!m) {
    const known = methodsFor(configuration).map((x) => x.id);
    throw new InputError(
      `unknown method '${id}' for configuration '${configuration}'; expected one of: ${known.join(', ')}`,
    );
  }
  return m;
}

export function requireConfiguration(id: string) {
  const c = findConfiguration(id);
  if (!c) {
    throw new InputError(
      `unknown configuration '${id}'; expected one of: ${configurations.map((x) => x.id).join(', ')}`,
    );
  }
  return c;
}

/** The method as plain data (no function), for JSON output and the dashboard. */
export function describeMethod(m: Method): MethodInfo {
  const { evaluate: _evaluate, ...info } = m;
  return info;
}
