// The Trends board API: stored scores, sort and paging in SQL, target re-scoring (issue 4).
// Expected scores come from shared/scoring's scoreSeries on the same points, itself checked against
// R decompose(), NIST Norris and the EPA Mann–Kendall examples in shared/scoring/*.spec.ts.
import request from 'supertest';
import { scoreSeries } from '@shared/scoring/score-series';
import type { Score } from '@shared/scoring/types';
import { verdictFigures } from '@shared/scoring/verdict-figures';
import { fixedClock, useClock } from '../../server/clock/clock';
import { trendsRoutes } from '../../server/series/trends-routes';
import { makeStudio, signIn } from '../helpers/test-app';
import { fixedToday, insertSales, insertSeries, useTrendsTestApp, viaJson } from './series-test-data';

const app = useTrendsTestApp();
const today = fixedToday;
const json = viaJson;

async function studioWithSeries(count = 3) {
  const studio = await makeStudio(app().db);
  const made = [];
  for (let index = 0; index < count; index++) {
    made.push(await insertSeries(app().db, studio.studioId, { term: `term ${String.fromCharCode(97 + index)}`, growth: (index - 2) * 0.004, crest: 10 + index * 7, seed: index + 1 }));
  }
  return { ...studio, made };
}

describe('GET /series', () => {
  it('when a member lists series, then each row has the issue-3 fields and a score equal to scoreSeries on its points', async () => {
    const { studioId, members, made } = await studioWithSeries(2);
    const agent = await signIn(app().app, members.crew.email);
    const response = await agent.get(`/api/studios/${studioId}/series?sort=term&order=asc`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ total: 2, page: 1, pageSize: 25, target: null, today });
    const [first] = response.body.items;
    expect(first).toMatchObject({ id: made[0].id, term: 'term a', region: '', kind: 'interest', period: 'weekly', start: '2023-01-02', end: made[0].points.at(-1)?.date, points: 156, scoredFor: today });
    expect(first.score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today })));
    expect(Object.keys(first.score.parts)).toEqual(['rise', 'seasonLift', 'leadRoom', 'salesPull']);
    expect(Object.keys(first.score.rise.mannKendall)).toEqual(['S', 'varS', 'z', 'p', 'tau']);
    expect(first.score.seasonal).toMatchObject({ model: 'multiplicative', period: 52, indices: expect.any(Array) });
    expect(first.spark.recent).toHaveLength(104);
    expect(first.spark.yearBefore).toHaveLength(104);
    // The year-before line is the same grid shifted by m = 52 periods.
    expect(first.spark.yearBefore[60]).toBe(first.spark.recent[8]);
    const stored = await app().db('series_scores').where({ series_id: made[0].id, target: '' }).first();
    expect(stored).toMatchObject({ studio_id: studioId, heat: first.score.heat, verdict: first.score.verdict, scored_for: today, next_peak: first.score.seasonal.nextPeak });
  });

  it('when sorted by heat and paged, then MariaDB orders and cuts the rows and the total counts all', async () => {
    const { studioId, members, made } = await studioWithSeries(7);
    const agent = await signIn(app().app, members.owner.email);
    const all = (await agent.get(`/api/studios/${studioId}/series?sort=heat&order=desc&pageSize=200`)).body.items;
    const heats = all.map((item: { score: { heat: number } }) => item.score.heat);
    expect(heats).toEqual([...heats].sort((a, b) => b - a));
    const page2 = await agent.get(`/api/studios/${studioId}/series?sort=heat&order=desc&page=2&pageSize=3`);
    expect(page2.body).toMatchObject({ total: 7, page: 2, pageSize: 3 });
    expect(page2.body.items.map((item: { id: number }) => item.id)).toEqual(all.slice(3, 6).map((item: { id: number }) => item.id));
    // The same order straight from the stored column.
    const fromSql = await app().db('series_scores').where({ studio_id: studioId, target: '' }).orderBy([{ column: 'heat', order: 'desc' }, { column: 'series_id' }]).pluck('series_id');
    expect(all.map((item: { id: number }) => item.id)).toEqual(fromSql);
    const ascending = await agent.get(`/api/studios/${studioId}/series?sort=term&order=asc&pageSize=2&page=4`);
    expect(ascending.body.items.map((item: { term: string }) => item.term)).toEqual(['term g']);
    expect(made).toHaveLength(7);
  });

  it.each(['rise', 'yoy', 'strength', 'nextPeak'] as const)('when sorted by %s, then rows follow the stored figure', async (sort) => {
    const { studioId, members } = await studioWithSeries(4);
    const agent = await signIn(app().app, members.owner.email);
    const items = (await agent.get(`/api/studios/${studioId}/series?sort=${sort}&order=asc`)).body.items;
    // The rise the board shows and sorts by is the verdict's own measure (issue 23).
    const figure = (item: { score: Score }) =>
      sort === 'rise' ? verdictFigures(item.score).risePerYear : sort === 'yoy' ? item.score.yoy : sort === 'strength' ? item.score.seasonal!.strength : item.score.seasonal!.nextPeak;
    const figures = items.map(figure);
    const known = figures.filter((value: unknown) => value !== null);
    // Nulls come last either way.
    expect(figures).toEqual([...[...known].sort((a, b) => (a! < b! ? -1 : a! > b! ? 1 : 0)), ...figures.filter((value: unknown) => value === null)]);
  });

  it('when filtered by text, verdict and kind, then only matching rows count', async () => {
    const { studioId, members } = await makeStudio(app().db);
    await insertSeries(app().db, studioId, { term: 'pumpkin sign', seed: 3 });
    await insertSeries(app().db, studioId, { term: 'herb rack', seed: 4 });
    await insertSeries(app().db, studioId, { term: 'short one', periods: 8, seed: 5 });
    await insertSeries(app().db, studioId, { term: 'walnut coaster', kind: 'sales', seed: 6 });
    const agent = await signIn(app().app, members.partner.email);
    const base = `/api/studios/${studioId}/series`;
    expect((await agent.get(`${base}?q=PUMP`)).body.items.map((item: { term: string }) => item.term)).toEqual(['pumpkin sign']);
    const short = await agent.get(`${base}?verdict=not-enough-history`);
    expect(short.body.items.map((item: { term: string }) => item.term)).toEqual(['short one']);
    expect((await agent.get(`${base}?kind=sales`)).body.total).toBe(1);
    expect((await agent.get(`${base}?q=${encodeURIComponent('100%_')}`)).body.total).toBe(0);
  });

  it('when a month target is asked for, then heat is re-scored against that month and stored for it', async () => {
    const { studioId, members, made } = await studioWithSeries(2);
    const agent = await signIn(app().app, members.owner.email);
    const base = (await agent.get(`/api/studios/${studioId}/series?sort=term&order=asc`)).body.items[0].score;
    const response = await agent.get(`/api/studios/${studioId}/series?sort=term&order=asc&target=2026-07`);
    expect(response.status).toBe(200);
    expect(response.body.target).toEqual({ key: '2026-07', label: 'July 2026', from: '2026-07-01', to: '2026-07-31' });
    const score = response.body.items[0].score;
    expect(score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today, target: { from: '2026-07-01', to: '2026-07-31' } })));
    expect(score.explanation.target).toEqual({ from: '2026-07-01', to: '2026-07-31' });
    expect(score.parts.seasonLift).not.toBe(base.parts.seasonLift);
    expect(await app().db('series_scores').where({ studio_id: studioId, target: '2026-07' }).count({ n: '*' }).first()).toEqual({ n: 2 });
  });

  it('when an occasion target is asked for, then its sell window from the calendar rules is the target', async () => {
    const { studioId, members } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.owner.email);
    const choices = (await agent.get(`/api/studios/${studioId}/series/targets`)).body;
    expect(choices.today).toBe(today);
    expect(choices.months[0]).toMatchObject({ key: '2026-04', from: '2026-04-01', to: '2026-04-30' });
    // US Mother's Day 2026 is the second Sunday of May, 10 May (from memory; shared/calendar checks it).
    const mothersDay = choices.occasions.find((choice: { key: string }) => choice.key === 'occasion:mothers-day');
    expect(mothersDay.to).toBe('2026-05-10');
    const response = await agent.get(`/api/studios/${studioId}/series?target=occasion:mothers-day`);
    expect(response.body.target).toMatchObject({ key: 'occasion:mothers-day', from: mothersDay.from, to: '2026-05-10' });
    expect(response.body.items[0].score.explanation.target).toEqual({ from: mothersDay.from, to: '2026-05-10' });
  });

  it("when a market target is asked for, then the four weeks before the studio market's next day are the target", async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const [marketId] = await app().db('markets').insert({ studio_id: studioId, name: 'Riverside craft fair', start: '2026-04-18' });
    const agent = await signIn(app().app, members.owner.email);
    const choices = (await agent.get(`/api/studios/${studioId}/series/targets`)).body;
    expect(choices.markets).toEqual([{ key: `market:${marketId}`, label: 'Riverside craft fair 2026-04-18', from: '2026-03-21', to: '2026-04-18' }]);
    const response = await agent.get(`/api/studios/${studioId}/series?target=market:${marketId}`);
    expect(response.body.items[0].score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today, target: { from: '2026-03-21', to: '2026-04-18' } })));
    const other = await makeStudio(app().db, ['owner']);
    const [foreignMarket] = await app().db('markets').insert({ studio_id: other.studioId, name: 'Elsewhere fair', start: '2026-05-02' });
    expect((await agent.get(`/api/studios/${studioId}/series?target=market:${foreignMarket}`)).status).toBe(400);
  });

  it('when a day passes, then stale scores are re-scored for the new today', async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.owner.email);
    await agent.get(`/api/studios/${studioId}/series`);
    useClock(fixedClock('2026-03-11T15:00:00Z'));
    const response = await agent.get(`/api/studios/${studioId}/series`);
    expect(response.body.today).toBe('2026-03-11');
    expect(response.body.items[0].score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today: '2026-03-11' })));
  });

  it('when the imports hook reports changed series, then their stored scores are recomputed from the new points', async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.owner.email);
    await agent.get(`/api/studios/${studioId}/series?target=2026-08`);
    const extra = Array.from({ length: 8 }, (_, week) => ({ date: new Date(Date.parse('2025-12-29') + week * 7 * 86_400_000).toISOString().slice(0, 10), value: 400 }));
    await app().db('series_points').insert(extra.map((point) => ({ ...point, series_id: made[0].id, studio_id: studioId })));
    await trendsRoutes(app().db).scoring.afterSeriesChanged(studioId, [made[0].id]);
    const rows = await app().db('series_scores').where({ series_id: made[0].id });
    expect(rows.map((row) => row.target)).toEqual(['']);
    expect(JSON.parse(rows[0].score_json)).toEqual(json(scoreSeries([...made[0].points, ...extra], { period: 'weekly', today })));
    // Eight weeks at ten times the level read as a new level, not a lone spike.
    expect(JSON.parse(rows[0].score_json).verdict).toBe('rising');
  });

  it('when a series belongs to a theme with sold items, then its sales pull comes from those sales', async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const sales = [];
    for (let month = 0; month < 24; month++) {
      const date = new Date(Date.UTC(2024, month, 15)).toISOString().slice(0, 10);
      sales.push({ date, item: 'Herb rack', quantity: month % 12 === 6 ? 30 : 5 });
    }
    await insertSales(app().db, studioId, sales);
    const agent = await signIn(app().app, members.owner.email);
    const created = await agent.post(`/api/studios/${studioId}/themes`).send({ name: 'Herb garden', seriesIds: [made[0].id], items: ['Herb rack'] });
    expect(created.status).toBe(201);
    const item = (await agent.get(`/api/studios/${studioId}/series?target=2026-07`)).body.items[0];
    const salesPull = sales.map((sale) => ({ date: sale.date, value: sale.quantity }));
    expect(item.score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today, target: { from: '2026-07-01', to: '2026-07-31' }, salesPull })));
    // July sold 30 against a mean month of (22 × 5 + 2 × 30) / 24 ≈ 7.08: ratio ≈ 4.2, part capped at 100.
    expect(item.score.parts.salesPull).toBe(100);
  });

  it('when a sales series is scored, then its sales pull is its own item by season', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const points = Array.from({ length: 30 }, (_, month) => ({ date: new Date(Date.UTC(2023, month, 1)).toISOString().slice(0, 10), value: month % 12 === 11 ? 40 : 10 }));
    await insertSeries(app().db, studioId, { term: 'Star ornament', kind: 'sales', period: 'monthly' }, points);
    const agent = await signIn(app().app, members.owner.email);
    const item = (await agent.get(`/api/studios/${studioId}/series?target=2026-12`)).body.items[0];
    expect(item.score).toEqual(json(scoreSeries(points, { period: 'monthly', today, kind: 'sales', target: { from: '2026-12-01', to: '2026-12-31' }, salesPull: points })));
    expect(item.score.parts.salesPull).toBeGreaterThan(50);
  });

  it.each([
    ['sort=size', 'sort'],
    ['order=up', 'order'],
    ['page=0', 'page'],
    ['pageSize=500', 'pageSize'],
    ['verdict=hot', 'verdict'],
    ['target=2026-13', 'target'],
    ['target=occasion:no-such-day', 'target'],
    ['q=a&q=b', 'q'],
  ])('when the query is %s, then 400 names %s', async (query, field) => {
    const { studioId, members } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.owner.email);
    const response = await agent.get(`/api/studios/${studioId}/series?${query}`);
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path[0]).toBe(field);
  });
});

