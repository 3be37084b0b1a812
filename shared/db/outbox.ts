// The local mail outbox: every message the server sends lands here (server/mail.ts), in
// place of a hosted mail service; the dashboard shows it in development.
import type { Store } from './store.js';

export interface OutboxMessage {
  id: number;
  to: string;
  subject: string;
  text: string;
  created_at: string;
}

export async function storeMail(store: Store, message: { to: string; subject: string; text: string; raw: string }): Promise<number> {
  const row = await store.db
    .insertInto('mail_outbox')
    .values({ to_address: message.to, subject: message.subject, text: message.text, raw: message.raw, created_at: new Date().toISOString() })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Newest first. */
export async function listMail(store: Store, limit = 200): Promise<OutboxMessage[]> {
  const rows = await store.db
    .selectFrom('mail_outbox')
    .select(['id', 'to_address', 'subject', 'text', 'created_at'])
    .orderBy('id', 'desc')
    .limit(limit)
    .execute();
  return rows.map((r) => ({ id: r.id, to: r.to_address, subject: r.subject, text: r.text, created_at: r.created_at }));
}
