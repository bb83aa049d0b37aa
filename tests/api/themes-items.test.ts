// Issue 23: one way to attach an item. A sales series given to a theme as a series joins as its
// item, so "Your items" lists it and the members' sales pull comes from its sales, whichever way
// the user came. And targets reach screens by name, never by key. Expected scores come from
// shared/scoring (checked against outside references in shared/scoring/*.spec.ts).
import { scoreSeries } from '@shared/scoring/score-series';
import { scoreTheme } from '@shared/scoring/score-theme';
import type { Point } from '@shared/scoring/types';
import { makeStudio, signIn } from '../helpers/test-app';
import { fixedToday, insertSales, insertSeries, useTrendsTestApp, viaJson } from './series-test-data';

const app = useTrendsTestApp();
const today = fixedToday;
const july = { from: '2026-07-01', to: '2026-07-31' };

/** Two years of monthly sales of one item, July the best month (30 against 5). */
function salesOf(item: string) {
  return Array.from({ length: 24 }, (_, month) => ({ date: new Date(Date.UTC(2024, month, 15)).toISOString().slice(0, 10), item, quantity: month % 12 === 6 ? 30 : 5 }));
}

async function setup() {
  const studio = await makeStudio(app().db);
  const interest = await insertSeries(app().db, studio.studioId, { term: 'herb planter', crest: 26, seed: 51 });
  const sales = salesOf('Herb rack');
  await insertSales(app().db, studio.studioId, sales);
  const weekly: Point[] = sales.map((sale) => ({ date: sale.date, value: sale.quantity }));
  const item = await insertSeries(app().db, studio.studioId, { term: 'Herb rack', kind: 'sales' }, weekly);
  const owner = await signIn(app().app, studio.members.owner.email);
  return { ...studio, interest, item, sales, owner, base: `/api/studios/${studio.studioId}/themes` };
}

describe('a sales series attached to a theme', () => {
  it('when it is given as a series, then it becomes the item and the members draw sales pull from it', async () => {
    const { interest, item, sales, owner, base } = await setup();
    const created = await owner.post(base).send({ name: 'Herb garden', seriesIds: [interest.id, item.id] });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ seriesIds: [interest.id], items: ['Herb rack'] });
    expect(await app().db('theme_series').where({ theme_id: created.body.id }).pluck('series_id')).toEqual([interest.id]);
    expect(await app().db('theme_items').where({ theme_id: created.body.id }).pluck('item')).toEqual(['Herb rack']);
    expect(created.body.itemSeries.map((member: { id: number }) => member.id)).toEqual([item.id]);

    const picked = await owner.post(`${base}/${created.body.id}/pick`).send({ target: { kind: 'month', value: '2026-07' }, version: created.body.version });
    const salesPull = sales.map((sale) => ({ date: sale.date, value: sale.quantity }));
    const member = scoreSeries(interest.points, { period: 'weekly', today, target: july, salesPull });
    // July sold 30 against a mean month of (22 × 5 + 2 × 30) / 24 ≈ 7.08: the part is capped at 100.
    expect(member.parts.salesPull).toBe(100);
    const itemScore = scoreSeries(item.points, { period: 'weekly', today, kind: 'sales', target: july, salesPull });
    expect(picked.body.score).toEqual(viaJson(scoreTheme([member, itemScore])));
    expect(picked.body.score.membersTotal).toBe(2);
  });

  it('when it is added to an existing theme as a series, then it joins the items already there', async () => {
    const { interest, item, owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Herb garden', seriesIds: [interest.id], items: ['Trowel hook'] })).body;
    const patched = await owner.patch(`${base}/${created.id}`).send({ seriesIds: [interest.id, item.id], version: created.version });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ seriesIds: [interest.id], items: ['Herb rack', 'Trowel hook'] });
  });

  it('when the same item is attached by name instead, then the theme is the same', async () => {
    const { interest, item, owner, base } = await setup();
    const bySeries = (await owner.post(base).send({ name: 'By series', seriesIds: [interest.id, item.id] })).body;
    const byName = (await owner.post(base).send({ name: 'By name', seriesIds: [interest.id], items: ['herb rack'] })).body;
    const shape = (theme: typeof bySeries) => ({ seriesIds: theme.seriesIds, items: theme.items.map((name: string) => name.toLowerCase()), itemSeries: theme.itemSeries, members: theme.members, score: theme.score });
    expect(shape(byName)).toEqual(shape(bySeries));
  });
});

describe('targets on screen', () => {
  it('when a theme is picked for an occasion, then its target and history carry the name, not the key', async () => {
    const { interest, owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Garden gift', seriesIds: [interest.id] })).body;
    const picked = (await owner.post(`${base}/${created.id}/pick`).send({ target: { kind: 'occasion', value: 'mothers-day' }, version: 1 })).body;
    // US Mother's Day 2026 is Sunday 10 May (from memory; shared/calendar/occasions.spec.ts checks the rule).
    expect(picked.target.label).toBe("Mother's Day 2026-05-10");
    expect(picked.history.map((entry: { targetLabel: string | null }) => entry.targetLabel)).toEqual([null, "Mother's Day"]);
    expect(picked.history[1].target).toBe('occasion:mothers-day');
  });

  it('when a stored target no longer resolves, then it is named in words rather than shown as its key', async () => {
    const { studioId, interest, owner, base } = await setup();
    const created = (await owner.post(base).send({ name: 'Fair stock', seriesIds: [interest.id] })).body;
    await app().db('themes').where({ id: created.id }).update({ status: 'picked', target_kind: 'occasion', target_value: 'harvest-supper', target_date: '2025-10-01' });
    await app().db('theme_status_history').insert({ theme_id: created.id, studio_id: studioId, from_status: 'idea', to_status: 'picked', target_kind: 'occasion', target_value: 'harvest-supper', changed_at: app().db.raw('NOW(3)') });
    const detail = (await owner.get(`${base}/${created.id}`)).body;
    expect(detail.target.label).toBe('Harvest supper');
    expect(detail.history.at(-1).targetLabel).toBe('Harvest supper');
    const list = (await owner.get(base)).body;
    expect(list[0].target.label).toBe('Harvest supper');
  });
});
