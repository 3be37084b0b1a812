// Issue 10 item 7: a server killed during a run left it `running` for ever. At start-up
// `serve` (startServer, and the compiled `filmsweep serve`) and `filmsweep worker` mark
// this host's runs whose process is gone `interrupted` and remove pushes they never
// finished; runs of other hosts and of live processes are left alone. A researcher then
// resumes such a run with POST /api/runs/:id/resume: it finishes in the background with
// every point computed once. Also `serve`'s start-up lines about links in e-mails (item 2).
// SQLite, and PostgreSQL when FILMSWEEP_TEST_PG_URL is set (the worker needs
// FILMSWEEP_TEST_REDIS_URL).
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../server/index.js';
import { closeStore, getRun, openStore, type Store } from '../shared/db/index.js';
import { createUser } from '../shared/db/users.js';
import { hostName, prepareStudy, runStudy } from '../shared/runner/index.js';
import { parseStudy } from '../shared/study/index.js';
import { cliPath, repoRoot } from './helpers/cli.js';
import { skipReason, serviceUrl, uniqueQueueUrl } from './helpers/queue-services.js';
import { Client, PASSWORD, waitForRun } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

const STUDY = `name: killed-sweep
configuration: pipe
methods: [gnielinski, dittus-boelter]
inputs:
  heating: true
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: 400, spacing: log}
    Pr: [0.7, 5, 50]
`;
const TOTAL = 1200;

/**
 * A process id no process has: one above the kernel's pid_max. (The id of a child that
 * has exited can be handed out again within seconds on a busy machine, threads included,
 * and would then look alive.)
 */
function deadPid(): number {
  let max = 4_194_304; // Linux's ceiling on 64-bit
  try {
    max = Number(readFileSync('/proc/sys/kernel/pid_max', 'utf8').trim()) || max;
  } catch {
    // not Linux: the ceiling above is still beyond any process id there
  }
  return max + 1;
}

/** A run of STUDY stopped after its first batches, then made to look like its process was killed. */
async function killedRun(store: Store, pid: number, host = hostName()): Promise<number> {
  const prepared = prepareStudy(parseStudy(STUDY, 'killed-sweep.yaml'));
  const stop = new AbortController();
  const outcome = await runStudy(store, prepared, { workers: 1, batchSize: 100, stop: stop.signal, onProgress: () => stop.abort() });
  expect(outcome.status).toBe('interrupted');
  expect(outcome.points_done).toBeLessThan(TOTAL);
  await store.db.updateTable('runs').set({ status: 'running', finished_at: null, pid, host }).where('id', '=', outcome.id).execute();
  return outcome.id;
}

async function countPoints(store: Store, runId: number): Promise<{ points: number; distinct: number; results: number }> {
  const [p] = await store.dialect.all<{ n: unknown; d: unknown }>('select count(*) as n, count(distinct idx) as d from points where run_id = ?', [runId]);
  const [r] = await store.dialect.all<{ n: unknown }>('select count(*) as n from results where run_id = ?', [runId]);
  return { points: Number(p.n), distinct: Number(p.d), results: Number(r.n) };
}

