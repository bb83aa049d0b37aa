import path from 'node:path';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(() => harness?.close());

const monthlyFile = path.resolve(__dirname, '../../data/interest-long-monthly.csv');

describe('importing through the wizard', () => {
  it('when the owner imports the monthly demo file again, then the wizard asks about the duplicate, replaces it and shows its series', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'owner@demo.test');
    await page.getByRole('link', { name: 'Imports' }).click();
    await page.getByRole('heading', { name: 'Imports', exact: true }).waitFor();
    // The demo seed imported the three demo files through the same path.
    await page.getByRole('link', { name: 'interest-long-monthly.csv', exact: true }).waitFor();

    await page.getByLabel('CSV files to import').setInputFiles(monthlyFile);
    await page.getByRole('definition').filter({ hasText: 'Search interest, one row per date and term' }).waitFor();
    await page.getByText('YYYY-MM', { exact: true }).waitFor();
    await expect(page.getByRole('cell', { name: 'herb planter box' }).first().isVisible()).resolves.toBe(true);
    await page.screenshot({ path: path.join(screenshotDir, 'imports-map.png'), fullPage: true });
    await page.getByRole('button', { name: 'Next: check' }).click();

    await page.getByText('This file was already imported on').waitFor();
    await expect(page.getByRole('button', { name: 'Next: commit' }).isDisabled()).resolves.toBe(true);
    await page.getByRole('radio', { name: 'Replace the earlier import with this one' }).check();
    await page.getByRole('button', { name: 'Next: commit' }).click();
    await page.getByRole('button', { name: 'Commit import' }).click();
    await page.getByText('Committed: 3 series').waitFor();
    await page.getByRole('link', { name: 'Open import' }).click();

    await page.getByRole('heading', { name: 'interest-long-monthly.csv' }).waitFor();
    for (const term of ['herb planter box (US)', 'lantern panel (US)', 'hex wall shelf (US)']) {
      await page.getByText(term, { exact: true }).waitFor();
    }
    await expect(page.getByRole('img', { name: 'Chart of lantern panel' }).count()).resolves.toBe(1);
    await page.screenshot({ path: path.join(screenshotDir, 'import-detail.png'), fullPage: true });

    const rows = await harness.app.db('imports').where({ studio_id: harness.demoStudioId, file_name: 'interest-long-monthly.csv', status: 'committed' }).count({ n: '*' }).first();
    expect(rows).toEqual({ n: 1 });
    await page.context().close();
  }, 90_000);

  it('when crew open Imports, then they see the list without the upload controls', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    await page.getByRole('link', { name: 'Imports' }).click();
    await page.getByRole('link', { name: 'sales.csv', exact: true }).waitFor();
    await expect(page.getByRole('button', { name: 'Choose files' }).count()).resolves.toBe(0);
    await page.context().close();
  }, 60_000);
});
