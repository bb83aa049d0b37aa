import {
  HEAT_WEIGHTS,
  NEUTRAL_PART,
  combineHeat,
  daysUntil,
  leadRoomPart,
  risePart,
  salesPullPart,
  seasonLiftPart,
} from './heat';
import type { MannKendall, Point } from './types';

// The part rules are our own (docs/decisions/0002-heat-weights.md), so these checks are worked
// by hand from the rules' formulas rather than against a published source.
const significant: MannKendall = { S: 40, varS: 100, z: 3.9, p: 0.0001, tau: 0.6 };
const notSignificant: MannKendall = { S: 4, varS: 100, z: 0.3, p: 0.76, tau: 0.06 };

describe('HEAT_WEIGHTS', () => {
  it('when the weights are added, then they make 1 so heat stays on 0–100', () => {
    const total =
      HEAT_WEIGHTS.rise + HEAT_WEIGHTS.seasonLift + HEAT_WEIGHTS.leadRoom + HEAT_WEIGHTS.salesPull;
    expect(total).toBeCloseTo(1, 12);
  });
});

describe('risePart', () => {
  it.each([
    // 1 % a month × 12 = 12 % a year → 50 + 50·0.12 = 56.
    { name: '+1 %/month, significant', slopePct: 1, m: 12, trend: significant, expected: 56 },
    // Not significant: the shift of 6 is halved → 53.
    {
      name: '+1 %/month, not significant',
      slopePct: 1,
      m: 12,
      trend: notSignificant,
      expected: 53,
    },
    // −0.5 % a week × 52 = −26 % a year → 50 − 13 = 37.
    { name: '−0.5 %/week, significant', slopePct: -0.5, m: 52, trend: significant, expected: 37 },
    // +10 % a month = +120 % a year, capped at +100 % → 100.
    { name: 'a steep rise', slopePct: 10, m: 12, trend: significant, expected: 100 },
    { name: 'no slope', slopePct: null, m: 12, trend: null, expected: NEUTRAL_PART },
  ])('when the rise is $name, then the part is $expected', ({ slopePct, m, trend, expected }) => {
    expect(risePart(slopePct, m, trend)).toBeCloseTo(expected, 10);
  });
});

describe('seasonLiftPart', () => {
  it.each([
    { lift: 0.2, expected: 70 }, // 50 + 100·0.2
    { lift: -0.1, expected: 40 }, // 50 − 10
    { lift: 0.8, expected: 100 }, // capped
    { lift: -0.9, expected: 0 }, // capped
    { lift: null, expected: 50 },
  ])('when the lift is $lift, then the part is $expected', ({ lift, expected }) => {
    expect(seasonLiftPart(lift)).toBeCloseTo(expected, 10);
  });
});

describe('leadRoomPart', () => {
  it.each([
    { days: 21, runway: 42, expected: 25 }, // q = 0.5 → 100·0.25
    { days: 42, runway: 42, expected: 100 }, // q = 1
    { days: 84, runway: 42, expected: 100 }, // q = 2
    { days: 168, runway: 42, expected: 50 }, // q = 4 → 100·2/4
    { days: 0, runway: 42, expected: 0 }, // the target is today
    { days: -5, runway: 42, expected: 0 }, // the target has passed
    { days: null, runway: 42, expected: 50 }, // no target
  ])(
    'when $days days are left for a $runway-day runway, then the part is $expected',
    ({ days, runway, expected }) => {
      expect(leadRoomPart(days, runway)).toBeCloseTo(expected, 10);
    },
  );

  it('when counting days to a target across a leap day, then February 29 counts', () => {
    expect(daysUntil('2024-02-01', '2024-03-01')).toBe(29);
  });
});

describe('salesPullPart', () => {
  const december = { from: '2024-12-01', to: '2024-12-31' };
  const monthly = (values: number[], fromYear = 2023): Point[] =>
    values.map((value, index) => ({
      date: `${fromYear + Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}-15`,
      value,
    }));

  it('when December sells three times an average month, then the part is capped at 100', () => {
    // 2023: 11 months of 10 and December 40 → mean 150/12 = 12.5; December 40 → ratio 3.2 → 100.
    const sales = monthly([10, 10, 10, 10, 10, 10, 10, 10, 10, 10, 10, 40]);
    const result = salesPullPart(sales, december, '2024-01-01');
    expect(result.ratio).toBeCloseTo(3.2, 10);
    expect(result.part).toBe(100);
  });

  it('when the target months sell like any other, then the part is 50', () => {
    expect(salesPullPart(monthly(new Array(12).fill(5)), december, '2024-01-01').part).toBeCloseTo(
      50,
      10,
    );
    // Five months later Jan–May 2024 sold nothing: mean 60/17, December 5 → 50·5·17/60 ≈ 70.8.
    expect(salesPullPart(monthly(new Array(12).fill(5)), december, '2024-06-01').part).toBeCloseTo(
      (50 * 5 * 17) / 60,
      10,
    );
  });

  it('when months without sales fall inside the span, then they count as 0', () => {
    // Sales only in 2023-01 (12) and 2023-12 (6); span Jan–Dec 2023 has 12 months totalling 18,
    // mean 1.5; December mean 6 → ratio 4 → part capped at 100. Target June: 0 → part 0.
    const sales: Point[] = [
      { date: '2023-01-10', value: 12 },
      { date: '2023-12-10', value: 6 },
    ];
    expect(salesPullPart(sales, december, '2024-01-05').ratio).toBeCloseTo(4, 10);
    expect(salesPullPart(sales, { from: '2024-06-01', to: '2024-06-30' }, '2024-01-05').part).toBe(
      0,
    );
  });

  it('when sales are from today or later, then they are not counted', () => {
    const sales: Point[] = [{ date: '2024-06-03', value: 99 }];
    expect(salesPullPart(sales, december, '2024-06-05')).toEqual({ part: 50, ratio: null });
  });

  it.each([
    { name: 'no sales', sales: undefined },
    { name: 'an empty list', sales: [] as Point[] },
    { name: 'only nulls', sales: [{ date: '2023-01-01', value: null }] as Point[] },
    { name: 'only zeros', sales: [{ date: '2023-12-01', value: 0 }] as Point[] },
  ])('when the studio has $name, then the part is neutral', ({ sales }) => {
    expect(salesPullPart(sales, december, '2024-06-01').part).toBe(50);
  });

  it('when there is no target, then the part is neutral', () => {
    expect(salesPullPart(monthly([1, 2, 3]), null, '2024-06-01').part).toBe(50);
  });
});

describe('combineHeat', () => {
  it('when the parts are given, then each contribution is weight × part and they add to heat', () => {
    // 0.35·80 + 0.30·60 + 0.20·100 + 0.15·50 = 28 + 18 + 20 + 7.5 = 73.5.
    const { heat, contributions } = combineHeat({
      rise: 80,
      seasonLift: 60,
      leadRoom: 100,
      salesPull: 50,
    });
    expect(contributions).toEqual({ rise: 28, seasonLift: 18, leadRoom: 20, salesPull: 7.5 });
    expect(heat).toBeCloseTo(73.5, 12);
  });

  it('when every part is neutral, then heat is 50', () => {
    expect(combineHeat({ rise: 50, seasonLift: 50, leadRoom: 50, salesPull: 50 }).heat).toBeCloseTo(
      50,
      12,
    );
  });
});
