import { makeStudio, makeTestApp, signIn, type Agent, type TestApp } from '../helpers/test-app';
import { smallSteps } from './events-fixtures';

// Every name a person types goes through one shared check (shared/contracts/text.ts); one case per
// place it is used, each stored nothing.

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

const override = 'Spoon\u202Eworks';
const controlMessage = (label: string) => `${label} contains a control or text-direction character`;

interface Case {
  what: string;
  send: (owner: Agent, base: string) => PromiseLike<{ status: number; body: { error: { issues: unknown[] } } }>;
  path: (string | number)[];
  label: string;
  stored: (studioId: number) => Promise<unknown[]>;
}

const cases: Case[] = [
  {
    what: 'studio name',
    send: (owner, base) => owner.patch(base).send({ name: override }),
    path: ['name'],
    label: 'Studio name',
    stored: (studioId) => t.db('studios').where({ id: studioId, name: override }),
  },
  {
    what: 'channel name',
    send: (owner, base) => owner.patch(base).send({ channels: ['market', 'online', 'Spoon\u0007shop'] }),
    path: ['channels', 2],
    label: 'A channel name',
    stored: (studioId) => t.db('studios').where({ id: studioId }).where('channels', 'like', '%Spoon%'),
  },
  {
    what: 'theme name',
    send: (owner, base) => owner.post(`${base}/themes`).send({ name: override }),
    path: ['name'],
    label: 'Theme name',
    stored: (studioId) => t.db('themes').where({ studio_id: studioId }),
  },
  {
    what: 'market place',
    send: (owner, base) => owner.post(`${base}/markets`).send({ name: 'Wickerby fair', place: 'Hall\u2066 B', start: '2027-03-06' }),
    path: ['place'],
    label: 'Place',
    stored: (studioId) => t.db('markets').where({ studio_id: studioId }),
  },
  {
    what: 'market name',
    send: (owner, base) => owner.post(`${base}/markets`).send({ name: override, place: '', start: '2027-03-06' }),
    path: ['name'],
    label: 'Market name',
    stored: (studioId) => t.db('markets').where({ studio_id: studioId }),
  },
  {
    what: 'runway template name',
    send: (owner, base) => owner.post(`${base}/runway-templates`).send({ name: override, steps: smallSteps }),
    path: ['name'],
    label: 'Template name',
    stored: (studioId) => t.db('runway_templates').where({ studio_id: studioId }),
  },
];

describe('names with control or text-direction characters', () => {
  it.each(cases.map((one) => [one.what, one] as const))('when a %s has one, then 400 names the field and nothing is stored', async (_what, one) => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const owner = await signIn(t.app, members.owner.email);
    const response = await one.send(owner, `/api/studios/${studioId}`);
    expect(response.status).toBe(400);
    expect(response.body.error.issues).toEqual([{ path: one.path, message: controlMessage(one.label) }]);
    expect(await one.stored(studioId)).toEqual([]);
  });

  it('when a market has notes over several lines with a tab, then they are kept as written', async () => {
    const { studioId, members } = await makeStudio(t.db, ['owner']);
    const owner = await signIn(t.app, members.owner.email);
    const notes = 'Bring the weights.\n\tAnd the spare table.';
    const response = await owner.post(`/api/studios/${studioId}/markets`).send({ name: 'Wickerby fair', place: '', start: '2027-03-06', notes });
    expect(response.status).toBe(201);
    expect(response.body.notes).toBe(notes);
  });
});
