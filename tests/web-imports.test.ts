// The dashboard bundle must stay browser-safe: no shared/db, shared/runner, server/,
// Node built-ins or server-only packages, directly or through shared/ (DESIGN.md §4).
// The Vite build has the same guard as a plugin (vite.config.ts); this test reads the
// sources without building.
import { builtinModules } from 'node:module';
import { existsSync, mkdtempSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const repo = fileURLToPath(new URL('..', import.meta.url));

const SERVER_ONLY_DIRS = ['shared/db', 'shared/runner', 'server'];
const SERVER_ONLY_PACKAGES = ['better-sqlite3', 'kysely', 'piscina', 'express', 'multer', 'nodemailer', 'exceljs', 'cookie-parser', 'bcryptjs', 'express-rate-limit', 'cli-progress', 'commander'];
const builtins = new Set(builtinModules.flatMap((m) => [m, `node:${m}`]));

function sourcesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) return sourcesUnder(p);
    return /\.(ts|tsx)$/.test(name) && !name.endsWith('.d.ts') ? [p] : [];
  });
}

function specifiers(code: string): string[] {
  const found: string[] = [];
  const re = /(?:import|export)\s+(?:type\s+)?(?:[^'"`;]*?\sfrom\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;
  for (const m of code.matchAll(re)) found.push(m[1] ?? m[2]);
  return found;
}

/** `./x.js` → the .ts/.tsx file it names, as TypeScript and Vite resolve it. */
function resolveRelative(from: string, spec: string): string | undefined {
  const base = path.resolve(path.dirname(from), spec);
  const candidates = [base, base.replace(/\.js$/, '.ts'), base.replace(/\.js$/, '.tsx'), `${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts')];
  return candidates.find((c) => existsSync(c) && statSync(c).isFile());
}

/** Every forbidden import reachable from `entries`, as "importer → target". */
function forbiddenImports(root: string, entries: string[]): string[] {
  const problems: string[] = [];
  const seen = new Set<string>();
  const queue = [...entries];
  while (queue.length) {
    const file = queue.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    if (!/\.(ts|tsx)$/.test(file)) continue;
    for (const spec of specifiers(readFileSync(file, 'utf8'))) {
      const where = path.relative(root, file);
      if (spec.startsWith('.')) {
        const target = resolveRelative(file, spec);
        if (!target) continue;
        const rel = path.relative(root, target).split(path.sep).join('/');
        if (SERVER_ONLY_DIRS.some((d) => rel === d || rel.startsWith(`${d}/`))) problems.push(`${where} → ${rel}`);
        else queue.push(target);
      } else {
        const pkg = spec.startsWith('@') ? spec.split('/').slice(0, 2).join('/') : spec.split('/')[0];
        if (builtins.has(spec) || builtins.has(pkg)) problems.push(`${where} → ${spec} (Node built-in)`);
        if (SERVER_ONLY_PACKAGES.includes(pkg)) problems.push(`${where} → ${spec} (server-only package)`);
      }
    }
  }
  return problems;
}

describe('web/src imports', () => {
  it('reach no server-only code, directly or through shared/', () => {
    const files = sourcesUnder(path.join(repo, 'web', 'src'));
    expect(files.length).toBeGreaterThan(10);
    expect(forbiddenImports(repo, files)).toEqual([]);
  });

  it("takes the run queries' shapes from their one definition (shared/export/run-data.ts) instead of declaring them again", () => {
    const shapes = ['MethodSummary', 'RunColumns', 'ResultsPage', 'ResultPageRow', 'ResultRowDto', 'ChartSeries', 'ChartData', 'CompareRow', 'Comparison', 'CompareResponse'];
    const declared: string[] = [];
    for (const file of sourcesUnder(path.join(repo, 'web', 'src'))) {
      const code = readFileSync(file, 'utf8');
      // A declaration of its own: an interface with a body, or a type spelled out as an object.
      for (const m of code.matchAll(/\b(?:interface\s+(\w+)(?:<[^>]*>)?\s*\{|type\s+(\w+)\s*=\s*\{)/g)) {
        const name = m[1] ?? m[2];
        if (shapes.includes(name)) declared.push(`${path.relative(repo, file)}: ${name}`);
      }
    }
    // ChartData may extend the shared one with the API's measured overlay.
    expect(declared.filter((d) => !d.endsWith(': ChartData'))).toEqual([]);
    expect(readFileSync(path.join(repo, 'web', 'src', 'api', 'types.ts'), 'utf8')).toContain("from '../../../shared/export/run-data.js'");
  });

  it('the scanner finds a forbidden import two files away', () => {
    const root = mkdtempSync(path.join(tmpdir(), 'fs-web-guard-'));
    try {
      mkdirSync(path.join(root, 'web', 'src'), { recursive: true });
      mkdirSync(path.join(root, 'shared', 'export'), { recursive: true });
      mkdirSync(path.join(root, 'shared', 'db'), { recursive: true });
      writeFileSync(path.join(root, 'web', 'src', 'main.tsx'), "import { x } from '../../shared/export/a.js';\nimport 'react';\n");
      writeFileSync(path.join(root, 'shared', 'export', 'a.ts'), "export { y as x } from '../db/store.js';\nimport { readFileSync } from 'node:fs';\n");
      writeFileSync(path.join(root, 'shared', 'db', 'store.ts'), "import Database from 'better-sqlite3';\nexport const y = 1;\n");
      const problems = forbiddenImports(root, [path.join(root, 'web', 'src', 'main.tsx')]);
      expect(problems).toEqual(['shared/export/a.ts → shared/db/store.ts', 'shared/export/a.ts → node:fs (Node built-in)']);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
