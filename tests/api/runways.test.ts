import { DEFAULT_DECOR_TEMPLATE } from '@shared/planning/default-template';
import { anonymousAgent, makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { smallSteps, storeRunway } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const preview = (agent: Awaited<ReturnType<typeof signIn>>, studioId: number, body: unknown) =>
  agent.post(`/api/studios/${studioId}/runways/preview`).send(body as object);

describe('POST /runways/preview', () => {
  it('when steps are given, then the dated plan comes back and nothing is stored', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    // Anchor Fri 2027-05-21, launch 7 days before: Fri 05-14. Paint: latestEnd = 05-14 − 1 − 2 =
    // 05-11 (Tue). Cut: latestEnd = 05-10 (Mon), two work days: Fri 05-07 and Mon 05-10.
    const response = await preview(partner, studioId, { anchorDate: '2027-05-21', offsetDays: 7, steps: smallSteps });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ anchorDate: '2027-05-21', offsetDays: 7, launch: '2027-05-14', start: '2027-05-07', warnings: [] });
    expect(response.body.steps.map((step: { name: string; kind: string; start: string; end: string }) => [step.name, step.kind, step.start, step.end])).toEqual([
      ['Cut', 'build', '2027-05-07', '2027-05-10'],
      ['Paint', 'build', '2027-05-11', '2027-05-11'],
      ['Launch', 'launch', '2027-05-14', '2027-05-14'],
    ]);
    expect(await t.db('events').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('when no steps are given, then the default template is used with its cautions on cutting and finishing', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await preview(owner, studioId, { anchorDate: '2027-11-26', offsetDays: 14 });
    expect(response.status).toBe(200);
    expect(response.body.steps.map((step: { name: string }) => step.name)).toEqual(DEFAULT_DECOR_TEMPLATE.steps.map((step) => step.name));
    const batchCut = response.body.steps.find((step: { name: string }) => step.name === 'Batch cut');
    expect(batchCut.cautions.join(' ')).toMatch(/never PVC or vinyl/);
    expect(response.body.steps.find((step: { name: string }) => step.name === 'Finish').cautions.join(' ')).toMatch(/ventilated/);
    expect(response.body.launch).toBe('2027-11-12');
  });

  it('when the studio already booked hours, then the preview plans around them', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    // 6 hours on Mon 2027-05-10; Cut (4 h) no longer fits in 8 h that day, so it takes Thu 05-06 and Fri 05-07.
    await storeRunway(owner, studioId, { anchorDate: '2027-05-11', offsetDays: 0, steps: [{ name: 'Order', kind: 'build', workDays: 1, hoursPerDay: 6, cureDays: 0 }] });
    const response = await preview(owner, studioId, { anchorDate: '2027-05-21', offsetDays: 7, steps: smallSteps });
    expect(response.body.steps[0]).toMatchObject({ start: '2027-05-06', end: '2027-05-07', days: ['2027-05-06', '2027-05-07'] });
  });

  it('when the runway cannot fit before the anchor, then it warns how many work days short with the first feasible launch', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await preview(owner, studioId, { anchorDate: '2020-03-02', offsetDays: 0, steps: smallSteps });
    expect(response.status).toBe(200);
    expect(response.body.warnings[0]).toMatchObject({ code: 'too-short' });
    expect(response.body.warnings[0].message).toMatch(/too short by 3 work days/);
    expect(response.body.warnings[0].firstFeasibleLaunch > '2026-01-01').toBe(true);
  });

  it('when the anchor is an occasion, a holiday, a market or a theme, then it is resolved to its date', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const market = await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Harvest Barn Fair', place: 'County grounds', start: '2027-10-02', rrule: 'FREQ=YEARLY' });
    const [themeId] = await t.db('themes').insert({ studio_id: studioId, name: 'Pumpkin signs', status: 'picked', target_kind: 'occasion', target_value: 'halloween:2027-10-31', offset_days: 10 });
    const cases: [unknown, string, number][] = [
      // 36 U.S.C. 117: Mother's Day is the second Sunday of May (2027-05-09).
      [{ kind: 'occasion', value: 'mothers-day:2027-05-09' }, '2027-05-09', 0],
      // OPM: Thanksgiving Day 2027 is Thursday November 25.
      [{ kind: 'holiday', value: 'us-thanksgiving-day:2027-11-25' }, '2027-11-25', 0],
      [{ kind: 'market', value: `${market.body.id}:2027-10-02` }, '2027-10-02', 0],
      [{ kind: 'theme', value: String(themeId) }, '2027-10-31', 10],
      [{ kind: 'date', value: '2027-08-01' }, '2027-08-01', 0],
    ];
    for (const [anchor, date, offsetDays] of cases) {
      const response = await preview(owner, studioId, { anchor, steps: smallSteps });
      expect([anchor, response.status, response.body.anchorDate, response.body.offsetDays]).toEqual([anchor, 200, date, offsetDays]);
    }
    const bare = await preview(owner, studioId, { anchor: { kind: 'occasion', value: 'halloween' }, steps: smallSteps });
    expect(bare.body.anchorDate).toMatch(/-10-31$/);
  });

  it.each([
    [{ offsetDays: 3, steps: smallSteps }, 'anchorDate'],
    [{ anchorDate: '2027-02-30', steps: smallSteps }, 'anchorDate'],
    [{ anchorDate: '2027-05-01', offsetDays: -1 }, 'offsetDays'],
    [{ anchorDate: '2027-05-01', steps: [{ name: 'Cut', kind: 'sand', workDays: 1, hoursPerDay: 2, cureDays: 0 }] }, 'steps'],
    [{ anchorDate: '2027-05-01', templateId: 999999 }, 'templateId'],
    [{ anchor: { kind: 'occasion', value: 'no-such-day' } }, 'anchor'],
    [{ anchor: { kind: 'market', value: '999999' } }, 'anchor'],
  ])('when the body is %j, then 400 names %s', async (body, field) => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const response = await preview(owner, studioId, body);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
  });

  it('when the calendar has no room at all, then 422 says so', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    // Every day off for four years: the backward pass gives up at its three-year bound.
    await owner.put(`/api/studios/${studioId}/blackouts`).send({ blackouts: [{ start: '2024-01-01', end: '2027-12-31' }] });
    const response = await preview(owner, studioId, { anchorDate: '2027-12-01', offsetDays: 0, steps: smallSteps });
    expect(response.status).toBe(422);
    expect(response.body.error).toMatchObject({ code: 'runway_no_room' });
  });
});

