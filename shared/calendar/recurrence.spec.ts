import fc from 'fast-check';
import { RRule } from 'rrule';
import { addDays, fromUtcDate, toUtcDate } from './dates';
import { expandRecurrence, expandRule, validateRrule } from './recurrence';
import { rruleSchema } from './schemas';
import rfc5545 from '../../tests/fixtures/calendar/rfc5545-recurrence-examples.json';

describe('expandRecurrence', () => {
  // Outside source: RFC 5545 §3.8.5.3, the recurrence examples with their listed occurrences
  // (transcribed into the fixture). DTSTART is the example's date as an all-day, floating date.
  it.each(rfc5545.examples.map((example) => [example.title, example] as const))(
    'RFC 5545 example: %s',
    (_title, example) => {
      const exdates = 'exdates' in example ? example.exdates : undefined;
      const dates = expandRecurrence(
        { start: example.dtstart, rrule: example.rrule, exdates },
        example.dtstart,
        example.to,
      );
      expect(dates).toEqual(example.expected);
    },
  );

  it('uses the window, exdates and rdates of a weekly market', () => {
    // Saturdays from 2 May 2026; no market on 23 May (a holiday weekend), an extra Friday market.
    const dates = expandRecurrence(
      {
        start: '2026-05-02',
        rrule: 'FREQ=WEEKLY;BYDAY=SA',
        exdates: ['2026-05-23'],
        rdates: ['2026-05-29'],
      },
      '2026-05-10',
      '2026-06-06',
    );
    expect(dates).toEqual(['2026-05-16', '2026-05-29', '2026-05-30', '2026-06-06']);
  });

  it('accepts an RRULE: prefix and a trailing semicolon', () => {
    expect(
      expandRecurrence(
        { start: '2026-01-03', rrule: 'RRULE:FREQ=MONTHLY;BYDAY=1SA;COUNT=3;' },
        '2026-01-01',
        '2026-12-31',
      ),
    ).toEqual(['2026-01-03', '2026-02-07', '2026-03-07']);
  });

  it('a DATE UNTIL is inclusive', () => {
    expect(
      expandRecurrence(
        { start: '2026-06-01', rrule: 'FREQ=DAILY;UNTIL=20260603' },
        '2026-01-01',
        '2026-12-31',
      ),
    ).toEqual(['2026-06-01', '2026-06-02', '2026-06-03']);
  });

  it('without a rule is the start plus extra dates, minus struck ones', () => {
    expect(
      expandRecurrence(
        { start: '2026-09-12', rdates: ['2026-09-13', '2026-09-12'] },
        '2026-09-01',
        '2026-09-30',
      ),
    ).toEqual(['2026-09-12', '2026-09-13']);
    expect(
      expandRecurrence(
        { start: '2026-09-12', exdates: ['2026-09-12'] },
        '2026-09-01',
        '2026-09-30',
      ),
    ).toEqual([]);
  });

  it('does not shift a day across clock changes (last Sunday of March, first of November)', () => {
    const dates = expandRecurrence(
      { start: '2026-03-28', rrule: 'FREQ=DAILY;COUNT=3' },
      '2026-03-01',
      '2026-04-30',
    );
    expect(dates).toEqual(['2026-03-28', '2026-03-29', '2026-03-30']);
    const autumn = expandRule('FREQ=WEEKLY;BYDAY=SU', '2026-10-25', '2026-10-25', '2026-11-08');
    expect(autumn).toEqual(['2026-10-25', '2026-11-01', '2026-11-08']);
  });

  it('refuses an invalid rule and an unreasonably long window', () => {
    expect(() =>
      expandRecurrence(
        { start: '2026-01-01', rrule: 'FREQ=FORTNIGHTLY' },
        '2026-01-01',
        '2026-02-01',
      ),
    ).toThrow(/Unknown FREQ "FORTNIGHTLY"/);
    expect(() =>
      expandRecurrence({ start: '2026-01-01', rrule: 'FREQ=DAILY' }, '2000-01-01', '2026-01-01'),
    ).toThrow(/Range too long/);
  });

  it('an impossible rule ends with no dates instead of looping', () => {
    expect(
      expandRecurrence(
        { start: '2026-01-01', rrule: 'FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=30' },
        '2026-01-02',
        '2030-12-31',
      ),
    ).toEqual([]);
  });
});

