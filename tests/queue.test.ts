// Distributed runs end to end with the real command: two `filmsweep worker` processes on one
// Redis queue and one database (an SQLite file shared on this machine, and PostgreSQL), a
// `run --queue` that follows the run, and one worker killed with SIGKILL in the middle.
// The run must still finish, with exactly one result per point and method and the values
// of a local `filmsweep run` of the same study.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Queue, QueueEvents } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeStore, openStore } from '../shared/db/index.js';
import { runTableName } from '../shared/db/result-table.js';
import { parseQueueUrl } from '../shared/queue/index.js';
import { freshPgDatabase, serviceUrl, skipReason, uniqueQueueUrl } from './helpers/queue-services.js';

const BIN = resolve(process.env.FILMSWEEP_TEST_BIN ?? 'bin/filmsweep.js');
const REDIS = serviceUrl('FILMSWEEP_TEST_REDIS_URL');
const PG = serviceUrl('FILMSWEEP_TEST_PG_URL');

// Each Pr is a new free-convection solve (about 0.3 ms a point since the Taylor-series
// solver): some seconds of work for two workers, so one can be killed mid-run.
const STUDY = `name: queue-plate
configuration: vertical-plate
methods: [similarity]
inputs:
  Gr: 1.0e6
sweep:
  over:
    Pr: {from: 0.01, to: 1.0e4, count: 24000, spacing: log}
`;
const POINTS = 24000;
const BATCH = 200;
// Short enough that the killed worker's batches come back within a few seconds.
const LOCK = ['--lock-duration', '2', '--stalled-interval', '1'];

