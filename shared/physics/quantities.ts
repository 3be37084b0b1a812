// Dimensional inputs a study or `solve --set` may give, with their SI unit. The study
// parser converts strings with units ("25 mm", "80 degC") to these units; anything
// else is a dimensionless group or a method switch.

export interface QuantitySpec {
  name: string;
  /** SI unit as mathjs spells it, used to check the dimension of a value with units. */
  unit: string;
  description: string;
}

export const dimensionalQuantities: QuantitySpec[] = [
  { name: 'velocity', unit: 'm/s', description: 'free-stream velocity (external flow) or mean velocity (internal flow)' },
  { name: 'flow_rate', unit: 'm^3/s', description: 'volumetric flow rate (internal flow)' },
  { name: 'diameter', unit: 'm', description: 'cylinder, sphere or tube diameter' },
  { name: 'length', unit: 'm', description: 'plate length in the flow direction, or tube/cylinder length' },
  { name: 'width', unit: 'm', description: 'plate width, or duct side a' },
  { name: 'height', unit: 'm', description: 'vertical plate height, or duct side b' },
  { name: 'characteristic_length', unit: 'm', description: 'override of the configuration\'s characteristic length' },
  { name: 'surface_temperature', unit: 'K', description: 'wall or surface temperature T_s' },
  { name: 'fluid_temperature', unit: 'K', description: 'free-stream temperature (external flow, free convection) or INLET bulk temperature (internal flow, tube banks)' },
  { name: 'heat_flux', unit: 'W/m^2', description: 'uniform wall heat flux q″ (the surface temperature then follows; internal flow: the outlet and wall temperatures follow)' },
  { name: 'heat_rate', unit: 'W', description: 'power the surface must shed (external flow, free convection): the surface temperature follows from convection plus radiation' },
  { name: 'pressure', unit: 'Pa', description: 'absolute pressure: air density scales with it; water: the boiling check uses it; other liquids refuse it' },
  { name: 'surroundings_temperature', unit: 'K', description: 'temperature of the surroundings the surface radiates to (default: fluid_temperature)' },
];

export const dimensionalNames = new Set(dimensionalQuantities.map((q) => q.name));

export function findQuantity(name: string): QuantitySpec | undefined {
  return dimensionalQuantities.find((q) => q.name === name);
}

/**
 * Dimensionless inputs the engine itself reads (not a method's): which configurations
 * accept them is in configurations.ts (`engineInputs`).
 */
export const engineInputSpecs: { name: string; description: string; unit: string; default?: number }[] = [
  { name: 'emissivity', description: 'hemispherical emissivity of the surface, 0 … 1 (radiation to the surroundings beside convection)', unit: '1', default: 0 },
  { name: 'tubes_per_row', description: 'tubes in each row across the flow, N_T (tube-bank energy balance and flow area)', unit: '1', default: 1 },
];

export const engineInputNames = new Set(engineInputSpecs.map((s) => s.name));

/** What the dimensional engine adds to a method's outputs: names, units and meanings. */
export const engineOutputSpecs: { name: string; unit: string; description: string }[] = [
  { name: 'h', unit: 'W/(m^2·K)', description: 'mean heat-transfer coefficient, Nu·k/L' },
  { name: 'h_x', unit: 'W/(m^2·K)', description: 'local heat-transfer coefficient at x = L, Nu_x·k/L' },
  { name: 'q', unit: 'W/m^2', description: 'convective heat flux from the surface into the fluid (internal flow: mean over the length)' },
  { name: 'heat_rate', unit: 'W', description: 'convective heat rate from the surface into the fluid (internal flow and tube banks: from the energy balance, ṁ·c_p·(T_out − T_in))' },
  { name: 'pressure_drop', unit: 'Pa', description: 'pressure drop over the length (internal flow) or the bank (tube banks)' },
  { name: 'property_temperature', unit: 'K', description: 'temperature at which the fluid properties were read (film, free stream or mean bulk)' },
  { name: 'surface_temperature', unit: 'K', description: 'surface temperature solved from a given heat flux or heat rate (internal flow with uniform flux: length-mean wall temperature)' },
  { name: 'adiabatic_wall_temperature', unit: 'K', description: 'T_aw = T∞ + r·U²/(2c_p), the reference temperature where viscous dissipation matters' },
  { name: 'velocity', unit: 'm/s', description: 'velocity (derived from Re when Re is given)' },
  { name: 'delta99', unit: 'm', description: 'boundary-layer thickness δ99 at x = L' },
  { name: 'Ec', unit: '1', description: 'Eckert number U²/(c_p·(T_s − T∞)), derived for the similarity solutions' },
  { name: 'outlet_temperature', unit: 'K', description: 'bulk temperature at the outlet, from the energy balance' },
  { name: 'mean_bulk_temperature', unit: 'K', description: '(T_in + T_out)/2, where the bulk properties are read' },
  { name: 'mass_flow', unit: 'kg/s', description: 'mass flow rate ṁ (from the velocity or flow rate at the inlet, or from Re)' },
  { name: 'log_mean_temperature_difference', unit: 'K', description: 'ΔT_lm = (ΔT_in − ΔT_out)/ln(ΔT_in/ΔT_out), uniform wall temperature (heat_rate = h·A·ΔT_lm)' },
  { name: 'surface_temperature_outlet', unit: 'K', description: 'wall temperature at the outlet, T_out + q″/h: the hottest wall point under a uniform heat flux' },
  { name: 'h_radiation', unit: 'W/(m^2·K)', description: 'radiative coefficient εσ(T_s² + T_sur²)(T_s + T_sur)' },
  { name: 'q_radiation', unit: 'W/m^2', description: 'radiative heat flux εσ(T_s⁴ − T_sur⁴) from the surface to the surroundings' },
  { name: 'q_total', unit: 'W/m^2', description: 'convective plus radiative heat flux' },
  { name: 'heat_rate_radiation', unit: 'W', description: 'radiative heat rate over the surface area' },
  { name: 'heat_rate_total', unit: 'W', description: 'convective plus radiative heat rate' },
  { name: 'radiation_fraction', unit: '1', description: 'share of radiation in the total heat flux, q_radiation/q_total' },
  { name: 'surface_area', unit: 'm^2', description: 'heated surface area the heat rates use' },
];
