import type { Knex } from 'knex';
import type { CapturedMail } from '@shared/contracts/team';
import { MailboxRepository } from '../../server/dev/mailbox-repository';
import { startMailFake, type MailFake } from '../../server/mail/mail-fake';
import { makeTestApp, testConfig, type TestApp } from './test-app';

export interface MailTestApp extends TestApp {
  mailFake: MailFake;
}

/** The test app with real SMTP to the local fake, which listens on a free port and keeps mail in dev_mailbox. */
export async function makeMailTestApp(overrides: Record<string, string> = {}): Promise<MailTestApp> {
  const probe = makeTestApp();
  const mailFake = await startMailFake(probe.db, 0);
  const config = testConfig({ SMTP_PORT: String(mailFake.port), PUBLIC_URL: 'http://app.example.test', ...overrides });
  const t = makeTestApp({ config });
  return {
    ...t,
    mailFake,
    close: async () => {
      await mailFake.close();
      await t.close();
      await probe.close();
    },
  };
}

/** Waits until a message to `to` (optionally whose subject matches) has been captured, and returns the newest. */
export async function waitForMail(db: Knex, to: string, subject?: RegExp, timeoutMs = 5000): Promise<CapturedMail> {
  const mailbox = new MailboxRepository(db);
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await mailbox.list({ email: to, ownedStudios: [] }, 20)).find((mail) => !subject || subject.test(mail.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to}${subject ? ` matching ${subject}` : ''} within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

export async function mailCount(db: Knex, to: string): Promise<number> {
  return (await new MailboxRepository(db).list({ email: to, ownedStudios: [] }, 200)).length;
}

/** The token at the end of the first app link with the given path in the mail's text part. */
export function linkToken(mail: CapturedMail, pathPrefix: string): string {
  const match = new RegExp(`http://app\\.example\\.test${pathPrefix}/([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!match) throw new Error(`no ${pathPrefix} link in mail "${mail.subject}"`);
  return match[1];
}
