import { regularise, sumDaysToWeeks } from './regularise';
import type { Point } from './types';

/** Daily points from `from` for `days` days, valued by `valueOf(dayIndex)`. */
function dailyPoints(from: string, days: number, valueOf: (day: number) => number | null): Point[] {
  const start = Date.parse(`${from}T00:00:00Z`);
  return Array.from({ length: days }, (_, day) => ({
    date: new Date(start + day * 86_400_000).toISOString().slice(0, 10),
    value: valueOf(day),
  }));
}

describe('regularise', () => {
  it('when monthly points come unsorted, then they are sorted onto the first of each month', () => {
    const result = regularise(
      [
        { date: '2024-03-01', value: 3 },
        { date: '2024-01-01', value: 1 },
        { date: '2024-02-01', value: 2 },
      ],
      'monthly',
    );
    expect(result.dates).toEqual(['2024-01-01', '2024-02-01', '2024-03-01']);
    expect(result.values).toEqual([1, 2, 3]);
    expect(result.m).toBe(12);
  });

  it.each([
    // One missing month between 10 and 20 → 10 + (20 − 10)/2 = 15.
    { name: 'one period', points: [10, null, 20], filled: [10, 15, 20] },
    // Two missing between 10 and 40 → steps of (40 − 10)/3 = 10 → 20, 30.
    { name: 'two periods', points: [10, null, null, 40], filled: [10, 20, 30, 40] },
  ])('when a gap is $name, then it is interpolated on a straight line', ({ points, filled }) => {
    const monthly = points.map((value, index) => ({ date: `2024-0${index + 1}-01`, value }));
    const result = regularise(monthly, 'monthly');
    expect(result.values).toEqual(filled);
    expect(result.interpolated).toHaveLength(points.length - 2);
    expect(result.gaps).toEqual([]);
  });

  it('when weekly dates are absent rather than null, then the missing weeks are found', () => {
    // Sunday-dated weeks 01-07 and 01-28 with 01-14 and 01-21 absent: a two-week gap, 20 and 30.
    const result = regularise(
      [
        { date: '2024-01-07', value: 10 },
        { date: '2024-01-28', value: 40 },
      ],
      'weekly',
    );
    expect(result.dates).toEqual(['2024-01-07', '2024-01-14', '2024-01-21', '2024-01-28']);
    expect(result.values).toEqual([10, 20, 30, 40]);
  });

  it('when a gap is longer than two periods, then it is reported and left empty', () => {
    const result = regularise(
      [
        { date: '2024-01-01', value: 10 },
        { date: '2024-05-01', value: 50 },
      ],
      'monthly',
    );
    expect(result.values).toEqual([10, null, null, null, 50]);
    expect(result.gaps).toEqual([{ from: '2024-02-01', to: '2024-04-01', periods: 3 }]);
    expect(result.notes.join(' ')).toContain('gap of 3 periods');
  });

  it('when the ends are null, then they are trimmed rather than filled', () => {
    const result = regularise(
      [
        { date: '2024-01-01', value: null },
        { date: '2024-02-01', value: 5 },
        { date: '2024-03-01', value: 6 },
        { date: '2024-04-01', value: null },
      ],
      'monthly',
    );
    expect(result.dates).toEqual(['2024-02-01', '2024-03-01']);
    expect(result.values).toEqual([5, 6]);
  });

  it('when two points share a period, then the later one is kept and it is noted', () => {
    const result = regularise(
      [
        { date: '2024-01-01', value: 1 },
        { date: '2024-01-01', value: 2 },
      ],
      'monthly',
    );
    expect(result.values).toEqual([2]);
    expect(result.notes[0]).toContain('1 points shared a period');
  });

  it('when there are no points or one point, then the series is empty or single', () => {
    expect(regularise([], 'weekly').values).toEqual([]);
    expect(regularise([{ date: '2024-01-01', value: 3 }], 'weekly').values).toEqual([3]);
  });
});

describe('sumDaysToWeeks', () => {
  it('when whole ISO weeks of days are given, then each week is the sum of its 7 days', () => {
    // 2024-01-01 is a Monday (ISO 2024-W01). Days valued 1 → each week sums to 7; days valued by
    // their index 0..13 → week 1 = 0+…+6 = 21, week 2 = 7+…+13 = 70.
    const result = regularise(
      dailyPoints('2024-01-01', 14, (day) => day),
      'daily',
    );
    expect(result.dates).toEqual(['2024-01-01', '2024-01-08']);
    expect(result.values).toEqual([21, 70]);
    expect(result.period).toBe('weekly');
  });

  it('when the year has 53 ISO weeks, then week 53 is its own week', () => {
    // 2020 has 53 ISO weeks (it starts on a Wednesday and is a leap year): W53 runs Monday
    // 2020-12-28 to Sunday 2021-01-03, and 2021-W01 starts Monday 2021-01-04 (ISO 8601).
    const result = regularise(
      dailyPoints('2020-12-21', 21, () => 1),
      'daily',
    );
    expect(result.dates).toEqual(['2020-12-21', '2020-12-28', '2021-01-04']);
    expect(result.values).toEqual([7, 7, 7]);
  });

  it('when the first and last weeks are cut by the file, then they are left out and noted', () => {
    // Wednesday 2024-01-03 to Wednesday 2024-01-17: only the week of Monday 01-08 is whole.
    const notes: string[] = [];
    const result = sumDaysToWeeks(
      dailyPoints('2024-01-03', 15, () => 2),
      notes,
    );
    expect(result.dates).toEqual(['2024-01-08']);
    expect(result.values).toEqual([14]);
    expect(notes).toHaveLength(2);
  });

  it('when a week has missing days, then it is scaled up from the days it has', () => {
    // Week of 2024-01-01 with Tuesday and Wednesday null: 5 days of 3 = 15, scaled 15·7/5 = 21.
    const points = dailyPoints('2024-01-01', 7, (day) => (day === 1 || day === 2 ? null : 3));
    const notes: string[] = [];
    expect(sumDaysToWeeks(points, notes).values).toEqual([21]);
    expect(notes[0]).toContain('1 weeks had missing days');
  });

  it('when a whole week is null, then it is a gap of one period and interpolated', () => {
    // Weeks sum to 7, null, 21 → the middle is filled with (7 + 21)/2 = 14.
    const points = dailyPoints('2024-01-01', 21, (day) => (day < 7 ? 1 : day < 14 ? null : 3));
    const result = regularise(points, 'daily');
    expect(result.values).toEqual([7, 14, 21]);
    expect(result.interpolated).toEqual(['2024-01-08']);
  });

  it('when daylight saving changes inside a week, then the week still has 7 days', () => {
    // Europe and the US change clocks in late March; dates are counted in UTC, so nothing shifts.
    const result = regularise(
      dailyPoints('2024-03-25', 7, () => 1),
      'daily',
    );
    expect(result.values).toEqual([7]);
  });
});
