import { addDays } from '@shared/calendar/dates';
import { DEFAULT_DECOR_TEMPLATE } from '@shared/planning/default-template';
import { demoRunwayName, demoRunwayUnderWayName, seedDemoCalendar, underWayLaunch } from '../../db/seeds/demo-calendar';
import { todayInZone } from '../../server/occasions/studio-today';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('demo calendar seed', () => {
  it('when run twice, then the studio has two recurring markets, one runway planned back from the fair and one under way', async () => {
    const { studioId, members } = await makeStudio(t.db);
    await seedDemoCalendar(t.db, studioId);
    await seedDemoCalendar(t.db, studioId);
    const markets = await t.db('markets').where({ studio_id: studioId }).orderBy('id');
    expect(markets.map((market) => market.rrule)).toEqual(['FREQ=MONTHLY;BYDAY=2SA', 'FREQ=YEARLY;BYMONTH=10;BYDAY=1SA']);
    expect(JSON.parse(markets[0].exdates)).toEqual(['2027-01-09']);
    expect(markets[1].application_deadline).toBe('2027-06-15');
    const runways = await t.db('runways').where({ studio_id: studioId }).orderBy('id');
    expect(runways.map((runway) => runway.name)).toEqual([demoRunwayName, demoRunwayUnderWayName]);
    expect(runways[0]).toMatchObject({ name: demoRunwayName, anchor_kind: 'market', offset_days: 14 });
    // The fair's next day (first Saturday of October: 2027-10-02 when seeded in late 2026, as
    // 1 October 2027 is a Friday); the launch two weeks before it.
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

    // The runway under way: the same template, launching on the Monday after the coming Sunday, so
    // nothing of it is left for the days after that Monday; what ended before today is done.
    const today = todayInZone((await t.db('studios').where({ id: studioId }).first('timezone')).timezone);
    const launch = underWayLaunch(today);
    expect(runways[1]).toMatchObject({ anchor_kind: 'date', anchor_date: launch, launch });
    const underWay = await t.db('events').where({ runway_id: runways[1].id }).orderBy('step_index');
    expect(underWay.map((step) => step.title)).toEqual(DEFAULT_DECOR_TEMPLATE.steps.map((step) => step.name));
    expect(underWay.every((step) => String(step.end_date) <= launch)).toBe(true);
    for (const step of underWay) {
      expect({ title: step.title, done: Boolean(step.done) }).toEqual({ title: step.title, done: String(step.end_date) < today });
      if (step.done) expect(step.done_by).toBe(step.assignee_user_id ?? members.owner.id);
    }
    expect(underWay.find((step) => step.kind === 'build').assignee_user_id).toBe(members.partner.id);
  });

  it('when the runway under way is placed, then it launches on the Monday after the coming Sunday', () => {
    // Hand-worked from a calendar (common practice: the demo's weeks start on Sunday): 2 December
    // 2026 is a Wednesday, 5 December a Saturday, 6 December a Sunday.
    expect(underWayLaunch('2026-12-02')).toBe('2026-12-07');
    expect(underWayLaunch('2026-12-05')).toBe('2026-12-07');
    expect(underWayLaunch('2026-12-06')).toBe('2026-12-14');
    expect(underWayLaunch('2026-12-07')).toBe('2026-12-14');
  });
});
