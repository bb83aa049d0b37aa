import ical, { ICalCalendarMethod } from 'ical-generator';
import { addDays, type IsoDate } from '@shared/calendar/dates';

/** One VEVENT of a feed: an all-day event, or a recurring one described by an RRULE. */
export interface FeedItem {
  uid: string;
  title: string;
  start: IsoDate;
  /** Inclusive last day; written as the exclusive DTEND the standard asks for. */
  end: IsoDate;
  sequence: number;
  stamp: Date;
  description: string;
  url: string;
  location?: string | null;
  category: string;
  /** RFC 5545 RECUR text without the "RRULE:" prefix. */
  rrule?: string | null;
  exdates?: IsoDate[];
  rdates?: IsoDate[];
}

export interface FeedCalendar {
  name: string;
  timezone: string;
  /** How often calendar apps should refetch, in seconds (X-PUBLISHED-TTL and REFRESH-INTERVAL). */
  refreshSeconds: number;
  items: FeedItem[];
}

const utcMidnight = (date: IsoDate) => new Date(`${date}T00:00:00Z`);
const compact = (date: IsoDate) => date.replaceAll('-', '');

// Recurring markets stay one VEVENT with RRULE, EXDATE and RDATE (RFC 5545 §3.8.5), never expanded.
function recurrenceLines(item: FeedItem): string | null {
  if (!item.rrule) return null;
  const lines = [`RRULE:${item.rrule.replace(/^RRULE:/i, '')}`];
  if (item.exdates?.length) lines.push(`EXDATE;VALUE=DATE:${item.exdates.map(compact).join(',')}`);
  if (item.rdates?.length) lines.push(`RDATE;VALUE=DATE:${item.rdates.map(compact).join(',')}`);
  return lines.join('\n');
}

/**
 * Builds an RFC 5545 calendar with ical-generator: all-day DATE events with an exclusive DTEND,
 * stable UIDs, DTSTAMP, SEQUENCE; ical-generator escapes TEXT values and folds lines at 75 octets.
 * Dates are handed over as UTC midnights with no calendar time zone set, so DATE values never
 * depend on the server's own zone; the studio's zone is named by X-WR-TIMEZONE.
 */
export function buildFeed(feed: FeedCalendar): string {
  const calendar = ical({
    name: feed.name,
    prodId: { company: 'Kerfcast', product: 'Kerfcast feeds', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
    ttl: feed.refreshSeconds,
    x: [['X-WR-TIMEZONE', feed.timezone]],
  });
  for (const item of feed.items) {
    calendar.createEvent({
      id: item.uid,
      allDay: true,
      start: utcMidnight(item.start),
      end: utcMidnight(addDays(item.end, 1)),
      summary: item.title,
      description: item.description,
      url: item.url,
      location: item.location || undefined,
      sequence: item.sequence,
      stamp: item.stamp,
      categories: [{ name: item.category }],
      repeating: recurrenceLines(item),
    });
  }
  return calendar.toString();
}
