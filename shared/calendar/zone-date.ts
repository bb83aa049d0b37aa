import { fromUtcDate, type IsoDate } from './dates';

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

/** The calendar date an instant falls on in an IANA time zone (UTC's for a zone Intl does not know). */
export function dateInZone(instant: Date, timezone: string): IsoDate {
  const format = formatterFor(timezone);
  return format ? format.format(instant) : fromUtcDate(instant);
}
