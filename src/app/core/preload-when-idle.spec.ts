import { of } from 'rxjs';
import { preloadDelayMs, PreloadWhenIdle } from './preload-when-idle';

describe('PreloadWhenIdle', () => {
  afterEach(() => jest.useRealTimers());

  it('when a page has opened, then the other pages are loaded only after preloadDelayMs', () => {
    jest.useFakeTimers();
    const load = jest.fn(() => of('loaded'));
    const seen: unknown[] = [];
    new PreloadWhenIdle().preload({ path: 'calendar' }, load).subscribe((value) => seen.push(value));
    jest.advanceTimersByTime(preloadDelayMs - 1);
    expect(load).not.toHaveBeenCalled();
    jest.advanceTimersByTime(1);
    expect(load).toHaveBeenCalledTimes(1);
    expect(seen).toEqual(['loaded']);
  });

  it('when the browser can tell when it is idle, then the load waits for that too', () => {
    jest.useFakeTimers();
    const idle: (() => void)[] = [];
    const globals = globalThis as { requestIdleCallback?: unknown; cancelIdleCallback?: unknown };
    globals.requestIdleCallback = (callback: () => void) => idle.push(callback);
    globals.cancelIdleCallback = () => undefined;
    try {
      const load = jest.fn(() => of('loaded'));
      new PreloadWhenIdle().preload({ path: 'themes' }, load).subscribe();
      jest.advanceTimersByTime(preloadDelayMs);
      expect(load).not.toHaveBeenCalled();
      expect(idle).toHaveLength(1);
      idle[0]();
      expect(load).toHaveBeenCalledTimes(1);
    } finally {
      delete globals.requestIdleCallback;
      delete globals.cancelIdleCallback;
    }
  });
});
