import { HttpResponse, provideHttpClient, withInterceptors, type HttpInterceptorFn } from '@angular/common/http';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { SeriesPage, SeriesSummary } from '@shared/contracts/series';
import type { Score } from '@shared/scoring/types';
import { StudioContext } from '../core/studio-context';
import { TrendBoard } from './trend-board/trend-board';

/** A board row around a score (weekly search interest unless told). */
export function boardRow(id: number, term: string, score: Score, period: SeriesSummary['period'] = 'weekly', kind: SeriesSummary['kind'] = 'interest'): SeriesSummary {
  return { id, term, region: '', kind, period, start: '2024-01-01', end: '2026-04-13', points: 120, score, spark: null, scoredFor: '2026-05-01' };
}

/**
 * For the board's component tests: a stand-in for the server that answers at once (so harnesses can
 * wait for stability) and sorts like the real one (no heat last), recording every query sent.
 */
function fakeServer(rows: SeriesSummary[], total = rows.length) {
  const queries: URLSearchParams[] = [];
  const interceptor: HttpInterceptorFn = (request) => {
    if (request.url.endsWith('/series/targets')) return of(new HttpResponse({ status: 200, body: { today: '2026-05-01', months: [], occasions: [], holidays: [], markets: [] } }));
    if (request.url.endsWith('/themes')) return of(new HttpResponse({ status: 200, body: [] }));
    const params = new URLSearchParams(request.params.toString());
    queries.push(params);
    const sort = params.get('sort');
    const sign = params.get('order') === 'asc' ? 1 : -1;
    const heatOf = (row: SeriesSummary) => row.score?.heat ?? null;
    const byHeat = (a: SeriesSummary, b: SeriesSummary) => (heatOf(a) === null ? 1 : heatOf(b) === null ? -1 : sign * (heatOf(a)! - heatOf(b)!));
    const sorted = [...rows].sort((a, b) => (sort === 'term' ? sign * a.term.localeCompare(b.term) : byHeat(a, b)));
    const body: SeriesPage = { items: sorted, total, page: Number(params.get('page')), pageSize: Number(params.get('pageSize')), target: null, today: '2026-05-01' };
    return of(new HttpResponse({ status: 200, body }));
  };
  return { interceptor, queries };
}

export async function setUpBoard(rows: SeriesSummary[], total?: number) {
  const server = fakeServer(rows, total);
  TestBed.configureTestingModule({
    imports: [TrendBoard],
    providers: [provideHttpClient(withInterceptors([server.interceptor])), provideRouter([])],
  });
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(TrendBoard);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  await fixture.whenStable();
  return { fixture, loader, queries: server.queries };
}