describe('POST /runways and reading them back', () => {
  it('when a theme is planned, then each step is a stored event linked to the theme and runway, with a version', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const [themeId] = await t.db('themes').insert({ studio_id: studioId, name: 'Herb garden', status: 'picked' });
    const runway = await storeRunway(owner, studioId, { anchorDate: '2027-05-21', offsetDays: 7, steps: smallSteps, themeId });
    expect(runway).toMatchObject({ name: 'Herb garden', themeId, themeName: 'Herb garden', launch: '2027-05-14', anchorDate: '2027-05-21', offsetDays: 7 });
    const rows = await t.db('events').where({ runway_id: runway.id }).orderBy('step_index');
    expect(rows.map((row) => [row.title, row.kind, row.start_date, row.end_date, row.theme_id, row.version])).toEqual([
      ['Cut', 'build', '2027-05-07', '2027-05-10', themeId, 1],
      ['Paint', 'build', '2027-05-11', '2027-05-11', themeId, 1],
      ['Launch', 'launch', '2027-05-14', '2027-05-14', themeId, 1],
    ]);
    expect(Number(rows[0].hours_per_day)).toBe(4);
    expect(rows[1].cure_days).toBe(2);

    const list = await owner.get(`/api/studios/${studioId}/runways`);
    expect(list.body.map((item: { id: number }) => item.id)).toEqual([runway.id]);
    const one = await owner.get(`/api/studios/${studioId}/runways/${runway.id}`);
    expect(one.body.steps.map((step: { name: string; version: number }) => [step.name, step.version])).toEqual([
      ['Cut', 1],
      ['Paint', 1],
      ['Launch', 1],
    ]);
  });

  it('when placement is tray, then the steps are stored without dates', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, { anchorDate: '2027-05-21', offsetDays: 7, placement: 'tray' });
    const rows = await t.db('events').where({ runway_id: runway.id });
    expect(rows).toHaveLength(DEFAULT_DECOR_TEMPLATE.steps.length);
    expect(rows.every((row) => row.start_date === null && row.end_date === null)).toBe(true);
    expect((await t.db('runways').where({ id: runway.id }).first()).template).toBe('default');
  });

  it('when the theme belongs to another studio, then 400 names themeId and nothing is stored', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const other = await makeStudio(t.db, ['owner']);
    const [foreignTheme] = await t.db('themes').insert({ studio_id: other.studioId, name: 'Not ours', status: 'picked' });
    const owner = await signIn(t.app, members.owner.email);
    const response = await owner.post(`/api/studios/${studioId}/runways`).send({ anchorDate: '2027-05-21', steps: smallSteps, themeId: foreignTheme });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(['themeId']);
    expect(await t.db('runways').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('when a runway is deleted, then its steps go with it', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const runway = await storeRunway(partner, studioId, { anchorDate: '2027-05-21', steps: smallSteps });
    expect((await partner.delete(`/api/studios/${studioId}/runways/${runway.id}`)).status).toBe(204);
    expect(await t.db('events').where({ runway_id: runway.id }).count({ n: '*' }).first()).toEqual({ n: 0 });
    expect((await partner.get(`/api/studios/${studioId}/runways/${runway.id}`)).status).toBe(404);
  });
});

