// A run sent from elsewhere (`filmsweep push`, CI): the study text (its hash checked), the
// run's facts and its rows, stored as a new run on this server: the rows in batches
// through the batch writer, then the run's final status; a push that fails half-way
// removes its run again (and one the server did not finish, killed half-way, is removed
// at the next start-up: shared/db/reconcile.ts).
//
// A pushed run meets the limits of a run made here (an upload): its study text must parse
// and validate exactly as an uploaded file does (schema, catalogue, YAML alias limit, the
// server's point limit), and the run's facts must be that study's: its name and
// configuration, its methods in order, its point count. Each row may carry only the
// study's input names and at most MAX_RUN_OUTPUT_NAMES output names over the run, each a
// plain name as the engine writes them. Without these limits a run with thousands of
// output names made every page of it fail (the results cache of that time had one column per name; run tables have too).
import { z } from '#zod';
import { createBatchWriter, createRun, deleteRun, type Store } from '../shared/db/index.js';
import { NAME_PATTERN } from '../shared/db/results-query.js';
import { getDashboardRun, type DashboardRun } from '../shared/db/studies.js';
import { hostName, prepareStudy } from '../shared/runner/index.js';
import { parseStudy, pointAt } from '../shared/study/index.js';
import { sha256Hex } from '../shared/study/sha256.js';
import { HttpError } from './http-error.js';

export const MAX_PUSH_BYTES = 50 * 1024 * 1024;
/**
 * Output names one run may have. The whole catalogue declares 25 output names and the
 * engine derives about 25 more, so a local run has at most about 50; this leaves room for
 * new outputs and stays far below what a run table can hold (one column per
 * name: SQLite stops at 2000 columns, PostgreSQL at 1600).
 */
export const MAX_RUN_OUTPUT_NAMES = 256;

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
          inputs: z.record(z.string().max(100), inputValue),
          outputs: z.record(z.string().max(100), finite),
          flags: z.array(z.string().max(200)).max(100),
        }).loose(),
      )
      .max(5_000_000),
  })
  .strict();

export type PushBody = z.infer<typeof pushSchema>;

/** Refuses a push that a run made here could not have produced (400, or 413 for size limits). */
export function checkPushAgainstStudy(body: PushBody, maxPoints: number): void {
  // The same parse as an uploaded study: StudyError (400 with diagnostics) when invalid or too large.
  const loaded = parseStudy(body.yaml, `${body.study.name}.yaml`, { maxPoints });
  const prepared = prepareStudy(loaded);
  const { study } = loaded;
  if (study.name !== body.study.name) throw new HttpError(400, `study.name '${body.study.name}' is not the name in the study text ('${study.name}')`);
  if (study.configuration !== body.study.configuration) {
    throw new HttpError(400, `study.configuration '${body.study.configuration}' is not the configuration in the study text ('${study.configuration}')`);
  }
  const want = prepared.methods.map((m) => m.id);
  const got = body.run.methods.map((m) => m.id);
  if (want.join(',') !== got.join(',')) throw new HttpError(400, `run.methods [${got.join(', ')}] are not the study's methods [${want.join(', ')}]`);
  if (body.run.points_total !== prepared.total) {
    throw new HttpError(400, `run.points_total is ${body.run.points_total}; the study expands to ${prepared.total} points`);
  }
  const inputNames = new Set(prepared.total > 0 ? Object.keys(pointAt(study, 0)) : Object.keys(study.inputs));
  const outputNames = new Set<string>();
  body.rows.forEach((row, k) => {
    for (const name of Object.keys(row.inputs)) {
      if (!inputNames.has(name)) throw new HttpError(400, `rows[${k}]: input '${name}' is not an input of the study (it has: ${[...inputNames].join(', ')})`);
    }
    for (const name of Object.keys(row.outputs)) {
      if (outputNames.has(name)) continue;
      if (!NAME_PATTERN.test(name)) throw new HttpError(400, `rows[${k}]: output name '${name.slice(0, 100)}' is not a plain name (letters, digits, _)`);
      outputNames.add(name);
      if (outputNames.size > MAX_RUN_OUTPUT_NAMES) {
        throw new HttpError(413, `the pushed rows have more than ${MAX_RUN_OUTPUT_NAMES} different output names; a run has at most ${MAX_RUN_OUTPUT_NAMES}`);
      }
    }
  });
}

export async function pushRun(store: Store, body: PushBody, userId: number, maxPoints: number): Promise<DashboardRun> {
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
  checkPushAgainstStudy(body, maxPoints);

  // Made as this process's run (so a crash half-way is found at the next start-up), and
  // marked pushed before any row is written.
  const runId = await createRun(store, {
    study: body.study,
    yaml: body.yaml,
    hash: body.hash,
    sourceFile: null,
    methods: body.run.methods,
    pointsTotal: body.run.points_total,
    workers: body.run.workers,
    host: hostName(),
    pid: process.pid,
    gitCommit: body.run.git_commit,
  });
  try {
    await store.db.updateTable('runs').set({ pushed_from: body.run.host }).where('id', '=', runId).execute();
    const writer = createBatchWriter(store, runId, methodIds);
    const BATCH = 2000;
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
      .set({
        status: body.run.status,
        started_at: body.run.started_at,
        finished_at: body.run.finished_at ?? new Date().toISOString(),
        host: body.run.host,
        pid: null,
        started_by: userId,
      })
      .where('id', '=', runId)
      .execute();
  } catch (e) {
    // Leave no half-pushed run behind (its results table goes with it).
    await deleteRun(store, runId);
    throw e;
  }
  return (await getDashboardRun(store, runId))!;
}
