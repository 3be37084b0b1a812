// Killing real `filmsweep run` processes (the compiled build, bin/filmsweep.js) at random
// moments with SIGKILL and SIGTERM, then resuming: the finished run must hold exactly one
// result per point and method, with values identical to an uninterrupted run. Also: two
// runs at once on one database, a reader that never sees half a batch, and bad input
// that leaves no database behind.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import BetterSqlite3 from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeStore, getRunRows, listRuns, openStore } from '../shared/db/index.js';
import { runTableName } from '../shared/db/result-table.js';

// FILMSWEEP_TEST_BIN points the tests at another build of the command (default: this one).
const BIN = resolve(process.env.FILMSWEEP_TEST_BIN ?? 'bin/filmsweep.js');

interface Exit {
  code: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

interface Kill {
  signal: NodeJS.Signals;
  afterMs: number;
  /** Start the clock when stderr first matches this (the run's first progress line); else at spawn. */
  once?: RegExp;
}

function cli(args: string[], kill?: Kill): Promise<Exit> {
  return new Promise((done, fail) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, NO_COLOR: '1' } });
    let stdout = '';
    let stderr = '';
    let timer: NodeJS.Timeout | undefined;
    const arm = () => (timer ??= setTimeout(() => child.kill(kill!.signal), kill!.afterMs));
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => {
      stderr += d;
      if (kill?.once?.test(stderr)) arm();
    });
    if (kill && !kill.once) arm();
    child.on('error', fail);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      done({ code, signal, stdout, stderr });
    });
  });
}

// Small deterministic generator (mulberry32) so a failing sequence of delays can be replayed.
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 2 ** 32;
  };
}

/** The first progress line (stderr without a terminal), printed once the run is in the database. */
const STARTED = /^run \d+ kill-me: \d+ points/m;

let dir: string;
let study: string;
const POINTS = 400 * 100;
const METHODS = 2;

