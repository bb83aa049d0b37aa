import request from 'supertest';
import { anonymousAgent, makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf, smallSteps, storeRunway } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

// The small runway back from Tuesday 2027-07-20 on a Monday–Friday studio, worked by hand:
// Launch is a milestone on L = 2027-07-20. Paint: latestEnd = 07-20 − 1 − 2 cure = 07-17 (Sat),
// so the latest work day is Fri 07-16. Cut: latestEnd = 07-16 − 1 = 07-15 (Thu), two work days:
// 07-14 and 07-15.
const anchored = { anchorDate: '2027-07-20', offsetDays: 0, steps: smallSteps };

describe('GET /events', () => {
  it('when a month is asked for, then stored steps, holidays, occasions, market days and deadlines come merged', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    expect(runway.steps.map((step) => [step.name, step.start, step.end])).toEqual([
      ['Cut', '2027-07-14', '2027-07-15'],
      ['Paint', '2027-07-16', '2027-07-16'],
      ['Launch', '2027-07-20', '2027-07-20'],
    ]);
    const market = await owner.post(`/api/studios/${studioId}/markets`).send({
      name: 'Riverbend Makers Night',
      place: 'Old mill yard',
      start: '2027-01-09',
      rrule: 'FREQ=MONTHLY;BYDAY=2SA',
      hours: '17:00–21:00',
      notes: 'Power at the mill wall only.',
      applicationDeadline: '2027-07-01',
      decisionDate: '2027-07-12',
    });
    expect(market.status).toBe(201);

    const events = await eventsOf(owner, studioId, '2027-07-01', '2027-07-31');
    const ids = events.map((event) => event.id);
    // US OPM 2027 federal holidays: Independence Day (Sunday July 4) is observed on Monday July 5.
    expect(ids).toContain('holiday:us-independence-day:2027-07-05');
    // Second Saturday of July 2027 (July 1 is a Thursday: Saturdays 3 and 10).
    expect(ids).toContain(`market:${market.body.id}:2027-07-10`);
    expect(ids).toContain(`deadline:${market.body.id}:application`);
    expect(ids).toContain(`deadline:${market.body.id}:decision`);
    const cut = events.find((event) => event.id === runway.steps[0].id)!;
    expect(cut).toMatchObject({ kind: 'build', title: 'Cut', start: '2027-07-14', end: '2027-07-15', allDay: true, editable: true, version: 1, runwayId: runway.id, stepIndex: 0, hoursPerDay: 4, cureDays: 0, done: false, workDays: 2 });
    const launch = events.find((event) => event.kind === 'launch')!;
    expect(launch).toMatchObject({ start: '2027-07-20', end: '2027-07-20' });
    expect(events.find((event) => event.kind === 'market')).toMatchObject({ title: 'Riverbend Makers Night', place: 'Old mill yard', hours: '17:00–21:00', notes: 'Power at the mill wall only.', editable: false });
    // Sorted by start date.
    expect(events.map((event) => event.start)).toEqual([...events.map((event) => event.start)].sort());
    // The same ids on a second read: computed ids are stable.
    expect((await eventsOf(owner, studioId, '2027-07-01', '2027-07-31')).map((event) => event.id)).toEqual(ids);
  });

  it('when a step spans the edge of the range, then it is included; outside the range it is not', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const edge = await eventsOf(owner, studioId, '2027-07-15', '2027-07-15');
    expect(edge.map((event) => event.id)).toEqual([runway.steps[0].id]);
    expect(await eventsOf(owner, studioId, '2027-07-21', '2027-07-31')).not.toContainEqual(expect.objectContaining({ runwayId: runway.id }));
  });

  it('when a long step started well before the range, then it still shows', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, { anchorDate: '2027-12-20', offsetDays: 0, steps: [{ name: 'Long build', kind: 'build', workDays: 90, hoursPerDay: 2, cureDays: 0 }] });
    const [step] = runway.steps;
    expect(step.start! < '2027-09-01').toBe(true);
    const events = await eventsOf(owner, studioId, '2027-12-01', '2027-12-31');
    expect(events.map((event) => event.id)).toContain(step.id);
  });

  it('when the studio is in Canada, then its holidays and its Thanksgiving show', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.patch(`/api/studios/${studioId}`).send({ country: 'CA', region: 'ON' })).status).toBe(200);
    const events = await eventsOf(owner, studioId, '2026-10-01', '2026-10-31');
    // Canada Labour Code: Thanksgiving is the second Monday of October (2026-10-12).
    expect(events).toContainEqual(expect.objectContaining({ kind: 'holiday', start: '2026-10-12' }));
    expect(events).toContainEqual(expect.objectContaining({ id: 'occasion:thanksgiving:2026-10-12', kind: 'occasion', sellWindowStart: '2026-09-21' }));
  });

  it.each([
    ['from=2027-07-01', 'to'],
    ['from=2027-02-30&to=2027-03-01', 'from'],
    ['from=2027-07-31&to=2027-07-01', 'to'],
    ['from=2027-01-01&to=2028-12-31', 'to'],
  ])('when the query is %s, then 400 names %s', async (query, field) => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    const response = await crew.get(`/api/studios/${studioId}/events?${query}`);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
  });
});

