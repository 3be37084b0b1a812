// Study checks and baselines over synthetic rows: these test the comparison logic, not
// physics, so the numbers are made up and need no source.
import { describe, expect, it } from 'vitest';
import {
  baselinePathFor,
  compareWithBaseline,
  makeBaseline,
  parseBaseline,
  rowKey,
  serializeBaseline,
  type Baseline,
} from '../shared/check/baseline.js';
import { evaluateChecks, type CheckSpec } from '../shared/check/study-checks.js';
import type { RunExport } from '../shared/export/types.js';
import type { ResultRow } from '../shared/physics/engine.js';
import { InputError } from '../shared/physics/types.js';

function rows(): ResultRow[] {
  const out: ResultRow[] = [];
  for (const Re of [1e4, 1e5]) {
    for (const Pr of [0.7, 5]) {
      out.push({ method: 'gnielinski', inputs: { Re, Pr }, outputs: { Nu: 0.012 * Re ** 0.87 * Pr ** 0.4, f: 0.02 }, flags: [] });
      out.push({
        method: 'dittus-boelter',
        inputs: { Re, Pr },
        outputs: { Nu: 0.023 * Re ** 0.8 * Pr ** 0.4 },
        flags: Pr < 1 ? ['out-of-range:Pr'] : [],
      });
    }
  }
  return out;
}

const check = (over: Partial<CheckSpec>): CheckSpec => ({
  at: { Re: 1e5, Pr: 5 },
  method: 'gnielinski',
  expect: { Nu: 0.012 * 1e5 ** 0.87 * 5 ** 0.4 },
  tolerance: { relative: 0.03 },
  line: 12,
  column: 5,
  ...over,
});

