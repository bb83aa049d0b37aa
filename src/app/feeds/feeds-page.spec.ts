import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { StudioContext } from '../core/studio-context';
import { FeedsPage, webcalOf } from './feeds-page';

const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
  await fixture.whenStable();
  await new Promise((resolve) => setTimeout(resolve, 20));
  await fixture.whenStable();
};

async function setUp() {
  TestBed.configureTestingModule({ imports: [FeedsPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
  TestBed.inject(StudioContext).select(5);
  const fixture = TestBed.createComponent(FeedsPage);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const http = TestBed.inject(HttpTestingController);
  // Resources count as pending work, so their requests are answered before waiting for stability.
  TestBed.tick();
  http.match('/api/studios/5').forEach((request) => request.flush(null));
  http.expectOne('/api/studios/5/feeds').flush([]);
  await settle(fixture);
  return { fixture, loader, http, element: fixture.nativeElement as HTMLElement };
}

describe('FeedsPage', () => {
  it('when a feed is made, then its link shows once with copy, a webcal:// link and a QR code, and the list reloads', async () => {
    const { fixture, loader, http, element } = await setUp();
    expect(element.textContent).toContain('No feeds yet.');
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Only markets and deadlines' });
    await (await loader.getHarness(MatSlideToggleHarness)).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Make a feed/ }))).click();
    const post = http.expectOne('/api/studios/5/feeds');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ scope: 'markets', includeHolidays: true });
    post.flush({ id: 3, url: 'https://kerfcast.example.org/feeds/abcDEF_123-xyz.ics', scope: 'markets', includeHolidays: true, createdAt: '2026-12-01T10:00:00.000Z' });
    await new Promise((resolve) => setTimeout(resolve, 200));
    TestBed.tick();
    http.expectOne('/api/studios/5/feeds').flush([{ id: 3, scope: 'markets', includeHolidays: true, createdAt: '2026-12-01T10:00:00.000Z', lastFetchedAt: null }]);
    await settle(fixture);
    expect(element.querySelector('[data-testid=feed-url]')?.textContent).toBe('https://kerfcast.example.org/feeds/abcDEF_123-xyz.ics');
    expect(element.querySelector('a[href^="webcal:"]')?.getAttribute('href')).toBe('webcal://kerfcast.example.org/feeds/abcDEF_123-xyz.ics');
    expect(element.querySelector('img[alt="QR code of the feed link"]')?.getAttribute('src')).toMatch(/^data:image\/png;base64,/);
    expect(element.textContent).toContain('Only markets and deadlines, with holidays');
    expect(element.textContent).toContain('not fetched yet');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Copy/ }))).toHaveLength(1);
  }, 20_000);

  it.each([
    ['https://a.example/feeds/x.ics', 'webcal://a.example/feeds/x.ics'],
    ['http://127.0.0.1:3000/feeds/x.ics', 'webcal://127.0.0.1:3000/feeds/x.ics'],
  ])('when the link is %s, then the calendar-app link is %s', (url, webcal) => {
    expect(webcalOf(url)).toBe(webcal);
  });
});
