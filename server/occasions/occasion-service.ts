import type { Knex } from 'knex';
import { addDays } from '@shared/calendar/dates';
import { occasionDefaults, occasionsBetween } from '@shared/calendar/occasions';
import type { BlackoutView, BlackoutsRequest, OccasionSettingsRequest, OccasionSettingsView, UpcomingTarget } from '@shared/contracts/markets';
import { AppError } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { customKey, OccasionRepository } from './occasion-repository';
import { holidaysOf, loadStudioCalendar, marketDaysOf, occasionsOf } from './studio-calendar';

function invalid(path: (string | number)[], message: string): AppError {
  return new AppError('invalid_input', 400, `${path.join('.')}: ${message}`, [{ path, message }]);
}

export class OccasionService {
  private readonly repository: OccasionRepository;

  constructor(private readonly db: Knex) {
    this.repository = new OccasionRepository(db);
  }

  async settings(studio: StudioContext): Promise<OccasionSettingsView> {
    const calendar = await loadStudioCalendar(this.db, studio.id);
    return {
      builtIn: occasionDefaults(calendar.settings.country).map((occasion) => ({
        ...occasion,
        defaultSellWindowDays: occasion.sellWindowDays,
        sellWindowDays: calendar.sellWindows[occasion.key] ?? occasion.sellWindowDays,
      })),
      custom: calendar.custom.map((occasion) => ({ ...occasion, key: customKey(occasion) })),
      sellWindows: calendar.sellWindows,
      backToSchool: calendar.settings.back_to_school,
    };
  }

  /** Replaces the studio's occasion settings after checking they all make sense together. */
  async replace(studio: StudioContext, request: OccasionSettingsRequest): Promise<OccasionSettingsView> {
    const calendar = await loadStudioCalendar(this.db, studio.id);
    const builtInKeys = new Set(occasionDefaults(calendar.settings.country).map((occasion) => occasion.key));
    const customKeys = new Set<string>();
    request.custom.forEach((occasion, index) => {
      const key = customKey(occasion);
      if (builtInKeys.has(key) || customKeys.has(key)) throw invalid(['custom', index, 'name'], `another occasion already uses the key "${key}"`);
      customKeys.add(key);
    });
    for (const key of Object.keys(request.sellWindows)) {
      if (!builtInKeys.has(key) && !customKeys.has(key)) throw invalid(['sellWindows', key], `no occasion "${key}"`);
    }
    try {
      // A dry run over a year catches what the schemas cannot see together (e.g. a rule with no dates).
      occasionsBetween(calendar.settings.country, calendar.today, addDays(calendar.today, 366), {
        custom: request.custom,
        sellWindows: request.sellWindows,
        backToSchool: request.backToSchool ?? undefined,
      });
    } catch (error) {
      if (error instanceof RangeError) throw invalid(['custom'], error.message);
      throw error;
    }
    await this.repository.replaceOccasions(studio.id, request);
    return this.settings(studio);
  }

  /** Dates a theme or runway can target between from and to: occasions, holidays and market days. */
  async upcoming(studio: StudioContext, from: string | undefined, to: string | undefined): Promise<UpcomingTarget[]> {
    const calendar = await loadStudioCalendar(this.db, studio.id);
    const start = from ?? calendar.today;
    const end = to ?? addDays(start, 365);
    if (end < start) throw invalid(['to'], 'to cannot be before from');
    if (end > addDays(start, 2 * 366)) throw invalid(['to'], 'A range is at most two years');
    const targets: UpcomingTarget[] = [
      ...occasionsOf(calendar, start, end).map((occasion) => ({
        kind: 'occasion' as const,
        value: `${occasion.key}:${occasion.date}`,
        key: occasion.key,
        name: occasion.name,
        date: occasion.date,
        sellWindowStart: occasion.sellWindowStart,
      })),
      ...holidaysOf(calendar, start, end).map((holiday) => ({
        kind: 'holiday' as const,
        value: `${holiday.key}:${holiday.date}`,
        key: holiday.key,
        name: holiday.name,
        date: holiday.date,
      })),
      ...marketDaysOf(calendar, start, end).map(({ market, date }) => ({
        kind: 'market' as const,
        value: `${market.id}:${date}`,
        key: String(market.id),
        name: market.name,
        date,
      })),
    ];
    return targets.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0));
  }

  async blackouts(studio: StudioContext): Promise<BlackoutView[]> {
    return this.repository.blackouts(studio.id);
  }

  async replaceBlackouts(studio: StudioContext, request: BlackoutsRequest): Promise<BlackoutView[]> {
    await this.repository.replaceBlackouts(studio.id, request);
    return this.blackouts(studio);
  }
}
