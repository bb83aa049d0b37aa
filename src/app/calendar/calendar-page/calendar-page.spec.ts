import { MatSnackBar } from '@angular/material/snack-bar';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import type { DragRef } from '@angular/cdk/drag-drop';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS, provideNativeDateAdapter } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { By } from '@angular/platform-browser';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import type { BlackoutView } from '@shared/contracts/markets';
import type { StudioSettings } from '@shared/contracts/studios';
import { SessionStore } from '../../core/session-store';
import { StudioContext } from '../../core/studio-context';
import { CalendarStore } from '../calendar-store';
import { ChipDrags } from '../chip-drags';
import { MoveFlow } from '../move-flow';
import { CalendarPage, loadingBarDelayMs } from './calendar-page';

const base = '/api/studios/7';
const settings: StudioSettings = {
  id: 7,
  name: 'Test bench',
  timezone: 'UTC',
  country: 'US',
  region: null,
  weekStart: 1,
  workDays: [1, 2, 3, 4, 5],
  dailyCapacityHours: 8,
  holidaysOff: true,
  version: 1,
  role: 'partner',
};

function step(overrides: Partial<CalendarEvent>): CalendarEvent {
  return {
    id: '41',
    kind: 'build',
    title: 'Batch cut',
    start: '2026-12-08',
    end: '2026-12-08',
    allDay: true,
    editable: true,
    version: 3,
    runwayId: 5,
    stepIndex: 2,
    workDays: 1,
    hoursPerDay: 6,
    cureDays: 0,
    themeId: 9,
    themeName: 'Herb garden',
    assigneeId: 2,
    assigneeName: 'Tobin Ashgrove',
    cautions: ['Never leave the laser cutter running unattended.'],
    ...overrides,
  };
}

const trayStep: TrayStep = { ...step({ id: '44', title: 'Photograph', kind: 'content', stepIndex: 5 }), start: null, end: null, workDays: 1 };

/**
 * The calendar page for `role` with `events` and the studio's days off (`blackouts`) loaded, or (when
 * `beforeEvents` is given) with the month still to answer, which it gets after that callback.
 */
async function setUp(
  role: 'partner' | 'crew' = 'partner',
  events: CalendarEvent[] = [step({})],
  beforeEvents?: (fixture: ComponentFixture<CalendarPage>) => Promise<void>,
  blackouts: BlackoutView[] = [],
) {
  TestBed.configureTestingModule({
    imports: [CalendarPage],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), provideNativeDateAdapter(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
  });
  const http = TestBed.inject(HttpTestingController);
  const session = TestBed.inject(SessionStore);
  const loading = session.load();
  http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 7, name: 'Test bench', role, timezone: 'America/Chicago', today: '2026-12-01' }] });
  await loading;
  TestBed.inject(StudioContext).select(7);
  const store = TestBed.inject(CalendarStore);
  store.goTo('2026-12-01');
  const fixture = TestBed.createComponent(CalendarPage);
  fixture.detectChanges();
  await settle();
  // December 2026 shows from Monday 30 November to Sunday 3 January; it is asked for at the same
  // time as the settings, so from Sunday 29 November in case the week starts on Sunday.
  const month = http.expectOne(`${base}/events?from=2026-11-29&to=2027-01-03`);
  http.expectOne(base).flush({ ...settings, role });
  await settle();
  await beforeEvents?.(fixture);
  month.flush(events);
  http.expectOne(`${base}/events/tray`).flush([trayStep]);
  http.expectOne(`${base}/blackouts`).flush(blackouts);
  http.match(`${base}/events/stamp`).forEach((request) => request.flush({ stamp: 'a' }));
  await settle();
  const announcer = TestBed.inject(LiveAnnouncer);
  const announce = jest.spyOn(announcer, 'announce');
  return { fixture, http, store, announce, loader: TestbedHarnessEnvironment.documentRootLoader(fixture) };
}

function cell(fixture: ComponentFixture<CalendarPage>, date: string): HTMLElement {
  return fixture.nativeElement.querySelector(`[data-date="${date}"]`);
}

function chipsIn(fixture: ComponentFixture<CalendarPage>, date: string): string[] {
  return [...cell(fixture, date).querySelectorAll('.chip .title')].map((title) => title.textContent!.trim());
}

/**
 * Emits a CDK drop as the days' (or the tray's) drop list does at the end of a drag, the pointer over
 * the cell of `to` (jsdom lays nothing out, so elementFromPoint is given that cell).
 */
