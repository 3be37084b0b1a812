// Text exports: CSV (RFC 4180 quoting, read back with an independent parser), JSON shape,
// Markdown and LaTeX tables (significant figures, escaping, column choice), units in
// headers and the caution line. The rows are synthetic: these tests check formatting, not
// physics, so no value here needs an outside source.
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../shared/export/caution.js';
import { csvField, toCsv } from '../shared/export/csv.js';
import { toJson } from '../shared/export/json.js';
import { escapeLatex, latexNumber, latexUnit, toLatex } from '../shared/export/latex.js';
import { escapeMarkdown, toMarkdown } from '../shared/export/markdown.js';
import { memoColumns } from '../shared/export/memo-columns.js';
import { roundSignificant } from '../shared/export/significant.js';
import type { RunExport } from '../shared/export/types.js';
import { makeUnitLookup } from '../shared/export/units.js';
import type { MethodInfo } from '../shared/physics/types.js';
import { InputError } from '../shared/physics/types.js';

/** Just the spec fields the unit lookup reads, as a catalogue method would declare them. */
const fakeSpecs = [
  {
    inputs: [
      { name: 'Re', description: '', unit: '1', required: true },
      { name: 'Pr', description: '', unit: '1', required: true },
      { name: 'arrangement', description: '', unit: '1', required: false, type: 'string' },
    ],
    outputs: [
      { name: 'Nu', description: '', unit: '1' },
      { name: 'f', description: '', unit: '1' },
    ],
  },
] as unknown as MethodInfo[];
const unitOf = makeUnitLookup(fakeSpecs);

function sampleRun(): RunExport {
  const rows = [];
  const velocities = [0.5, 1, 2];
  for (const velocity of velocities) {
    for (const method of ['gnielinski', 'dittus-boelter']) {
      const Re = 123456.789 * velocity;
      const Nu = method === 'gnielinski' ? 0.0123456 * Re : 0.0119 * Re;
      rows.push({
        method,
        inputs: { velocity, diameter: 0.025, fluid_temperature: 330, arrangement: 'inline' },
        outputs: { Pr: 3.0123, property_temperature: 330, velocity, Re, Nu, h: (Nu * 0.65) / 0.025, f: 0.0191 },
        flags: velocity === 2 && method === 'dittus-boelter' ? ['out-of-range:Re', 'out-of-range:Pr'] : [],
      });
    }
  }
  return {
    run: {
      id: 42,
      study: 'glycol_heater',
      study_version: 3,
      title: 'Heater tube, 30 % glycol & water #2',
      configuration: 'pipe',
      status: 'done',
      started_at: '2025-01-02T03:04:05.000Z',
      finished_at: '2025-01-02T03:04:09.500Z',
      git_commit: 'abc123',
      host: 'bench-1',
      workers: 2,
      points_total: 3,
      points_done: 3,
      results_count: 6,
      flagged_count: 1,
      methods: [
        { id: 'gnielinski', version: 1 },
        { id: 'dittus-boelter', version: 1 },
      ],
      yaml_hash: 'f'.repeat(64),
    },
    rows,
  };
}

/** An RFC 4180 reader written independently of the exporter: quoted fields, "" escapes, CRLF. */
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let i = 0;
  let quoted = false;
  while (i < text.length) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
      } else if (ch === '"') {
        quoted = false;
        i++;
      } else {
        field += ch;
        i++;
      }
    } else if (ch === '"') {
      if (field !== '') throw new Error(`quote inside an unquoted field at ${i}`);
      quoted = true;
      i++;
    } else if (ch === ',') {
      record.push(field);
      field = '';
      i++;
    } else if (ch === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i += 2;
    } else if (ch === '\n' || ch === '\r') {
      throw new Error(`bare line break outside quotes at ${i}`);
    } else {
      field += ch;
      i++;
    }
  }
  if (quoted) throw new Error('unterminated quoted field');
  if (field !== '' || record.length) throw new Error('last record lacks CRLF');
  return records;
}

