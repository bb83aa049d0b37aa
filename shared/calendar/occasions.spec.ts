import { easterSunday } from './easter';
import { occasionDefaults, occasionsBetween } from './occasions';
import easter from '../../tests/fixtures/calendar/western-easter-2020-2035.json';
import retailDays from '../../tests/fixtures/calendar/retail-days-2024-2030.json';

const datesOf = (country: string, key: string, from = '2024-01-01', to = '2030-12-31') =>
  occasionsBetween(country, from, to)
    .filter((occasion) => occasion.key === key)
    .map((occasion) => occasion.date);

describe('easterSunday', () => {
  // Outside source: Western Easter 2020–2035 by the Gregorian computus, cross-checked with
  // python-dateutil, from the reference file holidays_us_easter.json.
  it.each(Object.entries(easter.years))('Easter %s is on %o', (year, days) => {
    expect(easterSunday(Number(year))).toBe(days.easterSunday);
  });

  it('is always a Sunday from 22 March to 25 April', () => {
    for (let year = 1900; year <= 2200; year++) {
      const date = easterSunday(year);
      expect(new Date(`${date}T00:00:00Z`).getUTCDay()).toBe(0);
      expect(date.slice(5) >= '03-22' && date.slice(5) <= '04-25').toBe(true);
    }
  });
});