describe('validateRrule', () => {
  it.each([
    'FREQ=WEEKLY;BYDAY=SA',
    'RRULE:FREQ=MONTHLY;BYDAY=2SA',
    'FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1',
    'FREQ=YEARLY;BYMONTH=11;BYDAY=4TH',
    'FREQ=WEEKLY;INTERVAL=2;UNTIL=20261231;WKST=SU;BYDAY=SA,SU',
    'FREQ=DAILY;UNTIL=19971224T000000Z',
    'freq=weekly;byday=sa',
  ])('accepts %s', (rule) => {
    expect(validateRrule(rule)).toEqual({ ok: true });
  });

  it.each([
    ['', /empty/],
    ['BYDAY=SA', /FREQ is missing/],
    ['FREQ=FORTNIGHTLY', /Unknown FREQ "FORTNIGHTLY"/],
    ['FREQ=HOURLY;INTERVAL=3', /repeats within a day/],
    ['FREQ=WEEKLY;BYDAY=SAT', /BYDAY item "SAT"/],
    ['FREQ=WEEKLY;BYDAY=XX', /BYDAY item "XX"/],
    ['FREQ=WEEKLY;BYDAY=2SA', /ordinal "2SA" only works with FREQ=MONTHLY or FREQ=YEARLY/],
    ['FREQ=MONTHLY;BYDAY=6SA', /must be 1 to 5/],
    ['FREQ=MONTHLY;BYDAY=0SA', /must be 1 to 5/],
    ['FREQ=YEARLY;BYMONTH=13', /BYMONTH value 13 is out of range/],
    ['FREQ=MONTHLY;BYMONTHDAY=0', /BYMONTHDAY value 0/],
    ['FREQ=MONTHLY;BYMONTHDAY=first', /whole numbers, got "FIRST"/],
    ['FREQ=WEEKLY;BYMONTHDAY=1', /BYMONTHDAY cannot be used with FREQ=WEEKLY/],
    ['FREQ=MONTHLY;BYWEEKNO=20', /BYWEEKNO only works with FREQ=YEARLY/],
    ['FREQ=MONTHLY;BYSETPOS=2', /BYSETPOS needs another BY part/],
    ['FREQ=DAILY;COUNT=3;UNTIL=20260101', /COUNT and UNTIL cannot both/],
    ['FREQ=DAILY;COUNT=0', /COUNT must be at least 1/],
    ['FREQ=DAILY;INTERVAL=-2', /INTERVAL must be a whole number of at least 1/],
    ['FREQ=DAILY;UNTIL=2026-12-31', /UNTIL must be a date/],
    ['FREQ=DAILY;UNTIL=20260230', /UNTIL must be a date/],
    ['FREQ=WEEKLY;WKST=XX', /WKST must be one of/],
    ['FREQ=WEEKLY;BYHOUR=9', /BYHOUR sets times of day/],
    ['FREQ=WEEKLY;COLOUR=RED', /Unknown rule part "COLOUR"/],
    ['FREQ=WEEKLY;FREQ=DAILY', /FREQ appears more than once/],
    ['FREQ=WEEKLY;BYDAY', /not a NAME=VALUE part/],
    ['DTSTART=20260101;FREQ=DAILY', /DTSTART does not belong/],
  ])('rejects "%s" and says why', (rule, message) => {
    const check = validateRrule(rule);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.message).toMatch(message);
  });
});

describe('expandRecurrence far from the first day', () => {
  it('when 400 Gregorian years are counted, then they are 146,097 days, a whole number of weeks', () => {
    // Outside reference: JavaScript's Date (proleptic Gregorian), counting the days itself.
    const days = (Date.UTC(2426, 2, 6) - Date.UTC(2026, 2, 6)) / 86_400_000;
    expect([days, days % 7]).toEqual([146_097, 0]);
  });

  it('when a window lies decades or centuries on, then the dates are those rrule finds walking from the first day', () => {
    // Outside reference: the rrule library expanding the same rule from its own first day, unshortened.
    const frequencies = ['DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'] as const;
    const rule = fc
      .record({
        freq: fc.constantFrom(...frequencies),
        interval: fc.integer({ min: 1, max: 5 }),
        byday: fc.option(fc.subarray(['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'], { minLength: 1 }), { nil: undefined }),
        bymonth: fc.option(fc.integer({ min: 1, max: 12 }), { nil: undefined }),
      })
      .map(({ freq, interval, byday, bymonth }) =>
        [`FREQ=${freq}`, `INTERVAL=${interval}`, byday ? `BYDAY=${byday.join(',')}` : '', bymonth ? `BYMONTH=${bymonth}` : ''].filter(Boolean).join(';'),
      );
    const day = (min: number, max: number) => fc.integer({ min, max }).map((offset) => addDays('2000-01-01', offset));
    fc.assert(
      fc.property(rule, day(0, 12_000), fc.integer({ min: 0, max: 60_000 }), fc.integer({ min: 0, max: 60 }), (rrule, start, ahead, length) => {
        const from = addDays(start, ahead);
        const to = addDays(from, length);
        const reference = new RRule({ ...RRule.parseString(rrule), dtstart: toUtcDate(start), tzid: null })
          .between(toUtcDate(from), toUtcDate(to), true)
          .map(fromUtcDate);
        const expected = [...new Set([...reference, ...(start >= from && start <= to ? [start] : [])])].sort();
        expect(expandRecurrence({ start, rrule }, from, to)).toEqual(expected);
      }),
      { numRuns: 150 },
    );
  });

  it('when a rule counts more than 1000 occurrences, then it is refused with the limit named', () => {
    expect(validateRrule('FREQ=WEEKLY;COUNT=1000')).toEqual({ ok: true });
    expect(validateRrule('FREQ=WEEKLY;COUNT=1001')).toEqual({ ok: false, message: 'COUNT is at most 1000; for a longer run give UNTIL or no end' });
  });
});

describe('rule text in any case', () => {
  it('when a rule is written in lower or mixed case, then it is read as RFC 5545 §3.1 says (case-insensitively), and stored in upper case', () => {
    // Outside source: RFC 5545 §3.1, "all names of properties, property parameters, enumerated
    // property values and property parameter values are case-insensitive"; the dates are the second
    // Saturdays of January to April 2027, read from a printed calendar (from memory) and checked here
    // against the same rule in upper case.
    expect(validateRrule('freq=monthly;byday=1sa')).toEqual({ ok: true });
    const lower = expandRecurrence({ start: '2027-01-09', rrule: 'rrule:freq=monthly;ByDay=2sa' }, '2027-01-01', '2027-04-30');
    expect(lower).toEqual(['2027-01-09', '2027-02-13', '2027-03-13', '2027-04-10']);
    expect(lower).toEqual(expandRecurrence({ start: '2027-01-09', rrule: 'FREQ=MONTHLY;BYDAY=2SA' }, '2027-01-01', '2027-04-30'));
    expect(rruleSchema.parse('freq=weekly;byday=sa;until=20271231')).toBe('FREQ=WEEKLY;BYDAY=SA;UNTIL=20271231');
  });
});
