// Scores follow imports: the imports service's afterSeriesChanged hook is wired to the scoring
// service in createApp, and the demo seed scores the studio and adds its two invented themes.
import { scoreSeries } from '@shared/scoring/score-series';
import { seedDemoThemes } from '../../db/seeds/demo-themes';
import { makeStudio, signIn } from '../helpers/test-app';
import { trendsRoutes } from '../../server/series/trends-routes';
import { fixedToday, insertSales, insertSeries, useTrendsTestApp, viaJson } from './series-test-data';

const app = useTrendsTestApp();

function weeklyCsv(): { csv: string; points: { date: string; value: number }[] } {
  const points = Array.from({ length: 110 }, (_, week) => ({
    date: new Date(Date.UTC(2023, 0, 1 + 7 * week)).toISOString().slice(0, 10),
    value: Math.round(40 + 30 * Math.cos((2 * Math.PI * (week - 20)) / 52) + (week % 5)),
  }));
  return { csv: `Week,bird feeder kit: (US)\n${points.map((point) => `${point.date},${point.value}`).join('\n')}\n`, points };
}

describe('scores after imports', () => {
  it('when an interest file is committed, then its series is scored and stored before anyone opens the board', async () => {
    const { studioId, members } = await makeStudio(app().db);
    const owner = await signIn(app().app, members.owner.email);
    const { csv, points } = weeklyCsv();
    const preview = await owner.post(`/api/studios/${studioId}/imports`).attach('file', Buffer.from(csv), 'bird-feeder.csv');
    expect(preview.status).toBe(201);
    const committed = await owner.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(committed.status).toBe(200);
    const [series] = committed.body.series;
    const stored = await app().db('series_scores').where({ series_id: series.id, target: '' }).first();
    expect(stored).toMatchObject({ studio_id: studioId, scored_for: fixedToday });
    expect(JSON.parse(stored.score_json)).toEqual(viaJson(scoreSeries(points, { period: 'weekly', today: fixedToday })));
  });

  it("when new sales of a theme's item arrive, then the theme's series are re-scored with the new sales pull", async () => {
    const { studioId, members } = await makeStudio(app().db);
    const interest = await insertSeries(app().db, studioId, { term: 'herb planter', seed: 61 });
    const owner = await signIn(app().app, members.owner.email);
    await owner.post(`/api/studios/${studioId}/themes`).send({ name: 'Herb garden', seriesIds: [interest.id], items: ['Herb rack'] });
    const before = JSON.parse((await app().db('series_scores').where({ series_id: interest.id, target: '' }).first()).score_json);
    expect(before.parts.salesPull).toBe(50);
    // What an import of the studio's sales leaves behind: sale rows and a weekly sales series of the item.
    const sales = Array.from({ length: 24 }, (_, month) => ({ date: new Date(Date.UTC(2024, month, 10)).toISOString().slice(0, 10), item: 'Herb rack', quantity: month % 12 === 3 ? 40 : 4 }));
    await insertSales(app().db, studioId, sales);
    const salesSeries = await insertSeries(app().db, studioId, { term: 'herb rack', kind: 'sales', periods: 20, seed: 62 });
    await trendsRoutes(app().db).scoring.afterSeriesChanged(studioId, [salesSeries.id]);
    const after = JSON.parse((await app().db('series_scores').where({ series_id: interest.id, target: '' }).first()).score_json);
    const salesPull = sales.map((sale) => ({ date: sale.date, value: sale.quantity }));
    expect(after).toEqual(viaJson(scoreSeries(interest.points, { period: 'weekly', today: fixedToday, salesPull })));
    expect(after.parts.salesPull).not.toBe(50);
  });

  it('when the demo themes are seeded, then every series is scored and the two themes hold the matching series and items', async () => {
    const { studioId, members } = await makeStudio(app().db);
    for (const [index, term] of ['herb planter box', 'garden stake set', 'lantern panel', 'pumpkin porch sign', 'hex wall shelf'].entries()) {
      await insertSeries(app().db, studioId, { term, region: 'US', seed: 40 + index, crest: 10 + 9 * index });
    }
    await seedDemoThemes(app().db, studioId, members.owner.id);
    await seedDemoThemes(app().db, studioId, members.owner.id);
    expect(await app().db('series_scores').where({ studio_id: studioId, target: '' }).count({ n: '*' }).first()).toEqual({ n: 5 });
    const themes = await app().db('themes').where({ studio_id: studioId }).orderBy('id').select('id', 'name', 'status');
    expect(themes.map((theme) => [theme.name, theme.status])).toEqual([
      ['Kitchen garden line', 'shortlisted'],
      ['Autumn porch lights', 'idea'],
    ]);
    const terms = await app().db('theme_series as ts').join('series as s', 's.id', 'ts.series_id').where('ts.theme_id', themes[0].id).orderBy('s.term').pluck('s.term');
    expect(terms).toEqual(['garden stake set', 'herb planter box']);
    expect(await app().db('theme_items').where({ theme_id: themes[1].id }).orderBy('item').pluck('item')).toEqual(['Lantern panel, walnut', 'Pumpkin porch sign']);
  });
});
