// Turns raw points into an evenly spaced series: sorted, daily summed to ISO weeks, short gaps
// interpolated and long ones reported. Decomposition and the trend tests need equal spacing.
// Sales are counted, not sampled: a period without a sale sold 0, so for them nothing is missing.

import {
  fromDayNumber,
  fromMonthNumber,
  isoWeekMonday,
  toDayNumber,
  toMonthNumber,
} from './calendar-days';
import type { Gap, Period, Point } from './types';

/** Gaps this long or shorter are filled by a straight line between their neighbours. */
export const MAX_INTERPOLATED_PERIODS = 2;

export type RegularPeriod = 'weekly' | 'monthly';

export interface RegularSeries {
  period: RegularPeriod;
  /** Periods per year: 52 weekly, 12 monthly. */
  m: number;
  dates: string[];
  /** null only inside gaps longer than MAX_INTERPOLATED_PERIODS. */
  values: (number | null)[];
  interpolated: string[];
  /** Periods without a figure that were counted as 0 (sales only). */
  zeroFilled: string[];
  gaps: Gap[];
  notes: string[];
}

export interface RegulariseOptions {
  /** Whether a period without a figure sold nothing (sales) rather than is unknown (interest). */
  isMissingZero?: boolean;
  /**
   * The last day the source files cover (YYYY-MM-DD). With isMissingZero, whole periods after the
   * last point up to it count as 0 too: an item that stopped selling sold nothing since.
   */
  coveredUntil?: string;
}

export function periodsPerYear(period: RegularPeriod): number {
  return period === 'weekly' ? 52 : 12;
}

export function regularise(
  points: Point[],
  period: Period,
  options: RegulariseOptions = {},
): RegularSeries {
  const notes: string[] = [];
  // Day numbers are parsed once, not on every comparison of the sort.
  const sorted = points
    .map((point) => ({ point, day: toDayNumber(point.date) }))
    .sort((a, b) => a.day - b.day)
    .map(({ point }) => point);
  const regularPeriod: RegularPeriod = period === 'monthly' ? 'monthly' : 'weekly';
  const until = options.isMissingZero ? options.coveredUntil : undefined;
  const slotted =
    period === 'daily'
      ? sumDaysToWeeks(sorted, notes, options.isMissingZero === true, until)
      : placeInSlots(sorted, regularPeriod, notes, until);
  const zeroFilled = options.isMissingZero ? fillWithZeros(slotted) : [];
  if (zeroFilled.length > 0) {
    const unit = regularPeriod === 'weekly' ? 'weeks' : 'months';
    notes.push(`${zeroFilled.length} ${unit} without a sale count as 0 sold`);
  }
  const { dates, values } = trimMissingEnds(slotted.dates, slotted.values);
  const { interpolated, gaps } = fillShortGaps(dates, values);
  for (const gap of gaps) {
    notes.push(`gap of ${gap.periods} periods from ${gap.from} to ${gap.to} is not filled`);
  }
  return {
    period: regularPeriod,
    m: periodsPerYear(regularPeriod),
    dates,
    values,
    interpolated,
    zeroFilled,
    gaps,
    notes,
  };
}

/** Sets every missing value to 0 in place and returns the dates it filled. */
function fillWithZeros(slots: Slots): string[] {
  const filled: string[] = [];
  slots.values.forEach((value, index) => {
    if (value !== null) return;
    slots.values[index] = 0;
    filled.push(slots.dates[index]);
  });
  return filled;
}

interface Slots {
  dates: string[];
  values: (number | null)[];
}

function placeInSlots(
  sorted: Point[],
  period: RegularPeriod,
  notes: string[],
  coveredUntil?: string,
): Slots {
  if (sorted.length === 0) return { dates: [], values: [] };
  // Weekly files keep their own weekday (some sources start weeks on Sunday), so slots count
  // whole weeks from the first date rather than snapping to Mondays.
  const first = sorted[0].date;
  const slotOf = (date: string): number =>
    period === 'monthly'
      ? toMonthNumber(date) - toMonthNumber(first)
      : Math.round((toDayNumber(date) - toDayNumber(first)) / 7);
  const dateOf = (slot: number): string =>
    period === 'monthly'
      ? fromMonthNumber(toMonthNumber(first) + slot)
      : fromDayNumber(toDayNumber(first) + 7 * slot);
  let count = slotOf(sorted[sorted.length - 1].date) + 1;
  // Only whole periods of the covered range are added: a cut-off period would read as a fall.
  const slotEnd = (slot: number): number =>
    period === 'monthly' ? toDayNumber(dateOf(slot + 1)) - 1 : toDayNumber(dateOf(slot)) + 6;
  if (coveredUntil !== undefined) {
    while (slotEnd(count) <= toDayNumber(coveredUntil)) count++;
  }
  const values: (number | null)[] = new Array(count).fill(null);
  const seen = new Set<number>();
  let duplicates = 0;
  for (const point of sorted) {
    const slot = slotOf(point.date);
    if (seen.has(slot)) duplicates++;
    seen.add(slot);
    // The later of two points for the same period wins, as a re-export usually corrects one.
    if (point.value !== null || values[slot] === null) values[slot] = finiteOrNull(point.value);
  }
  if (duplicates > 0)
    notes.push(`${duplicates} points shared a period with another; the later was kept`);
  return { dates: Array.from({ length: count }, (_, slot) => dateOf(slot)), values };
}

