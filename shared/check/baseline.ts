// Baselines: a committed snapshot of a run's rows (`studies/<name>.baseline.json`) that
// `filmsweep check` compares each new run with, so CI fails when a result drifts.
//
// The file is pretty-printed JSON with every object's keys sorted and each row's flags
// sorted, so regenerating it after a change gives a readable git diff. Rows keep the run's
// order (point order, then method order).
//
// Comparison: rows are paired by method + canonical inputs (input names sorted, numbers
// rounded to 12 significant figures, so a last-digit wobble of a swept value from a
// different libm does not unpair rows; a repeated point is paired by occurrence). Then a
// missing row, an extra row, a changed flag set, a missing or extra output, or an output
// with |actual − baseline| > max(tolerance·|baseline|, absoluteFloor) is a drift. The
// absolute floor (default 1e-12, in the output's SI unit) keeps values that should be zero
// but come out as 1e-17 from failing a relative test they cannot pass.
import { basename, dirname, extname, join } from 'node:path';
import type { ResultRow } from '../physics/engine.js';
import { InputError, type InputValue } from '../physics/types.js';
import type { MethodVersion, RunExport } from '../export/types.js';
import { describeInputs } from './study-checks.js';

export interface Baseline {
  study: string;
  yaml_hash: string;
  created_at: string;
  methods: MethodVersion[];
  rows: ResultRow[];
}

/** The snapshot of a run; `created_at` defaults to the run's finish time, so it is reproducible. */
export function makeBaseline(data: RunExport, options: { createdAt?: string } = {}): Baseline {
  const { run } = data;
  return {
    study: run.study,
    yaml_hash: run.yaml_hash,
    created_at: options.createdAt ?? run.finished_at ?? new Date().toISOString(),
    methods: [...run.methods].sort((a, b) => a.id.localeCompare(b.id)),
    rows: data.rows.map((r) => ({ method: r.method, inputs: r.inputs, outputs: r.outputs, flags: [...r.flags].sort() })),
  };
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(value).sort()) out[k] = sortKeys((value as Record<string, unknown>)[k]);
    return out;
  }
  return value;
}

/** The file text: sorted keys, two-space indent, trailing newline. */
export function serializeBaseline(b: Baseline): string {
  return JSON.stringify(sortKeys(b), null, 2) + '\n';
}

/** Parse and shape-check a baseline file's text; `file` names it in errors. */
export function parseBaseline(text: string, file = 'baseline'): Baseline {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new InputError(`${file}: not valid JSON (${(e as Error).message})`);
  }
  const bad = (what: string) => new InputError(`${file}: ${what}`);
  if (!data || typeof data !== 'object' || Array.isArray(data)) throw bad('expected an object');
  const b = data as Record<string, unknown>;
  for (const key of ['study', 'yaml_hash', 'created_at'] as const) {
    if (typeof b[key] !== 'string') throw bad(`'${key}' must be a string`);
  }
  if (!Array.isArray(b.methods) || !b.methods.every((m) => m && typeof m.id === 'string' && typeof m.version === 'number')) {
    throw bad(`'methods' must be a list of {id, version}`);
  }
  if (!Array.isArray(b.rows)) throw bad(`'rows' must be a list`);
  b.rows.forEach((r: unknown, i: number) => {
    const row = r as Record<string, unknown> | null;
    const isMap = (v: unknown) => !!v && typeof v === 'object' && !Array.isArray(v);
    if (
      !row ||
      typeof row.method !== 'string' ||
      !isMap(row.inputs) ||
      !isMap(row.outputs) ||
      !Array.isArray(row.flags) ||
      !Object.values(row.outputs as object).every((v) => typeof v === 'number' || v === null) ||
      !row.flags.every((f) => typeof f === 'string')
    ) {
      throw bad(`row ${i + 1} must be {method, inputs: {...}, outputs: {name: number}, flags: [strings]}`);
    }
  });
  return data as Baseline;
}

