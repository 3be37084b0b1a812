// The physical situations Filmsweep knows. A configuration fixes the characteristic
// length, the temperature at which fluid properties are read, and the heated area, so
// that the dimensional engine (engine.ts) can turn velocities, sizes and temperatures
// into Re, Pr, Gr, Ra and back into h, q and the heat rate.

export type Regime = 'external' | 'internal' | 'free';

/** Where properties are evaluated: film (T_s+T_∞)/2, free stream T_∞, or bulk T_b. */
export type PropertyRule = 'film' | 'free-stream' | 'bulk';

export interface Configuration {
  id: string;
  title: string;
  description: string;
  regime: Regime;
  /** Words for the characteristic length used in Re, Nu and Gr. */
  lengthNote: string;
  /** Default property temperature rule for methods of this configuration. */
  propertyRule: PropertyRule;
  /** Dimensional inputs this configuration understands (besides the common ones). */
  dimensionalInputs: string[];
  /** What the dimensional inputs mean here, where it differs from the obvious (shown by `methods`). */
  conventions?: string;
  /** Outputs the configuration's own output extension adds (extensions.ts), shown with the engine's. */
  extensionOutputs?: string[];
}

export const configurations: Configuration[] = [
  {
    id: 'flat-plate',
    title: 'Flat plate in parallel flow',
    description: 'Forced flow along an isothermal or uniform-flux flat plate, zero pressure gradient.',
    regime: 'external',
    lengthNote: 'plate length L in the flow direction (local methods: x = L)',
    propertyRule: 'film',
    dimensionalInputs: ['velocity', 'length', 'width'],
  },
  {
    id: 'wedge',
    title: 'Wedge flow (Falkner–Skan)',
    description: 'Laminar boundary layer under an outer flow U = C x^m; Blasius is m = 0, stagnation m = 1.',
    regime: 'external',
    lengthNote: 'distance x from the leading edge; velocity is the local outer velocity U(x)',
    propertyRule: 'film',
    dimensionalInputs: ['velocity', 'length', 'width'],
  },
  {
    id: 'cylinder',
    title: 'Circular cylinder in cross flow',
    description: 'A single long cylinder normal to a uniform stream.',
    regime: 'external',
    lengthNote: 'diameter D',
    propertyRule: 'film',
    dimensionalInputs: ['velocity', 'diameter', 'length'],
  },
  {
    id: 'sphere',
    title: 'Sphere in a uniform stream',
    description: 'Forced convection from a single sphere.',
    regime: 'external',
    lengthNote: 'diameter D',
    propertyRule: 'free-stream',
    dimensionalInputs: ['velocity', 'diameter'],
  },
  {
    id: 'tube-bank',
    title: 'Bank of tubes in cross flow',
    description: 'Aligned or staggered tube bundle; Re on the maximum velocity between tubes.',
    regime: 'external',
    lengthNote: 'tube diameter D; Re uses the maximum velocity V_max',
    propertyRule: 'free-stream',
    dimensionalInputs: ['velocity', 'diameter', 'length'],
    conventions:
      'fluid_temperature is the INLET temperature of the stream; velocity is the approach velocity upstream of the bank. ' +
      'The outlet follows from the bank energy balance T_s − T_o = (T_s − T_i)·exp(−πDNh̄/(ρVN_T S_T c_p)) with N = rows·tubes_per_row; ' +
      'properties at the mean of inlet and outlet, Pr_s at the surface. length is the tube length (heat_rate needs it).',
  },
  {
    id: 'pipe',
    title: 'Circular pipe, internal flow',
    description: 'Fully developed and entry-region flow in a circular tube, smooth or (with roughness) commercially rough.',
    regime: 'internal',
    lengthNote: 'inner diameter D',
    propertyRule: 'bulk',
    dimensionalInputs: ['velocity', 'flow_rate', 'diameter', 'length', 'roughness'],
    conventions:
      'fluid_temperature is the INLET bulk temperature. With surface_temperature (uniform wall temperature) the outlet follows from ' +
      'T_s − T_out = (T_s − T_in)·exp(−h̄PL/(ṁc_p)); with heat_flux (uniform flux) from T_out = T_in + q″PL/(ṁc_p). Bulk properties at ' +
      '(T_in + T_out)/2, wall properties at the wall. velocity and flow_rate are taken at the inlet (ṁ = ρ_in·u·A). Without length: no ' +
      'energy balance, properties at the inlet temperature. roughness (absolute ε, with units) gives relative_roughness = ε/D: the Colebrook f.',
  },
  {
    id: 'duct',
    title: 'Rectangular duct, internal flow',
    description: 'Smooth rectangular duct; Re and Nu on the hydraulic diameter.',
    regime: 'internal',
    lengthNote: 'hydraulic diameter D_h = 2ab/(a+b)',
    propertyRule: 'bulk',
    dimensionalInputs: ['velocity', 'flow_rate', 'width', 'height', 'length'],
    conventions:
      'fluid_temperature is the INLET bulk temperature. With surface_temperature (uniform wall temperature) the outlet follows from ' +
      'T_s − T_out = (T_s − T_in)·exp(−h̄PL/(ṁc_p)); with heat_flux (uniform flux) from T_out = T_in + q″PL/(ṁc_p). Bulk properties at ' +
      '(T_in + T_out)/2, wall properties at the wall. velocity and flow_rate are taken at the inlet (ṁ = ρ_in·u·A). Without length: no ' +
      'energy balance, properties at the inlet temperature.',
  },
  {
    id: 'vertical-plate',
    title: 'Vertical plate, free convection',
    description: 'Isothermal vertical plate in a quiescent fluid.',
    regime: 'free',
    lengthNote: 'plate height L (local methods: x = L)',
    propertyRule: 'film',
    dimensionalInputs: ['height', 'width'],
  },
  {
    id: 'horizontal-plate',
    title: 'Horizontal plate, free convection',
    description: 'Upper or lower face of a heated or cooled horizontal plate.',
    regime: 'free',
    lengthNote: 'L = A/P, surface area over perimeter',
    propertyRule: 'film',
    dimensionalInputs: ['length', 'width'],
  },
  {
    id: 'horizontal-cylinder',
    title: 'Horizontal cylinder, free convection',
    description: 'Long isothermal horizontal cylinder in a quiescent fluid.',
    regime: 'free',
    lengthNote: 'diameter D',
    propertyRule: 'film',
    dimensionalInputs: ['diameter', 'length'],
  },
  {
    id: 'sphere-free',
    title: 'Sphere, free convection',
    description: 'Isothermal sphere in a quiescent fluid.',
    regime: 'free',
    lengthNote: 'diameter D',
    propertyRule: 'film',
    dimensionalInputs: ['diameter'],
  },
  {
    id: 'annulus',
    title: 'Concentric annulus, internal flow',
    description: 'Flow between two concentric tubes, one wall heated (heated_wall inner or outer) and the other insulated.',
    regime: 'internal',
    lengthNote: 'hydraulic diameter D_h = D_o − D_i',
    propertyRule: 'bulk',
    dimensionalInputs: ['velocity', 'flow_rate', 'inner_diameter', 'outer_diameter', 'length'],
    conventions:
      'fluid_temperature is the INLET bulk temperature; the outlet follows from the energy balance over the heated area (surface_temperature: uniform wall temperature; heat_flux: uniform flux), bulk properties at (T_in + T_out)/2. The heated area is the heated wall only: π·D_i·length (heated_wall inner, the default) or π·D_o·length (outer); surface_temperature and heat_flux are that wall\'s. diameter_ratio = D_i/D_o and L_over_D = length/D_h follow from the sizes.',
  },
  {
    id: 'parallel-plates',
    title: 'Parallel-plate channel, internal flow',
    description: 'Flow between two wide parallel plates a gap apart, one or both walls heated.',
    regime: 'internal',
    lengthNote: 'hydraulic diameter D_h = 2·gap',
    propertyRule: 'bulk',
    dimensionalInputs: ['velocity', 'flow_rate', 'gap', 'width', 'length'],
    conventions:
      'fluid_temperature is the INLET bulk temperature; the outlet follows from the energy balance over the heated area (surface_temperature: uniform wall temperature; heat_flux: uniform flux), bulk properties at (T_in + T_out)/2. width is the plates\' extent across the flow (needed with length): the flow area is gap·width, the heated area 2·width·length (heated_walls both) or width·length (one).',
  },
  {
    id: 'vertical-channel',
    title: 'Vertical parallel-plate channel, free convection',
    description: 'Two isothermal vertical plates a gap apart, open at top and bottom: a fin array or card-cage channel.',
    regime: 'free',
    lengthNote: 'plate spacing S (gap); the height L enters through S/L',
    propertyRule: 'film',
    dimensionalInputs: ['gap', 'height', 'width'],
    conventions:
      'surface_temperature is the plates\' temperature, fluid_temperature the ambient air below the channel; Ra on the gap. width (optional) gives heat_rate over 2·height·width (heated_walls both) or height·width (one). optimum_gap = S_opt in metres. No radiation (the plates face each other).',
    extensionOutputs: ['optimum_gap'],
  },
  {
    id: 'plate-fin-heat-sink',
    title: 'Plate-fin heat sink',
    description:
      'A base with N straight rectangular fins: channel h from free convection (vertical fins) or forced flow along the fins, fin efficiency, heat rate and base-to-air thermal resistance.',
    regime: 'free',
    lengthNote: 'fin spacing S (gap); the fin length L along the flow enters through S/L',
    propertyRule: 'film',
    dimensionalInputs: ['fin_count', 'fin_height', 'fin_thickness', 'gap', 'length', 'fin_conductivity', 'velocity'],
    conventions:
      'surface_temperature is the BASE temperature, fluid_temperature the ambient air. Free convection (no velocity): vertical fins, length the fin length upward, Ra on the gap. Forced (velocity = approach velocity along the fins): Re on the gap with the channel velocity V(1 + t/S). Every wetted surface gets the channel h; heat_rate = η_o·h·A_t·(T_b − T_air) with the fin efficiency of straight fins (L_c = fin_height + t/2). emissivity: radiation from the envelope (fin-tip plane W·L and the two outer fin faces) at the base temperature. thermal_resistance = (T_b − T_air)/heat_rate_total. heat_flux and heat_rate are not accepted (give the base temperature).',
    extensionOutputs: ['fin_efficiency', 'fin_parameter', 'overall_efficiency', 'base_width', 'radiating_area', 'thermal_resistance', 'optimum_gap', 'channel_velocity'],
  },
  {
    id: 'enclosure',
    title: 'Rectangular enclosure, free convection',
    description:
      'A closed cavity with one hot and one cold wall a gap apart (surface_temperature the hot wall, fluid_temperature the cold wall), vertical, horizontal or tilted.',
    regime: 'free',
    lengthNote: 'gap L between the hot and cold walls',
    propertyRule: 'film',
    dimensionalInputs: ['gap', 'height', 'width'],
    conventions:
      'surface_temperature is the HOT wall, fluid_temperature the COLD wall; properties at their mean. gap is the distance between them, height their extent (H/L), width the other extent: heat_rate crosses height·width. The tilt (degrees from horizontal) is a method input. emissivity is the effective emissivity of the pair of walls, 1/(1/ε_1 + 1/ε_2 − 1), with the cold wall as the surroundings by default.',
  },
  {
    id: 'inclined-plate',
    title: 'Inclined plate, free convection',
    description: 'Isothermal flat plate tilted from vertical, hot side facing down or up.',
    regime: 'free',
    lengthNote: 'plate length L along the slope',
    propertyRule: 'film',
    dimensionalInputs: ['length', 'width'],
    conventions:
      'length is the plate length along the slope (Ra on it, full g), width across; width_over_length follows (needed for hot_side up). The tilt (degrees from vertical) and hot_side are method inputs.',
  },
  {
    id: 'impinging-jet',
    title: 'Impinging round jets',
    description: 'A single round gas jet or an array of them impinging normally on a flat surface.',
    regime: 'external',
    lengthNote: 'nozzle diameter D; Re on the nozzle exit velocity',
    propertyRule: 'film',
    dimensionalInputs: ['velocity', 'diameter', 'height', 'radius', 'pitch', 'length', 'width'],
    conventions:
      'velocity is the nozzle exit velocity, diameter the nozzle diameter, height the nozzle-to-surface distance; radius (single nozzle) is the disc the average covers and gives heat_rate over π·radius²; pitch (arrays) the nozzle spacing, with heat_rate over length·width.',
  },
];

