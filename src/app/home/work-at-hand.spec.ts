import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import type { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { provideRouter } from '@angular/router';
import { addDays } from '@shared/calendar/dates';
import type { AtHand, CalendarEvent } from '@shared/contracts/calendar';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';
import { WorkAtHand } from './work-at-hand';

const base = '/api/studios/7';
/** The studio's today as the server states it: years from the browser's own date, so reading the browser's clock fails. */
const today = '2031-05-14';
const me = 3;

function step(overrides: Partial<CalendarEvent>): CalendarEvent {
  return { id: '40', kind: 'build', title: 'Cut stars', start: today, end: today, allDay: true, editable: true, version: 1, done: false, assigneeId: me, assigneeName: 'Juniper Lake', themeName: 'Winter window stars', ...overrides };
}

const answer: AtHand = {
  overdue: [step({ id: '41', title: 'Sand edges', start: addDays(today, -3), end: addDays(today, -2), assigneeId: 9, assigneeName: 'Rowan Pell' })],
  overdueCount: 3,
  upcoming: [
    step({ id: '42', title: 'Cut stars', cautions: ['Never leave a running laser unattended.'], problems: [{ code: 'blackout', message: `Cut stars: ${today} is a market day` }] }),
    step({ id: '43', kind: 'content', title: 'Film the glue-up', start: addDays(today, 2), end: addDays(today, 2), assigneeId: null, assigneeName: null }),
  ],
};

async function settle(fixture: ComponentFixture<WorkAtHand>): Promise<void> {
  for (let round = 0; round < 2; round++) {
    await new Promise((resolve) => setTimeout(resolve));
    TestBed.tick();
  }
  fixture.detectChanges();
}

async function setUp(role: 'partner' | 'crew', atHand: AtHand | 'fails' = answer) {
  TestBed.configureTestingModule({
    imports: [WorkAtHand],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
  });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: me, email: 'm@example.test', name: 'Juniper Lake' }, studios: [{ id: 7, name: 'Bench', role, timezone: 'Pacific/Auckland', today }] });
  await loading;
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(WorkAtHand);
  fixture.detectChanges();
  await settle(fixture);
  // The studio's settings, which the studio context loads (the harnesses wait for every request).
  http.match(base).forEach((request) => request.flush({ id: 7, name: 'Bench', weekStart: 1, workDays: [1, 2, 3, 4, 5], dailyCapacityHours: 8, holidaysOff: true }));
  const asked = http.expectOne((request) => request.url === `${base}/events/at-hand`);
  if (atHand === 'fails') asked.flush({ error: { code: 'internal', message: 'Something went wrong' } }, { status: 500, statusText: 'Server Error' });
  else asked.flush(atHand);
  http.expectOne(`${base}/events/stamp`).flush({ stamp: 'a' });
  await settle(fixture);
  return { fixture, http, asked, loader: TestbedHarnessEnvironment.loader(fixture), documentLoader: TestbedHarnessEnvironment.documentRootLoader(fixture) };
}

function groupsOf(fixture: ComponentFixture<WorkAtHand>): [string, string[]][] {
  return [...(fixture.nativeElement as HTMLElement).querySelectorAll('section.group')].map((group) => [
    group.getAttribute('aria-label')!,
    [...group.querySelectorAll('li .title')].map((title) => title.textContent!.trim()),
  ]);
}

/** The done box of the step titled `title`, found by its accessible name. */
async function boxOf(loader: HarnessLoader, title: string): Promise<MatCheckboxHarness> {
  for (const box of await loader.getAllHarnesses(MatCheckboxHarness)) if ((await box.getAriaLabel()) === `Done: ${title}`) return box;
  throw new Error(`No done box for ${title}`);
}

jest.setTimeout(20_000);

