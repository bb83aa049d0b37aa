import { anonymousAgent, makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const fair = {
  name: 'Lantern Hollow Craft Fair',
  place: 'Grange hall, Main Street',
  start: '2027-03-06',
  rrule: 'FREQ=MONTHLY;BYDAY=1SA',
  exdates: ['2027-04-03'],
  rdates: ['2027-04-10'],
  hours: '9:00–15:00',
  boothFeeCents: 4500,
  applicationDeadline: '2027-02-01',
  decisionDate: '2027-02-15',
  kitsAllowed: true,
  notes: 'Bring the tent weights.',
};

describe('markets CRUD', () => {
  it('when a partner adds a market, then it is stored as given and read back with its next dates', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const created = await partner.post(`/api/studios/${studioId}/markets`).send(fair);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ ...fair, version: 1 });
    // First Saturdays from March 2027, with 3 April struck and 10 April added.
    expect(created.body.nextDates).toEqual(['2027-03-06', '2027-04-10', '2027-05-01', '2027-06-05', '2027-07-03']);
    const row = await t.db('markets').where({ id: created.body.id }).first();
    expect(row).toMatchObject({ studio_id: studioId, booth_fee_cents: 4500, kits_allowed: true, start: '2027-03-06' });
    expect(JSON.parse(row.exdates)).toEqual(['2027-04-03']);
    const list = await partner.get(`/api/studios/${studioId}/markets`);
    expect(list.body.map((market: { id: number }) => market.id)).toEqual([created.body.id]);
  });

  it('when the market is changed with the version read, then it is stored; a stale version is 409', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const { body: market } = await owner.post(`/api/studios/${studioId}/markets`).send(fair);
    const updated = await owner.put(`/api/studios/${studioId}/markets/${market.id}`).send({ ...fair, name: 'Lantern Hollow Spring Fair', version: 1 });
    expect(updated.status).toBe(200);
    expect(updated.body).toMatchObject({ name: 'Lantern Hollow Spring Fair', version: 2 });
    const stale = await owner.put(`/api/studios/${studioId}/markets/${market.id}`).send({ ...fair, name: 'Again', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.current.name).toBe('Lantern Hollow Spring Fair');
    expect((await owner.delete(`/api/studios/${studioId}/markets/${market.id}`)).status).toBe(204);
    expect((await owner.get(`/api/studios/${studioId}/markets/${market.id}`)).status).toBe(404);
  });

  it.each([
    [{ rrule: 'FREQ=MONTHLY;BYDAY=XX' }, 'rrule', /BYDAY item "XX"/],
    [{ rrule: 'FREQ=FORTNIGHTLY' }, 'rrule', /Unknown FREQ/],
    [{ rrule: 'FREQ=WEEKLY;COLOR=RED' }, 'rrule', /Unknown rule part "COLOR"/],
    [{ rrule: 'FREQ=HOURLY' }, 'rrule', /repeats within a day/],
    [{ start: '2027-02-29' }, 'start', /real date/],
    [{ boothFeeCents: -1 }, 'boothFeeCents', /./],
    [{ decisionDate: '2027-01-15' }, 'decisionDate', /before the application deadline/],
    [{ exdates: ['someday'] }, 'exdates', /real date/],
    [{ name: '' }, 'name', /./],
  ])('when the market has %j, then 400 names %s and says what is wrong', async (change, field, message) => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.post(`/api/studios/${studioId}/markets`).send({ ...fair, ...change });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
    expect(response.body.error.message).toMatch(message);
    expect(await t.db('markets').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('market recurrences on the calendar', () => {
  it('when a market repeats with struck and extra dates, then GET /events lists exactly its days', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const { body: market } = await owner.post(`/api/studios/${studioId}/markets`).send(fair);
    const days = (await eventsOf(owner, studioId, '2027-01-01', '2027-06-30')).filter((event) => event.kind === 'market').map((event) => event.start);
    expect(days).toEqual(['2027-03-06', '2027-04-10', '2027-05-01', '2027-06-05']);
    const deadlines = (await eventsOf(owner, studioId, '2027-01-01', '2027-06-30')).filter((event) => event.kind === 'deadline');
    expect(deadlines.map((event) => [event.id, event.start, event.title])).toEqual([
      [`deadline:${market.id}:application`, '2027-02-01', 'Application deadline: Lantern Hollow Craft Fair'],
      [`deadline:${market.id}:decision`, '2027-02-15', 'Decision date: Lantern Hollow Craft Fair'],
    ]);
  });

  it.each([
    // RFC 5545 §3.8.5.3: "Monthly on the first Friday for 10 occurrences" from 1997-09-05.
    ['FREQ=MONTHLY;COUNT=10;BYDAY=1FR', '1997-09-05', '1997-09-01', '1998-06-30', ['1997-09-05', '1997-10-03', '1997-11-07', '1997-12-05', '1998-01-02', '1998-02-06', '1998-03-06', '1998-04-03', '1998-05-01', '1998-06-05']],
    // RFC 5545 §3.8.5.3: "The last work day of the month" (BYSETPOS=-1), first occurrences.
    ['FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1', '1997-09-30', '1997-09-01', '1998-03-31', ['1997-09-30', '1997-10-31', '1997-11-28', '1997-12-31', '1998-01-30', '1998-02-27', '1998-03-31']],
    // RFC 5545 §3.8.5.3: "Every other week on Tuesday and Thursday, for 8 occurrences" (INTERVAL=2).
    ['FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH', '1997-09-02', '1997-09-01', '1997-12-31', ['1997-09-02', '1997-09-04', '1997-09-16', '1997-09-18', '1997-09-30', '1997-10-02', '1997-10-14', '1997-10-16']],
  ])('when a market follows %s, then its days are those RFC 5545 lists', async (rrule, start, from, to, expected) => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Example market', place: '', start, rrule })).status).toBe(201);
    const days = (await eventsOf(owner, studioId, from, to)).filter((event) => event.kind === 'market').map((event) => event.start);
    expect(days).toEqual(expected);
  });

  it('when a market day falls in a runway, then build work is planned around it but content is not', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    // A weekday market on Thursday 2027-05-13.
    await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Thursday pop-up', place: 'Library lawn', start: '2027-05-13' });
    const response = await owner.post(`/api/studios/${studioId}/runways/preview`).send({
      anchorDate: '2027-05-14',
      offsetDays: 0,
      steps: [
        { name: 'Cut', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 0 },
        { name: 'Film', kind: 'content', workDays: 1, hoursPerDay: 4, cureDays: 0 },
        { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
      ],
    });
    // Film (content) may use the market day, Thu 05-13; Cut then ends before it, Wed 05-12.
    expect(response.body.steps.map((step: { start: string }) => step.start)).toEqual(['2027-05-12', '2027-05-13', '2027-05-14']);
    // A build step alone: its latest end would be the market day, which is off for build work.
    const builds = await owner.post(`/api/studios/${studioId}/runways/preview`).send({
      anchorDate: '2027-05-14',
      offsetDays: 0,
      steps: [{ name: 'Assemble', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 0 }],
    });
    expect(builds.body.steps[0].start).toBe('2027-05-12');
  });
});