beforeAll(() => {
  if (!existsSync(BIN)) throw new Error(`${BIN} is missing: build first (npm run build)`);
  dir = mkdtempSync(join(tmpdir(), 'filmsweep-interrupt-'));
  study = join(dir, 'kill-me.yaml');
  writeFileSync(
    study,
    `name: kill-me
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: false
sweep:
  over:
    Re: {from: 3.0e3, to: 3.0e6, count: 400, spacing: log}
    Pr: {from: 0.5, to: 500, count: 100, spacing: log}
`,
  );
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Rows of a run, as comparable text: point, method, inputs, outputs, flags. */
async function rowsOf(db: string, runId: number): Promise<string[]> {
  const store = await openStore(db);
  try {
    const { rows } = await getRunRows(store, runId);
    return rows.map((r) => JSON.stringify(r));
  } finally {
    await closeStore(store);
  }
}

describe('interrupting real runs', () => {
  it('loses and duplicates nothing across SIGKILL and SIGTERM at random moments, then resume', async () => {
    const db = join(dir, 'kills.db');
    const t0 = performance.now();
    const clean = await cli(['run', study, '--db', db, '--workers', '2', '--batch-size', '100', '--json']);
    const cleanMs = performance.now() - t0;
    expect(clean.code, clean.stderr).toBe(0);
    const referenceId = JSON.parse(clean.stdout).runs[0].id as number;
    const reference = await rowsOf(db, referenceId);
    expect(reference.length).toBe(POINTS * METHODS);

    const computeMs = 1000 * (JSON.parse(clean.stdout).runs[0].seconds as number);

    const seed = Number(process.env.FILMSWEEP_TEST_SEED ?? Date.now() % 100_000);
    const next = random(seed);
    // Most kills land at a random moment of the sweep itself (the clock starts at the
    // run's first progress line); two land anywhere from the process start, which also
    // covers loading, validation, opening the database and creating the run.
    const kills: Kill[] = [
      ...(['SIGKILL', 'SIGTERM', 'SIGKILL', 'SIGTERM', 'SIGKILL', 'SIGTERM'] as const).map((signal) => ({
        signal,
        afterMs: Math.round(0.6 * computeMs * next()),
        once: STARTED,
      })),
      { signal: 'SIGKILL', afterMs: Math.round(1.2 * cleanMs * next()) },
      { signal: 'SIGTERM', afterMs: Math.round(1.2 * cleanMs * next()) },
    ];
    const log: string[] = [];
    let interruptedMidway = 0;
    for (const kill of kills) {
      const signal = kill.signal;
      const before = new Set((await listRunsOf(db)).map((r) => r.id));
      const killed = await cli(['run', study, '--db', db, '--workers', '2', '--batch-size', '100'], kill);
      const created = (await listRunsOf(db)).filter((r) => !before.has(r.id));
      const where = `seed ${seed}: ${signal} ${kill.afterMs} ms after ${kill.once ? 'the run started' : 'spawn'} (sweep ${Math.round(computeMs)} ms)`;
      log.push(`${where}: ${created.map((r) => `${r.status} at ${r.points_done} points`).join('') || 'no run yet'}`);
      if (created.length === 0) {
        expect(kill.once, where).toBeUndefined(); // only a kill timed from spawn can come that early
        continue;
      }
      expect(created.length, where).toBe(1);
      let run = created[0];
      if (signal === 'SIGTERM' && run.status !== 'done') {
        // A clean stop: batches in flight committed, status interrupted, exit code 2.
        expect(killed.code, `${where}\n${killed.stderr}`).toBe(2);
        expect(run.status, where).toBe('interrupted');
      }
      if (signal === 'SIGKILL' && run.status !== 'done') {
        expect(killed.signal, where).toBe('SIGKILL');
        expect(run.status, where).toBe('running'); // its pid is dead now
      }
      // Counters always match the committed rows: no half batch is ever visible.
      const counts = countRows(db, run.id);
      expect(counts.results, where).toBe(run.results_count);
      expect(counts.results, where).toBe(counts.points * METHODS);
      expect(run.points_done, where).toBe(counts.points);

      if (run.status !== 'done') {
        interruptedMidway++;
        // Interrupt the resume once too, then finish it.
        await cli(['resume', String(run.id), '--db', db, '--workers', '1'], { signal, afterMs: Math.round(0.5 * computeMs * next()), once: STARTED });
        const resumed = await cli(['resume', String(run.id), '--db', db, '--json']);
        const status = (await listRunsOf(db)).find((r) => r.id === run.id)!;
        if (status.status !== 'done' || resumed.code !== 0) {
          // The interrupted resume may have finished the run itself; then resume refuses (exit 1).
          expect(resumed.code, `${where}\n${resumed.stderr}`).toBe(status.status === 'done' ? 1 : 0);
        }
        run = (await listRunsOf(db)).find((r) => r.id === run.id)!;
      }
      expect(run.status, where).toBe('done');
      const counts2 = countRows(db, run.id);
      expect(counts2, where).toEqual({ points: POINTS, results: POINTS * METHODS, distinct: POINTS * METHODS });
      expect(await rowsOf(db, run.id), where).toEqual(reference);
    }
    // The kills timed from the run's start must mostly land mid-sweep, or the test proved nothing.
    expect(interruptedMidway, log.join('\n')).toBeGreaterThanOrEqual(4);
  }, 240_000);
});

describe('concurrency and validation', () => {
  it('finishes two runs started at once on one fresh database', async () => {
    const db = join(dir, 'two.db');
    const [a, b] = await Promise.all([
      cli(['run', study, '--db', db, '--workers', '1', '--batch-size', '50', '--json']),
      cli(['run', study, '--db', db, '--workers', '1', '--batch-size', '50', '--json']),
    ]);
    expect(a.code, a.stderr).toBe(0);
    expect(b.code, b.stderr).toBe(0);
    const runs = await listRunsOf(db);
    expect(runs.map((r) => [r.status, r.points_done, r.results_count])).toEqual([
      ['done', POINTS, POINTS * METHODS],
      ['done', POINTS, POINTS * METHODS],
    ]);
    expect(await rowsOf(db, runs[0].id)).toEqual(await rowsOf(db, runs[1].id));
  }, 120_000);

  it('lets a reader poll while a run writes and never see a half-written batch', async () => {
    const db = join(dir, 'reader.db');
    await cli(['migrate', '--db', db]);
    const running = cli(['run', study, '--db', db, '--workers', '2', '--batch-size', '64']);
    const reader = new BetterSqlite3(db, { readonly: true, timeout: 10_000 });
    let snapshots = 0;
    let finished = false;
    running.then(() => (finished = true));
    try {
      while (!finished) {
        const snap = reader.transaction(() => {
          const run = reader.prepare('select id, points_done, results_count from runs order by id desc limit 1').get() as
            | { id: number; points_done: number; results_count: number }
            | undefined;
          if (!run) return undefined;
          const results = reader.prepare(`select count(*) from ${runTableName(run.id)}`).pluck().get() as number;
          return { ...run, results };
        })();
        if (snap) {
          snapshots++;
          expect(snap.results).toBe(snap.results_count);
          expect(snap.results).toBe(snap.points_done * METHODS);
          expect(snap.points_done % 64 === 0 || snap.points_done === POINTS).toBe(true);
        }
        await new Promise((r) => setTimeout(r, 5));
      }
    } finally {
      reader.close();
    }
    expect((await running).code).toBe(0);
    expect(snapshots).toBeGreaterThan(3);
  }, 120_000);

  it('writes nothing, not even the database file, when a study file is bad (exit 1)', async () => {
    const db = join(dir, 'never.db');
    const bad = join(dir, 'bad.yaml');
    writeFileSync(bad, 'name: Not A Slug\nconfiguration: nowhere\n');
    const r = await cli(['run', study, bad, '--db', db]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/bad\.yaml/);
    expect(existsSync(db)).toBe(false);
  });

  it('prints only one JSON document on stdout with --json', async () => {
    const db = join(dir, 'json.db');
    const r = await cli(['run', study, '--db', db, '--json', '--max-points', String(POINTS)]);
    expect(r.code, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(Object.keys(doc.runs[0]).sort()).toEqual(
      ['flagged', 'id', 'points_done', 'points_total', 'results', 'seconds', 'status', 'study'].sort(),
    );
    expect(doc.runs[0]).toMatchObject({ study: 'kill-me', status: 'done', points_total: POINTS, results: POINTS * METHODS });
    const over = await cli(['run', study, '--db', join(dir, 'json2.db'), '--max-points', '10']);
    expect(over.code).toBe(1);
    expect(existsSync(join(dir, 'json2.db'))).toBe(false);
  });
});

async function listRunsOf(db: string) {
  const store = await openStore(db);
  try {
    return (await listRuns(store)).reverse();
  } finally {
    await closeStore(store);
  }
}

function countRows(db: string, runId: number): { points: number; results: number; distinct: number } {
  const c = new BetterSqlite3(db, { readonly: true });
  const table = runTableName(runId);
  try {
    return c
      .prepare(
        `select (select count(*) from ${table} where seq % ${METHODS} = 0) points,
                (select count(*) from ${table}) results,
                (select count(*) from (select distinct seq from ${table})) "distinct"`,
      )
      .get() as { points: number; results: number; distinct: number };
  } finally {
    c.close();
  }
}
