import { anonymousAgent, makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { eventsOf } from './events-fixtures';
import { addStep } from './feeds-fixtures';
import { appClock, fixedClock, useClock } from '../../server/clock/clock';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const settings = {
  custom: [{ name: 'Harvest open studio', rrule: 'FREQ=YEARLY;BYMONTH=9;BYDAY=3SA', start: '2026-01-01', sellWindowDays: 10 }],
  sellWindows: { 'mothers-day': 28 },
  backToSchool: '08-17',
};

describe('occasion settings', () => {
  it('when nothing is set, then the built-in occasions of the country come with their default sell windows', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    const response = await crew.get(`/api/studios/${studioId}/occasions`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ custom: [], sellWindows: {}, backToSchool: null });
    expect(response.body.builtIn).toContainEqual({ key: 'mothers-day', name: "Mother's Day", sellWindowDays: 21, defaultSellWindowDays: 21 });
    expect(response.body.builtIn.map((occasion: { key: string }) => occasion.key)).toContain('back-to-school');
  });

  it('when the studio sets its own occasion, a sell window and back-to-school, then the calendar shows them', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const saved = await partner.put(`/api/studios/${studioId}/occasions`).send(settings);
    expect(saved.status).toBe(200);
    expect(saved.body.custom).toEqual([expect.objectContaining({ key: 'custom-harvest-open-studio', name: 'Harvest open studio', sellWindowDays: 10 })]);
    expect(saved.body.builtIn).toContainEqual(expect.objectContaining({ key: 'mothers-day', sellWindowDays: 28, defaultSellWindowDays: 21 }));
    expect((await t.db('studios').where({ id: studioId }).first()).back_to_school).toBe('08-17');

    // 1 September 2027 is a Wednesday: Saturdays 4, 11, 18, so the third is the 18th.
    const september = await eventsOf(partner, studioId, '2027-09-01', '2027-09-30');
    expect(september).toContainEqual(expect.objectContaining({ id: 'occasion:custom-harvest-open-studio:2027-09-18', sellWindowStart: '2027-09-08' }));
    const august = await eventsOf(partner, studioId, '2027-08-01', '2027-08-31');
    expect(august).toContainEqual(expect.objectContaining({ id: 'occasion:back-to-school:2027-08-17', sellWindowStart: '2027-07-20' }));
    // 36 U.S.C. 117: second Sunday in May, 2027-05-09; the 28-day window opens on 2027-04-11.
    const may = await eventsOf(partner, studioId, '2027-05-01', '2027-05-31');
    expect(may).toContainEqual(expect.objectContaining({ id: 'occasion:mothers-day:2027-05-09', sellWindowStart: '2027-04-11' }));
  });

  it.each([
    [{ custom: [{ name: 'Bad', rrule: 'FREQ=YEARLY;BYMONTH=13' }] }, ['custom', 0, 'rrule']],
    [{ custom: [{ name: 'No dates' }] }, ['custom', 0, 'rrule']],
    [{ custom: [{ name: 'Twice', dates: ['2027-01-01'] }, { name: 'Twice', dates: ['2027-02-01'] }] }, ['custom', 1, 'name']],
    [{ sellWindows: { 'no-such-day': 3 } }, ['sellWindows', 'no-such-day']],
    [{ sellWindows: { halloween: 400 } }, ['sellWindows', 'halloween']],
    [{ backToSchool: '13-40' }, ['backToSchool']],
  ])('when the settings have %j, then 400 names %j and nothing changes', async (change, path) => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.put(`/api/studios/${studioId}/occasions`).send(settings)).status).toBe(200);
    const response = await owner.put(`/api/studios/${studioId}/occasions`).send({ ...settings, ...change });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(path);
    const after = await owner.get(`/api/studios/${studioId}/occasions`);
    expect(after.body).toMatchObject({ sellWindows: { 'mothers-day': 28 }, backToSchool: '08-17', custom: [expect.objectContaining({ name: 'Harvest open studio' })] });
  });
});

