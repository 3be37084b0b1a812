// Start-up of the command line: registering the commands loads only commander and small
// modules of our own; each command loads its dependencies when it runs. Checked by the
// modules a real process loads (timing is measured by `npm run bench -- startup`).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { cliPath, repoRoot } from './helpers/cli.js';

const tracer = fileURLToPath(new URL('./helpers/import-trace.mjs', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'fs-startup-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The npm packages a `filmsweep …` process loads, and its exit status. */
function packagesLoaded(args: string[]): { status: number | null; packages: string[]; stdout: string } {
  const trace = join(dir, `${args.join('_').replace(/[^A-Za-z0-9]+/g, '_')}.txt`);
  const r = spawnSync(process.execPath, ['--import', tracer, cliPath, ...args], {
    encoding: 'utf8',
    cwd: repoRoot,
    env: { ...process.env, FILMSWEEP_IMPORT_TRACE: trace, FILMSWEEP_DB: join(dir, 'none.db') },
  });
  const urls = readFileSync(trace, 'utf8').split('\n').filter(Boolean);
  const packages = new Set(urls.flatMap((u) => /\/node_modules\/((?:@[^/]+\/)?[^/]+)\//.exec(u)?.[1] ?? []));
  return { status: r.status, packages: [...packages].sort(), stdout: r.stdout };
}

// Packages no command needs just to start: each costs tens to hundreds of milliseconds.
const HEAVY = ['better-sqlite3', 'bullmq', 'exceljs', 'express', 'kysely', 'mathjs', 'pg', 'piscina', 'yaml', 'zod', 'nodemailer', 'cli-progress'];

describe('filmsweep start-up', () => {
  it('--version and --help load commander and a few small modules, none of the heavy packages', () => {
    for (const args of [['--version'], ['--help'], ['run', '--help'], ['serve', '--help']]) {
      const r = packagesLoaded(args);
      expect(r.status, args.join(' ')).toBe(0);
      expect(r.packages, args.join(' ')).toContain('commander');
      expect(r.packages.filter((p) => HEAVY.includes(p)), args.join(' ')).toEqual([]);
      // commander, and what a help text needs (the password rules of `user add`: bcryptjs, p-limit).
      expect(r.packages.length, `${args.join(' ')}: ${r.packages.join(', ')}`).toBeLessThanOrEqual(5);
    }
  });

  it('methods and a dimensionless solve load the physics, not the database, server or unit library', () => {
    const methods = packagesLoaded(['methods']);
    expect(methods.status).toBe(0);
    expect(methods.stdout).toContain('gnielinski');
    const solve = packagesLoaded(['solve', 'pipe', '--set', 'Re=1e5', '--set', 'Pr=0.7', '--json']);
    expect(solve.status).toBe(0);
    expect(JSON.parse(solve.stdout).rows.length).toBeGreaterThan(0);
    for (const r of [methods, solve]) expect(r.packages.filter((p) => HEAVY.includes(p))).toEqual([]);
  });

  it('a value with units loads the unit library when it is needed (and the trace sees it)', () => {
    const r = packagesLoaded(['fluid', 'water', '--temperature', '40 degC', '--json']);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).temperature).toBeCloseTo(313.15, 10);
    expect(r.packages).toContain('mathjs');
  });
});
