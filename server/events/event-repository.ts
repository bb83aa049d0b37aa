import type { Knex } from 'knex';
import { addDays, daysBetween, type IsoDate } from '@shared/calendar/dates';
import type { StepKind } from '@shared/contracts/calendar';

export interface EventRow {
  id: number;
  runway_id: number | null;
  theme_id: number | null;
  theme_name: string | null;
  runway_name: string | null;
  step_index: number | null;
  kind: StepKind;
  title: string;
  start_date: IsoDate | null;
  end_date: IsoDate | null;
  days: string | null;
  work_days: number;
  hours_per_day: number;
  cure_days: number;
  cautions: string | null;
  notes: string | null;
  assignee_user_id: number | null;
  assignee_name: string | null;
  done: boolean;
  version: number;
  sequence: number;
}

/** A new stored step (an event) as the runway planner makes it. */
export interface NewEvent {
  runwayId: number | null;
  themeId: number | null;
  stepIndex: number;
  kind: StepKind;
  title: string;
  start: IsoDate | null;
  end: IsoDate | null;
  days: IsoDate[];
  workDays: number;
  hoursPerDay: number;
  cureDays: number;
  cautions: string[];
}

/** Steps at most this long (calendar days from start to end) are found by a start-date range. */
export const SHORT_SPAN_DAYS = 31;

export function spanOf(start: IsoDate | null, end: IsoDate | null): number | null {
  return start && end ? daysBetween(start, end) : null;
}

export function newEventColumns(studioId: number, event: NewEvent) {
  return {
    studio_id: studioId,
    runway_id: event.runwayId,
    theme_id: event.themeId,
    step_index: event.stepIndex,
    kind: event.kind,
    title: event.title,
    start_date: event.start,
    end_date: event.end,
    days: event.start ? JSON.stringify(event.days) : null,
    span_days: spanOf(event.start, event.end),
    work_days: event.workDays,
    hours_per_day: event.hoursPerDay,
    cure_days: event.cureDays,
    cautions: JSON.stringify(event.cautions),
  };
}

const EVENT_COLUMNS = [
  'e.id',
  'e.runway_id',
  'e.theme_id',
  't.name as theme_name',
  'r.name as runway_name',
  'e.step_index',
  'e.kind',
  'e.title',
  'e.start_date',
  'e.end_date',
  'e.days',
  'e.work_days',
  'e.hours_per_day',
  'e.cure_days',
  'e.cautions',
  'e.notes',
  'e.assignee_user_id',
  'u.name as assignee_name',
  'e.done',
  'e.version',
  'e.sequence',
];

// The month view needs no per-day list (only planning and bookings do).
const VIEW_COLUMNS = EVENT_COLUMNS.filter((column) => column !== 'e.days');

export class EventRepository {
  constructor(private readonly db: Knex | Knex.Transaction) {}

  private select(studioId: number, columns = EVENT_COLUMNS) {
    return this.db('events as e')
      .leftJoin('themes as t', 't.id', 'e.theme_id')
      .leftJoin('runways as r', 'r.id', 'e.runway_id')
      .leftJoin('users as u', 'u.id', 'e.assignee_user_id')
      .where('e.studio_id', studioId)
      .select(columns);
  }

  /**
   * Stored events that touch from..to. Short steps come through the (studio_id, start_date) index
   * within SHORT_SPAN_DAYS before `from`; the rare longer ones through (studio_id, span_days).
   */
  inRange(studioId: number, from: IsoDate, to: IsoDate): Promise<EventRow[]> {
    const shortFrom = addDays(from, -SHORT_SPAN_DAYS);
    const longOnes = this.select(studioId, VIEW_COLUMNS)
      .andWhere('e.span_days', '>', SHORT_SPAN_DAYS)
      .andWhere('e.start_date', '<', shortFrom)
      .andWhere('e.end_date', '>=', from);
    // The driver's own casting (no per-field callback) for the month view's hundreds of rows: the
    // views convert DECIMAL and TINYINT themselves (Number(), Boolean()), and DATEs stay strings.
    return this.select(studioId, VIEW_COLUMNS)
      .whereBetween('e.start_date', [shortFrom, to])
      .andWhere('e.end_date', '>=', from)
      .unionAll(longOnes)
      .options({ typeCast: true }) as unknown as Promise<EventRow[]>;
  }