describe('GET /occasions/upcoming', () => {
  it('when asked for a window, then occasions, holidays and market days come sorted, each usable as an anchor', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const { body: market } = await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Orchard Row Market', place: 'Orchard Row', start: '2027-05-01', rrule: 'FREQ=WEEKLY;BYDAY=SA' });
    const response = await owner.get(`/api/studios/${studioId}/occasions/upcoming?from=2027-05-01&to=2027-05-31`);
    expect(response.status).toBe(200);
    const targets = response.body as { kind: string; value: string; date: string; name: string }[];
    expect(targets.map((target) => target.date)).toEqual([...targets.map((target) => target.date)].sort());
    expect(targets).toContainEqual(expect.objectContaining({ kind: 'occasion', value: 'mothers-day:2027-05-09', date: '2027-05-09', sellWindowStart: '2027-04-18' }));
    // OPM: Memorial Day 2027 is Monday May 31.
    expect(targets).toContainEqual(expect.objectContaining({ kind: 'holiday', date: '2027-05-31' }));
    expect(targets.filter((target) => target.kind === 'market').map((target) => target.date)).toEqual(['2027-05-01', '2027-05-08', '2027-05-15', '2027-05-22', '2027-05-29']);
    for (const target of targets) {
      const planned = await owner.post(`/api/studios/${studioId}/runways/preview`).send({ anchor: { kind: target.kind, value: target.value }, steps: [{ name: 'Make', kind: 'build', workDays: 1, hoursPerDay: 2, cureDays: 0 }] });
      expect([target.value, planned.status, planned.body.anchorDate]).toEqual([target.value, 200, target.date]);
    }
    expect(targets.find((target) => target.kind === 'market')!.value).toBe(`${market.id}:2027-05-01`);
  });

  it('when the window is reversed or too long, then 400 names to', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    for (const query of ['from=2027-05-31&to=2027-05-01', 'from=2027-01-01&to=2030-01-01']) {
      const response = await crew.get(`/api/studios/${studioId}/occasions/upcoming?${query}`);
      expect(response.status).toBe(400);
      expect(response.body.error.issues[0].path).toEqual(['to']);
    }
  });
});

describe('blackouts', () => {
  it('when blackout days are set, then they replace the old list and are read back', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-01-04' }] });
    const response = await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-08-02', end: '2027-08-13', note: 'Summer break' }, { start: '2027-06-18' }] });
    expect(response.status).toBe(200);
    expect(response.body).toEqual([
      { start: '2027-06-18', end: '2027-06-18', note: null },
      { start: '2027-08-02', end: '2027-08-13', note: 'Summer break' },
    ]);
    // The planner walks around the break: a one-day step due by Mon 2027-08-16 lands on Fri 07-30.
    const planned = await owner.post(`/api/studios/${studioId}/runways/preview`).send({ anchorDate: '2027-08-16', steps: [{ name: 'Make', kind: 'build', workDays: 1, hoursPerDay: 2, cureDays: 0 }] });
    expect(planned.body.steps[0].start).toBe('2027-07-30');
  });

  it('when a blackout ends before it starts, then 400 names it and the old list stays', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-01-04' }] });
    const response = await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2027-08-13', end: '2027-08-02' }] });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(['blackouts', 0, 'end']);
    expect((await owner.get(`/api/studios/${studioId}/blackouts`)).body).toEqual([{ start: '2027-01-04', end: '2027-01-04', note: null }]);
  });
});

describe('studio holiday place', () => {
  it.each([
    [{ country: 'GB', region: 'ENG' }, 200, null],
    [{ country: 'CA', region: 'ON' }, 200, null],
    [{ country: 'GB', region: 'ZZ' }, 400, 'region'],
    [{ country: 'XX' }, 400, 'country'],
    [{ region: 'ON' }, 400, 'region'],
  ])('when the owner sets %j, then %i', async (patch, status, field) => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.patch(`/api/studios/${studioId}`).send(patch);
    expect(response.status).toBe(status);
    if (field) {
      expect(response.body.error.issues[0].path).toEqual([field]);
      expect((await t.db('studios').where({ id: studioId }).first()).country).toBe('US');
    }
  });

  it('when the studio is in England, then the calendar has the UK government’s bank holidays', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    await owner.patch(`/api/studios/${studioId}`).send({ country: 'GB', region: 'ENG' });
    // gov.uk bank holidays (England and Wales) 2026: Good Friday 3 April, Easter Monday 6 April,
    // Early May 4 May, Spring 25 May, Summer 31 August, Boxing Day substitute Monday 28 December.
    const holidays = (await eventsOf(owner, studioId, '2026-04-01', '2026-12-31')).filter((event) => event.kind === 'holiday').map((event) => event.start);
    expect(holidays).toEqual(['2026-04-03', '2026-04-06', '2026-05-04', '2026-05-25', '2026-08-31', '2026-12-25', '2026-12-28']);
  });
});

