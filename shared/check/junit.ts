// JUnit XML, the report format CI systems read: <testsuites> of <testsuite> of <testcase>,
// a failing case holding a <failure> whose message attribute is the first line of the text.
// Text is escaped for XML 1.0; characters XML 1.0 cannot carry at all (control characters
// other than tab, newline and carriage return, lone surrogates, U+FFFE/U+FFFF) become U+FFFD.
import type { CheckOutcome } from './outcome.js';

export interface JUnitCase {
  name: string;
  classname: string;
  /** Failure text; absent when the case passed. */
  failure?: string;
  /** Seconds. */
  time?: number;
}

export interface JUnitSuite {
  name: string;
  cases: JUnitCase[];
}

const notXmlChar = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Element text; a carriage return as a reference, since parsers turn a raw one into LF. */
export function xmlText(s: string): string {
  return s
    .replace(notXmlChar, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/\r/g, '&#13;');
}

/** For a double-quoted attribute: also quotes, and line breaks and tabs as references (parsers turn raw ones into spaces). */
export function xmlAttr(s: string): string {
  return xmlText(s).replace(/"/g, '&quot;').replace(/'/g, '&apos;').replace(/\n/g, '&#10;').replace(/\t/g, '&#9;');
}

function seconds(t: number | undefined): string {
  return (t !== undefined && Number.isFinite(t) && t >= 0 ? t : 0).toFixed(3);
}

export function junitXml(suites: readonly JUnitSuite[], name = 'filmsweep'): string {
  const count = (cases: readonly JUnitCase[]) => ({
    tests: cases.length,
    failures: cases.filter((c) => c.failure !== undefined).length,
    time: cases.reduce((sum, c) => sum + (c.time ?? 0), 0),
  });
  const all = count(suites.flatMap((s) => s.cases));
  const out = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<testsuites name="${xmlAttr(name)}" tests="${all.tests}" failures="${all.failures}" errors="0" time="${seconds(all.time)}">`,
  ];
  for (const suite of suites) {
    const c = count(suite.cases);
    out.push(
      `  <testsuite name="${xmlAttr(suite.name)}" tests="${c.tests}" failures="${c.failures}" errors="0" skipped="0" time="${seconds(c.time)}">`,
    );
    for (const tc of suite.cases) {
      const attrs = `name="${xmlAttr(tc.name)}" classname="${xmlAttr(tc.classname)}" time="${seconds(tc.time)}"`;
      if (tc.failure === undefined) {
        out.push(`    <testcase ${attrs}/>`);
      } else {
        const first = tc.failure.split('\n', 1)[0];
        out.push(`    <testcase ${attrs}>`);
        out.push(`      <failure message="${xmlAttr(first)}">${xmlText(tc.failure)}</failure>`);
        out.push('    </testcase>');
      }
    }
    out.push('  </testsuite>');
  }
  out.push('</testsuites>');
  return out.join('\n') + '\n';
}

/** Test cases for outcomes (study checks or baseline comparisons) under one class name. */
export function outcomeCases(outcomes: readonly Pick<CheckOutcome, 'name' | 'passed' | 'message'>[], classname: string): JUnitCase[] {
  return outcomes.map((o) => ({ name: o.name, classname, failure: o.passed ? undefined : o.message }));
}