/** `studies/pipe.yaml` → `studies/pipe.baseline.json` (next to the study file). */
export function baselinePathFor(studyFile: string): string {
  const ext = extname(studyFile);
  const stem = ext === '.yaml' || ext === '.yml' ? basename(studyFile, ext) : basename(studyFile);
  return join(dirname(studyFile), `${stem}.baseline.json`);
}

function canonicalValue(v: InputValue): string {
  if (typeof v !== 'number') return JSON.stringify(v);
  if (v === 0) return '0';
  return Number.isFinite(v) ? String(Number(v.toPrecision(12))) : String(v);
}

/** The pairing key of a row: method and its inputs, names sorted, numbers to 12 figures. */
export function rowKey(row: Pick<ResultRow, 'method' | 'inputs'>): string {
  const inputs = Object.keys(row.inputs)
    .sort()
    .map((k) => `${k}=${canonicalValue(row.inputs[k])}`)
    .join(',');
  return `${row.method}|${inputs}`;
}

export type DriftKind = 'missing-row' | 'extra-row' | 'flags-changed' | 'missing-output' | 'extra-output' | 'value-changed';

export interface Drift {
  kind: DriftKind;
  method: string;
  inputs: Record<string, InputValue>;
  output?: string;
  baseline?: number | string[] | null;
  actual?: number | string[] | null;
  relError?: number | null;
}

export interface BaselineOptions {
  /** Relative tolerance on every output (the study's `baseline.tolerance`, default 1e-9). */
  tolerance?: number;
  /** Absolute difference that always passes, in the output's SI unit (default 1e-12). */
  absoluteFloor?: number;
  /** How many drifts a failure message lists (default 10). */
  maxDetails?: number;
  /** Method versions of the new run, to mention a version change in the message. */
  methods?: readonly MethodVersion[];
}

export interface BaselineOutcome {
  /** `baseline: <method>`, one per method found in either the baseline or the run. */
  name: string;
  passed: boolean;
  message: string;
  method: string;
  /** Rows present in both and compared. */
  compared: number;
  drifts: Drift[];
}

function show(x: number | null | undefined): string {
  return x === null || x === undefined ? 'none' : String(Number(x.toPrecision(10)));
}

export function describeDrift(d: Drift): string {
  const at = `at ${describeInputs(d.inputs) || '(no inputs)'}`;
  switch (d.kind) {
    case 'missing-row':
      return `${at}: row missing from the run`;
    case 'extra-row':
      return `${at}: row not in the baseline`;
    case 'flags-changed':
      return `${at}: flags [${(d.baseline as string[]).join(', ')}] -> [${(d.actual as string[]).join(', ')}]`;
    case 'missing-output':
      return `${at}: output ${d.output} missing (baseline ${show(d.baseline as number | null)})`;
    case 'extra-output':
      return `${at}: output ${d.output} not in the baseline (now ${show(d.actual as number | null)})`;
    case 'value-changed': {
      const rel = d.relError === null || d.relError === undefined ? '' : ` (${show(d.relError)} relative)`;
      return `${at}: ${d.output} ${show(d.baseline as number | null)} -> ${show(d.actual as number | null)}${rel}`;
    }
  }
}

function sameNumber(baseline: number | null, actual: number | null, tolerance: number, floor: number): boolean {
  if (baseline === null || actual === null || !Number.isFinite(baseline) || !Number.isFinite(actual)) {
    return Object.is(baseline === null ? NaN : baseline, actual === null ? NaN : actual);
  }
  const diff = Math.abs(actual - baseline);
  return diff <= floor || diff <= tolerance * Math.abs(baseline);
}

