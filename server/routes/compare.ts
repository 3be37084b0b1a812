// Two runs side by side: one output, paired by method and inputs.
import { Router } from 'express';
import { z } from 'zod';
import { getRun } from '../../shared/db/index.js';
import { NAME_PATTERN } from '../../shared/db/results-cache.js';
import { compareRuns } from '../../shared/db/compare-query.js';
import { MAX_PAGE_SIZE } from '../../shared/db/results-query.js';
import { withRunMeta } from '../../shared/db/studies.js';
import type { AppContext } from '../context.js';
import { notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';

const query = z
  .object({
    a: z.coerce.number().int().positive(),
    b: z.coerce.number().int().positive(),
    output: z.string().regex(NAME_PATTERN, 'expected an output name').default('Nu'),
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(50),
    changed: z.enum(['yes', 'any']).default('any'),
  })
  .strict();

export function compareRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    const q = parse(query, req.query, 'query');
    for (const id of [q.a, q.b]) if (!(await getRun(ctx.store, id))) throw notFound(`run ${id}`);
    const c = await compareRuns(ctx.store, q.a, q.b, q);
    const [a, b] = await withRunMeta(ctx.store, [c.a, c.b]);
    res.json({ ...c, a, b });
  });
  return r;
}