describe('PATCH /events/:eventId (moves)', () => {
  it('when a step is moved to a free work day, then it is stored there with a new version and SEQUENCE', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const runway = await storeRunway(partner, studioId, anchored);
    const cut = runway.steps[0];
    // Two work days from Thursday 07-08: Thu 07-08 and Fri 07-09.
    const response = await partner.patch(`/api/studios/${studioId}/events/${cut.id}`).send({ start: '2027-07-08', end: '2027-07-09', version: 1 });
    expect(response.status).toBe(200);
    expect(response.body.event).toMatchObject({ id: cut.id, start: '2027-07-08', end: '2027-07-09', version: 2 });
    expect(response.body.warnings).toEqual([]);
    const row = await t.db('events').where({ id: Number(cut.id) }).first();
    expect(row).toMatchObject({ start_date: '2027-07-08', end_date: '2027-07-09', version: 2, sequence: 1 });
    expect(JSON.parse(row.days)).toEqual(['2027-07-08', '2027-07-09']);
  });

  it('when the step spans a weekend, then its work days skip it and the end is worked out by the server', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    // Friday 07-09 plus the next work day, Monday 07-12 (the client's end is only a hint).
    const response = await owner.patch(`/api/studios/${studioId}/events/${runway.steps[0].id}`).send({ start: '2027-07-09', end: '2027-07-10', version: 1 });
    expect(response.status).toBe(200);
    expect(response.body.event).toMatchObject({ start: '2027-07-09', end: '2027-07-12' });
  });

  it('when the version is stale, then 409 carries the current event and nothing changes', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const partner = await signIn(t.app, members.partner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const id = runway.steps[0].id;
    expect((await owner.patch(`/api/studios/${studioId}/events/${id}`).send({ start: '2027-07-08', version: 1 })).status).toBe(200);
    const response = await partner.patch(`/api/studios/${studioId}/events/${id}`).send({ start: '2027-07-07', version: 1 });
    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('version_conflict');
    expect(response.body.current).toMatchObject({ id, start: '2027-07-08', version: 2 });
    expect((await t.db('events').where({ id: Number(id) }).first()).start_date).toBe('2027-07-08');
  });

  it('when a step is moved before its predecessor ends, then 422 with an order warning; with force it is stored', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const paint = runway.steps[1];
    const refused = await owner.patch(`/api/studios/${studioId}/events/${paint.id}`).send({ start: '2027-07-14', version: 1 });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('rule_broken');
    expect(refused.body.warnings).toEqual([expect.objectContaining({ code: 'order', stepIndex: 1 })]);
    expect((await t.db('events').where({ id: Number(paint.id) }).first()).start_date).toBe('2027-07-16');
    const forced = await owner.patch(`/api/studios/${studioId}/events/${paint.id}`).send({ start: '2027-07-14', version: 1, force: true });
    expect(forced.status).toBe(200);
    expect(forced.body.warnings).toEqual([expect.objectContaining({ code: 'order' })]);
    expect(forced.body.event).toMatchObject({ start: '2027-07-14', version: 2 });
  });

  it('when the launch is moved inside the cure time after painting, then 422 with a cure warning', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    // Paint ends Friday 07-16; with 2 cure days the launch may come on 07-19 at the earliest.
    const response = await owner.patch(`/api/studios/${studioId}/events/${runway.steps[2].id}`).send({ start: '2027-07-18', version: 1 });
    expect(response.status).toBe(422);
    expect(response.body.warnings).toEqual([expect.objectContaining({ code: 'cure', stepIndex: 2 })]);
  });

  it('when a step is dropped on a Saturday, a blackout day or a holiday, then 422 names the day off', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    expect((await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-07-07', note: 'Lumber delivery' }] })).status).toBe(200);
    const move = (start: string) => owner.patch(`/api/studios/${studioId}/events/${runway.steps[0].id}`).send({ start, version: 1 });
    const saturday = await move('2027-07-10');
    expect(saturday.status).toBe(422);
    expect(saturday.body.warnings[0]).toMatchObject({ code: 'blackout', dates: ['2027-07-10'] });
    expect(saturday.body.warnings[0].message).toMatch(/Saturday, not a work day/);
    const blackout = await move('2027-07-07');
    expect(blackout.body.warnings[0].message).toMatch(/2027-07-07 is a blackout day/);
    // OPM: Independence Day 2027 is observed on Monday July 5.
    const holiday = await move('2027-07-05');
    expect(holiday.body.warnings[0].message).toMatch(/2027-07-05 is a public holiday/);
  });

  it('when another runway already fills the day, then 422 for capacity', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    // A full 8-hour day on Tuesday 2027-07-06 from another runway (the studio's capacity is 8 h).
    await storeRunway(owner, studioId, { anchorDate: '2027-07-07', offsetDays: 0, steps: [{ name: 'Big order', kind: 'build', workDays: 1, hoursPerDay: 8, cureDays: 0 }] });
    const runway = await storeRunway(owner, studioId, anchored);
    const response = await owner.patch(`/api/studios/${studioId}/events/${runway.steps[1].id}`).send({ start: '2027-07-06', version: 1, force: false });
    expect(response.status).toBe(422);
    expect(response.body.warnings).toContainEqual(expect.objectContaining({ code: 'capacity', dates: ['2027-07-06'] }));
  });

  it('when a step is put back in the tray, then its dates are cleared and it is listed in the tray', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const response = await owner.patch(`/api/studios/${studioId}/events/${runway.steps[0].id}`).send({ start: null, version: 1 });
    expect(response.status).toBe(200);
    const tray = await owner.get(`/api/studios/${studioId}/events/tray`);
    expect(tray.body).toEqual([expect.objectContaining({ id: runway.steps[0].id, start: null, end: null, workDays: 2 })]);
  });

  it('when the owner edits notes, title and assignee, then they are stored; an outsider as assignee is 400', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const other = await makeStudio(t.db, ['crew']);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const id = runway.steps[0].id;
    const edited = await owner.patch(`/api/studios/${studioId}/events/${id}`).send({ title: 'Cut the panels', notes: 'Birch ply, 3 mm', assigneeId: members.crew.id, version: 1 });
    expect(edited.status).toBe(200);
    expect(edited.body.event).toMatchObject({ title: 'Cut the panels', notes: 'Birch ply, 3 mm', assigneeId: members.crew.id, assigneeName: 'crew person', version: 2 });
    const outsider = await owner.patch(`/api/studios/${studioId}/events/${id}`).send({ assigneeId: other.members.crew.id, version: 2 });
    expect(outsider.status).toBe(400);
    expect(outsider.body.error.issues[0].path).toEqual(['assigneeId']);
    const empty = await owner.patch(`/api/studios/${studioId}/events/${id}`).send({ version: 2 });
    expect(empty.status).toBe(400);
  });
});