describe('CSV', () => {
  it('quotes fields with commas, quotes and line breaks only', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('cr\rhere')).toBe('"cr\rhere"');
    expect(csvField('')).toBe('');
  });

  it('has one column per input and output with SI units, method first and flags last', () => {
    const records = parseCsv(toCsv(sampleRun(), unitOf));
    expect(records[0]).toEqual([
      'method',
      'velocity [m/s]',
      'diameter [m]',
      'fluid_temperature [K]',
      'arrangement',
      'Pr [-]',
      'property_temperature [K]',
      'velocity (output) [m/s]',
      'Re [-]',
      'Nu [-]',
      'h [W/(m^2·K)]',
      'f [-]',
      'flags',
    ]);
    expect(records).toHaveLength(7);
    expect(records.every((r) => r.length === records[0].length)).toBe(true);
  });

  it('round-trips tricky text and numbers exactly through an RFC 4180 reader', () => {
    const data = sampleRun();
    data.rows[0].inputs.arrangement = 'staggered, "tight"\r\nsecond line';
    data.rows[1].outputs.Nu = 1e-7;
    data.rows[2].outputs.Nu = -0;
    delete data.rows[3].outputs.f;
    const text = toCsv(data, unitOf);
    expect(text.startsWith('method,')).toBe(true); // no preamble, no byte-order mark
    expect(text).not.toContain('Caution');
    const records = parseCsv(text);
    const header = records[0];
    const col = (name: string) => header.indexOf(name);
    expect(records[1][col('arrangement')]).toBe('staggered, "tight"\r\nsecond line');
    expect(records[2][col('Nu [-]')]).toBe('1e-7');
    expect(records[3][col('Nu [-]')]).toBe('0');
    expect(records[4][col('f [-]')]).toBe('');
    data.rows.forEach((row, i) => {
      expect(Number(records[i + 1][col('Re [-]')])).toBe(row.outputs.Re);
      expect(Number(records[i + 1][col('h [W/(m^2·K)]')])).toBe(row.outputs.h);
    });
    expect(records[6][col('flags')]).toBe('out-of-range:Re;out-of-range:Pr');
  });

  it('marks a numeric column without a known unit with [?]', () => {
    const data = sampleRun();
    data.rows[0].outputs.mystery = 1;
    expect(parseCsv(toCsv(data, unitOf))[0]).toContain('mystery [?]');
  });
});

describe('JSON', () => {
  it('keeps the documented {run, rows} shape plus a top-level caution', () => {
    const data = sampleRun();
    const parsed = JSON.parse(toJson(data));
    expect(Object.keys(parsed)).toEqual(['caution', 'run', 'rows']);
    expect(parsed.caution).toBe(CAUTION);
    expect(parsed.run).toEqual(data.run);
    expect(parsed.rows).toEqual(data.rows);
    expect(Object.keys(parsed.rows[0])).toEqual(['method', 'inputs', 'outputs', 'flags']);
  });

  it('writes an empty run as an empty list', () => {
    const data = { ...sampleRun(), rows: [] };
    expect(JSON.parse(toJson(data)).rows).toEqual([]);
  });
});

describe('significant figures', () => {
  it('rounds to 4 figures and drops trailing zeros', () => {
    expect(roundSignificant(520)).toEqual({ digits: '520' });
    expect(roundSignificant(1234.5678)).toEqual({ digits: '1235' });
    expect(roundSignificant(123456.7)).toEqual({ digits: '123500' });
    expect(roundSignificant(-12.3456)).toEqual({ digits: '-12.35' });
    expect(roundSignificant(0.7)).toEqual({ digits: '0.7' });
    expect(roundSignificant(0.00123456)).toEqual({ digits: '0.001235' });
    expect(roundSignificant(0)).toEqual({ digits: '0' });
  });

  it('switches to a power of ten outside 1e-3..1e6, after rounding', () => {
    expect(roundSignificant(1.23456e-5)).toEqual({ digits: '1.235', exponent: -5 });
    expect(roundSignificant(999960)).toEqual({ digits: '1', exponent: 6 });
    expect(roundSignificant(999940)).toEqual({ digits: '999900' });
    expect(roundSignificant(0.00099996)).toEqual({ digits: '0.001' });
    expect(roundSignificant(2.5e7)).toEqual({ digits: '2.5', exponent: 7 });
    expect(roundSignificant(123456.7, 6)).toEqual({ digits: '123457' });
  });
});