describe('occasionsBetween', () => {
  // Outside source: 36 U.S.C. 117 (Mother's Day) and 36 U.S.C. 109 (Father's Day), dates from
  // holidays_us_easter.json.
  it('has the US and Canadian Mother’s and Father’s Days 2024–2030', () => {
    const mothers = retailDays.rules["Mother's Day (US, 36 U.S.C. 117)"].occurrences_2024_2030;
    const fathers = retailDays.rules["Father's Day (US, 36 U.S.C. 109)"].occurrences_2024_2030;
    expect(datesOf('US', 'mothers-day')).toEqual(mothers);
    expect(datesOf('CA', 'mothers-day')).toEqual(mothers);
    expect(datesOf('US', 'fathers-day')).toEqual(fathers);
    expect(datesOf('GB', 'fathers-day')).toEqual(fathers);
    expect(datesOf('CA', 'fathers-day')).toEqual(fathers);
  });

  // Outside source: Mothering Sunday = Easter − 21 days, from holidays_us_easter.json.
  it('puts Mothering Sunday three weeks before Easter in the UK', () => {
    const expected = Object.values(easter.years).map((days) => days.motheringSunday);
    const occasions = occasionsBetween('GB', '2020-01-01', '2035-12-31').filter(
      (o) => o.key === 'mothers-day',
    );
    expect(occasions.map((o) => o.date)).toEqual(expected);
    expect(occasions[0].name).toBe('Mothering Sunday');
  });

  // Outside source: 5 U.S.C. 6103 (fourth Thursday of November) and the day after it, from
  // holidays_us_easter.json; Canada's second Monday of October from the same file.
  it('has both Thanksgivings and the US shopping days after it', () => {
    expect(datesOf('US', 'thanksgiving')).toEqual(
      retailDays.rules['Thanksgiving (US, 5 U.S.C. 6103)'].occurrences_2024_2030,
    );
    expect(datesOf('US', 'day-after-thanksgiving')).toEqual(
      retailDays.rules['Day after Thanksgiving (Black Friday)'].occurrences_2024_2030,
    );
    // The shopping Monday is Thanksgiving + 4 days: 2026-11-26 (Thu) + 4 = 2026-11-30 (Mon).
    expect(datesOf('US', 'shopping-monday-after-thanksgiving', '2026-01-01', '2026-12-31')).toEqual(
      ['2026-11-30'],
    );
    expect(datesOf('CA', 'thanksgiving')).toEqual(
      retailDays.rules['Thanksgiving (Canada)'].occurrences_2024_2030,
    );
    expect(datesOf('GB', 'thanksgiving')).toEqual([]);
  });

  it('has the fixed days on their dates', () => {
    expect(datesOf('US', 'valentines-day')).toEqual(
      retailDays.rules["Valentine's Day"].occurrences_2024_2030,
    );
    expect(datesOf('GB', 'halloween')).toEqual(retailDays.rules.Halloween.occurrences_2024_2030);
    expect(datesOf('CA', 'christmas-eve', '2026-01-01', '2026-12-31')).toEqual(['2026-12-24']);
    expect(datesOf('US', 'christmas-day', '2026-01-01', '2026-12-31')).toEqual(['2026-12-25']);
  });

  it('opens each sell window its default number of days before, or the studio’s override', () => {
    const year = occasionsBetween('US', '2026-01-01', '2026-12-31');
    const mothers = year.find((o) => o.key === 'mothers-day');
    // 2026-05-10 − 21 days = 2026-04-19.
    expect(mothers).toEqual({
      key: 'mothers-day',
      name: "Mother's Day",
      date: '2026-05-10',
      sellWindowStart: '2026-04-19',
      sellWindowDays: 21,
      kind: 'occasion',
    });
    // Christmas 2026-12-25 − 42 days = 2026-11-13; Halloween 2026-10-31 − 30 = 2026-10-01.
    expect(year.find((o) => o.key === 'christmas-day')?.sellWindowStart).toBe('2026-11-13');
    expect(year.find((o) => o.key === 'halloween')?.sellWindowStart).toBe('2026-10-01');
    const edited = occasionsBetween('US', '2026-01-01', '2026-12-31', {
      sellWindows: { halloween: 45 },
    });
    // 2026-10-31 − 45 days = 2026-09-16.
    expect(edited.find((o) => o.key === 'halloween')?.sellWindowStart).toBe('2026-09-16');
    expect(() =>
      occasionsBetween('US', '2026-01-01', '2026-12-31', { sellWindows: { halloween: -1 } }),
    ).toThrow(RangeError);
  });

  it('adds back-to-school as one date or every year', () => {
    const once = occasionsBetween('US', '2026-01-01', '2027-12-31', { backToSchool: '2026-08-24' });
    expect(
      once.filter((o) => o.key === 'back-to-school').map((o) => [o.date, o.sellWindowStart]),
    ).toEqual([
      ['2026-08-24', '2026-07-27'], // 28 days before
    ]);
    const yearly = occasionsBetween('GB', '2026-01-01', '2027-12-31', { backToSchool: '09-03' });
    expect(yearly.filter((o) => o.key === 'back-to-school').map((o) => o.date)).toEqual([
      '2026-09-03',
      '2027-09-03',
    ]);
    expect(() =>
      occasionsBetween('GB', '2026-01-01', '2026-12-31', { backToSchool: '02-30' }),
    ).toThrow(RangeError);
  });

  it('adds the studio’s own occasions by rule or by date', () => {
    const occasions = occasionsBetween('US', '2026-09-01', '2026-10-31', {
      custom: [
        // The town's harvest weekend: third Saturday of September.
        { name: 'Harvest weekend', rrule: 'FREQ=YEARLY;BYMONTH=9;BYDAY=3SA', sellWindowDays: 10 },
        { key: 'studio-birthday', name: 'Studio birthday', dates: ['2026-10-02', '2027-10-02'] },
      ],
    });
    expect(
      occasions.filter((o) => o.key.startsWith('custom-') || o.key === 'studio-birthday'),
    ).toEqual([
      {
        key: 'custom-harvest-weekend',
        name: 'Harvest weekend',
        date: '2026-09-19',
        sellWindowStart: '2026-09-09',
        sellWindowDays: 10,
        kind: 'occasion',
      },
      {
        key: 'studio-birthday',
        name: 'Studio birthday',
        date: '2026-10-02',
        sellWindowStart: '2026-09-11',
        sellWindowDays: 21,
        kind: 'occasion',
      },
    ]);
    expect(() =>
      occasionsBetween('US', '2026-01-01', '2026-12-31', {
        custom: [{ name: 'Oops', rrule: 'FREQ=YEARLY;BYMONTH=13' }],
      }),
    ).toThrow(/Oops: BYMONTH value 13/);
  });

  it('gives other countries the widely kept days only, sorted by date', () => {
    const keys = occasionsBetween('FR', '2026-01-01', '2026-12-31').map((o) => o.key);
    expect(keys).toEqual([
      'valentines-day',
      'easter',
      'halloween',
      'christmas-eve',
      'christmas-day',
    ]);
    expect(occasionDefaults('FR').map((o) => o.key)).toContain('back-to-school');
  });

  it('is empty for a reversed range and includes both ends', () => {
    expect(occasionsBetween('US', '2026-12-31', '2026-01-01')).toEqual([]);
    expect(occasionsBetween('US', '2026-02-14', '2026-02-14').map((o) => o.key)).toEqual([
      'valentines-day',
    ]);
  });
});
