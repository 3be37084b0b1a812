// Invitations (a lead invites an e-mail with a role; the link's token makes the account)
// and password resets (a one-hour link). Both tokens are single-use and stored as sha256.
import type { Role } from './schema.js';
import { hashSecret, newSecret } from './secrets.js';
import type { Store } from './store.js';
import { normalizeEmail } from './users.js';

export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000;
export const PASSWORD_RESET_TTL_MS = 3600 * 1000;

export interface Invite {
  id: number;
  email: string;
  role: Role;
  created_at: string;
  expires_at: string;
  accepted_at: string | null;
}

const inviteColumns = ['id', 'email', 'role', 'created_at', 'expires_at', 'accepted_at'] as const;

export async function createInvite(store: Store, spec: { email: string; role: Role; invitedBy: number | null }, ttlMs = INVITE_TTL_MS): Promise<Invite & { token: string }> {
  const token = newSecret();
  const now = new Date();
  const row = await store.db
    .insertInto('invites')
    .values({
      email: normalizeEmail(spec.email),
      role: spec.role,
      token_hash: hashSecret(token),
      invited_by: spec.invitedBy,
      created_at: now.toISOString(),
      expires_at: new Date(now.getTime() + ttlMs).toISOString(),
      accepted_at: null,
    })
    .returning(inviteColumns)
    .executeTakeFirstOrThrow();
  return { ...row, token };
}

export async function listInvites(store: Store): Promise<Invite[]> {
  return store.db.selectFrom('invites').select(inviteColumns).orderBy('id', 'desc').execute();
}

/** The open (unused, unexpired) invite for a token, or undefined. */
export async function findOpenInvite(store: Store, token: string): Promise<Invite | undefined> {
  return store.db
    .selectFrom('invites')
    .select(inviteColumns)
    .where('token_hash', '=', hashSecret(token))
    .where('accepted_at', 'is', null)
    .where('expires_at', '>', new Date().toISOString())
    .executeTakeFirst();
}

/** Marks the invite used; false when someone else used it first. */
export async function markInviteAccepted(store: Store, id: number): Promise<boolean> {
  const r = await store.db
    .updateTable('invites')
    .set({ accepted_at: new Date().toISOString() })
    .where('id', '=', id)
    .where('accepted_at', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

export async function createPasswordReset(store: Store, userId: number, ttlMs = PASSWORD_RESET_TTL_MS): Promise<{ token: string; expiresAt: string }> {
  const token = newSecret();
  const now = new Date();
  const expiresAt = new Date(now.getTime() + ttlMs).toISOString();
  await store.db
    .insertInto('password_resets')
    .values({ user_id: userId, token_hash: hashSecret(token), created_at: now.toISOString(), expires_at: expiresAt, used_at: null })
    .execute();
  return { token, expiresAt };
}

/** Uses a reset token once: the user id when it was valid, else undefined. */
export async function consumePasswordReset(store: Store, token: string): Promise<number | undefined> {
  const row = await store.db
    .selectFrom('password_resets')
    .select(['id', 'user_id'])
    .where('token_hash', '=', hashSecret(token))
    .where('used_at', 'is', null)
    .where('expires_at', '>', new Date().toISOString())
    .executeTakeFirst();
  if (!row) return undefined;
  const r = await store.db
    .updateTable('password_resets')
    .set({ used_at: new Date().toISOString() })
    .where('id', '=', row.id)
    .where('used_at', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1 ? row.user_id : undefined;
}
