import request from 'supertest';
import { Mailer } from '../../server/mail/mailer';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testConfig, uniqueEmail } from '../helpers/test-app';
import { makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

describe('development mailbox', () => {
  it('when mail goes through the SMTP fake, then an owner reads it with both parts, newest first', async () => {
    const to = uniqueEmail('reader');
    const mailer = new Mailer(t.config);
    await mailer.send({ to, subject: 'First, with "quotes"', text: 'plain one', html: '<p>html <b>one</b></p>' });
    await mailer.send({ to, subject: 'Second', text: 'plain two', html: '<p>two</p>' });
    mailer.close();
    await waitForMail(t.db, to, /Second/);
    const { members } = await makeStudio(t.db, ['owner']);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.get('/api/dev/mailbox').query({ to });
    expect(response.status).toBe(200);
    expect(response.body.map((m: { subject: string }) => m.subject)).toEqual(['Second', 'First, with "quotes"']);
    expect(response.body[1]).toEqual({
      id: expect.any(Number),
      to,
      subject: 'First, with "quotes"',
      text: expect.stringContaining('plain one'),
      html: expect.stringContaining('<b>one</b>'),
      date: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
    });
  });

  it('when anonymous, then 401; when the user owns no studio, then 403', async () => {
    expect((await (await anonymousAgent(t.app)).get('/api/dev/mailbox')).status).toBe(401);
    const { members } = await makeStudio(t.db, ['partner', 'crew']);
    expect((await (await signIn(t.app, members.crew.email)).get('/api/dev/mailbox')).status).toBe(403);
    expect((await (await signIn(t.app, members.partner.email)).get('/api/dev/mailbox')).status).toBe(403);
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
