import { RRule, RRuleSet, type Options } from 'rrule';
import { addDays, daysBetween, fromUtcDate, isIsoDate, toUtcDate, type IsoDate } from './dates';

export interface Recurrence {
  /** The first occurrence (RFC 5545's DTSTART, as an all-day DATE). */
  start: IsoDate;
  /** RFC 5545 RECUR text such as "FREQ=WEEKLY;BYDAY=SA"; an optional "RRULE:" prefix is allowed. */
  rrule?: string;
  /** Dates struck out of the set (a market cancelled for a holiday). */
  exdates?: IsoDate[];
  /** Extra dates added to the set (a special Christmas market). */
  rdates?: IsoDate[];
}

export type RruleCheck = { ok: true } | { ok: false; message: string };

/** Most occurrences a rule with COUNT may have (about 19 years of a weekly market). */
export const MAX_COUNT = 1000;

// An expansion longer than this is a mistake in the caller, not a calendar view.
const MAX_RANGE_DAYS = 366 * 20;

const PARTS = new Set([
  'FREQ',
  'UNTIL',
  'COUNT',
  'INTERVAL',
  'BYSECOND',
  'BYMINUTE',
  'BYHOUR',
  'BYDAY',
  'BYMONTHDAY',
  'BYYEARDAY',
  'BYWEEKNO',
  'BYMONTH',
  'BYSETPOS',
  'WKST',
]);
const DAY_FREQUENCIES = ['DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'];
const TIME_FREQUENCIES = ['SECONDLY', 'MINUTELY', 'HOURLY'];
const WEEKDAYS = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'];
const BYDAY_ITEM = /^([+-]?\d{1,2})?([A-Z]{2})$/;
const INTEGER = /^[+-]?\d+$/;
const UNTIL_DATE = /^(\d{4})(\d{2})(\d{2})$/;
const UNTIL_DATE_TIME = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z?$/;

/**
 * The rule's text without an "RRULE:" prefix or trailing semicolons, in upper case: RFC 5545 §3.1
 * reads property names and values case-insensitively, and the rrule library reads upper case only.
 */
function stripPrefix(text: string): string {
  return text
    .trim()
    .replace(/^RRULE:/i, '')
    .replace(/;+$/, '')
    .toUpperCase();
}

/** A rule as it is stored and shown: no prefix, upper case ("freq=monthly;byday=1sa" → "FREQ=MONTHLY;BYDAY=1SA"). */
export function normaliseRrule(text: string): string {
  return stripPrefix(text);
}

/**
 * The rule as an all-day event's RRULE in a calendar file: RFC 5545 §3.3.10 wants UNTIL to have
 * DTSTART's value type, a DATE here, so a DATE-TIME UNTIL is written as the date the app itself
 * reads it as (a client would otherwise count one day more or fewer).
 */
export function allDayRrule(text: string): string {
  return stripPrefix(text).replace(/(^|;)UNTIL=([^;]+)/, (whole, separator: string, value: string) => {
    const date = untilDate(value);
    return date ? `${separator}UNTIL=${date.replaceAll('-', '')}` : whole;
  });
}

function checkIntegers(
  name: string,
  value: string,
  min: number,
  max: number,
  allowNegative: boolean,
): string | null {
  for (const item of value.split(',')) {
    if (!INTEGER.test(item)) return `${name} must be a list of whole numbers, got "${item}"`;
    const number = Number(item);
    const size = Math.abs(number);
    if (number === 0 || size < min || size > max || (!allowNegative && number < 0)) {
      const range = allowNegative ? `${min} to ${max} or -${max} to -${min}` : `${min} to ${max}`;
      return `${name} value ${item} is out of range (${range})`;
    }
  }
  return null;
}

function untilDate(value: string): IsoDate | null {
  const dateOnly = UNTIL_DATE.exec(value);
  const dateTime = UNTIL_DATE_TIME.exec(value);
  const match = dateOnly ?? dateTime;
  if (!match) return null;
  const date = `${match[1]}-${match[2]}-${match[3]}`;
  if (!isIsoDate(date)) return null;
  if (!dateTime) return date;
  const [hour, minute, second] = [Number(dateTime[4]), Number(dateTime[5]), Number(dateTime[6])];
  if (hour > 23 || minute > 59 || second > 60) return null;
  // A DATE-TIME UNTIL at exactly midnight names the moment that day begins, so the day itself is
  // not in the set; this is how RFC 5545's own examples (09:00 starts, UNTIL ...T000000Z) read.
  return hour === 0 && minute === 0 && second === 0 ? addDays(date, -1) : date;
}

/**
 * Checks RECUR text for all-day use. rrule's own parser accepts nonsense (unknown parts, BYDAY=XX,
 * BYMONTH=13) without a word, so every part is checked here and the message names the part.
 */
