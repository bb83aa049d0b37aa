import path from 'node:path';
import { addDays } from '@shared/calendar/dates';
import { screenshotDir, signInAs, startBrowserHarness, todayIso, type BrowserHarness } from '../helpers/browser';
import { addStep } from '../api/feeds-fixtures';

let harness: BrowserHarness;
/** The steps these tests add (each test makes its own open work), taken away after. */
const added: number[] = [];
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  if (added.length) await harness?.app.db('events').whereIn('id', added).delete();
  await harness?.close();
});

/** An open step of the demo studio assigned to a member, on a day of the work at hand. */
async function openStepFor(email: string, step: { title: string; kind: 'build' | 'content'; start: string }): Promise<number> {
  const member = await harness.app.db('users').where({ email }).first('id');
  const id = await addStep(harness.app.db, harness.demoStudioId, { ...step, assignee: member.id });
  added.push(id);
  return id;
}

describe('home page', () => {
  it('when the partner ticks a step of the work at hand, then it stays done after a reload, and its title opens the calendar on its side sheet', async () => {
    const title = 'Sand the star edges';
    const eventId = await openStepFor('crew@demo.test', { title, kind: 'build', start: todayIso() });
    const page = await harness.newPage();
    await signInAs(page, 'partner@demo.test');
    const card = page.locator('kc-work-at-hand');
    await card.getByRole('heading', { name: 'Work at hand' }).waitFor();
    // Today's step, not done yet, and crew's: partners tick anyone's.
    const line = card.locator('section.group:not(.overdue) li:not(.done)', { hasText: title });
    await line.waitFor();
    const href = (await line.locator('a.title').getAttribute('href'))!;
    expect(Number(new URLSearchParams(href.split('?')[1]).get('event'))).toBe(eventId);
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
    const title = 'Film the glue-up';
    const eventId = await openStepFor('crew@demo.test', { title, kind: 'content', start: addDays(todayIso(), 1) });
    await openStepFor('partner@demo.test', { title: 'Cut the spare panels', kind: 'build', start: addDays(todayIso(), 1) });
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    const card = page.locator('kc-work-at-hand');
    await card.getByRole('heading', { name: 'Work at hand' }).waitFor();
    expect(await card.getByRole('switch', { name: 'Only mine' }).isChecked()).toBe(true);
    // Tomorrow's step of theirs is listed; the partner's is not, as every line shown is theirs.
    const line = card.locator('section.group:not(.overdue) li:not(.done)', { hasText: title });
    await line.waitFor();
    await expect(card.locator('li', { hasText: 'Cut the spare panels' }).count()).resolves.toBe(0);
    expect(await card.locator('li .meta').allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/· You\s*$/)]));
    for (const meta of await card.locator('li .meta').allTextContents()) expect(meta).toMatch(/· You\s*$/);
    const href = (await line.locator('a.title').getAttribute('href'))!;
    expect(Number(new URLSearchParams(href.split('?')[1]).get('event'))).toBe(eventId);
    await line.getByRole('checkbox').check();
    await card.locator('li.done', { has: page.locator(`a.title[href="${href}"]`) }).waitFor();
    const stored = await harness.app.db('events').where({ id: eventId }).first();
    expect([Boolean(stored.done), stored.done_by]).toEqual([true, (await harness.app.db('users').where({ email: 'crew@demo.test' }).first()).id]);
    await page.context().close();
  }, 60_000);
});
