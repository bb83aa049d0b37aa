import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, RouterPreloader, withPreloading } from '@angular/router';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PreloadMarkedRoutes } from './preload-marked-routes';
import { SessionStore } from './session-store';

@Component({ selector: 'kc-test-page', template: '' })
class TestPage {}

describe('PreloadMarkedRoutes', () => {
  it('when a signed-in member has navigated and the browser is idle, then the code of marked routes is loaded ahead and the rest waits until opened; before sign-in nothing is', async () => {
    const loaded: string[] = [];
    const lazy = (name: string) => () => {
      loaded.push(name);
      return Promise.resolve(TestPage);
    };
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: '', component: TestPage },
            { path: 'calendar', loadComponent: lazy('calendar'), data: { preload: true } },
            { path: 'trends', loadComponent: lazy('trends') },
          ],
          withPreloading(PreloadMarkedRoutes),
        ),
      ],
    });
    const router = TestBed.inject(Router);
    // What the app's bootstrap does (a TestBed does not bootstrap): preload after each navigation.
    TestBed.inject(RouterPreloader).setUpPreloading();
    await router.navigateByUrl('/');
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(loaded).toEqual([]);
    // Signed in (as the sign-in page's answer makes it), then the next navigation.
    const loading = TestBed.inject(SessionStore).load();
    TestBed.inject(HttpTestingController).expectOne('/api/auth/me').flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [] });
    await loading;
    await router.navigateByUrl('/?signed-in');
    expect(loaded).toEqual([]);
    // jsdom has no requestIdleCallback: the preloading waits for a timer instead.
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(loaded).toEqual(['calendar']);
    await router.navigateByUrl('/trends');
    expect(loaded).toEqual(['calendar', 'trends']);
  });
});
