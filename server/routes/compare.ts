// Two runs side by side: one output, paired by method and chosen inputs (exactly or
// within a relative tolerance). The work is bounded: runs up to COMPARE_MAX_RESULTS
// results (413 beyond), pairing choices that identify points (422 otherwise), pages of at
// most MAX_PAGE_SIZE rows, and a short queue of long reads (503 when it is full).
import { Router } from 'express';
import { z } from '#zod';
import { compareRuns, CompareLimitError, MAX_TOLERANCE, studyYamlOf } from '../../shared/db/compare-query.js';
import { getRun } from '../../shared/db/index.js';
import { ReadThreadBusyError } from '../../shared/db/read-thread.js';
import { MAX_PAGE_SIZE, NAME_PATTERN } from '../../shared/db/results-query.js';
import { withRunMeta } from '../../shared/db/studies.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';

/** `0.001` or `0.1%`: a relative tolerance. */
const tolerance = z
  .string()
  .trim()
  .max(40)
  .transform((s, c) => {
    const m = /^([0-9.eE+-]+)\s*(%?)$/.exec(s);
    const v = m ? Number(m[1]) / (m[2] ? 100 : 1) : NaN;
    if (!Number.isFinite(v)) {
      c.addIssue({ code: 'custom', message: `tolerance '${s}': expected a relative tolerance such as 0.001 or 0.1%` });
      return z.NEVER;
    }
    return v;
  });

const query = z
  .object({
    a: z.coerce.number().int().positive(),
    b: z.coerce.number().int().positive(),
    output: z.string().regex(NAME_PATTERN, 'expected an output name').default('Nu'),
    page: z.coerce.number().int().min(1).max(1_000_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(50),
    changed: z.enum(['yes', 'any']).default('any'),
    /** Comma-separated input names that identify a point; default every input of either run. */
    by: z
      .string()
      .max(2000)
      .transform((s) => s.split(',').map((n) => n.trim()).filter(Boolean))
      .pipe(z.array(z.string().regex(NAME_PATTERN, 'expected input names separated by commas')))
      .optional(),
    tolerance: tolerance.optional(),
    /** `yes`: add both study versions' YAML (for the diff). */
    yaml: z.enum(['yes', 'no']).default('no'),
  })
  .strict();

export function compareRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    const q = parse(query, req.query, 'query');
    for (const id of [q.a, q.b]) if (!(await getRun(ctx.store, id))) throw notFound(`run ${id}`);
    if (q.tolerance !== undefined && !(q.tolerance >= 0 && q.tolerance <= MAX_TOLERANCE)) {
      throw new HttpError(422, `tolerance ${q.tolerance} is outside 0 … ${MAX_TOLERANCE} (a relative tolerance: 0.001 is 0.1 %)`);
    }
    try {
      const c = await compareRuns(ctx.store, q.a, q.b, q);
      const [a, b] = await withRunMeta(ctx.store, [c.a, c.b]);
      const yaml = q.yaml === 'yes' ? { yaml: { a: (await studyYamlOf(ctx.store, q.a)) ?? '', b: (await studyYamlOf(ctx.store, q.b)) ?? '' } } : {};
      res.json({ ...c, a, b, ...yaml });
    } catch (e) {
      if (e instanceof CompareLimitError) throw new HttpError(e.status, e.message);
      if (e instanceof ReadThreadBusyError) {
        res.set('Retry-After', '5');
        throw new HttpError(503, e.message);
      }
      throw e;
    }
  });
  return r;
}
