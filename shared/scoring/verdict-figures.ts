// The figures shown beside a verdict. They are the very figures the verdict rule read, in its own
// measure (growth a year after the season is taken out, judged by Mann–Kendall), so the board can
// never say "Fading" beside a rising number. The client formats them; it never picks others.

import { TREND_SIGNIFICANCE } from './heat';
import type { Score } from './types';

export interface VerdictFigures {
  /**
   * Growth a year when the trend test tells it from chance; null when there is no verdict yet, no
   * slope, or no clear trend. Rising means at least +10 %, fading at most −10 %.
   */
  risePerYear: number | null;
  /** Whether a slope was measured but the trend test cannot tell it from chance. */
  isRiseUnclear: boolean;
  /** Seasonal strength F, 0 to 1; "seasonal" needs 0.6. */
  seasonalStrength: number | null;
  /** Periods still needed before there is a verdict (and a heat); 0 once there is one. */
  periodsNeeded: number;
}

export function verdictFigures(score: Score): VerdictFigures {
  const needed = Number(score.explanation.figures['periodsNeeded'] ?? 0);
  if (score.verdict === 'not-enough-history') {
    return {
      risePerYear: null,
      isRiseUnclear: false,
      seasonalStrength: null,
      periodsNeeded: needed,
    };
  }
  const growth = score.rise.growthPerYear;
  const p = score.rise.mannKendall?.p ?? null;
  const isClear = growth !== null && p !== null && p < TREND_SIGNIFICANCE;
  return {
    risePerYear: isClear ? growth : null,
    isRiseUnclear: growth !== null && !isClear,
    seasonalStrength: score.seasonal?.strength ?? null,
    periodsNeeded: 0,
  };
}
