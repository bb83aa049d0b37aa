import { anonymousAgent, makeStudio, uniqueEmail } from '../helpers/test-app';
import { mailCount, makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

const signUp = async (email: string, name = 'Brisk Imposter', studioName = 'Visit crooked-link.example.test now') =>
  (await anonymousAgent(t.app)).post('/api/auth/signup').send({ name, email, password: 'long-enough-pass', studioName });

describe('sign-up with an address that has an account', () => {
  it('when someone signs up with a known address, then its owner is told how to sign in, in a mail with nothing they typed', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    expect((await signUp(members.owner.email)).status).toBe(202);
    const mail = await waitForMail(t.db, members.owner.email, /tried to sign up/);
    expect(mail.subject).toBe('Someone tried to sign up to Kerfcast with your address');
    expect(mail.text).toContain(`with ${members.owner.email}, which already has an account. Nothing was changed.`);
    expect(mail.text).toContain('Sign in: http://app.example.test/sign-in');
    expect(mail.text).toContain('Reset your password: http://app.example.test/forgot-password');
    expect(mail.html).toContain('href="http://app.example.test/forgot-password"');
    for (const part of [mail.text, mail.html]) {
      expect(part).not.toContain('Brisk Imposter');
      expect(part).not.toContain('crooked-link');
    }
  });

  it('when the same known address is tried again within the hour, then no second mail goes', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    await signUp(members.owner.email);
    await waitForMail(t.db, members.owner.email, /tried to sign up/);
    expect((await signUp(members.owner.email)).status).toBe(202);
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await mailCount(t.db, members.owner.email)).toBe(1);
  });

  it('when a new address signs up, then no such mail goes to it', async () => {
    const email = uniqueEmail('newcomer');
    expect((await signUp(email, 'Tamsel Orrin', 'Wickerby')).status).toBe(202);
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await mailCount(t.db, email)).toBe(0);
  });
});
