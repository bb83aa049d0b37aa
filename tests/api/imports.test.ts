import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { createDb } from '../../server/db';
import { ImportService } from '../../server/imports/import-service';
import { anonymousAgent, makeStudio, makeTestApp, signIn, testConfig, type Agent, type TestApp } from '../helpers/test-app';
import { appClock } from '../../server/clock/clock';

const dataDir = path.resolve(__dirname, '../../data');
const fixtureDir = path.resolve(__dirname, '../fixtures/imports');
let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  // Previews this file left uncommitted keep their uploads in the temp folder; remove them.
  const left: string[] = await t.db('imports').whereNotNull('stored_path').pluck('stored_path');
  await Promise.all(left.map((file) => fs.promises.rm(file, { force: true })));
  await t.close();
});

async function owner() {
  const studio = await makeStudio(t.db);
  return { ...studio, agent: await signIn(t.app, studio.members.owner.email) };
}

function upload(agent: Agent, studioId: number, content: string | Buffer, name = 'file.csv', fields: Record<string, string> = {}) {
  let req = agent.post(`/api/studios/${studioId}/imports`).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), name);
  for (const [key, value] of Object.entries(fields)) req = req.field(key, value);
  return req;
}

const dataFile = (name: string) => fs.readFileSync(path.join(dataDir, name));
const fixture = (name: string) => fs.readFileSync(path.join(fixtureDir, name));

async function counts(studioId: number) {
  const count = async (table: string) => Number((await t.db(table).where({ studio_id: studioId }).count({ n: '*' }).first())?.n ?? 0);
  return { imports: await count('imports'), series: await count('series'), points: await count('series_points'), sales: await count('sales') };
}

describe('importing wide weekly interest end to end', () => {
  it('when the owner uploads, commits, lists, opens and deletes, then each step answers the issue 3 shapes and the rows follow', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, dataFile('interest-weekly.csv'), 'interest-weekly.csv');
    expect(preview.status).toBe(201);
    expect(preview.body).toMatchObject({
      status: 'preview',
      kind: 'interest',
      layout: 'wide',
      delimiter: ',',
      period: 'weekly',
      dateFormat: 'YYYY-MM-DD',
      headerRow: 4,
      rows: 264,
      hasErrors: false,
      duplicateOf: null,
      mapping: { date: 'Week', terms: expect.arrayContaining(['herb planter box: (US)']) },
    });
    expect(preview.body.sample).toHaveLength(10);
    expect(preview.body.sample[0][0]).toBe('2021-11-07');
    expect(preview.body.columns[1]).toMatchObject({ name: 'herb planter box: (US)', role: 'series', term: 'herb planter box', region: 'US' });
    expect(preview.body.problems.filter((p: { severity: string }) => p.severity === 'error')).toEqual([]);
    const stored = await t.db('imports').where({ id: preview.body.id }).first();
    expect(stored).toMatchObject({ status: 'preview', studio_id: studioId, row_count: 264, sha256: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(fs.existsSync(stored.stored_path)).toBe(true);
    expect(await counts(studioId)).toMatchObject({ series: 0, points: 0 });

    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(200);
    expect(commit.body).toMatchObject({ id: preview.body.id, status: 'committed', sales: { rows: 0 } });
    expect(commit.body.series).toHaveLength(6);
    expect(commit.body.series[0]).toEqual({ id: expect.any(Number), term: expect.any(String), region: 'US', kind: 'interest', period: 'weekly', points: 264 });
    expect(await counts(studioId)).toMatchObject({ series: 6, points: 6 * 264, sales: 0 });
    const series = await t.db('series').where({ studio_id: studioId, term: 'herb planter box' }).first();
    expect(series).toMatchObject({ kind: 'interest', region: 'US', period: 'weekly', start_date: '2021-11-07', points: 264 });
    const first = await t.db('series_points').where({ series_id: series.id, date: '2021-11-07' }).first();
    expect(first).toMatchObject({ value: 11, below_one: false, import_id: preview.body.id });
    expect(fs.existsSync(stored.stored_path)).toBe(false);

    const list = await agent.get(`/api/studios/${studioId}/imports`);
    expect(list.status).toBe(200);
    expect(list.body).toEqual([
      expect.objectContaining({
        id: preview.body.id,
        fileName: 'interest-weekly.csv',
        kind: 'interest',
        status: 'committed',
        rows: 264,
        seriesCount: 6,
        periodStart: '2021-11-07',
        createdBy: { id: expect.any(Number), name: 'owner person' },
        committedAt: expect.any(String),
      }),
    ]);

    const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.series).toHaveLength(6);
    expect(detail.body.series[0].values).toHaveLength(264);
    expect(detail.body.preview).toBeNull();

    const removed = await agent.delete(`/api/studios/${studioId}/imports/${preview.body.id}`);
    expect(removed.status).toBe(204);
    expect(await counts(studioId)).toEqual({ imports: 0, series: 0, points: 0, sales: 0 });
  });
});