describe('done ticks', () => {
  it('when crew tick their own step, then it is done; someone else’s or a move is 403', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner', 'partner', 'crew', 'crew']);
    const owner = await signIn(t.app, members.owner.email);
    const crew = await signIn(t.app, members.crew.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const [mine, theirs] = runway.steps;
    await owner.patch(`/api/studios/${studioId}/events/${mine.id}`).send({ assigneeId: members.crew.id, version: 1 });
    const ticked = await crew.patch(`/api/studios/${studioId}/events/${mine.id}`).send({ done: true, version: 2 });
    expect(ticked.status).toBe(200);
    expect(ticked.body.event).toMatchObject({ done: true, editable: false });
    const row = await t.db('events').where({ id: Number(mine.id) }).first();
    expect(row).toMatchObject({ done: true, done_by: members.crew.id });
    const listed = await eventsOf(crew, studioId, '2027-07-01', '2027-07-31');
    expect(listed.find((event) => event.id === mine.id)).toMatchObject({ done: true, hoursPerDay: 4, editable: false });
    expect((await crew.patch(`/api/studios/${studioId}/events/${theirs.id}`).send({ done: true, version: 1 })).status).toBe(403);
    expect((await crew.patch(`/api/studios/${studioId}/events/${mine.id}`).send({ start: '2027-07-08', version: 3 })).status).toBe(403);
    expect((await crew.patch(`/api/studios/${studioId}/events/${mine.id}`).send({ done: false, notes: 'x', version: 3 })).status).toBe(403);
    // Owner and partner may tick any step.
    const partner = await signIn(t.app, members.partner.email);
    expect((await partner.patch(`/api/studios/${studioId}/events/${theirs.id}`).send({ done: true, version: 1 })).status).toBe(200);
  });
});

