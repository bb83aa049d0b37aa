import airPassengersFigures from '../../tests/fixtures/scoring/airpassengers_decompose.json';
import airPassengers from '../../tests/fixtures/scoring/airpassengers-series.json';
import publishedIndices from '../../tests/fixtures/scoring/airpassengers_seasonal_indices.json';
import { scoreSeries } from './score-series';
import type { Point } from './types';
import { lcg } from '../seeded-random';

const airPoints: Point[] = airPassengers.months.map((month, index) => ({
  date: `${month}-01`,
  value: airPassengers.passengers[index],
}));

/** Weekly points from Monday 2020-01-06 valued by `valueOf(week)`. */
function weekly(count: number, valueOf: (week: number) => number | null): Point[] {
  const start = Date.UTC(2020, 0, 6);
  return Array.from({ length: count }, (_, week) => ({
    date: new Date(start + week * 7 * 86_400_000).toISOString().slice(0, 10),
    value: valueOf(week),
  }));
}

// A seeded linear congruential generator (Numerical Recipes constants) so noise is repeatable.
const nextNoise = lcg(12345);

/** Monthly points from January 2020. */
function monthly(values: (number | null)[]): Point[] {
  return values.map((value, index) => ({
    date: `${2020 + Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}-01`,
    value,
  }));
}

describe('scoreSeries on AirPassengers', () => {
  const score = scoreSeries(airPoints, { period: 'monthly', today: '1960-12-31' });

  it('when scored, then the seasonal part is the published multiplicative decomposition', () => {
    // Source: R decompose() / statsmodels seasonal_decompose (airpassengers_seasonal_indices.json)
    // and peak "Jul", next peak "1961-07", strength on the additive model (airpassengers_decompose.json).
    expect(score.seasonal!.model).toBe('multiplicative');
    expect(score.seasonal!.period).toBe(12);
    Object.values(publishedIndices.multiplicative).forEach((figure, position) =>
      expect(score.seasonal!.indices[position]).toBeCloseTo(figure, 6),
    );
    expect(score.seasonal!.strength).toBeCloseTo(
      airPassengersFigures.additive.seasonal_strength_FPP,
      10,
    );
    expect(score.seasonal!.peakPosition).toBe(6);
    expect(score.seasonal!.nextPeak.slice(0, 7)).toBe(
      airPassengersFigures.next_peak_after_last_obs,
    );
  });

  it('when scored, then yoy is the last quarter against the same quarter a year before', () => {
    // Oct–Dec 1960 = 1283 against Oct–Dec 1959 = 1174 (Series G values).
    expect(score.yoy).toBeCloseTo(1283 / 1174 - 1, 12);
  });

  it('when scored without a target, then the target is the next peak month and the verdict seasonal', () => {
    expect(score.explanation.target).toEqual({ from: '1961-07-01', to: '1961-07-31' });
    // Lift = July index − 1 = 0.2265555 (R decompose()); part = 50 + 22.65555 = 72.65555.
    expect(score.parts.seasonLift).toBeCloseTo(72.65555429312012, 8);
    // 182 days from 1960-12-31 to 1961-07-01, runway 42: q = 4.33 → 100·2/q = 46.15.
    expect(score.parts.leadRoom).toBeCloseTo((100 * 2 * 42) / 182, 10);
    expect(score.verdict).toBe('seasonal');
    expect(score.explanation.reason).toContain('peaks in July');
  });

  it('when scored, then heat is the sum of the contributions and between 0 and 100', () => {
    const { contributions } = score;
    const total =
      contributions.rise +
      contributions.seasonLift +
      contributions.leadRoom +
      contributions.salesPull;
    expect(score.heat).toBeCloseTo(total, 12);
    expect(score.heat).toBeGreaterThan(0);
    expect(score.heat).toBeLessThan(100);
  });

  it('when a target is given, then lift and lead room are judged against it', () => {
    // November index 0.8011781 (R decompose()) → lift −0.1988; part 50 − 19.88 = 30.12.
    const november = scoreSeries(airPoints, {
      period: 'monthly',
      today: '1961-09-01',
      target: { from: '1961-11-01', to: '1961-11-30' },
      runwayDays: 30,
    });
    expect(november.parts.seasonLift).toBeCloseTo(50 + 100 * (0.8011780824134743 - 1), 8);
    // 61 days for a 30-day runway: q = 2.03 → 100·2/q = 98.36.
    expect(november.parts.leadRoom).toBeCloseTo((100 * 2 * 30) / 61, 10);
  });
});

