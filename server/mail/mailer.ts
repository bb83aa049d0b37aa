import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** What the mail is and which studio sent it: headers the local fake files it under. */
  tag?: { kind: MailKind; studioId?: number };
}

export type MailKind = 'invitation' | 'reset' | 'agenda' | 'account';

/** Sends mail over SMTP: the local fake outside production, the configured server in production. */
export class Mailer {
  private readonly transport: Transporter;

  constructor(private readonly config: Pick<Config, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_USER' | 'SMTP_PASSWORD' | 'MAIL_FROM' | 'NODE_ENV'>) {
    const isLocalFake = config.NODE_ENV !== 'production' && !config.SMTP_USER;
    this.transport = nodemailer.createTransport({
      host: config.SMTP_HOST,
      port: config.SMTP_PORT,
      // Port 465 speaks TLS from the first byte; others upgrade with STARTTLS when the server offers it.
      secure: config.SMTP_PORT === 465,
      ignoreTLS: isLocalFake,
      auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? '' } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
    });
  }

  async send({ tag, ...mail }: OutgoingMail): Promise<void> {
    const headers: Record<string, string> = {};
    if (tag) headers['X-Kerfcast-Kind'] = tag.kind;
    if (tag?.studioId !== undefined) headers['X-Kerfcast-Studio'] = String(tag.studioId);
    await this.transport.sendMail({ from: this.config.MAIL_FROM, ...mail, headers });
  }

  close(): void {
    this.transport.close();
  }
}
