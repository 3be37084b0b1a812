// Runs: list, one run, its results (paged, sorted, filtered), chart data, exports
// (streamed from the database: see shared/export/stream.ts), the reference mark, runs
// pushed from elsewhere (`filmsweep push`, CI), and resuming an interrupted run.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { getRun, getRunDetails, getRunSource, getRunSummary, resumeRefusal, RUN_STATUSES } from '../../shared/db/index.js';
import { getMeasurement } from '../../shared/db/measurements.js';
import { chartAxes, chartData, MAX_CHART_POINTS, measuredOverlay } from '../../shared/db/chart-query.js';
import { getRunColumns, MAX_PAGE_SIZE, NAME_PATTERN, queryResults, type RangeFilter } from '../../shared/db/results-query.js';
import { findStudyByName, getDashboardRun, getStudyName, listDashboardRuns, setRunReference } from '../../shared/db/studies.js';
import { runRowSource } from '../../shared/db/run-rows.js';
import { exportFormats, makeUnitLookup, mediaTypes, OutputClosedError, runMethodSpecs, writeRunExport, xlsxTooLong, type ExportFormat } from '../../shared/export/index.js';
import { findConfiguration } from '../../shared/physics/configurations.js';
import { InputError } from '../../shared/physics/types.js';
import { processAlive } from '../../shared/runner/index.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';
import { pushRun, pushSchema } from '../push.js';
import { linkBase } from './links.js';
import { idParams } from './users.js';

const name = z.string().regex(NAME_PATTERN, 'expected an input or output name');
const list = z
  .string()
  .max(2000)
  .transform((s) => s.split(',').map((m) => m.trim()).filter(Boolean));
const number = z
  .string()
  .trim()
  .transform((s, c) => {
    if (s === '') return undefined;
    const v = Number(s);
    if (!Number.isFinite(v)) {
      c.addIssue({ code: 'custom', message: `'${s}' is not a number` });
      return z.NEVER;
    }
    return v;
  });
const filter = z
  .string()
  .max(300)
  .transform((s, c): RangeFilter => {
    const m = /^([A-Za-z_][A-Za-z0-9_]*):([^:]*):([^:]*)$/.exec(s);
    if (!m) {
      c.addIssue({ code: 'custom', message: `filter '${s}': expected NAME:min:max (min or max may be empty)` });
      return z.NEVER;
    }
    const [min, max] = [m[2], m[3]].map((v) => number.safeParse(v));
    if (!min.success || !max.success) {
      c.addIssue({ code: 'custom', message: `filter '${s}': min and max must be numbers` });
      return z.NEVER;
    }
    return { name: m[1], min: min.data, max: max.data };
  });
const filters = z.union([filter.transform((f) => [f]), z.array(filter).max(20)]).optional();