describe('memo column choice', () => {
  it('shows varying inputs and the main outputs, lists fixed inputs and names what it left out', () => {
    const data = sampleRun();
    const { shown, fixed, leftOut } = memoColumns(data.rows, unitOf);
    expect(shown.map((c) => c.label)).toEqual(['method', 'velocity', 'Re', 'Nu', 'h', 'flags']);
    expect(fixed.map((f) => [f.column.name, f.value])).toEqual([
      ['diameter', 0.025],
      ['fluid_temperature', 330],
      ['arrangement', 'inline'],
    ]);
    expect(leftOut).toEqual(['Pr', 'property_temperature', 'velocity (output)', 'f']);
  });

  it('takes explicit columns and refuses unknown ones', () => {
    const data = sampleRun();
    expect(memoColumns(data.rows, unitOf, ['method', 'Re', 'f']).shown.map((c) => c.label)).toEqual(['method', 'Re', 'f']);
    expect(() => memoColumns(data.rows, unitOf, ['Nusselt'])).toThrow(InputError);
  });
});

/** Cells of a GitHub table row, splitting on pipes that are not backslash-escaped. */
function mdCells(line: string): string[] {
  return line
    .slice(2, -2)
    .split(/(?<!\\) \| /)
    .map((s) => s.trim());
}

describe('Markdown', () => {
  it('prints the run, the caution and a table with units and 4 significant figures', () => {
    const data = sampleRun();
    const md = toMarkdown(data, unitOf);
    expect(md).toContain('## Run 42: glycol_heater');
    expect(md).toContain('version 3');
    expect(md).toContain('`' + 'f'.repeat(64) + '`');
    expect(md).toContain(`> ${escapeMarkdown(CAUTION)}`);
    expect(md).toContain('- Fixed inputs: diameter = 0.025 m, fluid_temperature = 330 K, arrangement = inline');
    expect(md).toContain('- Columns left out: Pr, property_temperature, velocity (output), f');
    const table = md.split('\n').filter((l) => l.startsWith('| '));
    expect(mdCells(table[0])).toEqual(['method', 'velocity [m/s]', 'Re [-]', 'Nu [-]', 'h [W/(m^2·K)]', 'flags']);
    expect(mdCells(table[1])).toEqual(['---', '---:', '---:', '---:', '---:', '---']);
    expect(table).toHaveLength(2 + data.rows.length);
    // Row 1: velocity 0.5, Re = 61728.3945, Nu = 762.0789..., h = 19814.05...
    expect(mdCells(table[2])).toEqual(['gnielinski', '0.5', '61730', '762.1', '19810', '']);
    expect(mdCells(table[7])).toEqual(['dittus-boelter', '2', '246900', '2938', '76400', 'out-of-range:Re, out-of-range:Pr']);
  });

  it('escapes pipes and markup in text cells without touching intraword underscores', () => {
    expect(escapeMarkdown('a|b')).toBe('a\\|b');
    expect(escapeMarkdown('*bold* `code` <b>')).toBe('\\*bold\\* \\`code\\` \\<b\\>');
    expect(escapeMarkdown('Nu_x _lead trail_')).toBe('Nu_x \\_lead trail\\_');
    expect(escapeMarkdown('back\\slash')).toBe('back\\\\slash');
    const data = sampleRun();
    data.rows[0].inputs.arrangement = 'odd | value';
    const md = toMarkdown(data, unitOf);
    const row = md.split('\n').filter((l) => l.startsWith('| '))[2];
    expect(mdCells(row)).toHaveLength(7); // arrangement now varies, so it is shown
    expect(row).toContain('odd \\| value');
  });
});