describe('other formats', () => {
  it('when a long monthly file is imported, then one monthly series per term and region is stored', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, dataFile('interest-long-monthly.csv'));
    expect(preview.body).toMatchObject({ layout: 'long', period: 'monthly', mapping: { date: 'month', term: 'term', value: 'value', region: 'region' } });
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(200);
    expect(commit.body.series.map((s: { term: string }) => s.term).sort()).toEqual(['herb planter box', 'hex wall shelf', 'lantern panel']);
    expect(commit.body.series.every((s: { period: string; points: number }) => s.period === 'monthly' && s.points === 60)).toBe(true);
    const point = await t.db('series_points as p').join('series as s', 's.id', 'p.series_id').where({ 's.studio_id': studioId, 's.term': 'lantern panel', 'p.date': '2021-12-01' }).first('p.value');
    expect(point.value).toBe(88);
  });

  it('when a sales file is imported, then every sale is stored in cents and weekly unit series are made per item', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, dataFile('sales.csv'), 'sales.csv');
    expect(preview.body).toMatchObject({ kind: 'sales', layout: 'sales', period: 'daily', rows: 1521, hasErrors: false });
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(200);
    expect(commit.body.sales).toEqual({ rows: 1521 });
    expect(await counts(studioId)).toMatchObject({ sales: 1521 });
    const sale = await t.db('sales').where({ studio_id: studioId, date: '2023-11-04', sku: 'LNT-WAL' }).first();
    expect(sale).toMatchObject({ item: 'Lantern panel, walnut', quantity: 1, revenue_cents: 5400, channel: 'market', currency: 'USD' });
    const series = await t.db('series').where({ studio_id: studioId, kind: 'sales', term: 'Pumpkin porch sign' }).first();
    expect(series).toMatchObject({ period: 'weekly' });
    // 2023-11-04 is a Saturday; its ISO week starts on Monday 2023-10-30.
    const week = await t.db('series_points').where({ series_id: series.id, date: '2023-10-30' }).first();
    const units = await t.db('sales').where({ studio_id: studioId, item: 'Pumpkin porch sign' }).whereBetween('date', ['2023-10-30', '2023-11-05']).sum({ n: 'quantity' }).first();
    expect(week.value).toBe(Number(units?.n));
  });

  it("when the studio has its own channel, then sales map onto it; a channel it does not have is stored as other with a warning", async () => {
    const { studioId, agent } = await owner();
    await agent.patch(`/api/studios/${studioId}`).send({ channels: ['market', 'online', 'Gallery Shop'] }).expect(200);
    const file = 'date,item,quantity,revenue,channel\n2025-03-01,Lantern panel,1,54.00,gallery shop\n2025-03-02,Lantern panel,1,54.00,Craft fair\n2025-03-03,Lantern panel,1,54.00,Pop-up van\n';
    const preview = await upload(agent, studioId, file, 'channels.csv');
    expect(preview.status).toBe(201);
    expect(preview.body.hasErrors).toBe(false);
    const warnings = preview.body.problems.filter((problem: { severity: string }) => problem.severity === 'warning');
    expect(warnings).toEqual([expect.objectContaining({ row: 4, column: 'channel', message: expect.stringContaining('"Pop-up van" is not one of the studio\'s channels (market, online, Gallery Shop)') })]);
    await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({}).expect(200);
    const channels = await t.db('sales').where({ studio_id: studioId }).orderBy('date').pluck('channel');
    // "Craft fair" is one of the synonyms of market (shared/csv/csv-channels.ts).
    expect(channels).toEqual(['Gallery Shop', 'market', 'other']);
  });

  it('when sales carry quoted names, currency signs, refunds and formula-like text, then they are stored as written text and cents', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, fixture('sales-tricky.csv'));
    expect(preview.body.hasErrors).toBe(false);
    expect(preview.body.problems).toEqual(expect.arrayContaining([expect.objectContaining({ code: 'formula-like', row: 4, column: 'Item', severity: 'warning' })]));
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(200);
    const rows = await t.db('sales').where({ studio_id: studioId }).orderBy('id').select('item', 'quantity', 'revenue_cents', 'channel');
    expect(rows).toEqual([
      { item: 'Lantern panel, walnut', quantity: 2, revenue_cents: 124000, channel: 'market' },
      { item: 'The "Big" herb planter', quantity: 1, revenue_cents: 3850, channel: 'booth' },
      { item: '=HYPERLINK("x")', quantity: 1, revenue_cents: 1000, channel: 'online' },
      { item: 'Pumpkin porch sign', quantity: -1, revenue_cents: -2400, channel: 'online' },
      { item: "Maker's back\\slash sign", quantity: 1, revenue_cents: 500, channel: 'booth' },
    ]);
  });

  it('when a semicolon file with a byte-order mark, CRLF and D.M.YYYY dates comes in, then it is read without a mapping', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, '\ufeffTag;lantern panel\r\n05.01.2025;4\r\n12.01.2025;<1');
    expect(preview.body).toMatchObject({ delimiter: ';', dateFormat: 'D.M.YYYY', period: 'weekly', rows: 2 });
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(200);
    const points = await t.db('series_points').where({ studio_id: studioId }).orderBy('date').select('date', 'value', 'below_one');
    expect(points).toEqual([
      { date: '2025-01-05', value: 4, below_one: false },
      { date: '2025-01-12', value: 0.5, below_one: true },
    ]);
  });

  it('when slash dates read both ways, then the preview asks, the commit needs dateOrder, and DMY stores day-first dates', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'date,lantern panel\n1/2/2025,4\n1/3/2025,5\n1/4/2025,6');
    expect(preview.body.dateAmbiguous).toBe(true);
    expect(preview.body.problems).toEqual([expect.objectContaining({ code: 'date-ambiguous', column: 'date', severity: 'warning' })]);
    const refused = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(refused.status).toBe(400);
    expect(refused.body.error).toMatchObject({ code: 'date_order_needed', issues: [{ row: 1, column: 'date', path: ['dateOrder'] }] });
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({ dateOrder: 'DMY' });
    expect(commit.status).toBe(200);
    const series = await t.db('series').where({ studio_id: studioId }).first();
    expect(series).toMatchObject({ period: 'monthly', start_date: '2025-02-01', end_date: '2025-04-01' });
  });

  it('when the mapping is corrected before commit, then the preview is checked again with it', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'when,alpha,beta\n2025-01-05,1,2\n2025-01-12,3,4');
    expect(preview.body.mapping).toEqual({ date: 'when', terms: ['alpha', 'beta'] });
    const changed = await agent.patch(`/api/studios/${studioId}/imports/${preview.body.id}`).send({ mapping: { date: 'when', terms: ['beta'] } });
    expect(changed.status).toBe(200);
    expect(changed.body.columns.map((c: { role: string }) => c.role)).toEqual(['date', 'ignored', 'series']);
    const wrong = await agent.patch(`/api/studios/${studioId}/imports/${preview.body.id}`).send({ mapping: { date: 'when', terms: ['gamma'] } });
    expect(wrong.body.problems).toEqual([expect.objectContaining({ code: 'unknown-column', column: 'gamma', row: 1 })]);
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({ mapping: { date: 'when', terms: ['beta'] } });
    expect(commit.status).toBe(200);
    expect(commit.body.series).toEqual([expect.objectContaining({ term: 'beta', points: 2 })]);
  });
});