function drop(fixture: ComponentFixture<CalendarPage>, item: CalendarEvent | TrayStep, from: string | null, to: string): void {
  const lists = fixture.debugElement.queryAll(By.directive(ChipDrags)).map((list) => list.injector.get(ChipDrags).dropList);
  const days = lists.find((list) => list.data === 'days')!;
  const tray = lists.find((list) => list.data === 'tray')!;
  const target = to === 'tray' ? tray : days;
  document.elementFromPoint = () => (to === 'tray' ? fixture.nativeElement.querySelector('kc-calendar-tray') : cell(fixture, to));
  target.dropped.next({
    container: target,
    previousContainer: from === null ? tray : days,
    item: { data: { item, day: from } } as DragRef,
    currentIndex: 0,
    previousIndex: 0,
    isPointerOverContainer: true,
    distance: { x: 0, y: 0 },
    dropPoint: { x: 10, y: 10 },
    event: new MouseEvent('mouseup'),
  });
}

/** The ChipDrags of the month's days. */
function monthDrags(fixture: ComponentFixture<CalendarPage>): ChipDrags {
  return fixture.debugElement.query(By.css('kc-month-view [role=grid]')).injector.get(ChipDrags);
}

/** Lets answers and effects run; not whenStable, which waits for every open request. */
async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

/** Closes the page and opens it again, its first look for changes answered with `stamp` (setUp's is 'a'). */
async function openAgain(fixture: ComponentFixture<CalendarPage>, stamp: string): Promise<ComponentFixture<CalendarPage>> {
  fixture.destroy();
  const again = TestBed.createComponent(CalendarPage);
  again.detectChanges();
  await settle();
  TestBed.inject(HttpTestingController).expectOne(`${base}/events/stamp`).flush({ stamp });
  await settle();
  return again;
}

/** Clicks a button in the overlay by its text without waiting for stability (the click starts a request). */
function clickInOverlay(text: string): void {
  const button = [...document.querySelectorAll<HTMLButtonElement>('.cdk-overlay-container button')].find((candidate) => candidate.textContent!.trim() === text);
  if (!button) throw new Error(`no button "${text}" in the overlay`);
  button.click();
}

// The first test also compiles the page and Material.
jest.setTimeout(20_000);

