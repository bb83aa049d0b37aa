import request from 'supertest';
import { relay } from '../helpers/db-relay';
import { makeStudio, makeTestApp, signIn, testConfig } from '../helpers/test-app';

describe('GET /api/health', () => {
  it('when the database answers, then ok/up', async () => {
    const t = makeTestApp();
    try {
      const response = await request(t.app).get('/api/health');
      expect(response.status).toBe(200);
      expect(response.body).toEqual({ status: 'ok', db: 'up' });
    } finally {
      await t.close();
    }
  });

  it('when the database goes away, then 503 db down, and when it returns, then up again', async () => {
    const base = testConfig();
    const proxy = relay(base.DB_PORT);
    const port = await proxy.listen();
    const t = makeTestApp({ config: testConfig({ DB_PORT: String(port) }) });
    try {
      expect((await request(t.app).get('/api/health')).body.db).toBe('up');
      await proxy.close();
      const down = await request(t.app).get('/api/health');
      expect(down.status).toBe(503);
      expect(down.body).toEqual({ status: 'degraded', db: 'down', error: { code: 'db_unavailable', message: 'The database cannot be reached just now' } });
      const back = relay(base.DB_PORT);
      await back.listen(port);
      let recovered = await request(t.app).get('/api/health');
      for (let i = 0; i < 20 && recovered.status !== 200; i += 1) recovered = await request(t.app).get('/api/health');
      expect(recovered.status).toBe(200);
      expect(recovered.body.db).toBe('up');
      await back.close();
    } finally {
      await t.close();
    }
  }, 30_000);
});

describe('a signed-in request while the database is away', () => {
  it('when the session cannot be touched, then the request fails cleanly and the process keeps serving', async () => {
    const base = testConfig();
    const proxy = relay(base.DB_PORT);
    const port = await proxy.listen();
    const t = makeTestApp({ config: testConfig({ DB_PORT: String(port) }) });
    try {
      const { members } = await makeStudio(t.db, ['owner']);
      const agent = await signIn(t.app, members.owner.email);
      await proxy.close();
      const response = await agent.get('/api/health');
      expect(response.status).toBe(503);
      // Give a stray rejection (if any) a chance to surface before the database returns.
      await new Promise((resolve) => setTimeout(resolve, 200));
      const back = relay(base.DB_PORT);
      await back.listen(port);
      let me = await agent.get('/api/auth/me');
      for (let i = 0; i < 20 && me.status !== 200; i += 1) me = await agent.get('/api/auth/me');
      expect(me.status).toBe(200);
      await back.close();
    } finally {
      await t.close();
    }
  }, 30_000);
});

describe('unknown API routes', () => {
  it('when a route does not exist, then 404 in the error shape', async () => {
    const t = makeTestApp();
    try {
      const response = await request(t.app).get('/api/nothing-here');
      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe('not_found');
    } finally {
      await t.close();
    }
  });
});
