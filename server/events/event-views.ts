import type { IsoDate } from '@shared/calendar/dates';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import type { Role } from '@shared/contracts/auth';
import type { PlacedStep } from '@shared/planning/runway-types';
import type { EventRow } from './event-repository';

function parseList(text: string | null): string[] {
  // Most steps have no cautions or days listed; skip the parser for those (the month view maps hundreds).
  if (!text || text === '[]') return [];
  const parsed: unknown = JSON.parse(text);
  return Array.isArray(parsed) ? parsed.map(String) : [];
}

/** Owner and partner may move and edit stored steps; crew only tick their own. */
export function mayEdit(role: Role): boolean {
  return role === 'owner' || role === 'partner';
}

// One object literal per row (no spreads): the month view maps hundreds of rows per request.
function view<S extends string | null>(row: EventRow, role: Role, start: S, end: S) {
  return {
    id: String(row.id),
    kind: row.kind,
    title: row.title,
    start,
    end,
    allDay: true as const,
    editable: mayEdit(role),
    version: row.version,
    themeId: row.theme_id,
    themeName: row.theme_name,
    runwayName: row.runway_name,
    runwayId: row.runway_id,
    stepIndex: row.step_index,
    hoursPerDay: Number(row.hours_per_day),
    cureDays: row.cure_days,
    workDays: row.work_days,
    assigneeId: row.assignee_user_id,
    assigneeName: row.assignee_name,
    done: Boolean(row.done),
    notes: row.notes,
    cautions: parseList(row.cautions),
    sequence: row.sequence,
  };
}

/** A stored event as the calendar sees it (start and end inclusive; null ones are tray steps). */
export function toCalendarEvent(row: EventRow, role: Role): CalendarEvent & { workDays: number; sequence: number } {
  return view(row, role, row.start_date as IsoDate, row.end_date as IsoDate);
}

/** Stored events in the tray keep start and end null; a placed one reads as a CalendarEvent. */
export function toStoredView(row: EventRow, role: Role): CalendarEvent | TrayStep {
  return row.start_date ? toCalendarEvent(row, role) : toTrayStep(row, role);
}

export function toTrayStep(row: EventRow, role: Role): TrayStep {
  return view(row, role, null, null);
}

/** A stored step as the planner's PlacedStep (only for placed ones). */
export function toPlacedStep(row: EventRow): PlacedStep {
  return {
    name: row.title,
    kind: row.kind,
    workDays: row.work_days,
    hoursPerDay: Number(row.hours_per_day),
    cureDays: row.cure_days,
    cautions: parseList(row.cautions),
    start: row.start_date as IsoDate,
    end: row.end_date as IsoDate,
    days: parseList(row.days),
  };
}