/** Inputs every dimensional study may use, whatever the configuration. */
export const commonDimensionalInputs = ['surface_temperature', 'fluid_temperature', 'heat_flux', 'pressure'];

/** Whether radiation to the surroundings is offered: external flow and free convection (a bank's tubes see each other, so not there). */
export function radiates(c: Configuration): boolean {
  return (c.regime === 'external' || c.regime === 'free') && c.id !== 'tube-bank';
}

/** Whether the engine closes an energy balance along the flow (fluid_temperature is then the inlet). */
export function hasEnergyBalance(c: Configuration): boolean {
  return c.regime === 'internal' || c.id === 'tube-bank';
}

/** Every dimensional input a study may give for the configuration. */
export function dimensionalInputsOf(c: Configuration): string[] {
  const radiation = radiates(c) ? ['surroundings_temperature', 'heat_rate'] : [];
  return [...new Set([...c.dimensionalInputs, ...commonDimensionalInputs, ...radiation, 'characteristic_length'])];
}

/** Dimensionless inputs the engine itself reads for the configuration (quantities.ts engineInputSpecs). */
export function engineInputsOf(c: Configuration): string[] {
  return [...(radiates(c) ? ['emissivity'] : []), ...(c.id === 'tube-bank' ? ['tubes_per_row'] : [])];
}

