// The run-related commands of the compiled build (bin/filmsweep.js): migrate, run, list,
// show and resume, their JSON documents, summaries and exit codes.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// FILMSWEEP_TEST_BIN points the tests at another build of the command (default: this one).
const BIN = resolve(process.env.FILMSWEEP_TEST_BIN ?? 'bin/filmsweep.js');

let dir: string;
let db: string;
let study: string;

function cli(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1', FILMSWEEP_DB: db } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-cli-'));
  db = join(dir, 'cli.db');
  study = join(dir, 'tube.yaml');
  writeFileSync(
    study,
    `name: cli-tube
title: Tube, dimensionless
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 2.0e3, to: 2.0e5, count: 12, spacing: log}
    Pr: [0.7, 7]
`,
  );
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('filmsweep migrate, run, list, show, resume', () => {
  it('lists nothing and creates no file before the first run', () => {
    const r = cli('list', '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).toEqual({ runs: [] });
    expect(existsSync(db)).toBe(false);
    expect(cli('show', 'latest').code).toBe(1);
    expect(existsSync(db)).toBe(false);
  });

  it('migrate applies the schema once, then has nothing to do', () => {
    const first = cli('migrate');
    expect(first.code, first.stderr).toBe(0);
    expect(first.stdout).toMatch(/applied 0001_initial/);
    expect(cli('migrate').stdout).toMatch(/up to date/);
  });

  it('run prints the summary table per method with the run id; show and list agree', () => {
    const r = cli('run', study, '--workers', '2');
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^run 1 {2}cli-tube \(version 1\) {2}done {2}24\/24 points, 48 results, \d+ flagged/);
    expect(r.stdout).toMatch(/\ngnielinski +\d+ +24 +\d+ +[\d.]+ +[\d.]+/);
    expect(r.stdout).toMatch(/\ndittus-boelter +\d+ +24 +\d+ /);

    const show = JSON.parse(cli('show', 'latest', '--json').stdout);
    expect(show.run).toMatchObject({ id: 1, study: 'cli-tube', title: 'Tube, dimensionless', status: 'done', workers: 2 });
    expect(show.error).toBeNull();
    expect(show.summary.map((m: { method: string; points: number }) => [m.method, m.points])).toEqual([
      ['gnielinski', 24],
      ['dittus-boelter', 24],
    ]);
    // Re = 2000 is below Dittus–Boelter's turbulent range: those points are flagged.
    expect(show.summary[1].flagged_points).toBeGreaterThan(0);
    expect(show.summary[0].nu_name).toBe('Nu');
    expect(show.summary[0].nu_max).toBeGreaterThan(show.summary[0].nu_min);

    const text = cli('show', '1');
    expect(text.stdout).toMatch(/status +done/);
    expect(text.stdout).toMatch(/methods +gnielinski v\d+, dittus-boelter v\d+/);

    const list = JSON.parse(cli('list', '--json').stdout);
    expect(list.runs).toHaveLength(1);
    expect(Object.keys(list.runs[0]).sort()).toEqual(
      ['finished_at', 'id', 'points_done', 'points_total', 'started_at', 'status', 'study'].sort(),
    );
  });

  it('resume refuses a done run (exit 1) and unknown references', () => {
    const r = cli('resume', '1');
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/already done/);
    expect(cli('resume', '99').code).toBe(1);
    expect(cli('show', 'nope').code).toBe(1);
  });

  it('a second run of the same file is a new run of the same study version; an edit makes version 2', () => {
    expect(cli('run', study, '--workers', '1', '--json').code).toBe(0);
    writeFileSync(study, `name: cli-tube\nconfiguration: pipe\nmethods: [gnielinski]\nsweep:\n  over:\n    Re: [1.0e4]\n    Pr: [0.7]\n`);
    const r = JSON.parse(cli('run', study, '--json').stdout);
    expect(r.runs[0]).toMatchObject({ id: 3, status: 'done', points_total: 1, results: 1 });
    const versions = JSON.parse(cli('list', '--json').stdout).runs.map((x: { id: number }) => JSON.parse(cli('show', String(x.id), '--json').stdout).run.study_version);
    expect(versions).toEqual([2, 1, 1]);
  });
});
