// Fluid properties: the catalogue (air, water, engine oil, ethylene glycol) and user fluids.
export { catalogueFluids, fluidNames, getFluid } from './catalogue.js';
export { makeConstantFluid, type ConstantFluidOptions } from './constantFluid.js';
export {
  makeTableFluid,
  type FluidColumns,
  type FluidTableData,
  type TableFluidOptions,
  type TableRow,
} from './tableFluid.js';
export { FluidRangeError, type Fluid, type FluidProperties } from './types.js';
