import { BUILT_IN_TEMPLATE_IDS, BUILT_IN_TEMPLATES } from '@shared/planning/built-in-templates';
import { makeStudio, makeTestApp, signIn, type TestApp } from '../helpers/test-app';
import { smallSteps, storeRunway } from './events-fixtures';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const base = (studioId: number) => `/api/studios/${studioId}/runway-templates`;

describe('built-in runway templates', () => {
  it('when any member lists templates, then the four built-in ones come first, each with its steps and cautions', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const crew = await signIn(t.app, members.crew.email);
    const response = await crew.get(base(studioId));
    expect(response.status).toBe(200);
    expect(response.body.map((template: { id: string; isBuiltIn: boolean }) => [template.id, template.isBuiltIn])).toEqual(BUILT_IN_TEMPLATE_IDS.map((id) => [id, true]));
    const kit = response.body.find((template: { id: string }) => template.id === 'flat-pack-kit');
    const kitting = kit.steps.find((step: { name: string }) => step.name === 'Kitting');
    expect(kitting.cautions.join(' ')).toMatch(/[Ss]mall parts/);
    const one = await crew.get(`${base(studioId)}/bench-piece`);
    expect(one.body).toMatchObject({ id: 'bench-piece', name: 'Bench-made piece', isBuiltIn: true, version: 1 });
    expect(one.body.steps.find((step: { name: string }) => step.name === 'Sand and finish').cautions.join(' ')).toMatch(/oily finishing rags/);
  });

  it('when an owner or partner changes or deletes a built-in template, then 400 names it as built in and nothing changes', async () => {
    const { studioId, members } = await makeStudio(t.db);
    for (const email of [members.owner.email, members.partner.email]) {
      const agent = await signIn(t.app, email);
      for (const id of BUILT_IN_TEMPLATE_IDS) {
        const put = await agent.put(`${base(studioId)}/${id}`).send({ name: 'Mine', steps: smallSteps, version: 1 });
        expect([id, put.status, put.body.error.code]).toEqual([id, 400, 'built_in']);
        expect(put.body.error.message).toContain(`"${BUILT_IN_TEMPLATES[id].name}" is built in`);
        const removed = await agent.delete(`${base(studioId)}/${id}`);
        expect([id, removed.status, removed.body.error.code]).toEqual([id, 400, 'built_in']);
      }
    }
    const crew = await signIn(t.app, members.crew.email);
    expect((await crew.put(`${base(studioId)}/video-only`).send({ name: 'Mine', steps: smallSteps })).status).toBe(403);
    expect((await crew.get(`${base(studioId)}/video-only`)).body.name).toBe('Video only');
  });

  it('when each built-in template is previewed by id, then the runway has its steps and ends on its launch', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    for (const id of BUILT_IN_TEMPLATE_IDS) {
      const response = await partner.post(`/api/studios/${studioId}/runways/preview`).send({ anchorDate: '2027-11-26', offsetDays: 7, templateId: id });
      expect([id, response.status]).toEqual([id, 200]);
      expect(response.body.steps.map((step: { name: string }) => step.name)).toEqual(BUILT_IN_TEMPLATES[id].steps.map((step) => step.name));
      expect(response.body.launch).toBe('2027-11-19');
      expect(response.body.warnings).toEqual([]);
    }
  });

  it('when an unknown string id is asked for, then 404', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const owner = await signIn(t.app, members.owner.email);
    expect((await owner.get(`${base(studioId)}/coffee-table`)).status).toBe(404);
  });
});

describe('editing a template after a runway was planned from it', () => {
  it('when the studio template is changed, then the runway planned from it keeps its steps', async () => {
    const { studioId, members } = await makeStudio(t.db);
    const partner = await signIn(t.app, members.partner.email);
    const created = await partner.post(base(studioId)).send({ name: 'Quick sign', steps: smallSteps });
    const runway = await storeRunway(partner, studioId, { anchorDate: '2027-05-21', offsetDays: 7, templateId: created.body.id });
    const before = await partner.get(`/api/studios/${studioId}/runways/${runway.id}`);
    expect(before.body.steps.map((step: { name: string }) => step.name)).toEqual(['Cut', 'Paint', 'Launch']);

    const changed = await partner
      .put(`${base(studioId)}/${created.body.id}`)
      .send({ name: 'Quick sign', version: 1, steps: [{ name: 'Engrave', kind: 'build', workDays: 4, hoursPerDay: 6, cureDays: 1 }, smallSteps[2]] });
    expect(changed.status).toBe(200);

    const after = await partner.get(`/api/studios/${studioId}/runways/${runway.id}`);
    expect(after.body.steps).toEqual(before.body.steps);
    const stored = await t.db('events').where({ studio_id: studioId, runway_id: runway.id }).orderBy('step_index').pluck('title');
    expect(stored).toEqual(['Cut', 'Paint', 'Launch']);
  });
});