/** Outputs the dimensional engine adds for the configuration (quantities.ts engineOutputSpecs). */
export function engineOutputsOf(c: Configuration): string[] {
  const common = ['h', 'q', 'heat_rate', 'property_temperature', 'surface_temperature', 'surface_area'];
  if (hasEnergyBalance(c)) {
    const balance = ['outlet_temperature', 'mean_bulk_temperature', 'mass_flow', 'log_mean_temperature_difference', 'pressure_drop'];
    return [...common, ...balance, ...(c.regime === 'internal' ? ['surface_temperature_outlet'] : [])];
  }
  const radiation = radiates(c) ? ['h_radiation', 'q_radiation', 'q_total', 'heat_rate_radiation', 'heat_rate_total', 'radiation_fraction'] : [];
  const local = c.regime === 'external' ? ['h_x', 'velocity', 'adiabatic_wall_temperature', 'delta99', 'Ec'] : ['h_x', 'delta99'];
  return [...common, ...local, ...radiation, ...(c.extensionOutputs ?? [])];
}

/** The configuration as the catalogue shows it (`methods --json`, the dashboard): with its full input and output lists. */
export function describeConfiguration(c: Configuration) {
  return { ...c, dimensionalInputs: dimensionalInputsOf(c), engineInputs: engineInputsOf(c), engineOutputs: engineOutputsOf(c) };
}

export const configurationIds = configurations.map((c) => c.id);

export function findConfiguration(id: string): Configuration | undefined {
  return configurations.find((c) => c.id === id);
}
