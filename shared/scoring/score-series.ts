// scoreSeries: the whole Score of one series, from raw points to heat and verdict (DESIGN §5).

import { MONTH_NAMES, monthOfYear } from './calendar-days';
import { chooseModel, decompose, seasonallyAdjust, seasonalStrength } from './decompose';
import {
  DEFAULT_RUNWAY_DAYS,
  combineHeat,
  daysUntil,
  leadRoomPart,
  risePart,
  salesPullPart,
  seasonLiftPart,
} from './heat';
import { regularise } from './regularise';
import { comparisonLength, computeRise, yearOverYear } from './rise';
import { nextPeakPeriod, peakPosition, periodEnd, periodStart, seasonLift } from './season';
import type { DateWindow, Point, Score, ScoreOptions, Seasonal } from './types';
import { decideVerdict } from './verdict';

export function scoreSeries(points: Point[], options: ScoreOptions): Score {
  const isSales = options.kind === 'sales';
  const regular = regularise(points, options.period, {
    isMissingZero: isSales,
    coveredUntil: options.coveredUntil,
  });
  const { period, m } = regular;
  const notes = [...regular.notes];
  // Decomposition needs evenly spaced values, so after a long gap only the stretch since is used.
  const lastGapEnd = regular.values.lastIndexOf(null);
  const values = regular.values.slice(lastGapEnd + 1) as number[];
  const dates = regular.dates.slice(lastGapEnd + 1);
  if (lastGapEnd >= 0) {
    notes.push(
      `only the ${values.length} periods since the last long gap (from ${dates[0]}) are scored`,
    );
  }
  const k = comparisonLength(period);

  const model = chooseModel(values);
  const result = decompose(values, m, model);
  const decomposition = result.decomposition;
  if (decomposition === null) {
    notes.push(`not enough history for seasonality: ${result.periodsNeeded} more periods needed`);
  }
  const additive =
    decomposition === null
      ? null
      : model === 'additive'
        ? decomposition
        : decompose(values, m, 'additive').decomposition;
  const strength = additive ? seasonalStrength(additive) : null;
  const adjusted = decomposition ? seasonallyAdjust(values, decomposition) : values;
  const rise = computeRise(adjusted, m, k);
  const yoy = yearOverYear(values, k, m);

  let seasonal: Seasonal | null = null;
  let peakWindow: DateWindow | null = null;
  if (decomposition !== null && values.length > 0) {
    const position = peakPosition(decomposition.indices);
    const t = nextPeakPeriod(dates[0], period, m, position, options.today);
    peakWindow = { from: periodStart(dates[0], period, t), to: periodEnd(dates[0], period, t) };
    seasonal = {
      model,
      period: m,
      indices: decomposition.indices,
      strength: strength ?? 0,
      peakPosition: position,
      nextPeak: peakWindow.from,
    };
  }

  // Without a chosen target the natural one is the next peak: is it worth building for it?
  const target = options.target ?? peakWindow;
  const runwayDays = options.runwayDays ?? DEFAULT_RUNWAY_DAYS;
  const lift =
    decomposition !== null && target !== null
      ? seasonLift(decomposition, values, dates[0], period, target)
      : null;
  const sales = salesPullPart(options.salesPull, target, options.today);
  const parts = {
    rise: risePart(rise.slopePct, m, rise.mannKendall),
    seasonLift: seasonLiftPart(lift),
    leadRoom: leadRoomPart(target ? daysUntil(options.today, target.from) : null, runwayDays),
    salesPull: sales.part,
  };
  const combined = combineHeat(parts);

  const peakMonth = peakWindow ? MONTH_NAMES[monthOfYear(peakWindow.from)] : null;
  const verdict = decideVerdict({
    period,
    periodsUsed: values.length,
    m,
    k,
    adjusted,
    rise,
    strength,
    peakMonth,
  });
  const hasVerdict = verdict.verdict !== 'not-enough-history';
  return {
    // Parts of a series this short are mostly neutral 50s; a heat would rank it among real ones.
    heat: hasVerdict ? combined.heat : null,
    parts,
    contributions: combined.contributions,
    verdict: verdict.verdict,
    yoy,
    rise,
    seasonal,
    explanation: {
      reason: verdict.reason,
      figures: { ...verdict.figures, salesRatio: sales.ratio, runwayDays },
      notes,
      gaps: regular.gaps,
      periodsUsed: values.length,
      periodsWithoutSales: isSales ? values.filter((value) => value === 0).length : null,
      seasonalPeriodsNeeded: result.periodsNeeded,
      target,
      seasonLiftFraction: lift,
    },
  };
}
