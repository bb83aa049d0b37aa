import type { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { MarketView } from '@shared/contracts/markets';
import { dayText } from './day-text';
import { feeText, MarketsPage } from './markets-page';
import { createSignedIn } from './markets-testing';

const base = '/api/studios/5/markets';

const fair: MarketView = {
  id: 8,
  name: 'Brookmead Spring Fair',
  place: 'Brookmead green',
  start: '2035-04-07',
  rrule: 'FREQ=YEARLY;BYMONTH=4;BYDAY=1SA',
  exdates: ['2036-04-05'],
  rdates: [],
  hours: '10:00–16:00',
  boothFeeCents: 4550,
  applicationDeadline: '2035-02-01',
  decisionDate: null,
  kitsAllowed: false,
  notes: 'Bring a table cover.',
  version: 4,
  nextDates: ['2035-04-07', '2037-04-04'],
};

const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
  await fixture.whenStable();
  await new Promise((resolve) => setTimeout(resolve, 20));
  await fixture.whenStable();
};

/** Lets answers and effects run without waiting for stability (a reload is then still open). */
async function pause(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, 50));
  TestBed.tick();
}

async function setUp(role: 'partner' | 'crew' = 'partner', markets: MarketView[] = [fair]) {
  const { fixture, http } = await createSignedIn(MarketsPage, role);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  http.expectOne(base).flush(markets);
  http.expectOne('/api/studios/5/blackouts').flush([]);
  await settle(fixture);
  return { fixture, loader, http, element: fixture.nativeElement as HTMLElement };
}

/** The input (or textarea) of the form field labelled `label`. */
const field = async (loader: HarnessLoader, label: string) => (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness);