export function validateRrule(text: string): RruleCheck {
  const fail = (message: string): RruleCheck => ({ ok: false, message });
  const body = stripPrefix(text ?? '');
  if (body === '')
    return fail('The rule is empty: it needs at least FREQ, e.g. "FREQ=WEEKLY;BYDAY=SA"');
  const parts = new Map<string, string>();
  for (const part of body.split(';')) {
    const [rawName, value, ...rest] = part.split('=');
    const name = (rawName ?? '').trim().toUpperCase();
    if (value === undefined || rest.length > 0 || value.trim() === '') {
      return fail(`"${part}" is not a NAME=VALUE part`);
    }
    if (name === 'DTSTART' || name === 'TZID') {
      return fail(`${name} does not belong in the rule: the start date is set on its own`);
    }
    if (!PARTS.has(name)) return fail(`Unknown rule part "${name}"`);
    if (parts.has(name)) return fail(`${name} appears more than once`);
    parts.set(name, value.trim().toUpperCase());
  }

  const frequency = parts.get('FREQ');
  if (!frequency) return fail('FREQ is missing (DAILY, WEEKLY, MONTHLY or YEARLY)');
  if (TIME_FREQUENCIES.includes(frequency)) {
    return fail(
      `FREQ=${frequency} repeats within a day; all-day events need DAILY, WEEKLY, MONTHLY or YEARLY`,
    );
  }
  if (!DAY_FREQUENCIES.includes(frequency)) {
    return fail(`Unknown FREQ "${frequency}" (use DAILY, WEEKLY, MONTHLY or YEARLY)`);
  }
  for (const timePart of ['BYHOUR', 'BYMINUTE', 'BYSECOND']) {
    if (parts.has(timePart))
      return fail(`${timePart} sets times of day, which all-day events do not have`);
  }
  if (parts.has('COUNT') && parts.has('UNTIL')) return fail('COUNT and UNTIL cannot both be given');
  const count = parts.get('COUNT');
  if (count !== undefined && !/^\d+$/.test(count))
    return fail(`COUNT must be a whole number, got "${count}"`);
  if (count !== undefined && Number(count) < 1) return fail('COUNT must be at least 1');
  // A rule with COUNT is walked from its first day on each expansion; more than this is never a market.
  if (count !== undefined && Number(count) > MAX_COUNT) return fail(`COUNT is at most ${MAX_COUNT}; for a longer run give UNTIL or no end`);
  const interval = parts.get('INTERVAL');
  if (interval !== undefined && (!/^\d+$/.test(interval) || Number(interval) < 1)) {
    return fail(`INTERVAL must be a whole number of at least 1, got "${interval}"`);
  }
  const until = parts.get('UNTIL');
  if (until !== undefined && untilDate(until) === null) {
    return fail(`UNTIL must be a date like 20261231 or 20261231T000000Z, got "${until}"`);
  }
  const weekStart = parts.get('WKST');
  if (weekStart !== undefined && !WEEKDAYS.includes(weekStart)) {
    return fail(`WKST must be one of ${WEEKDAYS.join(', ')}, got "${weekStart}"`);
  }

  const byDay = parts.get('BYDAY');
  if (byDay !== undefined) {
    for (const item of byDay.split(',')) {
      const match = BYDAY_ITEM.exec(item);
      if (!match || !WEEKDAYS.includes(match[2])) {
        return fail(
          `BYDAY item "${item}" is not a weekday (${WEEKDAYS.join(', ')}, optionally with an ordinal like 2SU or -1MO)`,
        );
      }
      if (match[1] === undefined) continue;
      const ordinal = Number(match[1]);
      if (frequency !== 'MONTHLY' && frequency !== 'YEARLY') {
        return fail(`BYDAY ordinal "${item}" only works with FREQ=MONTHLY or FREQ=YEARLY`);
      }
      const limit = frequency === 'MONTHLY' ? 5 : 53;
      if (ordinal === 0 || Math.abs(ordinal) > limit) {
        return fail(`BYDAY ordinal in "${item}" must be 1 to ${limit} or -${limit} to -1`);
      }
      if (frequency === 'YEARLY' && parts.has('BYWEEKNO')) {
        return fail(`BYDAY ordinal "${item}" cannot be combined with BYWEEKNO`);
      }
    }
  }
  const numberChecks: [string, number, number, boolean][] = [
    ['BYMONTH', 1, 12, false],
    ['BYMONTHDAY', 1, 31, true],
    ['BYYEARDAY', 1, 366, true],
    ['BYWEEKNO', 1, 53, true],
    ['BYSETPOS', 1, 366, true],
  ];
  for (const [name, min, max, allowNegative] of numberChecks) {
    const value = parts.get(name);
    const problem =
      value === undefined ? null : checkIntegers(name, value, min, max, allowNegative);
    if (problem) return fail(problem);
  }
  if (parts.has('BYMONTHDAY') && frequency === 'WEEKLY')
    return fail('BYMONTHDAY cannot be used with FREQ=WEEKLY');
  if (parts.has('BYYEARDAY') && frequency !== 'YEARLY')
    return fail('BYYEARDAY only works with FREQ=YEARLY');
  if (parts.has('BYWEEKNO') && frequency !== 'YEARLY')
    return fail('BYWEEKNO only works with FREQ=YEARLY');
  if (
    parts.has('BYSETPOS') &&
    ![...parts.keys()].some((name) => name.startsWith('BY') && name !== 'BYSETPOS')
  ) {
    return fail('BYSETPOS needs another BY part (such as BYDAY) to pick from');
  }
  try {
    RRule.parseString(body);
  } catch (error) {
    return fail(`The rule could not be read: ${(error as Error).message}`);
  }
  return { ok: true };
}

