import { addDays, compareDates, dateRange, daysBetween, isIsoDate, isoWeekday } from './dates';

describe('ISO date helpers', () => {
  it.each([
    ['2024-02-28', 1, '2024-02-29'], // leap year
    ['2023-02-28', 1, '2023-03-01'],
    ['2025-12-31', 1, '2026-01-01'],
    ['2026-03-08', 1, '2026-03-09'], // US clocks change this night; UTC arithmetic does not notice
    ['2026-03-29', -1, '2026-03-28'], // EU clocks change
    ['2026-01-10', -40, '2025-12-01'],
    ['2026-05-01', 0, '2026-05-01'],
  ])('addDays(%s, %i) is %s', (date, days, expected) => {
    expect(addDays(date, days)).toBe(expected);
  });

  it.each([
    ['2026-03-30', 1], // a Monday
    ['2026-04-05', 7], // Easter Sunday 2026
    ['2024-02-29', 4],
    ['2000-01-01', 6],
  ])('isoWeekday(%s) is %i', (date, weekday) => {
    expect(isoWeekday(date)).toBe(weekday);
  });

  it('counts calendar days across a leap day and a clock change', () => {
    expect(daysBetween('2024-02-01', '2024-03-31')).toBe(59);
    expect(daysBetween('2026-03-31', '2026-03-01')).toBe(-30);
  });

  it('ranges include both ends and are empty when reversed', () => {
    expect(dateRange('2025-12-30', '2026-01-02')).toEqual([
      '2025-12-30',
      '2025-12-31',
      '2026-01-01',
      '2026-01-02',
    ]);
    expect(dateRange('2026-01-02', '2026-01-01')).toEqual([]);
    expect(dateRange('2026-01-02', '2026-01-02')).toEqual(['2026-01-02']);
  });

  it('compares like dates and rejects dates that do not exist', () => {
    expect(['2026-02-01', '2025-12-31', '2026-01-15'].sort(compareDates)).toEqual([
      '2025-12-31',
      '2026-01-15',
      '2026-02-01',
    ]);
    expect(isIsoDate('2025-02-29')).toBe(false);
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2026-1-5')).toBe(false);
    expect(() => addDays('2026-13-01', 1)).toThrow(RangeError);
  });
});
