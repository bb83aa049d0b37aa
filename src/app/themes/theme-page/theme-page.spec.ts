import { HttpErrorResponse, HttpResponse, provideHttpClient, withInterceptors, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { of, throwError } from 'rxjs';
import type { Role } from '@shared/contracts/auth';
import type { TargetChoices } from '@shared/contracts/series';
import type { ThemeDetail } from '@shared/contracts/themes';
import { SessionStore } from '../../core/session-store';
import { StudioContext } from '../../core/studio-context';
import { ThemePage } from './theme-page';

const theme: ThemeDetail = {
  id: 3, name: 'Kitchen garden', status: 'shortlisted', seriesIds: [], items: ['Herb rack'], target: null, offsetDays: 0, notes: null, version: 4,
  statusChangedAt: '2026-03-01T10:00:00.000Z', statusChangedBy: { id: 1, name: 'Owner' }, createdAt: '2026-03-01T10:00:00.000Z', updatedAt: '2026-03-01T10:00:00.000Z',
  score: null, members: [], itemSeries: [], history: [{ from: null, to: 'idea', target: null, targetLabel: null, by: { id: 1, name: 'Owner' }, at: '2026-03-01T10:00:00.000Z' }], window: null, itemSales: [],
};
const choices: TargetChoices = {
  today: '2026-03-10',
  months: [{ key: '2026-04', label: 'April 2026', from: '2026-04-01', to: '2026-04-30' }, { key: '2026-05', label: 'May 2026', from: '2026-05-01', to: '2026-05-31' }],
  occasions: [], holidays: [], markets: [],
};

/** Answers the page's reads at once and records its writes. */
async function setUp(role: Role, isThemeMissing = false, detail: ThemeDetail = theme) {
  const writes: HttpRequest<unknown>[] = [];
  const server: HttpInterceptorFn = (request) => {
    const answer = (body: unknown) => of(new HttpResponse({ status: 200, body }));
    if (request.url === '/api/auth/me') return answer({ user: { id: 1, email: 'a@example.test', name: 'A' }, studios: [{ id: 7, name: 'Studio', role }] });
    if (request.method !== 'GET') {
      writes.push(request);
      return answer({ ...detail, status: 'picked', version: 5, target: { kind: 'month', value: '2026-05', date: '2026-05-01', label: 'May 2026' } });
    }
    if (request.url.endsWith('/series/targets')) return answer(choices);
    if (request.url.endsWith('/series')) return answer({ items: [], total: 0, page: 1, pageSize: 200, target: null, today: '2026-03-10' });
    if (isThemeMissing && request.url.endsWith('/themes/3')) return throwError(() => new HttpErrorResponse({ status: 404, statusText: 'Not Found', url: request.url, error: { error: { code: 'not_found', message: 'Theme 3 not found' } } }));
    return answer(detail);
  };
  TestBed.configureTestingModule({
    imports: [ThemePage],
    providers: [provideHttpClient(withInterceptors([server])), provideRouter([]), provideCharts(withDefaultRegisterables())],
  });
  await TestBed.inject(SessionStore).load();
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(ThemePage);
  fixture.componentRef.setInput('themeId', '3');
  const loader = TestbedHarnessEnvironment.loader(fixture);
  await fixture.whenStable();
  const buttonTexts = async () => Promise.all((await loader.getAllHarnesses(MatButtonHarness)).map((button) => button.getText()));
  return { fixture, loader, writes, buttonTexts };
}

jest.setTimeout(30_000);

describe('ThemePage', () => {
  it('when the theme is not found (deleted, or another studio\'s), then the page says it could not be loaded', async () => {
    const { fixture } = await setUp('partner', true);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('[role=alert]')!.textContent).toContain('could not be loaded');
    expect(element.querySelector('h1')).toBeNull();
  });

  it('when crew opens a theme, then it reads but offers no edits, status moves or pick', async () => {
    const { buttonTexts, fixture } = await setUp('crew');
    expect(fixture.nativeElement.textContent).toContain('Kitchen garden');
    const texts = await buttonTexts();
    expect(texts.filter((text) => /Move to|Pick|Save|Add|Delete/.test(text))).toEqual([]);
  });

  it('when a partner opens a theme, then status moves and edits are offered but picking is left to the owner', async () => {
    const { buttonTexts, fixture } = await setUp('partner');
    const texts = await buttonTexts();
    expect(texts).toEqual(expect.arrayContaining(['Move to idea', 'Move to retired', 'Save']));
    expect(texts.some((text) => /Pick|Delete/.test(text))).toBe(false);
    expect(fixture.nativeElement.textContent).toContain('The owner picks a theme');
  });

  it('when the owner picks a month with an offset, then the pick is sent with the version last read', async () => {
    const { loader, writes, fixture } = await setUp('owner');
    const target = await loader.getHarness(MatSelectHarness.with({ selector: '[aria-label="Target"]' }));
    await target.open();
    await target.clickOptions({ text: 'May 2026' });
    const offset: HTMLInputElement = fixture.nativeElement.querySelector('input[name="offsetDays"]');
    offset.value = '21';
    offset.dispatchEvent(new Event('input'));
    await (await loader.getHarness(MatButtonHarness.with({ text: /Pick/ }))).click();
    expect(writes.map((request) => [request.method, request.url, request.body])).toEqual([
      ['POST', '/api/studios/7/themes/3/pick', { target: { kind: 'month', value: '2026-05' }, offsetDays: 21, version: 4 }],
    ]);
    expect(fixture.nativeElement.querySelector('[data-testid="theme-status"]').textContent).toContain('Picked');
  });

  it('when a theme was picked for an occasion, then its history names the occasion, never its key', async () => {
    const history = [...theme.history, { from: 'idea' as const, to: 'picked' as const, target: 'occasion:halloween', targetLabel: 'Halloween', by: { id: 1, name: 'Owner' }, at: '2026-03-02T10:00:00.000Z' }];
    const { fixture } = await setUp('crew', false, { ...theme, history });
    const text = (fixture.nativeElement as HTMLElement).querySelector('.history')!.textContent!;
    expect(text).toContain('Idea → Picked for Halloween');
    expect(text).not.toContain('occasion:');
  });

  it('when one of its series has too little history, then the heat says how many of its series count', async () => {
    const parts = { rise: 60, seasonLift: 70, leadRoom: 100, salesPull: 50 };
    const counted = { heat: 71.5, parts, contributions: parts, verdict: 'rising' as const, reason: 'rising: the verdict of 100 % of the 1 series that count; heat from 1 of 2 series', membersUsed: 1, membersTotal: 2, verdictWeights: { rising: 1 } };
    const members = [
      { id: 1, term: 'lamp base', region: '', kind: 'interest' as const, period: 'weekly' as const, heat: 71.5, verdict: 'rising' as const },
      { id: 2, term: 'new lamp shade', region: '', kind: 'interest' as const, period: 'weekly' as const, heat: null, verdict: 'not-enough-history' as const },
    ];
    const { fixture } = await setUp('crew', false, { ...theme, seriesIds: [1, 2], members, score: counted });
    const page = fixture.nativeElement as HTMLElement;
    expect(page.querySelector('[data-testid="theme-heat-count"]')!.textContent).toBe('From 1 of 2 series; series with too little history do not count yet.');
    expect(page.querySelector('.members')!.textContent).toContain('no heat yet · Not enough history');

    TestBed.resetTestingModule();
    const none = { ...counted, heat: null, parts: null, contributions: null, verdict: 'not-enough-history' as const, membersUsed: 0, membersTotal: 1 };
    const waiting = await setUp('crew', false, { ...theme, seriesIds: [2], members: [members[1]], score: none });
    expect((waiting.fixture.nativeElement as HTMLElement).querySelector('mat-card-title')!.textContent).toBe('No heat yet');
  });
});
