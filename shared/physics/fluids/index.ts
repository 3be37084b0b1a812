// Fluid properties: the catalogue (air, water, engine oil, ethylene glycol, sodium; glycol–water
// solutions and humid air with their parameters), user fluids, and specs that name them.
export {
  catalogueFluids,
  fluidNames,
  getFluid,
  parametricFluids,
  type FluidParameter,
  type ParametricFluid,
} from './catalogue.js';
export { makeConstantFluid, type ConstantFluidOptions } from './constantFluid.js';
export { resolveFluidSpec, type FluidParameters, type FluidSpec } from './spec.js';
export {
  makeTableFluid,
  type FluidColumns,
  type FluidTableData,
  type TableFluidOptions,
  type TableRow,
} from './tableFluid.js';
export { FluidRangeError, type Fluid, type FluidProperties } from './types.js';
