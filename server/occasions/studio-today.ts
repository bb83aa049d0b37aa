import type { Knex } from 'knex';
import { OccasionRepository } from './occasion-repository';

/** Today's date in an IANA time zone, as YYYY-MM-DD: a studio's "today" is its own wall clock. */
export function todayInZone(timezone: string, now = new Date()): string {
  try {
    return new Intl.DateTimeFormat('en-CA', { timeZone: timezone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
  } catch {
    return now.toISOString().slice(0, 10);
  }
}

export async function todayIn(db: Knex, studioId: number): Promise<string> {
  const settings = await new OccasionRepository(db).studioSettings(studioId);
  return todayInZone(settings?.timezone ?? 'UTC');
}
