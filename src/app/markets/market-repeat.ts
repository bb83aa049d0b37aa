import { RRule } from 'rrule';
import { isoWeekday, toUtcDate, type IsoDate } from '@shared/calendar/dates';

/** How a market repeats, offered from its first day; "custom" takes an RFC 5545 RRULE as written. */
export type RepeatKind = 'once' | 'weekly' | 'monthly-nth' | 'monthly-last' | 'monthly-day' | 'yearly-nth' | 'yearly-date' | 'custom';

const dayCodes = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'];
const dayNames = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];
const monthNames = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const ordinals = ['1st', '2nd', '3rd', '4th', '5th'];

/** The parts of a first day that the repeat choices are made of. */
function partsOf(start: IsoDate) {
  const date = toUtcDate(start);
  const day = date.getUTCDate();
  const month = date.getUTCMonth();
  const daysInMonth = new Date(Date.UTC(date.getUTCFullYear(), month + 1, 0)).getUTCDate();
  const weekday = isoWeekday(start) - 1;
  return { day, month, weekday, nth: Math.ceil(day / 7), isLast: day + 7 > daysInMonth };
}

const once = { kind: 'once', label: 'Once' } as const;
const custom = { kind: 'custom', label: 'Another rule (RRULE)' } as const;

/**
 * The choices for a market first held on `start`, with their words (no "monthly-last" unless it is
 * that month's last such weekday; no 5th-weekday rules); before a first day is chosen, only "once"
 * and a rule of one's own.
 */
export function repeatChoices(start: IsoDate | null): { kind: RepeatKind; label: string }[] {
  if (start === null) return [once, custom];
  const { day, month, weekday, nth, isLast } = partsOf(start);
  const choices: { kind: RepeatKind; label: string }[] = [once, { kind: 'weekly', label: `Every week on ${dayNames[weekday]}` }];
  if (nth <= 4) choices.push({ kind: 'monthly-nth', label: `Every month on the ${ordinals[nth - 1]} ${dayNames[weekday]}` });
  if (isLast) choices.push({ kind: 'monthly-last', label: `Every month on the last ${dayNames[weekday]}` });
  choices.push({ kind: 'monthly-day', label: `Every month on day ${day}` });
  if (nth <= 4) choices.push({ kind: 'yearly-nth', label: `Every year on the ${ordinals[nth - 1]} ${dayNames[weekday]} of ${monthNames[month]}` });
  choices.push({ kind: 'yearly-date', label: `Every year on ${monthNames[month]} ${day}` });
  choices.push(custom);
  return choices;
}

/** The RRULE of a choice for a market first held on `start` (null: once; custom rules are the user's own text). */
export function ruleOf(kind: Exclude<RepeatKind, 'custom'>, start: IsoDate): string | null {
  const { day, month, weekday, nth } = partsOf(start);
  const code = dayCodes[weekday];
  switch (kind) {
    case 'once':
      return null;
    case 'weekly':
      return `FREQ=WEEKLY;BYDAY=${code}`;
    case 'monthly-nth':
      return `FREQ=MONTHLY;BYDAY=${nth}${code}`;
    case 'monthly-last':
      return `FREQ=MONTHLY;BYDAY=-1${code}`;
    case 'monthly-day':
      return `FREQ=MONTHLY;BYMONTHDAY=${day}`;
    case 'yearly-nth':
      return `FREQ=YEARLY;BYMONTH=${month + 1};BYDAY=${nth}${code}`;
    case 'yearly-date':
      return `FREQ=YEARLY;BYMONTH=${month + 1};BYMONTHDAY=${day}`;
  }
}

/** Which choice a stored rule is for a market first held on `start`: the one that writes the same rule, else custom. */
export function repeatOf(rule: string | null, start: IsoDate): RepeatKind {
  if (!rule) return 'once';
  const found = repeatChoices(start).find(({ kind }) => kind !== 'custom' && ruleOf(kind, start) === rule);
  return found?.kind ?? 'custom';
}

/** A stored rule in words, by the rrule library ("every month on the 2nd Saturday"); the rule itself if it cannot say. */
export function describeRule(rule: string | null): string {
  if (!rule) return 'Once';
  try {
    const text = RRule.fromString(rule).toText();
    return text.charAt(0).toUpperCase() + text.slice(1);
  } catch {
    return rule;
  }
}
