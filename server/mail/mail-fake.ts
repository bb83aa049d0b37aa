import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { MailboxRepository } from '../dev/mailbox-repository';

export interface MailFake {
  port: number;
  close(): Promise<void>;
}

function addressesOf(to: AddressObject | AddressObject[] | undefined): string {
  const list = Array.isArray(to) ? to : to ? [to] : [];
  return list.flatMap((group) => group.value.map((address) => address.address ?? '')).filter(Boolean).join(', ');
}

function headerText(value: unknown): string | null {
  return typeof value === 'string' ? value.trim() : null;
}

function studioIdOf(text: string | null): number | null {
  return text !== null && /^\d{1,9}$/.test(text) ? Number(text) : null;
}

/**
 * The local SMTP fake (development and tests only): accepts every message on 127.0.0.1 without
 * authentication, parses it with mailparser and keeps it in dev_mailbox for the Mailbox page.
 */
export function startMailFake(db: Knex, port: number, host = '127.0.0.1'): Promise<MailFake> {
  const mailbox = new MailboxRepository(db);
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) =>
          mailbox.add({
            to: addressesOf(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? null,
            html: typeof parsed.html === 'string' ? parsed.html : null,
            // The mail's own Date header, or the real moment the fake caught it.
            date: parsed.date ?? new Date(),
            kind: headerText(parsed.headers.get('x-kerfcast-kind'))?.slice(0, 32) ?? null,
            studio_id: studioIdOf(headerText(parsed.headers.get('x-kerfcast-studio'))),
          }),
        )
        .then(() => callback(), (error: Error) => callback(error));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve({
        port: (server.server.address() as AddressInfo).port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