describe('POST /events/:eventId/replan', () => {
  it('when a step moved later, then the preview lists the following moves and storing applies them', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const [cut, paint, launch] = runway.steps;
    // Cut moves to Thu 07-15 + Fri 07-16, onto Paint's day.
    const moved = await owner.patch(`/api/studios/${studioId}/events/${cut.id}`).send({ start: '2027-07-15', version: 1, force: true });
    expect(moved.status).toBe(200);
    expect(moved.body.warnings).toContainEqual(expect.objectContaining({ code: 'order', stepIndex: 1 }));
    // Forward: Paint takes the next work day, Mon 07-19; 2 cure days → the launch on Thu 07-22,
    // two days after the anchor (07-20).
    const preview = await owner.post(`/api/studios/${studioId}/events/${cut.id}/replan?preview=1`);
    expect(preview.status).toBe(200);
    expect(preview.body.moves).toEqual([
      { id: paint.id, title: 'Paint', from: { start: '2027-07-16', end: '2027-07-16' }, to: { start: '2027-07-19', end: '2027-07-19' } },
      { id: launch.id, title: 'Launch', from: { start: '2027-07-20', end: '2027-07-20' }, to: { start: '2027-07-22', end: '2027-07-22' } },
    ]);
    expect(preview.body.warnings).toContainEqual(expect.objectContaining({ code: 'past-anchor' }));
    expect((await t.db('events').where({ id: Number(paint.id) }).first()).start_date).toBe('2027-07-16');

    const stored = await owner.post(`/api/studios/${studioId}/events/${cut.id}/replan`);
    expect(stored.status).toBe(200);
    expect(stored.body.events.map((event: { id: string; start: string; version: number }) => [event.id, event.start, event.version])).toEqual([
      [paint.id, '2027-07-19', 2],
      [launch.id, '2027-07-22', 2],
    ]);
    expect((await t.db('events').where({ id: Number(launch.id) }).first()).start_date).toBe('2027-07-22');
  });

  it('when the step is in the tray, then 422', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, { ...anchored, placement: 'tray' });
    expect((await owner.post(`/api/studios/${studioId}/events/${runway.steps[0].id}/replan`)).status).toBe(422);
  });
});

describe('tray and stamp', () => {
  it('when steps are unscheduled, then the tray lists those of picked or building themes and of no theme', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const [picked] = await t.db('themes').insert({ studio_id: studioId, name: 'Herb garden', status: 'picked' });
    const [idea] = await t.db('themes').insert({ studio_id: studioId, name: 'Lanterns', status: 'idea' });
    await storeRunway(owner, studioId, { ...anchored, themeId: picked, placement: 'tray' });
    await storeRunway(owner, studioId, { ...anchored, themeId: idea, placement: 'tray' });
    const tray = await owner.get(`/api/studios/${studioId}/events/tray`);
    expect(tray.status).toBe(200);
    expect(tray.body.map((step: { title: string; themeName: string }) => [step.title, step.themeName])).toEqual([
      ['Cut', 'Herb garden'],
      ['Paint', 'Herb garden'],
      ['Launch', 'Herb garden'],
    ]);
    expect(tray.body[0]).toMatchObject({ start: null, end: null, workDays: 2, kind: 'build', themeId: picked });
  });

  it('when any stored event changes, appears or goes, or a market or theme name changes, then the stamp changes', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const crew = await signIn(t.app, members.crew.email);
    const stamp = async () => (await crew.get(`/api/studios/${studioId}/events/stamp`)).body.stamp as string;
    const empty = await stamp();
    const runway = await storeRunway(owner, studioId, anchored);
    const created = await stamp();
    expect(created).not.toBe(empty);
    expect(await stamp()).toBe(created);
    await owner.patch(`/api/studios/${studioId}/events/${runway.steps[0].id}`).send({ notes: 'x', version: 1 });
    const edited = await stamp();
    expect(edited).not.toBe(created);
    await owner.delete(`/api/studios/${studioId}/runways/${runway.id}`);
    const deleted = await stamp();
    expect(deleted).not.toBe(edited);
    // So does anything else the calendar shows: a market, a theme's name.
    await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Makers night', place: 'Mill yard', start: '2027-07-10' }).expect(201);
    const withMarket = await stamp();
    expect(withMarket).not.toBe(deleted);
    const [themeId] = await t.db('themes').insert({ studio_id: studioId, name: 'Lanterns', status: 'idea' });
    const withTheme = await stamp();
    expect(withTheme).not.toBe(withMarket);
    await t.db('themes').where({ id: themeId }).update({ name: 'Paper lanterns' });
    expect(await stamp()).not.toBe(withTheme);
  });
});