// 400 Gregorian years are 146,097 days, a whole number of weeks: the calendar repeats itself exactly
// after them (weekdays, leap days, week numbers). Common practice; the figure is from memory and
// checked in recurrence.spec.ts against the days JavaScript's Date counts.
const GREGORIAN_CYCLE_DAYS = 146_097;

/**
 * How many days the rule's first day can move on towards `from` without changing any occurrence
 * from `from` on: whole periods of the rule (n days, n weeks, or 400·n years for monthly and yearly
 * rules). rrule walks every occurrence from the first day, so a window centuries on would otherwise
 * cost one step per week since the start. A rule with COUNT counts from its first day and stays put.
 */
function repeatShift(options: Partial<Options>, start: IsoDate, from: IsoDate): number {
  const ahead = daysBetween(start, from);
  if (options.count || ahead <= 0) return 0;
  const interval = options.interval ?? 1;
  const period = options.freq === RRule.DAILY ? interval : options.freq === RRule.WEEKLY ? 7 * interval : GREGORIAN_CYCLE_DAYS * interval;
  return Math.floor(ahead / period) * period;
}

/** rrule options for an all-day rule, anchored on a UTC midnight with no time zone (floating). */
function ruleOptions(rrule: string, start: IsoDate): Partial<Options> {
  const body = stripPrefix(rrule);
  const untilPart = /(?:^|;)UNTIL=([^;]+)/i.exec(body);
  const withoutUntil = body.replace(/(^|;)UNTIL=[^;]+/i, '').replace(/^;/, '');
  const options = RRule.parseString(withoutUntil);
  options.dtstart = toUtcDate(start);
  options.tzid = null;
  if (untilPart) {
    const last = untilDate(untilPart[1].toUpperCase());
    if (last) options.until = toUtcDate(last);
  }
  return options;
}

/**
 * The occurrences of a recurrence between `from` and `to`, both included, as sorted ISO dates.
 * Without an rrule the set is the start date plus the rdates. Throws a RangeError on an invalid rule.
 * The start is always an instance (RFC 5545 §3.8.5.3: DTSTART defines the first instance).
 */
export function expandRecurrence(recurrence: Recurrence, from: IsoDate, to: IsoDate): IsoDate[] {
  return expand(recurrence, from, to, true);
}

/**
 * Dates a bare rule produces from `anchor` on, within `from`..`to`; unlike a market, the anchor is
 * only a starting point and is not itself an instance unless the rule lands on it.
 */
export function expandRule(rrule: string, anchor: IsoDate, from: IsoDate, to: IsoDate): IsoDate[] {
  return expand({ start: anchor, rrule }, from, to, false);
}

function expand(
  recurrence: Recurrence,
  from: IsoDate,
  to: IsoDate,
  isStartIncluded: boolean,
): IsoDate[] {
  const span = daysBetween(from, to);
  if (span < 0) return [];
  if (span > MAX_RANGE_DAYS)
    throw new RangeError(`Range too long: ${span} days (at most ${MAX_RANGE_DAYS})`);
  const set = new RRuleSet();
  if (recurrence.rrule) {
    const check = validateRrule(recurrence.rrule);
    if (!check.ok) throw new RangeError(check.message);
    const options = ruleOptions(recurrence.rrule, recurrence.start);
    options.dtstart = toUtcDate(addDays(recurrence.start, repeatShift(options, recurrence.start, from)));
    set.rrule(new RRule(options));
  }
  if (isStartIncluded || !recurrence.rrule) set.rdate(toUtcDate(recurrence.start));
  for (const date of recurrence.rdates ?? []) set.rdate(toUtcDate(date));
  for (const date of recurrence.exdates ?? []) set.exdate(toUtcDate(date));
  const dates = set.between(toUtcDate(from), toUtcDate(to), true).map(fromUtcDate);
  return [...new Set(dates)].sort();
}
