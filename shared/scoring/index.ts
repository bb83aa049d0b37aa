// The scoring API used by the server and the client; see DESIGN §5 "Scoring".
export * from './types';
export { regularise, sumDaysToWeeks, periodsPerYear, MAX_INTERPOLATED_PERIODS } from './regularise';
export type { RegularSeries, RegularPeriod, RegulariseOptions } from './regularise';
export {
  centredMovingAverage,
  chooseModel,
  decompose,
  seasonalStrength,
  seasonallyAdjust,
} from './decompose';
export type { Decomposition, DecompositionResult } from './decompose';
export {
  leastSquaresLine,
  mannKendall,
  senSlope,
  tieGroupSizes,
  twoSidedNormalP,
} from './trend-statistics';
export { comparisonLength, computeRise, recentChange, slopePercent, yearOverYear } from './rise';
export {
  nextPeakPeriod,
  peakPosition,
  periodEnd,
  periodIndexOf,
  periodStart,
  seasonLift,
} from './season';
export {
  DEFAULT_RUNWAY_DAYS,
  HEAT_WEIGHTS,
  NEUTRAL_PART,
  combineHeat,
  leadRoomPart,
  risePart,
  salesPullPart,
  seasonLiftPart,
} from './heat';
export { decideVerdict, recentSpikeZ } from './verdict';
export { scoreSeries } from './score-series';
export { scoreTheme, VERDICT_WORDS } from './score-theme';
export { verdictFigures } from './verdict-figures';
export type { VerdictFigures } from './verdict-figures';
export type { ThemeScore } from './score-theme';
