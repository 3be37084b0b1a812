// The dimensional side of the newer configurations (annulus, parallel plates, vertical
// channel, plate-fin heat sink, enclosure, inclined plate, impinging jet), registered in
// the engine's extension maps (extensions.ts): sizes → characteristic length, areas and the
// dimensionless groups their methods take, and the heat sink's own outputs (fin efficiency,
// heat rates, thermal resistance, optimum spacing). engine.ts imports this module once.
import { heatSinkPerformance, channelVelocityRatio, type HeatSinkGeometry } from './correlations/plate-fin-heat-sink.js';
import { derivableExtensions, geometryExtensions, outputExtensions, type GeometryBuilder } from './extensions.js';
import { STEFAN_BOLTZMANN } from './radiation.js';
import { InputError, type Inputs, type Outputs } from './types.js';

const num = (inputs: Inputs, name: string): number | undefined => {
  const v = inputs[name];
  if (v === undefined) return undefined;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`input '${name}': expected a finite number, got ${JSON.stringify(v)}`);
  return v;
};
const positive = (name: string, v: number) => {
  if (!(v > 0)) throw new InputError(`input '${name}' must be > 0, got ${v}`);
  return v;
};
/** Names from `group` derivable when every size in `from` is given. */
const when = (have: ReadonlySet<string>, from: string[], group: string) => (from.every((n) => have.has(n)) ? [group] : []);

// ---------------------------------------------------------------- annulus

const annulus: GeometryBuilder = (inputs, need) => {
  const Di = positive('inner_diameter', need('inner_diameter', num(inputs, 'inner_diameter')));
  const Do = positive('outer_diameter', need('outer_diameter', num(inputs, 'outer_diameter')));
  if (!(Di < Do)) throw new InputError(`annulus: inner_diameter (${Di} m) must be smaller than outer_diameter (${Do} m)`);
  const Dh = Do - Di;
  const L = num(inputs, 'length');
  // The heated wall's perimeter carries the heat; the other wall is insulated.
  const perimeter = Math.PI * ((inputs.heated_wall ?? 'inner') === 'outer' ? Do : Di);
  return {
    length: num(inputs, 'characteristic_length') ?? Dh,
    flowArea: (Math.PI / 4) * (Do * Do - Di * Di),
    perimeter,
    flowLength: L,
    area: L !== undefined ? perimeter * L : undefined,
    L_over_D: L !== undefined ? L / Dh : undefined,
    groups: { diameter_ratio: Di / Do },
  };
};

// ---------------------------------------------------------------- parallel plates

const parallelPlates: GeometryBuilder = (inputs, need) => {
  const gap = positive('gap', need('gap', num(inputs, 'gap')));
  const L = num(inputs, 'length');
  // The energy balance needs the channel's width (flow area and heated area both scale with it).
  const W = L !== undefined ? need('width', num(inputs, 'width')) : num(inputs, 'width');
  const walls = (inputs.heated_walls ?? 'both') === 'one' ? 1 : 2;
  const Dh = 2 * gap;
  return {
    length: num(inputs, 'characteristic_length') ?? Dh,
    flowArea: W !== undefined ? gap * W : undefined,
    perimeter: W !== undefined ? walls * W : undefined,
    flowLength: L,
    area: L !== undefined && W !== undefined ? walls * W * L : undefined,
    L_over_D: L !== undefined ? L / Dh : undefined,
  };
};

// ---------------------------------------------------------------- vertical channel

const verticalChannel: GeometryBuilder = (inputs, need) => {
  // Facing plates mostly see each other: radiation to the surroundings is not modelled here.
  if (inputs.emissivity !== undefined) {
    throw new InputError("vertical-channel: radiation between facing plates is not modelled; leave out 'emissivity' (plate-fin-heat-sink radiates from its envelope)");
  }
  const S = positive('gap', need('gap', num(inputs, 'gap')));
  const H = positive('height', need('height', num(inputs, 'height')));
  const W = num(inputs, 'width');
  const walls = (inputs.heated_walls ?? 'both') === 'one' ? 1 : 2;
  return { length: num(inputs, 'characteristic_length') ?? S, area: W !== undefined ? walls * H * W : undefined, groups: { gap_over_height: S / H } };
};

