// Turns a target key (?target=, or a theme's pick) into the window heat is scored against.
import { addDays } from '@shared/calendar/dates';
import { publicHolidays } from '@shared/calendar/holidays';
import { occasionsBetween, type OccasionOptions } from '@shared/calendar/occasions';
import type { TargetChoices, TargetWindow } from '@shared/contracts/series';
import type { ThemeTargetKind } from '@shared/contracts/themes';
import { AppError } from '../http/app-error';
import type { MarketRow } from '../markets/market-repository';
import { marketDates } from '../markets/market-service';

export interface StudioPlace {
  timezone: string;
  country: string;
  region: string | null;
  /** The studio's own occasions, sell windows and back-to-school day (calendar settings). */
  occasions?: OccasionOptions;
  markets?: Pick<MarketRow, 'id' | 'name' | 'start' | 'rrule' | 'exdates' | 'rdates'>[];
}

/** A public holiday or a market has no sell window of its own; four weeks before it is our default (ours). */
export const HOLIDAY_SELL_WINDOW_DAYS = 28;
const LOOK_AHEAD_DAYS = 400;
const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

export function monthWindow(month: string): TargetWindow {
  const [year, monthNumber] = month.split('-').map(Number);
  const last = new Date(Date.UTC(year, monthNumber, 0)).getUTCDate();
  return { key: month, label: `${MONTH_NAMES[monthNumber - 1]} ${year}`, from: `${month}-01`, to: `${month}-${String(last).padStart(2, '0')}` };
}

function badTarget(message: string): AppError {
  return new AppError('invalid_input', 400, `target: ${message}`, [{ path: ['target'], message }]);
}

function upcomingOccasions(place: StudioPlace, today: string) {
  return occasionsBetween(place.country, addDays(today, 1), addDays(today, LOOK_AHEAD_DAYS), place.occasions);
}

/** Each market's next day after today, soonest first. */
function upcomingMarkets(place: StudioPlace, today: string): TargetWindow[] {
  const windows: TargetWindow[] = [];
  for (const market of place.markets ?? []) {
    const [next] = marketDates(market as MarketRow, addDays(today, 1), addDays(today, LOOK_AHEAD_DAYS));
    if (next) windows.push({ key: `market:${market.id}`, label: `${market.name} ${next}`, from: addDays(next, -HOLIDAY_SELL_WINDOW_DAYS), to: next });
  }
  return windows.sort((a, b) => a.to.localeCompare(b.to));
}

function upcomingHolidays(place: StudioPlace, today: string) {
  try {
    return publicHolidays(place.country, place.region ?? undefined, addDays(today, 1), addDays(today, LOOK_AHEAD_DAYS));
  } catch {
    return [];
  }
}

/** null for the empty key (each series' own next peak); a 400 for a key that names nothing. */
export function resolveTarget(key: string | undefined, place: StudioPlace, today: string): TargetWindow | null {
  if (!key) return null;
  if (/^\d{4}-\d{2}$/.test(key)) return monthWindow(key);
  const [kind, value] = [key.slice(0, key.indexOf(':')), key.slice(key.indexOf(':') + 1)];
  if (kind === 'date') {
    if (Number.isNaN(Date.parse(`${value}T00:00:00Z`)) || new Date(`${value}T00:00:00Z`).toISOString().slice(0, 10) !== value) {
      throw badTarget(`${value} is not a real date`);
    }
    return { key, label: value, from: value, to: value };
  }
  if (kind === 'occasion') {
    const next = upcomingOccasions(place, today).find((occasion) => occasion.key === value);
    if (!next) throw badTarget(`no occasion "${value}" in the next year for ${place.country}`);
    return { key, label: `${next.name} ${next.date}`, from: next.sellWindowStart, to: next.date };
  }
  if (kind === 'holiday') {
    const next = upcomingHolidays(place, today).find((holiday) => holiday.key === value);
    if (!next) throw badTarget(`no public holiday "${value}" in the next year for ${place.country}`);
    return { key, label: `${next.name} ${next.date}`, from: addDays(next.date, -HOLIDAY_SELL_WINDOW_DAYS), to: next.date };
  }
  if (kind === 'market') {
    const next = upcomingMarkets(place, today).find((market) => market.key === key);
    if (!next) throw badTarget(`no market ${value} of this studio in the next year`);
    return next;
  }
  throw badTarget(`"${key}" is not a target`);
}

/** Words for a key the calendar no longer knows: "back-to-school" reads "Back to school". */
function keyAsWords(key: string): string {
  const words = key.replace(/-/g, ' ').trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/**
 * What a stored target is called on screen, whether or not it still resolves to a coming date:
 * the month, the occasion's, holiday's or market's own name, never its key.
 */
export function targetLabelOf(kind: ThemeTargetKind, value: string, place: StudioPlace, today: string): string {
  if (kind === 'month') return /^\d{4}-\d{2}$/.test(value) ? monthWindow(value).label : value;
  if (kind === 'date') return value;
  if (kind === 'occasion') return upcomingOccasions(place, today).find((occasion) => occasion.key === value)?.name ?? keyAsWords(value);
  if (kind === 'holiday') return upcomingHolidays(place, today).find((holiday) => holiday.key === value)?.name ?? keyAsWords(value);
  return place.markets?.find((market) => String(market.id) === value)?.name ?? 'a market no longer listed';
}

/** The ?target= key of a theme's stored target. */
export function targetKeyOf(kind: ThemeTargetKind, value: string): string {
  return kind === 'month' ? value : `${kind}:${value}`;
}

export function targetChoices(place: StudioPlace, today: string): TargetChoices {
  const [year, month] = today.split('-').map(Number);
  const months: TargetWindow[] = [];
  for (let ahead = 1; ahead <= 12; ahead++) {
    const index = month - 1 + ahead;
    months.push(monthWindow(`${year + Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`));
  }
  const seen = new Set<string>();
  const occasions = upcomingOccasions(place, today)
    .filter((occasion) => !seen.has(occasion.key) && seen.add(occasion.key))
    .map((occasion) => ({ key: `occasion:${occasion.key}`, label: `${occasion.name} ${occasion.date}`, from: occasion.sellWindowStart, to: occasion.date }));
  const holidays = upcomingHolidays(place, today)
    .filter((holiday) => !seen.has(holiday.key) && seen.add(holiday.key))
    .map((holiday) => ({ key: `holiday:${holiday.key}`, label: `${holiday.name} ${holiday.date}`, from: addDays(holiday.date, -HOLIDAY_SELL_WINDOW_DAYS), to: holiday.date }));
  return { today, months, occasions, holidays, markets: upcomingMarkets(place, today) };
}