describe('studio summary', () => {
  it('when steps fall in the next 30 days, then upcomingCount counts them (and not later or done ones)', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const inDays = (days: number) => new Date(appClock.now().getTime() + days * 86_400_000).toISOString().slice(0, 10);
    const steps = [
      { name: 'Make', kind: 'build', workDays: 2, hoursPerDay: 2, cureDays: 0 },
      { name: 'Launch', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0 },
    ];
    const near = await owner.post(`/api/studios/${studioId}/runways`).send({ anchorDate: inDays(14), steps });
    await owner.post(`/api/studios/${studioId}/runways`).send({ anchorDate: inDays(200), steps });
    expect((await owner.get(`/api/studios/${studioId}/summary`)).body.upcomingCount).toBe(2);
    await t.db('events').where({ id: Number(near.body.steps[0].id) }).update({ done: true });
    expect((await owner.get(`/api/studios/${studioId}/summary`)).body.upcomingCount).toBe(1);
  });

  it("when the studio's clock is on another day than the server's, then today is the studio's", async () => {
    // UTC+14 and UTC−11: at 18:00 UTC Kiritimati is on the next date, at 02:00 UTC Pago Pago on the one
    // before. Their dates come from the ECMAScript Intl API (a general-purpose reference, not our own date code).
    for (const [timezone, instant] of [['Pacific/Kiritimati', '2027-03-06T18:00:00Z'], ['Pacific/Pago_Pago', '2027-03-06T02:00:00Z']]) {
      const restore = useClock(fixedClock(instant));
      const { studioId, members } = await makeStudio(t.db);
      await t.db('studios').where({ id: studioId }).update({ timezone });
      const today = new Intl.DateTimeFormat('en-CA', { timeZone: timezone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(appClock.now());
      const dayBefore = new Date(Date.parse(`${today}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
      await addStep(t.db, studioId, { title: 'Ended the day before', start: dayBefore });
      await addStep(t.db, studioId, { title: 'Ends today', start: today });
      const owner = await signIn(t.app, members.owner.email);
      expect([timezone, today === '2027-03-06', (await owner.get(`/api/studios/${studioId}/summary`)).body.upcomingCount]).toEqual([timezone, false, 1]);
      restore();
    }
  });
});

describe('access to the occasion and blackout routes', () => {
  it('when anonymous 401, crew writing 403, another studio 404', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const routes = [
      ['get', `/api/studios/${studioId}/occasions`, 'read', {}],
      ['put', `/api/studios/${studioId}/occasions`, 'write', settings],
      ['get', `/api/studios/${studioId}/occasions/upcoming`, 'read', {}],
      ['get', `/api/studios/${studioId}/blackouts`, 'read', {}],
      ['put', `/api/studios/${studioId}/blackouts`, 'write', { blackouts: [] }],
    ] as const;
    const anonymous = await anonymousAgent(t.app);
    const crew = await signIn(t.app, members.crew.email);
    const outsider = await signIn(t.app, (await makeStudio(t.db, ['owner'])).members.owner.email);
    for (const [method, url, kind, body] of routes) {
      expect([url, (await anonymous[method](url).send(body)).status]).toEqual([url, 401]);
      expect([url, (await crew[method](url).send(body)).status]).toEqual([url, kind === 'read' ? 200 : 403]);
      expect([url, (await outsider[method](url).send(body)).status]).toEqual([url, 404]);
    }
    expect((await t.db('studios').where({ id: studioId }).first()).back_to_school).toBeNull();
  });
});
