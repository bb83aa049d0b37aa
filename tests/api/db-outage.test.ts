import request from 'supertest';
import { relay } from '../helpers/db-relay';
import { makeStudio, makeTestApp, signIn, testConfig, type Agent } from '../helpers/test-app';
import { addMarket } from './feeds-fixtures';

// The database taken away under load and brought back: a TCP relay in front of the real MariaDB
// drops every connection and refuses new ones, as a stopped server does from the app's side (the
// shared test database itself keeps serving the other test files meanwhile).
describe('the database away under load', () => {
  it('when the database goes away while 20 clients read, then every answer is a 503 db_unavailable, nothing rejects unhandled, and within 5 s of its return all succeed again', async () => {
    const base = testConfig();
    const proxy = relay(base.DB_PORT);
    const port = await proxy.listen();
    const t = makeTestApp({ config: testConfig({ DB_PORT: String(port) }), signInLimits: { perAccount: 100, perAddress: 100_000, windowMs: 60_000 } });
    const unhandled: unknown[] = [];
    const onUnhandled = (reason: unknown) => unhandled.push(reason);
    process.on('unhandledRejection', onUnhandled);
    try {
      const { studioId, members } = await makeStudio(t.db);
      await addMarket(t.db, studioId, { name: 'Hollow lane market', start: '2026-01-03', rrule: 'FREQ=WEEKLY;BYDAY=SA' });
      const owner = await signIn(t.app, members.owner.email);
      const feed = await owner.post(`/api/studios/${studioId}/feeds`).send({ scope: 'all' });
      expect(feed.status).toBe(201);
      const feedPath = new URL(feed.body.url).pathname;
      const agents: Agent[] = [owner, await signIn(t.app, members.partner.email), await signIn(t.app, members.crew.email)];
      const paths = [`/api/studios/${studioId}/events?from=2027-03-01&to=2027-03-31`, `/api/studios/${studioId}/summary`, '/api/auth/me', `/api/studios/${studioId}/markets`, feedPath, '/api/health'];

      let phase: 'up' | 'down' | 'back' = 'up';
      const answers: { phase: string; status: number; code?: string; path: string }[] = [];
      const client = async (index: number) => {
        for (let round = 0; phase !== 'back' || round < 1; round++) {
          const path = paths[(index + round) % paths.length];
          const seen = phase;
          const response = path.startsWith('/feeds/') ? await request(t.app).get(path) : await agents[index % agents.length].get(path);
          answers.push({ phase: seen, status: response.status, code: response.body?.error?.code, path });
          if (seen === 'back') break;
        }
      };
      const load = Promise.all(Array.from({ length: 20 }, (_, index) => client(index)));
      await new Promise((resolve) => setTimeout(resolve, 300));
      await proxy.close();
      phase = 'down';
      const downFrom = answers.length;
      await new Promise((resolve) => setTimeout(resolve, 1500));
      const back = relay(base.DB_PORT);
      await back.listen(port);
      const returned = Date.now();
      phase = 'back';
      await load;

      // Answers asked while it was away (those already on their way when it went may still succeed).
      const duringOutage = answers.slice(downFrom).filter((answer) => answer.phase === 'down');
      expect(duringOutage.length).toBeGreaterThan(20);
      const wrong = duringOutage.filter((answer) => !(answer.status === 503 && answer.code === 'db_unavailable') && answer.status !== 200);
      expect(wrong).toEqual([]);
      expect(duringOutage.filter((answer) => answer.status === 503).length).toBeGreaterThan(20);
      expect(answers.filter((answer) => answer.status >= 500 && answer.status !== 503)).toEqual([]);

      // Back: every path succeeds again within 5 s, with no restart.
      for (const path of paths) {
        let status = 0;
        while (Date.now() - returned < 5000) {
          status = (path.startsWith('/feeds/') ? await request(t.app).get(path) : await owner.get(path)).status;
          if (status === 200) break;
          await new Promise((resolve) => setTimeout(resolve, 100));
        }
        expect([path, status]).toEqual([path, 200]);
      }
      expect(Date.now() - returned).toBeLessThan(5000);
      expect(unhandled).toEqual([]);
      await back.close();
    } finally {
      process.off('unhandledRejection', onUnhandled);
      await t.close();
    }
  }, 60_000);
});