describe('bad input names the row and column and stores nothing', () => {
  const header200 = ['date', ...Array.from({ length: 200 }, (_, i) => `term ${i}`)].join(',');
  it.each([
    ['a binary file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x14, 0x00, 0x08, 0x00]), 'csv_not_csv', 1],
    ['an empty file', Buffer.alloc(0), 'csv_empty', 1],
    ['a header only', 'Week,lantern panel\n', 'csv_header_only', 1],
    ['no date column', 'term,score\nlantern panel,4\nherb planter box,6\n', 'csv_no_date_column', 1],
    ['more than 200 columns', `${header200}\n2025-01-05,${Array.from({ length: 200 }, () => '1').join(',')}`, 'csv_too_many_columns', 1],
  ])('when the upload is %s, then 400 at upload and no import is kept', async (_, content, code, row) => {
    const { studioId, agent } = await owner();
    const response = await upload(agent, studioId, content as string | Buffer);
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ code, message: expect.any(String), issues: [{ row, path: [] }] });
    expect(await counts(studioId)).toEqual({ imports: 0, series: 0, points: 0, sales: 0 });
  });

  it.each([
    ['unparseable dates', 'Week,lantern panel\n2025-01-05,4\n2025-13-45,5\n2025-01-19,6', 'unparseable-date', 3, 'Week'],
    ['non-numeric values', 'Week,lantern panel\n2025-01-05,4\n2025-01-12,lots\n2025-01-19,6', 'not-a-number', 3, 'lantern panel'],
    ['a formula in a value cell', 'Week,lantern panel\n2025-01-05,4\n2025-01-12,=1+2\n2025-01-19,6', 'not-a-number', 3, 'lantern panel'],
    ['duplicate dates in one series', 'Week,lantern panel\n2025-01-05,4\n2025-01-12,5\n2025-01-12,6', 'duplicate-date', 4, 'Week'],
    ['mixed periods', 'Week,lantern panel\n2025-01-05,1\n2025-01-12,2\n2025-01-19,3\n2025-01-20,4\n2025-01-27,5', 'mixed-period', 5, 'Week'],
    ['a quote that is never closed', 'Week,lantern panel\n2025-01-05,4\n2025-01-12,"5\n2025-01-19,6', 'unclosed-quote', 3, null],
    ['a row longer than the header', 'Week,lantern panel\n2025-01-05,4\n2025-01-12,5,9\n2025-01-19,6', 'row-too-long', 3, null],
  ])('when the file has %s, then the preview lists it and the commit answers 400 with its row and column', async (_, text, code, row, column) => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, text);
    expect(preview.status).toBe(201);
    expect(preview.body.hasErrors).toBe(true);
    expect(preview.body.problems).toEqual(expect.arrayContaining([expect.objectContaining({ code, row, column, severity: 'error' })]));
    const commit = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(400);
    expect(commit.body.error.code).toBe('file_has_problems');
    expect(commit.body.error.message).toContain(`row ${row}`);
    expect(commit.body.error.issues).toEqual(expect.arrayContaining([{ row, ...(column ? { column } : {}), message: expect.any(String), path: [] }]));
    expect(await counts(studioId)).toMatchObject({ series: 0, points: 0, sales: 0 });
  });

  it('when a problem sits beyond the first 64 KB, then the streaming pass still finds it by row', async () => {
    const { studioId, agent } = await owner();
    const lines = ['date,item,quantity,revenue'];
    for (let i = 0; i < 4000; i++) lines.push(`2025-01-${String((i % 28) + 1).padStart(2, '0')},Lantern panel number ${i},1,10.00`);
    lines.push('2025-02-01,Lantern panel,two,10.00');
    const preview = await upload(agent, studioId, lines.join('\n'));
    expect(preview.body.rows).toBe(4001);
    expect(preview.body.problems).toEqual([expect.objectContaining({ code: 'not-a-number', row: 4002, column: 'quantity' })]);
  });

  it('when a quote beyond the first 64 KB is never closed, then the upload answers 400 naming its line', async () => {
    const { studioId, agent } = await owner();
    const lines = ['date,item,quantity,revenue'];
    for (let i = 0; i < 4000; i++) lines.push(`2025-01-${String((i % 28) + 1).padStart(2, '0')},Lantern panel number ${i},1,10.00`);
    lines.push('2025-02-01,"Lantern panel,1,10.00', '2025-02-02,Lantern panel,1,10.00');
    const response = await upload(agent, studioId, lines.join('\n'));
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ code: 'csv_unclosed_quote', issues: [{ row: 4002, path: [] }] });
    expect((await counts(studioId)).imports).toBe(0);
  });

  it('when kind or mapping fields are malformed, then 400 names the field', async () => {
    const { studioId, agent } = await owner();
    const kind = await upload(agent, studioId, 'Week,a\n2025-01-05,1', 'x.csv', { kind: 'weather' });
    expect(kind.status).toBe(400);
    expect(kind.body.error.issues[0].path).toEqual(['kind']);
    const mapping = await upload(agent, studioId, 'Week,a\n2025-01-05,1', 'x.csv', { mapping: '{not json' });
    expect(mapping.status).toBe(400);
    expect(mapping.body.error.issues[0].path).toEqual(['mapping']);
    const missing = await agent.post(`/api/studios/${studioId}/imports`).field('kind', 'sales');
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0].path).toEqual(['file']);
    expect((await counts(studioId)).imports).toBe(0);
  });

  it('when the file is over the upload limit, then 413 and nothing is kept', async () => {
    const small = makeTestApp({ config: testConfig({ UPLOAD_LIMIT_MB: '0.01' }) });
    try {
      const { studioId, members } = await makeStudio(small.db);
      const agent = await signIn(small.app, members.owner.email);
      const big = `Week,a\n${Array.from({ length: 2000 }, (_, i) => `2025-01-05,${i}`).join('\n')}`;
      const response = await upload(agent, studioId, big);
      expect(response.status).toBe(413);
      expect(response.body.error).toMatchObject({ code: 'too_large', message: expect.stringContaining('0.01 MB') });
      expect(await small.db('imports').where({ studio_id: studioId }).count({ n: '*' }).first()).toEqual({ n: 0 });
    } finally {
      await small.close();
    }
  });
});