  /** Placed steps not done whose last day is before `today`, oldest first, at most `limit`; and how many in all. */
  async overdue(studioId: number, today: IsoDate, limit: number): Promise<{ rows: EventRow[]; count: number }> {
    const late = <Q extends Knex.QueryBuilder>(query: Q) => query.andWhere('e.done', false).whereNotNull('e.start_date').andWhere('e.end_date', '<', today);
    const [rows, counted] = await Promise.all([
      late(this.select(studioId)).orderBy([{ column: 'e.start_date' }, { column: 'e.id' }]).limit(limit) as unknown as Promise<EventRow[]>,
      late(this.db('events as e').where('e.studio_id', studioId)).count<{ count: number }[]>({ count: '*' }).first(),
    ]);
    return { rows, count: Number(counted?.count ?? 0) };
  }

  /** Unscheduled steps of themes being planned (picked or building) or of runways without a theme. */
  tray(studioId: number): Promise<EventRow[]> {
    return this.select(studioId)
      .whereNull('e.start_date')
      .andWhere((where) => where.whereNull('e.theme_id').orWhereIn('t.status', ['picked', 'building']))
      .orderBy([{ column: 'e.theme_id' }, { column: 'e.runway_id' }, { column: 'e.step_index' }]) as unknown as Promise<EventRow[]>;
  }

  /** Steps by id, with their days (the month view reads them without). */
  byIds(studioId: number, ids: number[]): Promise<EventRow[]> {
    if (ids.length === 0) return Promise.resolve([]);
    return this.select(studioId).whereIn('e.id', ids) as unknown as Promise<EventRow[]>;
  }

  /** The placed steps of several runways, in each runway's order. */
  placedOfRunways(studioId: number, runwayIds: number[]): Promise<EventRow[]> {
    if (runwayIds.length === 0) return Promise.resolve([]);
    return this.select(studioId).whereIn('e.runway_id', runwayIds).whereNotNull('e.start_date').orderBy(['e.runway_id', 'e.step_index']) as unknown as Promise<EventRow[]>;
  }

  find(studioId: number, id: number): Promise<EventRow | undefined> {
    return this.select(studioId).andWhere('e.id', id).first() as unknown as Promise<EventRow | undefined>;
  }

  ofRunway(studioId: number, runwayId: number): Promise<EventRow[]> {
    return this.select(studioId).andWhere('e.runway_id', runwayId).orderBy('e.step_index') as unknown as Promise<EventRow[]>;
  }

  /** Placed steps outside one runway that touch from..to: the hours they book. */
  placedOutside(studioId: number, runwayId: number | null, from: IsoDate, to: IsoDate): Promise<EventRow[]> {
    const query = this.select(studioId)
      .whereNotNull('e.start_date')
      .andWhere('e.start_date', '<=', to)
      .andWhere('e.end_date', '>=', from)
      .andWhere('e.hours_per_day', '>', 0);
    if (runwayId !== null) query.andWhere((where) => where.whereNull('e.runway_id').orWhereNot('e.runway_id', runwayId));
    return query as unknown as Promise<EventRow[]>;
  }

  async insertMany(studioId: number, events: NewEvent[]): Promise<void> {
    if (!events.length) return;
    await this.db('events').insert(events.map((event) => newEventColumns(studioId, event)));
    await this.bumpStamp(studioId);
  }

  /** Changes one event if its version still matches; bumps version and SEQUENCE. 0 = stale or gone. */
  async update(studioId: number, id: number, version: number, changes: Record<string, unknown>): Promise<number> {
    const changed = await this.db('events')
      .where({ studio_id: studioId, id, version })
      .update({
        ...changes,
        version: this.db.raw('version + 1'),
        sequence: this.db.raw('sequence + 1'),
        updated_at: this.db.raw('CURRENT_TIMESTAMP(3)'),
      });
    if (changed > 0) await this.bumpStamp(studioId);
    return changed;
  }

  /** Every write to the studio's events (here and in RunwayRepository.delete) bumps the counter. */
  async bumpStamp(studioId: number): Promise<void> {
    await this.db('studios').where({ id: studioId }).increment('events_stamp', 1);
  }

  async isMember(studioId: number, userId: number): Promise<boolean> {
    return Boolean(await this.db('memberships').where({ studio_id: studioId, user_id: userId }).first('user_id'));
  }
}
