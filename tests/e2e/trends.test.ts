// The owner's journey on the Trends board (issue 4): sort by heat, open a series, group two series
// into a theme and pick it for a month. The series go straight into the database.
import path from 'node:path';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';
import { makeStudio, testPassword } from '../helpers/test-app';
import { insertSeries } from '../api/series-test-data';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(() => harness?.close());

describe('the Trends board', () => {
  it('when the owner sorts by heat, opens a series, groups two into a theme and picks it for a month, then all of it is stored', async () => {
    const { studioId, members } = await makeStudio(harness.app.db, ['owner'], 'Birch Row Studio');
    const terms = ['lantern stencil', 'herb planter', 'star ornament', 'seed box'];
    for (const [index, term] of terms.entries()) {
      await insertSeries(harness.app.db, studioId, { term, crest: 8 + index * 12, growth: (index - 1) * 0.003, seed: 20 + index });
    }
    const page = await harness.newPage();
    await signInAs(page, members.owner.email, testPassword);
    await page.goto(`/studios/${studioId}/trends`);
    const termCells = page.locator('td.mat-column-term a');
    await termCells.first().waitFor();

    // Sort by term first, then by heat (descending first for figures).
    const byTerm = page.waitForResponse((response) => response.url().includes('sort=term&order=asc'));
    await page.locator('th.mat-column-term .mat-sort-header-container').click();
    await byTerm;
    await expect(termCells.allTextContents()).resolves.toEqual([...terms].sort());
    const byHeat = page.waitForResponse((response) => response.url().includes('sort=heat&order=desc'));
    await page.locator('th.mat-column-heat .mat-sort-header-container').click();
    await byHeat;
    await page.locator('th.mat-column-heat[aria-sort="descending"]').waitFor();
    // The rows re-render a tick after the answer; wait for that rather than a fixed time.
    await page.waitForFunction(() => {
      const values = [...document.querySelectorAll('td.mat-column-heat')].map((cell) => Number(cell.textContent?.trim()));
      return values.length === 4 && values.every((value, index) => index === 0 || values[index - 1] >= value);
    });
    const heats = (await page.locator('td.mat-column-heat').allTextContents()).map((text) => Number(text.trim()));
    expect(heats).toHaveLength(4);
    expect(heats).toEqual([...heats].sort((a, b) => b - a));
    await page.screenshot({ path: path.join(screenshotDir, 'trends-board.png') });

    // Each column explains itself on hover and on keyboard focus (issue 23).
    await page.locator('th.mat-column-rise').hover();
    await page.locator('.mat-mdc-tooltip').getByText('the figure the verdict is decided on').waitFor();
    // The pointer rests on the page (over the toolbar, Chromium sends the new tooltip a mouseleave
    // that closes it); the keyboard steps out of the first header and back in.
    await page.mouse.move(700, 760);
    await page.locator('th.mat-column-select [tabindex="0"]').focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    await page.locator('.mat-mdc-tooltip').getByText('Tick series to compare').waitFor();
    await page.keyboard.press('Shift+Tab');

    // Tapping a heat shows its parts.
    await page.locator('td.mat-column-heat button').first().click();
    const parts = page.locator('.kc-parts-menu');
    await parts.getByText('Season lift').waitFor();
    await expect(parts.getByText(`Heat ${heats[0]}`).count()).resolves.toBe(1);
    await page.keyboard.press('Escape');

    // Open the hottest series: its page explains every figure.
    const hottest = (await termCells.first().textContent())!.trim();
    await termCells.first().click();
    await page.getByRole('heading', { name: hottest }).waitFor();
    await page.getByText('Every figure, explained').waitFor();
    await page.getByText('Seasonal strength').first().waitFor();
    // Plain words first: the test statistics wait in a fold until asked for.
    const statistics = page.locator('details.statistics');
    await expect(statistics.getByText('Mann–Kendall').isVisible()).resolves.toBe(false);
    await statistics.locator('summary').click();
    await statistics.getByText('Mann–Kendall').waitFor();
    await expect(page.getByText(/of the cycle/).count()).resolves.toBe(0);
    expect(await page.locator('canvas').count()).toBeGreaterThanOrEqual(3);
    await page.screenshot({ path: path.join(screenshotDir, 'trends-series.png') });
    await page.getByRole('link', { name: 'Trends' }).first().click();

    // Select two series and group them into a theme.
    await termCells.first().waitFor();
    await page.getByRole('checkbox', { name: 'Select herb planter' }).check();
    await page.getByRole('checkbox', { name: 'Select seed box' }).check();
    await page.getByLabel('New theme name').fill('Kitchen garden');
    await page.getByRole('button', { name: 'Group into theme' }).click();
    await page.getByRole('heading', { name: 'Kitchen garden' }).waitFor();
    await page.getByRole('link', { name: 'herb planter' }).waitFor();
    await page.getByRole('link', { name: 'seed box' }).waitFor();

    // Pick it for a month, three weeks before.
    await page.getByRole('combobox', { name: 'Target', exact: true }).click();
    const month = page.getByRole('option').nth(2);
    const monthLabel = (await month.textContent())!.trim();
    await month.click();
    await page.getByLabel('Launch days before').fill('21');
    await page.getByRole('button', { name: 'Pick' }).click();
    await page.getByTestId('theme-status').filter({ hasText: 'Picked' }).waitFor();
    await expect(page.getByTestId('theme-target').textContent()).resolves.toBe(monthLabel);
    await page.screenshot({ path: path.join(screenshotDir, 'theme-picked.png') });

    // The board lists the theme beside the series, with its heat.
    await page.goto(`/studios/${studioId}/trends`);
    await page.locator('.theme-table').getByRole('link', { name: 'Kitchen garden' }).waitFor();

    const theme = await harness.app.db('themes').where({ studio_id: studioId, name: 'Kitchen garden' }).first();
    expect(theme).toMatchObject({ status: 'picked', target_kind: 'month', offset_days: 21 });
    expect(theme.target_value).toMatch(/^\d{4}-\d{2}$/);
    const memberTerms = await harness.app.db('theme_series as ts').join('series as s', 's.id', 'ts.series_id').where('ts.theme_id', theme.id).orderBy('s.term').pluck('s.term');
    expect(memberTerms).toEqual(['herb planter', 'seed box']);
    const history = await harness.app.db('theme_status_history').where({ theme_id: theme.id }).orderBy('id').pluck('to_status');
    expect(history).toEqual(['idea', 'picked']);
    await page.context().close();
  }, 90_000);
});
