// Dashboard API on a run of 1,000,000 results: a filtered, sorted page (median of
// repeated requests with varying filters, after the run's one-time results cache is
// built) and the chart payload size, which downsampling bounds whatever the run's size.
import { join } from 'node:path';
import { closeStore, openStore } from '../../shared/db/index.js';
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

export async function benchApi(ctx: BenchContext) {
  const db = join(ctx.dir, 'api.db');
  const big = await runStudyFile(ctx.study('bench-api-big', study('bench-api-big', 1000, 500)), { db, workers: 2 });
  const small = await runStudyFile(ctx.study('bench-api-small', study('bench-api-small', 100, 50)), { db, workers: 2 });
  const store = await openStore(db);
  await createUser(store, { email: 'bench@fernbrook.example', role: 'viewer', password: 'bench-password-1', cost: 4 });
  await closeStore(store);
  const server = await startServer({ db, port: 0, dev: false });
  try {
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
    const page = (i: number) =>
      `/api/runs/${big.id}/results?pageSize=50&page=${1 + (i % 5)}&sort=${i % 2 ? 'Nu' : 'f'}&order=${i % 3 ? 'desc' : 'asc'}` +
      `&method=gnielinski&filter=Re:${2e4 * (1 + (i % 4))}:${5e5}&filter=Pr:${1 + (i % 3)}:`;
    const first = await timeAsync(() => get(page(0))); // builds the run's results cache
    const times: number[] = [];
    for (let i = 0; i < 30; i++) times.push((await timeAsync(() => get(page(i)))).seconds * 1000);
    console.log(`results page on a ${fmt(big.results)}-result run (filter Re and Pr, sort, page of 50):`);
    console.log(`  first request (builds the per-run cache and index): ${fmt(first.seconds * 1000)} ms`);
    console.log(`  median of 30 requests: ${fmt(median(times))} ms (goal < 100 ms), max ${fmt(Math.max(...times))} ms`);
    const chartPath = (id: number) => `/api/runs/${id}/chart?x=Re&y=Nu&series=method&max=2000`;
    const bigChart = await timeAsync(() => get(chartPath(big.id)));
    const smallChart = await get(chartPath(small.id));
    console.log(`chart payload, ${fmt(big.results)} results: ${fmt(bigChart.value.length / 1024)} KiB in ${fmt(bigChart.seconds * 1000)} ms`);
    console.log(`chart payload, ${fmt(small.results)} results: ${fmt(smallChart.length / 1024)} KiB (bounded by max=2000 points)`);
  } finally {
    await server.close();
  }
}
