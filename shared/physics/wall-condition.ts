// Which wall condition a dimensional point poses, and what that means for each method:
// a given heat flux selects a method's flux form (`wall_condition: flux`), a method without
// one says so (`no-flux-form`) instead of silently giving its isothermal value; and the
// heating/cooling switch of Dittus–Boelter follows the sign of T_s − T_b.
import { InputError, type Flag, type Inputs, type Method, type WallCondition } from './types.js';

/** A point's inputs contradict each other in a way only its values show (e.g. heating: true with a cooled wall). */
export class PointConflictError extends InputError {
  constructor(
    message: string,
    /** The flag a sweep stores instead of numbers, e.g. `conflict:heating`. */
    readonly flag: Flag,
  ) {
    super(message);
    this.name = 'PointConflictError';
  }
}

/** The wall conditions a method covers: its `wall_condition` choices, its declared list, or both. */
export function wallConditionsOf(method: Method): readonly WallCondition[] {
  const input = method.inputs.find((s) => s.name === 'wall_condition');
  if (input?.choices) return input.choices as WallCondition[];
  return method.wallConditions ?? ['temperature', 'flux'];
}

/**
 * The method inputs a wall condition sets (`wall_condition` where the method has it) and
 * the flag when the method has no form for it. A point that fixes `wall_condition` itself
 * must agree with what its temperatures or flux say.
 */
export function applyWallCondition(method: Method, condition: WallCondition, inputs: Inputs): { set: Inputs; flags: Flag[] } {
  const given = inputs.wall_condition;
  if (given !== undefined && given !== condition) {
    throw new PointConflictError(
      `wall_condition: '${String(given)}' contradicts the point, which gives ${condition === 'flux' ? 'a heat flux' : 'a surface temperature'}; remove wall_condition (it follows from the inputs)`,
      'conflict:wall_condition',
    );
  }
  const hasInput = method.inputs.some((s) => s.name === 'wall_condition');
  if (!wallConditionsOf(method).includes(condition)) {
    return { set: {}, flags: [condition === 'flux' ? 'no-flux-form' : 'no-temperature-form'] };
  }
  return { set: hasInput ? { wall_condition: condition } : {}, flags: [] };
}

/**
 * `heating` for methods that distinguish it (Dittus–Boelter n = 0.4 / 0.3): true when the
 * wall heats the fluid. A value the point fixes must agree with the temperatures.
 */
export function applyHeating(method: Method, heats: boolean | undefined, inputs: Inputs): Inputs {
  if (heats === undefined || !method.inputs.some((s) => s.name === 'heating')) return {};
  const given = inputs.heating;
  if (given !== undefined && given !== heats) {
    throw new PointConflictError(
      `heating: ${String(given)} contradicts the temperatures (the wall ${heats ? 'heats' : 'cools'} the fluid); remove heating (it follows from T_s − T_b)`,
      'conflict:heating',
    );
  }
  return { heating: heats };
}
