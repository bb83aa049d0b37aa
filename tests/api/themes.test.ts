// The themes API (issue 4): CRUD, status transitions with who and when, pick for a target (owner),
// optimistic concurrency, and the theme score by scoreTheme (docs/decisions/0002-heat-weights.md).
import request from 'supertest';
import { scoreSeries } from '@shared/scoring/score-series';
import { scoreTheme } from '@shared/scoring/score-theme';
import { anonymousAgent, makeStudio, signIn } from '../helpers/test-app';
import { fixedToday, insertSeries, useTrendsTestApp, viaJson } from './series-test-data';

const app = useTrendsTestApp();
const today = fixedToday;
const json = viaJson;

async function setup() {
  const studio = await makeStudio(app().db);
  const a = await insertSeries(app().db, studio.studioId, { term: 'herb planter', crest: 18, growth: 0.004, seed: 11 });
  const b = await insertSeries(app().db, studio.studioId, { term: 'seed box', crest: 14, seed: 12 });
  const owner = await signIn(app().app, studio.members.owner.email);
  return { ...studio, a, b, owner, base: `/api/studios/${studio.studioId}/themes` };
}

describe('themes', () => {
  it('when a partner creates a theme, then it is stored with members, items and a first history entry', async () => {
    const { studioId, members, a, b, base } = await setup();
    const partner = await signIn(app().app, members.partner.email);
    const response = await partner.post(base).send({ name: ' Herb garden ', seriesIds: [a.id, b.id, a.id], items: ['Herb rack', 'herb rack', 'Trowel hook'], notes: 'Spring line' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ name: 'Herb garden', status: 'idea', seriesIds: [a.id, b.id], items: ['Herb rack', 'Trowel hook'], target: null, offsetDays: 0, notes: 'Spring line', version: 1 });
    expect(response.body.statusChangedBy).toEqual({ id: members.partner.id, name: 'partner person' });
    expect(response.body.history).toEqual([{ from: null, to: 'idea', target: null, targetLabel: null, by: { id: members.partner.id, name: 'partner person' }, at: expect.any(String) }]);
    expect(response.body.members.map((member: { term: string }) => member.term).sort()).toEqual(['herb planter', 'seed box']);
    const stored = await app().db('themes').where({ id: response.body.id }).first();
    expect(stored).toMatchObject({ studio_id: studioId, name: 'Herb garden', created_by: members.partner.id });
    expect(await app().db('theme_series').where({ theme_id: response.body.id }).orderBy('series_id').pluck('series_id')).toEqual([a.id, b.id].sort((x, y) => x - y));
    expect(await app().db('theme_items').where({ theme_id: response.body.id }).orderBy('item').pluck('item')).toEqual(['Herb rack', 'Trowel hook']);
    const list = await partner.get(base);
    expect(list.body.map((theme: { id: number }) => theme.id)).toEqual([response.body.id]);
  });

  it('when the theme has no target, then its score is scoreTheme of the members scored for their own next peaks', async () => {
    const { a, b, owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Herb garden', seriesIds: [a.id, b.id] })).body;
    const expected = scoreTheme([scoreSeries(a.points, { period: 'weekly', today }), scoreSeries(b.points, { period: 'weekly', today })]);
    expect(created.score).toEqual(json(expected));
  });

  it('when the owner picks the theme for a month with an offset, then status, target, history and score follow', async () => {
    const { members, a, b, owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Herb garden', seriesIds: [a.id, b.id] })).body;
    const response = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'month', value: '2026-05' }, offsetDays: 14, version: created.version });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ status: 'picked', offsetDays: 14, version: 2, target: { kind: 'month', value: '2026-05', date: '2026-05-01', label: 'May 2026' } });
    expect(response.body.window).toMatchObject({ from: '2026-05-01', to: '2026-05-31' });
    expect(response.body.history.map((entry: { to: string; target: string | null }) => [entry.to, entry.target])).toEqual([['idea', null], ['picked', '2026-05']]);
    expect(response.body.history[1].by.id).toBe(members.owner.id);
    const target = { from: '2026-05-01', to: '2026-05-31' };
    const expected = scoreTheme([scoreSeries(a.points, { period: 'weekly', today, target }), scoreSeries(b.points, { period: 'weekly', today, target })]);
    expect(response.body.score).toEqual(json(expected));
    const stored = await app().db('themes').where({ id: created.id }).first();
    expect(stored).toMatchObject({ status: 'picked', target_kind: 'month', target_value: '2026-05', target_date: '2026-05-01', offset_days: 14, status_changed_by: members.owner.id });
  });

  it('when the owner picks for an occasion, then the target resolves to its next date', async () => {
    const { owner, base, a } = await setup();
    const created = (await owner.post(base).send({ name: 'Garden gift', seriesIds: [a.id] })).body;
    const response = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'occasion', value: 'mothers-day' }, offsetDays: 21, version: 1 });
    expect(response.status).toBe(200);
    // Second Sunday of May 2026 (from memory; shared/calendar/occasions.spec.ts checks the rule).
    expect(response.body.target).toMatchObject({ kind: 'occasion', value: 'mothers-day', date: '2026-05-10' });
    const unknown = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'occasion', value: 'no-such-day' }, version: 2 });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.issues[0].path).toEqual(['target']);
  });

  it('when the owner picks for a market, then the target is its next day', async () => {
    const { studioId, owner, base } = await setup();
    const [marketId] = await app().db('markets').insert({ studio_id: studioId, name: 'Harvest fair', start: '2026-09-19' });
    const created = (await owner.post(base).send({ name: 'Fair stock' })).body;
    const response = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'market', value: String(marketId) }, offsetDays: 7, version: 1 });
    expect(response.status).toBe(200);
    expect(response.body.target).toEqual({ kind: 'market', value: String(marketId), date: '2026-09-19', label: 'Harvest fair 2026-09-19' });
    expect(response.body.window).toMatchObject({ from: '2026-08-22', to: '2026-09-19' });
  });

  it('when the status moves along, then each change is recorded with who and when, and a jump is refused', async () => {
    const { members, owner, base } = await setup();
    const partner = await signIn(app().app, members.partner.email);
    const created = (await owner.post(base).send({ name: 'Lantern line' })).body;
    const shortlisted = await partner.post(`${base}/${created.id}/status`).send({ status: 'shortlisted', version: 1 });
    expect(shortlisted.status).toBe(200);
    expect(shortlisted.body).toMatchObject({ status: 'shortlisted', version: 2, statusChangedBy: { id: members.partner.id } });
    const jump = await owner.post(`${base}/${created.id}/status`).send({ status: 'launched', version: 2 });
    expect(jump.status).toBe(409);
    expect(jump.body.error.code).toBe('invalid_transition');
    const unpicked = await owner.post(`${base}/${created.id}/status`).send({ status: 'picked', version: 2 });
    expect(unpicked.status).toBe(400);
    const picked = await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'date', value: '2026-06-20' }, version: 2 });
    const building = await partner.post(`${base}/${created.id}/status`).send({ status: 'building', version: picked.body.version });
    expect(building.body.status).toBe('building');
    const history = await app().db('theme_status_history').where({ theme_id: created.id }).orderBy('id');
    expect(history.map((row) => [row.from_status, row.to_status, row.changed_by])).toEqual([
      [null, 'idea', members.owner.id],
      ['idea', 'shortlisted', members.partner.id],
      ['shortlisted', 'picked', members.owner.id],
      ['picked', 'building', members.partner.id],
    ]);
    expect(history.every((row) => row.changed_at instanceof Date)).toBe(true);
  });

  it('when a partner tries to pick or drop a pick, then 403 and nothing changes', async () => {
    const { members, owner, base } = await setup();
    const partner = await signIn(app().app, members.partner.email);
    const created = (await owner.post(base).send({ name: 'Lantern line' })).body;
    expect((await partner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'month', value: '2026-05' }, version: 1 })).status).toBe(403);
    await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'month', value: '2026-05' }, version: 1 });
    expect((await partner.post(`${base}/${created.id}/status`).send({ status: 'shortlisted', version: 2 })).status).toBe(403);
    expect((await app().db('themes').where({ id: created.id }).first()).status).toBe('picked');
  });

  it('when two people edit from the same version, then the second gets 409 with the current theme', async () => {
    const { members, owner, base, a } = await setup();
    const partner = await signIn(app().app, members.partner.email);
    const created = (await owner.post(base).send({ name: 'Lantern line' })).body;
    const first = await partner.patch(`${base}/${created.id}`).send({ name: 'Lantern line, autumn', seriesIds: [a.id], items: ['Paper lantern'], version: 1 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ name: 'Lantern line, autumn', seriesIds: [a.id], items: ['Paper lantern'], version: 2 });
    const second = await owner.patch(`${base}/${created.id}`).send({ notes: 'late', version: 1 });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('version_conflict');
    expect(second.body.current).toMatchObject({ name: 'Lantern line, autumn', version: 2 });
    expect((await app().db('themes').where({ id: created.id }).first()).notes).toBeNull();
  });

  it.each([
    [{ name: '' }, 'name'],
    [{ name: 'x'.repeat(121) }, 'name'],
    [{ name: 'ok', seriesIds: ['1'] }, 'seriesIds'],
    [{ name: 'ok', items: [''] }, 'items'],
    [{ name: 'ok', status: 'picked' }, 'status'],
  ])('when the new theme is %j, then 400 names %s and nothing is stored', async (body, field) => {
    const { studioId, owner, base } = await setup();
    const response = await owner.post(base).send(body);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
    expect(await app().db('themes').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it("when a theme names another studio's series, then 400 names that series and nothing is stored", async () => {
    const { studioId, owner, base, a } = await setup();
    const other = await setup();
    const response = await owner.post(base).send({ name: 'Mixed', seriesIds: [a.id, other.a.id] });
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: ['seriesIds', 1], message: `No series with id ${other.a.id} in this studio` }]);
    expect(await app().db('themes').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it.each([
    [{ target: { kind: 'month', value: '2026-5' }, version: 1 }, 'target'],
    [{ target: { kind: 'market', value: '3' }, version: 1 }, 'target'],
    [{ target: { kind: 'month', value: '2026-05' }, offsetDays: -3, version: 1 }, 'offsetDays'],
    [{ target: { kind: 'month', value: '2026-05' } }, 'version'],
  ])('when the pick is %j, then 400 names %s', async (body, field) => {
    const { owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Lantern line' })).body;
    const response = await owner.post(`${base}/${created.id}/pick`).send(body);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
  });

  it('when the owner deletes a theme, then it and its links are gone', async () => {
    const { owner, base, a } = await setup();
    const created = (await owner.post(base).send({ name: 'Lantern line', seriesIds: [a.id], items: ['Paper lantern'] })).body;
    expect((await owner.delete(`${base}/${created.id}`)).status).toBe(204);
    expect(await app().db('theme_series').where({ theme_id: created.id })).toEqual([]);
    expect(await app().db('theme_items').where({ theme_id: created.id })).toEqual([]);
    expect((await owner.get(`${base}/${created.id}`)).status).toBe(404);
  });

  describe('access', () => {
    type Call = [string, 'get' | 'post' | 'patch' | 'delete', (id: number) => string, object | undefined];
    const calls: Call[] = [
      ['list', 'get', () => '', undefined],
      ['create', 'post', () => '', { name: 'New' }],
      ['read', 'get', (id) => `/${id}`, undefined],
      ['edit', 'patch', (id) => `/${id}`, { name: 'Renamed', version: 1 }],
      ['status', 'post', (id) => `/${id}/status`, { status: 'shortlisted', version: 1 }],
      ['pick', 'post', (id) => `/${id}/pick`, { target: { kind: 'month', value: '2026-05' }, version: 1 }],
      ['delete', 'delete', (id) => `/${id}`, undefined],
    ];
    const send = (agent: Awaited<ReturnType<typeof anonymousAgent>>, method: Call[1], url: string, body?: object) =>
      body === undefined ? agent[method](url) : agent[method](url).send(body);

    it.each(calls)('when anonymous calls %s, then 401', async (_name, method, path, body) => {
      const { base, owner } = await setup();
      const created = (await owner.post(base).send({ name: 'Mine' })).body;
      // With a CSRF token but no session, so the 401 comes from the missing sign-in.
      const anonymous = await anonymousAgent(app().app);
      expect((await send(anonymous, method, `${base}${path(created.id)}`, body)).status).toBe(401);
      if (method === 'get') expect((await request(app().app).get(`${base}${path(created.id)}`)).status).toBe(401);
    });

    it.each(calls)('when signed in to another studio and calling %s, then 404', async (_name, method, path, body) => {
      const { base, owner } = await setup();
      const created = (await owner.post(base).send({ name: 'Mine' })).body;
      const outsider = await makeStudio(app().db, ['owner']);
      const agent = await signIn(app().app, outsider.members.owner.email);
      expect((await send(agent, method, `${base}${path(created.id)}`, body)).status).toBe(404);
    });

    it.each(calls.filter(([, method]) => method !== 'get'))('when crew calls %s, then 403 and nothing changes', async (_name, method, path, body) => {
      const { base, owner, members, studioId } = await setup();
      const created = (await owner.post(base).send({ name: 'Mine' })).body;
      const crew = await signIn(app().app, members.crew.email);
      expect((await send(crew, method, `${base}${path(created.id)}`, body)).status).toBe(403);
      expect(await app().db('themes').where({ studio_id: studioId }).select('name', 'status', 'version')).toEqual([{ name: 'Mine', status: 'idea', version: 1 }]);
    });

    it.each([
      ['pick', 'post', (id: number) => `/${id}/pick`, { target: { kind: 'month', value: '2026-05' }, version: 1 }],
      ['delete', 'delete', (id: number) => `/${id}`, undefined],
    ] as Call[])('when a partner calls %s, then 403', async (_name, method, path, body) => {
      const { base, owner, members } = await setup();
      const created = (await owner.post(base).send({ name: 'Mine' })).body;
      const partner = await signIn(app().app, members.partner.email);
      expect((await send(partner, method, `${base}${path(created.id)}`, body)).status).toBe(403);
    });

    it('when crew reads, then the list and the theme answer 200', async () => {
      const { base, owner, members } = await setup();
      const created = (await owner.post(base).send({ name: 'Mine' })).body;
      const crew = await signIn(app().app, members.crew.email);
      expect((await crew.get(base)).status).toBe(200);
      expect((await crew.get(`${base}/${created.id}`)).body.name).toBe('Mine');
    });
  });
});
