// Rise and year over year: how the series moves, on the seasonally adjusted values so that a
// December peak is not read as a trend. Window lengths follow DESIGN §5.

import { mean } from 'simple-statistics';

import type { RegularPeriod } from './regularise';
import { leastSquaresLine, mannKendall, senSlope } from './trend-statistics';
import type { Rise } from './types';

/** Periods compared by recentChange and yoy: a month of weeks, a quarter of months. */
export function comparisonLength(period: RegularPeriod): number {
  return period === 'weekly' ? 4 : 3;
}

/** mean(last k) / mean(k before) − 1; null without 2k points or with a non-positive base. */
export function recentChange(values: number[], k: number): number | null {
  if (k < 1 || values.length < 2 * k) return null;
  const recent = mean(values.slice(-k));
  const before = mean(values.slice(-2 * k, -k));
  return before > 0 ? recent / before - 1 : null;
}

/** The last k periods against the same k periods m periods (a year) earlier, as a fraction. */
export function yearOverYear(values: number[], k: number, m: number): number | null {
  if (k < 1 || values.length < m + k) return null;
  const recent = mean(values.slice(-k));
  const yearBefore = mean(values.slice(values.length - m - k, values.length - m));
  return yearBefore > 0 ? recent / yearBefore - 1 : null;
}

/**
 * OLS slope over the last m periods (or all, when fewer) as % of their mean per period. Null with
 * fewer than 3 points or a mean of 0; the mean is taken as a size, so a negative mean keeps the
 * slope's sign.
 */
export function slopePercent(values: number[], m: number): number | null {
  const window = values.slice(-m);
  if (window.length < 3) return null;
  const line = leastSquaresLine(window);
  const level = Math.abs(mean(window));
  return line && level > 0 ? (line.slope / level) * 100 : null;
}

export function computeRise(adjusted: number[], m: number, k: number): Rise {
  // Mann–Kendall and Sen share the last 2m periods, so their figures describe the same stretch.
  const trendWindow = adjusted.slice(-2 * m);
  const slopePct = slopePercent(adjusted, m);
  return {
    recentChange: recentChange(adjusted, k),
    slopePct,
    growthPerYear: slopePct === null ? null : (slopePct * m) / 100,
    mannKendall: mannKendall(trendWindow),
    senSlope: trendWindow.length >= 3 ? senSlope(trendWindow) : null,
  };
}