function compareRow(base: ResultRow, now: ResultRow, tolerance: number, floor: number, drifts: Drift[]) {
  const where = { method: now.method, inputs: now.inputs };
  const flagsBase = [...base.flags].sort();
  const flagsNow = [...now.flags].sort();
  if (flagsBase.join('\n') !== flagsNow.join('\n')) {
    drifts.push({ kind: 'flags-changed', ...where, baseline: flagsBase, actual: flagsNow });
  }
  const outBase = base.outputs as Record<string, number | null>;
  const outNow = now.outputs as Record<string, number | null>;
  for (const name of Object.keys(outBase).sort()) {
    const b = outBase[name];
    if (!(name in outNow)) {
      drifts.push({ kind: 'missing-output', ...where, output: name, baseline: b });
      continue;
    }
    const a = outNow[name];
    if (!sameNumber(b, a, tolerance, floor)) {
      const relError = b === null || a === null || b === 0 ? null : Math.abs(a - b) / Math.abs(b);
      drifts.push({ kind: 'value-changed', ...where, output: name, baseline: b, actual: a, relError });
    }
  }
  for (const name of Object.keys(outNow).sort()) {
    if (!(name in outBase)) drifts.push({ kind: 'extra-output', ...where, output: name, actual: outNow[name] });
  }
}

/** Pairs rows by key, the n-th occurrence of a key with the n-th. */
function keyed(rows: readonly ResultRow[]): Map<string, ResultRow> {
  const map = new Map<string, ResultRow>();
  const seen = new Map<string, number>();
  for (const r of rows) {
    const k = rowKey(r);
    const n = seen.get(k) ?? 0;
    seen.set(k, n + 1);
    map.set(n === 0 ? k : `${k}#${n + 1}`, r);
  }
  return map;
}

export function compareWithBaseline(
  baseline: Baseline,
  rows: readonly ResultRow[],
  options: BaselineOptions = {},
): BaselineOutcome[] {
  const tolerance = options.tolerance ?? 1e-9;
  const floor = options.absoluteFloor ?? 1e-12;
  const maxDetails = options.maxDetails ?? 10;
  const base = keyed(baseline.rows);
  const now = keyed(rows);
  const methods: string[] = [];
  for (const r of [...baseline.rows, ...rows]) if (!methods.includes(r.method)) methods.push(r.method);
  const perMethod = new Map(methods.map((m) => [m, { compared: 0, drifts: [] as Drift[] }]));

  for (const [key, b] of base) {
    const entry = perMethod.get(b.method)!;
    const n = now.get(key);
    if (!n) {
      entry.drifts.push({ kind: 'missing-row', method: b.method, inputs: b.inputs });
      continue;
    }
    entry.compared++;
    compareRow(b, n, tolerance, floor, entry.drifts);
  }
  for (const [key, n] of now) {
    if (!base.has(key)) perMethod.get(n.method)!.drifts.push({ kind: 'extra-row', method: n.method, inputs: n.inputs });
  }

  if (methods.length === 0) {
    return [{ name: 'baseline', passed: true, message: 'the baseline and the run both have no rows', method: '', compared: 0, drifts: [] }];
  }
  return methods.map((method) => {
    const { compared, drifts } = perMethod.get(method)!;
    const passed = drifts.length === 0;
    const bounds = `tolerance ${tolerance} relative, floor ${floor}`;
    let message: string;
    if (passed) {
      message = `${compared} rows match the baseline (${bounds})`;
    } else {
      const lines = drifts.slice(0, maxDetails).map(describeDrift);
      if (drifts.length > maxDetails) lines.push(`… and ${drifts.length - maxDetails} more`);
      const was = baseline.methods.find((m) => m.id === method)?.version;
      const is = options.methods?.find((m) => m.id === method)?.version;
      const version =
        was !== undefined && is !== undefined && was !== is
          ? ` Method version changed ${was} -> ${is}: if the change is intended, update the baseline.`
          : '';
      message = `${drifts.length} difference${drifts.length === 1 ? '' : 's'} from the baseline (${compared} rows compared, ${bounds}).${version}\n${lines.join('\n')}`;
    }
    return { name: `baseline: ${method}`, passed, message, method, compared, drifts };
  });
}
