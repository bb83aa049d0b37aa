import request from 'supertest';
import { Mailer } from '../../server/mail/mailer';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testConfig, uniqueEmail } from '../helpers/test-app';
import { makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

async function send(mail: Parameters<Mailer['send']>[0]): Promise<void> {
  const mailer = new Mailer(t.config);
  try {
    await mailer.send(mail);
  } finally {
    mailer.close();
  }
  await waitForMail(t.db, mail.to, new RegExp(mail.subject.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')));
}

const subjects = (response: { body: { subject: string }[] }) => response.body.map((mail) => mail.subject);

describe('development mailbox', () => {
  it('when mail to a member goes through the SMTP fake, then they read it with both parts, newest first', async () => {
    const { members } = await makeStudio(t.db, ['crew']);
    const to = members.crew.email;
    await send({ to, subject: 'First, with "quotes"', text: 'plain one', html: '<p>html <b>one</b></p>' });
    await send({ to, subject: 'Second', text: 'plain two', html: '<p>two</p>' });
    const crew = await signIn(t.app, to);
    const response = await crew.get('/api/dev/mailbox');
    expect(response.status).toBe(200);
    expect(subjects(response)).toEqual(['Second', 'First, with "quotes"']);
    expect(response.body[1]).toEqual({
      id: expect.any(Number),
      to,
      subject: 'First, with "quotes"',
      text: expect.stringContaining('plain one'),
      html: expect.stringContaining('<b>one</b>'),
      date: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
    });
  });

  it("when an owner asks for mail to another account (its reset link), then they get none of it, asked by address or not", async () => {
    const victim = await makeStudio(t.db, ['owner']);
    await send({ to: victim.members.owner.email, subject: 'Reset your Kerfcast password', text: 'a reset link', html: '<p>a reset link</p>', tag: { kind: 'reset' } });
    const intruder = await signIn(t.app, (await makeStudio(t.db, ['owner'])).members.owner.email);
    expect((await intruder.get('/api/dev/mailbox').query({ to: victim.members.owner.email })).body).toEqual([]);
    expect(subjects(await intruder.get('/api/dev/mailbox'))).not.toContain('Reset your Kerfcast password');
  });

  it("when a studio sends an invitation, then its owners read it, and neither its other members nor another studio's owner do", async () => {
    const studio = await makeStudio(t.db);
    const other = await makeStudio(t.db, ['owner']);
    const invited = uniqueEmail('invited');
    await send({ to: invited, subject: 'Juniper invites you to Alder bench', text: 'an invitation link', html: '<p>link</p>', tag: { kind: 'invitation', studioId: studio.studioId } });
    const owner = await signIn(t.app, studio.members.owner.email);
    expect(subjects(await owner.get('/api/dev/mailbox').query({ to: invited }))).toEqual(['Juniper invites you to Alder bench']);
    for (const email of [studio.members.partner.email, studio.members.crew.email, other.members.owner.email]) {
      const reader = await signIn(t.app, email);
      expect([email, (await reader.get('/api/dev/mailbox').query({ to: invited })).body]).toEqual([email, []]);
    }
  });

  it('when anonymous, then 401; a member of no studio reads their own mail only', async () => {
    expect((await (await anonymousAgent(t.app)).get('/api/dev/mailbox')).status).toBe(401);
    const { members } = await makeStudio(t.db, ['crew']);
    const crew = await signIn(t.app, members.crew.email);
    const response = await crew.get('/api/dev/mailbox');
    expect(response.status).toBe(200);
    expect(response.body.every((mail: { to: string }) => mail.to === members.crew.email)).toBe(true);
  });

  it('when the app runs in production, then the mailbox route does not exist (404)', async () => {
    const production = makeTestApp({ config: testConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-production-secret-for-tests' }) });
    try {
      const response = await request(production.app).get('/api/dev/mailbox');
      expect(response.status).toBe(404);
    } finally {
      await production.close();
    }
  });
});
