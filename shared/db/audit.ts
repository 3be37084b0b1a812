// The audit log: who did what and when (sign-ins and their failures, uploads, runs
// started and resumed, role changes, invites and their revocation, tokens, exports, reads
// of the mail outbox, failed reset and invite confirmations, requests refused for their
// role (403) or CSRF token, sessions ended). Append-only.
import type { Store } from './store.js';

export const AUDIT_ACTIONS = [
  'sign-in',
  'sign-in-failed',
  'sign-out',
  'password-reset-requested',
  'password-reset',
  'invite',
  'invite-accepted',
  'role-change',
  'user-disabled',
  'user-enabled',
  'upload',
  'run-started',
  'run-pushed',
  'measurement-upload',
  'reference',
  'token-made',
  'token-revoked',
  'export',
  // 0003_security (issue 10)
  'outbox-read',
  'password-reset-failed',
  'password-reset-throttled',
  'invite-accept-failed',
  'invite-revoked',
  'access-refused',
  'csrf-refused',
  'sessions-ended',
  'run-resumed',
  'runs-reconciled',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export interface AuditEntry {
  id: number;
  at: string;
  /** The e-mail of who did it, or null (an anonymous failed sign-in names the e-mail tried in detail). */
  user: string | null;
  action: AuditAction;
  detail: Record<string, unknown>;
}

export async function recordAudit(
  store: Store,
  entry: { user?: { id: number; email: string } | null; action: AuditAction; detail?: Record<string, unknown>; ip?: string | null },
): Promise<void> {
  await store.db
    .insertInto('audit_log')
    .values({
      at: new Date().toISOString(),
      user_id: entry.user?.id ?? null,
      user_email: entry.user?.email ?? null,
      action: entry.action,
      detail: JSON.stringify(entry.detail ?? {}),
      ip: entry.ip ?? null,
    })
    .execute();
}

/** Newest first. */
export async function listAudit(store: Store, options: { limit?: number; action?: AuditAction } = {}): Promise<AuditEntry[]> {
  let q = store.db.selectFrom('audit_log').select(['id', 'at', 'user_email', 'action', 'detail', 'ip']).orderBy('id', 'desc');
  if (options.action) q = q.where('action', '=', options.action);
  const rows = await q.limit(options.limit ?? 500).execute();
  return rows.map((r) => ({
    id: r.id,
    at: r.at,
    user: r.user_email,
    action: r.action as AuditAction,
    detail: { ...(JSON.parse(r.detail) as Record<string, unknown>), ...(r.ip ? { ip: r.ip } : {}) },
  }));
}
