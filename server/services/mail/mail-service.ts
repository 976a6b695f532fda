import type { Knex } from 'knex';
import nodemailer, { type Transporter } from 'nodemailer';
import type { AppConfig } from '../../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  /** What the mail is for, kept in the mail log. */
  kind: 'invitation' | 'password_reset' | 'sign_up' | 'account_exists' | 'invitation_refused' | 'briefing_shared' | 'briefing_version';
}

const HOUR_MS = 3_600_000;

/** Sends plain-text mails over SMTP and keeps a log of recipients for the per-address limit. */
export class MailService {
  private readonly transport: Transporter;

  constructor(
    private readonly db: Knex,
    private readonly config: AppConfig['mail'],
  ) {
    this.transport = nodemailer.createTransport({
      host: config.host,
      port: config.port,
      secure: config.secure,
      auth: config.auth,
      connectionTimeout: 10_000,
    });
  }

  /** False when this address has had its hourly share of mails already. */
  async withinLimit(recipient: string): Promise<boolean> {
    const row = await this.db('mail_log')
      .where({ recipient })
      .where('sent_at', '>', new Date(Date.now() - HOUR_MS))
      .count({ n: '*' })
      .first();
    return Number(row?.n ?? 0) < this.config.perAddressPerHour;
  }

  async send(mail: OutgoingMail): Promise<void> {
    await this.db('mail_log').insert({ recipient: mail.to, kind: mail.kind, sent_at: new Date() });
    // Base64 bodies keep long links in one piece for every reader, including the local inbox.
    await this.transport.sendMail({ from: this.config.from, to: mail.to, subject: mail.subject, text: mail.text, textEncoding: 'base64' });
  }

  close(): void {
    this.transport.close();
  }
}
