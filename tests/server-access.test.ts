// The whole route × role matrix: every route in server/access.ts, called anonymously and
// by each role. Anonymous → 401 (unless public); below the route's role → 403; at or
// above it → anything but 401/403 (bodies here are empty or minimal, so 400/404 are fine).
// On SQLite and, when FILMSWEEP_TEST_PG_URL is set, PostgreSQL (no store error may leak as 500).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '../shared/db/schema.js';
import { ROUTES, findRoute, roleAtLeast } from '../server/access.js';
import { Client, startTestServer, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

describe.each(STORE_KINDS)('on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  const clients: Partial<Record<(typeof ROLES)[number], Client>> = {};
  beforeAll(async () => {
    database = await createTestDatabase(kind, 'access');
    s = await startTestServer({}, database.location);
    for (const role of ROLES) clients[role] = await s.signIn(s.emails[role]);
  });
  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  // Concrete paths: ids that do not exist (404 after the role check) and harmless bodies.
  const concrete = (path: string) => path.replace(/:id/g, '999999');
  const skipForRoles = (r: (typeof ROUTES)[number]) => r.method === 'DELETE' && r.path === '/api/session';

  describe('route × role matrix', () => {
    it('lists only routes the app serves (a path that is not in the table is 404 for everybody)', async () => {
      expect((await clients.lead!.json('GET', '/api/no-such-route')).status).toBe(404);
      expect((await clients.lead!.json('PUT', '/api/runs')).status).toBe(405);
      expect(findRoute('POST', '/api/runs/push')!.access).toBe('researcher');
      expect(findRoute('GET', '/api/runs/12/results')!.path).toBe('/api/runs/:id/results');
    });

    for (const route of ROUTES) {
      it(`${route.method} ${route.path} needs ${route.access}`, async () => {
        const path = concrete(route.path) + (route.path === '/api/compare' ? '?a=999999&b=999998' : '');
        const json = route.method === 'GET' || route.method === 'DELETE' ? undefined : {};
        const anon = await new Client(s.url).json(route.method, path, { json });
        if (route.access === 'public') expect(anon.status).not.toBe(401);
        else expect(anon.status).toBe(401);
        expect(anon.body.error?.message ?? '').not.toMatch(/internal/);
        for (const role of ROLES) {
          if (skipForRoles(route)) continue; // signing out is checked below, on its own sessions
          const r = await clients[role]!.json(route.method, path, { json });
          const allowed = route.access === 'public' || route.access === 'signed-in' || roleAtLeast(role, route.access);
          if (allowed) {
            expect([401, 403], `${role} ${route.method} ${path}: ${JSON.stringify(r.body)}`).not.toContain(r.status);
            expect(r.status, `${role} ${route.method} ${path}`).toBeLessThan(500);
          } else {
            expect(r.status, `${role} ${route.method} ${path}`).toBe(403);
          }
        }
      });
    }

    it('lets every role sign out of its own session', async () => {
      for (const role of ROLES) {
        const c = await s.signIn(s.emails[role]);
        expect((await c.request('DELETE', '/api/session')).status).toBe(204);
      }
    });
  });
});
