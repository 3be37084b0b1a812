import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command } from 'commander';
import { parse } from 'yaml';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { register as registerInit } from '../cli/commands/init.js';
import { register as registerSchema } from '../cli/commands/schema.js';
import { InputError } from '../shared/physics/types.js';
import { starterStudy } from '../shared/study/starter.js';
import { studyJsonSchema, studySchema } from '../shared/study/schema.js';

const fixture = (name: string) => fileURLToPath(new URL(`./fixtures/studies/${name}`, import.meta.url));
const yamlOf = (name: string) => parse(readFileSync(fixture(name), 'utf8'));

type Schema = Record<string, unknown>;

// A small JSON Schema (2020-12) checker for exactly the keywords the study schema uses;
// any other keyword throws, so a constraint it does not understand is never passed silently.
const annotations = new Set(['$schema', 'title', 'description', 'default']);
function errors(schema: Schema, value: unknown, path = '$'): string[] {
  const out: string[] = [];
  for (const [k, rule] of Object.entries(schema)) {
    if (annotations.has(k)) continue;
    switch (k) {
      case 'type': {
        const types = Array.isArray(rule) ? rule : [rule];
        if (!types.some((t) => typeMatches(t as string, value))) out.push(`${path}: not ${types.join('|')}`);
        break;
      }
      case 'enum':
        if (!(rule as unknown[]).includes(value)) out.push(`${path}: not in enum`);
        break;
      case 'pattern':
        if (typeof value === 'string' && !new RegExp(rule as string, 'u').test(value)) out.push(`${path}: pattern`);
        break;
      case 'minimum':
        if (typeof value === 'number' && value < (rule as number)) out.push(`${path}: below minimum`);
        break;
      case 'maximum':
        if (typeof value === 'number' && value > (rule as number)) out.push(`${path}: above maximum`);
        break;
      case 'maxItems':
        if (Array.isArray(value) && value.length > (rule as number)) out.push(`${path}: too many items`);
        break;
      case 'minItems':
        if (Array.isArray(value) && value.length < (rule as number)) out.push(`${path}: too few items`);
        break;
      case 'items':
        if (Array.isArray(value)) value.forEach((v, i) => out.push(...errors(rule as Schema, v, `${path}[${i}]`)));
        break;
      case 'anyOf':
        if (!(rule as Schema[]).some((s) => errors(s, value, path).length === 0)) out.push(`${path}: no anyOf branch`);
        break;
      case 'required':
        if (isObject(value)) for (const r of rule as string[]) if (!(r in value)) out.push(`${path}.${r}: required`);
        break;
      case 'properties':
        if (isObject(value)) {
          for (const [p, s] of Object.entries(rule as Record<string, Schema>)) if (p in value) out.push(...errors(s, value[p], `${path}.${p}`));
        }
        break;
      case 'propertyNames':
        if (isObject(value)) for (const p of Object.keys(value)) out.push(...errors(rule as Schema, p, `${path}{${p}}`));
        break;
      case 'additionalProperties':
        if (isObject(value)) {
          const declared = Object.keys((schema.properties as Schema | undefined) ?? {});
          for (const [p, v] of Object.entries(value)) {
            if (declared.includes(p)) continue;
            if (rule === false) out.push(`${path}.${p}: not allowed`);
            else out.push(...errors(rule as Schema, v, `${path}.${p}`));
          }
        }
        break;
      default:
        throw new Error(`unsupported JSON Schema keyword '${k}' at ${path}`);
    }
  }
  return out;
}
function isObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}
function typeMatches(t: string, v: unknown): boolean {
  if (t === 'integer') return Number.isInteger(v);
  if (t === 'array') return Array.isArray(v);
  if (t === 'object') return isObject(v);
  if (t === 'null') return v === null;
  return typeof v === t;
}