describe('study checks', () => {
  const data = rows();
  const nu = 0.012 * 1e5 ** 0.87 * 5 ** 0.4;

  it('passes within the relative tolerance and reports the relative error', () => {
    const [o] = evaluateChecks([check({ expect: { Nu: nu * 1.02 } })], data);
    expect(o.passed).toBe(true);
    expect(o.actual).toBe(nu);
    expect(o.expected).toBe(nu * 1.02);
    expect(o.relError).toBeCloseTo(0.02 / 1.02, 12);
    expect(o.name).toBe('line 12: gnielinski at Re=100000, Pr=5: Nu');
  });

  it('fails beyond the tolerance with both numbers in the message', () => {
    const [o] = evaluateChecks([check({ expect: { Nu: nu * 1.05 } })], data);
    expect(o.passed).toBe(false);
    expect(o.relError).toBeCloseTo(0.05 / 1.05, 12);
    expect(o.message).toMatch(/^Nu = [\d.]+, expected [\d.]+, off by 4\.76190\d* % \(tolerance 3 % relative\)$/);
  });

  it('accepts an absolute tolerance, and either bound when both are given', () => {
    expect(evaluateChecks([check({ expect: { Nu: nu + 0.4 }, tolerance: { absolute: 0.5 } })], data)[0].passed).toBe(true);
    expect(evaluateChecks([check({ expect: { Nu: nu + 0.6 }, tolerance: { absolute: 0.5 } })], data)[0].passed).toBe(false);
    const both = { relative: 1e-6, absolute: 0.5 };
    expect(evaluateChecks([check({ expect: { Nu: nu + 0.4 }, tolerance: both })], data)[0].passed).toBe(true);
  });

  it('uses 1e-9 relative when the check gives no tolerance', () => {
    expect(evaluateChecks([check({ expect: { Nu: nu * (1 + 1e-10) }, tolerance: {} })], data)[0].passed).toBe(true);
    expect(evaluateChecks([check({ expect: { Nu: nu * (1 + 1e-8) }, tolerance: {} })], data)[0].passed).toBe(false);
  });

  it('matches inputs to 1e-9 relative', () => {
    expect(evaluateChecks([check({ at: { Re: 1e5 * (1 + 5e-10), Pr: 5 } })], data)[0].passed).toBe(true);
    const [o] = evaluateChecks([check({ at: { Re: 1.0001e5, Pr: 5 } })], data);
    expect(o.passed).toBe(false);
    expect(o.message).toBe('no point of the run matches (nearest point: Re=100000, Pr=5)');
  });

  it('fails clearly without a matching point, with several, or with the output missing', () => {
    const [noMethod] = evaluateChecks([check({ method: 'sieder-tate' })], data);
    expect(noMethod.passed).toBe(false);
    expect(noMethod.message).toContain("no rows of method 'sieder-tate' (it has: gnielinski, dittus-boelter)");
    const [several] = evaluateChecks([check({ at: { Re: 1e5 } })], data);
    expect(several.passed).toBe(false);
    expect(several.message).toBe("2 points match; add Pr to 'at' to pick one");
    const [missing] = evaluateChecks([check({ method: 'dittus-boelter', expect: { f: 0.02 } })], data);
    expect(missing.passed).toBe(false);
    expect(missing.actual).toBeNull();
    expect(missing.message).toBe("the result has no output 'f' (it has: Nu)");
    const [unknownKey] = evaluateChecks([check({ at: { Re: 1e5, Pr: 5, Gr: 1e6 } })], data);
    expect(unknownKey.message).toContain('have no Gr');
  });

  it('gives one outcome per expected output', () => {
    const outcomes = evaluateChecks([check({ expect: { Nu: nu, f: 0.02, Cf: 1 } })], data);
    expect(outcomes.map((o) => [o.name.split(': ').pop(), o.passed])).toEqual([
      ['Nu', true],
      ['f', true],
      ['Cf', false],
    ]);
  });

  it('matches a derived output (Re from a velocity) and string inputs', () => {
    const dimensional: ResultRow[] = [
      { method: 'zukauskas', inputs: { velocity: 2, arrangement: 'aligned' }, outputs: { Re: 2345.678, Nu: 40 }, flags: [] },
      { method: 'zukauskas', inputs: { velocity: 2, arrangement: 'staggered' }, outputs: { Re: 2345.678, Nu: 45 }, flags: [] },
    ];
    const spec = check({ method: 'zukauskas', at: { Re: 2345.678, arrangement: 'staggered' }, expect: { Nu: 45 } });
    const [o] = evaluateChecks([spec], dimensional);
    expect(o.passed).toBe(true);
    expect(o.actual).toBe(45);
  });

  it('mentions the flags of a checked point', () => {
    const spec = check({ method: 'dittus-boelter', at: { Re: 1e4, Pr: 0.7 }, expect: { Nu: 1 } });
    expect(evaluateChecks([spec], data)[0].message).toContain('[flags: out-of-range:Pr]');
  });
});

function runExport(r: ResultRow[]): RunExport {
  return {
    run: {
      id: 3,
      study: 'pipe-demo',
      study_version: 2,
      title: null,
      configuration: 'pipe',
      status: 'done',
      started_at: '2025-05-05T05:05:05.000Z',
      finished_at: '2025-05-05T05:05:06.000Z',
      git_commit: null,
      host: 'h',
      workers: 2,
      points_total: 4,
      points_done: 4,
      results_count: r.length,
      flagged_count: 2,
      methods: [
        { id: 'gnielinski', version: 1 },
        { id: 'dittus-boelter', version: 1 },
      ],
      yaml_hash: 'c0ffee',
    },
    rows: r,
  };
}

/** Keys of every object in parsed JSON are in sorted order. */
function keysSorted(value: unknown): boolean {
  if (Array.isArray(value)) return value.every(keysSorted);
  if (value && typeof value === 'object') {
    const keys = Object.keys(value);
    return keys.join('\n') === [...keys].sort().join('\n') && Object.values(value).every(keysSorted);
  }
  return true;
}

