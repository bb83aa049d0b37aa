import { detectPeriod } from './csv-period';

describe('detectPeriod', () => {
  it.each([
    [['2025-01-01', '2025-01-02', '2025-01-03'], 'daily'],
    [['2021-11-07', '2021-11-14', '2021-11-21'], 'weekly'],
    [['2024-01-01', '2024-02-01', '2024-03-01'], 'monthly'],
    // Months of 28 to 31 days, across a leap February.
    [['2024-01-31', '2024-02-29', '2024-03-31', '2024-04-30'], 'monthly'],
    [['2024-01-01', '2024-01-08', '2024-02-01', '2024-03-01'], null],
    [['2024-12-01', '2025-01-01', '2025-02-01'], 'monthly'],
    // A weekly file across the spring DST change is still weekly: dates have no clock time.
    [['2025-03-02', '2025-03-09', '2025-03-16', '2025-03-23', '2025-03-30', '2025-04-06'], 'weekly'],
  ] as const)('%j → %s', (dates, expected) => {
    const report = detectPeriod(dates);
    if (expected === null) expect(report.mixedAt.length).toBeGreaterThan(0);
    else expect(report).toEqual({ period: expected, mixedAt: [], gapsAfter: [] });
  });

  it('a single date or none has no period', () => {
    expect(detectPeriod([])).toEqual({ period: null, mixedAt: [], gapsAfter: [] });
    expect(detectPeriod(['2025-01-01'])).toEqual({ period: null, mixedAt: [], gapsAfter: [] });
  });

  it('reports gaps of whole periods', () => {
    expect(detectPeriod(['2025-01-05', '2025-01-12', '2025-02-02', '2025-02-09'])).toEqual({
      period: 'weekly', mixedAt: [], gapsAfter: ['2025-01-12'],
    });
    expect(detectPeriod(['2024-01-01', '2024-02-01', '2024-05-01', '2024-06-01'])).toMatchObject({
      period: 'monthly', gapsAfter: ['2024-02-01'],
    });
  });

  it('reports steps that break the period', () => {
    expect(detectPeriod(['2025-01-05', '2025-01-12', '2025-01-19', '2025-01-20'])).toMatchObject({
      period: 'weekly', mixedAt: ['2025-01-19'],
    });
    // Four weeks apart on the same day of the month is still weekly in a weekly file.
    expect(detectPeriod(['2021-02-07', '2021-02-14', '2021-02-21', '2021-03-21'])).toMatchObject({
      period: 'weekly', mixedAt: [], gapsAfter: ['2021-02-21'],
    });
  });
});
