import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

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

  async send(mail: OutgoingMail): Promise<void> {
    await this.transport.sendMail({ from: this.config.MAIL_FROM, ...mail });
  }

  close(): void {
    this.transport.close();
  }
}
