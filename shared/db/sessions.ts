// Sign-in sessions: the cookie carries a random secret, the table its sha256, the user and
// the session's CSRF token. Sessions end at expires_at, at sign-out, or when the account
// is disabled (lookups refuse disabled users).
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

export async function createSession(store: Store, userId: number, ttlMs = DEFAULT_SESSION_TTL_MS): Promise<NewSession> {
  const secret = newSecret();
  const csrfToken = newSecret();
  const now = new Date();
  const expiresAt = new Date(now.getTime() + ttlMs);
  await store.db
    .insertInto('sessions')
    .values({ id: hashSecret(secret), user_id: userId, csrf_token: csrfToken, created_at: now.toISOString(), expires_at: expiresAt.toISOString() })
    .execute();
  return { secret, csrfToken, expiresAt };
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

export async function deleteExpiredSessions(store: Store): Promise<void> {
  await store.db.deleteFrom('sessions').where('expires_at', '<=', new Date().toISOString()).execute();
}
