import request from 'supertest';
import { hashToken } from '../../server/account/tokens';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testConfig, type TestApp } from '../helpers/test-app';
import { addMarket, addStep, inDays, parseFeed, studioToday } from './feeds-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp({ config: testConfig({ PUBLIC_URL: 'http://app.example.test' }) });
});
afterAll(() => t.close());

const path = (url: string) => new URL(url).pathname;
const tokenOf = (url: string) => /\/feeds\/([^/]+)\.ics$/.exec(url)![1];
const tricky = 'Sand, prime; seal \\ wax';
const trickyNotes = 'Line one, with a comma; a semicolon\nLine two \\ backslash — and a long tail that must be folded past seventy-five octets: ééééé';
const laserCautions = ['Never leave the laser cutter running unattended; keep an extinguisher at hand', 'Cut only materials known to be safe (never PVC or vinyl); vent fumes'];

async function studioWithWork() {
  const studio = await makeStudio(t.db);
  const today = studioToday();
  const { owner, partner, crew } = studio.members;
  const cut = await addStep(t.db, studio.studioId, { title: tricky, start: inDays(today, 3), end: inDays(today, 5), assignee: crew.id, notes: trickyNotes, cautions: laserCautions, sequence: 3 });
  const film = await addStep(t.db, studio.studioId, { title: 'Film the how-to', kind: 'content', start: inDays(today, 8), assignee: partner.id });
  const tray = await addStep(t.db, studio.studioId, { title: 'Still in the tray', start: null, assignee: crew.id });
  const market = await addMarket(t.db, studio.studioId, {
    name: 'Riverside Saturday market',
    start: inDays(today, 1),
    rrule: 'FREQ=WEEKLY;COUNT=10',
    exdates: [inDays(today, 15)],
    deadline: inDays(today, 20),
  });
  return { ...studio, today, owner, partner, crew, ids: { cut, film, tray, market } };
}

async function newFeed(studioId: number, email: string, body: object) {
  const agent = await signIn(t.app, email);
  const response = await agent.post(`/api/studios/${studioId}/feeds`).send(body);
  expect(response.status).toBe(201);
  return { agent, feed: response.body as { id: number; url: string; scope: string; includeHolidays: boolean; createdAt: string } };
}

describe('making feeds', () => {
  it('when a member makes a feed, then 201 carries the only full URL and only a SHA-256 of its token is stored', async () => {
    const s = await studioWithWork();
    const { agent, feed } = await newFeed(s.studioId, s.crew.email, { scope: 'all', includeHolidays: true });
    expect(feed).toEqual({ id: expect.any(Number), url: expect.stringMatching(/^http:\/\/app\.example\.test\/feeds\/[A-Za-z0-9_-]+\.ics$/), scope: 'all', includeHolidays: true, createdAt: expect.any(String) });
    const token = tokenOf(feed.url);
    expect(Buffer.from(token, 'base64url').length * 8).toBeGreaterThanOrEqual(128);
    const row = await t.db('feeds').where({ id: feed.id }).first();
    expect(row).toMatchObject({ studio_id: s.studioId, user_id: s.crew.id, scope: 'all', include_holidays: true, token_hash: hashToken(token) });
    expect(JSON.stringify(row)).not.toContain(token);
    const list = await agent.get(`/api/studios/${s.studioId}/feeds`);
    expect(list.body).toEqual([{ id: feed.id, scope: 'all', includeHolidays: true, createdAt: feed.createdAt, lastFetchedAt: null }]);
    expect(JSON.stringify(list.body)).not.toContain(token);
  });

  it('when the scope is unknown, then 400 names scope and nothing is stored', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const agent = await signIn(t.app, members.owner.email);
    const response = await agent.post(`/api/studios/${studioId}/feeds`).send({ scope: 'everything' });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toEqual(['scope']);
    expect(await t.db('feeds').where({ studio_id: studioId })).toEqual([]);
  });
});

