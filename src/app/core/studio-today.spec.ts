import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { DateAdapter } from '@angular/material/core';
import { isoOfLocalDate } from '../calendar/calendar-dates';
import { SessionStore } from './session-store';
import { StudioContext } from './studio-context';
import { provideStudioDateAdapter } from './studio-date-adapter';

describe('StudioDateAdapter', () => {
  it("when a studio is open, then the datepicker's today is the studio's as the server stated it, not the browser's", async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideStudioDateAdapter()] });
    const loading = TestBed.inject(SessionStore).load();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/auth/me')
      .flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 7, name: 'Bench', role: 'partner', timezone: 'Pacific/Auckland', today: '2031-05-14' }] });
    await loading;
    const adapter = TestBed.inject(DateAdapter<Date>);
    expect(isoOfLocalDate(adapter.today())).toBe(isoOfLocalDate(new Date()));
    TestBed.inject(StudioContext).select(7);
    expect(isoOfLocalDate(adapter.today())).toBe('2031-05-14');
    expect(adapter.format(adapter.today(), { year: 'numeric', month: 'long', day: 'numeric' })).toBe('May 14, 2031');
  });

});

describe('SessionStore.todayIn', () => {
  it("when a day passes in the studio's time zone, then its today moves on with it", async () => {
    // The browser's clock only counts the days that pass, at the studio's midnight (UTC here).
    jest.useFakeTimers({ now: new Date('2026-12-05T13:00:00Z'), doNotFake: ['setTimeout', 'setInterval', 'queueMicrotask', 'nextTick', 'setImmediate'] });
    try {
      TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
      const session = TestBed.inject(SessionStore);
      const loading = session.load();
      TestBed.inject(HttpTestingController)
        .expectOne('/api/auth/me')
        .flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 7, name: 'Bench', role: 'partner', timezone: 'UTC', today: '2031-05-14' }] });
      await loading;
      expect(session.todayIn(7)).toBe('2031-05-14');
      jest.setSystemTime(new Date('2026-12-05T23:59:00Z'));
      expect(session.todayIn(7)).toBe('2031-05-14');
      jest.setSystemTime(new Date('2026-12-06T00:01:00Z'));
      expect(session.todayIn(7)).toBe('2031-05-15');
      expect(session.todayIn(8)).toBeNull();
    } finally {
      jest.useRealTimers();
    }
  });
});
