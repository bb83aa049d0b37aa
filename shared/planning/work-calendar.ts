import { addDays, dateRange, daysBetween, isoWeekday, type IsoDate } from '../calendar/dates';

export type StepKind = 'build' | 'content' | 'launch';

export interface WorkCalendarSettings {
  /** ISO weekdays the studio works, 1 = Monday … 7 = Sunday. */
  workDays: number[];
  dailyCapacityHours: number;
  /** Vacation and other days nobody works. */
  blackoutDates: IsoDate[];
  /** Whether public holidays are days off. */
  holidaysOff: boolean;
  /** Public holiday dates (observed), e.g. from publicHolidayDates(). */
  holidays: IsoDate[];
  /** Days at a market: off for build work (the cutter's crew is at the booth), fine for content. */
  marketDays: IsoDate[];
}

/** Hours of work already booked on a day by events outside the plan being made. */
export interface Booking {
  date: IsoDate;
  hours: number;
}

export type DayOffReason = 'not-a-work-day' | 'blackout' | 'holiday' | 'market';

// Guards addWorkDays against a calendar whose every day is off.
const MAX_WALK_DAYS = 3660;

const WEEKDAY_NAMES = [
  '',
  'Monday',
  'Tuesday',
  'Wednesday',
  'Thursday',
  'Friday',
  'Saturday',
  'Sunday',
];

/**
 * The studio's working days and the hours already booked on them. Immutable: planners keep their
 * own tally of what they place on top, so one calendar serves several previews.
 */
export class WorkCalendar {
  readonly settings: Readonly<WorkCalendarSettings>;
  private readonly workWeekdays: ReadonlySet<number>;
  private readonly blackouts: ReadonlySet<IsoDate>;
  private readonly holidays: ReadonlySet<IsoDate>;
  private readonly markets: ReadonlySet<IsoDate>;
  private readonly booked: ReadonlyMap<IsoDate, number>;

  constructor(settings: WorkCalendarSettings, bookings: Booking[] = []) {
    const invalidDay = settings.workDays.find(
      (day) => !Number.isInteger(day) || day < 1 || day > 7,
    );
    if (invalidDay !== undefined)
      throw new RangeError(`Work days are ISO weekdays 1 to 7, got ${invalidDay}`);
    if (settings.workDays.length === 0)
      throw new RangeError('A work calendar needs at least one work day');
    if (!(settings.dailyCapacityHours > 0 && settings.dailyCapacityHours <= 24)) {
      throw new RangeError(
        `Daily capacity must be more than 0 and at most 24 hours, got ${settings.dailyCapacityHours}`,
      );
    }
    this.settings = settings;
    this.workWeekdays = new Set(settings.workDays);
    this.blackouts = new Set(settings.blackoutDates);
    this.holidays = new Set(settings.holidays);
    this.markets = new Set(settings.marketDays);
    const booked = new Map<IsoDate, number>();
    for (const booking of bookings)
      booked.set(booking.date, (booked.get(booking.date) ?? 0) + booking.hours);
    this.booked = booked;
  }

  get capacityHours(): number {
    return this.settings.dailyCapacityHours;
  }

  /** Why `date` is off for work of `kind`, or null when it is a work day. */
  dayOffReason(date: IsoDate, kind: StepKind): DayOffReason | null {
    if (!this.workWeekdays.has(isoWeekday(date))) return 'not-a-work-day';
    if (this.blackouts.has(date)) return 'blackout';
    if (this.settings.holidaysOff && this.holidays.has(date)) return 'holiday';
    if (kind === 'build' && this.markets.has(date)) return 'market';
    return null;
  }

  /** Whether work of `kind` may be planned on `date` (capacity aside). */
  isWorkDay(date: IsoDate, kind: StepKind): boolean {
    return this.dayOffReason(date, kind) === null;
  }

  /**
   * The `count`-th work day after `date` (before it when negative); `date` itself when 0.
   * Same convention as date-fns addBusinessDays for a Monday–Friday week.
   */
  addWorkDays(date: IsoDate, count: number, kind: StepKind = 'build'): IsoDate {
    if (!Number.isInteger(count)) throw new RangeError(`Work days must be whole, got ${count}`);
    const step = count < 0 ? -1 : 1;
    let remaining = Math.abs(count);
    let current = date;
    for (let walked = 0; remaining > 0; walked++) {
      if (walked > MAX_WALK_DAYS)
        throw new RangeError(`Fewer than ${Math.abs(count)} work days within ten years of ${date}`);
      current = addDays(current, step);
      if (this.isWorkDay(current, kind)) remaining--;
    }
    return current;
  }

  /**
   * Work days from `from` (included) up to `to` (excluded), negative when `to` is earlier; the
   * convention of date-fns differenceInBusinessDays(to, from).
   */
  workDaysBetween(from: IsoDate, to: IsoDate, kind: StepKind = 'build'): number {
    const span = daysBetween(from, to);
    if (span === 0) return 0;
    const days = span > 0 ? dateRange(from, addDays(to, -1)) : dateRange(addDays(to, 1), from);
    const count = days.filter((date) => this.isWorkDay(date, kind)).length;
    return span > 0 ? count : -count;
  }

  /** Hours booked on `date` by the bookings the calendar was made with. */
  bookedHours(date: IsoDate): number {
    return this.booked.get(date) ?? 0;
  }

  /** A calendar with more bookings on top (e.g. the other runways of the studio). */
  withBookings(bookings: Booking[]): WorkCalendar {
    const existing = [...this.booked].map(([date, hours]) => ({ date, hours }));
    return new WorkCalendar(this.settings, [...existing, ...bookings]);
  }

  describeDayOff(date: IsoDate, reason: DayOffReason): string {
    switch (reason) {
      case 'not-a-work-day':
        return `${date} is a ${WEEKDAY_NAMES[isoWeekday(date)]}, not a work day`;
      case 'blackout':
        return `${date} is a blackout day`;
      case 'holiday':
        return `${date} is a public holiday`;
      case 'market':
        return `${date} is a market day, off for build work`;
    }
  }
}

/**
 * Bookings from stored events: an event's hours a day on each of its work days from start to end
 * (inclusive), the way the planner placed them. Milestones (no hours) book nothing.
 */
export function bookingsFromEvents(
  events: { start: IsoDate; end: IsoDate; hoursPerDay: number; kind: StepKind; days?: IsoDate[] }[],
  calendar: WorkCalendar,
): Booking[] {
  const bookings: Booking[] = [];
  for (const event of events) {
    if (!(event.hoursPerDay > 0)) continue;
    const days =
      event.days ??
      dateRange(event.start, event.end).filter((date) => calendar.isWorkDay(date, event.kind));
    for (const date of days) bookings.push({ date, hours: event.hoursPerDay });
  }
  return bookings;
}
