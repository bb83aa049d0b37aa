import { appClock } from '../clock/clock';
import type { Knex } from 'knex';
import { addDays } from '@shared/calendar/dates';
import type { Role } from '@shared/contracts/auth';
import type { StudioSettings, StudioSettingsPatch, StudioSummary } from '@shared/contracts/studios';
import { defaultChannels } from '@shared/csv';

interface StudioRow {
  id: number;
  name: string;
  timezone: string;
  country: string;
  region: string | null;
  week_start: number;
  work_days: string;
  daily_capacity_hours: number;
  holidays_off: boolean;
  channels: string | null;
  version: number;
}

/** The studio's sales channels: its own list, or the default one. */
export function channelsOf(text: string | null): string[] {
  return text ? (JSON.parse(text) as string[]) : [...defaultChannels];
}

function toSettings(row: StudioRow, role: Role): StudioSettings {
  return {
    id: row.id,
    name: row.name,
    timezone: row.timezone,
    country: row.country,
    region: row.region,
    weekStart: row.week_start === 7 ? 7 : 1,
    workDays: row.work_days.split(',').filter(Boolean).map(Number),
    dailyCapacityHours: row.daily_capacity_hours,
    holidaysOff: Boolean(row.holidays_off),
    channels: channelsOf(row.channels),
    version: row.version,
    role,
  };
}

export class StudioRepository {
  constructor(private readonly db: Knex) {}

  async find(studioId: number, role: Role): Promise<StudioSettings | null> {
    const row = await this.db<StudioRow>('studios').where({ id: studioId }).first();
    return row ? toSettings(row, role) : null;
  }

  /** Returns how many rows changed: 0 means the version was stale. */
  async update(studioId: number, patch: StudioSettingsPatch, version: number | undefined): Promise<number> {
    const changes: Partial<StudioRow> = {};
    if (patch.name !== undefined) changes.name = patch.name;
    if (patch.timezone !== undefined) changes.timezone = patch.timezone;
    if (patch.country !== undefined) changes.country = patch.country;
    if (patch.region !== undefined) changes.region = patch.region;
    if (patch.weekStart !== undefined) changes.week_start = patch.weekStart;
    if (patch.workDays !== undefined) changes.work_days = [...new Set(patch.workDays)].sort().join(',');
    if (patch.dailyCapacityHours !== undefined) changes.daily_capacity_hours = patch.dailyCapacityHours;
    if (patch.holidaysOff !== undefined) changes.holidays_off = patch.holidaysOff;
    if (patch.channels !== undefined) changes.channels = JSON.stringify(patch.channels);
    const query = this.db('studios').where({ id: studioId });
    if (version !== undefined) query.andWhere({ version });
    return query.update({ ...changes, version: this.db.raw('version + 1') });
  }

  async channels(studioId: number): Promise<string[]> {
    const row = await this.db<StudioRow>('studios').where({ id: studioId }).first('channels');
    return channelsOf(row?.channels ?? null);
  }

  async summary(studioId: number): Promise<StudioSummary> {
    const count = async (table: string) =>
      Number((await this.db(table).where({ studio_id: studioId }).count<{ count: number }[]>({ count: '*' }).first())?.count ?? 0);
    // Upcoming work: stored steps not yet done that touch today and the 30 days after it, today
    // being the studio's own (its time zone), not the database server's.
    const studio = await this.db<StudioRow>('studios').where({ id: studioId }).first('timezone');
    const today = appClock.today(studio?.timezone ?? 'UTC');
    const upcoming = this.db('events')
      .where({ studio_id: studioId, done: false })
      .andWhere('start_date', '<=', addDays(today, 30))
      .andWhere('end_date', '>=', today)
      .count<{ count: number }[]>({ count: '*' })
      .first();
    const [seriesCount, themeCount, memberCount, upcomingRow] = await Promise.all([count('series'), count('themes'), count('memberships'), upcoming]);
    return { seriesCount, themeCount, upcomingCount: Number(upcomingRow?.count ?? 0), memberCount };
  }
}
