import path from 'node:path';
import { addDays, isoWeekday } from '@shared/calendar/dates';
import { screenshotDir, signInAs, startBrowserHarness, todayIso, type BrowserHarness } from '../helpers/browser';

const marketName = 'Larkspur Lane Pop-up';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  // The demo studio keeps only its own markets for the other browser tests.
  await harness?.app.db('markets').where({ studio_id: harness.demoStudioId, name: marketName }).delete();
  await harness?.app.db('studio_blackouts').where({ studio_id: harness.demoStudioId }).delete();
  await harness?.close();
});

/** A day as it is typed into the date fields (the browser's en-US format): "1/9/2027". */
function typed(iso: string): string {
  const [year, month, day] = iso.split('-').map(Number);
  return `${month}/${day}/${year}`;
}

describe('markets', () => {
  it('when the partner adds a weekly market, then its days show on the calendar with its hours, and deleting it takes them off', async () => {
    // A Saturday two to three weeks ahead, so the market is on the calendar's next month at the latest.
    const today = todayIso();
    const first = addDays(today, 14 + ((6 - isoWeekday(today) + 7) % 7));
    const page = await harness.newPage();
    await signInAs(page, 'partner@demo.test');
    await page.getByRole('link', { name: 'Markets', exact: true }).click();
    await page.getByText('Thistledown Makers Market').waitFor();
    await page.getByRole('button', { name: 'Add a market' }).click();
    await page.getByLabel('Name').fill(marketName);
    await page.getByLabel('Place').fill('Larkspur Lane, by the library');
    await page.getByLabel('First day').fill(typed(first));
    await page.getByLabel('Repeats').click();
    await page.getByRole('option', { name: 'Every week on Saturday' }).click();
    await page.getByLabel('Hours').fill('10:00–14:00');
    await page.getByLabel('Booth fee').fill('20');
    await page.getByRole('button', { name: 'Add market' }).click();
    await page.getByText('Market added; its days are on the calendar').waitFor();
    const list = page.getByRole('list', { name: "The studio's markets" });
    await list.getByText('Every week on Saturday').waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'markets.png'), fullPage: true });
    const stored = await harness.app.db('markets').where({ studio_id: harness.demoStudioId, name: marketName }).first();
    expect(stored).toMatchObject({ start: first, rrule: 'FREQ=WEEKLY;BYDAY=SA', hours: '10:00–14:00', booth_fee_cents: 2000 });

    await page.getByRole('link', { name: 'Calendar', exact: true }).click();
    const cell = page.locator(`kc-month-view [data-date="${first}"]`);
    await page.locator('kc-month-view [data-date]').first().waitFor();
    if ((await cell.count()) === 0) await page.getByRole('button', { name: 'Next month' }).click();
    const chip = cell.locator('button.chip', { hasText: marketName });
    await chip.waitFor();
    expect(await chip.getAttribute('data-hours')).toBe('10:00–14:00');
    // And a week later (on the next month's page when that week is past this one's last row).
    const weekLater = page.locator(`kc-month-view [data-date="${addDays(first, 7)}"]`);
    if ((await weekLater.count()) === 0) await page.getByRole('button', { name: 'Next month' }).click();
    await weekLater.locator('button.chip', { hasText: marketName }).waitFor();

    await page.getByRole('link', { name: 'Markets', exact: true }).click();
    await page.getByRole('button', { name: `Delete ${marketName}` }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete the market' }).click();
    await page.getByText('Market deleted').waitFor();
    // The list is fetched again after the delete.
    await list.getByText(marketName).waitFor({ state: 'detached' });
    expect(await harness.app.db('markets').where({ studio_id: harness.demoStudioId, name: marketName }).first()).toBeUndefined();
    await page.context().close();
  }, 90_000);

  it('when the partner adds days off, then they are kept after a reload, the calendar opened again shows them, and removing them takes them off', async () => {
    const first = addDays(todayIso(), 30);
    const last = addDays(first, 4);
    const page = await harness.newPage();
    await signInAs(page, 'partner@demo.test');
    // The calendar first, so that it is opened again (not loaded anew) once the days are added.
    await page.getByRole('link', { name: 'Calendar', exact: true }).click();
    await page.getByRole('grid').first().waitFor();
    await page.getByRole('link', { name: 'Markets', exact: true }).click();
    await page.getByText('No days off set.').waitFor();
    await page.getByPlaceholder('First day').fill(typed(first));
    await page.getByPlaceholder('Last day').fill(typed(last));
    await page.getByLabel('Note').fill('Workshop closed for a kiln repair');
    await page.getByRole('button', { name: 'Add days off' }).click();
    await page.getByText('Days off added').waitFor();
    await page.getByRole('link', { name: 'Calendar', exact: true }).click();
    await page.getByRole('grid').first().waitFor();
    // Wait for each month to draw before looking again: a click that lands before the last one has drawn
    // would step past the month we want.
    for (let i = 0; i < 24 && (await page.locator(`[data-date="${first}"]`).count()) === 0; i += 1) {
      const before = await page.locator('kc-month-view [data-date]').first().getAttribute('data-date');
      await page.getByRole('button', { name: 'Next month' }).click();
      await page.waitForFunction((previous) => document.querySelector('kc-month-view [data-date]')?.getAttribute('data-date') !== previous, before);
    }
    const dayOff = page.locator(`.day-off[data-date="${first}"]`);
    await dayOff.waitFor();
    expect(await dayOff.getAttribute('aria-label')).toMatch(/, Day off: Workshop closed for a kiln repair$/);
    await page.getByRole('link', { name: 'Markets', exact: true }).click();
    await page.reload();
    const list = page.getByRole('list', { name: 'Days off' });
    await list.getByText('Workshop closed for a kiln repair').waitFor();
    expect(await harness.app.db('studio_blackouts').where({ studio_id: harness.demoStudioId }).select('start', 'end', 'note')).toEqual([{ start: first, end: last, note: 'Workshop closed for a kiln repair' }]);
    await list.getByRole('button', { name: 'Remove' }).click();
    await page.getByText('No days off set.').waitFor();
    await expect(harness.app.db('studio_blackouts').where({ studio_id: harness.demoStudioId }).count({ count: '*' }).first()).resolves.toEqual({ count: 0 });
    await page.context().close();
  }, 60_000);

  it('when crew opens the markets, then they read them but cannot add, edit or delete', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    await page.getByRole('link', { name: 'Markets', exact: true }).click();
    await page.getByText('Quarry Hill Harvest Fair').waitFor();
    await expect(page.getByRole('button', { name: /Add a market|Edit|Delete/ }).count()).resolves.toBe(0);
    await page.context().close();
  }, 60_000);
});
