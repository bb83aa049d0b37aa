// What the import API tests share: an app whose leftover uploads are tidied away, a signed-in owner
// of a new studio, uploads, and counts of what a studio holds.
import fs from 'node:fs';
import { makeStudio, makeTestApp, signIn, type Agent, type TestApp } from '../helpers/test-app';

export interface ImportsKit {
  /** The app and its database, made in beforeAll. */
  readonly t: TestApp;
  owner(): Promise<Awaited<ReturnType<typeof makeStudio>> & { agent: Agent }>;
  upload(agent: Agent, studioId: number, content: string | Buffer): ReturnType<Agent['post']>;
  stored(studioId: number): Promise<{ series: number; points: number; sales: number; history: number }>;
}

/** What a studio holds when an import stored nothing. */
export const nothingStored = { series: 0, points: 0, sales: 0, history: 0 };

/** Registers the hooks of a test file of the imports area and returns its helpers. */
export function useImportsApp(): ImportsKit {
  let app: TestApp | undefined;
  beforeAll(() => {
    app = makeTestApp();
  });
  afterAll(async () => {
    // Previews left uncommitted keep their uploads in the temp folder; remove them.
    const left: string[] = await kit.t.db('imports').whereNotNull('stored_path').pluck('stored_path');
    await Promise.all(left.map((file) => fs.promises.rm(file, { force: true })));
    await kit.t.close();
  });
  const kit: ImportsKit = {
    get t() {
      if (!app) throw new Error('the imports test app is made in beforeAll');
      return app;
    },
    async owner() {
      const studio = await makeStudio(kit.t.db);
      return { ...studio, agent: await signIn(kit.t.app, studio.members.owner.email) };
    },
    upload: (agent, studioId, content) =>
      agent.post(`/api/studios/${studioId}/imports`).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), 'upload.csv'),
    async stored(studioId) {
      const count = async (table: string) => Number((await kit.t.db(table).where({ studio_id: studioId }).count({ n: '*' }).first())?.n ?? 0);
      return { series: await count('series'), points: await count('series_points'), sales: await count('sales'), history: await count('import_series') };
    },
  };
  return kit;
}
