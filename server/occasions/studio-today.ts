import type { Knex } from 'knex';
import { OccasionRepository } from './occasion-repository';

/** Today's date in an IANA time zone, as YYYY-MM-DD: a studio's "today" is its own wall clock. */
export function todayInZone(timezone: string, now = new Date()): string {
  const format = formatterFor(timezone);
  return format ? format.format(now) : now.toISOString().slice(0, 10);
}

// Making a DateTimeFormat costs far more than using one, and every calendar request asks.
const formatters = new Map<string, Intl.DateTimeFormat | null>();

function formatterFor(timezone: string): Intl.DateTimeFormat | null {
  let format = formatters.get(timezone);
  if (format === undefined) {
    try {
      // en-CA writes dates as YYYY-MM-DD.
      format = new Intl.DateTimeFormat('en-CA', { timeZone: timezone, year: 'numeric', month: '2-digit', day: '2-digit' });
    } catch {
      format = null;
    }
    if (formatters.size > 1000) formatters.clear();
    formatters.set(timezone, format);
  }
  return format;
}

export async function todayIn(db: Knex, studioId: number): Promise<string> {
  const settings = await new OccasionRepository(db).studioSettings(studioId);
  return todayInZone(settings?.timezone ?? 'UTC');
}