describe('WorkAtHand', () => {
  it('when a partner opens the home page, then it asks for the studio\'s today (the server\'s, not the browser\'s) and the next 7 days and lists overdue, today and next steps, linked to the calendar', async () => {
    const { fixture, asked } = await setUp('partner');
    expect(asked.request.params.get('today')).toBe(today);
    expect(asked.request.params.get('through')).toBe(addDays(today, 7));
    expect(groupsOf(fixture)).toEqual([
      ['Overdue', ['Sand edges']],
      ['Today', ['Cut stars']],
      ['The next 7 days', ['Film the glue-up']],
    ]);
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('.more')!.textContent).toContain('And 2 more overdue');
    expect(element.querySelector('.idle')).toBeNull();
    const link = element.querySelector<HTMLAnchorElement>('li .title')!;
    expect(link.getAttribute('href')).toBe(`/calendar?date=${addDays(today, -3)}&event=41`);
    const lines = [...element.querySelectorAll('li .meta')].map((meta) => meta.textContent!.replace(/\s+/g, ' ').trim());
    expect(lines[0]).toMatch(/^Build day · .+ – .+ · Winter window stars · Rowan Pell$/);
    expect(lines[2]).toMatch(/^Content day · .+ · Winter window stars · Nobody yet$/);
    expect(element.querySelectorAll('li')[1].querySelector('.caution')!.textContent).toContain('Never leave a running laser unattended.');
  });

  it('when a partner ticks a step, then it is sent with its version and shows done', async () => {
    const { fixture, http, loader } = await setUp('partner');
    const box = await boxOf(loader, 'Sand edges');
    await box.check();
    const patch = http.expectOne(`${base}/events/41`);
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toEqual({ done: true, version: 1 });
    patch.flush({ event: { ...answer.overdue[0], done: true, version: 2 }, warnings: [] });
    await settle(fixture);
    expect(await box.isChecked()).toBe(true);
    expect((fixture.nativeElement as HTMLElement).querySelector('li')!.classList).toContain('done');
    // Its new version goes with the next tick.
    await box.uncheck();
    expect(http.expectOne(`${base}/events/41`).request.body).toEqual({ done: false, version: 2 });
  });

  it('when crew open it, then they see their own steps; with "Only mine" off, others\' steps cannot be ticked', async () => {
    const { fixture, loader } = await setUp('crew');
    expect(groupsOf(fixture)).toEqual([
      ['Overdue', []],
      ['Today', ['Cut stars']],
      ['The next 7 days', []],
    ]);
    await (await loader.getHarness(MatSlideToggleHarness.with({ label: 'Only mine' }))).toggle();
    fixture.detectChanges();
    const boxes = await loader.getAllHarnesses(MatCheckboxHarness);
    expect(await Promise.all(boxes.map((box) => box.isDisabled()))).toEqual([true, false, true]);
  });

  it('when a tick is refused (another member changed the step), then it says why and reloads the list', async () => {
    const { fixture, http, loader, documentLoader } = await setUp('partner');
    await (await boxOf(loader, 'Cut stars')).check();
    http.expectOne(`${base}/events/42`).flush({ error: { code: 'version_conflict', message: 'Someone else changed this event; reload and try again' } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    const again: TestRequest = http.expectOne((request) => request.url === `${base}/events/at-hand`);
    again.flush({ ...answer, upcoming: [step({ id: '42', title: 'Cut stars', done: true, version: 4 }), answer.upcoming[1]] });
    await settle(fixture);
    expect(await (await documentLoader.getHarness(MatSnackBarHarness)).getMessage()).toBe('Not saved: Someone else changed this event; reload and try again');
    expect(await (await boxOf(loader, 'Cut stars')).isChecked()).toBe(true);
  });

  it('when another member changes the studio\'s events, then the next look for changes reloads the list; with no change it does not', async () => {
    const { fixture, http } = await setUp('partner');
    const unchanged = fixture.componentInstance.checkForChanges();
    http.expectOne(`${base}/events/stamp`).flush({ stamp: 'a' });
    expect(await unchanged).toBe(false);
    http.expectNone((request) => request.url === `${base}/events/at-hand`);
    const changed = fixture.componentInstance.checkForChanges();
    http.expectOne(`${base}/events/stamp`).flush({ stamp: 'b' });
    expect(await changed).toBe(true);
    await settle(fixture);
    http.expectOne((request) => request.url === `${base}/events/at-hand`).flush({ ...answer, overdue: [], overdueCount: 0 });
    await settle(fixture);
    expect(groupsOf(fixture)[0]).toEqual(['Overdue', []]);
  });

  it('when the studio has no step in hand, then partners are pointed to planning a runway from a theme', async () => {
    const { fixture } = await setUp('partner', { overdue: [], overdueCount: 0, upcoming: [] });
    const idle = (fixture.nativeElement as HTMLElement).querySelector('.idle')!;
    expect(idle.textContent).toContain('No steps in the coming days.');
    expect(idle.querySelector('a')!.getAttribute('href')).toBe('/themes');
  });

  it('when the list cannot be loaded, then it says so and draws no group', async () => {
    const { fixture } = await setUp('partner', 'fails');
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('[role=alert]')!.textContent).toContain('Your steps could not be loaded');
    expect(element.querySelectorAll('section.group')).toHaveLength(0);
  });

  it('when a step breaks a rule now, then its line says which, pointing to the calendar to re-plan', async () => {
    const { fixture } = await setUp('partner');
    const line = [...(fixture.nativeElement as HTMLElement).querySelectorAll('li')].find((item) => item.textContent!.includes('Cut stars'))!;
    expect(line.querySelector('.problem')!.textContent!.replace(/\s+/g, ' ').trim()).toBe(`error Breaks a rule now: Cut stars: ${today} is a market day. Open it to re-plan.`);
    expect([...(fixture.nativeElement as HTMLElement).querySelectorAll('.problem')]).toHaveLength(1);
  });
});
