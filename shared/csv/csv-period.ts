import type { CsvPeriod } from './csv-types';
import { daysBetween } from './csv-dates';

export interface PeriodReport {
  period: CsvPeriod | null;
  /** Dates (ISO) after which the spacing stops matching the period: a mixed file. */
  mixedAt: string[];
  /** Dates after which one or more periods are missing (allowed, but worth a warning). */
  gapsAfter: string[];
}

function isMonthEnd(iso: string): boolean {
  const next = new Date(Date.parse(iso) + 86_400_000);
  return next.getUTCDate() === 1;
}

/** Whether two dates sit at the same place in their months (month-end exports count as one place). */
function isSameDayOfMonth(from: string, to: string): boolean {
  return from.slice(8) === to.slice(8) || (isMonthEnd(from) && isMonthEnd(to));
}

function monthIndex(iso: string): number {
  return Number(iso.slice(0, 4)) * 12 + Number(iso.slice(5, 7)) - 1;
}

/** The spacing between two dates in the terms of each period, or null when it fits none. */
function stepOf(from: string, to: string): { period: CsvPeriod; steps: number } | null {
  const days = daysBetween(from, to);
  if (isSameDayOfMonth(from, to) && days >= 28) {
    return { period: 'monthly', steps: monthIndex(to) - monthIndex(from) };
  }
  if (days % 7 === 0 && days > 0) return { period: 'weekly', steps: days / 7 };
  if (days > 0) return { period: 'daily', steps: days };
  return null;
}

/** How many periods apart two dates are, or null when the spacing does not fit the period. */
function countSteps(period: CsvPeriod, from: string, to: string, days: number): number | null {
  if (days <= 0) return null;
  if (period === 'daily') return days;
  if (period === 'weekly') return days % 7 === 0 ? days / 7 : null;
  return isSameDayOfMonth(from, to) ? monthIndex(to) - monthIndex(from) : null;
}

/**
 * Detects daily, weekly or monthly spacing from sorted unique ISO dates. The period is the one
 * most gaps agree with; a one-day step inside a weekly file, or a weekly step inside a monthly
 * one, makes the file mixed.
 */
export function detectPeriod(sortedDates: readonly string[]): PeriodReport {
  const steps: { from: string; period: CsvPeriod; steps: number }[] = [];
  for (let i = 1; i < sortedDates.length; i++) {
    const step = stepOf(sortedDates[i - 1], sortedDates[i]);
    if (step) steps.push({ from: sortedDates[i - 1], ...step });
  }
  if (steps.length === 0) return { period: null, mixedAt: [], gapsAfter: [] };
  const single = (period: CsvPeriod) => steps.filter((s) => s.period === period && s.steps === 1);
  const votes = (['monthly', 'weekly', 'daily'] as const).map((period) => ({
    period,
    count: single(period).length,
  }));
  const winner = votes.reduce((best, vote) => (vote.count > best.count ? vote : best));
  const period = winner.count > 0 ? winner.period : steps[0].period;
  const mixedAt: string[] = [];
  const gapsAfter: string[] = [];
  for (let i = 1; i < sortedDates.length; i++) {
    const [from, to] = [sortedDates[i - 1], sortedDates[i]];
    const days = daysBetween(from, to);
    const count = countSteps(period, from, to, days);
    if (count === null) mixedAt.push(from);
    else if (count > 1) gapsAfter.push(from);
  }
  return { period, mixedAt, gapsAfter };
}
