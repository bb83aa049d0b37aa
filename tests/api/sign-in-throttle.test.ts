import { defaultSignInLimits } from '../../server/auth/auth-router';
import { anonymousAgent, makeStudio, makeTestApp, testConfig, testPassword, uniqueEmail, type Agent, type TestApp } from '../helpers/test-app';

// X-Forwarded-For stands in for the caller's address, as it does behind the production proxy.
const behindProxy = () => testConfig({ TRUST_PROXY: '1' });

let t: TestApp;
beforeAll(() => {
  t = makeTestApp({ config: behindProxy(), signInLimits: defaultSignInLimits });
});
afterAll(() => t.close());

/** The XSRF token the agent holds now: a sign-in may hand out a new one. */
function currentXsrf(agent: Agent): string {
  const cookie = agent.jar.getCookie('XSRF-TOKEN', { domain: '127.0.0.1', path: '/', secure: false, script: false });
  return cookie ? decodeURIComponent(cookie.value) : agent.xsrf;
}

function tryFrom(agent: Agent, address: string, email: string, password: string) {
  return agent.post('/api/auth/login').set('X-Forwarded-For', address).set('X-XSRF-TOKEN', currentXsrf(agent)).send({ email, password });
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('sign-in throttling', () => {
  it('when 20 wrong passwords for an account come from other addresses, then its owner still signs in', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const stranger = await anonymousAgent(t.app);
    for (let i = 1; i <= 20; i += 1) {
      expect((await tryFrom(stranger, `203.0.113.${i}`, members.owner.email, 'guessed-wrong-again')).status).toBe(401);
    }
    const owner = await anonymousAgent(t.app);
    expect((await tryFrom(owner, '198.51.100.7', members.owner.email, testPassword)).status).toBe(200);
  });

  it('when a member signs in 50 times from one address, then none is refused', async () => {
    const { members } = await makeStudio(t.db, ['crew']);
    const agent = await anonymousAgent(t.app);
    const statuses = new Set<number>();
    for (let i = 0; i < 50; i += 1) statuses.add((await tryFrom(agent, '198.51.100.8', members.crew.email, testPassword)).status);
    expect([...statuses]).toEqual([200]);
  });

  it('when one address keeps failing on one account, then each try past five waits longer and only that address waits', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const email = members.owner.email;
    const guesser = await anonymousAgent(t.app);
    const address = '203.0.113.50';
    for (let i = 0; i < 5; i += 1) expect((await tryFrom(guesser, address, email, 'guessed-wrong-again')).status).toBe(401);
    const waits: string[] = [];
    for (const delayMs of [1000, 2000, 4000]) {
      const refused = await tryFrom(guesser, address, email, testPassword);
      expect(refused.status).toBe(429);
      expect(refused.body.error).toEqual({ code: 'rate_limited', message: expect.stringMatching(/^Too many wrong passwords for this account from your network; try again in \d+ seconds?$/) });
      waits.push(refused.headers['retry-after']);
      if (delayMs === 4000) break;
      await sleep(delayMs + 50);
      expect((await tryFrom(guesser, address, email, 'guessed-wrong-again')).status).toBe(401);
    }
    expect(waits).toEqual(['1', '2', '4']);
    // Meanwhile the owner, elsewhere, is not held up.
    expect((await tryFrom(await anonymousAgent(t.app), '198.51.100.9', email, testPassword)).status).toBe(200);
  }, 20_000);

  it('when the wait is over and the right password comes, then that address starts afresh', async () => {
    const { members } = await makeStudio(t.db, ['owner']);
    const agent = await anonymousAgent(t.app);
    const address = '203.0.113.60';
    for (let i = 0; i < 5; i += 1) await tryFrom(agent, address, members.owner.email, 'guessed-wrong-again');
    await sleep(1050);
    expect((await tryFrom(agent, address, members.owner.email, testPassword)).status).toBe(200);
    for (let i = 0; i < 4; i += 1) expect((await tryFrom(agent, address, members.owner.email, 'guessed-wrong-again')).status).toBe(401);
  }, 10_000);
});

describe('sign-in throttling per address', () => {
  let crowded: TestApp;
  beforeAll(() => {
    crowded = makeTestApp({ config: behindProxy(), signInLimits: { perAccount: 5, perAddress: 3, windowMs: 60_000 } });
  });
  afterAll(() => crowded.close());

  const timed = async (request: PromiseLike<{ status: number }>) => {
    const started = Date.now();
    const { status } = await request;
    return { status, ms: Date.now() - started };
  };

  it('when one address fails on many accounts, then its further tries go one a second, a right password still signs in, and a regular there is not held', async () => {
    const address = '203.0.113.70';
    const { members } = await makeStudio(crowded.db, ['owner', 'partner']);
    const agent = await anonymousAgent(crowded.app);
    expect((await tryFrom(agent, address, members.partner.email, testPassword)).status).toBe(200);
    for (let i = 0; i < 3; i += 1) expect((await tryFrom(agent, address, uniqueEmail('sprayed'), 'Spring-2031')).status).toBe(401);

    const [first, second] = await Promise.all([
      timed(tryFrom(agent, address, uniqueEmail('sprayed'), 'Spring-2031')),
      timed(tryFrom(agent, address, members.owner.email, testPassword)),
    ]);
    expect(first.status).toBe(401);
    expect(second).toEqual({ status: 200, ms: expect.any(Number) });
    expect(Math.max(first.ms, second.ms)).toBeGreaterThanOrEqual(900);

    const regular = await timed(tryFrom(agent, address, members.partner.email, testPassword));
    expect(regular.status).toBe(200);
    expect(regular.ms).toBeLessThan(900);
  }, 15_000);
});
