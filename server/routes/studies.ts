// Studies: list, one study with its versions and runs, and upload (validated exactly as
// `filmsweep run` validates a file, then run in the background).
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { getDashboardRun, getStudy, listStudies, findStudyByName } from '../../shared/db/studies.js';
import { prepareStudy } from '../../shared/runner/index.js';
import { parseStudy } from '../../shared/study/index.js';
import type { AppContext } from '../context.js';
import { notFound } from '../http-error.js';
import { STUDY_UPLOAD, singleTextFile, uploadedText } from '../middleware/upload.js';
import { parse } from '../middleware/validate.js';
import { linkBase } from './links.js';
import { idParams } from './users.js';

export function studiesRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    const { q } = parse(z.object({ q: z.string().max(200).optional() }).strict(), req.query, 'query');
    res.json({ studies: await listStudies(ctx.store, q) });
  });
  r.get('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    const found = await getStudy(ctx.store, id);
    if (!found) throw notFound(`study ${id}`);
    res.json(found);
  });
  r.post('/', singleTextFile(STUDY_UPLOAD), async (req, res) => {
    parse(z.object({}).strict(), req.body ?? {}, 'body');
    const { name, text } = uploadedText(req);
    const user = req.auth!.user;
    // Every refusal (YAML, schema, catalogue, sweep size) comes before anything is stored.
    const loaded = parseStudy(text, name, { maxPoints: ctx.options.maxPoints });
    const prepared = prepareStudy(loaded);
    await recordAudit(ctx.store, { user, action: 'upload', detail: { file: name, study: loaded.study.name, hash: loaded.hash, points: prepared.total }, ip: req.ip });
    const runId = await ctx.background.start(prepared, user, linkBase(ctx, req));
    await recordAudit(ctx.store, { user, action: 'run-started', detail: { run: runId, study: loaded.study.name }, ip: req.ip });
    const study = (await findStudyByName(ctx.store, loaded.study.name))!;
    const detail = (await getStudy(ctx.store, study.id))!;
    const version = detail.versions.find((v) => v.hash === loaded.hash)!;
    res.status(201).json({ study: detail.study, version, run: await getDashboardRun(ctx.store, runId) });
  });
  return r;
}
