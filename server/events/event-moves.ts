import type { Knex } from 'knex';
import { addDays, type IsoDate } from '@shared/calendar/dates';
import type { CalendarEvent, MoveResult, PlanWarningView, ReplanResult, TrayStep } from '@shared/contracts/calendar';
import type { EventPatch } from '@shared/contracts/runways';
import { checkPlan, moveStep, replanForward, type PlacedStep, type PlanWarning } from '@shared/planning/runway';
import { bookingsFromEvents, type WorkCalendar } from '@shared/planning/work-calendar';
import { AppError, forbidden, notFound } from '../http/app-error';
import type { StudioContext } from '../http/auth-middleware';
import { loadStudioCalendar, workCalendarOf } from '../occasions/studio-calendar';
import { EventRepository, spanOf, type EventRow } from './event-repository';
import { mayEdit, toCalendarEvent, toPlacedStep, toStoredView } from './event-views';
import { ThemesRepository } from '../themes/themes-repository';

// How far around a step the work calendar is built: room for moves and for the forward re-plan.
const BEFORE_DAYS = 400;
const AFTER_DAYS = 3 * 366 + 60;

/** The runway of one event as the planner sees it: its placed steps in order (tray steps left out). */
interface RunwayContext {
  calendar: WorkCalendar;
  rows: EventRow[];
  placed: EventRow[];
  anchorDate: IsoDate | null;
}

function toView(warnings: PlanWarning[], rows: EventRow[]): PlanWarningView[] {
  return warnings.map(({ code, message, stepIndex, dates }) => {
    const view: PlanWarningView = { code, message };
    if (stepIndex !== undefined) view.stepIndex = rows[stepIndex]?.step_index ?? stepIndex;
    if (dates) view.dates = dates;
    return view;
  });
}

function conflict(current: CalendarEvent | TrayStep): AppError {
  return new AppError('version_conflict', 409, 'Someone else changed this step; here is how it stands now', undefined, { current });
}

export class EventMoves {
  constructor(private readonly db: Knex) {}

  private async runwayContext(studioId: number, row: EventRow, around: IsoDate): Promise<RunwayContext> {
    const events = new EventRepository(this.db);
    const from = addDays(around, -BEFORE_DAYS);
    const to = addDays(around, AFTER_DAYS);
    const [studioCalendar, rows, others, runway] = await Promise.all([
      loadStudioCalendar(this.db, studioId),
      row.runway_id === null ? Promise.resolve([row]) : events.ofRunway(studioId, row.runway_id),
      events.placedOutside(studioId, row.runway_id ?? -1, from, to),
      row.runway_id === null ? Promise.resolve(undefined) : this.db('runways').where({ studio_id: studioId, id: row.runway_id }).first('anchor_date'),
    ]);
    const bare = workCalendarOf(studioCalendar, from, to);
    const bookings = bookingsFromEvents(
      others
        .filter((other) => other.id !== row.id)
        .map(toPlacedStep)
        .map((step) => ({ ...step, days: step.days.length ? step.days : undefined })),
      bare,
    );
    return {
      calendar: bare.withBookings(bookings),
      rows,
      placed: rows.filter((step) => step.start_date !== null),
      anchorDate: (runway?.anchor_date as IsoDate | undefined) ?? null,
    };
  }

  /** PATCH /events/:eventId: a move, an edit or a tick, each against the version the client read. */
  async patch(studio: StudioContext, userId: number, id: number, patch: EventPatch): Promise<MoveResult> {
    const events = new EventRepository(this.db);
    const row = await events.find(studio.id, id);
    if (!row) throw notFound(`Event ${id}`);
    const { version, force, ...fields } = patch;
    const touched = Object.keys(fields).filter((key) => fields[key as keyof typeof fields] !== undefined);
    if (!mayEdit(studio.role)) {
      const isOwnTick = touched.length === 1 && touched[0] === 'done' && row.assignee_user_id === userId;
      if (!isOwnTick) throw forbidden('Crew may only mark their own steps done');
    }
    if (touched.length === 0) {
      throw new AppError('invalid_input', 400, 'Nothing to change: send start, title, notes, assigneeId or done', [{ path: ['start'], message: 'Nothing to change' }]);
    }
    if (row.version !== version) throw conflict(toStoredView(row, studio.role));

    const changes: Record<string, unknown> = {};
    let warnings: PlanWarningView[] = [];
    if (fields.start !== undefined) {
      const moved = fields.start === null ? null : await this.placeMove(studio.id, row, fields.start);
      if (moved) {
        warnings = moved.warnings;
        if (warnings.length > 0 && !force) {
          throw new AppError('rule_broken', 422, `This move breaks a rule: ${warnings.map((w) => w.message).join('; ')}`, undefined, { warnings });
        }
      }
      changes['start_date'] = moved?.step.start ?? null;
      changes['end_date'] = moved?.step.end ?? null;
      changes['days'] = moved ? JSON.stringify(moved.step.days) : null;
      changes['span_days'] = spanOf(moved?.step.start ?? null, moved?.step.end ?? null);
    }
    if (fields.title !== undefined) changes['title'] = fields.title;
    if (fields.notes !== undefined) changes['notes'] = fields.notes;
    if (fields.assigneeId !== undefined) {
      if (fields.assigneeId !== null && !(await events.isMember(studio.id, fields.assigneeId))) {
        throw new AppError('invalid_input', 400, `assigneeId: user ${fields.assigneeId} is not a member of this studio`, [
          { path: ['assigneeId'], message: 'Not a member of this studio' },
        ]);
      }
      changes['assignee_user_id'] = fields.assigneeId;
    }
    if (fields.done !== undefined) {
      changes['done'] = fields.done;
      changes['done_by'] = fields.done ? userId : null;
      changes['done_at'] = fields.done ? this.db.fn.now() : null;
    }
    if ((await events.update(studio.id, id, version, changes)) === 0) {
      const current = await events.find(studio.id, id);
      if (!current) throw notFound(`Event ${id}`);
      throw conflict(toStoredView(current, studio.role));
    }
    // A runway's launch ticked done launches its theme; unticked, the theme is building again.
    if (fields.done !== undefined && row.kind === 'launch' && row.theme_id !== null) {
      const themes = new ThemesRepository(this.db);
      if (fields.done) await themes.followRunway(studio.id, row.theme_id, 'launched', ['picked', 'building'], userId);
      else await themes.followRunway(studio.id, row.theme_id, 'building', ['launched'], userId);
    }
    const stored = (await events.find(studio.id, id))!;
    return { event: toStoredView(stored, studio.role) as CalendarEvent, warnings };
  }

