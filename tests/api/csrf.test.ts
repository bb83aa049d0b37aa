import request from 'supertest';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testPassword, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp({ signInLimits: { perAccount: 100, perAddress: 100_000, windowMs: 60_000 } });
});
afterAll(() => t.close());

const tokenIn = (response: request.Response) =>
  decodeURIComponent(([] as string[]).concat(response.headers['set-cookie'] ?? []).map((cookie) => /^XSRF-TOKEN=([^;]+)/.exec(cookie)?.[1]).find(Boolean) ?? '');
const sessionIn = (response: request.Response) => ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith('kerfcast.sid='))!.split(';')[0];

describe('the XSRF token is bound to the session', () => {
  it('when a signed-in write carries a cookie and header pair the server did not sign for this session, then 403', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const login = await request(t.app).post('/api/auth/login').set('Cookie', 'XSRF-TOKEN=planted.pair').set('X-XSRF-TOKEN', 'planted.pair').send({ email: members.owner.email, password: testPassword });
    expect(login.status).toBe(403);
    const owner = await signIn(t.app, members.owner.email);
    const session = (await owner.get('/api/auth/me')).request.cookies;
    const planted = 'bm9uY2Uxb2Z0aGVhdHRhY2tlcg.c2lnbmF0dXJlb2Z0aGVhdHRhY2tlcjEyMzQ1Njc4OTA';
    const write = await request(t.app).post(`/api/studios/${studioId}/themes`).set('Cookie', `${session.split(';').filter((part) => part.trim().startsWith('kerfcast.sid=')).join(';')}; XSRF-TOKEN=${planted}`).set('X-XSRF-TOKEN', planted).send({ name: 'Planted' });
    expect(write.status).toBe(403);
    expect(write.body.error.code).toBe('csrf');
  });

  it("when one member's valid token is replayed with another member's session, then 403", async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const owner = await signIn(t.app, members.owner.email);
    const ownerSession = ((await owner.get('/api/auth/me')).request.cookies as string).split(';').find((part) => part.trim().startsWith('kerfcast.sid='))!.trim();
    const replayed = await request(t.app).post(`/api/studios/${studioId}/themes`).set('Cookie', `${ownerSession}; XSRF-TOKEN=${encodeURIComponent(partner.xsrf)}`).set('X-XSRF-TOKEN', partner.xsrf).send({ name: 'Replayed' });
    expect(replayed.status).toBe(403);
    expect((await owner.post(`/api/studios/${studioId}/themes`).send({ name: 'Own token' })).status).toBe(201);
  });

  it('when a member signs in and out, then each answer hands out a new token, and the one before no longer writes', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const anonymous = agent.xsrf;
    const login = await agent.post('/api/auth/login').send({ email: members.owner.email, password: testPassword });
    expect(login.status).toBe(200);
    const signedIn = tokenIn(login);
    expect(signedIn).not.toBe('');
    expect(signedIn).not.toBe(anonymous);
    const session = sessionIn(login);
    const stale = await request(t.app).post('/api/auth/logout').set('Cookie', `${session}; XSRF-TOKEN=${encodeURIComponent(anonymous)}`).set('X-XSRF-TOKEN', anonymous);
    expect(stale.status).toBe(403);
    const logout = await agent.post('/api/auth/logout');
    expect(logout.status).toBeLessThan(300);
    expect(tokenIn(logout)).not.toBe('');
    expect(tokenIn(logout)).not.toBe(signedIn);
  });
});
