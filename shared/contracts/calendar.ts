// The calendar API as the client sees it. The calendar engine (server/events, server/runways,
// server/markets) answers in these shapes; the calendar screens read them. Dates are ISO YYYY-MM-DD;
// every event is all-day and `end` is inclusive.

export const eventKinds = ['holiday', 'occasion', 'market', 'deadline', 'build', 'content', 'launch'] as const;
export type EventKind = (typeof eventKinds)[number];

/** Kinds that are stored steps of a runway (movable); the rest are computed from rules. */
export const stepKinds = ['build', 'content', 'launch'] as const;
export type StepKind = (typeof stepKinds)[number];

export interface CalendarEvent {
  /** Stored events: their numeric id as a string ("42"). Computed ones: a stable key ("holiday:us-independence-day:2026-07-04"). */
  id: string;
  kind: EventKind;
  title: string;
  start: string;
  end: string;
  allDay: true;
  /** Whether the user's role may move or edit it (stored steps, owner and partner). */
  editable: boolean;
  /** Stored events only: optimistic-concurrency version to send back with a move. */
  version?: number;
  themeId?: number | null;
  themeName?: string | null;
  runwayId?: number | null;
  /** The runway the step belongs to, named as planned ("Winter window stars"). */
  runwayName?: string | null;
  /** For a stored step: the rules it breaks now, as a move would be checked (empty when none). */
  problems?: StepProblem[];
  stepIndex?: number | null;
  hoursPerDay?: number | null;
  cureDays?: number | null;
  /** Stored steps: work days the step takes (the calendar screens keep it when a step is moved). */
  workDays?: number | null;
  assigneeId?: number | null;
  assigneeName?: string | null;
  done?: boolean;
  notes?: string | null;
  cautions?: string[];
  /** Markets and their deadlines. */
  marketId?: number | null;
  place?: string | null;
  hours?: string | null;
  /** Occasions: the first day of the sell window. */
  sellWindowStart?: string | null;
}

/** A stored step not yet on the calendar (the tray): start and end are null. */
export interface TrayStep extends Omit<CalendarEvent, 'start' | 'end'> {
  start: null;
  end: null;
  workDays: number;
}

/** A rule a placed step breaks now (order, cure, a day it may not use, capacity), in plain words. */
export interface StepProblem {
  code: string;
  message: string;
}

export interface PlanWarningView {
  code: string;
  message: string;
  stepIndex?: number;
  dates?: string[];
}

/** PATCH /events/:eventId with {start, end, version, force?}: 200 answer. Without force a broken rule is a 422 carrying `warnings`. */
export interface MoveResult {
  event: CalendarEvent;
  warnings: PlanWarningView[];
}

/** POST /events/:eventId/replan (with ?preview=1 nothing is stored). */
export interface ReplanResult {
  moves: { id: string; title: string; from: { start: string | null; end: string | null }; to: { start: string; end: string } }[];
  warnings: PlanWarningView[];
  events?: CalendarEvent[];
}

/** GET /events/stamp: changes whenever anything the calendar shows changes (stored events, rules, markets, theme and member names); clients poll it. */
export interface EventsStamp {
  stamp: string;
}

/** GET /events/at-hand: the work a member has in hand (the home page's list). */
export interface AtHand {
  /** Placed steps not done whose last day is before today, oldest first (at most AT_HAND_OVERDUE_LIMIT). */
  overdue: CalendarEvent[];
  /** How many overdue steps there are in all (more than `overdue` holds when over the limit). */
  overdueCount: number;
  /** Placed steps, done or not, that touch today..through, by start. */
  upcoming: CalendarEvent[];
}

/** How many overdue steps GET /events/at-hand lists. */
export const AT_HAND_OVERDUE_LIMIT = 50;