describe('scoreSeries verdicts', () => {
  it.each([
    {
      name: 'grows 1 % a week with no season',
      points: weekly(120, (week) => 100 * 1.01 ** week),
      verdict: 'rising',
    },
    {
      name: 'shrinks 1 % a week with no season',
      points: weekly(120, (week) => 1000 * 0.99 ** week),
      verdict: 'fading',
    },
    {
      // Five years, so that noise is not mistaken for a season (with two cycles each position's
      // index is the mean of two noisy values and F for pure noise is near 0.5).
      name: 'is flat with noise',
      points: weekly(260, () => 100 + 10 * (nextNoise() - 0.5)),
      verdict: 'steady',
    },
    {
      name: 'jumps once in the last week',
      points: weekly(80, (week) => (week === 79 ? 400 : 100 + (week % 3))),
      verdict: 'spike',
    },
    {
      name: 'repeats a yearly wave over three years',
      points: weekly(156, (week) => 100 + 40 * Math.sin((2 * Math.PI * week) / 52)),
      verdict: 'seasonal',
    },
    {
      name: 'has eight weeks',
      points: weekly(8, (week) => week + 1),
      verdict: 'not-enough-history',
    },
  ])('when a weekly series $name, then the verdict is $verdict', ({ points, verdict }) => {
    const score = scoreSeries(points, { period: 'weekly', today: '2023-01-02' });
    expect(score.verdict).toBe(verdict);
    expect(
      score.explanation.reason.startsWith(
        verdict === 'not-enough-history' ? 'not enough history' : verdict,
      ),
    ).toBe(true);
  });

  it('when a weekly series has eight weeks, then it says how many more periods are needed', () => {
    const score = scoreSeries(
      weekly(8, (week) => week + 1),
      { period: 'weekly', today: '2023-01-02' },
    );
    expect(score.explanation.reason).toBe('not enough history: 5 more weeks needed for a verdict');
    expect(score.explanation.seasonalPeriodsNeeded).toBe(104 - 8);
    expect(score.explanation.notes).toContain(
      'not enough history for seasonality: 96 more periods needed',
    );
    expect(score.seasonal).toBeNull();
  });
});