describe('a feed by its token', () => {
  it('when a calendar app fetches the "all" feed, then ical.js reads every step, the recurring market and its deadline', async () => {
    const s = await studioWithWork();
    const { agent, feed } = await newFeed(s.studioId, s.owner.email, { scope: 'all', includeHolidays: false });
    const response = await request(t.app).get(path(feed.url));
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/calendar; charset=utf-8');
    const { calendar, events } = parseFeed(response.text);
    expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe('Test studio · all work');
    expect(calendar.getFirstPropertyValue('x-wr-timezone')).toBe('America/New_York');
    expect(calendar.getFirstPropertyValue('refresh-interval')?.toString()).toBe('PT1H');
    expect(calendar.getFirstPropertyValue('x-published-ttl')).toBe('PT1H');
    expect(events.map((event) => event.summary).sort()).toEqual(
      ['Application deadline: Riverside Saturday market', 'Film the how-to', 'Riverside Saturday market', tricky].sort(),
    );
    const cut = events.find((event) => event.summary === tricky)!;
    // All-day: DATE values, DTEND the day after the last day (RFC 5545 §3.6.1).
    expect(cut).toMatchObject({ startType: 'date', start: inDays(s.today, 3), end: inDays(s.today, 6), sequence: 3, category: 'build', uid: `kerfcast-event-${s.ids.cut}@app.example.test` });
    expect(cut.description).toContain(trickyNotes);
    expect(cut.description).toContain('Never leave the laser cutter running unattended');
    expect(cut.description).toContain('manuals, local codes and licensed professionals');
    expect(cut.description).toContain(`Open in Kerfcast: http://app.example.test/studios/${s.studioId}/calendar?date=${inDays(s.today, 3)}`);
    expect(cut.stamp).toMatch(/Z$/);
    const market = events.find((event) => event.summary === 'Riverside Saturday market')!;
    // Recurring markets stay one RRULE with EXDATE, not expanded; ical.js expands it to check.
    expect(market).toMatchObject({ rrule: 'FREQ=WEEKLY;COUNT=10', exdates: [inDays(s.today, 15)], isRecurring: true, location: 'Old grain hall' });
    const iterator = market.event.iterator();
    const dates: string[] = [];
    for (let next = iterator.next(); next; next = iterator.next()) if (!market.exdates.includes(next.toString())) dates.push(next.toString());
    expect(dates).toEqual([1, 8, 22, 29, 36, 43, 50, 57, 64].map((days) => inDays(s.today, days)));
    expect(events.some((event) => event.category === 'holiday')).toBe(false);
    const listed = await agent.get(`/api/studios/${s.studioId}/feeds`);
    expect(listed.body[0].lastFetchedAt).not.toBeNull();
  });

  it('when the feed is fetched twice, then UIDs are the same and unique', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.owner.email, { scope: 'all', includeHolidays: true });
    const first = parseFeed((await request(t.app).get(path(feed.url))).text).events.map((event) => event.uid);
    const second = parseFeed((await request(t.app).get(path(feed.url))).text).events.map((event) => event.uid);
    expect(second).toEqual(first);
    expect(new Set(first).size).toBe(first.length);
    expect(first.length).toBeGreaterThan(5);
  });

  it('when the text is written, then lines end in CRLF, fold at 75 octets and TEXT is escaped per RFC 5545 §3.3.11', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.owner.email, { scope: 'mine', includeHolidays: false });
    await t.db('events').where({ id: s.ids.cut }).update({ assignee_user_id: s.owner.id });
    const text = (await request(t.app).get(path(feed.url)).buffer(true)).text;
    expect(text.endsWith('END:VCALENDAR\r\n')).toBe(true);
    const lines = text.split('\r\n');
    expect(lines.some((line) => line.includes('\n'))).toBe(false);
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    expect(lines.some((line) => line.startsWith(' '))).toBe(true);
    const unfolded = text.replace(/\r\n[ \t]/g, '');
    expect(unfolded).toContain('SUMMARY:Sand\\, prime\\; seal \\\\ wax\r\n');
    expect(unfolded).toContain('Notes: Line one\\, with a comma\\; a semicolon\\nLine two \\\\ backslash');
    const { events } = parseFeed(text);
    expect(events[0].summary).toBe(tricky);
    expect(events[0].description).toContain(trickyNotes);
  });

  it('when a crew member fetches their "mine" feed, then it holds only their placed steps', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine', includeHolidays: false });
    const { calendar, events } = parseFeed((await request(t.app).get(path(feed.url))).text);
    expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe('Test studio · my steps (crew person)');
    expect(events.map((event) => event.summary)).toEqual([tricky]);
  });

  it('when the "markets" feed includes holidays, then it holds markets, deadlines, holidays and occasions but no steps', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.partner.email, { scope: 'markets', includeHolidays: true });
    const { events } = parseFeed((await request(t.app).get(path(feed.url))).text);
    const categories = new Set(events.map((event) => event.category));
    expect([...categories].sort()).toEqual(['deadline', 'holiday', 'market', 'occasion']);
    // The studio is in the US (the default): Independence Day is among the holidays, as a one-day DATE event.
    const independence = events.find((event) => event.category === 'holiday' && /Independence Day/.test(event.summary));
    expect(independence?.startType).toBe('date');
    expect(independence!.end).toBe(inDays(independence!.start, 1));
    expect(independence!.start.slice(5)).toMatch(/^07-0[345]$/);
  });

  it('when a revalidation carries the ETag or the Last-Modified date, then 304 with no body; a change gives 200 and a higher SEQUENCE', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.owner.email, { scope: 'all', includeHolidays: false });
    const first = await request(t.app).get(path(feed.url));
    const { etag, 'last-modified': lastModified } = first.headers;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(new Date(lastModified).toUTCString()).toBe(lastModified);
    const byTag = await request(t.app).get(path(feed.url)).set('If-None-Match', etag);
    expect(byTag.status).toBe(304);
    expect(byTag.text).toBe('');
    expect(byTag.headers['etag']).toBe(etag);
    expect((await request(t.app).get(path(feed.url)).set('If-None-Match', `W/${etag}`)).status).toBe(304);
    expect((await request(t.app).get(path(feed.url)).set('If-Modified-Since', lastModified)).status).toBe(304);
    expect((await request(t.app).get(path(feed.url)).set('If-Modified-Since', new Date(Date.parse(lastModified) - 1000).toUTCString())).status).toBe(200);
    // If-None-Match wins over If-Modified-Since (RFC 9110 §13.2.2).
    expect((await request(t.app).get(path(feed.url)).set('If-None-Match', '"other"').set('If-Modified-Since', lastModified)).status).toBe(200);

    await new Promise((resolve) => setTimeout(resolve, 5));
    await t.db('events').where({ id: s.ids.cut }).update({ title: 'Batch cut', version: t.db.raw('version + 1'), sequence: t.db.raw('sequence + 1'), updated_at: t.db.raw('CURRENT_TIMESTAMP(3)') });
    const changed = await request(t.app).get(path(feed.url)).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.headers['etag']).not.toBe(etag);
    expect(parseFeed(changed.text).events.find((event) => event.summary === 'Batch cut')?.sequence).toBe(4);
    await t.db('markets').where({ id: s.ids.market }).update({ name: 'Riverside market', version: 2 });
    const marketChanged = await request(t.app).get(path(feed.url)).set('If-None-Match', changed.headers['etag']);
    expect(marketChanged.status).toBe(200);
    expect(parseFeed(marketChanged.text).events.find((event) => event.summary === 'Riverside market')?.sequence).toBe(1);
    // Names the steps carry and the studio's own occasions are in the ETag too.
    const [themeId] = await t.db('themes').insert({ studio_id: s.studioId, name: 'Lanterns', status: 'building' });
    await t.db('events').where({ id: s.ids.cut }).update({ theme_id: themeId, updated_at: t.db.raw('CURRENT_TIMESTAMP(3)') });
    const themed = await request(t.app).get(path(feed.url)).set('If-None-Match', marketChanged.headers['etag']);
    expect(themed.status).toBe(200);
    await t.db('themes').where({ id: themeId }).update({ name: 'Paper lanterns' });
    const renamed = await request(t.app).get(path(feed.url)).set('If-None-Match', themed.headers['etag']);
    expect(renamed.status).toBe(200);
    // The step's title carries its theme (feed clients show titles only): "Batch cut · Paper lanterns".
    expect(parseFeed(renamed.text).events.find((event) => event.summary === 'Batch cut · Paper lanterns')?.description).toContain('Theme: Paper lanterns');
    await t.db('studio_occasions').insert({ studio_id: s.studioId, occasion_key: 'custom-open-studio', name: 'Open studio day', dates: JSON.stringify(['2027-03-06']) });
    expect((await request(t.app).get(path(feed.url)).set('If-None-Match', renamed.headers['etag'])).status).toBe(200);
  });

  it('when the token is unknown or malformed, then 404 in the error shape', async () => {
    const unknown = await request(t.app).get('/feeds/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA.ics');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('not_found');
    expect((await request(t.app).get('/feeds/short.ics')).status).toBe(404);
    expect((await request(t.app).get('/feeds/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA')).status).toBe(404);
  });
});

