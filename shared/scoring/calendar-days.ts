// Calendar arithmetic on plain YYYY-MM-DD strings. Day numbers count days since 1970-01-01 in
// UTC, so that no local time zone or daylight-saving shift can move a date.

const MILLISECONDS_PER_DAY = 86_400_000;

export const MONTH_NAMES = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** Accepts YYYY-MM-DD, or YYYY-MM for monthly data (read as the first of the month). */
export function toDayNumber(date: string): number {
  const match = /^(\d{4})-(\d{2})(?:-(\d{2}))?$/.exec(date);
  if (!match) throw new Error(`Not a YYYY-MM-DD date: ${date}`);
  const [, year, month, day] = match;
  return Date.UTC(Number(year), Number(month) - 1, day ? Number(day) : 1) / MILLISECONDS_PER_DAY;
}

export function fromDayNumber(dayNumber: number): string {
  return new Date(dayNumber * MILLISECONDS_PER_DAY).toISOString().slice(0, 10);
}

/** The Monday that starts the ISO week holding the day. */
export function isoWeekMonday(dayNumber: number): number {
  // 1970-01-01 was a Thursday, so day 0 is weekday 3 counting Monday as 0.
  const weekday = (((dayNumber + 3) % 7) + 7) % 7;
  return dayNumber - weekday;
}

/** Months since January 1970, for counting whole months between dates. */
export function toMonthNumber(date: string): number {
  return Number(date.slice(0, 4)) * 12 + Number(date.slice(5, 7)) - 1 - 1970 * 12;
}

export function fromMonthNumber(monthNumber: number): string {
  const year = 1970 + Math.floor(monthNumber / 12);
  const month = (((monthNumber % 12) + 12) % 12) + 1;
  return `${year}-${String(month).padStart(2, '0')}-01`;
}

/** Zero-based month of year of a YYYY-MM-DD date. */
export function monthOfYear(date: string): number {
  return Number(date.slice(5, 7)) - 1;
}
