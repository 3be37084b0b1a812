// Invitations: a lead invites an e-mail with a role; the mailed link makes the account and signs in.
import { Router } from 'express';
import { z } from 'zod';
import { recordAudit } from '../../shared/db/audit.js';
import { createInvite, findOpenInvite, listInvites, markInviteAccepted } from '../../shared/db/invites.js';
import { ROLES } from '../../shared/db/schema.js';
import { DuplicateUserError, createUser, findUserByEmail } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import { parse } from '../middleware/validate.js';
import { linkBase } from './links.js';
import { passwordSchema } from './password-reset.js';
import { signIn } from './session.js';

const newInvite = z.object({ email: z.email().max(320), role: z.enum(ROLES) }).strict();
const accept = z.object({ token: z.string().min(1).max(200), password: passwordSchema, name: z.string().trim().min(1).max(200).optional() }).strict();

export function invitesRouter(ctx: AppContext): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    res.json({ invites: await listInvites(ctx.store) });
  });
  r.post('/', async (req, res) => {
    const body = parse(newInvite, req.body, 'body');
    if (await findUserByEmail(ctx.store, body.email)) throw new HttpError(409, `${body.email} already has an account`);
    const lead = req.auth!.user;
    const invite = await createInvite(ctx.store, { email: body.email, role: body.role, invitedBy: lead.id });
    const link = `${linkBase(ctx, req)}/invite/${invite.token}`;
    await ctx.mailer.send({
      to: invite.email,
      subject: 'Filmsweep: you are invited',
      text: `${lead.name} <${lead.email}> invites you to the team's Filmsweep dashboard as ${invite.role}.\n\nChoose your password within 7 days at:\n${link}\n`,
    });
    await recordAudit(ctx.store, { user: lead, action: 'invite', detail: { email: invite.email, role: invite.role }, ip: req.ip });
    res.status(201).json({ invite: { id: invite.id, email: invite.email, role: invite.role, expires_at: invite.expires_at } });
  });
  r.post('/accept', async (req, res) => {
    const body = parse(accept, req.body, 'body');
    const invite = await findOpenInvite(ctx.store, body.token);
    if (!invite) throw new HttpError(400, 'the invitation is not valid (used, expired or unknown)');
    if (!(await markInviteAccepted(ctx.store, invite.id))) throw new HttpError(409, 'the invitation was just used');
    let user;
    try {
      user = await createUser(ctx.store, { email: invite.email, name: body.name, role: invite.role, password: body.password, cost: ctx.options.bcryptCost });
    } catch (e) {
      if (e instanceof DuplicateUserError) throw new HttpError(409, e.message);
      throw e;
    }
    await recordAudit(ctx.store, { user, action: 'invite-accepted', detail: { invite: invite.id }, ip: req.ip });
    await signIn(ctx, req, res, user);
  });
  return r;
}