describe('baselines', () => {
  it('serialises with sorted keys, sorted flags and two-space indent, and parses back', () => {
    const r = rows();
    r[1].flags = ['zeta', 'alpha'];
    r[0].outputs = { f: 0.02, Nu: 10, A: 1 };
    const b = makeBaseline(runExport(r));
    expect(b.created_at).toBe('2025-05-05T05:05:06.000Z');
    expect(b.methods.map((m) => m.id)).toEqual(['dittus-boelter', 'gnielinski']);
    const text = serializeBaseline(b);
    expect(text.endsWith('}\n')).toBe(true);
    expect(text.split('\n')[1]).toBe('  "created_at": "2025-05-05T05:05:06.000Z",');
    const parsed = JSON.parse(text);
    expect(keysSorted(parsed)).toBe(true);
    expect(parsed.rows[1].flags).toEqual(['alpha', 'zeta']);
    expect(parseBaseline(text)).toEqual(b);
    // Stable: the same run gives the same bytes.
    expect(serializeBaseline(makeBaseline(runExport(rows())))).toBe(serializeBaseline(makeBaseline(runExport(rows()))));
  });

  it('rejects malformed baseline files with an InputError naming the file', () => {
    expect(() => parseBaseline('{', 'studies/x.baseline.json')).toThrow(/studies\/x\.baseline\.json: not valid JSON/);
    expect(() => parseBaseline('[]')).toThrow(InputError);
    const good = JSON.parse(serializeBaseline(makeBaseline(runExport(rows()))));
    good.rows[2].outputs.Nu = '12';
    expect(() => parseBaseline(JSON.stringify(good))).toThrow(/row 3 must be/);
    delete good.methods;
    expect(() => parseBaseline(JSON.stringify(good))).toThrow(/'methods'/);
  });

  it('puts the baseline next to the study file', () => {
    expect(baselinePathFor('studies/pipe-demo.yaml')).toBe('studies/pipe-demo.baseline.json');
    expect(baselinePathFor('/a/b/x.yml')).toBe('/a/b/x.baseline.json');
  });

  const baseline = (): Baseline => parseBaseline(serializeBaseline(makeBaseline(runExport(rows()))));

  it('passes an identical run, one outcome per method', () => {
    const outcomes = compareWithBaseline(baseline(), rows());
    expect(outcomes.map((o) => [o.name, o.passed, o.compared])).toEqual([
      ['baseline: gnielinski', true, 4],
      ['baseline: dittus-boelter', true, 4],
    ]);
    expect(outcomes[0].message).toBe('4 rows match the baseline (tolerance 1e-9 relative, floor 1e-12)');
  });

  it('passes a change within the tolerance and detects one beyond it', () => {
    const r = rows();
    r[0].outputs.Nu *= 1 + 5e-10;
    expect(compareWithBaseline(baseline(), r).every((o) => o.passed)).toBe(true);
    r[2].outputs.Nu *= 1 + 2e-6;
    const [g, d] = compareWithBaseline(baseline(), r);
    expect(d.passed).toBe(true);
    expect(g.passed).toBe(false);
    expect(g.drifts).toHaveLength(1);
    expect(g.drifts[0]).toMatchObject({ kind: 'value-changed', output: 'Nu', inputs: { Re: 1e4, Pr: 5 } });
    expect(g.drifts[0].relError).toBeCloseTo(2e-6, 12);
    expect(g.message).toContain('1 difference from the baseline (4 rows compared');
    expect(g.message).toMatch(/at Re=10000, Pr=5: Nu [\d.]+ -> [\d.]+ \(0\.000002\d* relative\)/);
    // A looser tolerance lets the same drift pass.
    expect(compareWithBaseline(baseline(), r, { tolerance: 1e-5 }).every((o) => o.passed)).toBe(true);
  });

  it('detects a changed flag set but not a reordered one', () => {
    const r = rows();
    r[1].flags = ['out-of-range:Re', 'out-of-range:Pr'];
    const [, d] = compareWithBaseline(baseline(), r);
    expect(d.passed).toBe(false);
    expect(d.drifts[0]).toMatchObject({
      kind: 'flags-changed',
      baseline: ['out-of-range:Pr'],
      actual: ['out-of-range:Pr', 'out-of-range:Re'],
    });
    expect(d.message).toContain('flags [out-of-range:Pr] -> [out-of-range:Pr, out-of-range:Re]');
    const b = baseline();
    b.rows[1].flags = ['b', 'a'];
    r[1].flags = ['a', 'b'];
    expect(compareWithBaseline(b, r)[1].passed).toBe(true);
  });

  it('detects missing and extra rows and outputs', () => {
    const r = rows();
    const gone = r.splice(3, 1)[0]; // dittus-boelter at Re=1e4, Pr=5
    r.push({ ...gone, inputs: { Re: 2e5, Pr: 5 } });
    delete r[0].outputs.f;
    r[2].outputs.St = 0.001;
    const [g, d] = compareWithBaseline(baseline(), r);
    expect(g.drifts.map((x) => [x.kind, x.output])).toEqual([
      ['missing-output', 'f'],
      ['extra-output', 'St'],
    ]);
    expect(d.drifts.map((x) => [x.kind, x.inputs])).toEqual([
      ['missing-row', { Re: 1e4, Pr: 5 }],
      ['extra-row', { Re: 2e5, Pr: 5 }],
    ]);
    expect(d.message).toContain('at Pr=5, Re=10000: row missing from the run'); // baseline keys are sorted
    expect(d.message).toContain('at Re=200000, Pr=5: row not in the baseline');
  });

  it('pairs rows across a last-digit wobble of a swept input, and by occurrence for repeats', () => {
    expect(rowKey({ method: 'm', inputs: { Re: 0.1 + 0.2, Pr: 5 } })).toBe(rowKey({ method: 'm', inputs: { Pr: 5, Re: 0.3 } }));
    expect(rowKey({ method: 'm', inputs: { Re: 1e5 } })).not.toBe(rowKey({ method: 'm', inputs: { Re: 1.00000001e5 } }));
    expect(rowKey({ method: 'm', inputs: { a: '1' } })).not.toBe(rowKey({ method: 'm', inputs: { a: 1 } }));
    const twice: ResultRow[] = [
      { method: 'm', inputs: { Re: 1 }, outputs: { Nu: 1 }, flags: [] },
      { method: 'm', inputs: { Re: 1 }, outputs: { Nu: 2 }, flags: [] },
    ];
    const b = makeBaseline(runExport(twice));
    expect(compareWithBaseline(b, twice)[0].passed).toBe(true);
    expect(compareWithBaseline(b, twice.slice(0, 1))[0].drifts).toMatchObject([{ kind: 'missing-row' }]);
  });

  it('applies the absolute floor to values near zero', () => {
    const zero: ResultRow[] = [{ method: 'm', inputs: { Re: 1 }, outputs: { q: 0 }, flags: [] }];
    const b = makeBaseline(runExport(zero));
    const now = (q: number): ResultRow[] => [{ ...zero[0], outputs: { q } }];
    expect(compareWithBaseline(b, now(3e-17))[0].passed).toBe(true);
    expect(compareWithBaseline(b, now(1e-9))[0].passed).toBe(false);
    expect(compareWithBaseline(b, now(1e-9), { absoluteFloor: 1e-8 })[0].passed).toBe(true);
    expect(compareWithBaseline(b, now(NaN))[0].passed).toBe(false);
  });

  it('lists the first N drifts and counts the rest, and names a method version change', () => {
    const r = rows().map((x) => ({ ...x, outputs: Object.fromEntries(Object.entries(x.outputs).map(([k, v]) => [k, v * 2])) }));
    const [g] = compareWithBaseline(baseline(), r, { maxDetails: 3, methods: [{ id: 'gnielinski', version: 2 }] });
    expect(g.drifts).toHaveLength(8);
    const lines = g.message.split('\n');
    expect(lines).toHaveLength(1 + 3 + 1);
    expect(lines[0]).toContain('Method version changed 1 -> 2');
    expect(lines[4]).toBe('… and 5 more');
  });

  it('reports an empty run against an empty baseline as passing', () => {
    const b = makeBaseline(runExport([]));
    expect(compareWithBaseline(b, [])).toMatchObject([{ passed: true }]);
  });
});