/**
 * Sums days into ISO weeks starting Monday; drops incomplete first and last weeks. A week with
 * some days missing is scaled up to 7 days, unless missing days sold nothing (isMissingZero).
 */
export function sumDaysToWeeks(
  sorted: Point[],
  notes: string[] = [],
  isMissingZero = false,
  coveredUntil?: string,
): Slots {
  if (sorted.length === 0) return { dates: [], values: [] };
  const firstDay = toDayNumber(sorted[0].date);
  const lastDay = Math.max(
    toDayNumber(sorted[sorted.length - 1].date),
    coveredUntil === undefined ? -Infinity : toDayNumber(coveredUntil),
  );
  let firstMonday = isoWeekMonday(firstDay);
  let lastMonday = isoWeekMonday(lastDay);
  // A week cut by the ends of the file would look like a sudden fall, so it is left out.
  if (firstDay !== firstMonday) {
    notes.push(`first week (from ${fromDayNumber(firstMonday)}) is incomplete and left out`);
    firstMonday += 7;
  }
  if (lastDay !== lastMonday + 6) {
    notes.push(`last week (from ${fromDayNumber(lastMonday)}) is incomplete and left out`);
    lastMonday -= 7;
  }
  if (lastMonday < firstMonday) return { dates: [], values: [] };
  const count = (lastMonday - firstMonday) / 7 + 1;
  const sums = new Array<number>(count).fill(0);
  const knownDays = new Array<number>(count).fill(0);
  const daysSeen = new Set<number>();
  for (const point of sorted) {
    const day = toDayNumber(point.date);
    const week = (isoWeekMonday(day) - firstMonday) / 7;
    const value = finiteOrNull(point.value);
    if (week < 0 || week >= count || value === null || daysSeen.has(day)) continue;
    daysSeen.add(day);
    sums[week] += value;
    knownDays[week]++;
  }
  let scaledWeeks = 0;
  const values = sums.map((sum, week) => {
    if (knownDays[week] === 0) return null;
    if (knownDays[week] === 7 || isMissingZero) return sum;
    // A week with some days missing is scaled up from the days it has, rather than undercounted.
    scaledWeeks++;
    return (sum * 7) / knownDays[week];
  });
  if (scaledWeeks > 0)
    notes.push(`${scaledWeeks} weeks had missing days and were scaled to 7 days`);
  const dates = Array.from({ length: count }, (_, week) => fromDayNumber(firstMonday + 7 * week));
  return { dates, values };
}

function trimMissingEnds(dates: string[], values: (number | null)[]): Slots {
  let start = 0;
  let end = values.length;
  while (start < end && values[start] === null) start++;
  while (end > start && values[end - 1] === null) end--;
  return { dates: dates.slice(start, end), values: values.slice(start, end) };
}

/** Fills runs of up to MAX_INTERPOLATED_PERIODS nulls in place; returns what it did. */
function fillShortGaps(
  dates: string[],
  values: (number | null)[],
): { interpolated: string[]; gaps: Gap[] } {
  const interpolated: string[] = [];
  const gaps: Gap[] = [];
  let index = 0;
  while (index < values.length) {
    if (values[index] !== null) {
      index++;
      continue;
    }
    const start = index;
    while (index < values.length && values[index] === null) index++;
    const length = index - start;
    if (length > MAX_INTERPOLATED_PERIODS) {
      gaps.push({ from: dates[start], to: dates[index - 1], periods: length });
      continue;
    }
    // Ends were trimmed, so a run of nulls always has a known value on both sides.
    const before = values[start - 1] as number;
    const after = values[index] as number;
    for (let offset = 1; offset <= length; offset++) {
      values[start + offset - 1] = before + ((after - before) * offset) / (length + 1);
      interpolated.push(dates[start + offset - 1]);
    }
  }
  return { interpolated, gaps };
}

function finiteOrNull(value: number | null): number | null {
  return value === null || !Number.isFinite(value) ? null : value;
}
