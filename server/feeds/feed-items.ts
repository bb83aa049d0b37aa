import { addDays, type IsoDate } from '@shared/calendar/dates';
import type { CalendarEvent } from '@shared/contracts/calendar';
import type { MarketRow } from '../markets/market-repository';
import { parseDates } from '../markets/market-service';
import type { FeedItem } from './feed-builder';

// Turns the calendar engine's events and market rows into feed items: what each says and links to.

export const CAUTION_DEFERRAL = 'These remind; your machine manuals, local codes and licensed professionals have the last word.';

export interface ItemContext {
  studioId: number;
  publicUrl: string;
  /** The host part of stable UIDs, e.g. "kerfcast.example.org". */
  uidHost: string;
}

function calendarLink(context: ItemContext, date: IsoDate): string {
  return `${context.publicUrl}/studios/${context.studioId}/calendar?date=${date}`;
}

function describe(lines: (string | null | undefined | false)[], link: string): string {
  return [...lines.filter((line): line is string => Boolean(line)), `Open in Kerfcast: ${link}`].join('\n');
}

/** "Design · Winter window stars": a step named with what it is for, its theme or else its runway. */
export function stepTitle(event: Pick<CalendarEvent, 'title' | 'done' | 'themeName' | 'runwayName'>): string {
  const forWhat = event.themeName ?? event.runwayName;
  const title = forWhat ? `${event.title} · ${forWhat}` : event.title;
  return event.done ? `✓ ${title}` : title;
}

/** A stored step (build, content or launch): notes, theme, who, cautions, and a link back. */
export function stepItem(event: CalendarEvent & { sequence?: number }, context: ItemContext): FeedItem {
  const link = calendarLink(context, event.start);
  const cautions = event.cautions ?? [];
  return {
    uid: `kerfcast-event-${event.id}@${context.uidHost}`,
    title: stepTitle(event),
    start: event.start,
    end: event.end,
    sequence: event.sequence ?? 0,
    category: event.kind,
    url: link,
    description: describe(
      [
        event.themeName && `Theme: ${event.themeName}`,
        event.runwayName && `Runway: ${event.runwayName}`,
        event.assigneeName && `Assigned to: ${event.assigneeName}`,
        event.hoursPerDay ? `${event.hoursPerDay} h a day` : null,
        event.cureDays ? `Then ${event.cureDays} day(s) to cure` : null,
        event.notes && `Notes: ${event.notes}`,
        cautions.length > 0 && `Cautions:\n${cautions.map((caution) => `- ${caution}`).join('\n')}\n${CAUTION_DEFERRAL}`,
      ],
      link,
    ),
  };
}

/** A computed one-day event (holiday, occasion, deadline): its key is stable, so is the UID. */
export function ruleItem(event: CalendarEvent, context: ItemContext): FeedItem {
  const link = calendarLink(context, event.start);
  return {
    uid: `kerfcast-${event.id.replace(/[^A-Za-z0-9-]+/g, '-')}-${context.studioId}@${context.uidHost}`,
    title: event.title,
    start: event.start,
    end: event.end,
    sequence: 0,
    category: event.kind,
    url: link,
    location: event.place ?? null,
    description: describe([event.sellWindowStart && `Sell window from ${event.sellWindowStart}`], link),
  };
}

/** A market as one VEVENT; a recurring one keeps its RRULE, EXDATE and RDATE. */
export function marketItem(market: MarketRow, context: ItemContext): FeedItem {
  const link = calendarLink(context, market.start);
  const fee = market.booth_fee_cents === null ? null : `Booth fee: ${(Number(market.booth_fee_cents) / 100).toFixed(2)}`;
  return {
    uid: `kerfcast-market-${market.id}@${context.uidHost}`,
    title: market.name,
    start: market.start,
    end: market.start,
    sequence: Math.max(0, market.version - 1),
    category: 'market',
    url: link,
    location: market.place || null,
    rrule: market.rrule,
    exdates: market.rrule ? parseDates(market.exdates) : [],
    rdates: market.rrule ? parseDates(market.rdates) : [],
    description: describe(
      [
        market.hours && `Hours: ${market.hours}`,
        fee,
        market.kits_allowed ? 'Kits allowed' : null,
        market.notes && `Notes: ${market.notes}`,
      ],
      link,
    ),
  };
}

/** A market without RRULE but with extra dates: each RDATE becomes its own one-day item. */
export function extraMarketDays(market: MarketRow, context: ItemContext): FeedItem[] {
  if (market.rrule) return [];
  return parseDates(market.rdates)
    .filter((date) => date !== market.start)
    .map((date) => ({ ...marketItem(market, context), uid: `kerfcast-market-${market.id}-${date}@${context.uidHost}`, start: date, end: date }));
}

export const windowOf = (today: IsoDate) => ({ from: addDays(today, -180), to: addDays(today, 730) });
