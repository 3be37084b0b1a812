// A large finished run made fast: the rows go straight through the store's batch writer
// (the runner's own write path) instead of being computed, for tests of what the server
// does with big runs (streamed exports). The numbers are synthetic: these tests measure
// the server, not the physics.
import { createBatchWriter, createRun, finishRun, type Store } from '../../shared/db/index.js';
import { sha256Hex } from '../../shared/study/sha256.js';

export interface BigRunSpec {
  points: number;
  /** Method ids; every point gets a result for each. */
  methods?: string[];
  name?: string;
}

export async function makeBigRun(store: Store, spec: BigRunSpec): Promise<number> {
  const methods = spec.methods ?? ['gnielinski', 'dittus-boelter'];
  const name = spec.name ?? 'big-pipe';
  const yaml = `name: ${name}\nconfiguration: pipe\nmethods: [${methods.join(', ')}]\nsweep:\n  over:\n    Re: {from: 1.0e4, to: 1.0e6, count: ${spec.points}, spacing: log}\n    Pr: [5]\n`;
  const runId = await createRun(store, {
    study: { name, title: 'A large synthetic run', configuration: 'pipe' },
    yaml,
    hash: sha256Hex(yaml),
    sourceFile: null,
    methods: methods.map((id) => ({ id, version: 1 })),
    pointsTotal: spec.points,
    workers: 1,
    host: 'test-host',
    pid: 1,
    gitCommit: null,
  });
  const writer = createBatchWriter(store, runId, methods);
  const BATCH = 2000;
  for (let start = 0; start < spec.points; start += BATCH) {
    const idx = Array.from({ length: Math.min(BATCH, spec.points - start) }, (_, i) => start + i);
    const Re = (p: number) => 1e4 * 100 ** (p / Math.max(1, spec.points - 1));
    await writer.write({
      points: idx,
      inputs: idx.map((p) => JSON.stringify({ Re: Re(p), Pr: 5, heating: true })),
      outputs: idx.flatMap((p) =>
        methods.map((_, m) => {
          const Nu = (0.023 + 0.001 * m) * Re(p) ** 0.8 * 5 ** 0.4;
          return JSON.stringify({ Nu, f: 0.316 * Re(p) ** -0.25, St: Nu / (Re(p) * 5), j: Nu / (Re(p) * 5 ** (1 / 3)) });
        }),
      ),
      flags: idx.flatMap((p) => methods.map(() => (p % 97 === 0 ? '["out-of-range:Re"]' : '[]'))),
    });
  }
  await finishRun(store, runId, 'done');
  return runId;
}