describe.each(STORE_KINDS)('on %s', (kind) => {
  describe('item 7: serve reconciles dead runs at start-up; a researcher resumes them', () => {
    let database: TestDatabase;
    let server: RunningServer;
    let live: ChildProcess;
    const ids: Record<string, number> = {};

    beforeAll(async () => {
      database = await createTestDatabase(kind, 'reconcile');
      const store = await openStore(database.location);
      live = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 120000)'], { stdio: 'ignore' });
      try {
        ids.dead = await killedRun(store, deadPid());
        ids.otherHost = await killedRun(store, deadPid(), 'another-machine');
        ids.alive = await killedRun(store, live.pid!);
        ids.done = (await runStudy(store, prepareStudy(parseStudy(STUDY.replace('count: 400', 'count: 3'), 'small.yaml')), { workers: 1 })).id;
        // A push the server never finished: made as the server's own run, rows half written.
        ids.push = await killedRun(store, deadPid());
        await store.db.updateTable('runs').set({ pushed_from: 'ci-runner' }).where('id', '=', ids.push).execute();
        for (const [role, email] of [['researcher', 'rafael@example.org'], ['viewer', 'vera@example.org'], ['lead', 'lena@example.org']] as const) {
          await createUser(store, { email, role, password: PASSWORD, cost: 4 });
        }
      } finally {
        await closeStore(store);
      }
      server = await startServer({ db: database.location, port: 0, host: '127.0.0.1', webDir: null, bcryptCost: 4, workers: 1, log: () => {} });
    }, 120_000);
    afterAll(async () => {
      live?.kill();
      await server?.close();
      await database?.drop();
    });

    const signIn = async (email: string) => {
      const c = new Client(server.url);
      const r = await c.json('POST', '/api/session', { json: { email, password: PASSWORD } });
      c.csrfToken = r.body.csrfToken;
      return c;
    };

    it('marks this host\'s runs with a dead process interrupted, removes unfinished pushes, and leaves the rest alone', async () => {
      const store = server.app.context.store;
      expect(server.reconciled).toEqual({ interrupted: [ids.dead], removed: [ids.push] });
      const dead = await store.db.selectFrom('runs').select(['status', 'error', 'finished_at']).where('id', '=', ids.dead).executeTakeFirstOrThrow();
      expect(dead.status).toBe('interrupted');
      expect(dead.error).toMatch(/ended without finishing the run; resume it/);
      expect(dead.finished_at).not.toBeNull();
      expect(await getRun(store, ids.push)).toBeUndefined();
      expect(await countPoints(store, ids.push)).toEqual({ points: 0, distinct: 0, results: 0 });
      expect((await getRun(store, ids.otherHost))!.status).toBe('running');
      expect((await getRun(store, ids.alive))!.status).toBe('running');
      const lead = await signIn('lena@example.org');
      const audit = (await lead.json('GET', '/api/audit?action=runs-reconciled')).body.entries;
      expect(audit[0].detail).toMatchObject({ by: 'serve', interrupted: [ids.dead], removed_unfinished_pushes: [ids.push] });
    });

    it('resumes an interrupted run for a researcher (202), finishing every point exactly once, and refuses what cannot be resumed', async () => {
      const store = server.app.context.store;
      const viewer = await signIn('vera@example.org');
      expect((await viewer.json('POST', `/api/runs/${ids.dead}/resume`)).status).toBe(403);
      const researcher = await signIn('rafael@example.org');
      const before = await countPoints(store, ids.dead);
      const r = await researcher.json('POST', `/api/runs/${ids.dead}/resume`);
      expect(r.status, JSON.stringify(r.body)).toBe(202);
      expect(r.body.run).toMatchObject({ id: ids.dead, status: 'running' });
      expect((await researcher.json('POST', `/api/runs/${ids.dead}/resume`)).status).toBe(409); // already running here
      const done = await waitForRun(researcher, ids.dead, 120_000);
      expect(done.run).toMatchObject({ status: 'done', points_done: TOTAL, results_count: 2 * TOTAL });
      expect(await countPoints(store, ids.dead)).toEqual({ points: TOTAL, distinct: TOTAL, results: 2 * TOTAL });
      expect(before.points).toBeGreaterThan(0);

      for (const [id, message] of [
        [ids.dead, /already done/],
        [ids.done, /already done/],
        [ids.otherHost, /still running/],
        [ids.alive, /still running/],
        [999999, /not found/],
      ] as const) {
        const refused = await researcher.json('POST', `/api/runs/${id}/resume`);
        expect(refused.status, String(id)).toBe(id === 999999 ? 404 : 409);
        expect(refused.body.error.message).toMatch(message);
      }
      const lead = await signIn('lena@example.org');
      const audit = (await lead.json('GET', '/api/audit?action=run-resumed')).body.entries;
      expect(audit[0]).toMatchObject({ user: 'rafael@example.org', detail: { run: ids.dead, was: 'interrupted' } });
    }, 180_000);

    it('refuses to resume a pushed run (its points were renumbered when pushed)', async () => {
      const store = server.app.context.store;
      const stopped = await killedRun(store, deadPid());
      await store.db.updateTable('runs').set({ status: 'interrupted', pushed_from: 'ci-runner', pid: null }).where('id', '=', stopped).execute();
      const researcher = await signIn('rafael@example.org');
      const r = await researcher.json('POST', `/api/runs/${stopped}/resume`);
      expect(r.status).toBe(409);
      expect(r.body.error.message).toMatch(/was pushed from ci-runner; resume it there/);
    }, 60_000);
  });

  describe('the compiled commands at start-up', () => {
    let dir: string;
    beforeAll(() => {
      dir = mkdtempSync(join(tmpdir(), 'filmsweep-startup-'));
    });
    afterAll(() => rmSync(dir, { recursive: true, force: true }));

    /** Starts the command, collects its output until `until` matches (or it exits), then stops it. */
    function startAndStop(args: string[], until: RegExp, env: Record<string, string> = {}): Promise<{ out: string; code: number | null }> {
      return new Promise((resolve) => {
        const child = spawn(process.execPath, [cliPath, ...args], { cwd: repoRoot, env: { ...process.env, NO_COLOR: '1', ...env } });
        let out = '';
        const timer = setTimeout(() => child.kill('SIGKILL'), 60_000);
        const check = (b: Buffer) => {
          out += b.toString();
          if (until.test(out)) child.kill('SIGTERM');
        };
        child.stdout.on('data', check);
        child.stderr.on('data', check);
        // 'close', not 'exit': the output may still be in the pipe when the process has exited.
        child.on('close', (code) => {
          clearTimeout(timer);
          resolve({ out, code });
        });
      });
    }

    async function databaseWithKilledRun(name: string): Promise<{ location: string; run: number; drop: () => Promise<void> }> {
      const db = kind === 'sqlite' ? { location: join(dir, `${name}.db`), drop: async () => {} } : await createTestDatabase(kind, name);
      const store = await openStore(db.location);
      try {
        return { location: db.location, run: await killedRun(store, deadPid()), drop: db.drop };
      } finally {
        await closeStore(store);
      }
    }

    async function statusOf(location: string, run: number) {
      const store = await openStore(location);
      try {
        return (await getRun(store, run))!.status;
      } finally {
        await closeStore(store);
      }
    }

    it('`filmsweep serve` marks the killed run interrupted and says where links in e-mails point', async () => {
      const db = await databaseWithKilledRun('serve');
      try {
        const plain = await startAndStop(['serve', '--port', '0', '--db', db.location], /links in e-mails/);
        expect(plain.out).toMatch(new RegExp(`run ${db.run} had lost its process; marked interrupted`));
        expect(plain.out).toMatch(/links in e-mails: http:\/\/127\.0\.0\.1:\d+ \(the address it listens on; pass --public-url/);
        expect(await statusOf(db.location, db.run)).toBe('interrupted');
        const pub = await startAndStop(['serve', '--port', '0', '--db', db.location, '--public-url', 'https://dash.example.org/'], /links in e-mails/);
        expect(pub.out).toMatch(/links in e-mails: https:\/\/dash\.example\.org \(--public-url\)/);
        const bad = spawnSync(process.execPath, [cliPath, 'serve', '--port', '0', '--db', db.location, '--public-url', 'ftp://files.example'], { cwd: repoRoot, encoding: 'utf8', timeout: 30_000 });
        expect(bad.status).toBe(1);
        expect(bad.stderr).toMatch(/--public-url.*http:\/\/ or https:\/\//);
      } finally {
        await db.drop();
      }
    }, 120_000);

    const redis = serviceUrl('FILMSWEEP_TEST_REDIS_URL');
    it.skipIf(!redis)(`\`filmsweep worker\` marks the killed run interrupted at start${skipReason('FILMSWEEP_TEST_REDIS_URL', redis)}`, async () => {
      const db = await databaseWithKilledRun('worker');
      try {
        const r = await startAndStop(['worker', '--queue', uniqueQueueUrl(redis!), '--db', db.location, '--workers', '1'], /worker \d+ on/);
        expect(r.out).toMatch(new RegExp(`runs ${db.run} had lost their process on this host: marked interrupted`));
        expect(await statusOf(db.location, db.run)).toBe('interrupted');
      } finally {
        await db.drop();
      }
    }, 120_000);
  });
});
