// API tokens for CI and `filmsweep push`: random, shown once when made, stored as sha256.
// A token acts as its owner, with the owner's current role; it stops working when revoked
// or when the owner is disabled, and every token of a user is deleted when their password
// is reset.
import { hashSecret, newSecret } from './secrets.js';
import type { Store } from './store.js';
import type { User } from './users.js';

export interface ApiToken {
  id: number;
  name: string;
  created_at: string;
  last_used_at: string | null;
}

/** Tokens start with this, so a leaked one is easy to recognise in logs. */
export const TOKEN_PREFIX = 'fsw_';

export async function createToken(store: Store, userId: number, name: string): Promise<ApiToken & { token: string }> {
  const token = TOKEN_PREFIX + newSecret();
  const row = await store.db
    .insertInto('api_tokens')
    .values({ user_id: userId, name, token_hash: hashSecret(token), created_at: new Date().toISOString(), last_used_at: null })
    .returning(['id', 'name', 'created_at', 'last_used_at'])
    .executeTakeFirstOrThrow();
  return { ...row, token };
}

export async function listTokens(store: Store, userId: number): Promise<ApiToken[]> {
  return store.db
    .selectFrom('api_tokens')
    .select(['id', 'name', 'created_at', 'last_used_at'])
    .where('user_id', '=', userId)
    .orderBy('id')
    .execute();
}

/** Deletes the user's token; false when the user has no such token. */
export async function revokeToken(store: Store, userId: number, id: number): Promise<boolean> {
  const r = await store.db.deleteFrom('api_tokens').where('id', '=', id).where('user_id', '=', userId).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

/** Deletes every token of the user (a password reset does); the number deleted. */
export async function revokeAllTokens(store: Store, userId: number): Promise<number> {
  const r = await store.db.deleteFrom('api_tokens').where('user_id', '=', userId).executeTakeFirst();
  return Number(r.numDeletedRows);
}

/** The enabled owner of a token (and the token's id), marking it used; undefined otherwise. */
export async function userForToken(store: Store, token: string): Promise<{ user: User; tokenId: number } | undefined> {
  const row = await store.db
    .selectFrom('api_tokens as t')
    .innerJoin('users as u', 'u.id', 't.user_id')
    .select(['t.id as token_id', 'u.id', 'u.email', 'u.name', 'u.role', 'u.disabled', 'u.created_at'])
    .where('t.token_hash', '=', hashSecret(token))
    .executeTakeFirst();
  if (!row || row.disabled) return undefined;
  await store.db.updateTable('api_tokens').set({ last_used_at: new Date().toISOString() }).where('id', '=', row.token_id).execute();
  return {
    tokenId: row.token_id,
    user: { id: row.id, email: row.email, name: row.name, role: row.role, disabled: false, created_at: row.created_at },
  };
}