  /** Where the step lands from `start` and which rules that breaks (about it or its successor). */
  private async placeMove(studioId: number, row: EventRow, start: IsoDate): Promise<{ step: PlacedStep; warnings: PlanWarningView[] }> {
    const context = await this.runwayContext(studioId, row, start);
    const step = moveStep(toPlacedStep({ ...row, start_date: start, end_date: start }), start, context.calendar);
    // The runway's placed steps in order, with this one at its new place (or slotted in from the tray).
    const rows = [...context.placed.filter((other) => other.id !== row.id), row].sort((a, b) => (a.step_index ?? 0) - (b.step_index ?? 0));
    const steps = rows.map((other) => (other.id === row.id ? step : toPlacedStep(other)));
    const position = rows.indexOf(row);
    const broken = checkPlan(steps, context.calendar).filter(
      (warning) =>
        warning.stepIndex === position ||
        (warning.stepIndex === position + 1 && (warning.code === 'order' || warning.code === 'cure')),
    );
    return { step, warnings: toView(broken, rows) };
  }

  /**
   * POST /events/:eventId/replan: pushes the following steps after this one (stored unless preview);
   * `fromItself` re-plans this step too (a step that breaks a rule now), from its predecessor on.
   */
  async replan(studio: StudioContext, id: number, isPreview: boolean, fromItself = false): Promise<ReplanResult> {
    const events = new EventRepository(this.db);
    const row = await events.find(studio.id, id);
    if (!row) throw notFound(`Event ${id}`);
    if (row.start_date === null) {
      throw new AppError('not_placed', 422, 'This step is in the tray; put it on the calendar before shifting the steps after it');
    }
    const context = await this.runwayContext(studio.id, row, row.start_date);
    const found = context.placed.findIndex((step) => step.id === row.id);
    const position = fromItself ? found - 1 : found;
    if (position < 0) {
      throw new AppError('first_step', 422, "This is its runway's first step: move it to a free day yourself (Move to…), then shift the following steps");
    }
    const plan = replanForward(context.placed.map(toPlacedStep), position, context.calendar);
    const warnings = toView(plan.warnings, context.placed);
    if (context.anchorDate && plan.launch > context.anchorDate) {
      warnings.push({ code: 'past-anchor', message: `The launch would move to ${plan.launch}, after the anchor date ${context.anchorDate}` });
    }
    const moves: ReplanResult['moves'] = [];
    plan.steps.forEach((step, index) => {
      const stored = context.placed[index];
      if (step.start === stored.start_date && step.end === stored.end_date) return;
      moves.push({ id: String(stored.id), title: stored.title, from: { start: stored.start_date, end: stored.end_date }, to: { start: step.start, end: step.end } });
    });
    if (isPreview || moves.length === 0) return { moves, warnings };

    await this.db.transaction(async (trx) => {
      const writer = new EventRepository(trx);
      for (const move of moves) {
        const index = context.placed.findIndex((step) => String(step.id) === move.id);
        const step = plan.steps[index];
        const changed = await writer.update(studio.id, context.placed[index].id, context.placed[index].version, {
          start_date: step.start,
          end_date: step.end,
          days: JSON.stringify(step.days),
          span_days: spanOf(step.start, step.end),
        });
        if (changed === 0) {
          const current = await writer.find(studio.id, context.placed[index].id);
          throw current ? conflict(toStoredView(current, studio.role)) : notFound(`Event ${move.id}`);
        }
      }
    });
    const updated = await events.ofRunway(studio.id, row.runway_id ?? -1);
    const movedIds = new Set(moves.map((move) => move.id));
    return { moves, warnings, events: updated.filter((step) => movedIds.has(String(step.id))).map((step) => toCalendarEvent(step, studio.role)) };
  }
}
