import { addDays, isIsoDate, makeDate, yearOf, type IsoDate } from './dates';
import { easterSunday } from './easter';
import { expandRule, validateRrule } from './recurrence';

export interface Occasion {
  key: string;
  name: string;
  date: IsoDate;
  /** The day people start buying for it: `date` minus the sell window. */
  sellWindowStart: IsoDate;
  sellWindowDays: number;
  kind: 'occasion';
}

/** A studio's own occasion: a rule or a list of dates (or both). */
export interface CustomOccasion {
  /** Stable key; made from the name when absent. */
  key?: string;
  name: string;
  /** RECUR text, e.g. "FREQ=YEARLY;BYMONTH=9;BYDAY=3SA" (anchored on `start`, default 2000-01-01). */
  rrule?: string;
  start?: IsoDate;
  dates?: IsoDate[];
  sellWindowDays?: number;
}

export interface OccasionOptions {
  custom?: CustomOccasion[];
  /** Overrides of the sell window in days, by occasion key. */
  sellWindows?: Record<string, number>;
  /** The studio's back-to-school day: one date 'YYYY-MM-DD', or 'MM-DD' for the same day each year. */
  backToSchool?: string;
}

type OccasionRule =
  | { type: 'rrule'; rrule: string }
  | { type: 'easter'; offsetDays: number }
  /** Days after another occasion's date, e.g. the Friday after Thanksgiving. */
  | { type: 'after'; baseKey: string; offsetDays: number };

interface OccasionDefinition {
  key: string;
  name: string;
  sellWindowDays: number;
  rule: OccasionRule;
}

export const DEFAULT_CUSTOM_SELL_WINDOW_DAYS = 21;

// Sell windows: how many days before the day buyers shop for it. Gift days get three weeks,
// Christmas six (fairs and online orders start in mid-November), last-minute shopping days one.
const VALENTINES: OccasionDefinition = {
  key: 'valentines-day',
  name: "Valentine's Day",
  sellWindowDays: 21,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=14' },
};
const EASTER: OccasionDefinition = {
  key: 'easter',
  name: 'Easter',
  sellWindowDays: 28,
  rule: { type: 'easter', offsetDays: 0 },
};
const HALLOWEEN: OccasionDefinition = {
  key: 'halloween',
  name: 'Halloween',
  sellWindowDays: 30,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=10;BYMONTHDAY=31' },
};
const CHRISTMAS_EVE: OccasionDefinition = {
  key: 'christmas-eve',
  name: 'Christmas Eve',
  sellWindowDays: 42,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=12;BYMONTHDAY=24' },
};
const CHRISTMAS_DAY: OccasionDefinition = {
  key: 'christmas-day',
  name: 'Christmas Day',
  sellWindowDays: 42,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=12;BYMONTHDAY=25' },
};
const SECOND_SUNDAY_OF_MAY: OccasionDefinition = {
  key: 'mothers-day',
  name: "Mother's Day",
  sellWindowDays: 21,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=5;BYDAY=2SU' },
};
const THIRD_SUNDAY_OF_JUNE: OccasionDefinition = {
  key: 'fathers-day',
  name: "Father's Day",
  sellWindowDays: 21,
  rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=6;BYDAY=3SU' },
};

const OCCASIONS_BY_COUNTRY: Record<string, OccasionDefinition[]> = {
  US: [
    VALENTINES,
    EASTER,
    SECOND_SUNDAY_OF_MAY,
    THIRD_SUNDAY_OF_JUNE,
    HALLOWEEN,
    {
      key: 'thanksgiving',
      name: 'Thanksgiving',
      sellWindowDays: 21,
      rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=11;BYDAY=4TH' },
    },
    {
      key: 'day-after-thanksgiving',
      name: 'Day after Thanksgiving',
      sellWindowDays: 14,
      rule: { type: 'after', baseKey: 'thanksgiving', offsetDays: 1 },
    },
    {
      key: 'shopping-monday-after-thanksgiving',
      name: 'Shopping Monday after Thanksgiving',
      sellWindowDays: 14,
      rule: { type: 'after', baseKey: 'thanksgiving', offsetDays: 4 },
    },
    CHRISTMAS_EVE,
    CHRISTMAS_DAY,
  ],
  GB: [
    VALENTINES,
    // Mothering Sunday: the fourth Sunday of Lent, three weeks before Easter Sunday.
    {
      key: 'mothers-day',
      name: 'Mothering Sunday',
      sellWindowDays: 21,
      rule: { type: 'easter', offsetDays: -21 },
    },
    EASTER,
    THIRD_SUNDAY_OF_JUNE,
    HALLOWEEN,
    CHRISTMAS_EVE,
    CHRISTMAS_DAY,
  ],
  CA: [
    VALENTINES,
    EASTER,
    SECOND_SUNDAY_OF_MAY,
    THIRD_SUNDAY_OF_JUNE,
    {
      key: 'thanksgiving',
      name: 'Thanksgiving',
      sellWindowDays: 21,
      rule: { type: 'rrule', rrule: 'FREQ=YEARLY;BYMONTH=10;BYDAY=2MO' },
    },
    HALLOWEEN,
    CHRISTMAS_EVE,
    CHRISTMAS_DAY,
  ],
};

// Elsewhere Mother's and Father's Day and Thanksgiving differ too much to guess; the studio adds
// its own as custom occasions.
const WIDELY_KEPT = [VALENTINES, EASTER, HALLOWEEN, CHRISTMAS_EVE, CHRISTMAS_DAY];

export const BACK_TO_SCHOOL_KEY = 'back-to-school';
export const BACK_TO_SCHOOL_SELL_WINDOW_DAYS = 28;

