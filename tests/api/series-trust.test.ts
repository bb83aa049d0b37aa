// Issue 23, "trend numbers": sales weeks without a sale are 0 sold, a series without enough history
// has no heat and ranks after the scored ones, the board sorts by the rise it shows, and stored
// scores from an older way of scoring are recomputed. Expected scores come from shared/scoring's
// scoreSeries (checked against outside references in shared/scoring/*.spec.ts).
import { scoreSeries } from '@shared/scoring/score-series';
import type { Point } from '@shared/scoring/types';
import { verdictFigures } from '@shared/scoring/verdict-figures';
import { randomSalesAsStored, randomWeeklyUnits } from '../fixtures/scoring/random-sales';
import { SCORE_VERSION } from '../../server/series/scoring-service';
import { makeStudio, signIn } from '../helpers/test-app';
import { fixedToday, insertSeries, useTrendsTestApp, viaJson } from './series-test-data';

const app = useTrendsTestApp();
const today = fixedToday;

/** A committed sales import covering from–to that wrote this series, as the import service records it. */
async function coverWithSalesFile(studioId: number, seriesId: number, from: string, to: string): Promise<void> {
  const [importId] = await app().db('imports').insert({
    studio_id: studioId,
    file_name: 'shop-sales.csv',
    kind: 'sales',
    layout: 'sales',
    status: 'committed',
    sha256: 'b'.repeat(64),
    period_start: from,
    period_end: to,
  });
  await app().db('import_series').insert({ import_id: importId, series_id: seriesId, studio_id: studioId, points_written: 1 });
}

const weeklyPoints = (count: number, start = '2025-11-03'): Point[] =>
  Array.from({ length: count }, (_, week) => ({ date: new Date(Date.parse(start) + week * 7 * 86_400_000).toISOString().slice(0, 10), value: 30 + week }));

describe('sales series on the board', () => {
  it('when a random sales item is stored without its weeks of no sales, then those weeks count as 0 and it reads steady', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const stored = randomSalesAsStored();
    const { id } = await insertSeries(app().db, studioId, { term: 'Walnut key hook', kind: 'sales' }, stored);
    await coverWithSalesFile(studioId, id, '2023-01-02', '2025-12-28');
    const agent = await signIn(app().app, members.owner.email);
    const item = (await agent.get(`/api/studios/${studioId}/series`)).body.items[0];
    // Without sale rows, a sales series' own points are its sales pull.
    expect(item.score).toEqual(viaJson(scoreSeries(stored, { period: 'weekly', today, kind: 'sales', coveredUntil: '2025-12-28', salesPull: stored })));
    expect(item.score.verdict).toBe('steady');
    expect(verdictFigures(item.score).risePerYear).toBeNull();
    // Every week from the first sale to the end of the file, those without a sale as 0.
    const weeks = randomWeeklyUnits().slice(1);
    expect(item.score.explanation.periodsUsed).toBe(weeks.length);
    expect(item.score.explanation.periodsWithoutSales).toBe(weeks.filter((week) => week.value === 0).length);

    const detail = (await agent.get(`/api/studios/${studioId}/series/${id}`)).body;
    expect(detail.analysis.values).toEqual(weeks.map((week) => week.value));
    expect(detail.score.explanation.periodsWithoutSales).toBe(item.score.explanation.periodsWithoutSales);
    expect(item.spark.recent.every((value: number | null) => value !== null)).toBe(true);
  });

  it('when a search-interest series misses weeks, then they stay missing', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const stored = randomSalesAsStored();
    const { id } = await insertSeries(app().db, studioId, { term: 'walnut key hook' }, stored);
    const agent = await signIn(app().app, members.owner.email);
    const detail = (await agent.get(`/api/studios/${studioId}/series/${id}`)).body;
    expect(detail.score).toEqual(viaJson(scoreSeries(stored, { period: 'weekly', today })));
    expect(detail.score.explanation.periodsWithoutSales).toBeNull();
    expect(detail.analysis.values).toContain(null);
  });
});

describe('series without enough history', () => {
  it('when the board is sorted by any figure, then they have no heat and come after every scored series', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const short = await insertSeries(app().db, studioId, { term: 'new lamp shade' }, weeklyPoints(8));
    for (const [index, term] of ['herb rack', 'seed box', 'star ornament'].entries()) {
      await insertSeries(app().db, studioId, { term, crest: 10 + 9 * index, growth: (index - 1) * 0.004, seed: 30 + index });
    }
    const agent = await signIn(app().app, members.owner.email);
    for (const query of ['sort=heat&order=desc', 'sort=heat&order=asc', 'sort=rise&order=desc', 'sort=rise&order=asc', 'sort=strength&order=desc', 'sort=yoy&order=asc', 'sort=nextPeak&order=asc']) {
      const items = (await agent.get(`/api/studios/${studioId}/series?${query}`)).body.items;
      expect([query, items.at(-1).id]).toEqual([query, short.id]);
    }
    const row = (await agent.get(`/api/studios/${studioId}/series?q=lamp`)).body.items[0];
    expect(row.score.verdict).toBe('not-enough-history');
    expect(row.score.heat).toBeNull();
    expect(row.score.explanation.reason).toBe('not enough history: 5 more weeks needed for a verdict');
    const stored = await app().db('series_scores').where({ series_id: short.id, target: '' }).first();
    expect(stored).toMatchObject({ heat: null, rise_per_year: null, score_version: SCORE_VERSION });
  });

  it('when a theme has a member without enough history, then its heat says how many members count', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const short = await insertSeries(app().db, studioId, { term: 'new lamp shade' }, weeklyPoints(8));
    const full = await insertSeries(app().db, studioId, { term: 'lamp base', seed: 41 });
    const agent = await signIn(app().app, members.owner.email);
    const theme = (await agent.post(`/api/studios/${studioId}/themes`).send({ name: 'Lamps', seriesIds: [short.id, full.id] })).body;
    expect(theme.score).toMatchObject({ membersUsed: 1, membersTotal: 2 });
    expect(theme.score.reason).toContain('heat from 1 of 2 series; 1 has not enough history yet');
    expect(theme.members.find((member: { id: number }) => member.id === short.id)).toMatchObject({ heat: null, verdict: 'not-enough-history' });
    const waiting = (await agent.post(`/api/studios/${studioId}/themes`).send({ name: 'Shades', seriesIds: [short.id] })).body;
    expect(waiting.score).toMatchObject({ heat: null, parts: null, membersUsed: 0, membersTotal: 1 });
  });
});

describe('stored scores', () => {
  it('when a stored score comes from an older way of scoring, then it is recomputed on the next read', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const stored = randomSalesAsStored();
    const { id } = await insertSeries(app().db, studioId, { term: 'Walnut key hook', kind: 'sales' }, stored);
    const agent = await signIn(app().app, members.owner.email);
    await agent.get(`/api/studios/${studioId}/series`);
    // As a score from before issue 23 was stored: today's, but read with weeks of no sales missing.
    const old = scoreSeries(stored, { period: 'weekly', today });
    await app().db('series_scores').where({ series_id: id }).update({ score_version: 1, verdict: old.verdict, heat: old.heat, score_json: JSON.stringify(old) });
    const item = (await agent.get(`/api/studios/${studioId}/series`)).body.items[0];
    expect(old.verdict).toBe('rising');
    expect(item.score.verdict).toBe('steady');
    expect(await app().db('series_scores').where({ series_id: id }).first()).toMatchObject({ verdict: 'steady', score_version: SCORE_VERSION });
  });
});
