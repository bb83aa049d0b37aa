import { addDays, dateRange, fromUtcDate, isoWeekday, maxDate, minDate, toUtcDate, type IsoDate } from '@shared/calendar/dates';

export type CalendarView = 'month' | 'week' | 'agenda';

/**
 * A local Date (as the Material datepicker gives) as its ISO calendar date. "Today" is not this of
 * `new Date()`: it is the studio's, from StudioContext.today().
 */
export function isoOfLocalDate(date: Date): IsoDate {
  const month = String(date.getMonth() + 1).padStart(2, '0');
  const day = String(date.getDate()).padStart(2, '0');
  return `${date.getFullYear()}-${month}-${day}`;
}

/** The local midnight Date of an ISO date, for the Material datepicker. */
export function localDateOf(date: IsoDate): Date {
  const [year, month, day] = date.split('-').map(Number);
  return new Date(year, month - 1, day);
}

/** The first day of the week that holds `date`, for a week starting on ISO weekday `weekStart`. */
export function startOfWeek(date: IsoDate, weekStart: 1 | 7): IsoDate {
  return addDays(date, -((isoWeekday(date) - weekStart + 7) % 7));
}

export function firstOfMonth(date: IsoDate): IsoDate {
  return `${date.slice(0, 7)}-01`;
}

export function lastOfMonth(date: IsoDate): IsoDate {
  const utc = toUtcDate(firstOfMonth(date));
  return fromUtcDate(new Date(Date.UTC(utc.getUTCFullYear(), utc.getUTCMonth() + 1, 0)));
}

/** Moves a date by whole months, keeping the day where the target month has it (Jan 31 + 1 → Feb 28). */
export function addMonths(date: IsoDate, months: number): IsoDate {
  const utc = toUtcDate(date);
  const target = new Date(Date.UTC(utc.getUTCFullYear(), utc.getUTCMonth() + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(utc.getUTCDate(), last));
  return fromUtcDate(target);
}

/** The days a view shows around `focus`: whole weeks covering the month, one week, or today and the next 7 days. */
export function visibleDays(view: CalendarView, focus: IsoDate, weekStart: 1 | 7): IsoDate[] {
  if (view === 'agenda') return dateRange(focus, addDays(focus, 7));
  if (view === 'week') {
    const start = startOfWeek(focus, weekStart);
    return dateRange(start, addDays(start, 6));
  }
  const start = startOfWeek(firstOfMonth(focus), weekStart);
  const end = addDays(startOfWeek(lastOfMonth(focus), weekStart), 6);
  return dateRange(start, end);
}

/**
 * The dates to load for a view around `focus` before the studio's week start is known: the days it
 * shows from a Monday and from a Sunday together, so that the events can be asked for at the same
 * time as the settings (a few days more than the grid shows, instead of a round trip more).
 */
export function loadedRange(view: CalendarView, focus: IsoDate): { from: IsoDate; to: IsoDate } {
  const fromMonday = visibleDays(view, focus, 1);
  const fromSunday = visibleDays(view, focus, 7);
  return { from: minDate(fromMonday[0], fromSunday[0]), to: maxDate(fromMonday.at(-1)!, fromSunday.at(-1)!) };
}

/** Chunks days into rows of seven. */
export function weeksOf<T>(days: T[]): T[][] {
  const weeks: T[][] = [];
  for (let index = 0; index < days.length; index += 7) weeks.push(days.slice(index, index + 7));
  return weeks;
}

// The app speaks US English only, so the names are spelled out here: Intl.DateTimeFormat costs a
// first-call set-up on every page load and a formatter call per label, and a month asks for many.
const weekdayNames = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];
const monthNames = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

const weekdayOf = (date: IsoDate) => weekdayNames[isoWeekday(date) - 1];
const monthOf = (date: IsoDate) => monthNames[Number(date.slice(5, 7)) - 1];
const dayOf = (date: IsoDate) => Number(date.slice(8, 10));

// Each chip's accessible name and each day's label spell out a date, and a month's chips share its
// 42 days: the labels are kept per date (isoWeekday validates and parses, for every call).
const longLabels = new Map<IsoDate, string>();

/** "Wednesday, December 16". */
export function formatLong(date: IsoDate): string {
  let label = longLabels.get(date);
  if (label === undefined) {
    label = `${weekdayOf(date)}, ${monthOf(date)} ${dayOf(date)}`;
    longLabels.set(date, label);
  }
  return label;
}

/** "Wed, Dec 16". */
export function formatShort(date: IsoDate): string {
  return `${weekdayOf(date).slice(0, 3)}, ${monthOf(date).slice(0, 3)} ${dayOf(date)}`;
}

/** "Wed, Dec 16", or "Wed, Dec 16 – Fri, Dec 18" for days start..end. */
export function formatShortSpan(start: IsoDate, end: IsoDate): string {
  return start === end ? formatShort(start) : `${formatShort(start)} – ${formatShort(end)}`;
}

/** "December 2026". */
export function formatMonth(date: IsoDate): string {
  return `${monthOf(date)} ${date.slice(0, 4)}`;
}

/** "Wed". */
export function formatWeekday(date: IsoDate): string {
  return weekdayOf(date).slice(0, 3);
}

/** "Tobin Ashgrove" → "TA"; one name → its first two letters. */
export function initialsOf(name: string | null | undefined): string {
  if (!name) return '';
  const words = name.trim().split(/\s+/).filter(Boolean);
  if (words.length === 0) return '';
  if (words.length === 1) return words[0].slice(0, 2).toUpperCase();
  return (words[0][0] + words[words.length - 1][0]).toUpperCase();
}
