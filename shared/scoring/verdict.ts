// The plain-words verdict. Rules run in order and the first that fits wins; each returns the
// figures it looked at so the UI can show why. Reasons are in plain words; the test statistics
// behind them stay in the figures, for those who want them.

import { median, medianAbsoluteDeviation } from 'simple-statistics';

import { TREND_SIGNIFICANCE } from './heat';
import type { RegularPeriod } from './regularise';
import type { Rise, Verdict } from './types';

/** Fewer periods than this say nothing reliable about direction: a quarter of weeks, 6 months. */
export const MIN_PERIODS_FOR_VERDICT: Readonly<Record<RegularPeriod, number>> = {
  weekly: 13,
  monthly: 6,
};

/** F at or above this reads as "seasonal" (Hyndman & Athanasopoulos call 0.6+ strong). */
export const STRONG_SEASONALITY = 0.6;

/** A trend must move the series by at least this fraction a year to be called rising or fading. */
export const MEANINGFUL_GROWTH_PER_YEAR = 0.1;

/** A seasonal series is still called rising or fading when it grows this much a year or more. */
export const GROWTH_OVER_SEASON = 0.25;

/** Robust z (against the median and scaled MAD of the year before) that makes a jump. */
export const SPIKE_Z = 5;

export interface VerdictInput {
  period: RegularPeriod;
  periodsUsed: number;
  m: number;
  k: number;
  /** The seasonally adjusted series (raw when it could not be adjusted). */
  adjusted: number[];
  rise: Rise;
  strength: number | null;
  peakMonth: string | null;
}

export interface VerdictResult {
  verdict: Verdict;
  reason: string;
  figures: Record<string, number | string | null>;
}

const percent = (fraction: number): string =>
  `${fraction >= 0 ? '+' : ''}${Math.round(fraction * 100)} %`;

export function decideVerdict(input: VerdictInput): VerdictResult {
  const { rise, strength, period, m } = input;
  const minimum = MIN_PERIODS_FOR_VERDICT[period];
  const growthPerYear = rise.growthPerYear;
  const p = rise.mannKendall?.p ?? null;
  const figures: Record<string, number | string | null> = {
    periodsUsed: input.periodsUsed,
    growthPerYear,
    mannKendallP: p,
    recentChange: rise.recentChange,
    seasonalStrength: strength,
  };
  const unit = period === 'weekly' ? 'weeks' : 'months';
  if (input.periodsUsed < minimum) {
    return {
      verdict: 'not-enough-history',
      reason: `not enough history: ${minimum - input.periodsUsed} more ${minimum - input.periodsUsed === 1 ? unit.slice(0, -1) : unit} needed for a verdict`,
      figures: { ...figures, periodsNeeded: minimum - input.periodsUsed },
    };
  }
  const spikeZ = recentSpikeZ(input.adjusted, input.k, m);
  if (spikeZ !== null) {
    return {
      verdict: 'spike',
      reason: `spike: one of the last ${input.k} ${unit} jumped far above the usual level, and the rest did not follow`,
      figures: { ...figures, spikeZ },
    };
  }
  const isTrend = p !== null && p < TREND_SIGNIFICANCE && growthPerYear !== null;
  const isSeasonal = strength !== null && strength >= STRONG_SEASONALITY;
  const seasonNote = isSeasonal ? `, and seasonal (peaks in ${input.peakMonth})` : '';
  if (isSeasonal && !(isTrend && Math.abs(growthPerYear!) >= GROWTH_OVER_SEASON)) {
    return {
      verdict: 'seasonal',
      reason: `seasonal (peaks in ${input.peakMonth}): a strong yearly pattern, seasonal strength ${strength!.toFixed(2)} of 1`,
      figures: { ...figures, peakMonth: input.peakMonth },
    };
  }
  if (isTrend && Math.abs(growthPerYear!) >= MEANINGFUL_GROWTH_PER_YEAR) {
    const isRising = growthPerYear! > 0;
    return {
      verdict: isRising ? 'rising' : 'fading',
      reason: `${isRising ? 'rising' : 'fading'}: about ${percent(growthPerYear!)} a year after the season is taken out, a clear trend rather than chance${seasonNote}`,
      figures,
    };
  }
  return {
    verdict: 'steady',
    // Without a clear trend no growth figure is given: the board shows none beside "steady" either.
    reason:
      growthPerYear === null
        ? 'steady: no movement to measure'
        : isTrend
          ? `steady: about ${percent(growthPerYear)} a year, too little to matter`
          : 'steady: no clear trend; the ups and downs could be chance',
    figures,
  };
}

/**
 * Robust z of the highest of the last k values against the year before them, when it is the only
 * one of the last k standing out (z ≥ 2); null when there is no lone jump. The scale has a floor
 * of 10 % of the median so a flat baseline does not make every wobble a spike.
 */
export function recentSpikeZ(values: number[], k: number, m: number): number | null {
  const baseline = values.slice(Math.max(0, values.length - k - m), values.length - k);
  if (baseline.length < 2 * k) return null;
  const centre = median(baseline);
  const scale = Math.max(1.4826 * medianAbsoluteDeviation(baseline), 0.1 * Math.abs(centre), 1e-9);
  const zs = values.slice(-k).map((value) => (value - centre) / scale);
  const highest = Math.max(...zs);
  const standingOut = zs.filter((z) => z >= 2).length;
  return highest >= SPIKE_Z && standingOut === 1 ? highest : null;
}
