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
  { name: 'fluid_temperature', unit: 'K', description: 'free-stream (external, free) or bulk (internal) temperature' },
  { name: 'heat_flux', unit: 'W/m^2', description: 'uniform wall heat flux q″ (surface temperature then follows)' },
  { name: 'pressure', unit: 'Pa', description: 'absolute pressure (air: density scales with it; liquids: ignored)' },
  { name: 'inner_diameter', unit: 'm', description: 'annulus: outer diameter of the inner tube, D_i' },
  { name: 'outer_diameter', unit: 'm', description: 'annulus: inner diameter of the outer tube, D_o' },
  { name: 'gap', unit: 'm', description: 'parallel plates, vertical channel, heat-sink fins: spacing S; enclosure: distance between hot and cold walls' },
  { name: 'fin_count', unit: '1', description: 'heat sink: number of fins N' },
  { name: 'fin_height', unit: 'm', description: 'heat sink: fin projection from the base' },
  { name: 'fin_thickness', unit: 'm', description: 'heat sink: fin thickness t' },
  { name: 'fin_conductivity', unit: 'W/(m K)', description: 'heat sink: thermal conductivity of the fin material' },
  { name: 'radius', unit: 'm', description: 'impinging jet: radius of the disc the average covers (single nozzle)' },
  { name: 'pitch', unit: 'm', description: 'impinging jet: nozzle pitch (arrays)' },
];

export const dimensionalNames = new Set(dimensionalQuantities.map((q) => q.name));

export function findQuantity(name: string): QuantitySpec | undefined {
  return dimensionalQuantities.find((q) => q.name === name);
}
