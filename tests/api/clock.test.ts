import { appClock, clockFromEnv, fixedClock, pinnedToday, runningFrom, systemClock, useClock } from '../../server/clock/clock';
import { loadConfig } from '../../server/config';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';

// Time-zone arithmetic below is hand-worked and checked against the ECMAScript Intl API (a
// general-purpose reference): Chicago keeps UTC−6 in early March 2027 (US daylight time starts on
// 14 March 2027, the second Sunday), Kiritimati is UTC+14 all year.
describe('the clock', () => {
  it('when nothing pins the date, then the clock is the real one', () => {
    expect(clockFromEnv({})).toBe(systemClock);
    expect(clockFromEnv({ KERFCAST_TODAY: ' ', KERFCAST_NOW: '' })).toBe(systemClock);
  });

  it('when KERFCAST_TODAY pins a date, then every studio is on that date, whatever its time zone, and the next after 24 hours', () => {
    let real = Date.parse('2026-12-09T08:00:00Z');
    const clock = pinnedToday('2027-03-06', () => real);
    expect(['America/Chicago', 'Pacific/Kiritimati', 'Pacific/Pago_Pago'].map((zone) => clock.today(zone))).toEqual(['2027-03-06', '2027-03-06', '2027-03-06']);
    expect(clock.now().toISOString()).toBe('2027-03-06T12:00:00.000Z');
    real += 23 * 3600_000;
    expect(clock.today('UTC')).toBe('2027-03-06');
    real += 3600_000;
    expect([clock.today('UTC'), clock.now().toISOString()]).toEqual(['2027-03-07', '2027-03-07T12:00:00.000Z']);
    expect(clockFromEnv({ KERFCAST_TODAY: '2027-03-06' }).today('Pacific/Kiritimati')).toBe('2027-03-06');
  });

  it('when KERFCAST_NOW pins an instant, then each studio has its own date at that instant, and time runs on', () => {
    const fromEnv = clockFromEnv({ KERFCAST_NOW: '2027-03-06T23:30:00-06:00', KERFCAST_TODAY: '2030-01-01' });
    expect([fromEnv.today('America/Chicago'), fromEnv.today('UTC'), fromEnv.today('Pacific/Kiritimati')]).toEqual(['2027-03-06', '2027-03-07', '2027-03-07']);
    const reference = (zone: string) => new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date('2027-03-07T05:30:00Z'));
    expect([reference('America/Chicago'), reference('UTC')]).toEqual(['2027-03-06', '2027-03-07']);
    let real = 1_000;
    const running = runningFrom(new Date('2027-03-06T23:30:00-06:00'), () => real);
    real += 31 * 60_000;
    expect([running.now().toISOString(), running.today('America/Chicago')]).toEqual(['2027-03-07T06:01:00.000Z', '2027-03-07']);
  });

  it('when a pin is malformed or the server runs in production, then start-up stops with a message naming the variable', () => {
    expect(() => clockFromEnv({ KERFCAST_TODAY: '2027-02-30' })).toThrow('KERFCAST_TODAY: "2027-02-30" is not a date written YYYY-MM-DD');
    expect(() => clockFromEnv({ KERFCAST_NOW: '2027-03-06T23:30:00' })).toThrow(/^KERFCAST_NOW: .* with its offset/);
    expect(() => clockFromEnv({ KERFCAST_TODAY: '2027-03-06', NODE_ENV: 'production' })).toThrow('KERFCAST_TODAY: pinning the date is for development and tests only; unset it in production');
    const production = { NODE_ENV: 'production', SESSION_SECRET: 'a-production-secret-of-our-own' };
    expect(() => loadConfig({ ...production, KERFCAST_NOW: '2027-03-06T12:00:00Z' })).toThrow('Invalid configuration:\n  KERFCAST_NOW: pinning the date is for development and tests only');
    expect(() => loadConfig(production)).not.toThrow();
    expect(() => loadConfig({ NODE_ENV: 'test', KERFCAST_TODAY: 'saturday' })).toThrow('Invalid configuration:\n  KERFCAST_TODAY: "saturday" is not a date');
  });

  it('when a clock is swapped in, then the process reads it until it is put back', () => {
    const restore = useClock(fixedClock('2027-03-06T12:00:00Z'));
    expect(appClock.today('UTC')).toBe('2027-03-06');
    restore();
    expect(appClock.today('UTC')).not.toBe('2027-03-06');
  });
});

describe('each studio has its today in the session', () => {
  let t: TestApp;
  beforeAll(() => {
    t = makeTestApp();
  });
  afterAll(() => t.close());

  it('when a member of studios in two time zones asks who they are at 23:30 in Chicago, then each studio carries its own today and zone', async () => {
    const restore = useClock(fixedClock('2027-03-06T23:30:00-06:00'));
    try {
      const chicago = await makeStudio(t.db, ['owner']);
      await t.db('studios').where({ id: chicago.studioId }).update({ timezone: 'America/Chicago' });
      const utc = await makeStudio(t.db, ['owner']);
      await t.db('studios').where({ id: utc.studioId }).update({ timezone: 'UTC' });
      await t.db('memberships').insert({ studio_id: utc.studioId, user_id: chicago.members.owner.id, role: 'crew' });
      const me = (await (await signIn(t.app, chicago.members.owner.email)).get('/api/auth/me')).body;
      const byId = new Map(me.studios.map((studio: { id: number }) => [studio.id, studio]));
      expect(byId.get(chicago.studioId)).toMatchObject({ timezone: 'America/Chicago', today: '2027-03-06', role: 'owner' });
      expect(byId.get(utc.studioId)).toMatchObject({ timezone: 'UTC', today: '2027-03-07', role: 'crew' });
    } finally {
      restore();
    }
  });
});
