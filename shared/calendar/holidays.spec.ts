import { isValidRegion, publicHolidayDates, publicHolidays } from './holidays';
import usFederal from '../../tests/fixtures/calendar/us-federal-holidays-2025-2027.json';
import ukBankHolidays from '../../tests/fixtures/calendar/uk-bank-holidays-england-wales-2025-2026.json';
import canadaFederal from '../../tests/fixtures/calendar/canada-federal-holidays-2026.json';

describe('publicHolidays', () => {
  // Outside source: US OPM federal holiday lists, 5 U.S.C. 6103 — from memory, as the project's
  // reference file holidays_us_easter.json says (copied to tests/fixtures/calendar).
  it.each(['2025', '2026', '2027'] as const)(
    'matches the US federal observed days of %s',
    (year) => {
      const expected = usFederal.years[year]
        // Inauguration Day is a DC-area holiday only (and falls on MLK Day in 2025).
        .filter((holiday) => !holiday.name.startsWith('Inauguration'))
        .map((holiday) => holiday.observed)
        .filter((date) => date.startsWith(year));
      expect(publicHolidayDates('US', undefined, `${year}-01-01`, `${year}-12-31`)).toEqual(
        expected,
      );
    },
  );

  it('keeps the substitute day and remembers the holiday date', () => {
    const [independence] = publicHolidays('US', undefined, '2026-07-01', '2026-07-31');
    expect(independence).toEqual({
      date: '2026-07-03',
      name: 'Independence Day (substitute day)',
      kind: 'holiday',
      key: 'us-independence-day',
      actualDate: '2026-07-04',
    });
    // New Year's Day 2028 is a Saturday: observed on Friday 31 December 2027.
    expect(publicHolidays('US', undefined, '2027-12-31', '2027-12-31')).toEqual([
      expect.objectContaining({
        date: '2027-12-31',
        key: 'us-new-year-s-day',
        actualDate: '2028-01-01',
      }),
    ]);
    expect(publicHolidays('US', undefined, '2028-01-01', '2028-01-01')).toEqual([]);
  });

  // Outside source: the UK government's bank holiday list for England and Wales (gov.uk), written
  // in the fixture from memory.
  it.each(['2025', '2026'] as const)(
    'matches the England and Wales bank holidays of %s',
    (year) => {
      const holidays = publicHolidays('GB', 'ENG', `${year}-01-01`, `${year}-12-31`);
      expect(holidays.map(({ date, name }) => ({ date, name }))).toEqual(
        ukBankHolidays.years[year],
      );
    },
  );

  // The same outside sources for the names: 5 U.S.C. 6103 calls the first Monday of September
  // "Labor Day", the Canada Labour Code "Labour Day" (both from memory, as the fixtures say). The
  // key stays the one made from the library's English name, which stored anchors refer to.
  it('names the holidays in the English of the studio and keeps their keys', () => {
    const on = (country: string, date: string) => publicHolidays(country, undefined, date, date).map(({ name, key }) => ({ name, key }));
    const usLabor = usFederal.years['2026'].find((holiday) => holiday.observed === '2026-09-07')!;
    const caLabour = canadaFederal.holidays.find((holiday) => holiday.date === '2026-09-07')!;
    expect(on('US', '2026-09-07')).toEqual([{ name: usLabor.name, key: 'us-labour-day' }]);
    expect(on('CA', '2026-09-07')).toEqual([{ name: caLabour.name, key: 'ca-labour-day' }]);
  });

  // Outside source: Canada Labour Code s. 166 general holidays for 2026 (canada.ca), from memory.
  // date-holidays lists for CA as a whole only the days that are public in every province; the
  // rest are provincial and come with a region (checked below for Ontario).
  it('gives the nationwide Canadian holidays of 2026 and Ontario the provincial ones', () => {
    const nationwide = canadaFederal.holidays
      .filter((holiday) => holiday.nationwide)
      .map((h) => h.date);
    expect(publicHolidayDates('CA', undefined, '2026-01-01', '2026-12-31')).toEqual(nationwide);
    const ontario = publicHolidayDates('CA', 'ON', '2026-01-01', '2026-12-31');
    const federal = canadaFederal.holidays.map((holiday) => holiday.date);
    // Ontario keeps most federal days and adds Family Day and Easter Monday; Truth and
    // Reconciliation and Remembrance Day are not Ontario public holidays.
    expect(federal.filter((date) => !ontario.includes(date))).toEqual(['2026-09-30', '2026-11-11']);
    expect(ontario.filter((date) => !federal.includes(date))).toEqual(['2026-02-16', '2026-04-06']);
  });

  it('returns nothing for a reversed range and refuses unknown places', () => {
    expect(publicHolidays('US', undefined, '2026-12-31', '2026-01-01')).toEqual([]);
    expect(() => publicHolidays('GB', 'XYZ', '2026-01-01', '2026-12-31')).toThrow(
      /Unknown country or region/,
    );
  });

  it('keys stay the same from year to year', () => {
    const keys = (year: number) =>
      publicHolidays('GB', 'ENG', `${year}-01-01`, `${year}-12-31`).map((holiday) => holiday.key);
    expect(keys(2025)).toEqual(keys(2026));
    expect(keys(2025)).toContain('gb-eng-boxing-day');
  });
});

describe('isValidRegion', () => {
  it.each([
    ['US', undefined, true],
    ['GB', 'ENG', true],
    ['CA', 'ON', true],
    ['US', 'CA', true],
    ['GB', 'ON', false], // a real region code, of another country
    ['gb', 'ENG', false], // codes are upper case, as ISO 3166 writes them
    ['XX', undefined, false],
    ['USA', undefined, false],
    ['GB', 'england', false],
    ['CA', '', true],
  ])('isValidRegion(%s, %s) is %s', (country, region, expected) => {
    expect(isValidRegion(country, region)).toBe(expected);
  });
});