describe('CalendarPage', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify({ ignoreCancelled: true }));

  it('when the month loads, then the grid starts on the studio week start and shows events with kind, title and initials', async () => {
    const { fixture } = await setUp();
    const cells = fixture.nativeElement.querySelectorAll('.day[role=gridcell]');
    expect(cells.length).toBe(35);
    expect(cells[0].dataset.date).toBe('2026-11-30');
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['Batch cut']);
    // The initials are drawn from the chip's data-initials (_chip.scss); its name says whose it is.
    const chip: HTMLElement = cell(fixture, '2026-12-08').querySelector('button.chip')!;
    expect(chip.dataset['initials']).toBe('TA');
    expect(chip.dataset['kind']).toBe('build');
    expect(chip.getAttribute('aria-label')).toContain('assigned to');
    expect(cell(fixture, '2026-12-01').classList).toContain('today');
    expect(fixture.nativeElement.querySelector('kc-calendar-tray').textContent).toContain('Herb garden');
  });

  it('when the page opens, then its legend draws each kind as the month does (a chip, or a band for holidays and occasions) and a chip with your initials, before the month comes', async () => {
    let samples: { kind: string | undefined; look: string; initials: string | undefined; text: string }[] = [];
    await setUp('partner', [step({})], async (fixture) => {
      samples = [...fixture.nativeElement.querySelectorAll('.legend li > span')].map((sample: HTMLElement) => ({
        kind: sample.dataset['kind'],
        look: sample.className,
        initials: sample.dataset['initials'],
        text: sample.textContent!.trim(),
      }));
    });
    expect(samples).toEqual([
      { kind: 'build', look: 'chip', initials: undefined, text: 'Build day' },
      { kind: 'content', look: 'chip', initials: undefined, text: 'Content day' },
      { kind: 'launch', look: 'chip', initials: undefined, text: 'Launch' },
      { kind: 'market', look: 'chip', initials: undefined, text: 'Market' },
      { kind: 'holiday', look: 'band', initials: undefined, text: 'Holiday' },
      { kind: 'occasion', look: 'band', initials: undefined, text: 'Occasion' },
      { kind: 'deadline', look: 'chip', initials: undefined, text: 'Deadline' },
      { kind: 'build', look: 'chip', initials: 'TA', text: 'Assigned to you' },
    ]);
  });

  it('when steps book hours across a weekend and a holiday, then each day counts the hours of its work days only', async () => {
    // Work days Monday to Friday, holidays off (settings above); Monday 7 December is a holiday here.
    const { store } = await setUp('partner', [
      step({ id: '1', kind: 'build', start: '2026-12-04', end: '2026-12-08', hoursPerDay: 3 }),
      step({ id: '2', kind: 'content', start: '2026-12-04', end: '2026-12-04', hoursPerDay: 2 }),
      step({ id: '3', kind: 'launch', start: '2026-12-04', end: '2026-12-04', hoursPerDay: null }),
      step({ id: '4', kind: 'holiday', title: 'Workshop day off', start: '2026-12-07', end: '2026-12-07', editable: false, hoursPerDay: null }),
    ]);
    const booked = new Map(store.dayEntries().map((entry) => [entry.date, entry.bookedHours]));
    expect(['2026-12-03', '2026-12-04', '2026-12-05', '2026-12-06', '2026-12-07', '2026-12-08'].map((date) => booked.get(date))).toEqual([0, 5, 0, 0, 0, 3]);
  });

  /** Whether the page is kept unseen (opacity 0 in calendar-page.scss) and whether it shows a loading bar. */
  const looks = (fixture: ComponentFixture<CalendarPage>) => ({
    isUnseen: fixture.nativeElement.querySelector('section.calendar').classList.contains('unseen'),
    hasBar: fixture.nativeElement.querySelector('mat-progress-bar') !== null,
  });

  it('when the month takes longer than loadingBarDelayMs to come, then the page is unseen until then and shows a loading bar after, until the month comes', async () => {
    const seen: ReturnType<typeof looks>[] = [];
    const { fixture } = await setUp('partner', [step({})], async (waiting) => {
      seen.push(looks(waiting));
      await new Promise((resolve) => setTimeout(resolve, loadingBarDelayMs + 50));
      await settle();
      seen.push(looks(waiting));
    });
    expect(seen).toEqual([
      { isUnseen: true, hasBar: false },
      { isUnseen: false, hasBar: true },
    ]);
    expect(looks(fixture)).toEqual({ isUnseen: false, hasBar: false });
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['Batch cut']);
  });

  it('when the month comes quickly, then the page shows as soon as it does; opened again, it shows at once while the month refreshes', async () => {
    const seen: ReturnType<typeof looks>[] = [];
    const { fixture, http, store } = await setUp('partner', [step({})], async (waiting) => {
      seen.push(looks(waiting));
    });
    expect(seen).toEqual([{ isUnseen: true, hasBar: false }]);
    expect(looks(fixture)).toEqual({ isUnseen: false, hasBar: false });
    fixture.destroy();
    store.refresh();
    expect(store.events.isLoading()).toBe(true);
    const again = TestBed.createComponent(CalendarPage);
    again.detectChanges();
    await settle();
    expect(looks(again)).toEqual({ isUnseen: false, hasBar: false });
    http.match(() => true).forEach((request) => request.flush(request.request.url.endsWith('/stamp') ? { stamp: 'a' } : []));
  });

  it('when a month day holds more than its four lines, then a band takes a line, "+N more" the last, and opening it shows every chip', async () => {
    const events = [
      step({ id: '90', kind: 'holiday', title: 'Winter fair', editable: false }),
      ...['One', 'Two', 'Three', 'Four', 'Five'].map((title, index) => step({ id: String(50 + index), title })),
      ...['Six', 'Seven', 'Eight'].map((title, index) => step({ id: String(60 + index), title, start: '2026-12-09', end: '2026-12-09' })),
    ];
    const { fixture } = await setUp('partner', events);
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['One', 'Two']);
    expect(cell(fixture, '2026-12-08').querySelector('.band')!.textContent).toContain('Winter fair');
    const more = cell(fixture, '2026-12-08').querySelector<HTMLButtonElement>('.more')!;
    expect(more.textContent!.trim()).toBe('+3 more');
    // Three chips and no band fit the four lines as they are.
    expect(chipsIn(fixture, '2026-12-09')).toEqual(['Six', 'Seven', 'Eight']);
    expect(cell(fixture, '2026-12-09').querySelector('.more:not([hidden])')).toBeNull();
    more.click();
    await settle();
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['One', 'Two', 'Three', 'Four', 'Five']);
    expect(cell(fixture, '2026-12-08').querySelector('kc-day-items')!.classList).toContain('open');
    const fewer = cell(fixture, '2026-12-08').querySelector<HTMLButtonElement>('.more')!;
    expect([fewer.textContent!.trim(), fewer.hidden]).toEqual(['Show fewer', false]);
    fewer.click();
    await settle();
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['One', 'Two']);
    expect(more.getAttribute('aria-label')).toBe('Show 3 more on this day');
  });

  it('when a step is dropped on another day, then it shows there at once, is sent with its version, and the answer offers to shift the following steps', async () => {
    const { fixture, http, loader } = await setUp();
    drop(fixture, step({}), '2026-12-08', '2026-12-10');
    await settle();
    expect(chipsIn(fixture, '2026-12-10')).toEqual(['Batch cut']);
    expect(chipsIn(fixture, '2026-12-08')).toEqual([]);
    const request = http.expectOne(`${base}/events/41`);
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ start: '2026-12-10', end: '2026-12-10', version: 3 });
    request.flush({ event: step({ start: '2026-12-10', end: '2026-12-10', version: 4 }), warnings: [] });
    await settle();
    const snackBar = await loader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe('Moved Batch cut to Thursday, December 10.');
    expect(await snackBar.getActionDescription()).toBe('Shift the following steps');

    clickInOverlay('Shift the following steps');
    await settle();
    const preview = http.expectOne(`${base}/events/41/replan?preview=1`);
    preview.flush({ moves: [{ id: '42', title: 'Finish', from: { start: '2026-12-09', end: '2026-12-10' }, to: { start: '2026-12-11', end: '2026-12-14' } }], warnings: [] });
    await settle();
    const dialog = await loader.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain('Finish: Wed, Dec 9 – Thu, Dec 10 → Fri, Dec 11 – Mon, Dec 14');
    expect(await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep them' }))).isDisabled()).toBe(false);
    clickInOverlay('Shift 1 step');
    await settle();
    const apply = http.expectOne(`${base}/events/41/replan`);
    expect(apply.request.method).toBe('POST');
    apply.flush({ moves: [{ id: '42', title: 'Finish', from: { start: '2026-12-09', end: '2026-12-10' }, to: { start: '2026-12-11', end: '2026-12-14' } }], warnings: [] });
    await settle();
    http.expectOne(`${base}/events?from=2026-11-29&to=2027-01-03`).flush([step({ start: '2026-12-10', end: '2026-12-10', version: 4 })]);
    http.expectOne(`${base}/events/tray`).flush([trayStep]);
  });

  it('when a tray step is dropped on a day, then it leaves the tray and its end follows its work days', async () => {
    const { fixture, http } = await setUp();
    drop(fixture, { ...trayStep, workDays: 2 }, null, '2026-12-04');
    await settle();
    expect(fixture.nativeElement.querySelector('kc-calendar-tray').textContent).not.toContain('Photograph');
    const request = http.expectOne(`${base}/events/44`);
    // Friday 4 December and the next work day, Monday 7 December (Saturday and Sunday are off).
    expect(request.request.body).toEqual({ start: '2026-12-04', end: '2026-12-07', version: 3 });
    request.flush({ event: { ...trayStep, start: '2026-12-04', end: '2026-12-07', version: 4 }, warnings: [] });
    await settle();
    expect(chipsIn(fixture, '2026-12-07')).toContain('Photograph');
  });

  it('when a step is dropped back on its own day, then nothing moves and nothing is sent', async () => {
    const { fixture, http } = await setUp();
    drop(fixture, step({}), '2026-12-08', '2026-12-08');
    await settle();
    http.expectNone(`${base}/events/41`);
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['Batch cut']);
  });

  it('when a step is dropped on the tray, then it is sent back with start null and shows in the tray', async () => {
    const { fixture, http } = await setUp();
    const tray = () => fixture.nativeElement.querySelector('kc-calendar-tray').textContent as string;
    drop(fixture, step({}), '2026-12-08', 'tray');
    await settle();
    expect(chipsIn(fixture, '2026-12-08')).toEqual([]);
    expect(tray()).toContain('Batch cut');
    const request = http.expectOne(`${base}/events/41`);
    expect(request.request.body).toEqual({ start: null, end: null, version: 3 });
    request.flush({ event: { ...step({ version: 4 }), start: null, end: null }, warnings: [] });
    await settle();
    expect(tray()).toContain('Batch cut');
    expect(chipsIn(fixture, '2026-12-08')).toEqual([]);
  });

  it('when the server answers 409, then the step goes back to where the other member put it and "Move anyway" resends with force', async () => {
    const { fixture, http, loader, announce } = await setUp();
    drop(fixture, step({}), '2026-12-08', '2026-12-10');
    await settle();
    const current = step({ start: '2026-12-09', end: '2026-12-09', version: 5 });
    http.expectOne(`${base}/events/41`).flush({ error: { code: 'version_conflict', message: 'Someone else changed this step' }, current }, { status: 409, statusText: 'Conflict' });
    await settle();
    expect(chipsIn(fixture, '2026-12-10')).toEqual([]);
    expect(chipsIn(fixture, '2026-12-09')).toEqual(['Batch cut']);
    const snackBar = await loader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toContain('Someone else changed this step');
    expect(announce).toHaveBeenCalledWith(expect.stringContaining('Someone else changed this step'), 'assertive');
    clickInOverlay('Move anyway');
    await settle();
    const retry = http.expectOne(`${base}/events/41`);
    expect(retry.request.body).toEqual({ start: '2026-12-10', end: '2026-12-10', version: 5, force: true });
    retry.flush({ event: step({ start: '2026-12-10', end: '2026-12-10', version: 6 }), warnings: [] });
    await settle();
    expect(chipsIn(fixture, '2026-12-10')).toEqual(['Batch cut']);
  });

  it('when a move breaks a rule (422), then it rolls back and the message says why', async () => {
    const { fixture, http, loader } = await setUp();
    drop(fixture, step({}), '2026-12-08', '2026-12-12');
    await settle();
    const reply: TestRequest = http.expectOne(`${base}/events/41`);
    reply.flush(
      { error: { code: 'rule_broken', message: 'This move breaks a rule' }, warnings: [{ code: 'blackout', message: '2026-12-12 is a Saturday, not a work day' }] },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    expect(chipsIn(fixture, '2026-12-08')).toEqual(['Batch cut']);
    expect(chipsIn(fixture, '2026-12-12')).toEqual([]);
    const snackBar = await loader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe('Not moved: 2026-12-12 is a Saturday, not a work day');
    expect(await snackBar.getActionDescription()).toBe('Move anyway');
  });

  it('when a focused step gets arrow keys and Enter, then it moves by that many days and each step is announced', async () => {
    const { fixture, http, announce } = await setUp();
    const button: HTMLButtonElement = cell(fixture, '2026-12-08').querySelector('button.chip')!;
    button.focus();
    for (const key of ['ArrowRight', 'ArrowRight', 'ArrowDown', 'ArrowLeft']) {
      const press = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true });
      button.dispatchEvent(press);
      // Used by the move, so the page does not scroll as well.
      expect(press.defaultPrevented).toBe(true);
    }
    await settle();
    expect(announce).toHaveBeenLastCalledWith('Move Batch cut to Wednesday, December 16? Press Enter to move, Escape to cancel.');
    expect(cell(fixture, '2026-12-16').classList).toContain('keyboard-target');
    button.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await settle();
    const request = http.expectOne(`${base}/events/41`);
    expect(request.request.body).toEqual({ start: '2026-12-16', end: '2026-12-16', version: 3 });
    request.flush({ event: step({ start: '2026-12-16', end: '2026-12-16', version: 4 }), warnings: [] });
    await settle();
    expect(announce).toHaveBeenCalledWith('Moved Batch cut to Wednesday, December 16.');
  });

  it('when a chip or a band is clicked, then its side sheet opens on that item', async () => {
    const { fixture } = await setUp('partner', [step({}), step({ id: '90', kind: 'holiday', title: 'Winter fair', editable: false })]);
    const flow = TestBed.inject(MoveFlow);
    cell(fixture, '2026-12-08').querySelector<HTMLElement>('button.chip .title')!.click();
    expect(flow.selectedId()).toBe('41');
    cell(fixture, '2026-12-08').querySelector<HTMLElement>('button.band')!.click();
    expect(flow.selectedId()).toBe('90');
  });

  it('when an occasion falls on a public holiday of the same name, then the day draws one band for both, and hiding occasions leaves the holiday\'s', async () => {
    const fixed = { editable: false, hoursPerDay: null, start: '2026-12-25', end: '2026-12-25' };
    const { fixture, store } = await setUp('partner', [
      step({ ...fixed, id: 'holiday:christmas:2026-12-25', kind: 'holiday', title: 'Christmas Day' }),
      step({ ...fixed, id: 'occasion:christmas:2026-12-25', kind: 'occasion', title: 'Christmas Day', sellWindowStart: '2026-11-13' }),
      step({ ...fixed, id: 'occasion:eve:2026-12-24', kind: 'occasion', title: 'Christmas Eve', start: '2026-12-24', end: '2026-12-24' }),
    ]);
    const bandsOn = (date: string) => [...cell(fixture, date).querySelectorAll<HTMLElement>('button.band')].map((band) => ({ kind: band.dataset['kind'], also: band.dataset['also'], name: band.getAttribute('aria-label') }));
    expect(bandsOn('2026-12-25')).toEqual([{ kind: 'occasion', also: 'holiday', name: 'Occasion and public holiday: Christmas Day' }]);
    expect(bandsOn('2026-12-24')).toEqual([{ kind: 'occasion', also: undefined, name: 'Occasion: Christmas Eve' }]);
    // The holiday is still a day off for work.
    expect(store.workCalendar().isWorkDay('2026-12-25', 'build')).toBe(false);

    cell(fixture, '2026-12-25').querySelector<HTMLElement>('button.band')!.click();
    await settle();
    expect(fixture.nativeElement.querySelector('kc-event-sheet').textContent).toContain('Also a public holiday, a day off for work');

    store.toggleKind('occasion');
    await settle();
    expect(bandsOn('2026-12-25')).toEqual([{ kind: 'holiday', also: undefined, name: 'Holiday: Christmas Day' }]);
  });

  it('when the partner presses a chip, then it gets its drag, carrying the step and the day it was pressed on', async () => {
    const { fixture } = await setUp();
    const button: HTMLButtonElement = cell(fixture, '2026-12-08').querySelector('button.chip')!;
    expect(monthDrags(fixture).dragOf(button)).toBeUndefined();
    button.dispatchEvent(new MouseEvent('mousedown', { bubbles: true }));
    const drag = monthDrags(fixture).dragOf(button)!;
    button.dispatchEvent(new MouseEvent('mousedown', { bubbles: true }));
    // One drag per chip, made at its first press and kept.
    expect(monthDrags(fixture).dragOf(button)).toBe(drag);
    expect(drag.data.item.id).toBe('41');
    expect(drag.data.day).toBe('2026-12-08');
    expect(drag.disabled).toBe(false);
    document.dispatchEvent(new MouseEvent('mouseup'));
  });

  it('when the partner holds a chip in a drag, then the look for other members\' changes waits until it is let go', async () => {
    const { fixture, http, store } = await setUp();
    const button: HTMLButtonElement = cell(fixture, '2026-12-08').querySelector('button.chip')!;
    const pointer = { bubbles: true, buttons: 1, detail: 1, clientX: 20, clientY: 20 };
    button.dispatchEvent(new MouseEvent('mousedown', pointer));
    // Past the CDK's start threshold of 5 px: the drag starts.
    document.dispatchEvent(new MouseEvent('mousemove', { ...pointer, clientX: 40, clientY: 40 }));
    expect(monthDrags(fixture).dragOf(button)!.isDragging()).toBe(true);
    expect(await store.checkForChanges()).toBe(false);
    http.expectNone(`${base}/events/stamp`);
    // Let go on its own day (jsdom lays nothing out: the drop's hit test is given that cell), which moves nothing.
    document.elementFromPoint = () => cell(fixture, '2026-12-08');
    document.dispatchEvent(new MouseEvent('mouseup', { ...pointer, buttons: 0 }));
    await settle();
    http.expectNone(`${base}/events/41`);
    const checking = store.checkForChanges();
    http.expectOne(`${base}/events/stamp`).flush({ stamp: 'a' });
    expect(await checking).toBe(false);
  });

  it('when crew opens the calendar, then no step can be dragged or moved by keys and the plan button is gone', async () => {
    const { fixture, http } = await setUp('crew', [step({ editable: false })]);
    const button: HTMLButtonElement = cell(fixture, '2026-12-08').querySelector('button.chip')!;
    button.dispatchEvent(new MouseEvent('mousedown', { bubbles: true }));
    expect(monthDrags(fixture).dragOf(button)).toBeUndefined();
    expect(button.classList).toContain('fixed');
    button.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    button.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await settle();
    http.expectNone(`${base}/events/41`);
    expect(fixture.nativeElement.textContent).not.toContain('Plan runway');
  });

  it('when the stamp changes, then the calendar refetches what another member changed', async () => {
    const { fixture, http, store } = await setUp();
    const checking = store.checkForChanges();
    http.expectOne(`${base}/events/stamp`).flush({ stamp: 'b' });
    expect(await checking).toBe(true);
    await settle();
    http.expectOne(`${base}/events?from=2026-11-29&to=2027-01-03`).flush([step({ start: '2026-12-11', end: '2026-12-11', version: 9 })]);
    http.expectOne(`${base}/events/tray`).flush([]);
    http.expectOne(`${base}/blackouts`).flush([{ start: '2026-12-14', end: '2026-12-14', note: null }]);
    await settle();
    expect(chipsIn(fixture, '2026-12-11')).toEqual(['Batch cut']);
    expect(cell(fixture, '2026-12-14').classList).toContain('day-off');
  });

  it('when the calendar is opened again after a change made elsewhere, then its first look for changes refetches the month', async () => {
    const { fixture, http } = await setUp();
    // Meanwhile a day off is added on the Markets page, which changes the studio's stamp.
    const again = await openAgain(fixture, 'b');
    http.expectOne(`${base}/events?from=2026-11-29&to=2027-01-03`).flush([step({})]);
    http.expectOne(`${base}/events/tray`).flush([]);
    http.expectOne(`${base}/blackouts`).flush([{ start: '2026-12-09', end: '2026-12-09', note: 'Stocktake' }]);
    await settle();
    expect(cell(again, '2026-12-09').getAttribute('aria-label')).toBe('Wednesday, December 9, Day off: Stocktake');
  });

  it('when the calendar is opened again and nothing changed, then it shows what it had without refetching', async () => {
    const { fixture, http } = await setUp();
    const again = await openAgain(fixture, 'a');
    http.expectNone(`${base}/events?from=2026-11-29&to=2027-01-03`);
    expect(chipsIn(again, '2026-12-08')).toEqual(['Batch cut']);
  });

  it('when a day of the phone\'s agenda is a day off, then it says so instead of "Nothing planned"', async () => {
    const { fixture, http, store } = await setUp('partner', [], undefined, [{ start: '2026-12-02', end: '2026-12-02', note: null }]);
    store.setPhoneWidth(true);
    await settle();
    http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([]));
    await settle();
    const linesOf = (date: string) => [...fixture.nativeElement.querySelectorAll(`kc-agenda-list [data-date="${date}"] > *`)].map((line: Element) => line.textContent!.trim());
    expect(linesOf('2026-12-02')).toEqual(['Wednesday, December 2', 'Day off']);
    expect(linesOf('2026-12-03')).toEqual(['Thursday, December 3', 'Nothing planned']);
  });

  it('when the view moves on to other days, then a move\'s message shown for the days before goes', async () => {
    const { store, http } = await setUp();
    TestBed.inject(MatSnackBar).open('Not moved: Paint: 2026-12-12 is a market day', 'Move anyway');
    await settle();
    expect(document.querySelector('.mdc-snackbar__label')?.textContent).toContain('Not moved');
    store.step(1);
    await settle();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(document.querySelector('.mdc-snackbar__label')).toBeNull();
    http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([]));
  });

  it("when the phone's agenda steps on a week, then it shows the next 8 days with their steps, asks for them, and Today comes back", async () => {
    const { fixture, http, store } = await setUp('partner', []);
    store.setPhoneWidth(true);
    await settle();
    http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([]));
    await settle();
    fixture.detectChanges();
    const heading = () => (fixture.nativeElement as HTMLElement).querySelector('h1')!.textContent!.trim();
    const button = (name: string) => (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>(`button[aria-label="${name}"]`)!;
    expect(heading()).toBe('This week');
    button('Next week').click();
    await settle();
    const asked = http.match((request) => request.url === `${base}/events`);
    expect(asked.map((request) => [request.request.params.get('from'), request.request.params.get('to')]).at(-1)).toEqual(['2026-12-08', '2026-12-15']);
    asked.forEach((request) => request.flush([step({ id: '9', title: 'Film the glue-up', kind: 'content', start: '2026-12-14', end: '2026-12-14' })]));
    await settle();
    fixture.detectChanges();
    expect(heading()).toBe('Tue, Dec 8 – Tue, Dec 15');
    expect((fixture.nativeElement as HTMLElement).querySelector('kc-agenda-list [data-date="2026-12-14"]')!.textContent).toContain('Film the glue-up');
    const today = [...(fixture.nativeElement as HTMLElement).querySelectorAll('button')].find((one) => one.textContent!.trim() === 'Today')!;
    today.click();
    await settle();
    http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([]));
    await settle();
    fixture.detectChanges();
    expect(heading()).toBe('This week');
  });

  it('when the studio has days off, then their days are hatched and named, book no hours, and a step dropped before them skips them', async () => {
    const { fixture, http, store } = await setUp(
      'partner',
      [step({ id: '1', start: '2026-12-08', end: '2026-12-11', workDays: 2, hoursPerDay: 3 })],
      undefined,
      [{ start: '2026-12-09', end: '2026-12-10', note: 'Stocktake' }],
    );
    const wednesday = cell(fixture, '2026-12-09');
    expect(wednesday.classList).toContain('day-off');
    expect(wednesday.querySelector('.day-off-label')!.textContent!.trim()).toBe('Day off');
    expect(wednesday.querySelector('.day-off-label')!.getAttribute('title')).toBe('Day off: Stocktake');
    expect(wednesday.getAttribute('aria-label')).toBe('Wednesday, December 9, Day off: Stocktake');
    expect(cell(fixture, '2026-12-08').classList).not.toContain('day-off');
    const booked = new Map(store.dayEntries().map((entry) => [entry.date, entry.bookedHours]));
    expect(['2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11'].map((date) => booked.get(date))).toEqual([3, 0, 0, 3]);

    // Two work days from Tuesday 8 December: the 8th and, past the days off, Friday the 11th.
    drop(fixture, { ...trayStep, workDays: 2 }, null, '2026-12-08');
    await settle();
    const request = http.expectOne(`${base}/events/44`);
    expect(request.request.body).toEqual({ start: '2026-12-08', end: '2026-12-11', version: 3 });
    request.flush({ event: { ...trayStep, start: '2026-12-08', end: '2026-12-11', version: 4 }, warnings: [] });
    await settle();

    // The week names the day off, with its note, where a work day has its booked hours.
    store.setView('week');
    store.goTo('2026-12-08');
    await settle();
    http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([]));
    await settle();
    expect(cell(fixture, '2026-12-09').querySelector('[role=meter]')).toBeNull();
    expect(cell(fixture, '2026-12-09').querySelector('.capacity')!.textContent!.trim()).toBe('Day off: Stocktake');
    expect(cell(fixture, '2026-12-08').querySelector('[role=meter]')!.getAttribute('aria-label')).toBe('Booked 0 of 8 hours');
  });
});

