import { demoRunwayName } from '../../db/seeds/demo-calendar';
import { seedDemoStudio } from '../../db/seeds/demo-studio';
import { makeTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const countOf = async (table: string, studioId: number) => Number((await t.db(table).where({ studio_id: studioId }).count({ count: '*' }).first())!.count);

describe('demo studio seed', () => {
  it('when a first start stopped after the imports, then the next start seeds the themes and calendar, and later starts leave changes alone', async () => {
    const { studioId } = await seedDemoStudio(t.db);
    // What a start stopped half way (or a database older than those parts of the demo) leaves.
    await t.db('events').where({ studio_id: studioId }).delete();
    await t.db('runways').where({ studio_id: studioId }).delete();
    await t.db('markets').where({ studio_id: studioId }).delete();
    await t.db('themes').where({ studio_id: studioId }).delete();
    const imports = await countOf('imports', studioId);

    expect(await seedDemoStudio(t.db)).toEqual({ studioId, isNew: false });
    expect(await countOf('imports', studioId)).toBe(imports);
    expect(await countOf('themes', studioId)).toBeGreaterThan(0);
    expect(await countOf('markets', studioId)).toBe(2);
    const runway = await t.db('runways').where({ studio_id: studioId }).orderBy('id').first();
    expect(runway.name).toBe(demoRunwayName);
    expect(await countOf('events', studioId)).toBeGreaterThan(0);

    // A member renames a step and deletes a theme: a restart keeps both changes.
    const step = await t.db('events').where({ studio_id: studioId }).orderBy('id').first();
    await t.db('events').where({ id: step.id }).update({ title: 'Renamed by the partner' });
    const themes = await countOf('themes', studioId);
    await t.db('themes').where({ studio_id: studioId }).orderBy('id').limit(1).delete();
    await seedDemoStudio(t.db);
    expect((await t.db('events').where({ id: step.id }).first()).title).toBe('Renamed by the partner');
    expect(await countOf('themes', studioId)).toBe(themes - 1);
  }, 120_000);
});
