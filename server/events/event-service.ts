import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { IsoDate } from '@shared/calendar/dates';
import { AT_HAND_OVERDUE_LIMIT, type AtHand, type CalendarEvent, type StepProblem, type TrayStep } from '@shared/contracts/calendar';
import { notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { OccasionRepository } from '../occasions/occasion-repository';
import { holidaysOf, loadStudioCalendar, marketDaysOf, occasionsOf, type StudioCalendar } from '../occasions/studio-calendar';
import { EventRepository, type EventRow } from './event-repository';
import { toCalendarEvent, toStoredView, toTrayStep } from './event-views';
import { stepProblems } from './step-problems';

const KIND_ORDER: Record<string, number> = { holiday: 0, occasion: 1, market: 2, deadline: 3, launch: 4, build: 5, content: 6 };

function byDateThenKind(a: CalendarEvent, b: CalendarEvent): number {
  if (a.start !== b.start) return a.start < b.start ? -1 : 1;
  const kinds = KIND_ORDER[a.kind] - KIND_ORDER[b.kind];
  if (kinds !== 0) return kinds;
  return a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
}

/** The events computed from rules: holidays, occasions, market days and market deadlines. */
export function ruleEvents(calendar: StudioCalendar, from: IsoDate, to: IsoDate): CalendarEvent[] {
  const events: CalendarEvent[] = [];
  const fixed = { allDay: true as const, editable: false };
  for (const holiday of holidaysOf(calendar, from, to)) {
    events.push({ ...fixed, id: `holiday:${holiday.key}:${holiday.date}`, kind: 'holiday', title: holiday.name, start: holiday.date, end: holiday.date });
  }
  for (const occasion of occasionsOf(calendar, from, to)) {
    events.push({
      ...fixed,
      id: `occasion:${occasion.key}:${occasion.date}`,
      kind: 'occasion',
      title: occasion.name,
      start: occasion.date,
      end: occasion.date,
      sellWindowStart: occasion.sellWindowStart,
    });
  }
  for (const { market, date } of marketDaysOf(calendar, from, to)) {
    events.push({
      ...fixed,
      id: `market:${market.id}:${date}`,
      kind: 'market',
      title: market.name,
      start: date,
      end: date,
      marketId: market.id,
      place: market.place,
      hours: market.hours,
      notes: market.notes,
    });
  }
  for (const market of calendar.markets) {
    const deadlines: [string, string | null, string][] = [
      ['application', market.application_deadline, 'Application deadline'],
      ['decision', market.decision_date, 'Decision date'],
    ];
    for (const [what, date, label] of deadlines) {
      if (!date || date < from || date > to) continue;
      events.push({ ...fixed, id: `deadline:${market.id}:${what}`, kind: 'deadline', title: `${label}: ${market.name}`, start: date, end: date, marketId: market.id, place: market.place });
    }
  }
  return events;
}

/**
 * The month view's answers, serialized once and kept by studio, role, range and the calendar's
 * fingerprint (which moves with every stored event, rule, market, theme or member name), so the
 * same month asked for again costs one small query. Bounded by bytes; the oldest go first.
 */
class AnswerCache {
  private readonly entries = new Map<string, { body: Buffer; etag: string }>();
  private bytes = 0;

  constructor(private readonly limitBytes: number) {}

  get(key: string): { body: Buffer; etag: string } | undefined {
    return this.entries.get(key);
  }

  set(key: string, body: Buffer): { body: Buffer; etag: string } {
    const entry = { body, etag: `"${createHash('sha256').update(key).digest('base64url').slice(0, 27)}"` };
    if (body.length > this.limitBytes) return entry;
    while (this.bytes + body.length > this.limitBytes) {
      const [oldest, { body: old }] = this.entries.entries().next().value!;
      this.entries.delete(oldest);
      this.bytes -= old.length;
    }
    this.entries.set(key, entry);
    this.bytes += body.length;
    return entry;
  }
}

/** A stored step with the rules it breaks now (an empty list when none). */
function withProblems<T extends CalendarEvent>(event: T, row: EventRow, problems: Map<number, StepProblem[]>): T {
  return { ...event, problems: problems.get(row.id) ?? [] };
}

export class EventService {
  private readonly events: EventRepository;
  private readonly rules: OccasionRepository;
  private readonly answers = new AnswerCache(32 * 1024 * 1024);

  constructor(private readonly db: Knex) {
    this.events = new EventRepository(db);
    this.rules = new OccasionRepository(db);
  }

  /**
   * GET /events: stored steps and rule-based events touching from..to, sorted by start then kind,
   * as JSON text with an ETag, from the answer cache when the calendar's fingerprint
   * is unchanged. The rules are read before the events, so a body is never older than its key.
   */
  async listBody(studio: StudioContext, from: IsoDate, to: IsoDate): Promise<{ body: Buffer; etag: string }> {
    const keyOf = (fingerprint: string | null) => `${studio.id}|${studio.role}|${from}|${to}|${fingerprint}`;
    const cached = this.answers.get(keyOf(await this.rules.fingerprint(studio.id)));
    if (cached) return cached;
    const calendar = await loadStudioCalendar(this.db, studio.id);
    const rows = await this.events.inRange(studio.id, from, to);
    const problems = await stepProblems(this.db, calendar, rows);
    return this.answers.set(keyOf(calendar.fingerprint), Buffer.from(JSON.stringify(this.merge(studio, calendar, rows, problems, from, to))));
  }

  private merge(studio: StudioContext, calendar: StudioCalendar, rows: EventRow[], problems: Map<number, StepProblem[]>, from: IsoDate, to: IsoDate): CalendarEvent[] {
    const stored = rows.map((row) => withProblems(toCalendarEvent(row, studio.role), row, problems));
    return [...ruleEvents(calendar, from, to), ...stored].sort(byDateThenKind);
  }

  /**
   * GET /events/at-hand: the overdue steps (placed, not done, ended before `today`) and the steps
   * touching today..through, done or not. `today` is the asker's, as the calendar marks it.
   */
  async atHand(studio: StudioContext, today: IsoDate, through: IsoDate): Promise<AtHand> {
    const [late, rows, calendar] = await Promise.all([
      this.events.overdue(studio.id, today, AT_HAND_OVERDUE_LIMIT),
      this.events.inRange(studio.id, today, through),
      loadStudioCalendar(this.db, studio.id),
    ]);
    const problems = await stepProblems(this.db, calendar, [...late.rows, ...rows]);
    return {
      overdue: late.rows.map((row) => withProblems(toCalendarEvent(row, studio.role), row, problems)),
      overdueCount: late.count,
      upcoming: rows.map((row) => withProblems(toCalendarEvent(row, studio.role), row, problems)).sort(byDateThenKind),
    };
  }

  async tray(studio: StudioContext): Promise<TrayStep[]> {
    return (await this.events.tray(studio.id)).map((row) => toTrayStep(row, studio.role));
  }

  async get(studio: StudioContext, id: number): Promise<CalendarEvent | TrayStep> {
    const row = await this.events.find(studio.id, id);
    if (!row) throw notFound(`Event ${id}`);
    return toStoredView(row, studio.role);
  }

  async stamp(studio: StudioContext): Promise<{ stamp: string }> {
    return { stamp: (await this.rules.fingerprint(studio.id)) ?? '' };
  }
}
