// Heat: one 0–100 figure from four 0–100 parts. The weights and the part rules are ours, not a
// published method; docs/decisions/0002-heat-weights.md says why they are what they are.

import { toDayNumber, toMonthNumber } from './calendar-days';
import type { DateWindow, HeatParts, MannKendall, Point } from './types';

/** The one place the weights live; they add up to 1 so heat stays on the parts' 0–100 scale. */
export const HEAT_WEIGHTS: Readonly<HeatParts> = Object.freeze({
  rise: 0.35,
  seasonLift: 0.3,
  leadRoom: 0.2,
  salesPull: 0.15,
});

/** A studio's runway before runways are planned: six weeks (issue 4). */
export const DEFAULT_RUNWAY_DAYS = 42;

/** A part with no evidence either way sits in the middle, so it neither lifts nor sinks heat. */
export const NEUTRAL_PART = 50;

/** Mann–Kendall p below this counts as a real trend. */
export const TREND_SIGNIFICANCE = 0.05;

const clampPart = (value: number): number => Math.min(100, Math.max(0, value));

/**
 * Rise part: 50 + 50 × growth per year, where growth per year = slopePct × m / 100; +100 % a year
 * or more is 100, −100 % is 0. Without a significant Mann–Kendall trend the distance from 50 is
 * halved, because an OLS slope alone is easily tipped by a few odd periods.
 */
export function risePart(slopePct: number | null, m: number, trend: MannKendall | null): number {
  if (slopePct === null) return NEUTRAL_PART;
  const growthPerYear = (slopePct * m) / 100;
  const isSignificant = trend !== null && trend.p < TREND_SIGNIFICANCE;
  const shift = 50 * Math.max(-1, Math.min(1, growthPerYear));
  return clampPart(NEUTRAL_PART + (isSignificant ? shift : shift / 2));
}

/** Season-lift part: 50 + 100 × lift; a window 50 % above an average period scores 100. */
export function seasonLiftPart(lift: number | null): number {
  return lift === null ? NEUTRAL_PART : clampPart(NEUTRAL_PART + 100 * lift);
}

/**
 * Lead-room part from q = days until the target / runway days: q < 1 (the runway would have to
 * start in the past) scores 100 × q², so being a little short costs little and half the time
 * costs three quarters; 1 ≤ q ≤ 2 is the best moment to start, 100; beyond that 100 × 2 / q,
 * since a far target leaves time for the trend to turn.
 */
export function leadRoomPart(daysUntilTarget: number | null, runwayDays: number): number {
  if (daysUntilTarget === null || runwayDays <= 0) return NEUTRAL_PART;
  if (daysUntilTarget <= 0) return 0;
  const q = daysUntilTarget / runwayDays;
  if (q < 1) return 100 * q * q;
  if (q <= 2) return 100;
  return (100 * 2) / q;
}

/**
 * Sales-pull part from the studio's own sales of linked items: the mean units per month in the
 * target's months of the year against the mean units per month over all months sold, counting
 * months without sales as 0, from the first sale up to the month before today. As good as an
 * average month is 50, twice as good or better 100, nothing sold in those months 0. No sales
 * history, or none covering the target's months, is neutral: a new product line has no evidence.
 */
export function salesPullPart(
  sales: Point[] | undefined,
  target: DateWindow | null,
  today: string,
): { part: number; ratio: number | null } {
  const ratio = salesSeasonRatio(sales ?? [], target, today);
  return { part: ratio === null ? NEUTRAL_PART : clampPart(50 * ratio), ratio };
}

function salesSeasonRatio(sales: Point[], target: DateWindow | null, today: string): number | null {
  if (target === null) return null;
  const lastMonth = toMonthNumber(today) - 1;
  const unitsByMonth = new Map<number, number>();
  for (const sale of sales) {
    if (sale.value === null || !Number.isFinite(sale.value)) continue;
    const month = toMonthNumber(sale.date);
    if (month > lastMonth) continue;
    unitsByMonth.set(month, (unitsByMonth.get(month) ?? 0) + sale.value);
  }
  if (unitsByMonth.size === 0) return null;
  const targetMonthsOfYear = new Set<number>();
  for (let month = toMonthNumber(target.from); month <= toMonthNumber(target.to); month++) {
    targetMonthsOfYear.add(((month % 12) + 12) % 12);
  }
  let allUnits = 0;
  let allMonths = 0;
  let targetUnits = 0;
  let targetMonths = 0;
  for (let month = Math.min(...unitsByMonth.keys()); month <= lastMonth; month++) {
    const units = unitsByMonth.get(month) ?? 0;
    allUnits += units;
    allMonths++;
    if (targetMonthsOfYear.has(((month % 12) + 12) % 12)) {
      targetUnits += units;
      targetMonths++;
    }
  }
  if (targetMonths === 0 || allUnits <= 0) return null;
  return targetUnits / targetMonths / (allUnits / allMonths);
}

/** Heat = Σ weight × part, with each contribution kept so the UI can show it. */
export function combineHeat(parts: HeatParts): { heat: number; contributions: HeatParts } {
  const contributions: HeatParts = {
    rise: HEAT_WEIGHTS.rise * parts.rise,
    seasonLift: HEAT_WEIGHTS.seasonLift * parts.seasonLift,
    leadRoom: HEAT_WEIGHTS.leadRoom * parts.leadRoom,
    salesPull: HEAT_WEIGHTS.salesPull * parts.salesPull,
  };
  const heat =
    contributions.rise +
    contributions.seasonLift +
    contributions.leadRoom +
    contributions.salesPull;
  return { heat, contributions };
}

/** Whole days from today to the target's first day. */
export function daysUntil(today: string, date: string): number {
  return toDayNumber(date) - toDayNumber(today);
}
