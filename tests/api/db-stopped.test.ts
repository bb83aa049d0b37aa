import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { prepareDatabase } from '../helpers/global-setup';
import { makeStudio, makeTestApp, signIn, testConfig, type TestApp } from '../helpers/test-app';

// A MariaDB of this test's own (its own port and data under .db/), so stopping it under load leaves
// the database every other test file uses alone.
const PORT = process.env['OUTAGE_DB_PORT'] ?? '3337';
const DATABASE = 'kerfcast_outage';
const root = path.resolve(__dirname, '../..');
const dbEnv = { ...process.env, DB_PORT: PORT, DB_NAMES: DATABASE };
const db = (action: 'start' | 'stop') => promisify(execFile)(process.execPath, [path.join(root, 'scripts/db.mjs'), action], { env: dbEnv, cwd: root });

let t: TestApp;
beforeAll(async () => {
  // Started, with a fresh database each run, as the test projects' own are.
  await prepareDatabase(DATABASE, dbEnv);
  t = makeTestApp({ config: testConfig({ DB_PORT: PORT, DB_NAME: DATABASE }), signInLimits: { perAccount: 100, perAddress: 100_000, windowMs: 60_000 } });
}, 120_000);
afterAll(async () => {
  await t?.close();
  await db('stop');
}, 60_000);

describe('the database stopped under load and started again', () => {
  it('when MariaDB stops while 10 clients read, then each answer is a 200 or a 503 db_unavailable, nothing rejects unhandled, and within 5 s of its start all succeed again', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const paths = [`/api/studios/${studioId}/summary`, `/api/studios/${studioId}/events?from=2027-03-01&to=2027-03-31`, '/api/auth/me', '/api/health'];
    const unhandled: unknown[] = [];
    const onUnhandled = (reason: unknown) => unhandled.push(reason);
    process.on('unhandledRejection', onUnhandled);
    try {
      let isLoading = true;
      const answers: { status: number; code?: string }[] = [];
      const load = Promise.all(
        Array.from({ length: 10 }, async (_, index) => {
          for (let round = 0; isLoading; round++) {
            const response = await owner.get(paths[(index + round) % paths.length]);
            answers.push({ status: response.status, code: response.body?.error?.code });
          }
        }),
      );
      await new Promise((resolve) => setTimeout(resolve, 300));
      await db('stop');
      const whileDown = answers.length;
      await new Promise((resolve) => setTimeout(resolve, 1000));
      await db('start');
      const started = Date.now();
      let recovered = false;
      while (!recovered && Date.now() - started < 5000) {
        const statuses = await Promise.all(paths.map(async (path) => (await owner.get(path)).status));
        recovered = statuses.every((status) => status === 200);
        if (!recovered) await new Promise((resolve) => setTimeout(resolve, 100));
      }
      isLoading = false;
      await load;
      expect([recovered, Date.now() - started < 5000]).toEqual([true, true]);
      const outage = answers.slice(whileDown);
      expect(outage.filter((answer) => answer.status === 503 && answer.code === 'db_unavailable').length).toBeGreaterThan(10);
      expect(answers.filter((answer) => !(answer.status === 200 || (answer.status === 503 && answer.code === 'db_unavailable')))).toEqual([]);
      expect(unhandled).toEqual([]);
    } finally {
      process.off('unhandledRejection', onUnhandled);
    }
  }, 60_000);
});
