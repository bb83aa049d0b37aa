import path from 'node:path';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';

let harness: BrowserHarness;
/** The demo steps these tests tick, put back as they were after. */
const ticked: number[] = [];
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  if (ticked.length) await harness?.app.db('events').whereIn('id', ticked).update({ done: false, done_by: null });
  await harness?.close();
});

describe('home page', () => {
  it('when the partner ticks a step of the work at hand, then it stays done after a reload, and its title opens the calendar on its side sheet', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'partner@demo.test');
    const card = page.locator('kc-work-at-hand');
    await card.getByRole('heading', { name: 'Work at hand' }).waitFor();
    // The demo's runway under way has steps in the coming days, not done yet; partners tick anyone's.
    const line = card.locator('section.group:not(.overdue) li:not(.done)').first();
    await line.waitFor();
    const title = (await line.locator('a.title').textContent())!.trim();
    const href = (await line.locator('a.title').getAttribute('href'))!;
    const eventId = Number(new URLSearchParams(href.split('?')[1]).get('event'));
    ticked.push(eventId);
    const ticks = card.locator('li', { has: page.locator(`a.title[href="${href}"]`) });
    await ticks.getByRole('checkbox', { name: `Done: ${title}` }).check();
    await card.locator('li.done', { has: page.locator(`a.title[href="${href}"]`) }).waitFor();
    const stored = await harness.app.db('events').where({ id: eventId, studio_id: harness.demoStudioId }).first();
    expect([stored.title, Boolean(stored.done)]).toEqual([title, true]);
    expect(stored.done_by).toBe((await harness.app.db('users').where({ email: 'partner@demo.test' }).first()).id);
    await page.screenshot({ path: path.join(screenshotDir, 'home.png'), fullPage: true });

    await page.reload();
    const again = ticks.getByRole('checkbox', { name: `Done: ${title}` });
    await again.waitFor();
    expect(await again.isChecked()).toBe(true);

    await card.locator(`a.title[href="${href}"]`).click();
    await page.waitForURL(/\/calendar$/);
    await page.locator('kc-event-sheet', { hasText: title }).waitFor();
    expect(await page.locator('kc-event-sheet').getByRole('checkbox', { name: 'Done' }).isChecked()).toBe(true);
    await page.context().close();
  }, 60_000);

  it('when crew open the home page, then they see only their own steps at first and tick one of them done', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    const card = page.locator('kc-work-at-hand');
    await card.getByRole('heading', { name: 'Work at hand' }).waitFor();
    expect(await card.getByRole('switch', { name: 'Only mine' }).isChecked()).toBe(true);
    // The demo's content steps are crew's; every line shown is theirs.
    const line = card.locator('section.group:not(.overdue) li:not(.done)').first();
    await line.waitFor();
    expect(await card.locator('li .meta').allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/· You\s*$/)]));
    for (const meta of await card.locator('li .meta').allTextContents()) expect(meta).toMatch(/· You\s*$/);
    const href = (await line.locator('a.title').getAttribute('href'))!;
    const eventId = Number(new URLSearchParams(href.split('?')[1]).get('event'));
    ticked.push(eventId);
    await line.getByRole('checkbox').check();
    await card.locator('li.done', { has: page.locator(`a.title[href="${href}"]`) }).waitFor();
    const stored = await harness.app.db('events').where({ id: eventId }).first();
    expect([Boolean(stored.done), stored.done_by]).toEqual([true, (await harness.app.db('users').where({ email: 'crew@demo.test' }).first()).id]);
    await page.context().close();
  }, 60_000);
});
