import { fixedClock, useClock } from '../../server/clock/clock';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';

let t: TestApp;
let restoreClock = () => {};
beforeAll(() => {
  t = makeTestApp();
  // A fixed today, so the pick's month and the runway's dates stay the same on any day.
  restoreClock = useClock(fixedClock('2027-03-03T15:00:00Z'));
});
afterAll(async () => {
  restoreClock();
  await t.close();
});

async function pickedTheme() {
  const { studioId, members } = await makeStudio(t.db);
  const owner = await signIn(t.app, members.owner.email);
  const base = `/api/studios/${studioId}/themes`;
  const created = (await owner.post(base).send({ name: 'Paper lantern kits' })).body;
  const picked = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'month', value: '2027-06' }, offsetDays: 0, version: created.version });
  expect(picked.status).toBe(200);
  return { studioId, members, owner, themeId: created.id as number, targetDate: picked.body.target.date as string, base };
}

describe('a theme follows its runway', () => {
  it('when a runway is planned for a picked theme, then the theme is building; its launch ticked done launches it, unticked it is building again, each in its history', async () => {
    const { studioId, owner, themeId, targetDate, base } = await pickedTheme();
    const runway = await owner.post(`/api/studios/${studioId}/runways`).send({ anchorDate: targetDate, offsetDays: 0, templateId: 'default', themeId });
    expect(runway.status).toBe(201);
    expect(runway.body.preview.warnings.filter((warning: { code: string }) => warning.code === 'other-target')).toEqual([]);
    expect((await owner.get(`${base}/${themeId}`)).body.status).toBe('building');

    const launch = await t.db('events').where({ studio_id: studioId, runway_id: runway.body.id, kind: 'launch' }).first();
    expect((await owner.patch(`/api/studios/${studioId}/events/${launch.id}`).send({ done: true, version: launch.version })).status).toBe(200);
    expect((await owner.get(`${base}/${themeId}`)).body.status).toBe('launched');
    expect((await owner.patch(`/api/studios/${studioId}/events/${launch.id}`).send({ done: false, version: launch.version + 1 })).status).toBe(200);
    const theme = (await owner.get(`${base}/${themeId}`)).body;
    expect(theme.status).toBe('building');
    expect(theme.history.map((entry: { from: string | null; to: string }) => `${entry.from ?? '·'}→${entry.to}`)).toEqual(['·→idea', 'idea→picked', 'picked→building', 'building→launched', 'launched→building']);
  });

  it('when a runway for a theme plans back from another day than its target, then the answer warns which', async () => {
    const { studioId, owner, themeId, targetDate } = await pickedTheme();
    const runway = await owner.post(`/api/studios/${studioId}/runways`).send({ anchorDate: '2027-08-14', offsetDays: 0, templateId: 'default', themeId });
    expect(runway.status).toBe(201);
    expect(runway.body.preview.warnings).toContainEqual({ code: 'other-target', message: `Paper lantern kits is picked for ${targetDate}; this runway plans back from 2027-08-14`, dates: [targetDate, '2027-08-14'] });
  });
});
