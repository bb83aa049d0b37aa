// Issue 23 on the series page: plain words first, the test statistics in a fold, the peak named by
// its month, and for sales how many periods sold nothing. Scores come from shared/scoring.
import { HttpResponse, provideHttpClient, withInterceptors, type HttpInterceptorFn } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { of } from 'rxjs';
import type { SeriesDetail } from '@shared/contracts/series';
import { regularise } from '@shared/scoring/regularise';
import { scoreSeries } from '@shared/scoring/score-series';
import type { Point } from '@shared/scoring/types';
import { randomSalesAsStored } from '../../../../tests/fixtures/scoring/random-sales';
import { StudioContext } from '../../core/studio-context';
import { TrendDetail } from './trend-detail';

const today = '2026-05-01';

/** Four years of months from January 2022 with the yearly crest in December. */
const monthly: Point[] = Array.from({ length: 48 }, (_, t) => ({
  date: new Date(Date.UTC(2022, t, 1)).toISOString().slice(0, 10),
  value: Math.round(40 * (1 + 0.5 * Math.cos((2 * Math.PI * (t - 11)) / 12)) + (t % 5)),
}));

function detailOf(points: Point[], period: 'weekly' | 'monthly', kind: 'interest' | 'sales' = 'interest'): SeriesDetail {
  const regular = regularise(points, period, { isMissingZero: kind === 'sales' });
  const empty = regular.values.map(() => null);
  return {
    id: 4, term: kind === 'sales' ? 'Walnut key hook' : 'star garland', region: '', kind, period, start: points[0]?.date ?? null, end: points.at(-1)?.date ?? null, points: points.length,
    score: scoreSeries(points, { period, today, kind }), spark: null, scoredFor: today, values: points, target: null, today,
    analysis: { period: regular.period, dates: regular.dates, values: regular.values, trend: empty, seasonal: empty, residual: empty, adjusted: regular.values, model: null },
  };
}

async function render(detail: SeriesDetail) {
  const server: HttpInterceptorFn = () => of(new HttpResponse({ status: 200, body: detail }));
  TestBed.configureTestingModule({
    imports: [TrendDetail],
    providers: [provideHttpClient(withInterceptors([server])), provideRouter([]), provideCharts(withDefaultRegisterables())],
  });
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(TrendDetail);
  fixture.componentRef.setInput('seriesId', '4');
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('TrendDetail', () => {
  it('when a series is opened, then the test statistics sit in a closed fold below the plain figures', async () => {
    const page = await render(detailOf(monthly, 'monthly'));
    const fold = page.querySelector('details.statistics') as HTMLDetailsElement;
    expect(fold).not.toBeNull();
    expect(fold.open).toBe(false);
    const folded = fold.textContent ?? '';
    for (const statistic of ['Mann–Kendall', 'S ', 'z ', 'p ', 'τ ', "Sen's slope"]) expect(folded).toContain(statistic);
    const plain = [...page.querySelectorAll('dl.figures')].filter((list) => !list.closest('details')).map((list) => list.textContent).join(' ');
    expect(plain).toContain('Verdict');
    expect(plain).not.toContain('Mann–Kendall');
    expect(plain).not.toContain("Sen's slope");
  });

  it('when the series peaks in December, then the peak is named by its month, never by its place in the cycle', async () => {
    const page = await render(detailOf(monthly, 'monthly'));
    expect(page.textContent).toContain('peaks in December, next 1 Dec 2026');
    expect(page.textContent).not.toMatch(/of the cycle|wk \d/);
  });

  it('when a sales series is opened, then it says how many weeks sold nothing', async () => {
    const stored = randomSalesAsStored();
    const detail = detailOf(stored, 'weekly', 'sales');
    const page = await render(detail);
    const withoutSales = detail.score!.explanation.periodsWithoutSales!;
    expect(withoutSales).toBeGreaterThan(0);
    expect(page.querySelector('[data-testid="no-sales"]')!.textContent).toBe(`${withoutSales} of ${detail.score!.explanation.periodsUsed} weeks without a sale`);
    expect(page.textContent).toContain('Weeks without a sale');
  });

  it('when a series has too little history, then it shows no heat and how many more weeks it needs', async () => {
    const page = await render(detailOf(monthly.slice(0, 8).map((point, week) => ({ ...point, date: new Date(Date.UTC(2026, 0, 5 + 7 * week)).toISOString().slice(0, 10) })), 'weekly'));
    expect(page.querySelector('.meta')!.textContent).toContain('no heat yet (5 more weeks of figures needed)');
    expect(page.textContent).not.toMatch(/heat \d/);
  });
});
