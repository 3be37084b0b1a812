// Sign-in sessions: the cookie carries a random secret, the table its sha256, the user and
// the session's CSRF token. Sessions end at expires_at, at sign-out, when the user ends
// their other sessions, at a password reset, or when the account is disabled (lookups
// refuse disabled users). Expired rows are deleted by the server (at start-up and on a
// timer), not only ignored. Signing in again does not end older sessions (several
// browsers are normal); the user lists them and may end all but the current one.
import { hashSecret, newSecret } from './secrets.js';
import type { Store } from './store.js';
import type { User } from './users.js';

/** Sessions last 7 days from sign-in unless the server says otherwise. */
export const DEFAULT_SESSION_TTL_MS = 7 * 24 * 3600 * 1000;

export interface NewSession {
  /** The cookie value: shown once, never stored. */
  secret: string;
  csrfToken: string;
  expiresAt: Date;
}

export interface ActiveSession {
  id: string;
  csrfToken: string;
  expiresAt: string;
  user: User;
}

/** Where a session was opened: shown in the user's list of sessions. */
export interface SessionOrigin {
  ip?: string | null;
  userAgent?: string | null;
}

export async function createSession(store: Store, userId: number, ttlMs = DEFAULT_SESSION_TTL_MS, origin: SessionOrigin = {}): Promise<NewSession> {
  const secret = newSecret();
  const csrfToken = newSecret();
  const now = new Date();
  const expiresAt = new Date(now.getTime() + ttlMs);
  await store.db
    .insertInto('sessions')
    .values({
      id: hashSecret(secret),
      user_id: userId,
      csrf_token: csrfToken,
      created_at: now.toISOString(),
      expires_at: expiresAt.toISOString(),
      ip: origin.ip ?? null,
      user_agent: origin.userAgent?.slice(0, 300) ?? null,
    })
    .execute();
  return { secret, csrfToken, expiresAt };
}

/** A session as its owner sees it in the list: no secret, no CSRF token, no stored hash. */
export interface SessionListing {
  created_at: string;
  expires_at: string;
  ip: string | null;
  user_agent: string | null;
  /** The session this request came with. */
  current: boolean;
}

/** The user's live sessions, newest first. */
export async function listUserSessions(store: Store, userId: number, currentId?: string): Promise<SessionListing[]> {
  const rows = await store.db
    .selectFrom('sessions')
    .select(['id', 'created_at', 'expires_at', 'ip', 'user_agent'])
    .where('user_id', '=', userId)
    .where('expires_at', '>', new Date().toISOString())
    .orderBy('created_at', 'desc')
    .execute();
  return rows.map((r) => ({ created_at: r.created_at, expires_at: r.expires_at, ip: r.ip, user_agent: r.user_agent, current: r.id === currentId }));
}

/** Ends every session of the user except `keepId`; the number ended. */
export async function deleteOtherSessions(store: Store, userId: number, keepId: string): Promise<number> {
  const r = await store.db.deleteFrom('sessions').where('user_id', '=', userId).where('id', '!=', keepId).executeTakeFirst();
  return Number(r.numDeletedRows);
}

/** The live session for a cookie value, or undefined (unknown, expired, or user disabled). */
export async function findSession(store: Store, secret: string): Promise<ActiveSession | undefined> {
  const row = await store.db
    .selectFrom('sessions as s')
    .innerJoin('users as u', 'u.id', 's.user_id')
    .select(['s.id', 's.csrf_token', 's.expires_at', 'u.id as user_id', 'u.email', 'u.name', 'u.role', 'u.disabled', 'u.created_at'])
    .where('s.id', '=', hashSecret(secret))
    .executeTakeFirst();
  if (!row || row.disabled || row.expires_at <= new Date().toISOString()) return undefined;
  return {
    id: row.id,
    csrfToken: row.csrf_token,
    expiresAt: row.expires_at,
    user: { id: row.user_id, email: row.email, name: row.name, role: row.role, disabled: false, created_at: row.created_at },
  };
}

export async function deleteSession(store: Store, id: string): Promise<void> {
  await store.db.deleteFrom('sessions').where('id', '=', id).execute();
}

export async function deleteUserSessions(store: Store, userId: number): Promise<void> {
  await store.db.deleteFrom('sessions').where('user_id', '=', userId).execute();
}

/** Deletes expired sessions; the number deleted. */
export async function deleteExpiredSessions(store: Store): Promise<number> {
  const r = await store.db.deleteFrom('sessions').where('expires_at', '<=', new Date().toISOString()).executeTakeFirst();
  return Number(r.numDeletedRows);
}
