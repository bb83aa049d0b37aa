import { inject, Injectable } from '@angular/core';
import type { PreloadingStrategy, Route } from '@angular/router';
import { Observable, of, switchMap } from 'rxjs';
import { SessionStore } from './session-store';

/** How long the preloading waits for the browser to be idle before it loads anyway. */
const preloadIdleTimeoutMs = 3_000;

/** The next idle moment of the browser (a timer where requestIdleCallback is missing). */
function browserIdle(): Observable<void> {
  return new Observable<void>((subscriber) => {
    const done = () => {
      subscriber.next();
      subscriber.complete();
    };
    if (typeof requestIdleCallback === 'function') {
      const handle = requestIdleCallback(done, { timeout: preloadIdleTimeoutMs });
      return () => cancelIdleCallback(handle);
    }
    const handle = setTimeout(done, 0);
    return () => clearTimeout(handle);
  });
}

/**
 * Loads the code of the routes marked `data: { preload: true }` (the calendar, where a studio spends
 * its day) once the browser is idle after the app has started, so that opening one from the side
 * nav waits for its data only, not for its code as well: bench:calendar-ui on a 2-CPU machine timed
 * a first opening, from the click to the painted month, at 524–742 ms without and 359–392 ms with. The other pages load when first opened, as they are used less
 * often and their code (charts, the import wizard) is larger.
 */
@Injectable({ providedIn: 'root' })
export class PreloadMarkedRoutes implements PreloadingStrategy {
  private readonly session = inject(SessionStore);

  // Not before sign-in: the sign-in page stays light, and the router asks again after each
  // navigation, so the calendar's code comes once a member is in.
  preload(route: Route, load: () => Observable<unknown>): Observable<unknown> {
    return route.data?.['preload'] === true && this.session.isSignedIn() ? browserIdle().pipe(switchMap(load)) : of(null);
  }
}
