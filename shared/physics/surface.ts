// External flow and free convection: a surface in a stream or a quiescent fluid at T∞. With
// a surface temperature the method runs once; with a heat flux or a heat rate (the power the
// surface must shed) the surface temperature is solved from convection plus radiation.
import { addSurfaceFlux, forward, type PointContext, type ResultRow } from './forward.js';
import { optionalNumber, requireNumber } from './point-inputs.js';
import { boilingFlag } from './properties.js';
import { radiationOutputs, radiationSpec } from './radiation.js';
import { solveSurfaceTemperature } from './surface-temperature.js';
import { InputError } from './types.js';

export function solveSurface(ctx: PointContext): ResultRow {
  const { inputs, geometry, reader } = ctx;
  const Tinf = requireNumber(inputs, 'fluid_temperature');
  const radiation = radiationSpec(optionalNumber(inputs, 'emissivity'), optionalNumber(inputs, 'surroundings_temperature'), Tinf);
  const target = shedFlux(ctx);

  let Ts = optionalNumber(inputs, 'surface_temperature');
  if (target !== undefined) {
    const solution = solveSurfaceTemperature({
      convective: (T) => {
        const f = forward(ctx, { Tfluid: Tinf, Ts: T });
        return f.h === undefined ? NaN : f.h * (T - f.Tref);
      },
      radiation,
      target,
      start: Tinf,
    });
    if (solution.status !== 'converged') {
      const flag = solution.status === 'out-of-range' ? 'out-of-range:property_temperature' : 'not-converged';
      return { method: ctx.method.id, inputs, outputs: {}, flags: [flag] };
    }
    Ts = solution.Ts;
  }
  const result = forward(ctx, { Tfluid: Tinf, Ts });
  const { row } = result;
  if (Ts === undefined || result.h === undefined) return row;
  if (target !== undefined) row.outputs.surface_temperature = Ts;
  addSurfaceFlux(result, Ts, geometry.area);
  if (radiation) Object.assign(row.outputs, radiationOutputs(radiation, Ts, row.outputs.q, geometry.area));
  const boiling = boilingFlag(reader, [Tinf, Ts]);
  if (boiling) row.flags.push(boiling);
  return row;
}

/** The flux the surface must shed: heat_flux, or heat_rate over the surface area. */
function shedFlux(ctx: PointContext): number | undefined {
  const heatFlux = optionalNumber(ctx.inputs, 'heat_flux');
  if (heatFlux !== undefined) return heatFlux;
  const heatRate = optionalNumber(ctx.inputs, 'heat_rate');
  if (heatRate === undefined) return undefined;
  const area = ctx.geometry.area;
  if (area === undefined) {
    throw new InputError(`heat_rate needs the surface area of configuration '${ctx.configuration.id}' (give its other size: ${ctx.configuration.lengthNote}, and width or length)`);
  }
  return heatRate / area;
}