describe('JSON Schema of study files', () => {
  const schema = studyJsonSchema() as Schema;

  it('is draft 2020-12 and closed to unknown keys', () => {
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.additionalProperties).toBe(false);
    expect(schema.required).toEqual(['name', 'configuration']);
  });

  it('accepts the DESIGN.md section 5 example, the sample files and the starter', () => {
    expect(errors(schema, yamlOf('design-example.yaml'))).toEqual([]);
    expect(errors(schema, yamlOf('dimensional-units.yaml'))).toEqual([]);
    expect(errors(schema, yamlOf('huge-grid.yaml'))).toEqual([]);
    expect(errors(schema, parse(starterStudy('my-study')))).toEqual([]);
  });

  it('rejects what the zod schema rejects', () => {
    const base = yamlOf('design-example.yaml');
    const bad: [string, unknown][] = [
      ['unknown key', { ...base, colour: 'blue' }],
      ['not a slug', { ...base, name: 'Glycol Tube' }],
      ['no configuration', { ...base, configuration: undefined }],
      ['bad design', { ...base, sweep: { ...base.sweep, design: 'random' } }],
      // A range without count or step is well formed (a latin hypercube's); parse.ts refuses it in other designs.
      ['range without from', { ...base, sweep: { over: { Re: { to: 2, count: 3 } } } }],
      ['target without within', { ...base, target: { output: 'Nu', value: 500, adjust: 'Re' } }],
      ['target interval of three', { ...base, target: { output: 'Nu', value: 500, adjust: 'Re', within: [1, 2, 3] } }],
      ['tolerance not a number or text', { ...base, tolerances: { Re: [1] } }],
      ['uncertainty with too few samples', { ...base, uncertainty: { samples: 3 } }],
      ['count below 2', { ...base, sweep: { over: { Re: { from: 1, to: 2, count: 1 } } } }],
      ['bad tolerance', { ...base, checks: [{ ...base.checks[0], tolerance: '3 percent' }] }],
      ['negative baseline tolerance', { ...base, baseline: { tolerance: -1 } }],
      ['fluid without k', { ...base, fluid: { constant: { rho: 1, cp: 1, mu: 1 } } }],
    ];
    for (const [what, doc] of bad) {
      const clean = JSON.parse(JSON.stringify(doc));
      expect(studySchema.safeParse(clean).success, what).toBe(false);
      expect(errors(schema, clean).length, what).toBeGreaterThan(0);
    }
  });
});

describe('filmsweep schema and init', () => {
  let dir: string;
  let output: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-init-'));
    output = '';
    vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
      output += String(chunk);
      return true;
    });
  });
  afterEach(() => {
    vi.restoreAllMocks();
    rmSync(dir, { recursive: true, force: true });
  });
  const run = async (...args: string[]) => {
    const program = new Command().exitOverride();
    registerSchema(program);
    registerInit(program);
    await program.parseAsync(['node', 'filmsweep', ...args]);
  };

  it('schema prints the JSON Schema', async () => {
    await run('schema');
    expect(JSON.parse(output)).toEqual(studyJsonSchema());
  });

  it('init writes NAME.yaml, or --out FILE, and never overwrites', async () => {
    const cwd = process.cwd();
    process.chdir(dir);
    try {
      await run('init', 'tube-study');
    } finally {
      process.chdir(cwd);
    }
    expect(readFileSync(join(dir, 'tube-study.yaml'), 'utf8')).toBe(starterStudy('tube-study'));

    const out = join(dir, 'other.yaml');
    await run('init', 'tube-study', '--out', out);
    expect(readFileSync(out, 'utf8')).toBe(starterStudy('tube-study'));

    writeFileSync(out, 'precious\n');
    await expect(run('init', 'tube-study', '--out', out)).rejects.toThrow(InputError);
    await expect(run('init', 'tube-study', '--out', out)).rejects.toThrow(/already exists/);
    expect(readFileSync(out, 'utf8')).toBe('precious\n');
  });

  it('init refuses a name that is not a slug, writing nothing', async () => {
    const out = join(dir, 'x.yaml');
    await expect(run('init', 'Tube Study', '--out', out)).rejects.toThrow(/not a slug/);
    expect(existsSync(out)).toBe(false);
  });
});
