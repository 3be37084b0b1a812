// Who is calling: an API token (`Authorization: Bearer …`) or the session cookie. Sets
// req.auth; refusing anonymous callers is access.ts's job.
import type { NextFunction, Request, Response } from 'express';
import { findSession } from '../../shared/db/sessions.js';
import { userForToken } from '../../shared/db/tokens.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import '../types.js';

export const SESSION_COOKIE = 'filmsweep_session';

export function authenticate(ctx: AppContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const header = req.get('authorization');
    if (header !== undefined) {
      const m = /^Bearer\s+(\S+)$/i.exec(header.trim());
      if (!m) throw new HttpError(401, 'Authorization header: expected "Bearer <API token>"');
      const found = await userForToken(ctx.store, m[1]);
      if (!found) throw new HttpError(401, 'the API token is not valid (revoked, or its owner is disabled)');
      req.auth = { user: found.user, via: 'token' };
      return next();
    }
    const secret = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
    if (secret) {
      const session = await findSession(ctx.store, secret);
      if (session) req.auth = { user: session.user, via: 'session', session: { id: session.id, csrfToken: session.csrfToken } };
    }
    next();
  };
}
