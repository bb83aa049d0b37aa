import request from 'supertest';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { appClock } from '../../server/clock/clock';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('studio settings', () => {
  it('when a member reads the studio, then the settings of DESIGN §7 come back', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members.crew.email);
    const response = await agent.get(`/api/studios/${studioId}`);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      id: studioId,
      name: 'Test studio',
      timezone: 'America/New_York',
      country: 'US',
      region: null,
      weekStart: 1,
      workDays: [1, 2, 3, 4, 5],
      dailyCapacityHours: 8,
      holidaysOff: true,
      channels: ['market', 'booth', 'online', 'wholesale', 'consignment'],
      version: 1,
      role: 'crew',
    });
  });

  it('when the owner patches settings, then they are stored and the version rises', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members.owner.email);
    const response = await agent.patch(`/api/studios/${studioId}`).send({
      name: 'Cedar Lane Studio',
      timezone: 'Europe/London',
      country: 'GB',
      region: 'ENG',
      weekStart: 7,
      workDays: [6, 2, 3, 2],
      dailyCapacityHours: 6.5,
      holidaysOff: false,
    });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ name: 'Cedar Lane Studio', workDays: [2, 3, 6], dailyCapacityHours: 6.5, holidaysOff: false, version: 2 });
    const row = await t.db('studios').where({ id: studioId }).first();
    expect(row).toMatchObject({ timezone: 'Europe/London', country: 'GB', region: 'ENG', week_start: 7, work_days: '2,3,6' });
  });

  it('when the owner sets the sales channels, then the list is stored in its own spelling and read back', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members.owner.email);
    const response = await agent.patch(`/api/studios/${studioId}`).send({ channels: ['market', ' Gallery Shop ', 'online'] });
    expect(response.status).toBe(200);
    expect(response.body.channels).toEqual(['market', 'Gallery Shop', 'online']);
    expect((await agent.get(`/api/studios/${studioId}`)).body.channels).toEqual(['market', 'Gallery Shop', 'online']);
  });

  it('when the version is stale, then 409 carries the current settings', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members.owner.email);
    await agent.patch(`/api/studios/${studioId}`).send({ name: 'First', version: 1 });
    const response = await agent.patch(`/api/studios/${studioId}`).send({ name: 'Second', version: 1 });
    expect(response.status).toBe(409);
    expect(response.body.current.name).toBe('First');
  });

  it.each([
    [{ workDays: [0] }, 'workDays'],
    [{ dailyCapacityHours: 0 }, 'dailyCapacityHours'],
    [{ country: 'usa' }, 'country'],
    [{ timezone: 'Mars/Base' }, 'timezone'],
    [{ weekStart: 3 }, 'weekStart'],
    [{ channels: [] }, 'channels'],
    [{ channels: ['market', 'Market'] }, 'channels'],
    [{ channels: ['market', 'Other'] }, 'channels'],
    [{ channels: ['market', ' '] }, 'channels'],
  ])('when the patch is %j, then 400 names %s', async (patch, field) => {
    const { studioId, members } = await makeStudio(t.db);
    const agent = await signIn(t.app, members.owner.email);
    const response = await agent.patch(`/api/studios/${studioId}`).send(patch);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
  });

  describe('access', () => {
    it('when anonymous, then 401', async () => {
      const { studioId } = await makeStudio(t.db, ['owner']);
      expect((await request(t.app).get(`/api/studios/${studioId}`)).status).toBe(401);
    });

    it.each(['partner', 'crew'] as const)('when a %s patches settings, then 403 and nothing changes', async (role) => {
      const { studioId, members } = await makeStudio(t.db);
      const agent = await signIn(t.app, members[role].email);
      const response = await agent.patch(`/api/studios/${studioId}`).send({ name: 'Taken over' });
      expect(response.status).toBe(403);
      expect((await t.db('studios').where({ id: studioId }).first()).name).toBe('Test studio');
    });

    it('when a member of another studio reads or patches it, then 404', async () => {
      const mine = await makeStudio(t.db, ['owner']);
      const theirs = await makeStudio(t.db, ['owner']);
      const agent = await signIn(t.app, mine.members.owner.email);
      expect((await agent.get(`/api/studios/${theirs.studioId}`)).status).toBe(404);
      expect((await agent.patch(`/api/studios/${theirs.studioId}`).send({ name: 'x' })).status).toBe(404);
      expect((await agent.get('/api/studios/not-a-number')).status).toBe(404);
    });
  });

  it('when a user belongs to two studios, then me lists both with their roles', async () => {
    const first = await makeStudio(t.db, ['owner'], 'Alpha bench');
    const second = await makeStudio(t.db, ['owner'], 'Beta bench');
    await t.db('memberships').insert({ studio_id: second.studioId, user_id: first.members.owner.id, role: 'crew' });
    const agent = await signIn(t.app, first.members.owner.email);
    const me = await agent.get('/api/auth/me');
    expect(me.body.studios).toEqual([
      { id: first.studioId, name: 'Alpha bench', role: 'owner', timezone: 'America/New_York', today: appClock.today('America/New_York') },
      { id: second.studioId, name: 'Beta bench', role: 'crew', timezone: 'America/New_York', today: appClock.today('America/New_York') },
    ]);
    expect((await agent.get(`/api/studios/${second.studioId}`)).body.role).toBe('crew');
  });
});
