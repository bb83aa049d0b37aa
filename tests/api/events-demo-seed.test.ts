import { addDays } from '@shared/calendar/dates';
import { DEFAULT_DECOR_TEMPLATE } from '@shared/planning/default-template';
import { demoRunwayName, demoRunwayUnderWayName, leavesWorkAtHand, seedDemoCalendar } from '../../db/seeds/demo-calendar';
import { demoStudioSettings } from '../../db/seeds/demo-studio';
import { appClock, fixedClock, useClock } from '../../server/clock/clock';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  // Many sign-ins from one address in one file; the limiter has its own tests.
  t = makeTestApp({ signInLimits: { perAccount: 10, perAddress: 100_000, windowMs: 60_000 } });
});
afterAll(() => t.close());

/** A studio with the demo's place and work week (Chicago, Monday to Saturday, 7 h a day). */
async function demoLikeStudio() {
  const studio = await makeStudio(t.db);
  await t.db('studios').where({ id: studio.studioId }).update(demoStudioSettings);
  return studio;
}

describe('demo calendar seed', () => {
  it('when run twice, then the studio has two recurring markets, one runway planned back from the fair and one under way', async () => {
    const { studioId, members } = await demoLikeStudio();
    await seedDemoCalendar(t.db, studioId);
    await seedDemoCalendar(t.db, studioId);
    const markets = await t.db('markets').where({ studio_id: studioId }).orderBy('id');
    expect(markets.map((market) => market.rrule)).toEqual(['FREQ=MONTHLY;BYDAY=2SA', 'FREQ=YEARLY;BYMONTH=10;BYDAY=1SA']);
    expect(JSON.parse(markets[0].exdates)).toEqual(['2027-01-09']);
    expect(markets[1].application_deadline).toBe('2027-06-15');
    const runways = await t.db('runways').where({ studio_id: studioId }).orderBy('id');
    expect(runways.map((runway) => runway.name)).toEqual([demoRunwayName, demoRunwayUnderWayName]);
    expect(runways[0]).toMatchObject({ name: demoRunwayName, anchor_kind: 'market', offset_days: 14 });
    // The fair's next day is a first Saturday of October (days 1 to 7); the launch two weeks before it.
    const owner = await signIn(t.app, members.owner.email);
    const fair = (await owner.get(`/api/studios/${studioId}/markets/${markets[1].id}`)).body;
    expect(fair.nextDates[0]).toMatch(/^\d{4}-10-0[1-7]$/);
    expect(runways[0].anchor_date).toBe(fair.nextDates[0]);
    expect(runways[0].launch).toBe(addDays(fair.nextDates[0], -14));
    const steps = await t.db('events').where({ runway_id: runways[0].id }).orderBy('step_index');
    expect(steps.map((step) => step.title)).toEqual(DEFAULT_DECOR_TEMPLATE.steps.map((step) => step.name));
    expect(steps.find((step) => step.kind === 'build').assignee_user_id).toBe(members.partner.id);
    expect(steps.find((step) => step.kind === 'content').assignee_user_id).toBe(members.crew.id);

    const january = await eventsOf(owner, studioId, '2027-01-01', '2027-01-31');
    expect(january.filter((event) => event.kind === 'market')).toEqual([]);

    // The runway under way: the same template, launching after today; what ended before today is done.
    const today = appClock.today(demoStudioSettings.timezone);
    expect(runways[1]).toMatchObject({ anchor_kind: 'date' });
    expect(String(runways[1].launch) > today).toBe(true);
    const underWay = await t.db('events').where({ runway_id: runways[1].id }).orderBy('step_index');
    expect(underWay.map((step) => step.title)).toEqual(DEFAULT_DECOR_TEMPLATE.steps.map((step) => step.name));
    for (const step of underWay) {
      expect({ title: step.title, done: Boolean(step.done) }).toEqual({ title: step.title, done: String(step.end_date) < today });
      if (step.done) expect(step.done_by).toBe(step.assignee_user_id ?? members.owner.id);
    }
    expect(underWay.find((step) => step.kind === 'build').assignee_user_id).toBe(members.partner.id);
  });

  // 1 to 7 March 2027 run Monday to Sunday, and 21 to 27 December 2026 too, with Christmas Day (a
  // public holiday, a day off for the demo) on the Friday: hand-worked from a printed calendar (from
  // memory), and checked below through Date's own weekday. Chicago keeps UTC−6 in both weeks (US
  // daylight time starts on the second Sunday of March: 14 March 2027).
  const weeks = [
    ['2027-03-01', '2027-03-02', '2027-03-03', '2027-03-04', '2027-03-05', '2027-03-06', '2027-03-07'],
    ['2026-12-21', '2026-12-22', '2026-12-23', '2026-12-24', '2026-12-25', '2026-12-26', '2026-12-27'],
  ];
  it.each(weeks)('when the demo is seeded on any weekday, in the morning or at 23:30 studio time, then partner and crew each have open work at hand (week of %s)', async (...days) => {
    expect(days.map((day) => new Date(`${day}T12:00:00Z`).getUTCDay())).toEqual([1, 2, 3, 4, 5, 6, 0]);
    for (const day of days) {
      for (const time of ['08:00', '23:30']) {
        const restore = useClock(fixedClock(`${day}T${time}:00-06:00`));
        try {
          expect(appClock.today(demoStudioSettings.timezone)).toBe(day);
          const { studioId, members } = await demoLikeStudio();
          await seedDemoCalendar(t.db, studioId);
          for (const role of ['partner', 'crew'] as const) {
            const member = await signIn(t.app, members[role].email);
            const atHand = await member.get(`/api/studios/${studioId}/events/at-hand`).query({ today: day, through: addDays(day, 7) });
            expect(atHand.status).toBe(200);
            const open = [...atHand.body.overdue, ...atHand.body.upcoming].filter((event) => !event.done && event.assigneeId === members[role].id);
            expect({ day, time, role, open: open.length > 0 }).toEqual({ day, time, role, open: true });
          }
        } finally {
          restore();
        }
      }
    }
  }, 120_000);

  it('when a plan leaves no build step open after today or no content step in the coming week, then it is not work at hand for both', () => {
    // Worked by hand against the rule: a build step must still be open tomorrow, a content step within 7 days.
    const today = '2027-03-03';
    const build = (start: string, end: string) => ({ kind: 'build', start, end });
    const content = (start: string, end: string) => ({ kind: 'content', start, end });
    expect(leavesWorkAtHand([build('2027-03-01', '2027-03-04'), content('2027-03-10', '2027-03-10')], today)).toBe(true);
    expect(leavesWorkAtHand([build('2027-03-01', '2027-03-03'), content('2027-03-05', '2027-03-05')], today)).toBe(false);
    expect(leavesWorkAtHand([build('2027-03-01', '2027-03-04'), content('2027-03-11', '2027-03-11')], today)).toBe(false);
  });
});
