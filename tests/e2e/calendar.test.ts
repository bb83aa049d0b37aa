import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { addDays, isoWeekday } from '@shared/calendar/dates';
import { screenshotDir, signInAs, startBrowserHarness, todayIso, type BrowserHarness } from '../helpers/browser';
import { signIn } from '../helpers/test-app';
import { demoRunwayUnderWayName } from '../../db/seeds/demo-calendar';
import { kindLooks } from '../../src/app/calendar/calendar-kinds';

let harness: BrowserHarness;
/** Tuesday, Wednesday and Thursday of the week after the demo's runway under way: days that hold no demo step. */
let freeDays: string[];
beforeAll(async () => {
  harness = await startBrowserHarness();
  const { launch } = await harness.app.db('runways').where({ studio_id: harness.demoStudioId, name: demoRunwayUnderWayName }).first('launch');
  const sundayAfter = addDays(String(launch), 7 - (isoWeekday(String(launch)) % 7));
  freeDays = [2, 3, 4].map((offset) => addDays(sundayAfter, offset));
}, 60_000);
afterAll(() => harness?.close());

const demoPassword = 'kerfcast-demo';

/** Three free work days of the demo studio (Monday to Saturday) in one week row, after all of its steps under way. */
function nextWeekDays(): string[] {
  return freeDays;
}

/** A CDK drag: press, pass the drag threshold, move in steps, release over the target. */
async function drag(page: Page, source: Locator, target: Locator): Promise<void> {
  const from = (await source.boundingBox())!;
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2 + 8, from.y + from.height / 2 + 8, { steps: 4 });
  const to = (await target.boundingBox())!;
  await page.mouse.move(to.x + to.width / 2, to.y + Math.min(60, to.height / 2), { steps: 20 });
  await page.mouse.up();
}

async function openWeekOf(page: Page, date: string): Promise<void> {
  await page.goto(`/studios/${harness.demoStudioId}/calendar`);
  await showWeekOf(page, date);
}

/** Switches the open calendar to the week view and steps on to the week of `date`. */
async function showWeekOf(page: Page, date: string): Promise<void> {
  await page.locator('mat-button-toggle', { hasText: 'Week' }).click();
  // Wait for each re-render before looking again: on a busy machine a click can land before the last one
  // has drawn, and counting too early would step past the week we want.
  const week = page.locator('kc-week-view');
  await week.locator('[data-date]').first().waitFor();
  for (let i = 0; i < 60 && (await week.locator(`[data-date="${date}"]`).count()) === 0; i += 1) {
    const before = await week.locator('[data-date]').first().getAttribute('data-date');
    await page.getByRole('button', { name: 'Next week' }).click();
    await page.waitForFunction(
      (previous) => document.querySelector('kc-week-view [data-date]')?.getAttribute('data-date') !== previous,
      before,
    );
  }
  await week.locator(`[data-date="${date}"]`).first().waitFor();
}

const formatted = (date: string) => new Intl.DateTimeFormat('en-US', { month: 'long', day: 'numeric', timeZone: 'UTC' }).format(new Date(`${date}T00:00:00Z`));
/** Waits for the page's next two animation frames (what was just changed has been drawn). */
const twoFrames = (page: Page) => page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
/** The calendar page's scroller: its sidenav content, around the side sheet. */
const calendarScroller = 'kc-calendar-page mat-sidenav-content';
const snackBar = (page: Page) => page.locator('.mdc-snackbar__label');
const chip = (page: Page, date: string, title: string) => page.locator(`[data-date="${date}"] button.chip`).filter({ hasText: title });

/**
 * A runway of the demo studio stored on the calendar through the API (as a partner would plan it),
 * with its first step put on `start` (a Tuesday, so the two days after it are work days in the same week row).
 */
