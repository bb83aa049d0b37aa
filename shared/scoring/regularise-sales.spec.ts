// Issue 23, "weeks without sales are missing, not zero": sales count what sold, so a period with
// no sale is 0 sold, never a gap to interpolate or to cut the series at. Interest series keep
// missing as missing. The rule is common practice for count data (a shop's report shows 0 for a
// week without sales); the calendar facts are checked against ISO 8601 as in regularise.spec.ts.
import { regularise } from './regularise';
import type { Point } from './types';

/** Weekly points from Monday 2024-01-01, one per non-null value (null: no row for that week). */
function weeklyRows(values: (number | null)[]): Point[] {
  const start = Date.UTC(2024, 0, 1);
  return values.flatMap((value, week) =>
    value === null
      ? []
      : [{ date: new Date(start + week * 7 * 86_400_000).toISOString().slice(0, 10), value }],
  );
}

describe('regularise for sales (isMissingZero)', () => {
  it('when weeks between two sales have no row, then they sold 0 and are counted', () => {
    // Sales in weeks 0, 1 and 6: weeks 2–5 have no row. Read as interest, four missing weeks are a
    // long gap that cuts the series; read as sales they are 0 sold.
    const points = weeklyRows([2, 1, null, null, null, null, 3]);
    const sales = regularise(points, 'weekly', { isMissingZero: true });
    expect(sales.values).toEqual([2, 1, 0, 0, 0, 0, 3]);
    expect(sales.zeroFilled).toEqual(['2024-01-15', '2024-01-22', '2024-01-29', '2024-02-05']);
    expect(sales.gaps).toEqual([]);
    expect(sales.interpolated).toEqual([]);
    expect(sales.notes).toContain('4 weeks without a sale count as 0 sold');

    const interest = regularise(points, 'weekly');
    expect(interest.values).toEqual([2, 1, null, null, null, null, 3]);
    expect(interest.gaps).toEqual([{ from: '2024-01-15', to: '2024-02-05', periods: 4 }]);
    expect(interest.zeroFilled).toEqual([]);
  });

  it('when a single week has no row, then sales read 0 where interest interpolates', () => {
    // Interest: (4 + 8) / 2 = 6 on a straight line; sales: nothing sold that week.
    const points = weeklyRows([4, null, 8]);
    expect(regularise(points, 'weekly').values).toEqual([4, 6, 8]);
    expect(regularise(points, 'weekly', { isMissingZero: true }).values).toEqual([4, 0, 8]);
  });

  it('when the files cover weeks after the last sale, then those whole weeks sold 0 too', () => {
    // Last sale in the week of Monday 01-08; the file runs to Wednesday 02-07. Whole weeks after
    // it: 01-15, 01-22 and 01-29 (Sunday 02-04); the week of 02-05 is cut by the file's end.
    const points = weeklyRows([5, 5]);
    const result = regularise(points, 'weekly', {
      isMissingZero: true,
      coveredUntil: '2024-02-07',
    });
    expect(result.dates.join(' ')).toBe('2024-01-01 2024-01-08 2024-01-15 2024-01-22 2024-01-29');
    expect(result.values).toEqual([5, 5, 0, 0, 0]);
    // Interest ignores the covered range: nothing is invented after its last figure.
    expect(regularise(points, 'weekly', { coveredUntil: '2024-02-07' }).values).toEqual([5, 5]);
  });

  it('when monthly sales skip months, then those months sold 0, up to the last whole covered month', () => {
    // Sales in January and April 2024, files to 2024-06-15: February, March and May sold 0;
    // June is cut by the file's end and left out.
    const points = [
      { date: '2024-01-01', value: 10 },
      { date: '2024-04-01', value: 6 },
    ];
    const result = regularise(points, 'monthly', {
      isMissingZero: true,
      coveredUntil: '2024-06-15',
    });
    expect(result.dates.join(' ')).toBe('2024-01-01 2024-02-01 2024-03-01 2024-04-01 2024-05-01');
    expect(result.values).toEqual([10, 0, 0, 6, 0]);
    expect(result.notes).toContain('3 months without a sale count as 0 sold');
  });

  it('when daily sales miss days, then a week is the sum of the days sold, not scaled up', () => {
    // Monday 2024-01-01 to Sunday 01-14 with sales of 3 on Monday and Friday of the first week
    // only: week 1 sold 6 (interest would scale 6 × 7 / 2 = 21), week 2 has no row and sold 0.
    const points = [
      { date: '2024-01-01', value: 3 },
      { date: '2024-01-05', value: 3 },
      { date: '2024-01-14', value: 0 },
    ];
    expect(regularise(points, 'daily', { isMissingZero: true }).values).toEqual([6, 0]);
    expect(regularise(points, 'daily').values).toEqual([21, 0]);
  });

  it('when nothing is missing, then sales and interest read the same', () => {
    const points = weeklyRows([1, 2, 3, 0, 4]);
    const sales = regularise(points, 'weekly', { isMissingZero: true });
    expect(sales.values).toEqual(regularise(points, 'weekly').values);
    expect(sales.zeroFilled).toEqual([]);
  });
});
