// Issue #22, item 5: cells the database cannot hold are problems at preview, by row and column;
// no commit answers 500 for a file's contents, and no SQL text reaches a client.
import { fixedClock, useClock } from '../../server/clock/clock';
import type { Agent } from '../helpers/test-app';
import { nothingStored, useImportsApp } from './imports-kit';

const kit = useImportsApp();
const { owner, upload, stored } = kit;
let restoreClock: () => void;
beforeAll(() => {
  // A studio's today of 15 March 2026 (UTC by default): sales dates run to 15 March 2027.
  restoreClock = useClock(fixedClock('2026-03-15T12:00:00Z'));
});
afterAll(() => restoreClock());

const commit = (agent: Agent, studioId: number, importId: number) => agent.post(`/api/studios/${studioId}/imports/${importId}/commit`).send({});

const sqlWords = /INSERT|UPDATE|SELECT|Data too long|Out of range|ER_/i;

describe('cells past the columns of the sales and series tables', () => {
  it.each([
    ['a quantity of 99999999999999999999', '2025-06-01,Oak tray,99999999999999999999,10.00', 'quantity', 'out-of-range'],
    ['a revenue of 99999999999999999999', '2025-06-01,Oak tray,1,99999999999999999999', 'revenue', 'out-of-range'],
    ['an item of 10,001 characters', `2025-06-01,${'w'.repeat(10_001)},1,10.00`, 'item', 'too-long'],
    ['a sale dated 1989', '1989-06-01,Oak tray,1,10.00', 'date', 'out-of-range'],
    ['a sale dated more than a year after the studio\'s today', '2027-03-16,Oak tray,1,10.00', 'date', 'out-of-range'],
  ])('when a sales file has %s, then the preview names row 3 and its column and the commit answers 400 with nothing stored', async (_, row, column, code) => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, `date,item,quantity,revenue\n2025-05-31,Oak tray,2,20.00\n${row}\n`);
    expect(preview.status).toBe(201);
    expect(preview.body.hasErrors).toBe(true);
    expect(preview.body.problems).toEqual([expect.objectContaining({ code, row: 3, column, severity: 'error' })]);
    const answer = await commit(agent, studioId, preview.body.id);
    expect(answer.status).toBe(400);
    expect(answer.body.error).toMatchObject({ code: 'file_has_problems', issues: [expect.objectContaining({ row: 3, column })] });
    expect(answer.body.error.message).toContain(`row 3, column "${column}"`);
    expect(await stored(studioId)).toEqual(nothingStored);
  });

  it('when a long interest file has a term of 5,000 characters, then the preview names its row and column and the commit answers 400', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, `month,term,value\n2025-01,oak tray,3\n2025-02,${'t'.repeat(5000)},4\n`);
    expect(preview.body.problems).toEqual([expect.objectContaining({ code: 'too-long', row: 3, column: 'term', severity: 'error' })]);
    expect(preview.body.problems[0].message.length).toBeLessThan(200);
    const answer = await commit(agent, studioId, preview.body.id);
    expect(answer.status).toBe(400);
    expect(await stored(studioId)).toEqual(nothingStored);
  });

  it('when cells sit exactly at the limits, then MariaDB stores them as read (the limits are the columns\' own)', async () => {
    const { studioId, agent } = await owner();
    const item = '🪵'.repeat(200);
    const text = `date,item,sku,quantity,revenue\n1990-01-01,${item},${'K'.repeat(64)},2147483647,90071992547409.91\n2027-03-15,Oak tray,,-2147483647,-1.00\n`;
    const preview = await upload(agent, studioId, text);
    expect(preview.body.hasErrors).toBe(false);
    expect((await commit(agent, studioId, preview.body.id)).status).toBe(200);
    const rows = await kit.t.db('sales').where({ studio_id: studioId }).orderBy('id').select('date', 'item', 'sku', 'quantity', 'revenue_cents');
    expect(rows).toEqual([
      { date: '1990-01-01', item, sku: 'K'.repeat(64), quantity: 2_147_483_647, revenue_cents: Number.MAX_SAFE_INTEGER },
      { date: '2027-03-15', item: 'Oak tray', sku: null, quantity: -2_147_483_647, revenue_cents: -100 },
    ]);
  });
});

describe('returns', () => {
  it('when sales rows have negative quantities, then the preview counts them as returns and the commit stores them negative', async () => {
    const { studioId, agent } = await owner();
    const text = 'date,item,quantity,revenue\n2025-06-01,Oak tray,3,30.00\n2025-06-02,Oak tray,-1,-10.00\n2025-06-03,Birch tray,-2,-24.00\n';
    const preview = await upload(agent, studioId, text);
    expect(preview.body).toMatchObject({ hasErrors: false, returnRows: 2 });
    expect((await commit(agent, studioId, preview.body.id)).status).toBe(200);
    expect(await kit.t.db('sales').where({ studio_id: studioId }).orderBy('id').pluck('quantity')).toEqual([3, -1, -2]);
  });
});

describe('a commit that meets what its preview did not', () => {
  it('when a preview stored without the limits is committed, then the commit pass answers 400 by row and column and stores nothing', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, `date,item,quantity,revenue\n2025-06-01,Oak tray,1,10.00\n2025-06-02,${'w'.repeat(10_001)},1,10.00\n`);
    // A preview checked by code that knew no limits looks like this: no problems.
    const row = await kit.t.db('imports').where({ id: preview.body.id }).first('preview_json');
    const analysis = JSON.parse(row.preview_json);
    analysis.preview.problems = [];
    await kit.t.db('imports').where({ id: preview.body.id }).update({ preview_json: JSON.stringify(analysis) });
    const answer = await commit(agent, studioId, preview.body.id);
    expect(answer.status).toBe(400);
    expect(answer.body.error).toMatchObject({ code: 'file_has_problems', issues: [expect.objectContaining({ row: 3, column: 'item' })] });
    expect(await stored(studioId)).toEqual(nothingStored);
    const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
    expect(detail.body).toMatchObject({ status: 'failed', failure: expect.stringContaining('nothing was stored') });
  });

  it('when MariaDB refuses a write for a reason of ours, then neither the answer nor the stored failure carries SQL', async () => {
    const { studioId, agent } = await owner();
    const preview = await upload(agent, studioId, 'month,term,value\n2025-01,oak tray,3\n2025-02,oak tray,4\n');
    // A period the series table's ENUM does not have: MariaDB answers "Data truncated for column 'period'".
    const row = await kit.t.db('imports').where({ id: preview.body.id }).first('preview_json');
    const analysis = JSON.parse(row.preview_json);
    analysis.preview.period = 'yearly';
    await kit.t.db('imports').where({ id: preview.body.id }).update({ preview_json: JSON.stringify(analysis) });
    const answer = await commit(agent, studioId, preview.body.id);
    expect(answer.status).toBe(500);
    expect(JSON.stringify(answer.body)).not.toMatch(sqlWords);
    const detail = await agent.get(`/api/studios/${studioId}/imports/${preview.body.id}`);
    expect(detail.body.status).toBe('failed');
    expect(detail.body.failure).toBe('The commit stopped on an error on our side; nothing was stored. Try again in a moment.');
    expect(await stored(studioId)).toEqual(nothingStored);
  });
});