/** The built-in occasions of a country with their default sell windows (for settings screens). */
export function occasionDefaults(
  country: string,
): { key: string; name: string; sellWindowDays: number }[] {
  const definitions = OCCASIONS_BY_COUNTRY[country] ?? WIDELY_KEPT;
  return [
    ...definitions.map(({ key, name, sellWindowDays }) => ({ key, name, sellWindowDays })),
    {
      key: BACK_TO_SCHOOL_KEY,
      name: 'Back to school',
      sellWindowDays: BACK_TO_SCHOOL_SELL_WINDOW_DAYS,
    },
  ];
}

function slug(text: string): string {
  return text
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
}

// Built-in rules are fixed, so their dates are cached per year: every month view asks again.
const yearlyRuleCache = new Map<string, IsoDate[]>();

function ruleDatesInYear(rrule: string, year: number): IsoDate[] {
  const id = `${rrule}|${year}`;
  let dates = yearlyRuleCache.get(id);
  if (!dates) {
    const start = makeDate(year, 1, 1);
    dates = expandRule(rrule, start, start, makeDate(year, 12, 31));
    if (yearlyRuleCache.size > 5000) yearlyRuleCache.clear();
    yearlyRuleCache.set(id, dates);
  }
  return dates;
}

function datesOfRule(
  rule: OccasionRule,
  firstYear: number,
  lastYear: number,
  known: Map<string, IsoDate[]>,
): IsoDate[] {
  switch (rule.type) {
    case 'rrule': {
      const dates: IsoDate[] = [];
      for (let year = firstYear; year <= lastYear; year++)
        dates.push(...ruleDatesInYear(rule.rrule, year));
      return dates;
    }
    case 'easter': {
      const dates: IsoDate[] = [];
      for (let year = firstYear; year <= lastYear; year++)
        dates.push(addDays(easterSunday(year), rule.offsetDays));
      return dates;
    }
    case 'after':
      return (known.get(rule.baseKey) ?? []).map((date) => addDays(date, rule.offsetDays));
  }
}

function backToSchoolDates(setting: string, firstYear: number, lastYear: number): IsoDate[] {
  if (isIsoDate(setting)) return [setting];
  const match = /^(\d{2})-(\d{2})$/.exec(setting);
  if (!match) throw new RangeError(`Back-to-school must be YYYY-MM-DD or MM-DD, got "${setting}"`);
  const dates: IsoDate[] = [];
  for (let year = firstYear; year <= lastYear; year++) {
    const date = `${year}-${match[1]}-${match[2]}`;
    if (!isIsoDate(date))
      throw new RangeError(`Back-to-school "${setting}" is not a day of the year`);
    dates.push(date);
  }
  return dates;
}

function checkSellWindow(key: string, days: number): number {
  if (!Number.isInteger(days) || days < 0 || days > 366) {
    throw new RangeError(`Sell window for ${key} must be 0 to 366 whole days, got ${days}`);
  }
  return days;
}

/**
 * Retail occasions of a country between two dates, both included, sorted by date then key.
 * Unknown countries get the widely kept ones only. Throws a RangeError on a bad custom rule.
 */
export function occasionsBetween(
  country: string,
  from: IsoDate,
  to: IsoDate,
  options: OccasionOptions = {},
): Occasion[] {
  if (from > to) return [];
  const firstYear = yearOf(from);
  const lastYear = yearOf(to);
  const overrides = options.sellWindows ?? {};
  const found: Omit<Occasion, 'sellWindowStart' | 'kind'>[] = [];
  const known = new Map<string, IsoDate[]>();

  for (const definition of OCCASIONS_BY_COUNTRY[country] ?? WIDELY_KEPT) {
    const dates = datesOfRule(definition.rule, firstYear, lastYear, known);
    known.set(definition.key, dates);
    const sellWindowDays = checkSellWindow(
      definition.key,
      overrides[definition.key] ?? definition.sellWindowDays,
    );
    for (const date of dates)
      found.push({ key: definition.key, name: definition.name, date, sellWindowDays });
  }
  if (options.backToSchool) {
    const sellWindowDays = checkSellWindow(
      BACK_TO_SCHOOL_KEY,
      overrides[BACK_TO_SCHOOL_KEY] ?? BACK_TO_SCHOOL_SELL_WINDOW_DAYS,
    );
    for (const date of backToSchoolDates(options.backToSchool, firstYear, lastYear)) {
      found.push({ key: BACK_TO_SCHOOL_KEY, name: 'Back to school', date, sellWindowDays });
    }
  }
  for (const custom of options.custom ?? []) {
    const key = custom.key ?? `custom-${slug(custom.name)}`;
    const sellWindowDays = checkSellWindow(
      key,
      overrides[key] ?? custom.sellWindowDays ?? DEFAULT_CUSTOM_SELL_WINDOW_DAYS,
    );
    const dates = [...(custom.dates ?? [])];
    if (custom.rrule) {
      const check = validateRrule(custom.rrule);
      if (!check.ok) throw new RangeError(`${custom.name}: ${check.message}`);
      const anchor = custom.start ?? '2000-01-01';
      dates.push(...expandRule(custom.rrule, anchor, from, to));
      if (custom.start && !dates.includes(custom.start)) dates.push(custom.start);
    }
    for (const date of new Set(dates)) found.push({ key, name: custom.name, date, sellWindowDays });
  }

  return found
    .filter((occasion) => occasion.date >= from && occasion.date <= to)
    .map((occasion) => ({
      ...occasion,
      sellWindowStart: addDays(occasion.date, -occasion.sellWindowDays),
      kind: 'occasion' as const,
    }))
    .sort((a, b) =>
      a.date < b.date ? -1 : a.date > b.date ? 1 : a.key < b.key ? -1 : a.key > b.key ? 1 : 0,
    );
}
