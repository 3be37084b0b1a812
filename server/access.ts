// Every API route with the least role that may call it: the single table the access
// middleware enforces (an /api route missing here answers 404, so nothing is reachable
// without an entry) and the route × role tests walk.
import { ROLES, type Role } from '../shared/db/schema.js';

export type Access = 'public' | 'signed-in' | Role;

export interface RouteAccess {
  method: 'GET' | 'POST' | 'PATCH' | 'DELETE';
  /** Express-style path; `:name` matches one segment. */
  path: string;
  access: Access;
  /** State-changing routes called before there is a session need no CSRF token. */
  csrfExempt?: boolean;
}

export const ROUTES: readonly RouteAccess[] = [
  { method: 'GET', path: '/api/health', access: 'public' },
  { method: 'POST', path: '/api/session', access: 'public', csrfExempt: true },
  { method: 'GET', path: '/api/session', access: 'signed-in' },
  { method: 'DELETE', path: '/api/session', access: 'signed-in' },
  { method: 'GET', path: '/api/session/all', access: 'signed-in' },
  { method: 'DELETE', path: '/api/session/others', access: 'signed-in' },
  { method: 'POST', path: '/api/password-reset', access: 'public', csrfExempt: true },
  { method: 'POST', path: '/api/password-reset/confirm', access: 'public', csrfExempt: true },
  { method: 'POST', path: '/api/invites/accept', access: 'public', csrfExempt: true },

  { method: 'GET', path: '/api/methods', access: 'viewer' },
  { method: 'GET', path: '/api/studies', access: 'viewer' },
  { method: 'GET', path: '/api/studies/:id', access: 'viewer' },
  { method: 'POST', path: '/api/studies', access: 'researcher' },
  { method: 'GET', path: '/api/studies/:id/measurements', access: 'viewer' },
  { method: 'POST', path: '/api/studies/:id/measurements', access: 'researcher' },
  { method: 'GET', path: '/api/measurements/:id', access: 'viewer' },
  { method: 'GET', path: '/api/runs', access: 'viewer' },
  { method: 'POST', path: '/api/runs/push', access: 'researcher' },
  { method: 'GET', path: '/api/runs/:id', access: 'viewer' },
  { method: 'GET', path: '/api/runs/:id/results', access: 'viewer' },
  { method: 'GET', path: '/api/runs/:id/chart', access: 'viewer' },
  { method: 'GET', path: '/api/runs/:id/chart/axes', access: 'viewer' },
  { method: 'GET', path: '/api/runs/:id/export', access: 'viewer' },
  { method: 'GET', path: '/api/runs/:id/points/:point', access: 'viewer' },
  { method: 'POST', path: '/api/runs/:id/reference', access: 'lead' },
  { method: 'POST', path: '/api/runs/:id/resume', access: 'researcher' },
  { method: 'GET', path: '/api/compare', access: 'viewer' },

  { method: 'GET', path: '/api/tokens', access: 'researcher' },
  { method: 'POST', path: '/api/tokens', access: 'researcher' },
  { method: 'DELETE', path: '/api/tokens/:id', access: 'researcher' },

  { method: 'GET', path: '/api/users', access: 'lead' },
  { method: 'PATCH', path: '/api/users/:id', access: 'lead' },
  { method: 'GET', path: '/api/invites', access: 'lead' },
  { method: 'POST', path: '/api/invites', access: 'lead' },
  { method: 'DELETE', path: '/api/invites/:id', access: 'lead' },
  { method: 'GET', path: '/api/outbox', access: 'lead' },
  { method: 'GET', path: '/api/audit', access: 'lead' },
];

export function roleAtLeast(role: Role, least: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(least);
}

const compiled = ROUTES.map((r) => ({
  ...r,
  // Static segments are matched literally; `:name` is one non-empty segment.
  pattern: new RegExp(`^${r.path.split('/').map((s) => (s.startsWith(':') ? '[^/]+' : s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'))).join('/')}/?$`),
}));

/** The table entry for a request, preferring a literal segment over a parameter (`/api/runs/push`). */
export function findRoute(method: string, path: string): RouteAccess | undefined {
  const matches = compiled.filter((r) => r.method === method && r.pattern.test(path));
  matches.sort((a, b) => a.path.split(':').length - b.path.split(':').length);
  return matches[0];
}

/** Whether some route has this path with another method (405 rather than 404). */
export function pathKnown(path: string): boolean {
  return compiled.some((r) => r.pattern.test(path));
}
