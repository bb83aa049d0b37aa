import Holidays from 'date-holidays';
import { daysBetween, yearOf, type IsoDate } from './dates';

export interface PublicHoliday {
  /** The day off: the observed (substitute) date where the library gives one. */
  date: IsoDate;
  name: string;
  kind: 'holiday';
  /** Stable per holiday across years, e.g. "us-independence-day"; pair it with `date` for an id. */
  key: string;
  /** The holiday's own date when it is observed on another day (a Saturday Fourth of July). */
  actualDate?: IsoDate;
}

const COUNTRY_CODE = /^[A-Z]{2}$/;
const REGION_CODE = /^[A-Z0-9]{1,3}$/;
// The longest gap the library puts between a holiday and its substitute day (GB: Sat → Mon/Tue).
const SUBSTITUTE_REACH_DAYS = 3;

// The library's rules are fixed data, so its instances and per-year answers are cached: the
// events endpoint asks for the same country on every month view.
const catalogue = new Holidays();
const libraries = new Map<string, Holidays>();
const yearCache = new Map<string, LibraryDay[]>();
const MAX_CACHED_YEARS = 2000;

function libraryFor(country: string, region: string | undefined): Holidays {
  const id = `${country}|${region ?? ''}`;
  let library = libraries.get(id);
  if (!library) {
    const options = { languages: ['en'], types: ['public' as const] };
    library = region ? new Holidays(country, region, options) : new Holidays(country, options);
    libraries.set(id, library);
  }
  return library;
}

function libraryDays(country: string, region: string | undefined, year: number): LibraryDay[] {
  const id = `${country}|${region ?? ''}|${year}`;
  let days = yearCache.get(id);
  if (!days) {
    const library = libraryFor(country, region);
    // A US studio reads the US names ("Labor Day", where the library's English has "Labour Day");
    // keys stay made from the English names, as runway anchors and theme targets store them.
    const shown = country === 'US' ? library.getHolidays(year, 'en-us') : null;
    // Both lists come from the same rules in the same order.
    days = library.getHolidays(year, 'en').flatMap((holiday, index) =>
      holiday.type !== 'public'
        ? []
        : [{ date: holiday.date.slice(0, 10), name: holiday.name, shownName: shown?.[index].name ?? holiday.name, isSubstitute: Boolean(holiday.substitute) }],
    );
    if (yearCache.size >= MAX_CACHED_YEARS) yearCache.clear();
    yearCache.set(id, days);
  }
  return days;
}

/**
 * Whether `country` (ISO 3166-1 alpha-2, e.g. "GB") and the optional `region` (the ISO 3166-2
 * suffix, e.g. "ENG") are known to the holiday data. Checked explicitly because date-holidays
 * quietly falls back to the whole country for a region it does not know.
 */
export function isValidRegion(country: string, region?: string): boolean {
  const id = `${country}|${region ?? ''}`;
  if (knownPlaces.has(id)) return true;
  const isValid = checkPlace(country, region);
  if (isValid) knownPlaces.add(id);
  return isValid;
}

// Only valid places are remembered, so the set stays as small as the holiday data.
const knownPlaces = new Set<string>();

function checkPlace(country: string, region: string | undefined): boolean {
  if (!COUNTRY_CODE.test(country)) return false;
  const countries = catalogue.getCountries('en');
  if (!countries || !(country in countries)) return false;
  if (region === undefined || region === '') return true;
  if (!REGION_CODE.test(region)) return false;
  const regions = catalogue.getStates(country, 'en');
  return Boolean(regions && region in regions);
}

function slug(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
}

interface LibraryDay {
  date: IsoDate;
  /** The library's English name: keys and substitute days are matched on it. */
  name: string;
  /** The name the studio reads. */
  shownName: string;
  isSubstitute: boolean;
}

/**
 * Public holidays (the library's type "public" only: no observances, banks or schools) of a
 * country and region between two dates, both included.
 *
 * date-holidays lists a holiday on its own date and, when it falls on a weekend, a second
 * "substitute day" entry. A studio is closed on the substitute day, so we keep that one, name it
 * as the library does and drop the weekend original (its date stays in `actualDate`). This matches
 * how the US federal lists and the UK bank-holiday lists show them.
 */
export function publicHolidays(
  country: string,
  region: string | undefined,
  from: IsoDate,
  to: IsoDate,
): PublicHoliday[] {
  if (!isValidRegion(country, region)) {
    throw new RangeError(`Unknown country or region: ${country}${region ? `-${region}` : ''}`);
  }
  if (daysBetween(from, to) < 0) return [];
  // One year either side, so a substitute across New Year (31 Dec for 1 Jan) finds its original.
  const days: LibraryDay[] = [];
  for (let year = yearOf(from) - 1; year <= yearOf(to) + 1; year++) {
    days.push(...libraryDays(country, region, year));
  }

  const replaced = new Map<LibraryDay, LibraryDay>();
  for (const substitute of days.filter((day) => day.isSubstitute)) {
    const original = days.find(
      (day) =>
        !day.isSubstitute &&
        !replaced.has(day) &&
        substitute.name.startsWith(day.name) &&
        Math.abs(daysBetween(day.date, substitute.date)) <= SUBSTITUTE_REACH_DAYS,
    );
    if (original) replaced.set(original, substitute);
  }
  const originalOf = new Map([...replaced].map(([original, substitute]) => [substitute, original]));

  const prefix = slug(region ? `${country}-${region}` : country);
  const holidays: PublicHoliday[] = [];
  for (const day of days) {
    if (replaced.has(day) || day.date < from || day.date > to) continue;
    const original = originalOf.get(day);
    const holiday: PublicHoliday = {
      date: day.date,
      name: day.shownName,
      kind: 'holiday',
      key: `${prefix}-${slug(original?.name ?? day.name)}`,
    };
    if (original) holiday.actualDate = original.date;
    holidays.push(holiday);
  }
  holidays.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : a.key < b.key ? -1 : 1));
  return dedupe(holidays);
}

// Two rules can name the same day (a region repeating a national holiday); keep one.
function dedupe(holidays: PublicHoliday[]): PublicHoliday[] {
  const seen = new Set<string>();
  return holidays.filter((holiday) => {
    const id = `${holiday.date}|${holiday.key}`;
    if (seen.has(id)) return false;
    seen.add(id);
    return true;
  });
}

/** The dates alone, for a work calendar's `holidays`. */
export function publicHolidayDates(
  country: string,
  region: string | undefined,
  from: IsoDate,
  to: IsoDate,
): IsoDate[] {
  return [...new Set(publicHolidays(country, region, from, to).map((holiday) => holiday.date))];
}
