// Enforces server/access.ts for every /api request: unknown route 404 (405 for a known
// path), anonymous 401, role too low 403, and the CSRF check for cookie-authenticated
// state-changing requests (header X-CSRF-Token must equal the session's token). It runs
// before any body is read, so nobody gets a request body parsed without the right to send
// it. A refusal of a signed-in caller (403, wrong CSRF token) goes to the audit log:
// it is either a bug in the web app or someone probing. Anonymous 401s are not logged
// (anyone can make them by the thousand; the sign-in failures are logged where they happen).
import { timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { recordAudit } from '../../shared/db/audit.js';
import { findRoute, pathKnown, roleAtLeast } from '../access.js';
import type { AppContext } from '../context.js';
import { HttpError } from '../http-error.js';
import '../types.js';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

export function enforceAccess(ctx: AppContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const path = req.baseUrl + req.path;
    const route = findRoute(req.method, path);
    if (!route) throw pathKnown(path) ? new HttpError(405, `${req.method} is not allowed on ${path}`) : new HttpError(404, `no API route ${req.method} ${path}`);
    req.route_access = route;
    if (route.access === 'public') return next();
    const auth = req.auth;
    if (!auth) throw new HttpError(401, 'sign in first');
    const refuse = async (action: 'access-refused' | 'csrf-refused', message: string, detail: Record<string, unknown>) => {
      await recordAudit(ctx.store, { user: auth.user, action, detail: { method: req.method, path, via: auth.via, ...detail }, ip: req.ip });
      return new HttpError(403, message);
    };
    if (route.access !== 'signed-in' && !roleAtLeast(auth.user.role, route.access)) {
      throw await refuse('access-refused', `this needs the ${route.access} role; you are ${auth.user.role}`, { needs: route.access, role: auth.user.role });
    }
    if (STATE_CHANGING.has(req.method) && auth.via === 'session' && !route.csrfExempt) {
      const sent = req.get('x-csrf-token');
      if (!sent || !same(sent, auth.session!.csrfToken)) {
        throw await refuse('csrf-refused', 'missing or wrong X-CSRF-Token header', { header: sent ? 'wrong' : 'missing' });
      }
    }
    next();
  };
}
