import { DateTime } from 'luxon';
import { detectDateFormat, looksLikeDate, parseDateCell } from './csv-dates';
import type { DateFormat } from './csv-types';

// Outside reference: luxon's own format parser (fromFormat with the matching token string). Our
// parser must accept exactly the cells luxon accepts and give the same calendar date.
const luxonTokens: Record<DateFormat, string> = {
  'YYYY-MM-DD': 'yyyy-M-d',
  'YYYY-MM': 'yyyy-M',
  'M/D/YYYY': 'M/d/yyyy',
  'D/M/YYYY': 'd/M/yyyy',
  'D.M.YYYY': 'd.M.yyyy',
};

describe('parseDateCell against luxon', () => {
  const cases: [string, DateFormat][] = [
    ['2024-02-29', 'YYYY-MM-DD'],
    ['2023-02-29', 'YYYY-MM-DD'],
    ['2021-11-07', 'YYYY-MM-DD'],
    ['2021-1-7', 'YYYY-MM-DD'],
    ['2025-13-01', 'YYYY-MM-DD'],
    ['2025-04-31', 'YYYY-MM-DD'],
    ['2025-00-10', 'YYYY-MM-DD'],
    ['2025-12', 'YYYY-MM'],
    ['2025-1', 'YYYY-MM'],
    ['2025-13', 'YYYY-MM'],
    ['3/14/2025', 'M/D/YYYY'],
    ['12/31/1999', 'M/D/YYYY'],
    ['2/29/2000', 'M/D/YYYY'],
    ['2/29/1900', 'M/D/YYYY'],
    ['14/3/2025', 'M/D/YYYY'],
    ['14/3/2025', 'D/M/YYYY'],
    ['31/12/2025', 'D/M/YYYY'],
    ['31/4/2025', 'D/M/YYYY'],
    ['7.11.2021', 'D.M.YYYY'],
    ['29.02.2024', 'D.M.YYYY'],
    ['29.02.2025', 'D.M.YYYY'],
    ['01.13.2025', 'D.M.YYYY'],
  ];

  it.each(cases)('%s as %s', (cell, format) => {
    const reference = DateTime.fromFormat(cell, luxonTokens[format], { zone: 'utc' });
    const expected = reference.isValid ? reference.toISODate() : null;
    expect(parseDateCell(cell, format)).toBe(expected);
  });

  it('every day of 2023 and 2024 in every format agrees with luxon', () => {
    let day = DateTime.fromISO('2023-01-01', { zone: 'utc' });
    while (day.year < 2025) {
      for (const format of ['YYYY-MM-DD', 'M/D/YYYY', 'D/M/YYYY', 'D.M.YYYY'] as const) {
        expect(parseDateCell(day.toFormat(luxonTokens[format]), format)).toBe(day.toISODate());
      }
      day = day.plus({ days: 1 });
    }
  });
});

describe('parseDateCell edge cases', () => {
  it('ignores surrounding spaces and refuses other shapes', () => {
    expect(parseDateCell(' 2025-01-05 ', 'YYYY-MM-DD')).toBe('2025-01-05');
    expect(parseDateCell('2025-01-05T10:00', 'YYYY-MM-DD')).toBeNull();
    expect(parseDateCell('5 Jan 2025', 'YYYY-MM-DD')).toBeNull();
    expect(parseDateCell('1/5/25', 'M/D/YYYY')).toBeNull();
  });

  it('looksLikeDate knows every accepted shape', () => {
    expect(['2025-01-05', '2025-01', '1/5/2025', '5.1.2025'].every(looksLikeDate)).toBe(true);
    expect(['2025', '12', 'lantern', '1/5'].some(looksLikeDate)).toBe(false);
  });
});

describe('detectDateFormat', () => {
  it.each([
    [['2025-01-05', '2025-01-12'], undefined, { format: 'YYYY-MM-DD', isAmbiguous: false }],
    [['2025-01', '2025-02'], undefined, { format: 'YYYY-MM', isAmbiguous: false }],
    [['1/5/2025', '1/12/2025'], undefined, { format: 'M/D/YYYY', isAmbiguous: true }],
    [['1/5/2025', '1/13/2025'], undefined, { format: 'M/D/YYYY', isAmbiguous: false }],
    [['5/1/2025', '13/1/2025'], undefined, { format: 'D/M/YYYY', isAmbiguous: false }],
    [['1/5/2025', '1/12/2025'], 'DMY', { format: 'D/M/YYYY', isAmbiguous: false }],
    [['5.1.2025', '12.1.2025'], undefined, { format: 'D.M.YYYY', isAmbiguous: false }],
    [['', ' '], undefined, null],
    [['soon', 'later'], undefined, null],
  ] as const)('%j (%s)', (cells, order, expected) => {
    expect(detectDateFormat(cells, order)).toEqual(expected);
  });
});