/** Braces balanced, ignoring escaped ones. */
function bracesBalanced(tex: string): boolean {
  let depth = 0;
  const stripped = tex.replace(/\\[{}]/g, '');
  for (const ch of stripped) {
    if (ch === '{') depth++;
    if (ch === '}' && --depth < 0) return false;
  }
  return depth === 0;
}

describe('LaTeX', () => {
  it('escapes every special character', () => {
    expect(escapeLatex('a_b & 50% #1 $x$ {y} ~ ^ \\ <> |')).toBe(
      'a\\_b \\& 50\\% \\#1 \\$x\\$ \\{y\\} \\textasciitilde{} \\textasciicircum{} \\textbackslash{} \\textless{}\\textgreater{} \\textbar{}',
    );
    expect(escapeLatex('[note] 10–25')).toBe('{[}note{]} 10--25');
    expect(escapeLatex('two\nlines')).toBe('two lines');
  });

  it('typesets units and numbers', () => {
    expect(latexUnit('W/(m^2·K)')).toBe('W/(m\\ensuremath{^{2}}\\ensuremath{\\cdot}K)');
    expect(latexUnit('m^3/s')).toBe('m\\ensuremath{^{3}}/s');
    expect(latexUnit('m^-1')).toBe('m\\ensuremath{^{-1}}');
    expect(latexNumber(1.23456e-5)).toBe('$1.235\\times10^{-5}$');
    expect(latexNumber(-3.14159)).toBe('$-3.142$');
    expect(latexNumber(520.04)).toBe('520');
  });

  it('writes a booktabs tabular with the run facts and the caution', () => {
    const data = sampleRun();
    const tex = toLatex(data, unitOf);
    expect(tex).toContain('\\caption{Run 42: Heater tube, 30 \\% glycol \\& water \\#2}');
    expect(tex).toContain('\\begin{tabular}{lrrrrl}');
    expect(tex).toContain('method & velocity [m/s] & Re [-] & Nu [-] & h [W/(m\\ensuremath{^{2}}\\ensuremath{\\cdot}K)] & flags \\\\');
    expect(tex).toContain('gnielinski & 0.5 & 61730 & 762.1 & 19810 &  \\\\');
    expect(tex).toContain('Study: glycol\\_heater (Heater tube, 30 \\% glycol \\& water \\#2), version 3.');
    expect(tex).toContain(`Study file sha256: ${'f'.repeat(64)}.`);
    expect(tex).toContain('Fixed inputs: diameter = 0.025~m, fluid\\_temperature = 330~K, arrangement = inline.');
    expect(tex).toContain(escapeLatex(CAUTION));
    for (const rule of ['\\toprule', '\\midrule', '\\bottomrule']) expect(tex).toContain(rule);
    expect(bracesBalanced(tex)).toBe(true);
    // Every body row has as many cells as the header.
    const body = tex.split('\n').filter((l) => l.endsWith(' \\\\'));
    expect(body).toHaveLength(1 + data.rows.length);
    for (const l of body) expect(l.split(/(?<!\\)&/)).toHaveLength(6);
    // No special character reaches the output unescaped outside commands and comments.
    const text = tex.split('\n').filter((l) => !l.startsWith('%')).join('\n');
    expect(text).not.toMatch(/(?<!\\)[%#_]/);
  });

  it('splits long runs into several tables', () => {
    const data = sampleRun();
    const tex = toLatex(data, unitOf, { rowsPerTable: 4 });
    expect(tex.match(/\\begin\{tabular\}/g)).toHaveLength(2);
    expect(tex).toContain('\\caption{Run 42 (continued, rows 5--6)}');
    expect(tex.match(/Caution/g)).toHaveLength(1);
    expect(bracesBalanced(tex)).toBe(true);
  });
});
