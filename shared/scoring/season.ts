// Where the season peaks and how much a target window stands above an average period. Period t
// starts at the series' first date plus t weeks or months, so positions line up with indices[].

import { mean } from 'simple-statistics';

import { fromDayNumber, fromMonthNumber, toDayNumber, toMonthNumber } from './calendar-days';
import type { Decomposition } from './decompose';
import type { RegularPeriod } from './regularise';
import type { DateWindow } from './types';

export function peakPosition(indices: number[]): number {
  let best = 0;
  for (let position = 1; position < indices.length; position++) {
    if (indices[position] > indices[best]) best = position;
  }
  return best;
}

/** Start date of period t counted from the series' first date (t may run past the end). */
export function periodStart(firstDate: string, period: RegularPeriod, t: number): string {
  return period === 'monthly'
    ? fromMonthNumber(toMonthNumber(firstDate) + t)
    : fromDayNumber(toDayNumber(firstDate) + 7 * t);
}

/** Last day of period t. */
export function periodEnd(firstDate: string, period: RegularPeriod, t: number): string {
  return period === 'monthly'
    ? fromDayNumber(toDayNumber(periodStart(firstDate, period, t + 1)) - 1)
    : fromDayNumber(toDayNumber(firstDate) + 7 * t + 6);
}

/** The period t that holds a date (negative before the series starts). */
export function periodIndexOf(firstDate: string, period: RegularPeriod, date: string): number {
  return period === 'monthly'
    ? toMonthNumber(date) - toMonthNumber(firstDate)
    : Math.floor((toDayNumber(date) - toDayNumber(firstDate)) / 7);
}

/**
 * The first peak period that starts after today. With m = 52 a weekly year is a day or two short
 * of a calendar year, so far-off peaks drift; the textbook method accepts that and so do we.
 */
export function nextPeakPeriod(
  firstDate: string,
  period: RegularPeriod,
  m: number,
  position: number,
  today: string,
): number {
  const todayIndex = periodIndexOf(firstDate, period, today);
  let t = todayIndex - ((((todayIndex - position) % m) + m) % m);
  while (toDayNumber(periodStart(firstDate, period, t)) <= toDayNumber(today)) t += m;
  return t;
}

const positionOf = (t: number, m: number): number => ((t % m) + m) % m;

/**
 * How far the target window stands above an average period, as a fraction: the mean index of
 * the periods the window touches, less 1 for the multiplicative model; for the additive model the
 * mean index over the current level (the mean of the last m values), null when that is not
 * positive.
 */
export function seasonLift(
  decomposition: Decomposition,
  values: number[],
  firstDate: string,
  period: RegularPeriod,
  target: DateWindow,
): number | null {
  const m = decomposition.period;
  const from = periodIndexOf(firstDate, period, target.from);
  const to = Math.max(from, periodIndexOf(firstDate, period, target.to));
  const touched: number[] = [];
  for (let t = from; t <= to; t++) touched.push(decomposition.indices[positionOf(t, m)]);
  const meanIndex = mean(touched);
  if (decomposition.model === 'multiplicative') return meanIndex - 1;
  const level = mean(values.slice(-m));
  return level > 0 ? meanIndex / level : null;
}
