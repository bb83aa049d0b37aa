import request from 'supertest';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testPassword, uniqueEmail, type TestApp } from '../helpers/test-app';
import { appClock } from '../../server/clock/clock';
import { signupAnswerMessage } from '@shared/contracts/auth';

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
    expect(response.status).toBe(202);
    expect(response.body).toEqual({ message: signupAnswerMessage });
    const stored = await t.db('users').where({ email }).first();
    expect(stored.password_hash).toMatch(/^\$argon2id\$/);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toEqual({ id: stored.id, email, name: 'Ada Maker' });
    expect(me.body.studios).toEqual([{ id: expect.any(Number), name: 'Pine Row Works', role: 'owner', ...newYorkToday() }]);
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

  it('when the address already has an account, then the answer is the one a new address gets and nothing is made or changed', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const before = await t.db('users').where({ email: members.owner.email }).first();
    const [knownStudio, freshStudio] = [uniqueEmail('bench'), uniqueEmail('bench')];
    const known = await (await anonymousAgent(t.app))
      .post('/api/auth/signup')
      .send({ name: 'Brisk Imposter', email: members.owner.email.toUpperCase(), password: 'long-enough-pass', studioName: knownStudio });
    const fresh = await (await anonymousAgent(t.app))
      .post('/api/auth/signup')
      .send({ name: 'Brisk Newcomer', email: uniqueEmail('fresh'), password: 'long-enough-pass', studioName: freshStudio });
    expect([known.status, known.body]).toEqual([fresh.status, fresh.body]);
    const headerNames = (headers: Record<string, unknown>) => Object.keys(headers).filter((name) => name !== 'set-cookie').sort();
    expect(headerNames(known.headers)).toEqual(headerNames(fresh.headers));
    expect(await t.db('users').where({ email: members.owner.email }).first()).toEqual(before);
    expect(await t.db('studios').where({ name: knownStudio }).first()).toBeUndefined();
    expect(await t.db('studios').where({ name: freshStudio }).first()).toBeDefined();
    expect(await t.db('memberships').where({ user_id: members.owner.id }).pluck('role')).toEqual(['owner']);
  });

  it.each([
    ['1234567890', 'This is a frequently used password.'],
    ['          ', 'Repeated characters like "aaa" are easy to guess.'],
    ['password12', 'This is a commonly used password.'],
  ])('when the password is %j, then 400 names the password field with the estimator\'s reason and nothing is stored', async (password, reason) => {
    const agent = await anonymousAgent(t.app);
    const email = uniqueEmail('weak');
    const response = await agent.post('/api/auth/signup').send({ name: 'Tamsel Orrin', email, password, studioName: 'Wickerby' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('weak_password');
    expect(response.body.error.issues).toEqual([{ path: ['password'], message: expect.stringContaining(reason) }]);
    expect(response.body.error.issues[0].message).toMatch(/^This password is too easy to guess\./);
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
  });

  it('when the password is made of the studio name, then 400 says it holds personal data', async () => {
    const agent = await anonymousAgent(t.app);
    const email = uniqueEmail('personal');
    const body = { name: 'Tamsel Orrin', email, password: 'brackenloftjoinery', studioName: 'Brackenloft Joinery' };
    const response = await agent.post('/api/auth/signup').send(body);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0]).toEqual({ path: ['password'], message: expect.stringContaining('personal or page related data') });
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
  });

  it.each([
    ['name', 'a NUL', '"Tamsel\\u0000Orrin"', 'Name contains a control or text-direction character'],
    ['name', 'a right-to-left override', '"Tamsel\\u202eOrrin"', 'Name contains a control or text-direction character'],
    ['studioName', 'a lone surrogate', '"Wicker\\ud800by"', 'Studio name contains a broken character (half of a surrogate pair)'],
    ['studioName', 'a left-to-right isolate', '"Wicker\\u2066by"', 'Studio name contains a control or text-direction character'],
  ])('when %s has %s, then 400 names the field and nothing is stored', async (field, _what, json, message) => {
    const agent = await anonymousAgent(t.app);
    const email = uniqueEmail('unsafe');
    const fields: Record<string, string> = { name: '"Tamsel Orrin"', email: JSON.stringify(email), password: '"long-enough-pass"', studioName: '"Wickerby"', [field]: json };
    const raw = `{${Object.entries(fields).map(([key, value]) => `"${key}":${value}`).join(',')}}`;
    const response = await agent.post('/api/auth/signup').set('Content-Type', 'application/json').send(raw);
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: [field], message }]);
    expect(await t.db('users').where({ email }).first()).toBeUndefined();
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

describe("a new studio's place at sign-up", () => {
  it('when the sign-up gives a time zone, country and region, then the studio keeps them; a zone or region that does not exist is a 400 naming it', async () => {
    const email = uniqueEmail('placed');
    const agent = await anonymousAgent(t.app);
    const body = { name: 'Ada Maker', email, password: 'lantern-kiln-maple-ridge', studioName: 'Harbour Row Works', timezone: 'Europe/London', country: 'GB', region: 'SCT' };
    expect((await agent.post('/api/auth/signup').send(body)).status).toBe(202);
    const studio = await t.db('studios as s').join('memberships as m', 'm.studio_id', 's.id').join('users as u', 'u.id', 'm.user_id').where('u.email', email).first('s.timezone', 's.country', 's.region');
    expect(studio).toEqual({ timezone: 'Europe/London', country: 'GB', region: 'SCT' });
    const wrongZone = await (await anonymousAgent(t.app)).post('/api/auth/signup').send({ ...body, email: uniqueEmail('zone'), timezone: 'Europe/Atlantis' });
    expect([wrongZone.status, wrongZone.body.error.issues[0].path]).toEqual([400, ['timezone']]);
    const wrongRegion = await (await anonymousAgent(t.app)).post('/api/auth/signup').send({ ...body, email: uniqueEmail('region'), region: 'ZZZ' });
    expect([wrongRegion.status, wrongRegion.body.error.issues[0].path]).toEqual([400, ['region']]);
  });
});
