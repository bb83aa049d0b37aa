import { addDays, type IsoDate } from '../calendar/dates';
import type { StepKind } from './work-calendar';

export interface RunwayStep {
  name: string;
  kind: StepKind;
  /** Whole work days the step takes; 0 makes it a milestone (a launch). */
  workDays: number;
  hoursPerDay: number;
  /** Calendar days that must pass after the step before the next one starts (paint drying). */
  cureDays: number;
  cautions?: string[];
}

export interface PlacedStep extends RunwayStep {
  start: IsoDate;
  end: IsoDate;
  /** The work days the step uses, ascending; empty for a milestone. */
  days: IsoDate[];
  cautions: string[];
}

export type WarningCode = 'too-short' | 'capacity' | 'blackout' | 'order' | 'cure';

export interface PlanWarning {
  code: WarningCode;
  message: string;
  /** Index of the step the warning is about. */
  stepIndex?: number;
  /** The days concerned (clashing or blacked-out days). */
  dates?: IsoDate[];
  /** For 'too-short': how many planned work days fall before today. */
  shortByWorkDays?: number;
  /** For 'too-short': the earliest launch a forward pass from today reaches. */
  firstFeasibleLaunch?: IsoDate;
}

export interface RunwayPlan {
  launch: IsoDate;
  start: IsoDate;
  steps: PlacedStep[];
  warnings: PlanWarning[];
}

/** Planning cannot go on (no room within the search bound); the server answers it as a 422. */
export class RunwayError extends Error {
  constructor(
    readonly code: 'no-room' | 'invalid-step',
    message: string,
  ) {
    super(message);
    this.name = 'RunwayError';
  }
}

// Walks never go further than this from their starting day, so a calendar with no room fails
// with a message instead of looping.
export const SEARCH_BOUND_DAYS = 3 * 366;

// Hours are decimals (1.5 h); compare with a little slack so 0.1 + 0.2 fits into 0.3.
export const HOURS_EPSILON = 1e-9;

export function isMilestone(step: RunwayStep): boolean {
  return step.workDays === 0;
}

/**
 * The earliest day the next step may start: after the step's last work day and its cure days.
 * A milestone sits on the day its successor could start were there no cure, hence no "+ 1".
 */
export function readyDate(step: PlacedStep): IsoDate {
  return isMilestone(step)
    ? addDays(step.start, step.cureDays)
    : addDays(step.end, 1 + step.cureDays);
}

/** The first day the next step would break order on (before it, the next step overlaps this one). */
export function orderDate(step: PlacedStep): IsoDate {
  return isMilestone(step) ? step.start : addDays(step.end, 1);
}

export function checkStep(step: RunwayStep, index: number): void {
  const problems: string[] = [];
  if (!Number.isInteger(step.workDays) || step.workDays < 0 || step.workDays > 366)
    problems.push('workDays must be a whole number from 0 to 366');
  if (!Number.isInteger(step.cureDays) || step.cureDays < 0 || step.cureDays > 366)
    problems.push('cureDays must be a whole number from 0 to 366');
  if (!(step.hoursPerDay >= 0 && step.hoursPerDay <= 24))
    problems.push('hoursPerDay must be from 0 to 24');
  if (problems.length > 0) {
    throw new RunwayError(
      'invalid-step',
      `Step ${index + 1} (${step.name}): ${problems.join('; ')}`,
    );
  }
}
