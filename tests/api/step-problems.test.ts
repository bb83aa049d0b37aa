import { fixedClock, useClock } from '../../server/clock/clock';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf, smallSteps, storeRunway } from './events-fixtures';
import { addMarket } from './feeds-fixtures';

let t: TestApp;
let restoreClock = () => {};
beforeAll(() => {
  t = makeTestApp();
  restoreClock = useClock(fixedClock('2027-03-01T15:00:00Z'));
});
afterAll(async () => {
  restoreClock();
  await t.close();
});

// 2027-03-15 is a Monday (2027-03-01 is one, hand-worked from a printed calendar, from memory); a
// new studio works Monday to Friday, so Cut takes Wednesday 10 and Thursday 11, Paint Friday 12 with
// two cure days after, and the launch is on Monday 15 March.
async function plannedStudio() {
  const { studioId, members } = await makeStudio(t.db);
  const owner = await signIn(t.app, members.owner.email);
  const runway = await storeRunway(owner, studioId, { anchorDate: '2027-03-15', offsetDays: 0, steps: smallSteps });
  const step = (name: string) => runway.steps.find((one) => one.name === name)!;
  const problemsOf = async (agent = owner) => {
    const events = await eventsOf(agent, studioId, '2027-03-01', '2027-03-31');
    return Object.fromEntries(events.filter((event) => event.kind === 'build' || event.kind === 'launch').map((event) => [event.title, event.problems]));
  };
  return { studioId, members, owner, runway, step, problemsOf };
}

describe('the rules a placed step breaks now', () => {
  it('when nothing changed since the plan, then every step comes with an empty problem list', async () => {
    const { step, problemsOf } = await plannedStudio();
    expect([step('Cut').start, step('Paint').start]).toEqual(['2027-03-10', '2027-03-12']);
    expect(await problemsOf()).toEqual({ Cut: [], Paint: [], Launch: [] });
  });

  it('when a market is added on a day of a placed build step, then that step carries a problem naming the day, for crew too', async () => {
    const { studioId, members, problemsOf } = await plannedStudio();
    await addMarket(t.db, studioId, { name: 'Ferry dock market', start: '2027-03-11' });
    const crew = await signIn(t.app, members.crew.email);
    const problems = await problemsOf(crew);
    expect(problems['Cut']).toEqual([{ code: 'blackout', message: expect.stringContaining('2027-03-11') }]);
    expect(problems['Paint']).toEqual([]);
  });

  it('when a day off covers a step or the daily capacity drops under its hours, then it says so; a done step says nothing', async () => {
    const { studioId, owner, step, problemsOf } = await plannedStudio();
    expect((await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-03-12', end: '2027-03-12', note: 'Kiln repair' }] })).status).toBe(200);
    expect((await problemsOf())['Paint']).toEqual([{ code: 'blackout', message: expect.stringContaining('2027-03-12') }]);
    await t.db('studios').where({ id: studioId }).update({ daily_capacity_hours: 3 });
    expect((await problemsOf())['Cut']).toEqual([expect.objectContaining({ code: 'capacity' })]);
    const cut = await t.db('events').where({ id: Number(step('Cut').id) }).first();
    expect((await owner.patch(`/api/studios/${studioId}/events/${cut.id}`).send({ done: true, version: cut.version })).status).toBe(200);
    expect((await problemsOf())['Cut']).toEqual([]);
  });

  it('when a step was moved before its predecessor ends, then the work at hand lists it with the order problem', async () => {
    const { studioId, owner, step } = await plannedStudio();
    const paint = await t.db('events').where({ id: Number(step('Paint').id) }).first();
    await t.db('events').where({ id: paint.id }).update({ start_date: '2027-03-10', end_date: '2027-03-10', days: JSON.stringify(['2027-03-10']) });
    const atHand = await owner.get(`/api/studios/${studioId}/events/at-hand`).query({ today: '2027-03-08', through: '2027-03-15' });
    const painted = atHand.body.upcoming.find((event: { title: string }) => event.title === 'Paint');
    expect(painted.problems).toEqual(expect.arrayContaining([expect.objectContaining({ code: 'order' })]));
  });
});

describe('re-planning from a step that breaks a rule', () => {
  it('when a market lands on a placed build step, then re-planning from that step moves it and the steps after it off the market day, and its problems are gone', async () => {
    const { studioId, owner, step, problemsOf } = await plannedStudio();
    await addMarket(t.db, studioId, { name: 'Ferry dock market', start: '2027-03-12' });
    expect((await problemsOf())['Paint']).toEqual([expect.objectContaining({ code: 'blackout' })]);
    const preview = await owner.post(`/api/studios/${studioId}/events/${step('Paint').id}/replan`).query({ preview: '1', from: 'itself' });
    expect(preview.status).toBe(200);
    expect(preview.body.moves.map((move: { title: string }) => move.title)).toContain('Paint');
    const applied = await owner.post(`/api/studios/${studioId}/events/${step('Paint').id}/replan`).query({ from: 'itself' });
    expect(applied.status).toBe(200);
    const stored = await t.db('events').where({ id: Number(step('Paint').id) }).first();
    expect(stored.start_date).not.toBe('2027-03-12');
    expect(await problemsOf()).toEqual({ Cut: [], Paint: [], Launch: [] });
  });

  it("when the broken step is its runway's first, then 422 says to move it by hand", async () => {
    const { studioId, owner, step } = await plannedStudio();
    const refused = await owner.post(`/api/studios/${studioId}/events/${step('Cut').id}/replan`).query({ from: 'itself' });
    expect([refused.status, refused.body.error.code]).toEqual([422, 'first_step']);
  });
});
