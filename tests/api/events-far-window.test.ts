import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf } from './events-fixtures';
import { addMarket } from './feeds-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

/** The Saturdays of a year, counted with JavaScript's Date (an outside reference, not our date code). */
function saturdaysOf(year: number): string[] {
  const days: string[] = [];
  for (let day = new Date(Date.UTC(year, 0, 1)); day.getUTCFullYear() === year; day = new Date(day.getTime() + 86_400_000)) {
    if (day.getUTCDay() === 6) days.push(day.toISOString().slice(0, 10));
  }
  return days;
}

describe('events of a window far from the markets\' first days', () => {
  it('when crew ask for a year centuries on in a studio with 50 weekly markets, then every market day of that year comes back', async () => {
    const { studioId, members } = await makeStudio(t.db);
    for (let index = 0; index < 50; index++) {
      await addMarket(t.db, studioId, { name: `Lantern row ${index}`, start: '2026-01-03', rrule: 'FREQ=WEEKLY;BYDAY=SA' });
    }
    const crew = await signIn(t.app, members.crew.email);
    const events = await eventsOf(crew, studioId, '2199-01-01', '2199-12-31');
    const marketDays = events.filter((event) => event.kind === 'market' && event.title === 'Lantern row 7').map((event) => event.start);
    expect(marketDays).toEqual(saturdaysOf(2199));
    expect(events.filter((event) => event.kind === 'market')).toHaveLength(50 * saturdaysOf(2199).length);
  }, 30_000);

  it('when a window lies outside 1900 to 2200, then it is a 400 naming the field', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    const far = await crew.get(`/api/studios/${studioId}/events`).query({ from: '9980-01-01', to: '9980-12-31' });
    expect(far.status).toBe(400);
    expect(far.body.error.issues).toEqual(expect.arrayContaining([{ path: ['from'], message: 'Expected a date from 1900-01-01 to 2200-12-31' }]));
    const early = await crew.get(`/api/studios/${studioId}/events`).query({ from: '1899-12-01', to: '1900-01-31' });
    expect([early.status, early.body.error.issues[0].path]).toEqual([400, ['from']]);
  });
});
