// The queue in one process, against a real Redis and a real store (an SQLite file, and
// PostgreSQL): what `run --queue` puts on the queue, what Ctrl-C takes off it,
// `resume --queue`, a batch computed twice, and a worker on the wrong database.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Queue } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeStore, getRunRows, openStore, type Store } from '../shared/db/index.js';
import { runTableName } from '../shared/db/result-table.js';
import { BATCH_JOB, parseQueueUrl, resumeOnQueue, runOnQueue, startQueueWorker, type QueueTarget } from '../shared/queue/index.js';
import { prepareStudy, runStudy } from '../shared/runner/index.js';
import { parseStudy } from '../shared/study/index.js';
import { freshPgDatabase, serviceUrl, skipReason, uniqueQueueUrl } from './helpers/queue-services.js';

const REDIS = serviceUrl('FILMSWEEP_TEST_REDIS_URL');
const PG = serviceUrl('FILMSWEEP_TEST_PG_URL');

interface StoreCase {
  name: string;
  skip: boolean;
  /** The store's location and how to remove it. */
  make: (dir: string) => Promise<{ location: string; drop: () => Promise<void> }>;
}
const STORES: StoreCase[] = [
  { name: 'SQLite file', skip: false, make: async (dir) => ({ location: join(dir, 'shared.db'), drop: async () => {} }) },
  {
    name: `PostgreSQL${skipReason('FILMSWEEP_TEST_PG_URL', PG)}`,
    skip: !PG,
    make: async () => {
      const db = await freshPgDatabase(PG!);
      return { location: db.url, drop: db.drop };
    },
  },
];

const STUDY = `name: queue-pipe
configuration: pipe
methods: [gnielinski, dittus-boelter]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: 50, spacing: log}
    Pr: [0.7, 3, 7, 50]
`;
const POINTS = 200;
const METHODS = 2;
const BATCH = 25;

const prepared = () => prepareStudy(parseStudy(STUDY, 'queue-pipe.yaml'));

async function until(what: string, check: () => Promise<boolean>, ms = 20_000): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe.skipIf(!REDIS).each(STORES)(`queue producer and consumer in one process, $name${skipReason('FILMSWEEP_TEST_REDIS_URL', REDIS)}`, (storeCase) => {
  if (storeCase.skip) {
    it.skip(storeCase.name, () => {});
    return;
  }
  let dir: string;
  let drop: () => Promise<void>;
  let target: QueueTarget;
  let queue: Queue;
  let store: Store;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'filmsweep-queue-'));
    target = parseQueueUrl(uniqueQueueUrl(REDIS!));
    queue = new Queue(target.name, { connection: target.connection, prefix: target.prefix });
    const made = await storeCase.make(dir);
    drop = made.drop;
    store = await openStore(made.location);
  });
  afterAll(async () => {
    await closeStore(store);
    await drop();
    await queue.obliterate({ force: true }).catch(() => {});
    await queue.close();
    rmSync(dir, { recursive: true, force: true });
  });

  let interruptedRun = 0;

  it('queues one job per batch, and Ctrl-C takes them off again and leaves the run interrupted', async () => {
    const stop = new AbortController();
    const outcome = runOnQueue(store, prepared(), target, {
      batchSize: BATCH,
      stop: stop.signal,
      onStart: (info) => (interruptedRun = info.runId),
    });
    await until('the jobs', async () => (await queue.getJobCounts('waiting')).waiting === POINTS / BATCH);
    const ids = (await queue.getJobs(['waiting'])).map((j) => j.id).sort();
    expect(ids).toEqual(Array.from({ length: POINTS / BATCH }, (_, i) => `run-${interruptedRun}-${i * BATCH}`).sort());
    stop.abort();
    const o = await outcome;
    expect(o).toMatchObject({ id: interruptedRun, status: 'interrupted', points_done: 0 });
    expect(await queue.getJobCounts('waiting', 'delayed', 'active')).toMatchObject({ waiting: 0, delayed: 0, active: 0 });
  });

  it('a batch computed a second time (its worker died before telling Redis) adds no row and no count', async () => {
    const lines: string[] = [];
    const worker = await startQueueWorker({ target, store, workers: 1, log: (l) => lines.push(l) });
    const counters = () => store.db.selectFrom('runs').select(['points_done', 'results_count', 'flagged_count']).where('id', '=', interruptedRun).executeTakeFirstOrThrow();
    const { hash } = prepared().loaded;
    const once = async () => {
      const job = await queue.add(BATCH_JOB, { runId: interruptedRun, hash, ranges: [0, BATCH] }, { jobId: `run-${interruptedRun}-0` });
      await until('the job', async () => (await job.getState()) === 'completed');
      const value = (await queue.getJob(job.id!))?.returnvalue;
      await queue.remove(job.id!); // the same batch may come again
      return value;
    };
    try {
      expect(await once()).toEqual({ points: BATCH, skipped: 0 });
      const first = await counters();
      expect(first.points_done).toBe(BATCH);
      expect(await once()).toEqual({ points: 0, skipped: BATCH });
      expect(await counters()).toEqual(first);
    } finally {
      await worker.close();
    }
    expect(lines.some((l) => l.includes(`${BATCH} already stored`))).toBe(true);
    const [n] = await store.dialect.all<{ n: unknown }>(`select count(*) as n from ${runTableName(interruptedRun)}`);
    expect(Number(n.n)).toBe(BATCH * METHODS);
  });

  it('resume --queue finishes the run through a worker, with the values of a local run', async () => {
    const lines: string[] = [];
    const worker = await startQueueWorker({ target, store, workers: 1, log: (l) => lines.push(l) });
    try {
      const o = await resumeOnQueue(store, interruptedRun, target, { batchSize: BATCH });
      expect(o).toMatchObject({ status: 'done', points_done: POINTS, results: POINTS * METHODS });
    } finally {
      await worker.close();
    }
    // The batch stored by the test before is not queued again.
    expect(lines.filter((l) => / written /.test(l))).toHaveLength(POINTS / BATCH - 1);

    const local = await openStore(join(dir, 'local.db'));
    try {
      const l = await runStudy(local, prepared(), { workers: 1 });
      expect((await getRunRows(store, interruptedRun)).rows).toEqual((await getRunRows(local, l.id)).rows);
    } finally {
      await closeStore(local);
    }
  });

  it('a worker on another database fails the batch at once, and the run ends failed saying why', async () => {
    const other = await openStore(join(dir, 'other.db'));
    const worker = await startQueueWorker({ target, store: other, workers: 1 });
    try {
      const o = await runOnQueue(store, prepared(), target, { batchSize: BATCH });
      expect(o.status).toBe('failed');
      expect(o.error).toMatch(/not in this worker's database.*same --db/);
      const run = await store.db.selectFrom('runs').select(['status', 'error']).where('id', '=', o.id).executeTakeFirstOrThrow();
      expect(run.status).toBe('failed');
      expect(run.error).toMatch(/same --db/);
    } finally {
      await worker.close();
      await closeStore(other);
    }
    expect(await queue.getJobCounts('waiting', 'delayed')).toMatchObject({ waiting: 0, delayed: 0 });
  });
});
