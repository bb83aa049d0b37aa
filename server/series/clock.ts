// The server's clock, in one place so tests can hold "today" still (jest.spyOn(systemClock, 'now')).
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** Today's date in a time zone, as YYYY-MM-DD: a studio's "today" is its own, not the server's. */
export function todayIn(timezone: string, clock: Clock = systemClock): string {
  // en-CA formats as YYYY-MM-DD.
  return new Intl.DateTimeFormat('en-CA', { timeZone: timezone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(clock.now());
}
