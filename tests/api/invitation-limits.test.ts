import { appClock, fixedClock, useClock } from '../../server/clock/clock';
import { makeStudio, signIn, uniqueEmail, type Agent } from '../helpers/test-app';
import { mailCount, makeMailTestApp, type MailTestApp } from '../helpers/mail';

let t: MailTestApp;
beforeAll(async () => {
  t = await makeMailTestApp();
});
afterAll(() => t.close());

const minute = 60_000;

async function ownerOfNewStudio() {
  const { studioId, members } = await makeStudio(t.db, ['owner']);
  return { studioId, owner: await signIn(t.app, members.owner.email) };
}

function invite(owner: Agent, studioId: number, email = uniqueEmail('invitee')) {
  return owner.post(`/api/studios/${studioId}/invitations`).send({ email, role: 'crew' });
}

/** Sends `count` invitations as if at `at` (the app's clock), and gives back their statuses. */
async function inviteAt(at: Date, owner: Agent, studioId: number, count: number): Promise<number[]> {
  const restore = useClock(fixedClock(at));
  try {
    const statuses: number[] = [];
    for (let i = 0; i < count; i += 1) statuses.push((await invite(owner, studioId)).status);
    return statuses;
  } finally {
    restore();
  }
}

describe('invitation limits', () => {
  it('when a studio has sent 10 invitations within the hour, then the 11th is 429 saying when, and nothing is stored or mailed', async () => {
    const { studioId, owner } = await ownerOfNewStudio();
    const start = appClock.now();
    expect(await inviteAt(start, owner, studioId, 10)).toEqual(Array(10).fill(201));
    const email = uniqueEmail('eleventh');
    const restore = useClock(fixedClock(new Date(start.getTime() + 20 * minute)));
    try {
      const refused = await invite(owner, studioId, email);
      expect(refused.status).toBe(429);
      expect(refused.headers['retry-after']).toBe(String(40 * 60));
      expect(refused.body.error).toEqual({
        code: 'rate_limited',
        message: 'This studio has sent 10 invitations in the last hour, the most it may; more may be sent in 40 minutes',
      });
    } finally {
      restore();
    }
    expect(await t.db('invitations').where({ studio_id: studioId, email }).first()).toBeUndefined();
    expect(await mailCount(t.db, email)).toBe(0);
    expect(await inviteAt(new Date(start.getTime() + 61 * minute), owner, studioId, 1)).toEqual([201]);
  });

  it('when a studio has sent 30 invitations within the day, then the 31st is 429 until the first is a day old', async () => {
    const { studioId, owner } = await ownerOfNewStudio();
    const start = appClock.now();
    for (const hour of [0, 2, 4]) {
      expect(await inviteAt(new Date(start.getTime() + hour * 60 * minute), owner, studioId, 10)).toEqual(Array(10).fill(201));
    }
    const sixHoursOn = new Date(start.getTime() + 6 * 60 * minute);
    const restore = useClock(fixedClock(sixHoursOn));
    try {
      const refused = await invite(owner, studioId);
      expect(refused.status).toBe(429);
      expect(refused.headers['retry-after']).toBe(String(18 * 3600));
      expect(refused.body.error.message).toBe('This studio has sent 30 invitations in the last day, the most it may; more may be sent in 18 hours');
    } finally {
      restore();
    }
    expect(await inviteAt(new Date(start.getTime() + 24 * 60 * minute + 1000), owner, studioId, 1)).toEqual([201]);
  });

  it('when invitations are revoked or sent again to one address, then they still count', async () => {
    const { studioId, owner } = await ownerOfNewStudio();
    const start = appClock.now();
    const restore = useClock(fixedClock(start));
    try {
      const same = uniqueEmail('again');
      for (let i = 0; i < 5; i += 1) expect((await invite(owner, studioId, same)).status).toBe(201);
      for (let i = 0; i < 5; i += 1) {
        const sent = await invite(owner, studioId);
        expect((await owner.delete(`/api/studios/${studioId}/invitations/${sent.body.id}`)).status).toBe(204);
      }
      expect((await owner.get(`/api/studios/${studioId}/invitations`)).body).toHaveLength(1);
      expect((await invite(owner, studioId)).status).toBe(429);
    } finally {
      restore();
    }
  });

  it('when another studio is at its limit, then this studio may still invite', async () => {
    const full = await ownerOfNewStudio();
    const start = appClock.now();
    await inviteAt(start, full.owner, full.studioId, 10);
    const other = await ownerOfNewStudio();
    expect(await inviteAt(start, other.owner, other.studioId, 1)).toEqual([201]);
  });
});
