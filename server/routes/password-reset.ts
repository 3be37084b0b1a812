// Forgotten passwords: a one-hour link by mail (202 whether or not the account exists, so
// the answer tells nobody who has one), then a new password for the token.
import { Router } from 'express';
import { z } from 'zod';
import { recordAudit } from '../../shared/db/audit.js';
import { consumePasswordReset, createPasswordReset } from '../../shared/db/invites.js';
import { deleteUserSessions } from '../../shared/db/sessions.js';
import { MIN_PASSWORD_LENGTH, findUserByEmail, getUser, setPassword } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import { parse } from '../middleware/validate.js';
import { linkBase } from './links.js';

export const passwordSchema = z.string().min(MIN_PASSWORD_LENGTH, `the password needs at least ${MIN_PASSWORD_LENGTH} characters`).max(1024);

export function passwordResetRouter(ctx: AppContext): Router {
  const r = Router();
  r.post('/', async (req, res) => {
    const { email } = parse(z.object({ email: z.string().trim().min(1).max(320) }).strict(), req.body, 'body');
    const user = await findUserByEmail(ctx.store, email);
    if (user && !user.disabled) {
      const { token } = await createPasswordReset(ctx.store, user.id);
      const link = `${linkBase(ctx, req)}/reset/${token}`;
      await ctx.mailer.send({
        to: user.email,
        subject: 'Filmsweep: reset your password',
        text: `Someone (hopefully you) asked to reset the Filmsweep password of ${user.email}.\n\nChoose a new one within an hour at:\n${link}\n\nIf it was not you, ignore this message.`,
      });
      await recordAudit(ctx.store, { user, action: 'password-reset-requested', ip: req.ip });
    }
    res.status(202).json({ message: 'if the account exists, a reset link is on its way' });
  });
  r.post('/confirm', async (req, res) => {
    const body = parse(z.object({ token: z.string().min(1).max(200), password: passwordSchema }).strict(), req.body, 'body');
    const userId = await consumePasswordReset(ctx.store, body.token);
    const user = userId === undefined ? undefined : await getUser(ctx.store, userId);
    if (!user || user.disabled) throw new HttpError(400, 'the reset link is not valid (used, expired or unknown)');
    await setPassword(ctx.store, user.id, body.password, ctx.options.bcryptCost);
    // A reset ends every session: whoever knew the old password is signed out.
    await deleteUserSessions(ctx.store, user.id);
    await recordAudit(ctx.store, { user, action: 'password-reset', ip: req.ip });
    res.status(204).end();
  });
  return r;
}
