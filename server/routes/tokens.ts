// API tokens for CI and `filmsweep push`: made (shown once), listed, revoked.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { createToken, listTokens, revokeToken } from '../../shared/db/tokens.js';
import type { AppContext } from '../context.js';
import { notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';
import { idParams } from './users.js';

export function tokensRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    res.json({ tokens: await listTokens(ctx.store, req.auth!.user.id) });
  });
  r.post('/', async (req, res) => {
    const { name } = parse(z.object({ name: z.string().trim().min(1).max(100) }).strict(), req.body, 'body');
    const user = req.auth!.user;
    const made = await createToken(ctx.store, user.id, name);
    await recordAudit(ctx.store, { user, action: 'token-made', detail: { id: made.id, name }, ip: req.ip });
    res.status(201).json({ token: made.token, id: made.id, name: made.name });
  });
  r.delete('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const user = req.auth!.user;
    if (!(await revokeToken(ctx.store, user.id, id))) throw notFound(`token ${id}`);
    await recordAudit(ctx.store, { user, action: 'token-revoked', detail: { id }, ip: req.ip });
    res.status(204).end();
  });
  return r;
}
