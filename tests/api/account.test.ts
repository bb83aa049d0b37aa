import request from 'supertest';
import { hashToken } from '../../server/account/tokens';
import { verifyPassword } from '../../server/auth/passwords';
import { anonymousAgent, makeStudio, signIn, uniqueEmail } from '../helpers/test-app';
import { linkToken, mailCount, makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';
import { appClock } from '../../server/clock/clock';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

const newPassword = 'a-brand-new-password';

describe('password reset', () => {
  it('when a known address asks, then 202 and a mail whose link sets the password once and ends other sessions', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const email = members.owner.email;
    const otherDevice = await signIn(t.app, email);
    expect((await otherDevice.get('/api/auth/me')).status).toBe(200);

    const agent = await anonymousAgent(t.app);
    const asked = await agent.post('/api/auth/password-reset').send({ email: email.toUpperCase() });
    expect(asked.status).toBe(202);
    const mail = await waitForMail(t.db, email, /Reset your Kerfcast password/);
    expect(mail.to).toBe(email);
    expect(mail.text).toContain('http://app.example.test/reset-password/');
    expect(mail.html).toContain('href="http://app.example.test/reset-password/');
    const token = linkToken(mail, '/reset-password');
    const stored = await t.db('password_resets').where({ user_id: members.owner.id }).first();
    expect(stored.token_hash).toBe(hashToken(token));
    const minutes = (new Date(stored.expires_at).getTime() - appClock.now().getTime()) / 60_000;
    expect(minutes).toBeGreaterThan(59);
    expect(minutes).toBeLessThanOrEqual(60);

    const short = await agent.post(`/api/auth/password-reset/${token}`).send({ password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.issues[0].path).toEqual(['password']);
    expect((await agent.post(`/api/auth/password-reset/${token}`).send({ password: newPassword })).status).toBe(204);
    const user = await t.db('users').where({ id: members.owner.id }).first();
    expect(await verifyPassword(user.password_hash, newPassword)).toBe(true);
    expect((await otherDevice.get('/api/auth/me')).status).toBe(401);
    await signIn(t.app, email, newPassword);

    const again = await agent.post(`/api/auth/password-reset/${token}`).send({ password: 'yet-another-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('reset_used');
  });

  it('when an unknown address asks, then the same 202 answer and no mail', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const known = await agent.post('/api/auth/password-reset').send({ email: members.owner.email });
    const unknownEmail = uniqueEmail('nobody');
    const unknown = await agent.post('/api/auth/password-reset').send({ email: unknownEmail });
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await waitForMail(t.db, members.owner.email);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(await mailCount(t.db, unknownEmail)).toBe(0);
  });

  it('when the link is older than an hour, then 410 and the password stays', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    await agent.post('/api/auth/password-reset').send({ email: members.owner.email });
    const token = linkToken(await waitForMail(t.db, members.owner.email), '/reset-password');
    await t.db('password_resets').where({ user_id: members.owner.id }).update({ expires_at: new Date(appClock.now().getTime() - 1000) });
    const response = await agent.post(`/api/auth/password-reset/${token}`).send({ password: newPassword });
    expect(response.status).toBe(410);
    expect(response.body.error.code).toBe('reset_expired');
    await signIn(t.app, members.owner.email);
  });

  it('when the token is unknown, then 404; when the address is malformed, then 400 names email', async () => {
    const agent = await anonymousAgent(t.app);
    expect((await agent.post('/api/auth/password-reset/not-a-token').send({ password: newPassword })).status).toBe(404);
    const bad = await agent.post('/api/auth/password-reset').send({ email: 'nope' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toEqual(['email']);
  });

  it.each([
    ['1234567890', 'This is a frequently used password.'],
    ['crewperson2031', 'There should not be any personal or page related data.'],
  ])('when the new password is %j, then 400 names the password field, the password stays and the link still works', async (weak, reason) => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await anonymousAgent(t.app);
    await agent.post('/api/auth/password-reset').send({ email: members.crew.email });
    const token = linkToken(await waitForMail(t.db, members.crew.email), '/reset-password');
    const before = (await t.db('users').where({ id: members.crew.id }).first()).password_hash;
    const response = await agent.post(`/api/auth/password-reset/${token}`).send({ password: weak });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('weak_password');
    expect(response.body.error.issues).toEqual([{ path: ['password'], message: expect.stringContaining(reason) }]);
    expect((await t.db('users').where({ id: members.crew.id }).first()).password_hash).toBe(before);
    expect((await agent.post(`/api/auth/password-reset/${token}`).send({ password: newPassword })).status).toBe(204);
  });

  it('when one address asks over and over, then it is rate-limited with 429', async () => {
    const email = uniqueEmail('flood');
    const agent = await anonymousAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 4; i += 1) statuses.push((await agent.post('/api/auth/password-reset').send({ email })).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
  });

  it('when the request has no CSRF header, then 403', async () => {
    expect((await request(t.app).post('/api/auth/password-reset').send({ email: uniqueEmail('x') })).status).toBe(403);
  });
});

describe('profile', () => {
  it('when a user turns the weekly agenda off and renames themselves, then both are stored', async () => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await signIn(t.app, members.crew.email);
    expect((await agent.get('/api/account/profile')).body).toEqual({ id: members.crew.id, name: 'crew person', email: members.crew.email, weeklyAgenda: true });
    const response = await agent.patch('/api/account/profile').send({ weeklyAgenda: false, name: '  Sam Birch  ' });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ name: 'Sam Birch', weeklyAgenda: false });
    expect(await t.db('users').where({ id: members.crew.id }).first('name', 'weekly_agenda')).toEqual({ name: 'Sam Birch', weekly_agenda: false });
    expect((await agent.get('/api/auth/me')).body.user.name).toBe('Sam Birch');
  });

  it.each([
    ['a NUL', 'Sam\u0000Birch', 'Name contains a control or text-direction character'],
    ['a pop-directional-isolate', 'Sam\u2069Birch', 'Name contains a control or text-direction character'],
  ])('when the new name has %s, then 400 names the name field and the name stays', async (_what, name, message) => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await signIn(t.app, members.crew.email);
    const response = await agent.patch('/api/account/profile').send({ name });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: ['name'], message }]);
    expect((await t.db('users').where({ id: members.crew.id }).first()).name).toBe('crew person');
  });

  it('when the patch is bad, then 400 names the field', async () => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await signIn(t.app, members.crew.email);
    const response = await agent.patch('/api/account/profile').send({ weeklyAgenda: 'sometimes' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(['weeklyAgenda']);
  });

  it('when anonymous, then 401 (each user reaches only their own profile, so there is no 403 or 404 case)', async () => {
    const agent = await anonymousAgent(t.app);
    expect((await agent.get('/api/account/profile')).status).toBe(401);
    expect((await agent.patch('/api/account/profile').send({ weeklyAgenda: false })).status).toBe(401);
  });
});