/** The optimum spacing in metres from the method's S_opt/L. */
const optimumGap = (lengthName: 'height' | 'length') => (ctx: { inputs: Inputs; outputs: Outputs }) => {
  const ratio = ctx.outputs.optimum_gap_over_height;
  const L = num(ctx.inputs, lengthName);
  return ratio !== undefined && L !== undefined ? { outputs: { optimum_gap: ratio * L } } : {};
};

// ---------------------------------------------------------------- plate-fin heat sink

function heatSinkGeometry(inputs: Inputs, need: (name: string, v: number | undefined) => number): HeatSinkGeometry {
  const read = (name: keyof HeatSinkGeometry) => need(name, num(inputs, name));
  return {
    fin_count: read('fin_count'),
    fin_height: read('fin_height'),
    fin_thickness: read('fin_thickness'),
    gap: read('gap'),
    length: read('length'),
    fin_conductivity: read('fin_conductivity'),
  };
}

const plateFinHeatSink: GeometryBuilder = (inputs, need) => {
  // The fins' heat follows from the base temperature through the fin efficiency; a heat flux or
  // a power to shed would need that fin model inside the surface-temperature solve.
  for (const name of ['heat_flux', 'heat_rate']) {
    if (inputs[name] !== undefined) {
      throw new InputError(
        `plate-fin-heat-sink: give the base temperature as surface_temperature, not '${name}'; the result's thermal_resistance gives the base temperature for a power: T_base ≈ T_air + Q·R`,
      );
    }
  }
  const g = heatSinkGeometry(inputs, need);
  const velocity = num(inputs, 'velocity');
  return {
    length: num(inputs, 'characteristic_length') ?? g.gap,
    // No single heated area: the engine gives h and q; the output extension the heat rates.
    groups: { gap_over_length: g.gap / g.length },
    velocityRatio: velocity !== undefined ? channelVelocityRatio(g.fin_thickness, g.gap) : undefined,
  };
};

function heatSinkOutputs(ctx: { inputs: Inputs; outputs: Outputs }) {
  const { inputs, outputs } = ctx;
  const need = (name: string, v: number | undefined) => {
    if (v === undefined) throw new InputError(`plate-fin-heat-sink needs input '${name}'`);
    return v;
  };
  const g = heatSinkGeometry(inputs, need);
  const h = outputs.h;
  const Tb = outputs.surface_temperature ?? num(inputs, 'surface_temperature');
  const Tair = num(inputs, 'fluid_temperature');
  if (h === undefined || Tb === undefined || Tair === undefined) return {};
  const p = heatSinkPerformance(g, h, Tb - Tair);
  const out: Outputs = {
    fin_efficiency: p.fin_efficiency,
    fin_parameter: p.fin_parameter,
    overall_efficiency: p.overall_efficiency,
    base_width: p.base_width,
    surface_area: p.convective_area,
    heat_rate: p.convective_heat_rate,
  };
  // Radiation from the envelope (fin-tip plane and the two outer fin faces) at the base
  // temperature: the channel walls mostly see each other (common practice; the open channels
  // radiate more like cavities, so ε there is conservative).
  let radiated = 0;
  const emissivity = num(inputs, 'emissivity');
  if (emissivity !== undefined && emissivity > 0) {
    const Tsur = num(inputs, 'surroundings_temperature') ?? Tair;
    radiated = emissivity * STEFAN_BOLTZMANN * (Tb ** 4 - Tsur ** 4) * p.radiating_area;
    out.radiating_area = p.radiating_area;
    out.heat_rate_radiation = radiated;
  }
  const total = p.convective_heat_rate + radiated;
  out.heat_rate_total = total;
  if (total !== 0) {
    out.radiation_fraction = radiated / total;
    out.thermal_resistance = (Tb - Tair) / total;
  }
  if (outputs.optimum_gap_over_height !== undefined) out.optimum_gap = outputs.optimum_gap_over_height * g.length;
  if (inputs.velocity !== undefined) out.channel_velocity = (inputs.velocity as number) * channelVelocityRatio(g.fin_thickness, g.gap);
  return { outputs: out };
}