describe('GET /series/:seriesId', () => {
  it('when a member opens a series, then it carries values, the decomposition and the same score', async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.crew.email);
    const response = await agent.get(`/api/studios/${studioId}/series/${made[0].id}`);
    expect(response.status).toBe(200);
    expect(response.body.values).toEqual(made[0].points);
    expect(response.body.score).toEqual(json(scoreSeries(made[0].points, { period: 'weekly', today })));
    const { analysis } = response.body;
    expect(analysis.model).toBe('multiplicative');
    expect(analysis.dates).toHaveLength(156);
    // Multiplicative: value = trend × seasonal × residual wherever the centred average exists.
    expect(analysis.trend[100] * analysis.seasonal[100] * analysis.residual[100]).toBeCloseTo(analysis.values[100], 9);
    expect(analysis.trend[0]).toBeNull();
    const july = await agent.get(`/api/studios/${studioId}/series/${made[0].id}?target=2026-07`);
    expect(july.body.target.key).toBe('2026-07');
    expect(july.body.score.explanation.target).toEqual({ from: '2026-07-01', to: '2026-07-31' });
  });

  it('when the series is another studio\'s or absent, then 404', async () => {
    const { studioId, members } = await studioWithSeries(1);
    const other = await studioWithSeries(1);
    const agent = await signIn(app().app, members.owner.email);
    expect((await agent.get(`/api/studios/${studioId}/series/${other.made[0].id}`)).status).toBe(404);
    expect((await agent.get(`/api/studios/${studioId}/series/999999999`)).status).toBe(404);
  });
});

describe('access to the series routes', () => {
  const paths = (studioId: number, seriesId: number) => [`/api/studios/${studioId}/series`, `/api/studios/${studioId}/series/targets`, `/api/studios/${studioId}/series/${seriesId}`];

  it('when anonymous, then 401 on every route', async () => {
    const { studioId, made } = await studioWithSeries(1);
    for (const path of paths(studioId, made[0].id)) expect((await request(app().app).get(path)).status).toBe(401);
  });

  it('when signed in to another studio, then 404 on every route', async () => {
    const { studioId, made } = await studioWithSeries(1);
    const outsider = await makeStudio(app().db, ['owner']);
    const agent = await signIn(app().app, outsider.members.owner.email);
    for (const path of paths(studioId, made[0].id)) expect((await agent.get(path)).status).toBe(404);
  });

  // Every role may read series, so no role gets 403 here: crew reading is the least privileged case.
  it('when crew reads, then every route answers 200', async () => {
    const { studioId, members, made } = await studioWithSeries(1);
    const agent = await signIn(app().app, members.crew.email);
    for (const path of paths(studioId, made[0].id)) expect((await agent.get(path)).status).toBe(200);
  });
});
