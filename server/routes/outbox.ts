// The local mail outbox (lead, and only when the server runs with --dev: it holds live
// reset and invite links; every read is audited) and the audit log (lead).
import { Router } from 'express';
import { z } from '#zod';
import { AUDIT_ACTIONS, listAudit, recordAudit } from '../../shared/db/audit.js';
import { listMail } from '../../shared/db/outbox.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import { parse } from '../middleware/validate.js';

export function outboxRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    if (!ctx.options.dev) throw new HttpError(404, 'the mail outbox is shown only in development mode (serve --dev)');
    parse(z.object({}).strict(), req.query, 'query');
    const messages = await listMail(ctx.store);
    await recordAudit(ctx.store, { user: req.auth!.user, action: 'outbox-read', detail: { messages: messages.length, newest: messages[0]?.id ?? null }, ip: req.ip });
    res.json({ messages });
  });
  return r;
}

export function auditRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    const q = parse(
      z.object({ action: z.enum(AUDIT_ACTIONS).optional(), limit: z.coerce.number().int().min(1).max(5000).optional() }).strict(),
      req.query,
      'query',
    );
    res.json({ entries: await listAudit(ctx.store, q) });
  });
  return r;
}