// ---------------------------------------------------------------- enclosure, inclined plate, jets

const enclosure: GeometryBuilder = (inputs, need) => {
  const gap = positive('gap', need('gap', num(inputs, 'gap')));
  const H = num(inputs, 'height');
  const W = num(inputs, 'width');
  return {
    length: num(inputs, 'characteristic_length') ?? gap,
    area: H !== undefined && W !== undefined ? H * W : undefined,
    groups: H !== undefined ? { height_over_gap: positive('height', H) / gap } : undefined,
  };
};

const inclinedPlate: GeometryBuilder = (inputs, need) => {
  const L = positive('length', need('length', num(inputs, 'length')));
  const W = num(inputs, 'width');
  return {
    length: num(inputs, 'characteristic_length') ?? L,
    area: W !== undefined ? L * W : undefined,
    groups: W !== undefined ? { width_over_length: positive('width', W) / L } : undefined,
  };
};

const impingingJet: GeometryBuilder = (inputs, need) => {
  const D = positive('diameter', need('diameter', num(inputs, 'diameter')));
  const groups: Record<string, number> = {};
  const H = num(inputs, 'height');
  const r = num(inputs, 'radius');
  const S = num(inputs, 'pitch');
  if (H !== undefined) groups.H_over_D = positive('height', H) / D;
  if (r !== undefined) groups.r_over_D = positive('radius', r) / D;
  if (S !== undefined) groups.pitch_over_D = positive('pitch', S) / D;
  // Single nozzle: the disc of radius r the average covers; arrays: the plate the array serves.
  const single = (inputs.nozzles ?? 'single') === 'single';
  const L = num(inputs, 'length');
  const W = num(inputs, 'width');
  const area = single ? (r !== undefined ? Math.PI * r * r : undefined) : L !== undefined && W !== undefined ? L * W : undefined;
  return { length: num(inputs, 'characteristic_length') ?? D, area, groups };
};

// ---------------------------------------------------------------- registration

geometryExtensions.set('annulus', annulus);
geometryExtensions.set('parallel-plates', parallelPlates);
geometryExtensions.set('vertical-channel', verticalChannel);
geometryExtensions.set('plate-fin-heat-sink', plateFinHeatSink);
geometryExtensions.set('enclosure', enclosure);
geometryExtensions.set('inclined-plate', inclinedPlate);
geometryExtensions.set('impinging-jet', impingingJet);

outputExtensions.set('vertical-channel', optimumGap('height'));
outputExtensions.set('plate-fin-heat-sink', heatSinkOutputs);

// The pipe's geometry is built in geometry.ts; its roughness group is derivable like the others.
derivableExtensions.set('pipe', (have) => when(have, ['roughness', 'diameter'], 'relative_roughness'));
derivableExtensions.set('annulus', (have) => [...when(have, ['inner_diameter', 'outer_diameter'], 'diameter_ratio'), ...when(have, ['length'], 'L_over_D')]);
derivableExtensions.set('parallel-plates', (have) => when(have, ['length'], 'L_over_D'));
derivableExtensions.set('vertical-channel', (have) => when(have, ['gap', 'height'], 'gap_over_height'));
derivableExtensions.set('plate-fin-heat-sink', (have) => [...when(have, ['gap', 'length'], 'gap_over_length'), ...when(have, ['velocity'], 'Re')]);
derivableExtensions.set('enclosure', (have) => when(have, ['gap', 'height'], 'height_over_gap'));
derivableExtensions.set('inclined-plate', (have) => when(have, ['length', 'width'], 'width_over_length'));
derivableExtensions.set('impinging-jet', (have) => [
  ...when(have, ['height', 'diameter'], 'H_over_D'),
  ...when(have, ['radius', 'diameter'], 'r_over_D'),
  ...when(have, ['pitch', 'diameter'], 'pitch_over_D'),
]);
