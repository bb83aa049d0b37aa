import { Injectable } from '@angular/core';
import type { PreloadingStrategy, Route } from '@angular/router';
import { Observable, switchMap, timer } from 'rxjs';

/** How long after a navigation the other pages' code may be fetched: the page's own loads and drawing come first. */
export const preloadDelayMs = 3000;

/**
 * Fetches and runs the code of every lazy page a while after the first page has opened, in the
 * browser's idle time, so that a page opened later from the side nav starts at once instead of after
 * a chain of downloads. Straight away (the router's PreloadAllModules) it ran beside the first page's
 * own drawing and slowed it down.
 */
@Injectable({ providedIn: 'root' })
export class PreloadWhenIdle implements PreloadingStrategy {
  preload(_route: Route, load: () => Observable<unknown>): Observable<unknown> {
    return timer(preloadDelayMs).pipe(
      switchMap(() => whenIdle()),
      switchMap(() => load()),
    );
  }
}

/** Emits once the browser is idle (at most 2 s later), or at once where it cannot tell. */
function whenIdle(): Observable<void> {
  return new Observable<void>((subscriber) => {
    const done = () => {
      subscriber.next();
      subscriber.complete();
    };
    if (typeof requestIdleCallback !== 'function') return done();
    const handle = requestIdleCallback(done, { timeout: 2000 });
    return () => cancelIdleCallback(handle);
  });
}
