// Issue #22, item 6: a commit that died leaves a claim that is released after a time-out or at
// start-up; commits that deadlock are retried once, then answer 409; the same file committed twice
// at once is stored once.
import fs from 'node:fs';
import path from 'node:path';
import { releaseInterruptedCommits } from '../../server/imports/import-claims';
import { nothingStored, useImportsApp } from './imports-kit';

const dataDir = path.resolve(__dirname, '../../data');
const kit = useImportsApp();
const { owner, upload, stored } = kit;
const commitUrl = (studioId: number, importId: number) => `/api/studios/${studioId}/imports/${importId}/commit`;

/** What a commit that died with its database leaves: the claim and its last progress, no rows (rolled back). */
async function leaveClaim(studioId: number, importId: number, minutesAgo: number) {
  await kit.t.db('imports').where({ id: importId }).update({ status: 'committing' });
  await kit.t.db('import_progress').insert({ import_id: importId, studio_id: studioId, rows_done: 800, updated_at: kit.t.db.raw('NOW() - INTERVAL ? SECOND', [minutesAgo * 60]) });
}

describe('a claim whose commit died', () => {
  it('when its last progress is 11 minutes old, then a commit releases it and stores the whole file', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, fs.readFileSync(path.join(dataDir, 'sales.csv')));
    await leaveClaim(studioId, preview.body.id, 11);
    const answer = await agent.post(commitUrl(studioId, preview.body.id)).send({});
    expect(answer.status).toBe(200);
    expect((await stored(studioId)).sales).toBe(1521);
    expect(await kit.t.db('import_progress').where({ import_id: preview.body.id }).first()).toBeUndefined();
  });

  it('when its last progress is 11 minutes old, then a delete releases it and removes the import', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'month,term,value\n2025-01,oak tray,3\n2025-02,oak tray,4\n');
    await leaveClaim(studioId, preview.body.id, 11);
    expect((await agent.delete(`/api/studios/${studioId}/imports/${preview.body.id}`)).status).toBe(204);
    expect(await kit.t.db('imports').where({ id: preview.body.id }).first()).toBeUndefined();
  });

  it('when its last progress is a minute old, then commit and delete still answer 409 and the claim stays', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'month,term,value\n2025-01,oak tray,3\n2025-02,oak tray,4\n');
    await leaveClaim(studioId, preview.body.id, 1);
    const answer = await agent.post(commitUrl(studioId, preview.body.id)).send({});
    expect(answer.status).toBe(409);
    expect(answer.body.error).toMatchObject({ code: 'commit_running', message: expect.stringContaining('10 minutes after its last progress') });
    expect((await agent.delete(`/api/studios/${studioId}/imports/${preview.body.id}`)).status).toBe(409);
    expect(await kit.t.db('imports').where({ id: preview.body.id }).first('status')).toEqual({ status: 'committing' });
  });

  it('when a live transaction holds the import, then even an old claim is not released', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'month,term,value\n2025-01,oak tray,3\n2025-02,oak tray,4\n');
    await leaveClaim(studioId, preview.body.id, 11);
    const holder = await kit.t.db.transaction();
    try {
      // A running commit locks its import's row from its first statement until it ends.
      await holder('imports').where({ id: preview.body.id }).forUpdate().first('id');
      expect((await agent.post(commitUrl(studioId, preview.body.id)).send({})).status).toBe(409);
    } finally {
      await holder.rollback();
    }
    expect(await kit.t.db('imports').where({ id: preview.body.id }).first('status')).toEqual({ status: 'committing' });
  });

  it('when the server starts, then releaseInterruptedCommits frees claims older than a minute that no transaction holds', async () => {
    const { studioId, agent } = await owner();
    const old = await upload(agent, studioId, 'month,term,value\n2025-01,oak tray,3\n2025-02,oak tray,4\n');
    const fresh = await upload(agent, studioId, 'month,term,value\n2025-01,birch tray,3\n2025-02,birch tray,4\n');
    await leaveClaim(studioId, old.body.id, 2);
    await leaveClaim(studioId, fresh.body.id, 0);
    expect(await releaseInterruptedCommits(kit.t.db)).toContain(old.body.id);
    const detail = await agent.get(`/api/studios/${studioId}/imports/${old.body.id}`);
    expect(detail.body).toMatchObject({ status: 'failed', failure: expect.stringContaining('interrupted') });
    expect(await kit.t.db('imports').where({ id: fresh.body.id }).first('status')).toEqual({ status: 'committing' });
    expect((await agent.post(commitUrl(studioId, old.body.id)).send({})).status).toBe(200);
  });
});

