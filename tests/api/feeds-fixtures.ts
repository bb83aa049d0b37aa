import type { Knex } from 'knex';
import ICAL from 'ical.js';
import { addDays, daysBetween } from '@shared/calendar/dates';
import { todayInZone } from '../../server/occasions/studio-today';

// Rows of the calendar engine's tables (events, markets) as the feed tests need them.

export function studioToday(timezone = 'America/New_York'): string {
  return todayInZone(timezone);
}

export async function addStep(
  db: Knex,
  studioId: number,
  step: { title: string; start: string | null; end?: string | null; assignee?: number | null; kind?: string; notes?: string | null; cautions?: string[]; sequence?: number },
): Promise<number> {
  const end = step.start ? (step.end ?? step.start) : null;
  const [id] = await db('events').insert({
    studio_id: studioId,
    kind: step.kind ?? 'build',
    title: step.title,
    start_date: step.start,
    end_date: end,
    days: step.start ? JSON.stringify([step.start]) : null,
    span_days: step.start && end ? daysBetween(step.start, end) : null,
    work_days: 1,
    hours_per_day: 4,
    cure_days: 0,
    cautions: JSON.stringify(step.cautions ?? []),
    notes: step.notes ?? null,
    assignee_user_id: step.assignee ?? null,
    sequence: step.sequence ?? 0,
  });
  return id;
}

export async function addMarket(
  db: Knex,
  studioId: number,
  market: { name: string; start: string; rrule?: string | null; exdates?: string[]; rdates?: string[]; deadline?: string | null; place?: string },
): Promise<number> {
  const [id] = await db('markets').insert({
    studio_id: studioId,
    name: market.name,
    place: market.place ?? 'Old grain hall',
    start: market.start,
    rrule: market.rrule ?? null,
    exdates: JSON.stringify(market.exdates ?? []),
    rdates: JSON.stringify(market.rdates ?? []),
    application_deadline: market.deadline ?? null,
  });
  return id;
}

/** Parses a feed with ical.js, a general-purpose iCalendar library, and lists its events. */
export function parseFeed(feed: string | Buffer) {
  const calendar = new ICAL.Component(ICAL.parse(feed.toString()));
  const events = calendar.getAllSubcomponents('vevent').map((component) => {
    const event = new ICAL.Event(component);
    const start = component.getFirstProperty('dtstart')!;
    const end = component.getFirstProperty('dtend')!;
    return {
      uid: event.uid,
      summary: event.summary,
      description: event.description,
      location: event.location,
      sequence: event.sequence,
      startType: start.type,
      start: (start.getFirstValue() as ICAL.Time).toString(),
      end: (end.getFirstValue() as ICAL.Time).toString(),
      stamp: component.getFirstPropertyValue('dtstamp')?.toString(),
      rrule: component.getFirstPropertyValue('rrule')?.toString() ?? null,
      exdates: component.getAllProperties('exdate').flatMap((property) => property.getValues().map(String)),
      rdates: component.getAllProperties('rdate').flatMap((property) => property.getValues().map(String)),
      category: component.getFirstPropertyValue('categories')?.toString(),
      url: component.getFirstPropertyValue('url')?.toString(),
      isRecurring: event.isRecurring(),
      event,
    };
  });
  return { calendar, events };
}

export const inDays = (today: string, days: number) => addDays(today, days);
