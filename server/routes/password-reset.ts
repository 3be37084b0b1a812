// Forgotten passwords: a one-hour link by mail (202 whether or not the account exists, so
// the answer tells nobody who has one), then a new password for the token. Requests are
// limited per client address (429) and mails per account (3 an hour: further requests
// answer the same 202 and send nothing). A confirmed reset ends every other reset link
// of the account, every session and every API token of the user (whoever knew the old
// password may have made one); the user signs in again and makes new tokens.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { consumePasswordReset, countPasswordResetsSince, createPasswordReset } from '../../shared/db/invites.js';
import { deleteUserSessions } from '../../shared/db/sessions.js';
import { revokeAllTokens } from '../../shared/db/tokens.js';
import { MIN_PASSWORD_LENGTH, findUserByEmail, getUser, setPassword } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import { DEFAULT_RESET_LIMIT, resetRequestRateLimit } from '../middleware/rate-limit.js';
import { parse } from '../middleware/validate.js';
import { linkBase } from './links.js';

export const passwordSchema = z.string().min(MIN_PASSWORD_LENGTH, `the password needs at least ${MIN_PASSWORD_LENGTH} characters`).max(1024);

export function passwordResetRouter(ctx: AppContext): Router {
  const limits = ctx.options.resetLimit ?? DEFAULT_RESET_LIMIT;
  const r = Router();
  r.post('/', resetRequestRateLimit(limits), async (req, res) => {
    const { email } = parse(z.object({ email: z.string().trim().min(1).max(320) }).strict(), req.body, 'body');
    const user = await findUserByEmail(ctx.store, email);
    if (user && !user.disabled) {
      const since = new Date(Date.now() - limits.windowMs).toISOString();
      if ((await countPasswordResetsSince(ctx.store, user.id, since)) >= limits.perAccount) {
        await recordAudit(ctx.store, { user, action: 'password-reset-throttled', detail: { limit: limits.perAccount }, ip: req.ip });
      } else {
        const { token } = await createPasswordReset(ctx.store, user.id);
        const link = `${linkBase(ctx, req)}/reset/${token}`;
        await ctx.mailer.send({
          to: user.email,
          subject: 'Filmsweep: reset your password',
          text: `Someone (hopefully you) asked to reset the Filmsweep password of ${user.email}.\n\nChoose a new one within an hour at:\n${link}\n\nIf it was not you, ignore this message.`,
        });
        await recordAudit(ctx.store, { user, action: 'password-reset-requested', ip: req.ip });
      }
    }
    res.status(202).json({ message: 'if the account exists, a reset link is on its way' });
  });
  r.post('/confirm', async (req, res) => {
    const body = parse(z.object({ token: z.string().min(1).max(200), password: passwordSchema }).strict(), req.body, 'body');
    const userId = await consumePasswordReset(ctx.store, body.token);
    const user = userId === undefined ? undefined : await getUser(ctx.store, userId);
    if (!user || user.disabled) {
      await recordAudit(ctx.store, { user: user ?? null, action: 'password-reset-failed', detail: { reason: user ? 'account disabled' : 'unknown, used or expired link' }, ip: req.ip });
      throw new HttpError(400, 'the reset link is not valid (used, expired or unknown)');
    }
    await setPassword(ctx.store, user.id, body.password, ctx.options.bcryptCost);
    // Whoever knew the old password is signed out and loses the tokens they may have made.
    await deleteUserSessions(ctx.store, user.id);
    const tokens = await revokeAllTokens(ctx.store, user.id);
    await recordAudit(ctx.store, { user, action: 'password-reset', detail: { api_tokens_revoked: tokens }, ip: req.ip });
    res.status(204).end();
  });
  return r;
}
