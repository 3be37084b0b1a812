// Fluids defined by a property table against temperature: the catalogue fluids and
// user tables. rho, cp and k are interpolated by monotone cubics, mu by a monotone cubic
// in ln(mu) (oil viscosity spans three decades over the table); nu, alpha and Pr are then
// derived from the interpolated values so that Pr = nu / alpha holds exactly.

import { InputError } from '../types.js';
import { FluidRangeError, type Fluid, type FluidProperties } from './types.js';
import { hermiteDerivative, hermiteValue, intervalIndex, monotoneSlopes } from './monotoneCubic.js';

/** One table row, SI units: T K, rho kg/m³, cp J/(kg·K), mu Pa·s, k W/(m·K), beta 1/K. */
export type TableRow = readonly [T: number, rho: number, cp: number, mu: number, k: number, beta: number];

/** A shipped property table (the modules in ./data). */
export interface FluidTableData {
  name: string;
  title: string;
  source: string;
  rows: readonly TableRow[];
}

/** A user table, one array per property, SI units. Without `beta`, beta = -(1/rho) drho/dT. */
export interface FluidColumns {
  T: number[];
  rho: number[];
  cp: number[];
  mu: number[];
  k: number[];
  beta?: number[];
}

export interface TableFluidOptions {
  /** Default `user`. */
  name?: string;
  title?: string;
  source?: string;
  columns: FluidColumns;
}

const REQUIRED_COLUMNS = ['T', 'rho', 'cp', 'mu', 'k'] as const;
const ALLOWED_COLUMNS: readonly string[] = [...REQUIRED_COLUMNS, 'beta'];

/** A user-defined fluid from a property table; throws InputError naming the faulty column. */
export function makeTableFluid(options: TableFluidOptions): Fluid {
  const name = options?.name ?? 'user';
  if (typeof name !== 'string' || name === '') {
    throw new InputError(`table fluid: name must be a non-empty string, got ${JSON.stringify(name)}`);
  }
  const columns = validateColumns(name, options?.columns);
  return new TableFluid(
    name,
    options.title ?? 'User-defined fluid (property table)',
    options.source ?? 'user-supplied property table',
    columns,
  );
}

/** A catalogue fluid from a shipped table (checked by the same rules as user tables). */
export function fluidFromTable(data: FluidTableData): Fluid {
  const columns: FluidColumns = { T: [], rho: [], cp: [], mu: [], k: [], beta: [] };
  for (const [T, rho, cp, mu, k, beta] of data.rows) {
    columns.T.push(T);
    columns.rho.push(rho);
    columns.cp.push(cp);
    columns.mu.push(mu);
    columns.k.push(k);
    columns.beta!.push(beta);
  }
  return new TableFluid(data.name, data.title, data.source, validateColumns(data.name, columns));
}

function validateColumns(name: string, columns: unknown): FluidColumns {
  const fail = (message: string): never => {
    throw new InputError(`table fluid '${name}': ${message}`);
  };
  if (typeof columns !== 'object' || columns === null || Array.isArray(columns)) {
    fail('columns must be an object with arrays T, rho, cp, mu, k and optionally beta');
  }
  const table = columns as Record<string, unknown>;
  for (const key of Object.keys(table)) {
    if (!ALLOWED_COLUMNS.includes(key)) {
      fail(`unknown column '${key}' (allowed: ${ALLOWED_COLUMNS.join(', ')})`);
    }
  }
  const present = table.beta === undefined ? REQUIRED_COLUMNS : ALLOWED_COLUMNS;
  for (const key of present) {
    const column = table[key];
    if (column === undefined) fail(`column '${key}' is missing`);
    if (!Array.isArray(column)) fail(`column '${key}' must be an array of numbers`);
  }
  const T = table.T as unknown[];
  if (T.length < 2) fail(`needs at least 2 rows, column 'T' has ${T.length}`);
  for (const key of present) {
    const column = table[key] as unknown[];
    if (column.length !== T.length) {
      fail(`column '${key}' has ${column.length} values but column 'T' has ${T.length}`);
    }
    column.forEach((v, i) => {
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        fail(`${key}[${i}] must be a finite number, got ${JSON.stringify(v)}`);
      }
      // beta may be negative (water below 277 K); every other property is positive.
      if (key !== 'beta' && (v as number) <= 0) {
        fail(`${key}[${i}] must be positive, got ${v}`);
      }
    });
  }
  for (let i = 1; i < T.length; i++) {
    if ((T[i] as number) <= (T[i - 1] as number)) {
      fail(`column 'T' must be strictly increasing: T[${i}] = ${T[i]} follows T[${i - 1}] = ${T[i - 1]}`);
    }
  }
  return table as unknown as FluidColumns;
}

class TableFluid implements Fluid {
  readonly Tmin: number;
  readonly Tmax: number;
  private readonly T: Float64Array;
  private readonly rho: Float64Array;
  private readonly rhoSlopes: Float64Array;
  private readonly cp: Float64Array;
  private readonly cpSlopes: Float64Array;
  private readonly lnMu: Float64Array;
  private readonly lnMuSlopes: Float64Array;
  private readonly k: Float64Array;
  private readonly kSlopes: Float64Array;
  private readonly beta: Float64Array | null;
  private readonly betaSlopes: Float64Array | null;

  constructor(
    readonly name: string,
    readonly title: string,
    readonly source: string,
    columns: FluidColumns,
  ) {
    this.T = Float64Array.from(columns.T);
    this.Tmin = this.T[0];
    this.Tmax = this.T[this.T.length - 1];
    this.rho = Float64Array.from(columns.rho);
    this.cp = Float64Array.from(columns.cp);
    this.lnMu = Float64Array.from(columns.mu, Math.log);
    this.k = Float64Array.from(columns.k);
    this.beta = columns.beta ? Float64Array.from(columns.beta) : null;
    this.rhoSlopes = monotoneSlopes(this.T, this.rho);
    this.cpSlopes = monotoneSlopes(this.T, this.cp);
    this.lnMuSlopes = monotoneSlopes(this.T, this.lnMu);
    this.kSlopes = monotoneSlopes(this.T, this.k);
    this.betaSlopes = this.beta ? monotoneSlopes(this.T, this.beta) : null;
  }

  properties(temperature: number): FluidProperties {
    // Written so that NaN fails the test too.
    if (!(temperature >= this.Tmin && temperature <= this.Tmax)) {
      throw new FluidRangeError(this.name, temperature, this.Tmin, this.Tmax);
    }
    const T = this.T;
    const i = intervalIndex(T, temperature);
    const h = T[i + 1] - T[i];
    const s = (temperature - T[i]) / h;
    const rho = hermiteValue(this.rho, this.rhoSlopes, i, s, h);
    const cp = hermiteValue(this.cp, this.cpSlopes, i, s, h);
    const mu = Math.exp(hermiteValue(this.lnMu, this.lnMuSlopes, i, s, h));
    const k = hermiteValue(this.k, this.kSlopes, i, s, h);
    // Tabulated beta when given, else the expansion coefficient of the density curve itself.
    const beta =
      this.beta && this.betaSlopes
        ? hermiteValue(this.beta, this.betaSlopes, i, s, h)
        : -hermiteDerivative(this.rho, this.rhoSlopes, i, s, h) / rho;
    const nu = mu / rho;
    const alpha = k / (rho * cp);
    return { rho, cp, mu, k, nu, alpha, Pr: nu / alpha, beta };
  }
}
