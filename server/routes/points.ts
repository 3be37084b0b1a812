// One point of a run, for the dashboard's point view: every method's row there (outputs
// with their `_low`/`_high` bands, flags, the method's stated uncertainty) and the
// summary across methods (applicable methods, spread, recommended with the reason).
//
// GET /api/runs/:id/points/:point →
//   {"run": {"id", "study", "configuration", "title", "points_total", "status"}, "point", "inputs": {...},
//    "rows": [{"method", "inputs", "outputs", "flags", "uncertainty": {"fraction", "note"} | null, "recommended"}],
//    "summary": {"applicable", "spread", "spread_of", "recommended", "reason", "flags"},
//    "summary_source": "stored" | "computed", "target"?: {"output", "value", "adjust", "within"}}
// (`target`, SI, when the run's study has one: what a `target-not-reached` row missed.)
// The summary is the one stored with the run; a run stored without summaries (pushed
// from an older Filmsweep) gets it computed from its rows (spread over Nu).
import { Router } from 'express';
import { z } from '#zod';
import { storedStudy, targetFacts } from '../../shared/db/chart-query.js';
import { getPointRows, getPointSummaryFacts } from '../../shared/db/point-summaries.js';
import { getDashboardRun } from '../../shared/db/studies.js';
import { explainSummary, summarizePoint } from '../../shared/design/summary.js';
import { getMethod } from '../../shared/physics/catalogue.js';
import { InputError, type MethodInfo } from '../../shared/physics/types.js';
import type { AppContext } from '../context.js';
import { notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';

const pointParams = z.object({ id: z.coerce.number().int().positive(), point: z.coerce.number().int().min(0).max(2 ** 31 - 1) });

function methodInfo(configuration: string, id: string): MethodInfo | undefined {
  try {
    return getMethod(configuration, id);
  } catch (e) {
    if (e instanceof InputError) return undefined; // a method since removed from the catalogue
    throw e;
  }
}

/** Mounted at /api/runs/:id/points (mergeParams keeps :id). */
export function pointsRouter(ctx: AppContext): Router {
  const r = Router({ mergeParams: true });
  r.get('/:point', async (req, res) => {
    const { id, point } = parse(pointParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    const run = await getDashboardRun(ctx.store, id);
    if (!run) throw notFound(`run ${id}`);
    const stored = await getPointRows(ctx.store, id, point);
    if (!stored) throw notFound(`point ${point} of run ${id}`);
    const infos = stored.rows.map((row) => methodInfo(run.configuration, row.method));
    const uncertainties = stored.rows.map((row, i) => ({ id: row.method, fraction: infos[i]?.uncertainty.fraction ?? Infinity }));
    const saved = await getPointSummaryFacts(ctx.store, id, point);
    const summary = saved ? explainSummary(saved, uncertainties, stored.rows) : summarizePoint(stored.rows, uncertainties);
    const target = targetFacts(await storedStudy(ctx.store, id));
    res.json({
      run: { id: run.id, study: run.study, configuration: run.configuration, title: run.title, points_total: run.points_total, status: run.status },
      point,
      inputs: stored.inputs,
      rows: stored.rows.map((row, i) => ({
        ...row,
        uncertainty: infos[i] ? { fraction: infos[i]!.uncertainty.fraction, note: infos[i]!.uncertainty.note } : null,
        recommended: summary.recommended === row.method,
      })),
      summary,
      summary_source: saved ? 'stored' : 'computed',
      ...(target ? { target } : {}),
    });
  });
  return r;
}
