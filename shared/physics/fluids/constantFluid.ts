// A user-defined fluid with temperature-independent properties (a study's `{constant: {...}}`).

import { InputError } from '../types.js';
import { FluidRangeError, type Fluid, type FluidProperties } from './types.js';

export interface ConstantFluidOptions {
  /** kg/m³ */
  rho: number;
  /** J/(kg·K) */
  cp: number;
  /** Pa·s */
  mu: number;
  /** W/(m·K) */
  k: number;
  /** 1/K. Without it beta is NaN, so a free-convection method cannot silently use a made-up value. */
  beta?: number;
  /** Default `user`. */
  name?: string;
  title?: string;
  /** Valid range in K; default 0 K to unbounded. */
  Tmin?: number;
  Tmax?: number;
}

const POSITIVE = ['rho', 'cp', 'mu', 'k'] as const;
const ALLOWED: readonly string[] = [...POSITIVE, 'beta', 'name', 'title', 'Tmin', 'Tmax'];

/** A fluid with the same properties at every temperature in [Tmin, Tmax]; throws InputError on bad values. */
export function makeConstantFluid(options: ConstantFluidOptions): Fluid {
  const name = typeof options?.name === 'string' && options.name !== '' ? options.name : 'user';
  const fail = (message: string): never => {
    throw new InputError(`constant fluid '${name}': ${message}`);
  };
  if (typeof options !== 'object' || options === null) fail('properties must be an object with rho, cp, mu, k');
  for (const key of Object.keys(options)) {
    if (!ALLOWED.includes(key)) fail(`unknown field '${key}' (allowed: ${ALLOWED.join(', ')})`);
  }
  if (options.name !== undefined && (typeof options.name !== 'string' || options.name === '')) {
    fail('name must be a non-empty string');
  }
  for (const key of POSITIVE) {
    const v: unknown = options[key];
    if (v === undefined) fail(`'${key}' is missing`);
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) {
      fail(`'${key}' must be a positive finite number, got ${JSON.stringify(v)}`);
    }
  }
  if (options.beta !== undefined && (typeof options.beta !== 'number' || !Number.isFinite(options.beta))) {
    fail(`'beta' must be a finite number, got ${JSON.stringify(options.beta)}`);
  }
  const Tmin = options.Tmin ?? 0;
  const Tmax = options.Tmax ?? Infinity;
  if (typeof Tmin !== 'number' || !Number.isFinite(Tmin) || Tmin < 0) {
    fail(`'Tmin' must be a finite temperature of at least 0 K, got ${JSON.stringify(options.Tmin)}`);
  }
  if (typeof Tmax !== 'number' || Number.isNaN(Tmax) || Tmax <= Tmin) {
    fail(`'Tmax' must be above Tmin (${Tmin} K), got ${JSON.stringify(options.Tmax)}`);
  }

  const { rho, cp, mu, k } = options;
  const nu = mu / rho;
  const alpha = k / (rho * cp);
  const values: FluidProperties = { rho, cp, mu, k, nu, alpha, Pr: nu / alpha, beta: options.beta ?? NaN };
  return {
    name,
    title: options.title ?? 'User-defined fluid (constant properties)',
    Tmin,
    Tmax,
    source: 'user-supplied constant properties',
    properties(T: number): FluidProperties {
      if (!(T >= Tmin && T <= Tmax) || !Number.isFinite(T)) throw new FluidRangeError(name, T, Tmin, Tmax);
      return { ...values };
    },
  };
}