describe('GET /events answer cache', () => {
  it('when anything the month shows changes, then the next read shows it; an unchanged month answers 304 to its ETag', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const crew = await signIn(t.app, members.crew.email);
    const month = `/api/studios/${studioId}/events?from=2027-07-01&to=2027-07-31`;
    const [themeId] = await t.db('themes').insert({ studio_id: studioId, name: 'Herb garden', status: 'picked' });
    const runway = await storeRunway(owner, studioId, { ...anchored, themeId });
    const cutId = runway.steps[0].id;
    const cut = async () => (await eventsOf(owner, studioId, '2027-07-01', '2027-07-31')).find((event) => event.id === cutId);
    await owner.patch(`/api/studios/${studioId}/events/${cutId}`).send({ assigneeId: members.crew.id, version: 1 }).expect(200);
    expect(await cut()).toMatchObject({ themeName: 'Herb garden', assigneeName: 'crew person', editable: true });

    const first = await owner.get(month).expect(200);
    expect(first.headers['etag']).toMatch(/^"[A-Za-z0-9_-]{27}"$/);
    expect(first.headers['cache-control']).toBe('private, no-cache');
    await owner.get(month).set('If-None-Match', first.headers['etag']).expect(304);
    // Each role has its own answer: crew may not edit.
    expect((await eventsOf(crew, studioId, '2027-07-01', '2027-07-31')).find((event) => event.id === cutId)).toMatchObject({ editable: false });

    const theme = await owner.get(`/api/studios/${studioId}/themes/${themeId}`).expect(200);
    await owner.patch(`/api/studios/${studioId}/themes/${themeId}`).send({ name: 'Window herb boxes', version: theme.body.version }).expect(200);
    expect(await cut()).toMatchObject({ themeName: 'Window herb boxes' });
    await crew.patch('/api/account/profile').send({ name: 'Robin Crewhand' }).expect(200);
    expect(await cut()).toMatchObject({ assigneeName: 'Robin Crewhand' });
    await owner.patch(`/api/studios/${studioId}`).send({ country: 'CA' }).expect(200);
    const canadian = await eventsOf(owner, studioId, '2027-07-01', '2027-07-31');
    // Canada Day, Thursday 2027-07-01 (Canada's statutory holidays, from memory).
    expect(canadian.some((event) => event.kind === 'holiday' && event.start === '2027-07-01')).toBe(true);
    await owner.get(month).set('If-None-Match', first.headers['etag']).expect(200);
    await owner.delete(`/api/studios/${studioId}/runways/${runway.id}`).expect(204);
    expect(await cut()).toBeUndefined();
  });
});

