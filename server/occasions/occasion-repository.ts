import type { Knex } from 'knex';
import type { CustomOccasion } from '@shared/calendar/occasions';
import type { BlackoutsRequest, OccasionSettingsRequest } from '@shared/contracts/markets';

export interface StudioCalendarRow {
  timezone: string;
  country: string;
  region: string | null;
  work_days: string;
  daily_capacity_hours: number;
  holidays_off: boolean;
  back_to_school: string | null;
}

export interface BlackoutRow {
  start: string;
  end: string;
  note: string | null;
}

interface OccasionRow {
  occasion_key: string;
  name: string;
  rrule: string | null;
  start: string | null;
  dates: string | null;
  sell_window_days: number | null;
}

function toCustom(row: OccasionRow): CustomOccasion {
  const occasion: CustomOccasion = { key: row.occasion_key, name: row.name };
  if (row.rrule) occasion.rrule = row.rrule;
  if (row.start) occasion.start = row.start;
  const dates = row.dates ? (JSON.parse(row.dates) as string[]) : [];
  if (dates.length) occasion.dates = dates;
  if (row.sell_window_days !== null) occasion.sellWindowDays = row.sell_window_days;
  return occasion;
}

export function customKey(occasion: { key?: string; name: string }): string {
  return occasion.key ?? `custom-${occasion.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}`;
}

export class OccasionRepository {
  constructor(private readonly db: Knex) {}

  studioSettings(studioId: number): Promise<StudioCalendarRow | undefined> {
    return this.db('studios')
      .where({ id: studioId })
      .first('timezone', 'country', 'region', 'work_days', 'daily_capacity_hours', 'holidays_off', 'back_to_school');
  }

  async custom(studioId: number): Promise<CustomOccasion[]> {
    const rows: OccasionRow[] = await this.db('studio_occasions').where({ studio_id: studioId }).orderBy('id');
    return rows.map(toCustom);
  }

  async sellWindows(studioId: number): Promise<Record<string, number>> {
    const rows = await this.db('studio_sell_windows').where({ studio_id: studioId }).select('occasion_key', 'days');
    return Object.fromEntries(rows.map((row: { occasion_key: string; days: number }) => [row.occasion_key, row.days]));
  }

  blackouts(studioId: number): Promise<BlackoutRow[]> {
    return this.db('studio_blackouts').where({ studio_id: studioId }).orderBy([{ column: 'start' }, { column: 'id' }]).select('start', 'end', 'note');
  }

  /** Replaces all occasion settings in one transaction: nothing partial is stored. */
  async replaceOccasions(studioId: number, settings: OccasionSettingsRequest): Promise<void> {
    await this.db.transaction(async (trx) => {
      await trx('studio_occasions').where({ studio_id: studioId }).delete();
      await trx('studio_sell_windows').where({ studio_id: studioId }).delete();
      if (settings.custom.length) {
        await trx('studio_occasions').insert(
          settings.custom.map((occasion) => ({
            studio_id: studioId,
            occasion_key: customKey(occasion),
            name: occasion.name,
            rrule: occasion.rrule ?? null,
            start: occasion.start ?? null,
            dates: occasion.dates ? JSON.stringify(occasion.dates) : null,
            sell_window_days: occasion.sellWindowDays ?? null,
          })),
        );
      }
      const windows = Object.entries(settings.sellWindows);
      if (windows.length) {
        await trx('studio_sell_windows').insert(windows.map(([key, days]) => ({ studio_id: studioId, occasion_key: key, days })));
      }
      await trx('studios').where({ id: studioId }).update({ back_to_school: settings.backToSchool });
    });
  }

  async replaceBlackouts(studioId: number, request: BlackoutsRequest): Promise<void> {
    await this.db.transaction(async (trx) => {
      await trx('studio_blackouts').where({ studio_id: studioId }).delete();
      if (request.blackouts.length) {
        await trx('studio_blackouts').insert(
          request.blackouts.map((blackout) => ({
            studio_id: studioId,
            start: blackout.start,
            end: blackout.end ?? blackout.start,
            note: blackout.note ?? null,
          })),
        );
      }
    });
  }
}
