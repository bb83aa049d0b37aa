import type { Knex } from 'knex';
import { dateRange, maxDate, minDate, yearOf, type IsoDate } from '@shared/calendar/dates';
import { publicHolidays, type PublicHoliday } from '@shared/calendar/holidays';
import { occasionsBetween, type CustomOccasion, type Occasion } from '@shared/calendar/occasions';
import { WorkCalendar, type Booking } from '@shared/planning/work-calendar';
import type { MarketRow } from '../markets/market-repository';
import { marketDates } from '../markets/market-service';
import { OccasionRepository, type BlackoutRow, type StudioCalendarRow } from './occasion-repository';
import { todayInZone } from './studio-today';

/** Everything rule-based about a studio's calendar, read in one query. */
export interface StudioCalendar {
  studioId: number;
  today: IsoDate;
  /** See CalendarSnapshot.fingerprint. */
  fingerprint: string;
  settings: StudioCalendarRow;
  custom: CustomOccasion[];
  sellWindows: Record<string, number>;
  blackouts: BlackoutRow[];
  markets: MarketRow[];
}

export async function loadStudioCalendar(db: Knex, studioId: number): Promise<StudioCalendar> {
  const snapshot = await new OccasionRepository(db).snapshot(studioId);
  if (!snapshot) throw new Error(`studio ${studioId} vanished`);
  return { studioId, today: todayInZone(snapshot.settings.timezone), ...snapshot };
}

// A place's holidays of a year never change, so they are kept per place and year: publicHolidays
// pairs substitute days with their originals over three years on every call.
const holidayYears = new Map<string, PublicHoliday[]>();

function holidaysOfYear(country: string, region: string | undefined, year: number): PublicHoliday[] {
  const id = `${country}|${region ?? ''}|${year}`;
  let holidays = holidayYears.get(id);
  if (!holidays) {
    try {
      holidays = publicHolidays(country, region, `${year}-01-01`, `${year}-12-31`);
    } catch {
      // A place the holiday data does not know (set before settings were checked) has no holidays.
      holidays = [];
    }
    if (holidayYears.size > 5000) holidayYears.clear();
    holidayYears.set(id, holidays);
  }
  return holidays;
}

export function holidaysOf(calendar: StudioCalendar, from: IsoDate, to: IsoDate): PublicHoliday[] {
  const { country, region } = calendar.settings;
  const holidays: PublicHoliday[] = [];
  for (let year = yearOf(from); year <= yearOf(to); year++) {
    for (const holiday of holidaysOfYear(country, region ?? undefined, year)) {
      if (holiday.date >= from && holiday.date <= to) holidays.push(holiday);
    }
  }
  return holidays;
}

export function occasionsOf(calendar: StudioCalendar, from: IsoDate, to: IsoDate): Occasion[] {
  return occasionsBetween(calendar.settings.country, from, to, {
    custom: calendar.custom,
    sellWindows: calendar.sellWindows,
    backToSchool: calendar.settings.back_to_school ?? undefined,
  });
}

export interface MarketDay {
  market: MarketRow;
  date: IsoDate;
}

export function marketDaysOf(calendar: StudioCalendar, from: IsoDate, to: IsoDate): MarketDay[] {
  return calendar.markets.flatMap((market) => marketDates(market, from, to).map((date) => ({ market, date })));
}

export function blackoutDatesOf(calendar: StudioCalendar, from: IsoDate, to: IsoDate): IsoDate[] {
  const dates = new Set<IsoDate>();
  for (const blackout of calendar.blackouts) {
    const start = maxDate(blackout.start, from);
    const end = minDate(blackout.end, to);
    for (const date of dateRange(start, end)) dates.add(date);
  }
  return [...dates].sort();
}

/** The studio's work calendar over a span, with hours already booked by stored events. */
export function workCalendarOf(calendar: StudioCalendar, from: IsoDate, to: IsoDate, bookings: Booking[] = []): WorkCalendar {
  const { settings } = calendar;
  return new WorkCalendar(
    {
      workDays: settings.work_days.split(',').filter(Boolean).map(Number),
      dailyCapacityHours: Number(settings.daily_capacity_hours),
      blackoutDates: blackoutDatesOf(calendar, from, to),
      holidaysOff: Boolean(settings.holidays_off),
      holidays: [...new Set(holidaysOf(calendar, from, to).map((holiday) => holiday.date))],
      marketDays: [...new Set(marketDaysOf(calendar, from, to).map((day) => day.date))],
    },
    bookings,
  );
}
