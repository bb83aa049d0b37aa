import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import { formatLong, initialsOf } from './calendar-dates';
import { lookOf } from './calendar-kinds';

/**
 * What a chip shows of an event or tray step, worked out once per event object rather than by
 * bindings and signals on every chip: a month of 300 events draws about a hundred chips at once.
 */
export interface ChipView {
  item: CalendarEvent | TrayStep;
  label: string;
  /** The assignee's initials, or null when nobody is assigned. */
  initials: string | null;
  /** Whether the user may move it (an editable step and a role that edits). */
  canMove: boolean;
}

// Events are immutable snapshots (a move or a refetch makes new objects), so their views keep.
const views = new WeakMap<CalendarEvent | TrayStep, ChipView>();
const fixedViews = new WeakMap<CalendarEvent | TrayStep, ChipView>();

/** Whether a member may tick `step` done: an editing role on an editable step, or its own assignee (crew). */
export function canTickStep(step: CalendarEvent | TrayStep, canEdit: boolean, userId: number | undefined): boolean {
  return (step.editable && canEdit) || (step.assigneeId != null && step.assigneeId === userId);
}

/** The chip of `item`; `canMove` is whether the user may move it (editable and an editing role). */
export function chipViewOf(item: CalendarEvent | TrayStep, canMove: boolean): ChipView {
  const cache = canMove ? views : fixedViews;
  let view = cache.get(item);
  if (!view) {
    const look = lookOf(item.kind);
    const parts = [`${look.label}: ${item.title}`];
    if (item.start) parts.push(item.start === item.end ? formatLong(item.start) : `${formatLong(item.start)} to ${formatLong(item.end!)}`);
    else parts.push('not on the calendar yet');
    if (item.assigneeName) parts.push(`assigned to ${item.assigneeName}`);
    if (item.hours) parts.push(item.hours);
    if (item.done) parts.push('done');
    if (item.problems?.length) parts.push(`breaks a rule now: ${item.problems.map((problem) => problem.message).join('; ')}`);
    view = { item, label: parts.join(', '), initials: initialsOf(item.assigneeName) || null, canMove };
    cache.set(item, view);
  }
  return view;
}

/** The chip or band (its data-event-id) that an event's target is in, if it is inside `list`. */
export function chipAt(target: EventTarget | null, list: HTMLElement): HTMLElement | null {
  const element = target instanceof Element ? target.closest<HTMLElement>('[data-event-id]') : null;
  return element && list.contains(element) ? element : null;
}
