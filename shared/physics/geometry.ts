// Sizes → the lengths and areas a configuration needs: the characteristic length of Re,
// Nu and Gr, the heated area of the heat rates, and for internal flow the flow
// cross-section and heated perimeter of the energy balance.
import type { Configuration } from './configurations.js';
import { hydraulicDiameter } from './correlations/duct.js';
import { geometryExtensions, type ExtensionGeometry } from './extensions.js';
import { maxVelocityRatio } from './correlations/tube-bank.js';
import { optionalNumber, requireNumber } from './point-inputs.js';
import { InputError, type Inputs } from './types.js';

export interface Geometry extends ExtensionGeometry {
  /** Characteristic length of Re, Nu, Gr (diameter, hydraulic diameter, plate length …), m. */
  length: number;
  /** Heated surface area, m², when the inputs define it (internal flow: the whole tube wall). */
  area?: number;
  /** Internal flow: flow cross-section, m². */
  flowArea?: number;
  /** Internal flow: heated (wetted) perimeter, m. */
  perimeter?: number;
  /** Internal flow: heated length along the flow, m. */
  flowLength?: number;
  L_over_D?: number;
  aspect_ratio?: number;
}

/** A configuration's geometry from the point's sizes; an InputError names a missing size. */
export function geometryOf(c: Configuration, inputs: Inputs): Geometry {
  const override = optionalNumber(inputs, 'characteristic_length');
  const D = optionalNumber(inputs, 'diameter');
  const len = optionalNumber(inputs, 'length');
  const w = optionalNumber(inputs, 'width');
  const h = optionalNumber(inputs, 'height');
  const need = (name: string, v: number | undefined) => {
    if (v === undefined) throw new InputError(`configuration '${c.id}' needs input '${name}' (its ${c.lengthNote})`);
    return v;
  };
  const extension = geometryExtensions.get(c.id);
  if (extension) return extension(inputs, need);
  switch (c.id) {
    case 'flat-plate':
    case 'wedge': {
      const L = override ?? need('length', len);
      return { length: L, area: w !== undefined ? L * w : undefined };
    }
    case 'cylinder':
    case 'horizontal-cylinder': {
      const d = override ?? need('diameter', D);
      return { length: d, area: len !== undefined ? Math.PI * d * len : undefined };
    }
    case 'tube-bank': {
      // The area of the whole bank: rows × tubes per row tubes of length L.
      const d = override ?? need('diameter', D);
      const tubes = bankTubeCount(inputs);
      return { length: d, area: len !== undefined ? tubes * Math.PI * d * len : undefined, flowLength: len };
    }
    case 'sphere':
    case 'sphere-free': {
      const d = override ?? need('diameter', D);
      return { length: d, area: Math.PI * d * d };
    }
    case 'pipe': {
      const d = need('diameter', D);
      const roughness = optionalNumber(inputs, 'roughness');
      return {
        length: override ?? d,
        flowArea: (Math.PI * d * d) / 4,
        perimeter: Math.PI * d,
        flowLength: len,
        area: len !== undefined ? Math.PI * d * len : undefined,
        L_over_D: len !== undefined ? len / d : undefined,
        groups: roughness !== undefined ? { relative_roughness: roughness / d } : undefined,
      };
    }
    case 'duct': {
      const a = need('width', w);
      const b = need('height', h);
      const Dh = hydraulicDiameter(a, b);
      return {
        length: override ?? Dh,
        flowArea: a * b,
        perimeter: 2 * (a + b),
        flowLength: len,
        area: len !== undefined ? 2 * (a + b) * len : undefined,
        L_over_D: len !== undefined ? len / Dh : undefined,
        aspect_ratio: Math.min(a, b) / Math.max(a, b),
      };
    }
    case 'vertical-plate': {
      const H = override ?? need('height', h);
      return { length: H, area: w !== undefined ? H * w : undefined };
    }
    case 'horizontal-plate': {
      // Lloyd & Moran (1974): L = A/P.
      if (override !== undefined) return { length: override };
      const a = need('length', len);
      const b = need('width', w);
      return { length: (a * b) / (2 * (a + b)), area: a * b };
    }
    default:
      throw new InputError(`configuration '${c.id}' has no dimensional form`);
  }
}

/** Tube bank: V_max/V from the pitches (Incropera §7.6). */
export function tubeBankRatio(inputs: Inputs): number {
  const arrangement = (inputs.arrangement as 'aligned' | 'staggered' | undefined) ?? 'aligned';
  return maxVelocityRatio(arrangement, requireNumber(inputs, 'ST_over_D'), requireNumber(inputs, 'SL_over_D'));
}

/** Tube bank: rows in the flow direction (N_L, the method's `rows`, default 20) × tubes per row (N_T, default 1). */
export function bankTubeCount(inputs: Inputs): number {
  return bankRows(inputs) * tubesPerRow(inputs);
}

export function bankRows(inputs: Inputs): number {
  return optionalNumber(inputs, 'rows') ?? 20;
}

export function tubesPerRow(inputs: Inputs): number {
  const n = optionalNumber(inputs, 'tubes_per_row') ?? 1;
  if (!(Number.isInteger(n) && n >= 1)) throw new InputError(`input 'tubes_per_row' must be a whole number ≥ 1, got ${n}`);
  return n;
}
