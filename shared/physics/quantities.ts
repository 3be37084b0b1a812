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
  { name: 'inner_diameter', unit: 'm', description: 'annulus: outer diameter of the inner tube, D_i' },
  { name: 'outer_diameter', unit: 'm', description: 'annulus: inner diameter of the outer tube, D_o' },
  { name: 'gap', unit: 'm', description: 'parallel plates, vertical channel, heat-sink fins: spacing S; enclosure: distance between hot and cold walls' },
  { name: 'fin_count', unit: '1', description: 'heat sink: number of fins N' },
  { name: 'fin_height', unit: 'm', description: 'heat sink: fin projection from the base' },
  { name: 'fin_thickness', unit: 'm', description: 'heat sink: fin thickness t' },
  { name: 'fin_conductivity', unit: 'W/(m K)', description: 'heat sink: thermal conductivity of the fin material' },
  { name: 'radius', unit: 'm', description: 'impinging jet: radius of the disc the average covers (single nozzle)' },
  { name: 'pitch', unit: 'm', description: 'impinging jet: nozzle pitch (arrays)' },
  { name: 'roughness', unit: 'm', description: 'pipe: absolute wall roughness ε (the Colebrook friction factor, and Gnielinski with it)' },
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
  { name: 'optimum_gap', unit: 'm', description: 'plate or fin spacing that maximises the heat from a given base width at this height and temperature difference' },
  { name: 'fin_efficiency', unit: '1', description: 'heat sink: tanh(mL_c)/(mL_c), a fin\'s heat over what it would shed at the base temperature' },
  { name: 'fin_parameter', unit: '1', description: 'heat sink: mL_c with m = (2h/(k_f t))^½ and L_c = fin_height + t/2' },
  { name: 'overall_efficiency', unit: '1', description: 'heat sink: 1 − (N A_f/A_t)(1 − η_f), fins and base together' },
  { name: 'base_width', unit: 'm', description: 'heat sink: N t + (N − 1) S' },
  { name: 'radiating_area', unit: 'm^2', description: 'heat sink: envelope that radiates, W L + 2 H_f L' },
  { name: 'thermal_resistance', unit: 'K/W', description: 'heat sink: (T_base − T_air)/heat_rate_total, base to air' },
  { name: 'channel_velocity', unit: 'm/s', description: 'heat sink, forced flow: velocity between the fins, V(1 + t/S)' },
];
