import request from 'supertest';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testPassword, uniqueEmail, type TestApp } from '../helpers/test-app';
import { appClock } from '../../server/clock/clock';

/** A new studio's zone (the default) and its today by the app's clock. */
const newYorkToday = () => ({ timezone: 'America/New_York', today: appClock.today('America/New_York') });

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('sign-up', () => {
  it('when the form is valid, then it makes a user and a studio they own and signs them in', async () => {
    const agent = await anonymousAgent(t.app);
    const email = uniqueEmail('signup');
    const response = await agent
      .post('/api/auth/signup')
      .send({ name: 'Ada Maker', email: email.toUpperCase(), password: 'long-enough-pass', studioName: 'Pine Row Works' });
    expect(response.status).toBe(201);
    expect(response.body.user).toEqual({ id: expect.any(Number), email, name: 'Ada Maker' });
    expect(response.body.studios).toEqual([{ id: expect.any(Number), name: 'Pine Row Works', role: 'owner', ...newYorkToday() }]);
    const stored = await t.db('users').where({ email }).first();
    expect(stored.password_hash).toMatch(/^\$argon2id\$/);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
  });

  it('when the password is under 10 characters, then 400 names the password field and nothing is stored', async () => {
    const agent = await anonymousAgent(t.app);
    const email = uniqueEmail('short');
    const response = await agent.post('/api/auth/signup').send({ name: 'A', email, password: 'short', studioName: 'S' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_input');
    expect(response.body.error.issues).toEqual([{ path: ['password'], message: 'Password must be at least 10 characters' }]);
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
  });

  it('when the e-mail is taken, then 409 says so on the e-mail field', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const response = await agent
      .post('/api/auth/signup')
      .send({ name: 'B', email: members.owner.email, password: 'long-enough-pass', studioName: 'S' });
    expect(response.status).toBe(409);
    expect(response.body.error.issues[0].path).toEqual(['email']);
  });

  it('when fields are missing or over-long, then 400 lists each one', async () => {
    const agent = await anonymousAgent(t.app);
    const response = await agent
      .post('/api/auth/signup')
      .send({ name: 'x'.repeat(121), email: 'not-an-email', password: 'long-enough-pass' });
    expect(response.status).toBe(400);
    const paths = response.body.error.issues.map((issue: { path: string[] }) => issue.path[0]).sort();
    expect(paths).toEqual(['email', 'name', 'studioName']);
  });

  it('when the body is malformed JSON, then 400 says so', async () => {
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/signup').set('Content-Type', 'application/json').send('{"name": ');
    expect(response.status).toBe(400);
    expect(response.body.error).toEqual({ code: 'malformed_json', message: 'The request body is not valid JSON' });
  });

  it('when the body is larger than the limit, then 413', async () => {
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/signup').send({ name: 'x'.repeat(300_000) });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('too_large');
  });
});

describe('sign-in', () => {
  it('when the password is right, then the session cookie is httpOnly and SameSite=Lax and me answers', async () => {
    const { members, studioId } = await makeStudio(t.db, ['partner']);
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/login').send({ email: members.partner.email, password: testPassword });
    expect(response.status).toBe(200);
    const cookie = ([] as string[]).concat(response.headers['set-cookie']).find((c) => c.startsWith('kerfcast.sid='))!;
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(response.body.studios).toEqual([{ id: studioId, name: 'Test studio', role: 'partner', ...newYorkToday() }]);
  });

  it('when signing in again, then a new session id is issued (no fixation)', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const sidOf = (response: { headers: Record<string, unknown> }) =>
      ([] as string[]).concat((response.headers['set-cookie'] as string[]) ?? []).find((c) => c.startsWith('kerfcast.sid='))?.split(';')[0];
    const first = sidOf(await agent.post('/api/auth/login').send({ email: members.owner.email, password: testPassword }));
    const second = sidOf(await agent.post('/api/auth/login').send({ email: members.owner.email, password: testPassword }));
    expect(first).toBeDefined();
    expect(second).toBeDefined();
    expect(second).not.toBe(first);
  });

  it('when the password is wrong, then 401 with the error shape', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/login').send({ email: members.owner.email, password: 'wrong-password' });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('bad_credentials');
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('when the e-mail is unknown, then the same 401 as a wrong password', async () => {
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/login').send({ email: uniqueEmail('ghost'), password: 'whatever-pass' });
    expect(response.status).toBe(401);
    expect(response.body.error.message).toBe('Wrong e-mail or password');
  });

  it('when one account is tried too often, then 429 even from a fresh client', async () => {
    const limited = makeTestApp({ signInLimits: { perAccount: 3, perAddress: 100, windowMs: 60_000 } });
    try {
      const { members } = await makeStudio(limited.db, ['owner']);
      for (let i = 0; i < 3; i += 1) {
        const agent = await anonymousAgent(limited.app);
        expect((await agent.post('/api/auth/login').send({ email: members.owner.email, password: 'wrong-password' })).status).toBe(401);
      }
      const agent = await anonymousAgent(limited.app);
      const response = await agent.post('/api/auth/login').send({ email: members.owner.email, password: testPassword });
      expect(response.status).toBe(429);
      expect(response.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });

  it('when one address tries too many accounts, then 429', async () => {
    const limited = makeTestApp({ signInLimits: { perAccount: 100, perAddress: 2, windowMs: 60_000 } });
    try {
      const agent = await anonymousAgent(limited.app);
      await agent.post('/api/auth/login').send({ email: uniqueEmail('a'), password: 'wrong-password' });
      await agent.post('/api/auth/login').send({ email: uniqueEmail('b'), password: 'wrong-password' });
      const response = await agent.post('/api/auth/login').send({ email: uniqueEmail('c'), password: 'wrong-password' });
      expect(response.status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

describe('sessions and CSRF', () => {
  it('when signed out, then me is 401 and still hands out an XSRF-TOKEN cookie', async () => {
    const response = await request(t.app).get('/api/auth/me');
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
    expect(String(response.headers['set-cookie'])).toMatch(/XSRF-TOKEN=/);
  });

  it('when a write has no X-XSRF-TOKEN header, then 403', async () => {
    const response = await request(t.app).post('/api/auth/login').send({ email: 'a@b.test', password: 'x' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('csrf');
  });

  it('when the header does not match the cookie, then 403', async () => {
    const agent = await anonymousAgent(t.app);
    const response = await agent.post('/api/auth/logout').set('X-XSRF-TOKEN', 'not-the-token');
    expect(response.status).toBe(403);
  });

  it('when signed out, then the session is destroyed', async () => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await signIn(t.app, members.crew.email);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('when the server restarts, then the session survives (it lives in MariaDB)', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await signIn(t.app, members.owner.email);
    const cookies = await new Promise<string>((resolve) => {
      resolve(agent.jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).toValueString());
    });
    const restarted = makeTestApp();
    try {
      const response = await request(restarted.app).get('/api/auth/me').set('Cookie', cookies);
      expect(response.status).toBe(200);
      expect(response.body.user.email).toBe(members.owner.email);
    } finally {
      await restarted.close();
    }
  });
});
