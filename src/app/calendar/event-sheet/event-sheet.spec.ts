import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MATERIAL_ANIMATIONS, provideNativeDateAdapter } from '@angular/material/core';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import type { CalendarEvent } from '@shared/contracts/calendar';
import { SessionStore } from '../../core/session-store';
import { StudioContext } from '../../core/studio-context';
import { CalendarStore } from '../calendar-store';
import { MoveFlow } from '../move-flow';
import { EventSheet } from './event-sheet';

const base = '/api/studios/7';
const finish: CalendarEvent = {
  id: '43',
  kind: 'build',
  title: 'Finish',
  start: '2026-12-09',
  end: '2026-12-10',
  allDay: true,
  editable: false,
  version: 2,
  runwayId: 5,
  stepIndex: 3,
  hoursPerDay: 5,
  cureDays: 3,
  assigneeId: 3,
  assigneeName: 'Juniper Lake',
  done: false,
  notes: 'Two coats',
  cautions: ['Apply finishes and let them cure in a well-ventilated space.'],
};

async function setUp(role: 'partner' | 'crew', userId: number, event: CalendarEvent) {
  TestBed.configureTestingModule({
    imports: [EventSheet],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), provideNativeDateAdapter(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
  });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: userId, email: 'm@example.test', name: 'Member' }, studios: [{ id: 7, name: 'Bench', role }] });
  await loading;
  TestBed.inject(StudioContext).select(7);
  TestBed.inject(CalendarStore);
  TestBed.inject(MoveFlow).open(event);
  const fixture = TestBed.createComponent(EventSheet);
  fixture.detectChanges();
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  http.match(base).forEach((request) => request.flush({ id: 7, weekStart: 1, workDays: [1, 2, 3, 4, 5], dailyCapacityHours: 8, holidaysOff: true }));
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  http.match(`${base}/events/tray`).forEach((request) => request.flush([]));
  http.match(`${base}/blackouts`).forEach((request) => request.flush([]));
  http.match((request) => request.url === `${base}/events`).forEach((request) => request.flush([event]));
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  // Partners' sheets ask for the members (the assignee choices) once the step is there.
  http.match(`${base}/members`).forEach((request) => request.flush([{ userId: 3, name: 'Juniper Lake', email: 'c@example.test', role: 'crew', joinedAt: '2026-01-01', isYou: false }]));
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
}

jest.setTimeout(20_000);

describe('EventSheet', () => {
  it('when a market day is opened, then it shows its place, hours and notes and links to the markets, with nothing to edit', async () => {
    const market: CalendarEvent = { id: 'market:4:2026-12-12', kind: 'market', title: 'Thistle Row Market', start: '2026-12-12', end: '2026-12-12', allDay: true, editable: false, marketId: 4, place: 'Thistle Row', hours: '8:00–13:00', notes: 'Tent weights required.' };
    const { fixture, loader } = await setUp('partner', 2, market);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    const facts = [...element.querySelectorAll('dt')].map((term) => [term.textContent!.trim(), term.nextElementSibling!.textContent!.trim()]);
    expect(facts).toEqual([
      ['When', 'Saturday, December 12'],
      ['Place', 'Thistle Row'],
      ['Hours', '8:00–13:00'],
      ['Market', 'Its rules, fee and deadlines in Markets'],
    ]);
    expect(element.querySelector('.notes')?.textContent).toBe('Tent weights required.');
    expect(element.querySelector('a[href="/studios/7/markets"]')?.textContent).toContain('in Markets');
    expect(await loader.getAllHarnesses(MatInputHarness)).toHaveLength(0);
  });

  it('when crew opens their own step, then they read it with its cautions and may tick it done, but not edit it', async () => {
    const { fixture, http, loader } = await setUp('crew', 3, finish);
    const text = fixture.nativeElement.textContent as string;
    expect(text).toContain('Finish');
    expect(text).toContain('5 h a day, then 3 cure days');
    expect(text).toContain('Apply finishes and let them cure in a well-ventilated space.');
    expect(text).toContain('Two coats');
    expect(await loader.getAllHarnesses(MatInputHarness)).toHaveLength(0);
    const done = await loader.getHarness(MatCheckboxHarness.with({ label: 'Done' }));
    expect(await done.isDisabled()).toBe(false);
    (fixture.nativeElement.querySelector('mat-checkbox input') as HTMLInputElement).click();
    await new Promise((resolve) => setTimeout(resolve));
    const request = http.expectOne(`${base}/events/43`);
    expect(request.request.body).toEqual({ done: true, version: 2 });
    request.flush({ event: { ...finish, done: true, version: 3 }, warnings: [] });
  });

  it("when crew opens someone else's step, then the done box is off limits", async () => {
    const { loader } = await setUp('crew', 4, finish);
    expect(await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Done' }))).isDisabled()).toBe(true);
  });

  it('when a partner edits the notes, then they are saved with the version', async () => {
    const { http, loader } = await setUp('partner', 2, { ...finish, editable: true });
    const notes = await loader.getHarness(MatInputHarness.with({ selector: 'textarea' }));
    await notes.setValue('Two coats, sand between');
    const save = await loader.getHarness(MatButtonHarness.with({ text: 'Save' }));
    (await save.host()).click();
    await new Promise((resolve) => setTimeout(resolve));
    const request = http.expectOne(`${base}/events/43`);
    expect(request.request.body).toEqual({ title: 'Finish', notes: 'Two coats, sand between', assigneeId: 3, version: 2 });
    request.flush({ event: { ...finish, notes: 'Two coats, sand between', version: 3 }, warnings: [] });
  });
});