describe('CalendarPage opened at an address', () => {
  afterEach(() => TestBed.resetTestingModule());

  it('when the address names a date and an event, then the calendar shows that month with the event\'s sheet open, and the address drops them', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'calendar', component: CalendarPage }]),
        provideNativeDateAdapter(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    const http = TestBed.inject(HttpTestingController);
    const loading = TestBed.inject(SessionStore).load();
    http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 7, name: 'Test bench', role: 'partner', timezone: 'America/Chicago', today: '2026-12-01' }] });
    await loading;
    TestBed.inject(StudioContext).select(7);
    const store = TestBed.inject(CalendarStore);
      store.goTo('2026-12-01');
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/calendar?date=2027-03-10&event=41');
    await settle();
    http.match(base).forEach((request) => request.flush(settings));
    await settle();
    // March 2027 runs from Monday 1 March to Sunday 4 April (a Monday week start), asked for from the Sunday before.
    http.expectOne(`${base}/events?from=2027-02-28&to=2027-04-04`).flush([step({ id: '41', title: 'Glue up frames', start: '2027-03-10', end: '2027-03-10' })]);
    http.match(`${base}/events/tray`).forEach((request) => request.flush([]));
    http.match(`${base}/blackouts`).forEach((request) => request.flush([]));
    http.match(`${base}/events/stamp`).forEach((request) => request.flush({ stamp: 'a' }));
    await settle();
    harness.detectChanges();
    expect(store.focus()).toBe('2027-03-10');
    expect(TestBed.inject(MoveFlow).selectedId()).toBe('41');
    expect(harness.routeNativeElement!.querySelector('kc-event-sheet')!.textContent).toContain('Glue up frames');
    expect(TestBed.inject(Router).url).toBe('/calendar');
  });
});
