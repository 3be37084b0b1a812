// Invitations (a lead invites an e-mail with a role; the link's token makes the account)
// and password resets (a one-hour link). Both tokens are single-use and stored as sha256.
// An address has at most one open invite (unused, unrevoked, unexpired); a lead may revoke
// it. A used reset token ends every other open reset token of the account.
import type { Role } from './schema.js';
import { hashSecret, newSecret } from './secrets.js';
import type { Store } from './store.js';
import { immediateTransaction } from './transaction.js';
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
  revoked_at: string | null;
}

const inviteColumns = ['id', 'email', 'role', 'created_at', 'expires_at', 'accepted_at', 'revoked_at'] as const;

/** The address already has an open invite: revoke it first (or let it expire). */
export class OpenInviteExistsError extends Error {
  constructor(readonly existing: Invite) {
    super(`${existing.email} already has an open invitation (id ${existing.id}, as ${existing.role}, until ${existing.expires_at}); revoke it first`);
    this.name = 'OpenInviteExistsError';
  }
}

/** The open invite of an address, if any. */
export async function openInviteFor(store: Store, email: string): Promise<Invite | undefined> {
  return store.db
    .selectFrom('invites')
    .select(inviteColumns)
    .where('email', '=', normalizeEmail(email))
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .where('expires_at', '>', new Date().toISOString())
    .executeTakeFirst();
}

/** A new invite; OpenInviteExistsError when the address has one (checked and inserted in one serialised transaction). */
export async function createInvite(store: Store, spec: { email: string; role: Role; invitedBy: number | null }, ttlMs = INVITE_TTL_MS): Promise<Invite & { token: string }> {
  const token = newSecret();
  const now = new Date();
  const email = normalizeEmail(spec.email);
  const row = await immediateTransaction(store, async (db) => {
    const open = await db
      .selectFrom('invites')
      .select(inviteColumns)
      .where('email', '=', email)
      .where('accepted_at', 'is', null)
      .where('revoked_at', 'is', null)
      .where('expires_at', '>', now.toISOString())
      .executeTakeFirst();
    if (open) throw new OpenInviteExistsError(open);
    return db
      .insertInto('invites')
      .values({
        email,
        role: spec.role,
        token_hash: hashSecret(token),
        invited_by: spec.invitedBy,
        created_at: now.toISOString(),
        expires_at: new Date(now.getTime() + ttlMs).toISOString(),
        accepted_at: null,
      })
      .returning(inviteColumns)
      .executeTakeFirstOrThrow();
  });
  return { ...row, token };
}

export async function getInvite(store: Store, id: number): Promise<Invite | undefined> {
  return store.db.selectFrom('invites').select(inviteColumns).where('id', '=', id).executeTakeFirst();
}

/** Revokes an invite that is neither used nor revoked; false when it was not open. */
export async function revokeInvite(store: Store, id: number, by: number | null): Promise<boolean> {
  const r = await store.db
    .updateTable('invites')
    .set({ revoked_at: new Date().toISOString(), revoked_by: by })
    .where('id', '=', id)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
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
    .where('revoked_at', 'is', null)
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
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

/** Reset links made for the account since `since` (ISO time): the per-account mail limit counts them. */
export async function countPasswordResetsSince(store: Store, userId: number, since: string): Promise<number> {
  const row = await store.db
    .selectFrom('password_resets')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('user_id', '=', userId)
    .where('created_at', '>', since)
    .executeTakeFirstOrThrow();
  return Number(row.n);
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

/**
 * Uses a reset token once: the user id when it was valid, else undefined. Every other
 * open reset token of the same account ends with it (marked used), so an older link in a
 * mailbox cannot change the password again.
 */
export async function consumePasswordReset(store: Store, token: string): Promise<number | undefined> {
  return immediateTransaction(store, async (db) => {
    const now = new Date().toISOString();
    const row = await db
      .selectFrom('password_resets')
      .select(['id', 'user_id'])
      .where('token_hash', '=', hashSecret(token))
      .where('used_at', 'is', null)
      .where('expires_at', '>', now)
      .executeTakeFirst();
    if (!row) return undefined;
    await db.updateTable('password_resets').set({ used_at: now }).where('user_id', '=', row.user_id).where('used_at', 'is', null).execute();
    return row.user_id;
  });
}
