// Invitations: a lead invites an e-mail with a role; the mailed link makes the account and
// signs in. An address has one open invite at a time (a second answers 409 naming the
// first); a lead revokes an open invite with DELETE /api/invites/:id, after which its link
// is refused. Failed acceptances are audited.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { OpenInviteExistsError, createInvite, findOpenInvite, getInvite, listInvites, markInviteAccepted, revokeInvite } from '../../shared/db/invites.js';
import { ROLES } from '../../shared/db/schema.js';
import { DuplicateUserError, createUser, findUserByEmail } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { parse } from '../middleware/validate.js';
import { linkBase } from './links.js';
import { passwordSchema } from './password-reset.js';
import { signIn } from './session.js';
import { idParams } from './users.js';

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
    let invite;
    try {
      invite = await createInvite(ctx.store, { email: body.email, role: body.role, invitedBy: lead.id });
    } catch (e) {
      if (e instanceof OpenInviteExistsError) throw new HttpError(409, e.message, { invite: { id: e.existing.id, role: e.existing.role, expires_at: e.existing.expires_at } });
      throw e;
    }
    const link = `${linkBase(ctx, req)}/invite/${invite.token}`;
    await ctx.mailer.send({
      to: invite.email,
      subject: 'Filmsweep: you are invited',
      text: `${lead.name} <${lead.email}> invites you to the team's Filmsweep dashboard as ${invite.role}.\n\nChoose your password within 7 days at:\n${link}\n`,
    });
    await recordAudit(ctx.store, { user: lead, action: 'invite', detail: { email: invite.email, role: invite.role }, ip: req.ip });
    res.status(201).json({ invite: { id: invite.id, email: invite.email, role: invite.role, expires_at: invite.expires_at } });
  });
  r.delete('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    const lead = req.auth!.user;
    const invite = await getInvite(ctx.store, id);
    if (!invite) throw notFound(`invite ${id}`);
    if (!(await revokeInvite(ctx.store, id, lead.id))) {
      throw new HttpError(409, `invite ${id} is ${invite.accepted_at ? 'already accepted' : 'already revoked'}`);
    }
    await recordAudit(ctx.store, { user: lead, action: 'invite-revoked', detail: { invite: id, email: invite.email, role: invite.role }, ip: req.ip });
    res.status(204).end();
  });
  r.post('/accept', async (req, res) => {
    const body = parse(accept, req.body, 'body');
    const invite = await findOpenInvite(ctx.store, body.token);
    if (!invite) {
      await recordAudit(ctx.store, { action: 'invite-accept-failed', detail: { reason: 'unknown, used, revoked or expired link' }, ip: req.ip });
      throw new HttpError(400, 'the invitation is not valid (used, revoked, expired or unknown)');
    }
    if (!(await markInviteAccepted(ctx.store, invite.id))) {
      await recordAudit(ctx.store, { action: 'invite-accept-failed', detail: { invite: invite.id, email: invite.email, reason: 'used or revoked meanwhile' }, ip: req.ip });
      throw new HttpError(409, 'the invitation was just used or revoked');
    }
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