describe('two imports of the same file committed at once', () => {
  it('when both commit together, then one stores the file, the other answers 409 duplicate_file and stays a preview', async () => {
    const { studioId, agent } = await owner();
    const content = fs.readFileSync(path.join(dataDir, 'sales.csv'));
    const first = await upload(agent, studioId, content);
    const second = await upload(agent, studioId, content);
    const answers = await Promise.all([first, second].map((preview) => agent.post(commitUrl(studioId, preview.body.id)).send({})));
    expect(answers.map((answer) => answer.status).sort()).toEqual([200, 409]);
    const loser = answers.find((answer) => answer.status === 409)!;
    expect(loser.body.error.code).toBe('duplicate_file');
    expect((await stored(studioId)).sales).toBe(1521);
    const loserId = answers[0].status === 409 ? first.body.id : second.body.id;
    expect(await kit.t.db('imports').where({ id: loserId }).first('status', 'failure')).toEqual({ status: 'preview', failure: null });
  });
});

/** Waits until a connection runs this studio's insert of the series `term`: the commit, waiting for its lock. */
async function commitWaitsFor(studioId: number, term: string): Promise<void> {
  for (let i = 0; i < 200; i++) {
    const [rows] = await kit.t.db.raw(
      "SELECT id FROM information_schema.processlist WHERE db = DATABASE() AND info LIKE 'INSERT INTO series%' AND info LIKE ?",
      [`%(${studioId}, 'interest', '${term}'%`],
    );
    if ((rows as unknown[]).length > 0) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error(`the commit never waited for the series "${term}"`);
}

/**
 * A heavy rival transaction (MariaDB rolls back the lighter side of a deadlock: the commit) that
 * holds the series "alpha" the file's second term needs, while the commit holds "beta".
 */
async function rival(studioId: number) {
  const trx = await kit.t.db.transaction();
  const series = (term: string) => ({ studio_id: studioId, kind: 'interest', term, region: '', period: 'monthly' });
  await trx('series').insert(Array.from({ length: 300 }, (_, i) => series(`filler ${i}`)));
  await trx.raw('INSERT INTO series (studio_id, kind, term, region, period) VALUES (?, ?, ?, ?, ?)', Object.values(series('alpha')));
  return { trx, takeBeta: () => trx.raw('INSERT INTO series (studio_id, kind, term, region, period) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE updated_at = NOW()', Object.values(series('beta'))) };
}

describe('a commit that deadlocks', () => {
  const file = 'month,term,value\n2025-01,beta,3\n2025-01,alpha,4\n2025-02,beta,5\n2025-02,alpha,6\n';

  it('when it is the victim once, then it is retried and stores the file', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, file);
    const other = await rival(studioId);
    try {
      const answer = agent.post(commitUrl(studioId, preview.body.id)).send({}).then((response) => response);
      await commitWaitsFor(studioId, 'alpha');
      await other.takeBeta();
      // The commit was rolled back and waits again, for "beta" this time; the rival gives way.
      await commitWaitsFor(studioId, 'beta');
      await other.trx.rollback();
      expect((await answer).status).toBe(200);
    } finally {
      if (!other.trx.isCompleted()) await other.trx.rollback();
    }
    expect(await stored(studioId)).toMatchObject({ series: 2, points: 4, sales: 0 });
  }, 20_000);

  it('when it is the victim twice, then it answers 409 commit_conflict in plain words and stores nothing', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, file);
    const other = await rival(studioId);
    let response;
    try {
      const answer = agent.post(commitUrl(studioId, preview.body.id)).send({}).then((result) => result);
      await commitWaitsFor(studioId, 'alpha');
      await other.takeBeta();
      await commitWaitsFor(studioId, 'beta');
      // The retry holds its import's row and waits for "beta": ask for the row to close the circle again.
      await other.trx('imports').where({ id: preview.body.id }).forUpdate().first('id');
      await other.trx.rollback();
      response = await answer;
    } finally {
      if (!other.trx.isCompleted()) await other.trx.rollback();
    }
    expect(response.status).toBe(409);
    expect(response.body.error).toMatchObject({ code: 'commit_conflict', message: expect.stringContaining('nothing of this file was stored') });
    expect(await stored(studioId)).toEqual(nothingStored);
    const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
    expect(detail.body).toMatchObject({ status: 'failed', failure: response.body.error.message });
    expect((await agent.post(commitUrl(studioId, preview.body.id)).send({})).status).toBe(200);
  }, 20_000);
});
