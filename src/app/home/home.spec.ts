import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';
import { Home } from './home';

async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

async function homeOfEmptyStudio(role: 'owner' | 'crew') {
  TestBed.configureTestingModule({
    imports: [Home],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
  });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'm@example.test', name: 'Juniper Lake' }, studios: [{ id: 7, name: 'Bench', role, timezone: 'UTC', today: '2027-03-03' }] });
  await loading;
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(Home);
  fixture.detectChanges();
  await settle();
  http.match('/api/studios/7').forEach((request) => request.flush({ id: 7, name: 'Bench' }));
  http.match('/api/studios/7/summary').forEach((request) => request.flush({ seriesCount: 0, themeCount: 0, upcomingCount: 0, memberCount: 1 }));
  http.match((request) => request.url.startsWith('/api/studios/7/events')).forEach((request) => request.flush(request.request.url.endsWith('stamp') ? { stamp: 'a' } : { overdue: [], overdueCount: 0, upcoming: [] }));
  await settle();
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

describe('Home of an empty studio', () => {
  it('when an owner opens a studio with no figures yet, then it points to a first import', async () => {
    const page = await homeOfEmptyStudio('owner');
    expect(page.querySelector('.first-steps h2')!.textContent).toBe('Start with your figures');
    expect(page.querySelector('.first-steps a')!.getAttribute('href')).toBe('/imports');
  });

  it('when crew open it, then it says who imports instead of offering it', async () => {
    const page = await homeOfEmptyStudio('crew');
    expect(page.querySelector('.first-steps a')).toBeNull();
    expect(page.querySelector('.first-steps .hint')!.textContent).toContain('An owner or partner imports');
  });
});
