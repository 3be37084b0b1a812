// Sign-in, sessions, CSRF, rate limit, tokens, invites, password reset, team changes and
// the audit log, against a real server on 127.0.0.1 with a real SQLite file and, when
// FILMSWEEP_TEST_PG_URL is set, a real PostgreSQL database.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { hashSecret } from '../shared/db/secrets.js';
import { Client, PASSWORD, startTestServer, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

const outbox = async (lead: Client) => (await lead.json('GET', '/api/outbox')).body.messages as { to: string; subject: string; text: string }[];

describe.each(STORE_KINDS)('on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  beforeEach(async () => {
    database = await createTestDatabase(kind, 'auth');
    s = await startTestServer({}, database.location);
  });
  afterEach(async () => {
    await s.close();
    await database.drop();
  });

  describe('sign-in and sessions', () => {
    it('signs in, reports the session, and signs out', async () => {
      const c = new Client(s.url);
      const r = await c.json('POST', '/api/session', { json: { email: 'Lena@Example.org', password: PASSWORD } });
      expect(r.status).toBe(200);
      expect(r.body.user).toEqual({ email: s.emails.lead, role: 'lead', name: 'lead' });
      expect(r.body.csrfToken).toMatch(/^[A-Za-z0-9_-]{43}$/);
      c.csrfToken = r.body.csrfToken;
      const me = await c.json('GET', '/api/session');
      expect(me).toEqual({ status: 200, body: { user: r.body.user, csrfToken: r.body.csrfToken } });
      expect((await c.request('DELETE', '/api/session')).status).toBe(204);
      expect((await c.json('GET', '/api/session')).status).toBe(401);
    });

    it('sets the session cookie httpOnly, SameSite=Lax, Path=/, and Secure only over HTTPS', async () => {
      const c = await s.signIn(s.emails.viewer);
      const set = c.lastSetCookie!;
      expect(set).toMatch(/^filmsweep_session=[A-Za-z0-9_-]{43};/);
      expect(set).toMatch(/HttpOnly/i);
      expect(set).toMatch(/SameSite=Lax/i);
      expect(set).toMatch(/Path=\//);
      expect(set).toMatch(/Expires=/);
      expect(set).not.toMatch(/Secure/i);
      // The cookie value is stored only as its hash.
      const secret = c.cookie!.split('=')[1];
      const ids = (await s.store.dialect.all<{ id: string }>('select id from sessions')).map((r) => r.id);
      expect(ids).toContain(hashSecret(secret));
      expect(ids).not.toContain(secret);

      const proxied = await startTestServer({ trustProxy: 1 });
      try {
        const res = await fetch(`${proxied.url}/api/session`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-forwarded-proto': 'https' },
          body: JSON.stringify({ email: proxied.emails.viewer, password: PASSWORD }),
        });
        expect(res.status).toBe(200);
        expect(res.headers.get('set-cookie')).toMatch(/;\s*Secure/i);
      } finally {
        await proxied.close();
      }
    });

    it('refuses a wrong password and an unknown e-mail with the same 401 message, and audits both', async () => {
      const a = await s.anonymous().json('POST', '/api/session', { json: { email: s.emails.lead, password: 'not the password' } });
      const b = await s.anonymous().json('POST', '/api/session', { json: { email: 'nobody@example.org', password: 'not the password' } });
      expect(a.status).toBe(401);
      expect(b.status).toBe(401);
      expect(a.body).toEqual(b.body);
      expect(a.body.error.message).toBe('wrong e-mail or password');
      const bad = await s.anonymous().json('POST', '/api/session', { json: { email: s.emails.lead } });
      expect(bad.status).toBe(400);
      expect(Array.isArray(bad.body.error.details)).toBe(true);
      const lead = await s.signIn(s.emails.lead);
      const entries = (await lead.json('GET', '/api/audit')).body.entries;
      const failed = entries.filter((e: any) => e.action === 'sign-in-failed').map((e: any) => e.detail.email);
      expect(failed.sort()).toEqual(['lena@example.org', 'nobody@example.org']);
      expect(entries.some((e: any) => e.action === 'sign-in' && e.user === s.emails.lead)).toBe(true);
    });

    it('rate-limits failed sign-ins to 10 per 15 minutes per address and e-mail', async () => {
      const c = s.anonymous();
      for (let i = 0; i < 10; i++) {
        expect((await c.json('POST', '/api/session', { json: { email: s.emails.viewer, password: `wrong-${i}` } })).status).toBe(401);
      }
      const limited = await c.json('POST', '/api/session', { json: { email: s.emails.viewer, password: PASSWORD } });
      expect(limited.status).toBe(429);
      expect(limited.body.error.message).toMatch(/too many/);
      // Another e-mail from the same address is not affected.
      expect((await c.json('POST', '/api/session', { json: { email: s.emails.lead, password: PASSWORD } })).status).toBe(200);
    });

    it('refuses a state-changing request without the right X-CSRF-Token', async () => {
      const c = await s.signIn(s.emails.researcher);
      expect((await c.json('POST', '/api/tokens', { json: { name: 'ci' }, csrf: false })).status).toBe(403);
      expect((await c.json('POST', '/api/tokens', { json: { name: 'ci' }, headers: { 'x-csrf-token': 'x'.repeat(43) }, csrf: false })).status).toBe(403);
      expect((await c.request('DELETE', '/api/session', { csrf: false })).status).toBe(403);
      expect((await c.json('POST', '/api/tokens', { json: { name: 'ci' } })).status).toBe(201);
    });

    it('ends sessions at their expiry', async () => {
      const short = await startTestServer({ sessionTtlMs: 300 });
      try {
        const c = await short.signIn(short.emails.viewer);
        expect((await c.json('GET', '/api/methods')).status).toBe(200);
        await new Promise((r) => setTimeout(r, 400));
        expect((await c.json('GET', '/api/methods')).status).toBe(401);
      } finally {
        await short.close();
      }
    });
  });

  describe('API tokens', () => {
    it('are made (shown once, stored hashed), used with Bearer without CSRF, listed, and revoked', async () => {
      const c = await s.signIn(s.emails.researcher);
      const made = await c.json('POST', '/api/tokens', { json: { name: 'ci' } });
      expect(made.status).toBe(201);
      const token: string = made.body.token;
      expect(token).toMatch(/^fsw_[A-Za-z0-9_-]{43}$/);
      expect((await s.store.dialect.all<{ token_hash: string }>('select token_hash from api_tokens'))[0].token_hash).toBe(hashSecret(token));

      const bearer = { authorization: `Bearer ${token}` };
      const viaToken = await s.anonymous().json('GET', '/api/runs', { headers: bearer });
      expect(viaToken.status).toBe(200);
      // A POST with the token needs no CSRF token (it reaches validation: 400, not 403).
      const push = await s.anonymous().json('POST', '/api/runs/push', { headers: bearer, json: {} });
      expect(push.status).toBe(400);

      const list = await c.json('GET', '/api/tokens');
      expect(list.body.tokens).toHaveLength(1);
      expect(list.body.tokens[0]).toMatchObject({ id: made.body.id, name: 'ci' });
      expect(list.body.tokens[0].last_used_at).not.toBeNull();
      expect(JSON.stringify(list.body)).not.toContain(token);

      expect((await c.request('DELETE', `/api/tokens/${made.body.id}`)).status).toBe(204);
      expect((await s.anonymous().json('GET', '/api/runs', { headers: bearer })).status).toBe(401);
      expect((await c.request('DELETE', `/api/tokens/${made.body.id}`)).status).toBe(404);
    });

    it('stop working when the owner is disabled, as do the owner\'s sessions', async () => {
      const r = await s.signIn(s.emails.researcher);
      const { token } = (await r.json('POST', '/api/tokens', { json: { name: 'ci' } })).body;
      const lead = await s.signIn(s.emails.lead);
      const users = (await lead.json('GET', '/api/users')).body.users;
      const rafael = users.find((u: any) => u.email === s.emails.researcher);
      const off = await lead.json('PATCH', `/api/users/${rafael.id}`, { json: { disabled: true } });
      expect(off.status).toBe(200);
      expect(off.body.user.disabled).toBe(true);
      expect((await r.json('GET', '/api/runs')).status).toBe(401);
      expect((await s.anonymous().json('GET', '/api/runs', { headers: { authorization: `Bearer ${token}` } })).status).toBe(401);
      expect((await s.anonymous().json('POST', '/api/session', { json: { email: s.emails.researcher, password: PASSWORD } })).status).toBe(401);
    });
  });

  describe('team', () => {
    it('lets a lead change roles but not demote or disable themself, and audits role changes', async () => {
      const lead = await s.signIn(s.emails.lead);
      const users = (await lead.json('GET', '/api/users')).body.users as any[];
      expect(users.map((u) => u.email).sort()).toEqual(Object.values(s.emails).sort());
      expect(Object.keys(users[0]).sort()).toEqual(['created_at', 'disabled', 'email', 'id', 'name', 'role']);
      const vera = users.find((u) => u.email === s.emails.viewer);
      const me = users.find((u) => u.email === s.emails.lead);
      expect((await lead.json('PATCH', `/api/users/${vera.id}`, { json: { role: 'researcher' } })).body.user.role).toBe('researcher');
      expect((await lead.json('PATCH', `/api/users/${me.id}`, { json: { role: 'viewer' } })).status).toBe(409);
      expect((await lead.json('PATCH', `/api/users/${me.id}`, { json: { disabled: true } })).status).toBe(409);
      expect((await lead.json('PATCH', `/api/users/${vera.id}`, { json: { role: 'boss' } })).status).toBe(400);
      expect((await lead.json('PATCH', '/api/users/9999', { json: { role: 'viewer' } })).status).toBe(404);
      const audit = (await lead.json('GET', '/api/audit?action=role-change')).body.entries;
      expect(audit).toHaveLength(1);
      expect(audit[0]).toMatchObject({ user: s.emails.lead, action: 'role-change', detail: { email: s.emails.viewer, from: 'viewer', to: 'researcher' } });
    });

    it('invites by e-mail; the link\'s token makes the account once and signs in', async () => {
      const lead = await s.signIn(s.emails.lead);
      const inv = await lead.json('POST', '/api/invites', { json: { email: 'new.person@example.org', role: 'researcher' } });
      expect(inv.status).toBe(201);
      expect(Object.keys(inv.body.invite).sort()).toEqual(['email', 'expires_at', 'id', 'role']);
      expect((await lead.json('POST', '/api/invites', { json: { email: s.emails.viewer, role: 'viewer' } })).status).toBe(409);
      const mail = (await outbox(lead)).find((m) => m.to === 'new.person@example.org')!;
      expect(mail.subject).toMatch(/invited/);
      const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
      expect((await lead.json('GET', '/api/invites')).body.invites[0]).toMatchObject({ email: 'new.person@example.org', accepted_at: null });

      const c = new Client(s.url);
      expect((await c.json('POST', '/api/invites/accept', { json: { token, password: 'short' } })).status).toBe(400);
      const ok = await c.json('POST', '/api/invites/accept', { json: { token, password: 'a long enough password', name: 'New Person' } });
      expect(ok.status).toBe(200);
      expect(ok.body.user).toEqual({ email: 'new.person@example.org', role: 'researcher', name: 'New Person' });
      c.csrfToken = ok.body.csrfToken;
      expect((await c.json('GET', '/api/tokens')).status).toBe(200);
      expect((await new Client(s.url).json('POST', '/api/invites/accept', { json: { token, password: 'a long enough password' } })).status).toBe(400);
    });

    it('resets a password through the mailed link (202 whatever the e-mail), once', async () => {
      const anon = s.anonymous();
      expect((await anon.json('POST', '/api/password-reset', { json: { email: 'nobody@example.org' } })).status).toBe(202);
      expect((await anon.json('POST', '/api/password-reset', { json: { email: s.emails.viewer } })).status).toBe(202);
      const old = await s.signIn(s.emails.viewer);
      const lead = await s.signIn(s.emails.lead);
      const mails = await outbox(lead);
      expect(mails.filter((m) => m.to === 'nobody@example.org')).toHaveLength(0);
      const token = /\/reset\/([A-Za-z0-9_-]+)/.exec(mails.find((m) => m.to === s.emails.viewer)!.text)![1];
      expect((await anon.json('POST', '/api/password-reset/confirm', { json: { token, password: 'short' } })).status).toBe(400);
      expect((await anon.request('POST', '/api/password-reset/confirm', { json: { token, password: 'the new password 1' } })).status).toBe(204);
      expect((await anon.json('POST', '/api/password-reset/confirm', { json: { token, password: 'the new password 2' } })).status).toBe(400);
      expect((await old.json('GET', '/api/methods')).status).toBe(401); // sessions ended by the reset
      expect((await s.anonymous().json('POST', '/api/session', { json: { email: s.emails.viewer, password: PASSWORD } })).status).toBe(401);
      await s.signIn(s.emails.viewer, 'the new password 1');
    });

    it('hides the outbox outside development mode', async () => {
      const prod = await startTestServer({ dev: false });
      try {
        const lead = await prod.signIn(prod.emails.lead);
        expect((await lead.json('GET', '/api/outbox')).status).toBe(404);
        expect((await lead.json('GET', '/api/audit')).status).toBe(200);
      } finally {
        await prod.close();
      }
    });
  });
});
