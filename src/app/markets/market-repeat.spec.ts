import { RRule } from 'rrule';
import { fromUtcDate, toUtcDate } from '@shared/calendar/dates';
import { describeRule, repeatChoices, repeatOf, ruleOf, type RepeatKind } from './market-repeat';

/** The first `count` days of a rule from `start`, expanded by the rrule library (npm), the reference here. */
function firstDays(rule: string, start: string, count: number): string[] {
  const options = RRule.parseString(rule);
  return new RRule({ ...options, dtstart: toUtcDate(start) }).all((_, index) => index < count).map(fromUtcDate);
}

describe('market repeat choices', () => {
  // The expected days are worked out by hand (1 February 2026 is a Sunday, so its 2nd Saturday is the
  // 14th; 2 October 2027 is the 1st Saturday of that October) and compared with the rrule expansion.
  it.each<[string, RepeatKind, string[]]>([
    ['2026-01-10', 'weekly', ['2026-01-10', '2026-01-17', '2026-01-24']],
    ['2026-01-10', 'monthly-nth', ['2026-01-10', '2026-02-14', '2026-03-14']],
    ['2026-01-10', 'monthly-day', ['2026-01-10', '2026-02-10', '2026-03-10']],
    ['2026-10-03', 'yearly-nth', ['2026-10-03', '2027-10-02', '2028-10-07']],
    ['2026-10-03', 'yearly-date', ['2026-10-03', '2027-10-03', '2028-10-03']],
    ['2026-01-31', 'monthly-last', ['2026-01-31', '2026-02-28', '2026-03-28']],
  ])('when the first day is %s and the choice is %s, then the rule starts on that day and goes on %j', (start, kind, days) => {
    const rule = ruleOf(kind as Exclude<RepeatKind, 'custom'>, start)!;
    expect(firstDays(rule, start, 3)).toEqual(days);
    expect(repeatOf(rule, start)).toBe(kind);
  });

  it('when the first day is a 5th weekday, then no Nth-weekday choice is offered, only the last one', () => {
    // 2026-01-31 is the 5th and last Saturday of January.
    expect(repeatChoices('2026-01-31').map(({ kind }) => kind)).toEqual(['once', 'weekly', 'monthly-last', 'monthly-day', 'yearly-date', 'custom']);
    expect(repeatChoices('2026-01-10').map(({ label }) => label)).toContain('Every month on the 2nd Saturday');
  });

  it('when a stored rule is none of the choices, then it is custom, and rules read in words', () => {
    expect(repeatOf(null, '2026-01-10')).toBe('once');
    expect(repeatOf('FREQ=WEEKLY;INTERVAL=2;BYDAY=SA', '2026-01-10')).toBe('custom');
    expect(describeRule('FREQ=MONTHLY;BYDAY=2SA')).toBe('Every month on the 2nd Saturday');
    expect(describeRule(null)).toBe('Once');
  });
});