describe('rotating and revoking', () => {
  it('when a member rotates a feed, then the old URL answers 404 and the new one works', async () => {
    const s = await studioWithWork();
    const { agent, feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine' });
    expect((await request(t.app).get(path(feed.url))).status).toBe(200);
    const rotated = await agent.post(`/api/studios/${s.studioId}/feeds/${feed.id}/rotate`);
    expect(rotated.status).toBe(200);
    expect(rotated.body).toMatchObject({ id: feed.id, scope: 'mine', includeHolidays: false });
    expect(rotated.body.url).not.toBe(feed.url);
    expect((await request(t.app).get(path(feed.url))).status).toBe(404);
    expect((await request(t.app).get(path(rotated.body.url))).status).toBe(200);
  });

  it('when a member revokes a feed, then its URL answers 404 and the list is empty', async () => {
    const s = await studioWithWork();
    const { agent, feed } = await newFeed(s.studioId, s.partner.email, { scope: 'all' });
    expect((await agent.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(204);
    expect((await request(t.app).get(path(feed.url))).status).toBe(404);
    expect((await agent.get(`/api/studios/${s.studioId}/feeds`)).body).toEqual([]);
    expect((await agent.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(404);
  });

  it('when a member is removed from the studio, then their feed stops at once', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine' });
    const owner = await signIn(t.app, s.owner.email);
    expect((await owner.delete(`/api/studios/${s.studioId}/members/${s.crew.id}`)).status).toBe(204);
    expect((await request(t.app).get(path(feed.url))).status).toBe(404);
  });

  it("when the owner revokes a crew member's feed, then 204; a partner may not (403) and nobody may rotate another's (403)", async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine' });
    const partner = await signIn(t.app, s.partner.email);
    expect((await partner.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(403);
    expect((await partner.post(`/api/studios/${s.studioId}/feeds/${feed.id}/rotate`)).status).toBe(403);
    const owner = await signIn(t.app, s.owner.email);
    expect((await owner.post(`/api/studios/${s.studioId}/feeds/${feed.id}/rotate`)).status).toBe(403);
    expect((await request(t.app).get(path(feed.url))).status).toBe(200);
    expect((await owner.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(204);
    expect((await request(t.app).get(path(feed.url))).status).toBe(404);
  });
});

describe('access to feed routes', () => {
  it('when anonymous, then every feed route answers 401', async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine' });
    const agent = await anonymousAgent(t.app);
    expect((await agent.get(`/api/studios/${s.studioId}/feeds`)).status).toBe(401);
    expect((await agent.post(`/api/studios/${s.studioId}/feeds`).send({ scope: 'all' })).status).toBe(401);
    expect((await agent.post(`/api/studios/${s.studioId}/feeds/${feed.id}/rotate`)).status).toBe(401);
    expect((await agent.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(401);
  });

  it("when a member of another studio reaches for this studio's feeds, then 404 on every route and through their own studio too", async () => {
    const s = await studioWithWork();
    const { feed } = await newFeed(s.studioId, s.crew.email, { scope: 'mine' });
    const other = await makeStudio(t.db, ['owner']);
    const agent = await signIn(t.app, other.members.owner.email);
    expect((await agent.get(`/api/studios/${s.studioId}/feeds`)).status).toBe(404);
    expect((await agent.post(`/api/studios/${s.studioId}/feeds`).send({ scope: 'all' })).status).toBe(404);
    expect((await agent.post(`/api/studios/${s.studioId}/feeds/${feed.id}/rotate`)).status).toBe(404);
    expect((await agent.delete(`/api/studios/${s.studioId}/feeds/${feed.id}`)).status).toBe(404);
    expect((await agent.post(`/api/studios/${other.studioId}/feeds/${feed.id}/rotate`)).status).toBe(404);
    expect((await agent.delete(`/api/studios/${other.studioId}/feeds/${feed.id}`)).status).toBe(404);
    expect(await t.db('feeds').where({ id: feed.id }).first()).toBeDefined();
  });

  it("when another studio's feed is fetched by a member of this one, then it carries only that studio's work", async () => {
    const mine = await studioWithWork();
    const theirs = await studioWithWork();
    await t.db('events').where({ id: theirs.ids.film }).update({ title: 'Their secret step' });
    const { feed } = await newFeed(mine.studioId, mine.owner.email, { scope: 'all' });
    const titles = parseFeed((await request(t.app).get(path(feed.url))).text).events.map((event) => event.summary);
    expect(titles).not.toContain('Their secret step');
    expect(titles).toContain('Film the how-to');
  });
});
