// `filmsweep check studies/*.yaml`: the demo studies pass their published checks and
// match their committed baselines; a drifted value or a wrong expectation exits 3.
import { copyFileSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { repoRoot, runCli } from './helpers/cli.js';

const studies = readdirSync(join(repoRoot, 'studies'))
  .filter((f) => f.endsWith('.yaml'))
  .map((f) => join('studies', f));

describe('demo studies', () => {
  it('there are at least five, each with checks and a committed baseline', () => {
    expect(studies.length).toBeGreaterThanOrEqual(5);
    for (const s of studies) {
      const text = readFileSync(join(repoRoot, s), 'utf8');
      expect(text, s).toMatch(/checks:\s*\n\s*#/); // each check is preceded by its source comment
      expect(readdirSync(join(repoRoot, 'studies'))).toContain(s.replace('studies/', '').replace('.yaml', '.baseline.json'));
    }
  });

  it('filmsweep check studies/*.yaml passes and writes JUnit XML', () => {
    const dir = mkdtempSync(join(tmpdir(), 'fs-check-'));
    const junit = join(dir, 'report.xml');
    const r = runCli(['check', ...studies, '--db', join(dir, 'ci.db'), '--junit', junit]);
    expect(r.status, r.stdout + r.stderr).toBe(0);
    for (const s of studies) expect(r.stdout).toContain(`ok    ${s}`);
    const xml = readFileSync(junit, 'utf8');
    expect(xml).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>/);
    expect(xml).toMatch(/<testsuites name="filmsweep" tests="\d+" failures="0"/);
    expect((xml.match(/<testsuite /g) ?? []).length).toBe(studies.length);
  });
});

describe('check failures', () => {
  function copyStudy(name: string) {
    const dir = mkdtempSync(join(tmpdir(), 'fs-drift-'));
    copyFileSync(join(repoRoot, 'studies', `${name}.yaml`), join(dir, `${name}.yaml`));
    copyFileSync(join(repoRoot, 'studies', `${name}.baseline.json`), join(dir, `${name}.baseline.json`));
    return dir;
  }

  it('a drifted baseline value exits 3 and says what drifted', () => {
    const dir = copyStudy('probe-in-duct');
    const path = join(dir, 'probe-in-duct.baseline.json');
    const baseline = JSON.parse(readFileSync(path, 'utf8'));
    baseline.rows[3].outputs.Nu *= 1.001;
    writeFileSync(path, JSON.stringify(baseline, null, 2));
    const junit = join(dir, 'r.xml');
    const r = runCli(['check', join(dir, 'probe-in-duct.yaml'), '--db', join(dir, 'x.db'), '--junit', junit]);
    expect(r.status).toBe(3);
    expect(r.stdout).toMatch(/FAIL/);
    expect(r.stdout).toMatch(/Nu/);
    expect(readFileSync(junit, 'utf8')).toMatch(/failures="1"/);
    // A looser tolerance from the command line lets the same drift pass.
    const loose = runCli(['check', join(dir, 'probe-in-duct.yaml'), '--db', join(dir, 'x.db'), '--tolerance', '0.5%']);
    expect(loose.status, loose.stdout).toBe(0);
  });

  it('a study check that disagrees exits 3; --update-baseline rewrites the baseline', () => {
    const dir = copyStudy('heat-recovery-coil');
    const file = join(dir, 'heat-recovery-coil.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('expect: {Nu: 87.9}', 'expect: {Nu: 80.0}'));
    const r = runCli(['check', file, '--db', join(dir, 'x.db')]);
    expect(r.status).toBe(3);
    expect(r.stdout).toMatch(/zukauskas-bank/);
    const missing = mkdtempSync(join(tmpdir(), 'fs-nobase-'));
    copyFileSync(join(repoRoot, 'studies', 'probe-in-duct.yaml'), join(missing, 'probe-in-duct.yaml'));
    const none = runCli(['check', join(missing, 'probe-in-duct.yaml'), '--db', join(missing, 'x.db')]);
    expect(none.status).toBe(3);
    expect(none.stdout).toMatch(/no baseline/);
    const update = runCli(['check', join(missing, 'probe-in-duct.yaml'), '--db', join(missing, 'x.db'), '--update-baseline']);
    expect(update.status).toBe(0);
    const again = runCli(['check', join(missing, 'probe-in-duct.yaml'), '--db', join(missing, 'x.db')]);
    expect(again.status, again.stdout).toBe(0);
  });
});
