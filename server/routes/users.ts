// The team (lead only): list accounts, change a role, disable or enable an account.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { ROLES } from '../../shared/db/schema.js';
import { deleteUserSessions } from '../../shared/db/sessions.js';
import { getUser, listUsers, updateUser } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';

export const idParams = z.object({ id: z.coerce.number().int().positive() });
const change = z
  .object({ role: z.enum(ROLES).optional(), disabled: z.boolean().optional() })
  .strict()
  .refine((c) => c.role !== undefined || c.disabled !== undefined, 'give role or disabled');

export function usersRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    res.json({ users: await listUsers(ctx.store) });
  });
  r.patch('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const body = parse(change, req.body, 'body');
    const me = req.auth!.user;
    const user = await getUser(ctx.store, id);
    if (!user) throw notFound(`user ${id}`);
    if (user.id === me.id && ((body.role !== undefined && body.role !== 'lead') || body.disabled === true)) {
      throw new HttpError(409, 'a lead cannot demote or disable their own account; ask another lead');
    }
    const updated = (await updateUser(ctx.store, id, body))!;
    if (body.role !== undefined && body.role !== user.role) {
      await recordAudit(ctx.store, { user: me, action: 'role-change', detail: { email: user.email, from: user.role, to: body.role }, ip: req.ip });
    }
    if (body.disabled !== undefined && body.disabled !== user.disabled) {
      if (body.disabled) await deleteUserSessions(ctx.store, id);
      await recordAudit(ctx.store, { user: me, action: body.disabled ? 'user-disabled' : 'user-enabled', detail: { email: user.email }, ip: req.ip });
    }
    res.json({ user: updated });
  });
  return r;
}