describe('access to the market routes', () => {
  it('when anonymous 401, crew writing 403, another studio 404', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const { body: market } = await owner.post(`/api/studios/${studioId}/markets`).send(fair);
    const routes = [
      ['get', `/api/studios/${studioId}/markets`, 'read'],
      ['get', `/api/studios/${studioId}/markets/${market.id}`, 'read'],
      ['post', `/api/studios/${studioId}/markets`, 'write'],
      ['put', `/api/studios/${studioId}/markets/${market.id}`, 'write'],
      ['delete', `/api/studios/${studioId}/markets/${market.id}`, 'write'],
    ] as const;
    const anonymous = await anonymousAgent(t.app);
    const crew = await signIn(t.app, members.crew.email);
    const outsider = await signIn(t.app, (await makeStudio(t.db, ['owner'])).members.owner.email);
    for (const [method, url, kind] of routes) {
      expect([url, (await anonymous[method](url).send(fair)).status]).toEqual([url, 401]);
      expect([url, (await crew[method](url).send(fair)).status]).toEqual([url, kind === 'read' ? 200 : 403]);
      expect([url, (await outsider[method](url).send(fair)).status]).toEqual([url, 404]);
    }
    expect((await t.db('markets').where({ id: market.id }).first()).version).toBe(1);
  });
});