describe('uncommitted previews', () => {
  it('when a preview is a day old, then the next upload removes it and its stored file', async () => {
    const { studioId, agent } = await owner();
    const old = await upload(agent, studioId, 'Week,a\n2025-01-05,1\n2025-01-12,2');
    const stored = await t.db('imports').where({ id: old.body.id }).first();
    await t.db('imports').where({ id: old.body.id }).update({ created_at: new Date(appClock.now().getTime() - 25 * 3600 * 1000) });
    const fresh = await upload(agent, studioId, 'Week,b\n2025-01-05,1\n2025-01-12,2');
    expect(fresh.status).toBe(201);
    expect(await t.db('imports').where({ id: old.body.id }).first()).toBeUndefined();
    expect(fs.existsSync(stored.stored_path)).toBe(false);
    expect(await t.db('imports').where({ id: fresh.body.id }).first()).toMatchObject({ status: 'preview' });
  });
});

describe('all or nothing', () => {
  it('when the commit fails halfway, then the transaction leaves no sales, points or series and the import is failed', async () => {
    const { studioId, agent, members } = await owner();
    const preview = await upload(agent, studioId, dataFile('sales.csv'));
    const failing = new ImportService(t.db, { batchSize: 100, failAfterRows: 500 });
    const studio = { id: studioId, role: 'owner' as const };
    await expect(failing.commit(studio, preview.body.id, {})).rejects.toThrow('Injected failure after 500 rows');
    expect(await counts(studioId)).toEqual({ imports: 1, series: 0, points: 0, sales: 0 });
    const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
    // The import keeps a plain sentence; the error itself is for the server's log.
    expect(detail.body).toMatchObject({ status: 'failed', failure: expect.stringContaining('nothing was stored') });
    expect(detail.body.failure).not.toContain('Injected');
    expect(members.owner.id).toBeGreaterThan(0);
    // The same upload can be committed once the trouble is gone.
    const retry = await agent.post(`/api/studios/${studioId}/imports/${preview.body.id}/commit`).send({});
    expect(retry.status).toBe(200);
    expect((await counts(studioId)).sales).toBe(1521);
  });

  it('when commits end, well or badly, then their pooled connection checks foreign keys again', async () => {
    // One connection, so the commits and the check below all use the same session.
    const single = createDb(testConfig(), { min: 0, max: 1 });
    try {
      const { studioId, agent } = await owner();
      const studio = { id: studioId, role: 'owner' as const };
      const checks = async () => ((await single.raw('SELECT @@SESSION.foreign_key_checks AS checks'))[0][0] as { checks: number }).checks;
      const failed = await upload(agent, studioId, dataFile('sales.csv'));
      await expect(new ImportService(single, { batchSize: 100, failAfterRows: 500 }).commit(studio, failed.body.id, {})).rejects.toThrow('Injected failure');
      expect(await checks()).toBe(1);
      await new ImportService(single, { batchSize: 100 }).commit(studio, failed.body.id, {});
      expect(await checks()).toBe(1);
      expect((await counts(studioId)).sales).toBe(1521);
      // With the checks back on, a sale naming a studio that does not exist is refused again.
      await expect(single('sales').insert({ studio_id: 0, import_id: failed.body.id, date: '2025-01-01', item: 'x', quantity: 1, revenue_cents: 1, channel: 'other' })).rejects.toThrow(/foreign key/i);
    } finally {
      await single.destroy();
    }
  });

  it('when the same preview is committed twice at once, then one commit stores it and the other answers 409', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, dataFile('sales.csv'));
    const url = `/api/studios/${studioId}/imports/${preview.body.id}/commit`;
    const [first, second] = await Promise.all([agent.post(url).send({}), agent.post(url).send({})]);
    expect([first.status, second.status].sort()).toEqual([200, 409]);
    expect((await counts(studioId)).sales).toBe(1521);
  });

  it('when a commit is under way, then GET shows committing with progress rows from outside the transaction', async () => {
    const { studioId, agent } = await owner();
    const lines = ['date,item,quantity,revenue'];
    for (let i = 0; i < 30_000; i++) lines.push(`2025-01-${String((i % 28) + 1).padStart(2, "0")},Item ${i % 50},1,10.00`);
    const preview = await upload(agent, studioId, lines.join('\n'));
    const slow = new ImportService(t.db, { batchSize: 200 });
    const commit = slow.commit({ id: studioId, role: 'owner' }, preview.body.id, {});
    let seen = { status: 'preview', progressRows: 0 };
    for (let i = 0; i < 200 && !(seen.status === 'committing' && seen.progressRows > 0); i++) {
      seen = (await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`)).body;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    await commit;
    expect(seen.status).toBe('committing');
    expect(seen.progressRows).toBeGreaterThan(0);
    expect(seen.progressRows).toBeLessThanOrEqual(30_000);
  }, 30_000);
});

describe('the same file twice, and merging', () => {
  it('when a committed file comes again, then the preview says when, and skip or replace decide', async () => {
    const { studioId, agent } = await owner();
    const content = dataFile('interest-long-monthly.csv');
    const first = await upload(agent, studioId, content, 'first.csv');
    await agent.post(`/api/studios/${studioId}/imports/${first.body.id}/commit`).send({});
    const again = await upload(agent, studioId, content, 'again.csv');
    expect(again.body.duplicateOf).toEqual({ id: first.body.id, fileName: 'first.csv', committedAt: expect.any(String) });
    const asked = await agent.post(`/api/studios/${studioId}/imports/${again.body.id}/commit`).send({});
    expect(asked.status).toBe(409);
    expect(asked.body).toMatchObject({ error: { code: 'duplicate_file' }, duplicateOf: { id: first.body.id } });
    const skipped = await agent.post(`/api/studios/${studioId}/imports/${again.body.id}/commit`).send({ onDuplicate: 'skip' });
    expect(skipped.body).toMatchObject({ id: first.body.id, status: 'committed', skipped: true });
    expect(await counts(studioId)).toEqual({ imports: 1, series: 3, points: 180, sales: 0 });

    const seriesBefore = await t.db('series').where({ studio_id: studioId }).orderBy('id').pluck('id');
    const third = await upload(agent, studioId, content, 'third.csv');
    const replaced = await agent.post(`/api/studios/${studioId}/imports/${third.body.id}/commit`).send({ onDuplicate: 'replace' });
    expect(replaced.status).toBe(200);
    expect(replaced.body.id).toBe(third.body.id);
    expect(await counts(studioId)).toEqual({ imports: 1, series: 3, points: 180, sales: 0 });
    expect(await t.db('imports').where({ id: first.body.id }).first()).toBeUndefined();
    // Replacing keeps the series ids, so theme members and scores still point at them.
    expect(await t.db('series').where({ studio_id: studioId }).orderBy('id').pluck('id')).toEqual(seriesBefore);
    expect(await t.db('import_series').where({ import_id: third.body.id }).sum({ n: 'points_replaced' }).first()).toEqual({ n: 0 });
  });

  it('when two imports hold the same series, then they merge, newer points win, the history counts them, and deleting one keeps the other', async () => {
    const { studioId, agent } = await owner();
    const older = await upload(agent, studioId, 'month,term,value\n2025-01,lantern panel,10\n2025-02,lantern panel,11\n2025-03,lantern panel,12');
    await agent.post(`/api/studios/${studioId}/imports/${older.body.id}/commit`).send({});
    const newer = await upload(agent, studioId, 'month,term,value\n2025-03,lantern panel,50\n2025-04,lantern panel,51');
    const commit = await agent.post(`/api/studios/${studioId}/imports/${newer.body.id}/commit`).send({});
    expect(commit.body.series).toEqual([expect.objectContaining({ term: 'lantern panel', points: 2 })]);
    const series = await t.db('series').where({ studio_id: studioId }).select();
    expect(series).toHaveLength(1);
    expect(series[0]).toMatchObject({ points: 4, start_date: '2025-01-01', end_date: '2025-04-01' });
    const march = await t.db('series_points').where({ series_id: series[0].id, date: '2025-03-01' }).first();
    expect(march).toMatchObject({ value: 50, import_id: newer.body.id });
    const detail = await agent.get(`/api/studios/${studioId}/imports/${newer.body.id}`);
    expect(detail.body.series[0]).toMatchObject({ points: 2, replaced: 1, total: 4 });

    await agent.delete(`/api/studios/${studioId}/imports/${newer.body.id}`).expect(204);
    const left = await t.db('series_points').where({ series_id: series[0].id }).orderBy('date').select('date', 'value');
    expect(left).toEqual([
      { date: '2025-01-01', value: 10 },
      { date: '2025-02-01', value: 11 },
    ]);
    expect(await t.db('series').where({ id: series[0].id }).first()).toMatchObject({ points: 2, end_date: '2025-02-01' });
  });
});

describe('access', () => {
  async function setUp() {
    const { studioId, members, agent } = await owner();
    const preview = await upload(agent, studioId, 'Week,a\n2025-01-05,1\n2025-01-12,2');
    return { studioId, members, importId: preview.body.id as number };
  }
  const routes = (studioId: number, importId: number) => [
    { method: 'get', url: `/api/studios/${studioId}/imports`, write: false },
    { method: 'get', url: `/api/studios/${studioId}/imports/${importId}`, write: false },
    { method: 'post', url: `/api/studios/${studioId}/imports`, write: true },
    { method: 'patch', url: `/api/studios/${studioId}/imports/${importId}`, write: true },
    { method: 'post', url: `/api/studios/${studioId}/imports/${importId}/commit`, write: true },
    { method: 'delete', url: `/api/studios/${studioId}/imports/${importId}`, write: true },
  ] as const;

  it('when anonymous, then every route answers 401', async () => {
    const { studioId, importId } = await setUp();
    const agent = await anonymousAgent(t.app);
    for (const route of routes(studioId, importId)) {
      expect([route.url, (await agent[route.method](route.url)).status]).toEqual([route.url, 401]);
    }
    expect((await request(t.app).get(`/api/studios/${studioId}/imports`)).status).toBe(401);
  });

  it('when crew, then reading works and every write answers 403 with nothing changed', async () => {
    const { studioId, importId, members } = await setUp();
    const crew = await signIn(t.app, members.crew.email);
    for (const route of routes(studioId, importId)) {
      const response = route.method === 'post' && !route.url.endsWith('commit')
        ? await upload(crew, studioId, 'Week,a\n2025-01-05,1')
        : await crew[route.method](route.url).send({});
      expect([route.method, route.url, response.status]).toEqual([route.method, route.url, route.write ? 403 : 200]);
    }
    expect(await counts(studioId)).toEqual({ imports: 1, series: 0, points: 0, sales: 0 });
  });

  it('when a partner, then they may import and delete', async () => {
    const { studioId, importId, members } = await setUp();
    const partner = await signIn(t.app, members.partner.email);
    expect((await partner.post(`/api/studios/${studioId}/imports/${importId}/commit`).send({})).status).toBe(200);
    expect((await partner.delete(`/api/studios/${studioId}/imports/${importId}`)).status).toBe(204);
  });

  it('when a member of another studio, then every route answers 404', async () => {
    const { studioId, importId } = await setUp();
    const other = await owner();
    for (const route of routes(studioId, importId)) {
      const response = await other.agent[route.method](route.url).send({});
      expect([route.url, response.status]).toEqual([route.url, 404]);
    }
    // Their own studio's URL with this studio's import id is a 404 too.
    expect((await other.agent.get(`/api/studios/${other.studioId}/imports/${importId}`)).status).toBe(404);
    expect((await other.agent.delete(`/api/studios/${other.studioId}/imports/${importId}`)).status).toBe(404);
    expect(await counts(studioId)).toMatchObject({ imports: 1 });
  });
});