describe('GET /events/at-hand', () => {
  const atHand = (agent: Awaited<ReturnType<typeof signIn>>, studioId: number, today: string, through: string) =>
    agent.get(`/api/studios/${studioId}/events/at-hand`).query({ today, through });

  it('when a step ended before today undone, then it is overdue; steps touching today..through come by start, done or not', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, anchored);
    const [cut, paint, launch] = runway.steps;
    // Friday 2027-07-16: Cut (07-14..07-15) is over and not done; Paint is today; Launch is Tuesday.
    const friday = await atHand(owner, studioId, '2027-07-16', '2027-07-23');
    expect(friday.status).toBe(200);
    expect(friday.body.overdue.map((step: { id: string }) => step.id)).toEqual([cut.id]);
    expect(friday.body.overdueCount).toBe(1);
    expect(friday.body.upcoming.map((step: { id: string }) => step.id)).toEqual([paint.id, launch.id]);
    expect(friday.body.overdue[0]).toMatchObject({ title: 'Cut', start: '2027-07-14', end: '2027-07-15', done: false, editable: true, version: 1 });
    // On its last day a step is not overdue yet: it is today's.
    const thursday = await atHand(owner, studioId, '2027-07-15', '2027-07-15');
    expect(thursday.body.overdue).toEqual([]);
    expect(thursday.body.upcoming.map((step: { id: string }) => step.id)).toEqual([cut.id]);
    // Ticked done, it is no longer overdue; a done step in the range is still listed, ticked.
    expect((await owner.patch(`/api/studios/${studioId}/events/${cut.id}`).send({ done: true, version: 1 })).status).toBe(200);
    expect((await atHand(owner, studioId, '2027-07-16', '2027-07-23')).body).toMatchObject({ overdue: [], overdueCount: 0 });
    expect((await atHand(owner, studioId, '2027-07-14', '2027-07-14')).body.upcoming).toMatchObject([{ id: cut.id, done: true }]);
  });

  it('when crew ask, then they see the same steps, not editable', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const runway = await storeRunway(await signIn(t.app, members.owner.email), studioId, anchored);
    const answer = await atHand(await signIn(t.app, members.crew.email), studioId, '2027-07-16', '2027-07-23');
    expect(answer.status).toBe(200);
    expect(answer.body.overdue.map((step: { id: string; editable: boolean }) => [step.id, step.editable])).toEqual([[runway.steps[0].id, false]]);
  });

  it('when the dates are missing, reversed or too far apart, then 400 names the field', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const cases: [Record<string, string>, string][] = [
      [{ through: '2027-07-23' }, 'today'],
      [{ today: '2027-07-16', through: '2027-07-15' }, 'through'],
      [{ today: '2027-07-16', through: '2027-08-30' }, 'through'],
      [{ today: '2027-02-30', through: '2027-03-02' }, 'today'],
    ];
    for (const [query, field] of cases) {
      const answer = await owner.get(`/api/studios/${studioId}/events/at-hand`).query(query);
      expect([query, answer.status, JSON.stringify(answer.body)]).toEqual([query, 400, expect.stringContaining(field)]);
    }
  });
});

describe('access to the events routes', () => {
  const routes = (studioId: number, eventId: string) => [
    ['get', `/api/studios/${studioId}/events?from=2027-07-01&to=2027-07-31`],
    ['get', `/api/studios/${studioId}/events/tray`],
    ['get', `/api/studios/${studioId}/events/stamp`],
    ['get', `/api/studios/${studioId}/events/at-hand?today=2027-07-16&through=2027-07-23`],
    ['get', `/api/studios/${studioId}/events/${eventId}`],
    ['patch', `/api/studios/${studioId}/events/${eventId}`],
    ['post', `/api/studios/${studioId}/events/${eventId}/replan`],
  ] as const;

  it('when anonymous, then every route is 401', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const runway = await storeRunway(await signIn(t.app, members.owner.email), studioId, anchored);
    const agent = await anonymousAgent(t.app);
    for (const [method, url] of routes(studioId, runway.steps[0].id)) {
      expect([method, url, (await agent[method](url).send({ start: '2027-07-08', version: 1 })).status]).toEqual([method, url, 401]);
    }
    expect((await request(t.app).get(`/api/studios/${studioId}/events/tray`)).status).toBe(401);
  });

  it('when a member of another studio asks, then every route is 404', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const runway = await storeRunway(await signIn(t.app, members.owner.email), studioId, anchored);
    const other = await makeStudio(t.db, ['owner']);
    const outsider = await signIn(t.app, other.members.owner.email);
    for (const [method, url] of routes(studioId, runway.steps[0].id)) {
      expect([method, url, (await outsider[method](url).send({ start: '2027-07-08', version: 1 })).status]).toEqual([method, url, 404]);
    }
    // Their own studio does not see the event either.
    expect((await outsider.get(`/api/studios/${other.studioId}/events/${runway.steps[0].id}`)).status).toBe(404);
    expect((await outsider.patch(`/api/studios/${other.studioId}/events/${runway.steps[0].id}`).send({ start: '2027-07-08', version: 1 })).status).toBe(404);
  });

  it('when crew move or re-plan, then 403', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const runway = await storeRunway(await signIn(t.app, members.owner.email), studioId, anchored);
    const crew = await signIn(t.app, members.crew.email);
    expect((await crew.patch(`/api/studios/${studioId}/events/${runway.steps[0].id}`).send({ start: '2027-07-08', version: 1 })).status).toBe(403);
    expect((await crew.post(`/api/studios/${studioId}/events/${runway.steps[0].id}/replan`)).status).toBe(403);
    expect((await t.db('events').where({ id: Number(runway.steps[0].id) }).first()).version).toBe(1);
  });
});
