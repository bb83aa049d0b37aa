// Issue 23, "trend numbers": sales series are scored with weeks without a sale as 0 sold, and a
// series without a verdict has no heat. The random file and the sporadic item are invented data
// from a seeded generator (tests/fixtures/scoring/random-sales.ts); the verdict thresholds are
// docs/decisions/0002 (ours), the trend test Mann–Kendall as checked in trend-statistics.spec.ts.
import {
  RANDOM_SALES_SEED,
  randomSalesAsStored,
  randomWeeklyUnits,
} from '../../tests/fixtures/scoring/random-sales';
import { lcg } from '../seeded-random';
import { scoreSeries } from './score-series';
import type { Point } from './types';
import { verdictFigures } from './verdict-figures';

const today = '2026-01-05';

/** 150 weeks from Monday 2023-01-02: 1–3 units in about three weeks of four, none in weeks 141–144. */
function sporadicItem(): Point[] {
  const random = lcg(5);
  const start = Date.UTC(2023, 0, 2);
  const points: Point[] = [];
  for (let week = 0; week < 150; week++) {
    const sells = random() < 0.78 && !(week >= 141 && week <= 144);
    const units = 1 + Math.floor(random() * 3);
    const date = new Date(start + week * 7 * 86_400_000).toISOString().slice(0, 10);
    if (sells) points.push({ date, value: units });
  }
  return points;
}

describe('scoreSeries of sales', () => {
  it('when an item sells 0 to 3 a week at random for three years, then it reads steady with no rise', () => {
    const stored = randomSalesAsStored();
    const weeks = randomWeeklyUnits();
    expect(RANDOM_SALES_SEED).toBe(2);
    expect(stored).toHaveLength(123);
    // Read as interest (missing weeks interpolated, the series cut at a 5-week run without
    // sales), this file came out "rising" with the board's old rise (last 4 weeks against the 4
    // before) at +68 % and year over year +43 %.
    const asInterest = scoreSeries(stored, { period: 'weekly', today });
    expect(asInterest.verdict).toBe('rising');
    expect(asInterest.rise.recentChange).toBeCloseTo(0.684, 3);
    expect(asInterest.yoy).toBeCloseTo(0.429, 3);

    const score = scoreSeries(stored, { period: 'weekly', today, kind: 'sales' });
    expect(score.verdict).toBe('steady');
    expect(score.explanation.reason).toBe(
      'steady: no clear trend; the ups and downs could be chance',
    );
    expect(verdictFigures(score)).toMatchObject({ risePerYear: null, isRiseUnclear: true });
    // Every week from the first sale to the last is on the grid; those without a sale are 0.
    const firstSale = weeks.findIndex((week) => (week.value ?? 0) > 0);
    const lastSale =
      weeks.length - 1 - [...weeks].reverse().findIndex((week) => (week.value ?? 0) > 0);
    const inRange = weeks.slice(firstSale, lastSale + 1);
    expect(score.explanation.periodsUsed).toBe(inRange.length);
    const soldNothing = inRange.filter((week) => week.value === 0).length;
    expect(score.explanation.periodsWithoutSales).toBe(soldNothing);
    expect(score.explanation.gaps).toEqual([]);
  });

  it('when the sales files run past the last sale, then the weeks after it count as 0 sold', () => {
    const stored = randomSalesAsStored();
    const score = scoreSeries(stored, {
      period: 'weekly',
      today,
      kind: 'sales',
      coveredUntil: '2025-12-28',
    });
    // 2023-01-02 + 156 weeks − 1 day = Sunday 2025-12-28: every week from the first sale (the
    // file's second week; the first sold nothing) to the end of the three years is on the grid.
    expect(stored[0].date).toBe('2023-01-09');
    expect(score.explanation.periodsUsed).toBe(155);
    expect(score.explanation.periodsWithoutSales).toBe(155 - stored.length);
  });

  it('when an item sold sporadically over three years, then it has a verdict and a heat', () => {
    const points = sporadicItem();
    expect(points).toHaveLength(115);
    // Read as interest, the four weeks without sales near the end cut the series to its last 5
    // weeks: "not enough history".
    expect(scoreSeries(points, { period: 'weekly', today }).verdict).toBe('not-enough-history');
    const score = scoreSeries(points, { period: 'weekly', today, kind: 'sales' });
    expect(score.verdict).not.toBe('not-enough-history');
    expect(score.heat).not.toBeNull();
    expect(score.explanation.periodsUsed).toBe(150);
    expect(score.explanation.periodsWithoutSales).toBe(35);
  });

  it('when a search-interest series is scored, then nothing is counted as no sales', () => {
    const score = scoreSeries(randomSalesAsStored(), { period: 'weekly', today, kind: 'interest' });
    expect(score.explanation.periodsWithoutSales).toBeNull();
    expect(score).toEqual(scoreSeries(randomSalesAsStored(), { period: 'weekly', today }));
  });
});

describe('scoreSeries without enough history', () => {
  it('when there are 8 weeks, then there is no heat and the reason says how many more are needed', () => {
    const points = Array.from({ length: 8 }, (_, week) => ({
      date: new Date(Date.UTC(2025, 10, 3 + 7 * week)).toISOString().slice(0, 10),
      value: 20 + week,
    }));
    const score = scoreSeries(points, { period: 'weekly', today });
    expect(score.verdict).toBe('not-enough-history');
    // 13 weeks are needed for a verdict (MIN_PERIODS_FOR_VERDICT, ours): 5 more.
    expect(score.heat).toBeNull();
    expect(score.explanation.reason).toBe('not enough history: 5 more weeks needed for a verdict');
    expect(verdictFigures(score)).toEqual({
      risePerYear: null,
      isRiseUnclear: false,
      seasonalStrength: null,
      periodsNeeded: 5,
    });
  });
});
