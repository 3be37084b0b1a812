// Dashboard API on a run of 1,000,000 results, straight after the run (no copy is built
// on first view): a filtered, sorted page (the first request and the median of repeated
// requests with varying filters), the chart and its payload, which downsampling bounds
// whatever the run's size. Then the same run as a database from before run tables holds
// it (JSON rows in points/results): its first view starts the conversion in the
// background, and the server's requests answer meanwhile (their latency is shown).
import { join } from 'node:path';
import BetterSqlite3 from 'better-sqlite3';
import { closeStore, getRun, openStore } from '../../shared/db/index.js';
import { eachStoredResult, hasRunTable, runTableName } from '../../shared/db/result-table.js';
import { createUser } from '../../shared/db/users.js';
import { runStudyFile } from '../../shared/runner/index.js';
import { startServer } from '../../server/index.js';
import { fmt, timeAsync, type BenchContext } from './timing.js';

const study = (name: string, reCount: number, prCount: number) => `name: ${name}
configuration: pipe
methods: [dittus-boelter, gnielinski]
sweep:
  over:
    Re: {from: 1.0e4, to: 1.0e6, count: ${reCount}, spacing: log}
    Pr: {from: 0.7, to: 100, count: ${prCount}, spacing: log}
`;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Rewrites a run as Filmsweep stored it before run tables: JSON rows in points/results. */
async function storeAsBeforeRunTables(db: string, runId: number): Promise<void> {
  const store = await openStore(db);
  const run = (await getRun(store, runId))!;
  const rows: { point: number; method: number; inputs: string; outputs: string; flags: string }[] = [];
  await eachStoredResult(store, runId, run.methods.length, (r) =>
    rows.push({ point: r.point, method: r.method, inputs: JSON.stringify(r.inputs), outputs: JSON.stringify(r.outputs), flags: JSON.stringify(r.flags) }),
  );
  await closeStore(store);
  const sqlite = new BetterSqlite3(db);
  const point = sqlite.prepare('insert into points (run_id, idx, inputs) values (?, ?, jsonb(?))');
  const result = sqlite.prepare('insert into results (run_id, point_idx, method_idx, method, outputs, flags, flagged) values (?, ?, ?, ?, jsonb(?), ?, ?)');
  sqlite.transaction(() => {
    for (const r of rows) {
      if (r.method === 0) point.run(runId, r.point, r.inputs);
      result.run(runId, r.point, r.method, run.methods[r.method].id, r.outputs, r.flags, r.flags === '[]' ? 0 : 1);
    }
    sqlite.exec(`drop table ${runTableName(runId)}; update runs set results_table = 0 where id = ${runId};
      delete from result_columns where run_id = ${runId}; delete from result_shapes where run_id = ${runId};
      delete from result_counts where run_id = ${runId}; delete from result_stats where run_id = ${runId};`);
  })();
  sqlite.close();
}

export async function benchApi(ctx: BenchContext) {
  const db = join(ctx.dir, 'api.db');
  const big = await runStudyFile(ctx.study('bench-api-big', study('bench-api-big', 1000, 500)), { db, workers: 2 });
  const small = await runStudyFile(ctx.study('bench-api-small', study('bench-api-small', 100, 50)), { db, workers: 2 });
  const store = await openStore(db);
  await createUser(store, { email: 'bench@fernbrook.example', role: 'viewer', password: 'bench-password-1', cost: 4 });
  await closeStore(store);

  const serve = async () => {
    const server = await startServer({ db, port: 0, dev: false });
    const signIn = await fetch(`${server.url}/api/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'bench@fernbrook.example', password: 'bench-password-1' }),
    });
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    const get = async (path: string) => {
      const r = await fetch(`${server.url}${path}`, { headers: { cookie } });
      if (!r.ok) throw new Error(`${path}: ${r.status} ${await r.text()}`);
      return r.text();
    };
    return { server, get };
  };
  const page = (i: number) =>
    `/api/runs/${big.id}/results?pageSize=50&page=${1 + (i % 5)}&sort=${i % 2 ? 'Nu' : 'f'}&order=${i % 3 ? 'desc' : 'asc'}` +
    `&method=gnielinski&filter=Re:${2e4 * (1 + (i % 4))}:${5e5}&filter=Pr:${1 + (i % 3)}:`;
  const chartPath = (id: number) => `/api/runs/${id}/chart?x=Re&y=Nu&series=method&max=2000`;

  let { server, get } = await serve();
  try {
    const first = await timeAsync(() => get(page(0)));
    const times: number[] = [];
    for (let i = 0; i < 30; i++) times.push((await timeAsync(() => get(page(i)))).seconds * 1000);
    console.log(`results page on a ${fmt(big.results)}-result run (filter Re and Pr, sort, page of 50), straight off the run's table:`);
    console.log(`  first request after the run: ${fmt(first.seconds * 1000)} ms (nothing is built on first view)`);
    console.log(`  median of 30 requests: ${fmt(median(times))} ms (goal: well under 1 s), max ${fmt(Math.max(...times))} ms`);
    const bigChart = await timeAsync(() => get(chartPath(big.id)));
    const smallChart = await get(chartPath(small.id));
    console.log(`chart, ${fmt(big.results)} results: ${fmt(bigChart.seconds * 1000)} ms (goal: well under 1 s), payload ${fmt(bigChart.value.length / 1024)} KiB`);
    console.log(`chart payload, ${fmt(small.results)} results: ${fmt(smallChart.length / 1024)} KiB (bounded by max=2000 points)`);
  } finally {
    await server.close();
  }

  // The same run as an older database holds it: converted in the background on first view.
  await storeAsBeforeRunTables(db, big.id);
  ({ server, get } = await serve());
  try {
    const t0 = performance.now();
    const firstView = await timeAsync(() => get(page(0))); // answered off the JSON rows; starts the conversion
    const during: number[] = [];
    const check = await openStore(db);
    try {
      while (!(await hasRunTable(check, big.id))) {
        during.push((await timeAsync(() => get('/api/runs'))).seconds * 1000);
        await new Promise((r) => setTimeout(r, 50));
      }
    } finally {
      await closeStore(check);
    }
    const converted = (performance.now() - t0) / 1000;
    const after = await timeAsync(() => get(page(1)));
    console.log(`the same run stored the older way (JSON rows, as before run tables), first viewed on a fresh server:`);
    console.log(`  first page, off the JSON rows: ${fmt(firstView.seconds * 1000)} ms; converted to its table in the background in ${fmt(converted)} s`);
    console.log(
      `  meanwhile ${during.length} GET /api/runs answered: median ${fmt(median(during))} ms, max ${fmt(Math.max(...during))} ms (the event loop stays free between steps)`,
    );
    console.log(`  a page once converted: ${fmt(after.seconds * 1000)} ms`);
  } finally {
    await server.close();
  }
}