describe('runway templates', () => {
  it('when a planner keeps, changes and deletes a template of their own, then the list shows the built-in ones first', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const base = `/api/studios/${studioId}/runway-templates`;
    const initial = await partner.get(base);
    expect(initial.body[0]).toEqual(expect.objectContaining({ id: 'default', isBuiltIn: true, name: 'Laser-cut decor line' }));
    expect(initial.body.every((template: { isBuiltIn: boolean }) => template.isBuiltIn)).toBe(true);
    const created = await partner.post(base).send({ name: 'Quick sign', steps: smallSteps });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: 'Quick sign', isBuiltIn: false, version: 1, steps: [expect.objectContaining({ name: 'Cut' }), expect.anything(), expect.anything()] });
    const updated = await partner.put(`${base}/${created.body.id}`).send({ name: 'Quick sign v2', steps: smallSteps.slice(0, 2), version: 1 });
    expect(updated.body).toMatchObject({ name: 'Quick sign v2', version: 2 });
    expect((await partner.put(`${base}/${created.body.id}`).send({ name: 'Stale', steps: smallSteps, version: 1 })).status).toBe(409);
    // The template plans a preview by id.
    const planned = await preview(partner, studioId, { anchorDate: '2027-05-21', templateId: created.body.id });
    expect(planned.body.steps.map((step: { name: string }) => step.name)).toEqual(['Cut', 'Paint']);
    expect((await partner.put(`${base}/default`).send({ name: 'Mine', steps: smallSteps })).status).toBe(400);
    expect((await partner.delete(`${base}/default`)).status).toBe(400);
    expect((await partner.delete(`${base}/${created.body.id}`)).status).toBe(204);
    expect((await partner.get(`${base}/${created.body.id}`)).status).toBe(404);
  });

  it('when a template has no steps or a bad step, then 400 names it', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const base = `/api/studios/${studioId}/runway-templates`;
    expect((await owner.post(base).send({ name: 'Empty', steps: [] })).body.error.issues[0].path).toEqual(['steps']);
    const bad = await owner.post(base).send({ name: 'Bad', steps: [{ name: 'Cut', kind: 'build', workDays: 1.5, hoursPerDay: 2, cureDays: 0 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toEqual(['steps', 0, 'workDays']);
  });
});

describe('access to the runway routes', () => {
  async function setUp() {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    const runway = await storeRunway(owner, studioId, { anchorDate: '2027-05-21', steps: smallSteps });
    const template = (await owner.post(`/api/studios/${studioId}/runway-templates`).send({ name: 'Mine', steps: smallSteps })).body;
    return { studioId, members, runway, template };
  }
  const body = { anchorDate: '2027-05-21', steps: smallSteps, name: 'Mine' };
  const reads = (studioId: number, runwayId: number, templateId: number) => [
    ['get', `/api/studios/${studioId}/runways`],
    ['get', `/api/studios/${studioId}/runways/${runwayId}`],
    ['get', `/api/studios/${studioId}/runway-templates`],
    ['get', `/api/studios/${studioId}/runway-templates/${templateId}`],
  ] as const;
  const writes = (studioId: number, runwayId: number, templateId: number) => [
    ['post', `/api/studios/${studioId}/runways/preview`],
    ['post', `/api/studios/${studioId}/runways`],
    ['delete', `/api/studios/${studioId}/runways/${runwayId}`],
    ['post', `/api/studios/${studioId}/runway-templates`],
    ['put', `/api/studios/${studioId}/runway-templates/${templateId}`],
    ['delete', `/api/studios/${studioId}/runway-templates/${templateId}`],
  ] as const;

  it('when anonymous, then 401 everywhere', async () => {
    const { studioId, runway, template } = await setUp();
    const agent = await anonymousAgent(t.app);
    for (const [method, url] of [...reads(studioId, runway.id, template.id), ...writes(studioId, runway.id, template.id)]) {
      expect([method, url, (await agent[method](url).send(body)).status]).toEqual([method, url, 401]);
    }
  });

  it('when crew read, then 200; when crew write, then 403 and nothing changes', async () => {
    const { studioId, members, runway, template } = await setUp();
    const crew = await signIn(t.app, members.crew.email);
    for (const [method, url] of reads(studioId, runway.id, template.id)) expect([url, (await crew[method](url)).status]).toEqual([url, 200]);
    for (const [method, url] of writes(studioId, runway.id, template.id)) {
      expect([method, url, (await crew[method](url).send(body)).status]).toEqual([method, url, 403]);
    }
    expect(await t.db('runways').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it('when a member of another studio asks, then 404 everywhere', async () => {
    const { studioId, runway, template } = await setUp();
    const other = await makeStudio(t.db, ['owner']);
    const outsider = await signIn(t.app, other.members.owner.email);
    for (const [method, url] of [...reads(studioId, runway.id, template.id), ...writes(studioId, runway.id, template.id)]) {
      expect([method, url, (await outsider[method](url).send(body)).status]).toEqual([method, url, 404]);
    }
    // Through their own studio, the ids of the first are not found either.
    expect((await outsider.get(`/api/studios/${other.studioId}/runways/${runway.id}`)).status).toBe(404);
    expect((await outsider.get(`/api/studios/${other.studioId}/runway-templates/${template.id}`)).status).toBe(404);
  });
});