describe('scoreSeries edge cases', () => {
  it('when there are no points, then everything that needs data is null, heat too, and parts are neutral', () => {
    const score = scoreSeries([], { period: 'weekly', today: '2024-01-01' });
    expect(score.verdict).toBe('not-enough-history');
    expect(score.rise).toEqual({
      recentChange: null,
      slopePct: null,
      growthPerYear: null,
      mannKendall: null,
      senSlope: null,
    });
    expect(score.yoy).toBeNull();
    expect(score.seasonal).toBeNull();
    // Issue 23: no heat without a verdict; the parts stay, all at the neutral 50.
    expect(score.heat).toBeNull();
    expect(score.parts).toEqual({ rise: 50, seasonLift: 50, leadRoom: 50, salesPull: 50 });
  });

  it('when there is one point, then it is not enough history', () => {
    const score = scoreSeries([{ date: '2024-01-01', value: 5 }], {
      period: 'monthly',
      today: '2024-02-01',
    });
    expect(score.verdict).toBe('not-enough-history');
    expect(score.explanation.seasonalPeriodsNeeded).toBe(23);
  });

  it('when the series is constant, then it is steady with no season', () => {
    const score = scoreSeries(monthly(new Array(36).fill(8)), {
      period: 'monthly',
      today: '2023-01-01',
    });
    expect(score.verdict).toBe('steady');
    expect(score.rise.recentChange).toBe(0);
    expect(score.rise.slopePct).toBeCloseTo(0, 12);
    expect(score.rise.mannKendall).toEqual({ S: 0, varS: 0, z: 0, p: 1, tau: 0 });
    expect(score.seasonal!.strength).toBe(0);
    expect(score.yoy).toBe(0);
  });

  it('when the series is all zeros, then ratios are null and it is steady', () => {
    const score = scoreSeries(monthly(new Array(30).fill(0)), {
      period: 'monthly',
      today: '2023-01-01',
    });
    expect(score.seasonal!.model).toBe('additive');
    expect(score.rise.recentChange).toBeNull();
    expect(score.rise.slopePct).toBeNull();
    expect(score.yoy).toBeNull();
    expect(score.verdict).toBe('steady');
  });

  it('when there are exactly two cycles, then seasonality is estimated', () => {
    const score = scoreSeries(monthly(Array.from({ length: 24 }, (_, i) => 10 + (i % 12))), {
      period: 'monthly',
      today: '2022-01-01',
    });
    expect(score.seasonal).not.toBeNull();
    expect(score.explanation.seasonalPeriodsNeeded).toBe(0);
    // Peak at position 11 (December, value 21): the next December after 2022-01-01.
    expect(score.seasonal!.peakPosition).toBe(11);
    expect(score.seasonal!.nextPeak).toBe('2022-12-01');
  });

  it('when one period short of two cycles, then it asks for one more', () => {
    const score = scoreSeries(monthly(new Array(23).fill(3)), {
      period: 'monthly',
      today: '2022-01-01',
    });
    expect(score.seasonal).toBeNull();
    expect(score.explanation.seasonalPeriodsNeeded).toBe(1);
  });

  it('when values are negative, then the additive model is chosen', () => {
    const values = Array.from({ length: 36 }, (_, i) => -5 + 3 * Math.cos((2 * Math.PI * i) / 12));
    expect(
      scoreSeries(monthly(values), { period: 'monthly', today: '2023-01-01' }).seasonal!.model,
    ).toBe('additive');
  });

  it('when a gap is short, then it is filled; when long, the stretch after it is scored', () => {
    const short = monthly([1, 2, null, null, 5, 6, 7, 8]);
    expect(
      scoreSeries(short, { period: 'monthly', today: '2021-01-01' }).explanation.periodsUsed,
    ).toBe(8);
    const long = monthly([1, 2, null, null, null, 6, 7, 8, 9, 10, 11, 12]);
    const score = scoreSeries(long, { period: 'monthly', today: '2021-01-01' });
    expect(score.explanation.gaps).toEqual([{ from: '2020-03-01', to: '2020-05-01', periods: 3 }]);
    expect(score.explanation.periodsUsed).toBe(7);
    expect(score.explanation.notes.some((note) => note.includes('since the last long gap'))).toBe(
      true,
    );
  });

  it('when daily points are given, then they are summed to ISO weeks first', () => {
    // 2020-01-06 is a Monday; 14 days of 1 → two weeks of 7.
    const days = Array.from({ length: 14 }, (_, day) => ({
      date: new Date(Date.UTC(2020, 0, 6 + day)).toISOString().slice(0, 10),
      value: 1,
    }));
    const score = scoreSeries(days, { period: 'daily', today: '2020-02-01' });
    expect(score.explanation.periodsUsed).toBe(2);
  });

  it('when sales of linked items are given, then sales pull uses them', () => {
    const sales: Point[] = [
      { date: '1959-07-10', value: 30 },
      { date: '1959-12-10', value: 6 },
    ];
    // The span runs from July 1959 to November 1960, the month before today: 17 months, 36 units.
    // The target July 1961 covers July 1959 and July 1960: (30 + 0)/2 = 15 against 36/17 → ratio
    // 7.08, capped at part 100.
    const score = scoreSeries(airPoints, {
      period: 'monthly',
      today: '1960-12-31',
      salesPull: sales,
    });
    expect(score.parts.salesPull).toBe(100);
    expect(score.explanation.figures['salesRatio']).toBeCloseTo(15 / (36 / 17), 10);
  });
});
