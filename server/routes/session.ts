// Sign-in and sign-out; the session cookie and its CSRF token; a user's own sessions:
// `GET /api/session/all` lists them (when and where each was opened, which one is this),
// `DELETE /api/session/others` ends every one but the current.
import { Router, type Request, type Response } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { createSession, deleteOtherSessions, deleteSession, listUserSessions } from '../../shared/db/sessions.js';
import { verifyCredentials, type User } from '../../shared/db/users.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import { SESSION_COOKIE } from '../middleware/auth.js';
import { loginRateLimit } from '../middleware/rate-limit.js';
import { parse } from '../middleware/validate.js';

const credentials = z.object({ email: z.string().trim().min(1).max(320), password: z.string().min(1).max(1024) }).strict();

export const publicUser = (u: User) => ({ email: u.email, role: u.role, name: u.name });

/** Opens a session for the user, sets the cookie and answers like POST /api/session. */
export async function signIn(ctx: AppContext, req: Request, res: Response, user: User, status = 200) {
  const session = await createSession(ctx.store, user.id, ctx.options.sessionTtlMs, { ip: req.ip, userAgent: req.get('user-agent') });
  res.cookie(SESSION_COOKIE, session.secret, {
    httpOnly: true,
    sameSite: 'lax',
    path: '/',
    secure: req.secure,
    expires: session.expiresAt,
  });
  await recordAudit(ctx.store, { user, action: 'sign-in', ip: req.ip });
  res.status(status).json({ user: publicUser(user), csrfToken: session.csrfToken });
}

export function sessionRouter(ctx: AppContext): Router {
  const r = Router();
  r.post('/', ...loginRateLimit(ctx.options.loginLimit), async (req, res) => {
    const body = parse(credentials, req.body, 'body');
    const user = await verifyCredentials(ctx.store, body.email, body.password);
    if (!user) {
      await recordAudit(ctx.store, { action: 'sign-in-failed', detail: { email: body.email.toLowerCase() }, ip: req.ip });
      throw new HttpError(401, 'wrong e-mail or password');
    }
    await signIn(ctx, req, res, user);
  });
  r.get('/', (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    const auth = req.auth!;
    if (auth.via !== 'session') throw new HttpError(400, 'API tokens have no session; GET /api/session needs the cookie');
    res.json({ user: publicUser(auth.user), csrfToken: auth.session!.csrfToken });
  });
  r.delete('/', async (req, res) => {
    const auth = req.auth!;
    if (auth.via !== 'session') throw new HttpError(400, 'API tokens have no session to end; revoke the token instead');
    await deleteSession(ctx.store, auth.session!.id);
    await recordAudit(ctx.store, { user: auth.user, action: 'sign-out', ip: req.ip });
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: req.secure });
    res.status(204).end();
  });
  r.get('/all', async (req, res) => {
    parse(z.object({}).strict(), req.query, 'query');
    const auth = req.auth!;
    res.json({ sessions: await listUserSessions(ctx.store, auth.user.id, auth.session?.id) });
  });
  r.delete('/others', async (req, res) => {
    const auth = req.auth!;
    if (auth.via !== 'session') throw new HttpError(400, 'an API token has no session to keep; sign in with the browser to end your other sessions');
    const ended = await deleteOtherSessions(ctx.store, auth.user.id, auth.session!.id);
    await recordAudit(ctx.store, { user: auth.user, action: 'sessions-ended', detail: { ended, by: 'user' }, ip: req.ip });
    res.json({ ended });
  });
  return r;
}
