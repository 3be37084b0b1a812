// The compiled command on PostgreSQL (bin/filmsweep.js with --db postgres://… and with
// FILMSWEEP_DB): run, list, show, check, export and resume (after a kill -9) give the same
// rows as the same commands on a SQLite file, value for value. Needs FILMSWEEP_TEST_PG_URL (skipped
// without it, a failure under CI).
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeStore, getRun, getRunRows, openStore, resolveRunRef } from '../shared/db/index.js';
import { runTableName } from '../shared/db/result-table.js';
import { PG_URL, createTestDatabase, type TestDatabase } from './helpers/stores.js';

const BIN = resolve(process.env.FILMSWEEP_TEST_BIN ?? 'bin/filmsweep.js');
const STUDY = resolve('studies/probe-in-duct.yaml');

function cli(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], {
    encoding: 'utf8',
    env: { ...process.env, NO_COLOR: '1', FILMSWEEP_DB: '', ...env },
    timeout: 60_000,
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe.skipIf(!PG_URL)('filmsweep on PostgreSQL', () => {
  let pg: TestDatabase;
  let dir: string;
  let sqliteFile: string;

  beforeAll(async () => {
    pg = await createTestDatabase('postgres', 'cli');
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-pg-cli-'));
    sqliteFile = join(dir, 'local.db');
  });
  afterAll(async () => {
    await pg?.drop();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('runs a study with --db postgres://… and exports exactly the rows of the same run on SQLite', () => {
    const onPg = cli(['run', STUDY, '--db', pg.location, '--workers', '2', '--json']);
    expect(onPg.code, onPg.stderr).toBe(0);
    const onSqlite = cli(['run', STUDY, '--db', sqliteFile, '--workers', '2', '--json']);
    expect(onSqlite.code, onSqlite.stderr).toBe(0);

    const exported = (db: string) => {
      const r = cli(['export', 'latest', '--db', db, '--format', 'json']);
      expect(r.code, r.stderr).toBe(0);
      return JSON.parse(r.stdout) as { run: Record<string, unknown>; rows: { method: string; inputs: object; outputs: object; flags: string[] }[] };
    };
    const a = exported(pg.location);
    const b = exported(sqliteFile);
    expect(a.rows).toHaveLength(8 * 3);
    // Identical values, key order included (PostgreSQL's json keeps the text as written).
    expect(JSON.stringify(a.rows)).toBe(JSON.stringify(b.rows));
    for (const key of ['study', 'status', 'points_total', 'points_done', 'results_count', 'flagged_count', 'methods', 'yaml_hash']) {
      expect(a.run[key], key).toEqual(b.run[key]);
    }
    const csv = (db: string) => cli(['export', 'latest', '--db', db, '--format', 'csv']).stdout;
    expect(csv(pg.location)).toBe(csv(sqliteFile));
  });

  it('lists, shows and checks through FILMSWEEP_DB=postgres://…, with the password kept out of messages', () => {
    const env = { FILMSWEEP_DB: pg.location };
    const list = cli(['list', '--json'], env);
    expect(list.code, list.stderr).toBe(0);
    expect(JSON.parse(list.stdout).runs.map((r: { study: string; status: string }) => [r.study, r.status])).toEqual([['probe-in-duct', 'done']]);
    const show = cli(['show', 'latest'], env);
    expect(show.code, show.stderr).toBe(0);
    expect(show.stdout).toMatch(/probe-in-duct/);
    const check = cli(['check', STUDY], env);
    expect(check.code, check.stdout + check.stderr).toBe(0);
    const missing = cli(['show', '999'], env);
    expect(missing.code).toBe(1);
    const password = new URL(pg.location).password;
    if (password) expect(missing.stderr + missing.stdout).not.toContain(`:${password}@`);
  });

  it('loses nothing to a kill -9 mid-run: resume finishes with exactly the rows of an uninterrupted SQLite run', async () => {
    const study = join(dir, 'kill-me.yaml');
    writeFileSync(
      study,
      `name: pg-kill-me
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 3.0e3, to: 1.0e6, count: 150, spacing: log}
    Pr: {from: 0.7, to: 100, count: 400, spacing: log}
`,
    );
    const POINTS = 150 * 400;
    const child = spawn(process.execPath, [BIN, 'run', study, '--db', pg.location, '--workers', '2'], { stdio: 'ignore' });
    const exited = new Promise<void>((done) => child.on('exit', () => done()));
    const store = await openStore(pg.location);
    try {
      let runId: number | undefined;
      for (const end = Date.now() + 40_000; Date.now() < end; await new Promise((r) => setTimeout(r, 50))) {
        const [latest] = await store.dialect.all<{ id: number; points_done: number }>(
          "select r.id, r.points_done from runs r join study_versions v on v.id = r.study_version_id join studies s on s.id = v.study_id where s.name = 'pg-kill-me'",
        );
        if (latest && latest.points_done > 0) {
          runId = latest.id;
          break;
        }
      }
      expect(runId, 'the run wrote a first batch').toBeDefined();
      child.kill('SIGKILL');
      await exited;
      const killed = (await getRun(store, runId!))!;
      expect(killed.status).toBe('running'); // nobody could mark it
      expect(killed.points_done).toBeLessThan(POINTS);
      // The counters match the committed rows exactly: batches are all or nothing.
      const [{ n }] = await store.dialect.all<{ n: number }>(`select count(*) as n from ${runTableName(runId!)}`);
      expect(Number(n)).toBe(killed.results_count);

      const resumed = cli(['resume', String(runId), '--db', pg.location, '--workers', '2']);
      expect(resumed.code, resumed.stderr).toBe(0);
      const local = cli(['run', study, '--db', sqliteFile, '--workers', '2']);
      expect(local.code, local.stderr).toBe(0);
      const sqlite = await openStore(sqliteFile);
      try {
        const want = await getRunRows(sqlite, (await resolveRunRef(sqlite, 'latest')).id);
        const got = await getRunRows(store, runId!);
        expect(got.run).toMatchObject({ status: 'done', points_done: POINTS, results_count: 2 * POINTS, flagged_count: want.run.flagged_count });
        expect(got.rows).toHaveLength(2 * POINTS);
        expect(JSON.stringify(got.rows)).toBe(JSON.stringify(want.rows));
      } finally {
        await closeStore(sqlite);
      }
    } finally {
      child.kill('SIGKILL');
      await closeStore(store);
    }
  }, 120_000);

  it('reports an unreachable server as an error, not a crash', () => {
    const url = new URL(pg.location);
    url.port = '9'; // nothing listens on the discard port
    const r = cli(['list', '--db', url.toString()]);
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/ECONNREFUSED|connect/);
  });
});