const resultsQuery = z
  .object({
    page: z.coerce.number().int().min(1).max(1_000_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(50),
    sort: z.union([z.literal('point'), z.literal('method'), name]).optional(),
    order: z.enum(['asc', 'desc']).default('asc'),
    method: list.optional(),
    flagged: z.enum(['any', 'yes', 'no']).default('any'),
    filter: filters,
  })
  .strict();

const chartQuery = z
  .object({
    x: name,
    y: name,
    series: z.union([z.literal('method'), name]).default('method'),
    method: list.optional(),
    flagged: z.enum(['any', 'yes', 'no']).default('any'),
    filter: filters,
    max: z.coerce.number().int().min(10).max(MAX_CHART_POINTS).default(2000),
    measurement: z.coerce.number().int().positive().optional(),
  })
  .strict();

export function runsRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    const q = parse(z.object({ study: z.coerce.number().int().positive().optional(), status: z.enum(RUN_STATUSES).optional() }).strict(), req.query, 'query');
    let study: string | undefined;
    if (q.study !== undefined) {
      study = await getStudyName(ctx.store, q.study);
      if (!study) throw notFound(`study ${q.study}`);
    }
    res.json({ runs: await listDashboardRuns(ctx.store, { study, status: q.status }) });
  });

  r.post('/push', async (req, res) => {
    const body = parse(pushSchema, req.body, 'body');
    const user = req.auth!.user;
    const run = await pushRun(ctx.store, body, user.id, ctx.options.maxPoints);
    await recordAudit(ctx.store, { user, action: 'run-pushed', detail: { run: run.id, study: run.study, rows: body.rows.length, from_host: body.run.host }, ip: req.ip });
    res.status(201).json({ run });
  });

  r.get('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    const run = await getDashboardRun(ctx.store, id);
    if (!run) throw notFound(`run ${id}`);
    const details = await getRunDetails(ctx.store, id);
    // study_id: the run page links its study and lists its measurements without searching by name.
    const study = await findStudyByName(ctx.store, run.study);
    // regime: the chart's default abscissa (Re forced, Ra free) without the whole catalogue.
    const regime = findConfiguration(run.configuration)?.regime ?? null;
    res.json({ run, study_id: study?.id ?? null, regime, summary: await getRunSummary(ctx.store, id), error: details?.error ?? null, columns: await getRunColumns(ctx.store, id) });
  });

  r.get('/:id/results', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const q = parse(resultsQuery, req.query, 'query');
    if (!(await getDashboardRun(ctx.store, id))) throw notFound(`run ${id}`);
    res.json(
      await queryResults(ctx.store, id, { page: q.page, pageSize: q.pageSize, sort: q.sort, order: q.order, methods: q.method, flagged: q.flagged, filters: q.filter }),
    );
  });

  r.get('/:id/chart', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const q = parse(chartQuery, req.query, 'query');
    const run = await getDashboardRun(ctx.store, id);
    if (!run) throw notFound(`run ${id}`);
    const chart = await chartData(ctx.store, id, { x: q.x, y: q.y, series: q.series, methods: q.method, flagged: q.flagged, filters: q.filter, max: q.max });
    if (q.measurement === undefined) return res.json(chart);
    const m = await getMeasurement(ctx.store, q.measurement);
    if (!m || (await getStudyName(ctx.store, m.measurement.study_id)) !== run.study) throw notFound(`measurement ${q.measurement} of study ${run.study}`);
    res.json({ ...chart, measured: await measuredOverlay(ctx.store, run, { name: m.measurement.name, rows: m.rows }, q.x, q.y, q.series === 'method' ? undefined : q.series) });
  });

  // Facts about every input and output (swept or fixed, range, distinct values) for the
  // chart's axis and series choices.
  r.get('/:id/chart/axes', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    if (!(await getDashboardRun(ctx.store, id))) throw notFound(`run ${id}`);
    res.json(await chartAxes(ctx.store, id));
  });

  r.get('/:id/export', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const { format } = parse(z.object({ format: z.enum(exportFormats as [ExportFormat, ...ExportFormat[]]).default('csv') }).strict(), req.query, 'query');
    const run = await getRun(ctx.store, id);
    if (!run) throw notFound(`run ${id}`);
    // The one size limit an export has: a worksheet's rows. Refused before a byte is sent.
    const tooLong = format === 'xlsx' ? xlsxTooLong(run, run.results_count) : undefined;
    if (tooLong) throw new HttpError(422, tooLong);
    const user = req.auth!.user;
    const release = ctx.exports.take(user.id);
    try {
      await recordAudit(ctx.store, { user, action: 'export', detail: { run: id, format }, ip: req.ip });
      res.setHeader('Content-Type', mediaTypes[format]);
      res.attachment(`run-${id}.${format}`);
      await writeRunExport(run, runRowSource(ctx.store, id, { recommended: true }), format, res, makeUnitLookup(runMethodSpecs({ run })));
    } catch (e) {
      if (!res.headersSent) {
        // Nothing sent yet: an ordinary JSON error, not one labelled as the file.
        res.removeHeader('Content-Type');
        res.removeHeader('Content-Disposition');
        throw e;
      }
      // Once the file has started, the only way to say it failed is to cut it short.
      if (!(e instanceof OutputClosedError)) ctx.options.log(e);
      res.destroy();
    } finally {
      release();
    }
  });

  r.post('/:id/resume', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.body ?? {}, 'body');
    const source = await getRunSource(ctx.store, id);
    if (!source) throw notFound(`run ${id}`);
    const [row] = await ctx.store.db.selectFrom('runs').select(['pushed_from']).where('id', '=', id).execute();
    if (row.pushed_from !== null) {
      throw new HttpError(409, `run ${id} was pushed from ${row.pushed_from}; resume it there with \`filmsweep resume\` and push it again`);
    }
    const refusal = resumeRefusal(id, source, processAlive) ?? (ctx.background.has(id) ? `run ${id} is already running on this server` : undefined);
    if (refusal) throw new HttpError(409, refusal);
    const user = req.auth!.user;
    try {
      await ctx.background.resume(id, user, linkBase(ctx, req));
    } catch (e) {
      // The runner's own refusals (claimed meanwhile, the study or a method changed since).
      if (e instanceof InputError) throw new HttpError(409, e.message);
      throw e;
    }
    await recordAudit(ctx.store, { user, action: 'run-resumed', detail: { run: id, was: source.status }, ip: req.ip });
    res.status(202).json({ run: await getDashboardRun(ctx.store, id) });
  });

  r.post('/:id/reference', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const { reference } = parse(z.object({ reference: z.boolean() }).strict(), req.body, 'body');
    if (!(await getDashboardRun(ctx.store, id))) throw notFound(`run ${id}`);
    await setRunReference(ctx.store, id, reference);
    await recordAudit(ctx.store, { user: req.auth!.user, action: 'reference', detail: { run: id, reference }, ip: req.ip });
    res.json({ run: await getDashboardRun(ctx.store, id) });
  });
  return r;
}

export { HttpError };
