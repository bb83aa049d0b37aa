import type { Knex } from 'knex';
import { addDays, maxDate, minDate, type IsoDate } from '@shared/calendar/dates';
import type { StepProblem } from '@shared/contracts/calendar';
import { checkPlan } from '@shared/planning/runway';
import { bookingsFromEvents } from '@shared/planning/work-calendar';
import type { StudioCalendar } from '../occasions/studio-calendar';
import { workCalendarOf } from '../occasions/studio-calendar';
import { EventRepository, type EventRow } from './event-repository';
import { toPlacedStep } from './event-views';

// How far around a runway its work calendar is built: room for cure days after the last step.
const MARGIN_DAYS = 14;

/**
 * The rules each placed step breaks now, worked out as a move is checked (plan-check.ts): order,
 * cure time, a day that is not a work day for it (days off, holidays, market days for build steps)
 * and capacity, counting every other placed step's hours. A market, day off or setting added after
 * the plan can so break steps that were fine when placed; done steps are not reported.
 */
export async function stepProblems(db: Knex, calendar: StudioCalendar, rows: EventRow[]): Promise<Map<number, StepProblem[]>> {
  const problems = new Map<number, StepProblem[]>();
  const open = rows.filter((row) => row.start_date !== null && !row.done);
  if (open.length === 0) return problems;
  const events = new EventRepository(db);
  const runwayIds = [...new Set(open.map((row) => row.runway_id).filter((id): id is number => id !== null))];
  const [runwaySteps, loose] = await Promise.all([
    events.placedOfRunways(calendar.studioId, runwayIds),
    events.byIds(calendar.studioId, open.filter((row) => row.runway_id === null).map((row) => row.id)),
  ]);
  const groups = [...runwayIds.map((id) => runwaySteps.filter((step) => step.runway_id === id)), ...loose.map((row) => [row])];
  for (const group of groups) {
    if (group.length === 0) continue;
    const from = addDays(group.map((step) => step.start_date as IsoDate).reduce(minDate), -MARGIN_DAYS);
    const to = addDays(group.map((step) => step.end_date as IsoDate).reduce(maxDate), MARGIN_DAYS);
    const bare = workCalendarOf(calendar, from, to);
    const mine = new Set(group.map((step) => step.id));
    const others = (await events.placedOutside(calendar.studioId, group[0].runway_id, from, to)).filter((other) => !mine.has(other.id));
    const bookings = bookingsFromEvents(
      others.map(toPlacedStep).map((step) => ({ ...step, days: step.days.length ? step.days : undefined })),
      bare,
    );
    for (const warning of checkPlan(group.map(toPlacedStep), bare.withBookings(bookings))) {
      const step = warning.stepIndex === undefined ? undefined : group[warning.stepIndex];
      if (!step || step.done) continue;
      problems.set(step.id, [...(problems.get(step.id) ?? []), { code: warning.code, message: warning.message }]);
    }
  }
  return problems;
}