async function planRunwayThroughApi(anchorDate: string, start: string): Promise<{ id: string; start: string }> {
  const partner = await signIn(harness.app.app, 'partner@demo.test', demoPassword);
  const base = `/api/studios/${harness.demoStudioId}`;
  const created = await partner.post(`${base}/runways`).send({ anchorDate, offsetDays: 0, templateId: 'default', placement: 'calendar' });
  expect(created.status).toBe(201);
  const first = await harness.app.db('events').where({ studio_id: harness.demoStudioId, runway_id: created.body.id }).orderBy('step_index').first();
  const moved = await partner.patch(`${base}/events/${first.id}`).send({ start, version: first.version, force: true });
  expect(moved.status).toBe(200);
  return { id: String(first.id), start };
}

describe('the calendar', () => {
  it('when the partner plans a runway into the tray and drags a step onto a day and on to another, then a reload shows it there', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'partner@demo.test');
    // From a theme of the demo studio: its page's "Plan runway" opens the dialog on the calendar.
    // The tray holds the steps of picked themes (and of runways without one): pick the theme first.
    const theme = await harness.app.db('themes').where({ studio_id: harness.demoStudioId }).orderBy('id').first('id', 'name');
    await harness.app.db('themes').where({ id: theme.id }).update({ status: 'picked' });
    await page.goto(`/studios/${harness.demoStudioId}/themes/${theme.id}`);
    await page.getByRole('link', { name: 'Plan runway' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: `Plan a runway for ${theme.name}` }).waitFor();
    await dialog.locator('mat-button-toggle', { hasText: 'A date' }).click();
    const anchor = addDays(todayIso(), 90);
    const [year, month, day] = anchor.split('-').map(Number);
    await dialog.getByLabel('Anchor date').fill(`${month}/${day}/${year}`);
    await dialog.getByLabel('Launch days before').fill('7');
    await dialog.getByText('Starts ').first().waitFor();
    await expect(dialog.locator('.steps li').count()).resolves.toBe(11);
    await dialog.getByText('In the tray, to drag onto days myself').click();
    await page.screenshot({ path: path.join(screenshotDir, 'calendar-plan-runway.png') });
    await dialog.getByRole('button', { name: 'Create runway' }).click();
    await dialog.waitFor({ state: 'detached' });

    const tray = page.locator('kc-calendar-tray');
    await tray.getByRole('heading', { name: theme.name }).waitFor();
    await tray.locator('button.chip').filter({ hasText: 'Design' }).waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'calendar-month-tray.png') });
    const [first, second] = nextWeekDays();
    await showWeekOf(page, first);

    await drag(page, tray.locator('button.chip').filter({ hasText: 'Design' }), page.locator(`[data-date="${first}"]`));
    await chip(page, first, 'Design').first().waitFor();
    // bench:calendar-ui's drag frame marks (render-marks.ts): one per move from the press to the release
    // (24 moves, or fewer if Chromium merged some into one frame), and none once the pointer is up.
    const dragFrames = () =>
      page.evaluate(() => new Promise<number[]>((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => setTimeout(() => resolve(performance.getEntriesByName('kc-drag-frame').map((entry) => entry.duration)))))));
    const marked = await dragFrames();
    expect(marked.length).toBeGreaterThan(0);
    expect(marked.length).toBeLessThanOrEqual(24);
    expect(marked.every((duration) => duration > 0)).toBe(true);
    await page.mouse.move(10, 10, { steps: 5 });
    await expect(dragFrames()).resolves.toHaveLength(marked.length);
    await snackBar(page).filter({ hasText: /^\s*Moved Design to / }).waitFor();
    await expect(tray.locator('button.chip').filter({ hasText: 'Design' }).count()).resolves.toBe(0);

    await drag(page, chip(page, first, 'Design').first(), page.locator(`[data-date="${second}"]`));
    await chip(page, first, 'Design').waitFor({ state: 'detached' });
    // A new press drops the last drag's marks, so only this drag's are there.
    const secondMarks = await dragFrames();
    expect(secondMarks.length).toBeGreaterThan(0);
    expect(secondMarks.length).toBeLessThanOrEqual(24);
    await chip(page, second, 'Design').first().waitFor();
    await snackBar(page).filter({ hasText: /^\s*Moved Design to / }).filter({ hasNotText: formatted(first) }).waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'calendar-week-after-drag.png') });

    const stored = await harness.app.db('events').where({ studio_id: harness.demoStudioId, title: 'Design' }).orderBy('id', 'desc').first();
    expect(String(stored.start_date)).toBe(second);

    await page.reload();
    await showWeekOf(page, second);
    await chip(page, second, 'Design').first().waitFor();

    // The side sheet of a cutting step shows its cautions; at phone width the agenda replaces the grid.
    await tray.locator('button.chip').filter({ hasText: 'Prototype and test cut' }).click();
    await page.getByRole('heading', { name: 'Prototype and test cut', level: 2 }).waitFor();
    await page.getByText('Never leave the laser cutter running unattended.').waitFor();
    await page.screenshot({ path: path.join(screenshotDir, 'calendar-sheet.png') });
    await page.getByRole('button', { name: 'Close details' }).click();
    await page.setViewportSize({ width: 390, height: 800 });
    await page.getByRole('list', { name: 'Today and the next 7 days' }).waitFor();
    // The side sheet and the nav drawer slide shut as the width changes; the picture waits for them.
    await page.waitForFunction(() => document.getAnimations().length === 0);
    await page.screenshot({ path: path.join(screenshotDir, 'calendar-phone-agenda.png') });
    await page.context().close();
  }, 150_000);

  it('when crew drags a step, then nothing moves and nothing is sent', async () => {
    const step = await planRunwayThroughApi(addDays(nextWeekDays()[0], 60), addDays(nextWeekDays()[0], 7));
    const page = await harness.newPage();
    const patches: string[] = [];
    page.on('request', (request) => {
      if (request.method() === 'PATCH') patches.push(request.url());
    });
    await signInAs(page, 'crew@demo.test');
    await openWeekOf(page, step.start);
    const source = page.locator(`[data-date="${step.start}"] [data-event-id="${step.id}"]`).first();
    await source.waitFor();
    await expect(source.getAttribute('class')).resolves.toContain('fixed');
    // Design takes three work days (Tuesday to Thursday); Friday is free.
    const target = page.locator(`[data-date="${addDays(step.start, 3)}"]`);
    await drag(page, source, target);
    await page.waitForTimeout(500);
    expect(patches).toEqual([]);
    await expect(page.locator(`[data-date="${addDays(step.start, 3)}"] [data-event-id="${step.id}"]`).count()).resolves.toBe(0);
    const stored = await harness.app.db('events').where({ id: Number(step.id) }).first();
    expect(String(stored.start_date)).toBe(step.start);
    await expect(page.getByRole('button', { name: 'Plan runway' }).count()).resolves.toBe(0);
    await page.context().close();
  }, 120_000);

  it('when two members move the same step, then the second sees the conflict and the step shows where the first put it', async () => {
    const step = await planRunwayThroughApi(addDays(nextWeekDays()[0], 75), addDays(nextWeekDays()[0], 14));
    const [first, second] = [harness.newPage(), harness.newPage()];
    const [owner, partner] = await Promise.all([first, second]);
    await signInAs(owner, 'owner@demo.test');
    await signInAs(partner, 'partner@demo.test');
    await Promise.all([openWeekOf(owner, step.start), openWeekOf(partner, step.start)]);
    const source = (page: Page) => page.locator(`[data-date="${step.start}"] [data-event-id="${step.id}"]`).first();
    await Promise.all([source(owner).waitFor(), source(partner).waitFor()]);
    // Both read the step before either moves it; the owner moves first.
    const ownerTarget = addDays(step.start, 1);
    const partnerTarget = addDays(step.start, 2);
    await drag(owner, source(owner), owner.locator(`[data-date="${ownerTarget}"]`));
    await snackBar(owner).filter({ hasText: /^\s*Moved / }).waitFor();
    await drag(partner, source(partner), partner.locator(`[data-date="${partnerTarget}"]`));
    await snackBar(partner).filter({ hasText: 'Someone else changed this step while you were moving it' }).waitFor();
    await partner.getByRole('button', { name: 'Move anyway' }).waitFor();
    // Rolled back to where the owner put it: Wednesday to Friday, so Friday holds it now.
    await partner.locator(`[data-date="${addDays(ownerTarget, 2)}"] [data-event-id="${step.id}"]`).first().waitFor();
    await partner.screenshot({ path: path.join(screenshotDir, 'calendar-conflict.png') });
    const stored = await harness.app.db('events').where({ id: Number(step.id) }).first();
    expect(String(stored.start_date)).toBe(ownerTarget);
    await owner.context().close();
    await partner.context().close();
  }, 120_000);

  // The chips draw their kind's icon from a code point of the Material Symbols font (_kinds.scss),
  // where the rest of the app writes the icon's name (calendar-kinds.ts, DESIGN §4). Checked against
  // the font itself: the glyph the font's own ligature table gives for the name.
  it('when a chip of each kind is drawn, then its icon is the glyph the font gives its icon name', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    await page.goto(`/studios/${harness.demoStudioId}/calendar`);
    await page.locator('kc-month-view button.chip').first().waitFor();
    const icons = [...kindLooks.map(({ kind, icon }) => ({ kind, icon })), { kind: 'done', icon: 'check' }];
    const drawn = await page.evaluate(async (icons) => {
      await document.fonts.load('24px "Material Symbols Outlined"');
      const draw = (text: string) => {
        const canvas = document.createElement('canvas');
        canvas.width = canvas.height = 32;
        const context = canvas.getContext('2d')!;
        context.font = '24px "Material Symbols Outlined"';
        context.fillText(text, 2, 26);
        return Array.from(context.getImageData(0, 0, 32, 32).data);
      };
      return icons.map(({ kind, icon }) => {
        // A chip of the kind (a done one for the tick) as the app's stylesheet draws it.
        const chip = document.createElement('button');
        chip.className = kind === 'done' ? 'chip done' : 'chip';
        chip.dataset['kind'] = kind === 'done' ? 'build' : kind;
        chip.innerHTML = '<span class="title">A step</span>';
        document.body.append(chip);
        const content = getComputedStyle(kind === 'done' ? chip.firstElementChild! : chip, '::before').content;
        chip.remove();
        const glyph = content.startsWith('"') ? (JSON.parse(content) as string) : '';
        const fromGlyph = draw(glyph);
        return { kind, glyph: glyph.codePointAt(0)?.toString(16), same: fromGlyph.join() === draw(icon).join(), inked: fromGlyph.some((value) => value > 0) };
      });
    }, icons);
    for (const icon of drawn) expect(icon).toEqual({ kind: icon.kind, glyph: expect.stringMatching(/^[ef][0-9a-f]{3}$/), same: true, inked: true });
    await page.context().close();
  }, 60_000);

  // bench:calendar-ui's render mark (render-marks.ts): from the month's events coming in to the end of
  // a frame that paints them, and only for renders that waited for an arrival.
  it('when the month opens, and again after the week view, then its render is marked from the events coming in to a painted frame', async () => {
    const page = await harness.newPage();
    // Each animation frame from the page's first on: when its callbacks run, and when a task posted
    // from them runs, once the frame's style, layout, paint and commit are done (the way the app's
    // marks end, posted first). Not the callbacks' time stamp: that is the frame's scheduled begin,
    // which can precede a task that ran while the frame waited for the main thread (the events'
    // arrival, say), though the frame runs after it.
    await page.addInitScript(() => {
      type Scheduler = { postTask(callback: () => void, options: { priority: 'user-blocking' }): Promise<void> };
      const scheduler = (window as unknown as { scheduler: Scheduler }).scheduler;
      const frames: { ran: number; done: number }[] = [];
      (window as unknown as { kcFrames: typeof frames }).kcFrames = frames;
      const onFrame = () => {
        const frame = { ran: performance.now(), done: Infinity };
        frames.push(frame);
        void scheduler.postTask(() => (frame.done = performance.now()), { priority: 'user-blocking' });
        requestAnimationFrame(onFrame);
      };
      requestAnimationFrame(onFrame);
    });
    await signInAs(page, 'crew@demo.test');
    const marked = () =>
      page.evaluate(() => {
        const measures = performance.getEntriesByName('kc-month-render') as PerformanceMeasure[];
        const arrivals = (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).filter((entry) => entry.name.includes('/events?'));
        const frames = (window as unknown as { kcFrames: { ran: number; done: number }[] }).kcFrames;
        return measures.map((measure) => {
          const end = measure.startTime + measure.duration;
          return {
            chips: (measure.detail as { chips: number }).chips,
            afterItsResponse: arrivals.some((arrival) => arrival.responseEnd <= measure.startTime && measure.startTime - arrival.responseEnd < 1000),
            framed: frames.some((frame) => measure.startTime <= frame.ran && frame.done <= end),
            start: measure.startTime,
          };
        });
      });
    const markedOnce = async () => {
      await page.waitForFunction(() => performance.getEntriesByName('kc-month-render').length > 0);
      // Any second measure would follow within a frame or two.
      await twoFrames(page);
      return marked();
    };

    await page.goto(`/studios/${harness.demoStudioId}/calendar`);
    const first = await markedOnce();
    expect(first).toEqual([{ chips: expect.any(Number), afterItsResponse: true, framed: true, start: expect.any(Number) }]);
    expect(first[0].chips).toBeGreaterThan(0);

    // The week's events come in with no month view to render them; the month view made after them
    // does not measure from their arrival, only from its own month's.
    const weekEvents = page.waitForResponse((response) => response.url().includes('/events?'));
    await page.locator('mat-button-toggle', { hasText: 'Week' }).click();
    await weekEvents;
    await page.locator('kc-week-view [data-date]').first().waitFor();
    const switched = await page.evaluate(() => {
      performance.clearMeasures('kc-month-render');
      return performance.now();
    });
    await page.locator('mat-button-toggle', { hasText: 'Month' }).click();
    const again = await markedOnce();
    expect(again).toHaveLength(1);
    expect(again[0]).toMatchObject({ afterItsResponse: true, framed: true });
    expect(again[0].start).toBeGreaterThan(switched);
    await page.context().close();
  }, 60_000);

  // The page scrolls inside the calendar's sidenav content (around its side sheet). Chromium scrolls
  // a scroller on the compositor only when it is painted opaque (styles.scss); a transparent one is
  // repainted and rasterised again at every scroll step, as when a drag near the month's edge scrolls
  // it on each frame. Checked on the browser's own layer tree (DevTools protocol, LayerTree domain):
  // what scrolls gets a layer of its own, as tall as the scrolled content.
  it('when the month is taller than the window, then it scrolls on the compositor: what scrolls has a layer of its own', async () => {
    const page = await harness.newPage({ viewport: { width: 1280, height: 600 } });
    await signInAs(page, 'crew@demo.test');
    await page.goto(`/studios/${harness.demoStudioId}/calendar`);
    await page.locator('kc-month-view button.chip').first().waitFor();
    const scroller = page.locator(calendarScroller);
    const size = await scroller.evaluate((element) => ({ scrolled: element.scrollHeight, shown: element.clientHeight }));
    expect(size.scrolled).toBeGreaterThan(size.shown);

    const cdp = await page.context().newCDPSession(page);
    type Layer = { backendNodeId?: number; drawsContent: boolean; width: number; height: number };
    let layers: Layer[] = [];
    cdp.on('LayerTree.layerTreeDidChange', (change: { layers?: Layer[] }) => (layers = change.layers ?? layers));
    await cdp.send('DOM.enable');
    await cdp.send('LayerTree.enable');
    const { result } = await cdp.send('Runtime.evaluate', { expression: `document.querySelector('${calendarScroller}')` });
    const { node } = await cdp.send('DOM.describeNode', { objectId: result.objectId });
    await page.mouse.move(400, 400);
    await page.mouse.wheel(0, 40);
    const scrolling = () => layers.filter((layer) => layer.backendNodeId === node.backendNodeId && layer.drawsContent).map((layer) => layer.height);
    for (let wait = 0; wait < 50 && !scrolling().includes(size.scrolled); wait++) await page.waitForTimeout(100);
    expect(scrolling()).toContain(size.scrolled);
    await page.context().close();
  }, 60_000);

  // While a chip is dragged, the day under the pointer is outlined (chip-drags.ts). The days are
  // looked up among their rectangles on screen, which a scroll during the drag moves.
  it('when a step is dragged over the days, then the day under the pointer is outlined, also after the page scrolls under it', async () => {
    const step = await planRunwayThroughApi(addDays(nextWeekDays()[0], 60), nextWeekDays()[0]);
    // Short enough for the page to scroll by a week's row either way, in a month of four weeks too.
    const page = await harness.newPage({ viewport: { width: 1280, height: 500 } });
    const patches: string[] = [];
    page.on('request', (request) => {
      if (request.method() === 'PATCH') patches.push(request.url());
    });
    await signInAs(page, 'partner@demo.test');
    await page.goto(`/studios/${harness.demoStudioId}/calendar`);
    await page.locator('kc-month-view [data-date]').first().waitFor();
    if (step.start.slice(0, 7) !== todayIso().slice(0, 7)) {
      await page.getByRole('button', { name: 'Next month' }).click();
    }
    const source = page.locator(`kc-month-view [data-date="${step.start}"] [data-event-id="${step.id}"]`);
    await source.waitFor();
    // In the middle of the window, away from the edges where a drag scrolls the page.
    await source.evaluate((chip) => chip.scrollIntoView({ block: 'center' }));
    const home = await source.evaluate((chip) => chip.closest<HTMLElement>('[data-date]')!.dataset['date']!);
    const outlined = () => page.locator('.drop-target').evaluateAll((cells) => cells.map((cell) => (cell as HTMLElement).dataset['date']));
    const dayUnder = (x: number, y: number) => page.evaluate(([x, y]) => document.elementFromPoint(x, y)?.closest<HTMLElement>('[data-date]')?.dataset['date'] ?? null, [x, y]);

    const from = (await source.boundingBox())!;
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await page.mouse.down();
    await page.mouse.move(from.x + from.width / 2 + 8, from.y + from.height / 2 + 8, { steps: 4 });
    // A day of another column, away from the window's edges (where the drag scrolls).
    const point = { x: from.x + from.width / 2 < 640 ? 800 : 400, y: 300 };
    await page.mouse.move(point.x, point.y, { steps: 10 });
    const before = await dayUnder(point.x, point.y);
    expect(before).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(before).not.toBe(home);
    await expect(outlined()).resolves.toEqual([before]);

    // The page scrolls by a week's row under the still pointer (up if it can, else down); the next
    // move outlines the day now there.
    const scroller = page.locator(calendarScroller);
    const scrolled = await scroller.evaluate((element) => {
      const by = element.scrollTop >= 124 ? -124 : 124;
      element.scrollBy(0, by);
      return by;
    });
    await twoFrames(page);
    await page.mouse.move(point.x + 1, point.y, { steps: 1 });
    const after = await dayUnder(point.x + 1, point.y);
    expect(after).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(after).not.toBe(before);
    await expect(outlined()).resolves.toEqual([after]);

    // Scrolled back, onto its own day and let go there: nothing is outlined, nothing is sent.
    await scroller.evaluate((element, by) => element.scrollBy(0, -by), scrolled);
    await twoFrames(page);
    const homeCell = (await page.locator(`kc-month-view [data-date="${home}"]`).boundingBox())!;
    // Its day's number line: the cell's middle may be near the window's lower edge.
    await page.mouse.move(homeCell.x + homeCell.width / 2, homeCell.y + 12, { steps: 10 });
    await expect(outlined()).resolves.toEqual([home]);
    await page.mouse.up();
    await expect(outlined()).resolves.toEqual([]);
    await page.waitForTimeout(300);
    expect(patches).toEqual([]);
    await page.context().close();
  }, 60_000);
});
