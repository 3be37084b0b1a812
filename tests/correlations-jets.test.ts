// Martin's impinging-jet correlations: hand calculations from the published equations
// (Martin 1977, as given in Incropera et al., 7th ed., §7.7; from memory), the relative
// nozzle area of each array layout from its geometry, and the published ranges as flags.
import { describe, expect, it } from 'vitest';
import { methodsFor } from '../shared/physics/catalogue.js';
import { impingingJetMethods, relativeNozzleArea } from '../shared/physics/correlations/impinging-jet.js';
import { InputError, type Inputs } from '../shared/physics/types.js';

const martin = impingingJetMethods[0];
const run = (inputs: Inputs) => martin.evaluate(inputs);

describe('impinging-jet: martin', () => {
  it('is the one registered method, with complete metadata', () => {
    expect(methodsFor('impinging-jet').map((m) => m.id)).toEqual(['martin']);
    expect(martin.version).toBe(1);
    expect(martin.source).toMatch(/Martin, H\. \(1977\)/);
    expect(martin.uncertainty.fraction).toBeGreaterThan(0);
  });

  it('single nozzle: hand calculation at Re = 1e4, Pr = 0.7, H/D = 5, r/D = 5', () => {
    // G = 0.2·(1 − 0.22)/(1 + 0.1·(5 − 6)·0.2) = 0.159 184; F1 = 2·100·(1 + 0.005·158.489)^½ = 267.765;
    // Pr^0.42 = 0.860 877; Nu = 0.860 877·0.159 184·267.765 = 36.694 (calculator).
    const r = run({ Re: 1e4, Pr: 0.7, H_over_D: 5, r_over_D: 5 });
    expect(r.outputs.Nu).toBeCloseTo(36.694, 2);
    expect(r.flags).toEqual([]);
  });

  it('square array: hand calculation at Re = 2e4, Pr = 0.7, H/D = 4, S/D = 6', () => {
    // A_r = π/(4·36) = 0.021 817; A_r^½ = 0.147 704; K = [1 + (4/(0.6/0.147 704))^6]^−0.05 = 0.968 122;
    // G = 2·0.147 704·(1 − 0.324 950)/(1 + 0.2·(−2)·0.147 704) = 0.211 938; F2 = 0.5·2e4^⅔ = 368.403;
    // Nu = 0.860 877·0.968 122·0.211 938·368.403 = 65.073 (calculator).
    const r = run({ Re: 2e4, Pr: 0.7, H_over_D: 4, nozzles: 'square-array', pitch_over_D: 6 });
    expect(r.outputs.nozzle_area_ratio).toBeCloseTo(0.021817, 6);
    expect(r.outputs.Nu).toBeCloseTo(65.073, 2);
    expect(r.flags).toEqual([]);
  });

  it('relative nozzle area: nozzle area over the cell each nozzle serves', () => {
    // Square pitch S: cell S²; hexagonal (equilateral-triangle) pitch S: cell (√3/2)S².
    const S = 7;
    expect(relativeNozzleArea('square-array', S)).toBeCloseTo(Math.PI / 4 / (S * S), 14);
    expect(relativeNozzleArea('hexagonal-array', S)).toBeCloseTo(Math.PI / 4 / ((Math.sqrt(3) / 2) * S * S), 14);
    // A hexagonal array packs nozzles 2/√3 times as densely at the same pitch.
    expect(relativeNozzleArea('hexagonal-array', S) / relativeNozzleArea('square-array', S)).toBeCloseTo(2 / Math.sqrt(3), 12);
  });

  it('Nu scales with Pr^0.42 and falls with the averaging radius', () => {
    const base = { Re: 3e4, H_over_D: 6, r_over_D: 4 };
    expect(run({ ...base, Pr: 2 }).outputs.Nu / run({ ...base, Pr: 1 }).outputs.Nu).toBeCloseTo(2 ** 0.42, 12);
    expect(run({ ...base, Pr: 0.7, r_over_D: 6 }).outputs.Nu).toBeLessThan(run({ ...base, Pr: 0.7 }).outputs.Nu);
  });

  it("flags points outside Martin's ranges for each layout", () => {
    expect(run({ Re: 1000, Pr: 0.7, H_over_D: 5, r_over_D: 5 }).flags).toEqual(['out-of-range:Re']);
    expect(run({ Re: 1e4, Pr: 0.7, H_over_D: 15, r_over_D: 5 }).flags).toEqual(['out-of-range:H_over_D']);
    expect(run({ Re: 1e4, Pr: 0.7, H_over_D: 5, r_over_D: 2 }).flags).toEqual(['out-of-range:r_over_D']);
    // 4e5 is inside the single-nozzle range but beyond the arrays' 1e5.
    expect(run({ Re: 2e5, Pr: 0.7, H_over_D: 5, r_over_D: 5 }).flags).toEqual([]);
    expect(run({ Re: 2e5, Pr: 0.7, H_over_D: 5, nozzles: 'square-array', pitch_over_D: 6 }).flags).toEqual(['out-of-range:Re']);
    // S/D = 20: A_r = 0.0020 < 0.004.
    expect(run({ Re: 2e4, Pr: 0.7, H_over_D: 5, nozzles: 'square-array', pitch_over_D: 20 }).flags).toEqual(['out-of-range:nozzle_area_ratio']);
  });

  it('asks for the geometry its layout needs and refuses meaningless ones', () => {
    expect(() => run({ Re: 1e4, Pr: 0.7, H_over_D: 5 })).toThrow(/needs r_over_D/);
    expect(() => run({ Re: 1e4, Pr: 0.7, H_over_D: 5, nozzles: 'hexagonal-array' })).toThrow(/needs pitch_over_D/);
    expect(() => run({ Re: 1e4, Pr: 0.7, H_over_D: 5, r_over_D: 1 })).toThrow(InputError);
    expect(() => run({ Re: 1e4, Pr: 0.7, H_over_D: 5, nozzles: 'square-array', pitch_over_D: 1.5 })).toThrow(InputError);
    expect(() => run({ Re: 1e4, Pr: 0.7, H_over_D: 5, nozzles: 'slot', r_over_D: 5 })).toThrow(InputError);
  });
});
