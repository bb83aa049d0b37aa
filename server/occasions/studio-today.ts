import type { Knex } from 'knex';
import { dateInZone } from '@shared/calendar/zone-date';
import { appClock } from '../clock/clock';
import { OccasionRepository } from './occasion-repository';

/**
 * A studio's today in its IANA time zone, as YYYY-MM-DD: its own wall calendar, by the process's
 * clock, or the date `now` falls on there when an instant is given.
 */
export function todayInZone(timezone: string, now?: Date): string {
  return now ? dateInZone(now, timezone) : appClock.today(timezone);
}

export async function todayIn(db: Knex, studioId: number): Promise<string> {
  const settings = await new OccasionRepository(db).studioSettings(studioId);
  return todayInZone(settings?.timezone ?? 'UTC');
}
