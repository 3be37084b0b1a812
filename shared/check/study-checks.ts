// A study file's `checks`: expected outputs at given points, compared with a run's rows.
//
// Matching a check to a row: the row's method equals `method`, and every key of `at`
// equals the row's input of that name (numbers within 1e-9 relative, other values
// exactly). A key the point does not have as an input is looked up among the row's
// outputs instead, so `at: {Re: ...}` also finds points the engine derived Re for from a
// velocity. The same 1e-9 applies there, so it only matches a derived value given to
// full precision (copy it from an export); when nothing matches, the message names the
// nearest row so the value can be corrected. Several matching rows are an error too: `at`
// must pin down one point.
import type { ResultRow } from '../physics/engine.js';
import type { Inputs, InputValue } from '../physics/types.js';
import type { CheckOutcome } from './outcome.js';

/** The shape of shared/study's StudyCheck (SI values; positions of the check in the file). */
export interface CheckSpec {
  at: Inputs;
  method: string;
  expect: Record<string, number>;
  /** Pass when within either bound; neither given means relative 1e-9. */
  tolerance: { relative?: number; absolute?: number };
  line: number;
  column: number;
}

export const matchTolerance = 1e-9;
export const defaultCheckTolerance = 1e-9;

function close(a: number, b: number, rel: number): boolean {
  return a === b || Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b));
}

function valueAt(row: ResultRow, key: string): InputValue | undefined {
  return key in row.inputs ? row.inputs[key] : row.outputs[key];
}

function matches(row: ResultRow, at: Inputs): boolean {
  return Object.entries(at).every(([key, want]) => {
    const have = valueAt(row, key);
    if (typeof want === 'number' && typeof have === 'number') return close(have, want, matchTolerance);
    return have === want;
  });
}

/** How far a row is from `at`: the largest relative difference over numeric keys. */
function distance(row: ResultRow, at: Inputs): number {
  let worst = 0;
  for (const [key, want] of Object.entries(at)) {
    const have = valueAt(row, key);
    if (typeof want === 'number' && typeof have === 'number') {
      const scale = Math.max(Math.abs(want), Math.abs(have));
      worst = Math.max(worst, scale === 0 ? 0 : Math.abs(have - want) / scale);
    } else if (have !== want) {
      return Infinity;
    }
  }
  return worst;
}

export function describeInputs(values: Record<string, InputValue>): string {
  return Object.entries(values)
    .map(([k, v]) => `${k}=${typeof v === 'string' ? JSON.stringify(v) : String(v)}`)
    .join(', ');
}

/** Number format for messages: enough digits to see a small drift. */
function show(x: number): string {
  return String(Number(x.toPrecision(8)));
}

function nearestNote(rows: readonly ResultRow[], check: CheckSpec): string {
  const candidates = rows.filter((r) => r.method === check.method);
  if (!candidates.length) {
    const methods = [...new Set(rows.map((r) => r.method))];
    return `the run has no rows of method '${check.method}' (it has: ${methods.join(', ') || 'none'})`;
  }
  let best = candidates[0];
  let bestDistance = distance(best, check.at);
  for (const r of candidates) {
    const d = distance(r, check.at);
    if (d < bestDistance) [best, bestDistance] = [r, d];
  }
  const missingKeys = Object.keys(check.at).filter((k) => valueAt(best, k) === undefined);
  if (missingKeys.length) return `the points of '${check.method}' have no ${missingKeys.join(', ')}`;
  const nearest = Object.fromEntries(Object.keys(check.at).map((k) => [k, valueAt(best, k) as InputValue]));
  return `nearest point: ${describeInputs(nearest)}`;
}

function varyingKeys(rows: readonly ResultRow[]): string[] {
  const keys = new Set(rows.flatMap((r) => Object.keys(r.inputs)));
  return [...keys].filter((k) => rows.some((r) => r.inputs[k] !== rows[0].inputs[k]));
}

export function evaluateChecks(checks: readonly CheckSpec[], rows: readonly ResultRow[]): CheckOutcome[] {
  const outcomes: CheckOutcome[] = [];
  for (const check of checks) {
    const where = `line ${check.line}: ${check.method} at ${describeInputs(check.at)}`;
    const found = rows.filter((r) => r.method === check.method && matches(r, check.at));
    for (const [output, expected] of Object.entries(check.expect)) {
      const name = `${where}: ${output}`;
      const fail = (message: string, actual: number | null = null): CheckOutcome => ({
        name,
        passed: false,
        message,
        expected,
        actual,
        relError: null,
      });
      if (found.length === 0) {
        outcomes.push(fail(`no point of the run matches (${nearestNote(rows, check)})`));
        continue;
      }
      if (found.length > 1) {
        const vary = varyingKeys(found);
        outcomes.push(fail(`${found.length} points match; add ${vary.join(', ') || 'inputs'} to 'at' to pick one`));
        continue;
      }
      const row = found[0];
      const actual = row.outputs[output];
      if (actual === undefined) {
        const flags = row.flags.length ? `; the point is flagged ${row.flags.join(', ')}` : '';
        outcomes.push(fail(`the result has no output '${output}' (it has: ${Object.keys(row.outputs).join(', ') || 'none'})${flags}`));
        continue;
      }
      if (!Number.isFinite(actual)) {
        outcomes.push(fail(`${output} is not a finite number (${actual})`));
        continue;
      }
      const diff = Math.abs(actual - expected);
      const relError = expected === 0 ? null : diff / Math.abs(expected);
      const { relative, absolute } = check.tolerance;
      const noBound = relative === undefined && absolute === undefined;
      const relBound = noBound ? defaultCheckTolerance : relative;
      const passed =
        (relBound !== undefined && diff <= relBound * Math.abs(expected)) || (absolute !== undefined && diff <= absolute);
      const bounds = [
        relBound !== undefined ? `${show(relBound * 100)} % relative` : undefined,
        absolute !== undefined ? `${show(absolute)} absolute` : undefined,
      ].filter(Boolean).join(' or ');
      const off = relError === null ? `off by ${show(diff)}` : `off by ${show(relError * 100)} %`;
      const flagged = row.flags.length ? ` [flags: ${row.flags.join(', ')}]` : '';
      outcomes.push({
        name,
        passed,
        message: `${output} = ${show(actual)}, expected ${show(expected)}, ${off} (tolerance ${bounds})${flagged}`,
        expected,
        actual,
        relError,
      });
    }
  }
  return outcomes;
}
