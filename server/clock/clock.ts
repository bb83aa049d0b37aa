// Relative imports: config.ts loads this module in places without the @shared alias (Jest's global setup).
import { addDays, isIsoDate, type IsoDate } from '../../shared/calendar/dates';
import { dateInZone } from '../../shared/calendar/zone-date';

/**
 * The one source of "now" for the server, the seeds and the tests. A studio's today is its own:
 * `today(timezone)` turns the clock's instant into the date on the studio's wall calendar.
 */
export interface Clock {
  now(): Date;
  today(timezone: string): IsoDate;
}

const DAY_MS = 86_400_000;

export const systemClock: Clock = {
  now: () => new Date(),
  today: (timezone) => dateInZone(new Date(), timezone),
};

/** A clock standing still at `instant` (tests). */
export function fixedClock(instant: Date | string): Clock {
  const at = new Date(instant);
  if (Number.isNaN(at.getTime())) throw new RangeError(`not an instant: ${String(instant)}`);
  return { now: () => new Date(at), today: (timezone) => dateInZone(at, timezone) };
}

/**
 * A clock that starts at a pinned instant and runs on from there at the real pace, so sessions,
 * polling and time-outs behave as usual while the date is the pinned one.
 */
export function runningFrom(instant: Date, realNow: () => number = Date.now): Clock {
  const offset = instant.getTime() - realNow();
  const now = () => new Date(realNow() + offset);
  return { now, today: (timezone) => dateInZone(now(), timezone) };
}

/**
 * A clock on which every studio's today is `date`, whatever its time zone, turning to the next day
 * every 24 hours of running; its instant is noon UTC of that date plus the time it has run.
 */
export function pinnedToday(date: IsoDate, realNow: () => number = Date.now): Clock {
  const started = realNow();
  const noon = Date.parse(`${date}T12:00:00Z`);
  return {
    now: () => new Date(noon + realNow() - started),
    today: () => addDays(date, Math.floor((realNow() - started) / DAY_MS)),
  };
}

export interface ClockEnv {
  KERFCAST_TODAY?: string;
  KERFCAST_NOW?: string;
  NODE_ENV?: string;
}

/**
 * The clock the environment asks for: the real one, or one pinned by KERFCAST_TODAY=YYYY-MM-DD or
 * KERFCAST_NOW=<ISO instant> (KERFCAST_NOW wins when both are set). Pins are for development and
 * tests; in production, and for a malformed value, this throws with a message naming the variable.
 */
export function clockFromEnv(env: ClockEnv): Clock {
  const today = env.KERFCAST_TODAY?.trim() || undefined;
  const now = env.KERFCAST_NOW?.trim() || undefined;
  if (!today && !now) return systemClock;
  const variable = now ? 'KERFCAST_NOW' : 'KERFCAST_TODAY';
  if (env.NODE_ENV === 'production') {
    throw new Error(`${variable}: pinning the date is for development and tests only; unset it in production`);
  }
  if (now) {
    // An instant with its offset (Z or ±hh:mm), so that it means the same moment on every machine.
    const instant = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/.test(now) ? new Date(now) : null;
    if (!instant || Number.isNaN(instant.getTime())) {
      throw new Error(`KERFCAST_NOW: "${now}" is not an ISO instant with its offset, such as 2027-03-06T23:30:00-06:00`);
    }
    return runningFrom(instant);
  }
  if (!isIsoDate(today!)) throw new Error(`KERFCAST_TODAY: "${today}" is not a date written YYYY-MM-DD`);
  return pinnedToday(today!);
}

let current: Clock | null = null;

/**
 * The process's clock. Read from the environment on first use; `useClock` swaps it (start-up, tests).
 * Every reader of the date goes through it; see DEVELOPERS.md, "Dates and the clock".
 */
export const appClock: Clock = {
  now: () => source().now(),
  today: (timezone) => source().today(timezone),
};

function source(): Clock {
  current ??= clockFromEnv(process.env);
  return current;
}

/** Makes `clock` the process's clock; returns a function that puts the previous one back. */
export function useClock(clock: Clock): () => void {
  const previous = current;
  current = clock;
  return () => {
    current = previous;
  };
}
