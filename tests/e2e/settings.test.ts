import path from 'node:path';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  // The demo studio goes back to the default channels for the other browser tests.
  await harness?.app.db('studios').where({ id: harness.demoStudioId }).update({ channels: null });
  await harness?.close();
});

describe('studio settings', () => {
  it('when the owner adds a sales channel and saves, then it is kept after a reload and a sales import maps onto it', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'owner@demo.test');
    await page.getByRole('link', { name: 'Studio settings' }).click();
    const channels = page.getByRole('grid', { name: 'Sales channels' });
    await channels.getByText('consignment').waitFor();
    await page.getByPlaceholder('Add a channel, then Enter').fill('Gallery shop');
    await page.getByPlaceholder('Add a channel, then Enter').press('Enter');
    await page.getByRole('button', { name: 'Remove wholesale' }).click();
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Studio settings saved').waitFor();
    await page.reload();
    await page.getByRole('grid', { name: 'Sales channels' }).getByText('Gallery shop').waitFor();
    await expect(page.getByRole('grid', { name: 'Sales channels' }).getByText('wholesale').count()).resolves.toBe(0);
    await page.screenshot({ path: path.join(screenshotDir, 'settings-channels.png'), fullPage: true });
    const row = await harness.app.db('studios').where({ id: harness.demoStudioId }).first('channels');
    expect(JSON.parse(row.channels)).toEqual(['market', 'booth', 'online', 'consignment', 'Gallery shop']);

    await page.getByRole('link', { name: 'Imports' }).click();
    await page.getByLabel('CSV files to import').setInputFiles({
      name: 'gallery-takings.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('date,item,quantity,revenue,channel\n2026-11-07,Lantern panel,2,108.00,gallery shop\n2026-11-08,Lantern panel,1,54.00,market\n'),
    });
    await page.getByRole('button', { name: 'Next: check' }).click();
    await page.getByRole('button', { name: 'Next: commit' }).click();
    await page.getByRole('button', { name: 'Commit import' }).click();
    await page.getByText('Committed:').waitFor();
    const upload = await harness.app.db('imports').where({ studio_id: harness.demoStudioId, file_name: 'gallery-takings.csv' }).first('id');
    const sold = await harness.app.db('sales').where({ import_id: upload.id }).orderBy('date').pluck('channel');
    expect(sold).toEqual(['Gallery shop', 'market']);
    await page.context().close();
  }, 90_000);
});
