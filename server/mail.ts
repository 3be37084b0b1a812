// Outgoing mail: nodemailer builds each message (stream transport, so no network), and the
// finished message lands in the mail_outbox table in place of a hosted mail service.
import nodemailer from 'nodemailer';
import { storeMail } from '../shared/db/outbox.js';
import type { Store } from '../shared/db/store.js';

export const MAIL_FROM = 'Filmsweep <filmsweep@localhost>';

export class Mailer {
  private readonly transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });

  constructor(private readonly store: Store) {}

  async send(message: { to: string; subject: string; text: string }): Promise<number> {
    const info = await this.transport.sendMail({ from: MAIL_FROM, ...message });
    const raw = Buffer.isBuffer(info.message) ? info.message.toString('utf8') : String(info.message);
    return storeMail(this.store, { ...message, raw });
  }
}
