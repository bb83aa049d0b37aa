// All-day dates travel as ISO 'YYYY-MM-DD' strings. Arithmetic runs on UTC midnights so that a
// daylight-saving change in the server's or browser's zone can never shift a day.

export type IsoDate = string;

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const DAY_MS = 86_400_000;

/** Whether `text` is a real calendar date written as YYYY-MM-DD (rejects 2025-02-30). */
export function isIsoDate(text: string): boolean {
  const match = ISO_DATE.exec(text);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  return (
    date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day
  );
}

/** The UTC midnight of an ISO date; throws on anything that is not a real date. */
export function toUtcDate(date: IsoDate): Date {
  if (!isIsoDate(date)) throw new RangeError(`Not a date in YYYY-MM-DD form: "${date}"`);
  return new Date(`${date}T00:00:00Z`);
}

/** The ISO date of a Date's UTC calendar day. */
export function fromUtcDate(date: Date): IsoDate {
  return date.toISOString().slice(0, 10);
}

export function makeDate(year: number, month: number, day: number): IsoDate {
  return fromUtcDate(new Date(Date.UTC(year, month - 1, day)));
}

export function addDays(date: IsoDate, days: number): IsoDate {
  return fromUtcDate(new Date(toUtcDate(date).getTime() + days * DAY_MS));
}

/** Calendar days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return Math.round((toUtcDate(to).getTime() - toUtcDate(from).getTime()) / DAY_MS);
}

/** ISO weekday: 1 = Monday … 7 = Sunday. */
export function isoWeekday(date: IsoDate): number {
  const day = toUtcDate(date).getUTCDay();
  return day === 0 ? 7 : day;
}

/** Negative, zero or positive like a sort comparator; ISO strings order like their dates. */
export function compareDates(a: IsoDate, b: IsoDate): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

export function minDate(a: IsoDate, b: IsoDate): IsoDate {
  return a <= b ? a : b;
}

export function maxDate(a: IsoDate, b: IsoDate): IsoDate {
  return a >= b ? a : b;
}

/** Every date from `from` to `to`, both included; empty when `to` is before `from`. */
export function dateRange(from: IsoDate, to: IsoDate): IsoDate[] {
  toUtcDate(to);
  const dates: IsoDate[] = [];
  for (let date = from; date <= to; date = addDays(date, 1)) dates.push(date);
  return dates;
}

export function yearOf(date: IsoDate): number {
  return Number(date.slice(0, 4));
}
