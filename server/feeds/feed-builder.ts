import ical, { ICalCalendarMethod, ICalEvent, type ICalCalendar } from 'ical-generator';
import type { IsoDate } from '@shared/calendar/dates';
import { allDayRrule } from '@shared/calendar/recurrence';

/** One VEVENT of a feed: an all-day event, or a recurring one described by an RRULE. */
export interface FeedItem {
  uid: string;
  title: string;
  start: IsoDate;
  /** Inclusive last day; written as the exclusive DTEND the standard asks for. */
  end: IsoDate;
  sequence: number;
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

const DAY_MS = 86_400_000;
// Invalid dates make an Invalid Date, which ical-generator refuses ("`start` has to be a valid date").
const utcMidnight = (date: IsoDate) => new Date(`${date}T00:00:00Z`);
const compact = (date: IsoDate) => date.replaceAll('-', '');

// Recurring markets stay one VEVENT with RRULE, EXDATE and RDATE (RFC 5545 §3.8.5), never expanded.
function recurrenceLines(item: FeedItem): string | null {
  if (!item.rrule) return null;
  const lines = [`RRULE:${allDayRrule(item.rrule)}`];
  if (item.exdates?.length) lines.push(`EXDATE;VALUE=DATE:${item.exdates.map(compact).join(',')}`);
  if (item.rdates?.length) lines.push(`RDATE;VALUE=DATE:${item.rdates.map(compact).join(',')}`);
  return lines.join('\n');
}

const nonAscii = /[^\x00-\x7f]/;
function isAscii(line: string): boolean {
  return !nonAscii.test(line);
}

function utf8Length(codePoint: number): number {
  return codePoint < 0x80 ? 1 : codePoint < 0x800 ? 2 : codePoint < 0x10000 ? 3 : 4;
}

/** One content line folded: CRLF and a space before each 75th octet, never inside a UTF-8 character. */
function foldLine(line: string): string {
  // ASCII lines (almost all of them): one octet a character, so fold by slicing.
  if (isAscii(line)) {
    let folded = line.slice(0, 75);
    for (let at = 75; at < line.length; at += 74) folded += `\r\n ${line.slice(at, at + 74)}`;
    return folded;
  }
  let folded = '';
  let octets = 0;
  for (const char of line) {
    const size = utf8Length(char.codePointAt(0)!);
    if (octets + size > 75) {
      folded += '\r\n ';
      octets = 1;
    }
    folded += char;
    octets += size;
  }
  return folded;
}

/**
 * RFC 5545 §3.1: lines longer than 75 octets are folded with CRLF and one space, never inside a
 * UTF-8 character. (ical-generator folds too, but counts octets with a new TextEncoder per
 * character, which takes seconds for a feed of thousands of events; this is the same rule, linear.)
 * Lines that fit are copied through untouched, and text with none to fold comes back as it is.
 */
export function foldLines(text: string): string {
  let out = '';
  let copied = 0;
  for (let start = 0; start <= text.length; ) {
    let end = text.indexOf('\r\n', start);
    if (end < 0) end = text.length;
    const length = end - start;
    if (length > 75 / 4 && (length > 75 || !isAscii(text.slice(start, end))) && Buffer.byteLength(text.slice(start, end), 'utf8') > 75) {
      out += text.slice(copied, start) + foldLine(text.slice(start, end));
      copied = end;
    }
    start = end + 2;
  }
  return copied === 0 ? text : out + text.slice(copied);
}

// Each VEVENT's folded text as UTF-8, written once by ical-generator and kept while its content stays the
// same; DTSTAMP (the time the whole feed was last modified) is spliced in, so one changed event
// does not rewrite the other thousands. Bounded; the oldest entries go first.
const STAMP_SENTINEL = new Date(Date.UTC(1970, 0, 1));
const SENTINEL_LINE = 'DTSTAMP:19700101T000000Z';
const CACHE_LIMIT = 50_000;
/** A VEVENT's UTF-8 bytes with the sentinel DTSTAMP in them, and where that DTSTAMP's line starts. */
interface EventBytes {
  bytes: Buffer;
  stampAt: number;
}
const eventCache = new Map<string, { item: FeedItem; event: EventBytes }>();

// Every field of a FeedItem, so a cached VEVENT is reused only when the item is the same in all of
// them (the type check below fails when a field is added to FeedItem and not here).
const ITEM_FIELDS = ['uid', 'title', 'start', 'end', 'sequence', 'description', 'url', 'location', 'category', 'rrule', 'exdates', 'rdates'] as const;
const everyField: Exclude<keyof FeedItem, (typeof ITEM_FIELDS)[number]> extends never ? true : never = true;

function sameItem(a: FeedItem, b: FeedItem): boolean {
  for (const field of ITEM_FIELDS) {
    const [x, y] = [a[field] ?? null, b[field] ?? null];
    if (x === y) continue;
    if (!Array.isArray(x) || !Array.isArray(y) || x.length !== y.length || x.some((date, index) => date !== y[index])) return false;
  }
  return everyField;
}

function stampText(date: Date): string {
  return `DTSTAMP:${date.toISOString().slice(0, 19).replace(/[-:]/g, '')}Z`;
}

function eventBytes(calendar: ICalCalendar, item: FeedItem): EventBytes {
  const cached = eventCache.get(item.uid);
  if (cached && sameItem(cached.item, item)) return cached.event;
  // An event bound to the calendar but not added to it: it is garbage as soon as its text is kept,
  // so a build of thousands does not hold every event object until the end.
  const vevent = new ICalEvent(
    {
      id: item.uid,
      allDay: true,
      start: utcMidnight(item.start),
      end: new Date(utcMidnight(item.end).getTime() + DAY_MS),
      summary: item.title,
      description: item.description,
      url: item.url,
      location: item.location || undefined,
      sequence: item.sequence,
      stamp: STAMP_SENTINEL,
      categories: [{ name: item.category }],
      repeating: recurrenceLines(item),
    },
    calendar,
  );
  const text = foldLines(vevent.toString());
  const bytes = Buffer.from(text);
  const event = { bytes, stampAt: bytes.indexOf(SENTINEL_LINE) };
  if (!cached && eventCache.size >= CACHE_LIMIT) eventCache.delete(eventCache.keys().next().value!);
  eventCache.set(item.uid, { item, event });
  return event;
}

/** Forgets every cached VEVENT (the benchmark measures a cold build with it). */
export function clearFeedCache(): void {
  eventCache.clear();
}

/**
 * Builds an RFC 5545 calendar with ical-generator: all-day DATE events with an exclusive DTEND,
 * stable UIDs, DTSTAMP, SEQUENCE; ical-generator escapes TEXT values. Dates are handed over as UTC
 * midnights with no calendar time zone set, so DATE values never depend on the server's own zone;
 * the studio's zone is named by X-WR-TIMEZONE. The calendar's properties come first and the events
 * after them (RFC 5545 §3.6), each written by ical-generator and folded by foldLines.
 */
export function buildFeed(feed: FeedCalendar, stamp: Date): Buffer {
  const calendar = ical({
    name: feed.name,
    prodId: { company: 'Kerfcast', product: 'Kerfcast feeds', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
    ttl: feed.refreshSeconds,
    x: [['X-WR-TIMEZONE', feed.timezone]],
  });
  const header = Buffer.from(calendar.toString().replace(/\r\nEND:VCALENDAR(\r\n)?$/, '\r\n'));
  const footer = Buffer.from('END:VCALENDAR\r\n');
  // The cached VEVENTs are UTF-8 bytes: the feed is put together by copying them into one buffer
  // and writing this build's DTSTAMP over each sentinel (both are 24 octets).
  const stampLine = Buffer.from(stampText(stamp));
  const events = feed.items.map((item) => eventBytes(calendar, item));
  const out = Buffer.allocUnsafe(events.reduce((length, event) => length + event.bytes.length, header.length + footer.length));
  out.set(header, 0);
  let offset = header.length;
  for (const { bytes, stampAt } of events) {
    out.set(bytes, offset);
    out.set(stampLine, offset + stampAt);
    offset += bytes.length;
  }
  out.set(footer, offset);
  return out;
}
