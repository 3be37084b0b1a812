// A run sent from elsewhere (`filmsweep push`, CI): the study text (its hash checked), the
// run's facts and its rows, stored as a new run on this server: the rows in batches
// through the batch writer, then the run's final status; a push that fails half-way
// removes its run again.
import { z } from 'zod';
import { createBatchWriter, createRun, deleteRun, type Store } from '../shared/db/index.js';
import { getDashboardRun, type DashboardRun } from '../shared/db/studies.js';
import { sha256Hex } from '../shared/study/sha256.js';
import { HttpError } from './http-error.js';

export const MAX_PUSH_BYTES = 50 * 1024 * 1024;

const finite = z.number().refine(Number.isFinite, 'expected a finite number');
const inputValue = z.union([finite, z.boolean(), z.string().max(200)]);

export const pushSchema = z
  .object({
    study: z.object({
      name: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, 'expected a study slug').max(200),
      title: z.string().max(500).nullable().optional(),
      configuration: z.string().min(1).max(100),
    }),
    yaml: z.string().min(1).max(1024 * 1024),
    hash: z.string().regex(/^[0-9a-f]{64}$/, 'expected a sha256 in hex'),
    run: z.object({
      status: z.enum(['done', 'failed', 'interrupted']),
      started_at: z.string().max(40).nullable(),
      finished_at: z.string().max(40).nullable(),
      git_commit: z.string().max(64).nullable(),
      host: z.string().max(255),
      workers: z.number().int().min(1).max(1024),
      points_total: z.number().int().min(0),
      methods: z.array(z.object({ id: z.string().min(1).max(100), version: z.number().int().min(0) })).min(1).max(100),
    }).loose(),
    rows: z
      .array(
        z.object({
          method: z.string().min(1).max(100),
          inputs: z.record(z.string(), inputValue),
          outputs: z.record(z.string(), finite),
          flags: z.array(z.string().max(200)).max(100),
        }).loose(),
      )
      .max(5_000_000),
  })
  .strict();

export type PushBody = z.infer<typeof pushSchema>;

export async function pushRun(store: Store, body: PushBody, userId: number): Promise<DashboardRun> {
  if (sha256Hex(body.yaml) !== body.hash) throw new HttpError(400, 'hash is not the sha256 of yaml');
  const methodIds = body.run.methods.map((m) => m.id);
  const M = methodIds.length;
  // Rows come as getRunRows gives them: point by point, every method of the run in order.
  if (body.rows.length % M !== 0) throw new HttpError(400, `${body.rows.length} rows is not a whole number of points of ${M} methods`);
  body.rows.forEach((row, k) => {
    if (row.method !== methodIds[k % M]) throw new HttpError(400, `rows[${k}]: expected method ${methodIds[k % M]}, got ${row.method}`);
  });
  const points = body.rows.length / M;
  if (points > body.run.points_total) throw new HttpError(400, `${points} points pushed for a run of ${body.run.points_total}`);

  const runId = await createRun(store, {
    study: body.study,
    yaml: body.yaml,
    hash: body.hash,
    sourceFile: null,
    methods: body.run.methods,
    pointsTotal: body.run.points_total,
    workers: body.run.workers,
    host: body.run.host,
    pid: 0,
    gitCommit: body.run.git_commit,
  });
  const writer = createBatchWriter(store, runId, methodIds);
  const BATCH = 2000;
  try {
    for (let start = 0; start < points; start += BATCH) {
      const idx = Array.from({ length: Math.min(BATCH, points - start) }, (_, i) => start + i);
      await writer.write({
        points: idx,
        inputs: idx.map((p) => JSON.stringify(body.rows[p * M].inputs)),
        outputs: idx.flatMap((p) => body.rows.slice(p * M, p * M + M).map((r) => JSON.stringify(r.outputs))),
        flags: idx.flatMap((p) => body.rows.slice(p * M, p * M + M).map((r) => JSON.stringify(r.flags))),
      });
    }
    await store.db
      .updateTable('runs')
      .set({ status: body.run.status, started_at: body.run.started_at, finished_at: body.run.finished_at ?? new Date().toISOString(), pid: null, started_by: userId })
      .where('id', '=', runId)
      .execute();
  } catch (e) {
    // Leave no half-pushed run behind (its results table goes with it).
    await deleteRun(store, runId);
    throw e;
  }
  return (await getDashboardRun(store, runId))!;
}
