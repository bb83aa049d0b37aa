import airPassengersFigures from '../../tests/fixtures/scoring/airpassengers_decompose.json';
import airPassengers from '../../tests/fixtures/scoring/airpassengers-series.json';
import { comparisonLength, computeRise, recentChange, slopePercent, yearOverYear } from './rise';

describe('recentChange', () => {
  it.each([
    // last 2 = 6, 6 (mean 6) against 4, 4 (mean 4): 6/4 − 1 = 0.5.
    { name: 'a rise from 4 to 6', values: [1, 4, 4, 6, 6], k: 2, expected: 0.5 },
    // 3, 3 against 6, 6: 3/6 − 1 = −0.5.
    { name: 'a fall from 6 to 3', values: [6, 6, 3, 3], k: 2, expected: -0.5 },
    { name: 'a constant series', values: [5, 5, 5, 5], k: 2, expected: 0 },
    { name: 'zeros before', values: [0, 0, 1, 1], k: 2, expected: null },
    { name: 'too few points', values: [1, 2, 3], k: 2, expected: null },
  ])('when the series is $name, then the change is $expected', ({ values, k, expected }) => {
    const change = recentChange(values, k);
    if (expected === null) expect(change).toBeNull();
    else expect(change).toBeCloseTo(expected, 12);
  });

  it('when the period is weekly or monthly, then k is 4 or 3 (DESIGN §5)', () => {
    expect(comparisonLength('weekly')).toBe(4);
    expect(comparisonLength('monthly')).toBe(3);
  });
});

describe('yearOverYear', () => {
  it('when 1960 is set against 1959 in AirPassengers, then it matches the yearly sums', () => {
    // Source: airpassengers_decompose.json yoy_1960_vs_1959_pct (11.167 %; 5714 against 5140).
    const yoy = yearOverYear(airPassengers.passengers, 12, 12)!;
    expect(yoy * 100).toBeCloseTo(airPassengersFigures.yoy_1960_vs_1959_pct, 10);
  });

  it('when the last quarter of AirPassengers is set against a year before, then it is worked', () => {
    // Oct–Dec 1960 = 461 + 390 + 432 = 1283; Oct–Dec 1959 = 407 + 362 + 405 = 1174 (Series G).
    expect(yearOverYear(airPassengers.passengers, 3, 12)).toBeCloseTo(1283 / 1174 - 1, 12);
  });

  it('when there is less than a year and k periods, then it is null', () => {
    expect(yearOverYear([1, 2, 3, 4], 3, 12)).toBeNull();
  });
});

describe('slopePercent', () => {
  it.each([
    // 10, 11, 12, 13: slope 1, mean 11.5 → 100/11.5 % per period.
    { name: 'rising by 1 from 10', values: [10, 11, 12, 13], m: 4, expected: 100 / 11.5 },
    // Only the last 3 are used (m = 3): 13, 12, 11 → slope −1, mean 12.
    { name: 'falling over the window', values: [1, 13, 12, 11], m: 3, expected: -100 / 12 },
    { name: 'a constant series', values: [2, 2, 2], m: 12, expected: 0 },
    // −10, −11, −12: slope −1, |mean| 11 → −9.09 %: the sign of the slope is kept.
    { name: 'negative values', values: [-10, -11, -12], m: 12, expected: -100 / 11 },
    { name: 'all zeros', values: [0, 0, 0], m: 12, expected: null },
    { name: 'two points', values: [1, 2], m: 12, expected: null },
  ])('when the series is $name, then slopePct is $expected', ({ values, m, expected }) => {
    const slope = slopePercent(values, m);
    if (expected === null) expect(slope).toBeNull();
    else expect(slope).toBeCloseTo(expected, 10);
  });
});

describe('computeRise', () => {
  it('when there is one point, then every figure is null', () => {
    expect(computeRise([5], 12, 3)).toEqual({
      recentChange: null,
      slopePct: null,
      growthPerYear: null,
      mannKendall: null,
      senSlope: null,
    });
  });

  it('when the series runs past 2m, then Mann–Kendall uses only the last 2m points', () => {
    // 30 points falling then 24 rising (m = 12): the window holds only the 24 rising ones,
    // so S = 24·23/2 = 276 and tau = 1.
    const values = [
      ...Array.from({ length: 30 }, (_, i) => 100 - i),
      ...Array.from({ length: 24 }, (_, i) => i),
    ];
    const rise = computeRise(values, 12, 3);
    expect(rise.mannKendall!.S).toBe(276);
    expect(rise.mannKendall!.tau).toBe(1);
    expect(rise.senSlope).toBe(1);
  });
});
