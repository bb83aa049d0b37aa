import type { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatEndDateHarness, MatStartDateHarness } from '@angular/material/datepicker/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { BlackoutView } from '@shared/contracts/markets';
import { DaysOff, spanText } from './days-off';
import { createSignedIn } from './markets-testing';

const url = '/api/studios/5/blackouts';
const delivery: BlackoutView = { start: '2035-03-06', end: '2035-03-06', note: 'Lumber delivery' };

async function setUp(role: 'partner' | 'crew', days: BlackoutView[] = [delivery]) {
  const { fixture, http } = await createSignedIn(DaysOff, role);
  const loader: HarnessLoader = TestbedHarnessEnvironment.loader(fixture);
  http.expectOne(url).flush(days);
  await fixture.whenStable();
  return { fixture, loader, http, element: fixture.nativeElement as HTMLElement };
}

/** Lets an answer reach the component and draws it. */
async function answered(fixture: { detectChanges(): void }): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, 20));
  fixture.detectChanges();
}

const listed = (element: HTMLElement) => [...element.querySelectorAll('.days li .what')].map((item) => item.textContent!.trim());

describe('DaysOff', () => {
  it('when the partner adds a range with a note, then the whole list goes back in one PUT and shows what the server kept', async () => {
    const { fixture, loader, http, element } = await setUp('partner');
    expect(listed(element)).toEqual(['Tue, Mar 6, 2035 · Lumber delivery']);
    await (await loader.getHarness(MatStartDateHarness)).setValue('12/21/2035');
    await (await loader.getHarness(MatEndDateHarness)).setValue('1/1/2036');
    await (await loader.getHarness(MatInputHarness.with({ placeholder: 'Winter break' }))).setValue('Winter break');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add days off/ }))).click();
    const put = http.expectOne(url);
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ blackouts: [delivery, { start: '2035-12-21', end: '2036-01-01', note: 'Winter break' }] });
    put.flush(put.request.body.blackouts);
    await answered(fixture);
    expect(listed(element)).toEqual(['Tue, Mar 6, 2035 · Lumber delivery', 'Fri, Dec 21, 2035 – Tue, Jan 1, 2036 · Winter break']);
  });

  it('when a removal is refused, then the reason shows and the list is as it was', async () => {
    const { fixture, loader, http, element } = await setUp('partner');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Remove' }))).click();
    const put = http.expectOne(url);
    expect(put.request.body).toEqual({ blackouts: [] });
    put.flush({ error: { code: 'forbidden', message: 'Only owners and partners change the calendar settings' } }, { status: 403, statusText: 'Forbidden' });
    await answered(fixture);
    expect(element.querySelector('[role=alert]')!.textContent).toContain('Only owners and partners');
    expect(listed(element)).toEqual(['Tue, Mar 6, 2035 · Lumber delivery']);
  });

  it('when no first day is chosen, then nothing is sent; crew read the list without buttons', async () => {
    const { loader, http, element } = await setUp('partner', []);
    expect(element.textContent).toContain('No days off set.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add days off/ }))).click();
    http.expectNone(url);
    expect(element.querySelector('[role=alert]')!.textContent).toContain('Choose the first day off');
    TestBed.resetTestingModule();
    const crew = await setUp('crew');
    expect(listed(crew.element)).toEqual(['Tue, Mar 6, 2035 · Lumber delivery']);
    expect(await crew.loader.getAllHarnesses(MatButtonHarness)).toHaveLength(0);
  });

  it('when a span is one day, then it reads as that day', () => {
    expect(spanText({ start: '2026-12-24', end: '2026-12-24', note: null }, '2026-12-01')).toBe('Thu, Dec 24');
  });
});