describe('MarketsPage', () => {
  it('when the page opens, then each market shows its rule in words, next days, fee, kits, deadline and notes; crew get no edit buttons', async () => {
    const { element, loader } = await setUp('crew');
    const text = element.querySelector('.markets')!.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('Brookmead Spring Fair');
    expect(text).toContain('Brookmead green · 10:00–16:00');
    // Days of other years carry their year (these tests run before 2035).
    expect(text).toContain('Every April on the 1st Saturday, from Sat, Apr 7, 2035 (skipping 1)');
    expect(text).toContain('Next: Sat, Apr 7, 2035 · Sat, Apr 4, 2037');
    expect(text).toContain('Booth fee 45.50 · no kits · apply by Thu, Feb 1, 2035');
    expect(text).toContain('Bring a table cover.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Edit|Delete|Add a market/ }))).toHaveLength(0);
  });

  it('when the partner adds a market with a repeat chosen from its first day, then the request carries the rule, fee in cents and the rest, and the list reloads', async () => {
    const { fixture, loader, http, element } = await setUp('partner', []);
    expect(element.textContent).toContain('No markets yet.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a market/ }))).click();
    await (await field(loader, 'Name')).setValue('Millrace Night Market');
    await (await field(loader, 'Place')).setValue('Millrace car park');
    await (await field(loader, 'First day')).setValue('1/13/2035');
    const repeat = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=repeat]' }));
    await repeat.open();
    // 13 January 2035 is its month's 2nd Saturday (6 January the 1st).
    expect(await Promise.all((await repeat.getOptions()).map((option) => option.getText()))).toContain('Every month on the 2nd Saturday');
    await repeat.clickOptions({ text: 'Every month on the 2nd Saturday' });
    await (await field(loader, 'Hours')).setValue('17:00–21:00');
    await (await field(loader, 'Booth fee')).setValue('$35.50');
    await (await loader.getHarness(MatCheckboxHarness)).check();
    await (await field(loader, 'Notes')).setValue('Power on request.');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Add market' }))).click();
    const post = http.expectOne(base);
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({
      name: 'Millrace Night Market',
      place: 'Millrace car park',
      start: '2035-01-13',
      rrule: 'FREQ=MONTHLY;BYDAY=2SA',
      exdates: [],
      rdates: [],
      hours: '17:00–21:00',
      boothFeeCents: 3550,
      kitsAllowed: true,
      notes: 'Power on request.',
    });
    post.flush({ ...fair, id: 9, name: 'Millrace Night Market' });
    await pause();
    http.expectOne(base).flush([{ ...fair, id: 9, name: 'Millrace Night Market' }]);
    await settle(fixture);
    expect(element.querySelector('form[aria-label=Market]')).toBeNull();
    expect(element.querySelector('.markets')!.textContent).toContain('Millrace Night Market');
  }, 30_000);

  it('when the name or first day is missing or the fee is not a number, then nothing is sent and each field says what is wrong', async () => {
    const { fixture, loader, http, element } = await setUp('partner', []);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a market/ }))).click();
    await (await field(loader, 'Booth fee')).setValue('thirty');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Add market' }))).click();
    await settle(fixture);
    http.expectNone(base);
    const errors = [...element.querySelectorAll('mat-error')].map((error) => error.textContent!.trim());
    expect(errors).toEqual(['Give the market a name', 'Choose the first day it is held', 'Write the fee as a number, e.g. 35 or 35.50']);
  });

  it('when the server refuses a rule of one\'s own (400), then its message shows under the rule, and nothing closes', async () => {
    const { fixture, loader, http, element } = await setUp('partner', []);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a market/ }))).click();
    await (await field(loader, 'Name')).setValue('Odd market');
    await (await field(loader, 'First day')).setValue('1/13/2035');
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=repeat]' }))).clickOptions({ text: 'Another rule (RRULE)' });
    await (await field(loader, 'Rule (RFC 5545 RRULE)')).setValue('FREQ=SOMETIMES');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Add market' }))).click();
    const post = http.expectOne(base);
    expect(post.request.body.rrule).toBe('FREQ=SOMETIMES');
    post.flush(
      { error: { code: 'invalid_input', message: 'rrule: unknown FREQ', issues: [{ path: ['rrule'], message: 'Unknown FREQ "SOMETIMES"' }] } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle(fixture);
    expect([...element.querySelectorAll('mat-error')].map((error) => error.textContent!.trim())).toEqual(['Unknown FREQ "SOMETIMES"']);
    expect(element.querySelector('form[aria-label=Market]')).not.toBeNull();
  }, 30_000);

  it('when the partner edits a market, then the form holds what is stored and the PUT sends its version and skipped days; a 409 says so and reloads', async () => {
    const { fixture, loader, http, element } = await setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Edit' }))).click();
    expect(await (await field(loader, 'Name')).getValue()).toBe('Brookmead Spring Fair');
    expect(await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=repeat]' }))).getValueText()).toBe('Every year on the 1st Saturday of April');
    expect(element.querySelector('[aria-label="Days skipped"]')!.textContent).toContain('Sat, Apr 5, 2036');
    await (await field(loader, 'Hours')).setValue('9:00–15:00');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save market' }))).click();
    const put = http.expectOne(`${base}/8`);
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toMatchObject({ version: 4, hours: '9:00–15:00', rrule: 'FREQ=YEARLY;BYMONTH=4;BYDAY=1SA', exdates: ['2036-04-05'], boothFeeCents: 4550, applicationDeadline: '2035-02-01' });
    put.flush({ error: { code: 'version_conflict', message: 'Someone else changed this market; reload and try again' } }, { status: 409, statusText: 'Conflict' });
    await pause();
    fixture.detectChanges();
    expect(element.querySelector('.form-error')!.textContent).toContain('Someone else changed this market');
    http.expectOne(base).flush([{ ...fair, version: 5 }]);
  }, 30_000);

  it('when a fee in cents is written back, then whole amounts have no decimals; days of this year have no year', () => {
    expect([feeText(3500), feeText(3550), feeText(5), feeText(null)]).toEqual(['35', '35.50', '0.05', '']);
    expect([dayText('2026-12-12', '2026-12-01'), dayText('2027-01-09', '2026-12-01')]).toEqual(['Sat, Dec 12', 'Sat, Jan 9, 2027']);
  });
});