function cli(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024, env: { ...process.env, NO_COLOR: '1' } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

interface Proc {
  child: ChildProcess;
  /** stdout, line by line as it comes. */
  lines: string[];
  stderr: () => string;
  exited: Promise<number | null>;
}

function start(...args: string[]): Proc {
  const child = spawn(process.execPath, [BIN, ...args], { env: { ...process.env, NO_COLOR: '1' }, stdio: ['ignore', 'pipe', 'pipe'] });
  const lines: string[] = [];
  let out = '';
  child.stdout!.setEncoding('utf8').on('data', (d: string) => {
    out += d;
    const parts = out.split('\n');
    out = parts.pop()!;
    lines.push(...parts);
  });
  let err = '';
  child.stderr!.setEncoding('utf8').on('data', (d: string) => (err += d));
  const exited = new Promise<number | null>((res) => child.on('exit', (code) => res(code)));
  return { child, lines, stderr: () => err, exited };
}

async function until(what: string, check: () => boolean, ms = 30_000): Promise<void> {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

const jobLines = (p: Proc) => p.lines.filter((l) => / written /.test(l));
const pointsWritten = (p: Proc) => jobLines(p).reduce((sum, l) => sum + Number(/: (\d+) points,/.exec(l)![1]), 0);

describe.skipIf(!REDIS)(`run --queue with two worker processes, one killed mid-run${skipReason('FILMSWEEP_TEST_REDIS_URL', REDIS)}`, () => {
  let dir: string;
  let study: string;
  let localRows: unknown[];
  const procs: Proc[] = [];
  const cleanups: (() => Promise<void>)[] = [];

  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-queue-cli-'));
    study = join(dir, 'queue-plate.yaml');
    writeFileSync(study, STUDY);
    // The reference: the same study run locally into its own SQLite file.
    const db = join(dir, 'local.db');
    const run = cli('run', study, '--db', db, '--workers', '2', '--json');
    expect(run.code, run.stderr).toBe(0);
    localRows = JSON.parse(cli('export', '1', '--db', db, '--format', 'json').stdout).rows;
    expect(localRows).toHaveLength(POINTS);
  });

  afterAll(async () => {
    for (const p of procs) if (p.child.exitCode === null && p.child.signalCode === null) p.child.kill('SIGKILL');
    await Promise.all(procs.map((p) => p.exited));
    for (const c of cleanups) await c().catch(() => {});
    rmSync(dir, { recursive: true, force: true });
  });

  async function killOneWorkerMidRun(db: string) {
    const queueUrl = uniqueQueueUrl(REDIS!);
    const target = parseQueueUrl(queueUrl);
    const queue = new Queue(target.name, { connection: target.connection, prefix: target.prefix });
    const events = new QueueEvents(target.name, { connection: target.connection, prefix: target.prefix });
    cleanups.push(async () => {
      await events.close();
      await queue.obliterate({ force: true });
      await queue.close();
    });
    const stalled: string[] = [];
    events.on('stalled', ({ jobId }) => stalled.push(jobId));
    await events.waitUntilReady();

    const migrate = cli('migrate', '--db', db);
    expect(migrate.code, migrate.stderr).toBe(0);
    const a = start('worker', '--queue', queueUrl, '--db', db, '--workers', '1', ...LOCK);
    const b = start('worker', '--queue', queueUrl, '--db', db, '--workers', '1', ...LOCK);
    procs.push(a, b);
    await until('both workers', () => [a, b].every((w) => w.lines.some((l) => / worker \d+ on /.test(l))));

    const run = start('run', study, '--queue', queueUrl, '--db', db, '--batch-size', String(BATCH), '--json');
    procs.push(run);
    await until('two batches from worker A', () => jobLines(a).length >= 2);
    a.child.kill('SIGKILL');
    await a.exited;
    expect(run.child.exitCode, 'the run must not be over when the worker is killed').toBe(null);

    const code = await run.exited;
    expect(code, run.stderr()).toBe(0);
    const outcome = JSON.parse(run.lines.join('\n')).runs[0];
    expect(outcome).toMatchObject({ status: 'done', points_total: POINTS, points_done: POINTS, results: POINTS });

    // The killed worker's batches were taken back by the stalled check and redone by B.
    expect(stalled.length).toBeGreaterThan(0);
    expect(jobLines(b).length).toBeGreaterThan(0);
    // Every point written exactly once, counting the rows each worker inserted.
    expect(pointsWritten(a) + pointsWritten(b)).toBe(POINTS);

    const store = await openStore(db, { migrate: false });
    try {
      const count = async (where: string) =>
        Number((await store.dialect.all<{ n: unknown }>(`select count(*) as n from ${runTableName(outcome.id)}${where}`))[0].n);
      expect(await count(' where seq % 1 = 0')).toBe(POINTS); // points (one method)
      expect(await count('')).toBe(POINTS); // results
      const run = await store.db.selectFrom('runs').selectAll().where('id', '=', outcome.id).executeTakeFirstOrThrow();
      expect(run).toMatchObject({ status: 'done', points_done: POINTS, results_count: POINTS });
    } finally {
      await closeStore(store);
    }
    const exported = cli('export', String(outcome.id), '--db', db, '--format', 'json');
    expect(exported.code, exported.stderr).toBe(0);
    expect(JSON.parse(exported.stdout).rows).toEqual(localRows);

    b.child.kill('SIGTERM');
    expect(await b.exited).toBe(0);
    expect(b.lines.at(-1)).toMatch(/worker stopped/);
  }

  it('Ctrl-C on run --queue takes its batches off the queue, ends the run interrupted (exit 2) and names resume --queue', async () => {
    const queueUrl = uniqueQueueUrl(REDIS!);
    const target = parseQueueUrl(queueUrl);
    const queue = new Queue(target.name, { connection: target.connection, prefix: target.prefix });
    cleanups.push(async () => {
      await queue.obliterate({ force: true });
      await queue.close();
    });
    const db = join(dir, 'interrupted.db');
    const run = start('run', study, '--queue', queueUrl, '--db', db, '--batch-size', String(BATCH));
    procs.push(run);
    // No worker: the jobs wait until Ctrl-C.
    await until('the queued batches', () => /no worker is taking jobs/.test(run.stderr()));
    expect((await queue.getJobCounts('waiting')).waiting).toBe(POINTS / BATCH);
    run.child.kill('SIGINT');
    expect(await run.exited).toBe(2);
    expect(run.stderr()).toMatch(new RegExp(`run 1 interrupted \\(finish with \`filmsweep resume 1 --queue redis://`));
    expect((await queue.getJobCounts('waiting')).waiting).toBe(0);
    const list = JSON.parse(cli('list', '--db', db, '--json').stdout);
    expect(list.runs[0]).toMatchObject({ id: 1, status: 'interrupted' });
  });

  // About 15 s each on an idle machine; the margin is for a loaded CI machine.
  it('on an SQLite file shared by the processes', async () => {
    await killOneWorkerMidRun(join(dir, 'shared.db'));
  }, 150_000);

  it.skipIf(!PG)(`on PostgreSQL${skipReason('FILMSWEEP_TEST_PG_URL', PG)}`, async () => {
    const pg = await freshPgDatabase(PG!);
    cleanups.push(pg.drop);
    await killOneWorkerMidRun(pg.url);
  }, 150_000);
});

describe('run --queue and worker refuse bad options before anything is written', () => {
  it('a URL that is not redis:// is bad input (exit 1) and no database is created', () => {
    const dir = mkdtempSync(join(tmpdir(), 'filmsweep-queue-bad-'));
    try {
      const study = join(dir, 's.yaml');
      writeFileSync(study, STUDY);
      const db = join(dir, 'never.db');
      const run = cli('run', study, '--db', db, '--queue', 'http://127.0.0.1:6379');
      expect(run.code).toBe(1);
      expect(run.stderr).toMatch(/--queue: expected a redis:\/\/ or rediss:\/\/ URL/);
      const both = cli('run', study, '--db', db, '--queue', 'redis://127.0.0.1:6379', '--workers', '2');
      expect(both.code).toBe(1);
      expect(both.stderr).toMatch(/each `filmsweep worker` sets its own threads/);
      expect(existsSync(db)).toBe(false);
      const worker = cli('worker', '--db', db);
      expect(worker.code).toBe(1);
      expect(worker.stderr).toMatch(/--queue/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
