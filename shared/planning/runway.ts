import { addDays, daysBetween, isIsoDate, type IsoDate } from '../calendar/dates';
import { checkPlan, daysOfStep } from './plan-check';
import {
  HOURS_EPSILON,
  RunwayError,
  SEARCH_BOUND_DAYS,
  checkStep,
  isMilestone,
  readyDate,
  type PlacedStep,
  type PlanWarning,
  type RunwayPlan,
  type RunwayStep,
} from './runway-types';
import type { WorkCalendar } from './work-calendar';

export { checkPlan, daysOfStep, type CheckOptions } from './plan-check';
export * from './runway-types';

export interface RunwayRequest {
  /** The holiday, occasion or market day the runway is planned back from. */
  anchorDate: IsoDate;
  /** Calendar days between the launch and the anchor ("launch 21 days before"). */
  offsetDays: number;
  steps: RunwayStep[];
  /** Passed in, never read from a clock, so plans are reproducible. */
  today: IsoDate;
}

/** Hours the plan being made has put on each day, on top of the calendar's bookings. */
type Tally = Map<IsoDate, number>;

function fits(step: RunwayStep, date: IsoDate, calendar: WorkCalendar, tally: Tally): boolean {
  if (!calendar.isWorkDay(date, step.kind)) return false;
  // A step longer than a whole day's capacity can never fit; it is placed on work days anyway
  // and checkPlan reports the clash, rather than the walk running to its bound.
  if (step.hoursPerDay > calendar.capacityHours) return true;
  const booked = calendar.bookedHours(date) + (tally.get(date) ?? 0);
  return booked + step.hoursPerDay <= calendar.capacityHours + HOURS_EPSILON;
}

function book(step: RunwayStep, days: IsoDate[], tally: Tally): void {
  for (const date of days) tally.set(date, (tally.get(date) ?? 0) + step.hoursPerDay);
}

function collectDays(
  step: RunwayStep,
  from: IsoDate,
  direction: 1 | -1,
  calendar: WorkCalendar,
  tally: Tally,
): IsoDate[] {
  const days: IsoDate[] = [];
  let date = from;
  for (let walked = 0; days.length < step.workDays; walked++) {
    if (walked > SEARCH_BOUND_DAYS) {
      const way = direction < 0 ? 'on or before' : 'on or after';
      throw new RunwayError(
        'no-room',
        `No room for ${step.name} within three years ${way} ${from}: ${days.length} of ${step.workDays} work days found`,
      );
    }
    if (fits(step, date, calendar, tally)) days.push(date);
    date = addDays(date, direction);
  }
  return direction < 0 ? days.reverse() : days;
}

function placed(step: RunwayStep, days: IsoDate[], milestoneDate: IsoDate): PlacedStep {
  const { cautions = [], ...rest } = step;
  if (days.length === 0)
    return { ...rest, cautions: [...cautions], start: milestoneDate, end: milestoneDate, days: [] };
  return { ...rest, cautions: [...cautions], start: days[0], end: days[days.length - 1], days };
}

function placeBackward(
  step: RunwayStep,
  nextStart: IsoDate,
  calendar: WorkCalendar,
  tally: Tally,
): PlacedStep {
  // latestEnd = the next step's first day (or the launch) − 1 day − this step's cure days.
  const latestEnd = addDays(nextStart, -1 - step.cureDays);
  if (isMilestone(step)) return placed(step, [], addDays(latestEnd, 1));
  const days = collectDays(step, latestEnd, -1, calendar, tally);
  book(step, days, tally);
  return placed(step, days, latestEnd);
}

function placeForward(
  step: RunwayStep,
  earliestStart: IsoDate,
  calendar: WorkCalendar,
  tally: Tally,
): PlacedStep {
  if (isMilestone(step)) return placed(step, [], earliestStart);
  const days = collectDays(step, earliestStart, 1, calendar, tally);
  book(step, days, tally);
  return placed(step, days, earliestStart);
}

/** Places steps one after another from `from`, each as early as it fits. */
export function planForward(
  steps: RunwayStep[],
  from: IsoDate,
  calendar: WorkCalendar,
): PlacedStep[] {
  steps.forEach(checkStep);
  const tally: Tally = new Map();
  const result: PlacedStep[] = [];
  let earliest = from;
  for (const step of steps) {
    const placedStep = placeForward(step, earliest, calendar, tally);
    result.push(placedStep);
    earliest = readyDate(placedStep);
  }
  return result;
}

/** The launch a placed plan reaches: its final milestone, or the day after its last step is ready. */
export function launchOf(steps: PlacedStep[]): IsoDate {
  const last = steps[steps.length - 1];
  return isMilestone(last) ? last.start : readyDate(last);
}

/**
 * The backward pass of issue 5: launch L = anchor − offsetDays; steps are placed from last to
 * first, each on the latest work days that fit before the next step (less its cure days).
 */
export function planRunway(request: RunwayRequest, calendar: WorkCalendar): RunwayPlan {
  const { anchorDate, offsetDays, steps, today } = request;
  if (!isIsoDate(anchorDate) || !isIsoDate(today))
    throw new RunwayError('invalid-step', 'anchorDate and today must be YYYY-MM-DD dates');
  if (!Number.isInteger(offsetDays))
    throw new RunwayError('invalid-step', 'offsetDays must be a whole number');
  steps.forEach(checkStep);
  const launch = addDays(anchorDate, -offsetDays);
  if (steps.length === 0) return { launch, start: launch, steps: [], warnings: [] };

  const tally: Tally = new Map();
  const placedSteps: PlacedStep[] = new Array(steps.length);
  let nextStart = launch;
  for (let index = steps.length - 1; index >= 0; index--) {
    placedSteps[index] = placeBackward(steps[index], nextStart, calendar, tally);
    nextStart = placedSteps[index].start;
  }
  const start = placedSteps[0].start;
  const warnings: PlanWarning[] = [];
  if (start < today) warnings.push(tooShortWarning(placedSteps, request, calendar));
  warnings.push(...checkPlan(placedSteps, calendar));
  return { launch, start, steps: placedSteps, warnings };
}

function tooShortWarning(
  steps: PlacedStep[],
  request: RunwayRequest,
  calendar: WorkCalendar,
): PlanWarning {
  const { today, offsetDays } = request;
  const pastDays = new Set(steps.flatMap((step) => step.days).filter((date) => date < today));
  const forward = planForward(request.steps, today, calendar);
  const firstFeasibleLaunch = launchOf(forward);
  const launch = addDays(request.anchorDate, -offsetDays);
  const anchorNote =
    offsetDays === 0 ? '' : ` (anchor ${addDays(firstFeasibleLaunch, offsetDays)})`;
  const message =
    pastDays.size > 0
      ? `Runway too short by ${pastDays.size} work day${pastDays.size === 1 ? '' : 's'}: it would start on ${steps[0].start}, before today (${today}). The first feasible launch is ${firstFeasibleLaunch}${anchorNote}, ${daysBetween(launch, firstFeasibleLaunch)} days after ${launch}.`
      : `The launch (${launch}) is before today (${today}). The first feasible launch is ${firstFeasibleLaunch}${anchorNote}.`;
  return {
    code: 'too-short',
    message,
    stepIndex: 0,
    shortByWorkDays: pastDays.size,
    firstFeasibleLaunch,
  };
}

/**
 * A step moved to `start` by the user: its first day is `start` (even a day off, which checkPlan
 * then reports), then the following work days of its kind, capacity aside.
 */
export function moveStep(step: RunwayStep, start: IsoDate, calendar: WorkCalendar): PlacedStep {
  checkStep(step, 0);
  if (isMilestone(step)) return placed(step, [], start);
  const days = [start];
  for (
    let date = addDays(start, 1), walked = 0;
    days.length < step.workDays;
    date = addDays(date, 1), walked++
  ) {
    if (walked > SEARCH_BOUND_DAYS)
      throw new RunwayError(
        'no-room',
        `No work days for ${step.name} within three years after ${start}`,
      );
    if (calendar.isWorkDay(date, step.kind)) days.push(date);
  }
  return placed(step, days, start);
}

/**
 * After the user moved `steps[movedIndex]`, pushes the steps after it later where they now start
 * before their predecessor is done and cured or no longer fit; steps that still fit stay put.
 * Steps before the moved one are left alone (checkPlan reports if the move broke them).
 */
export function replanForward(
  steps: PlacedStep[],
  movedIndex: number,
  calendar: WorkCalendar,
): RunwayPlan {
  if (!Number.isInteger(movedIndex) || movedIndex < 0 || movedIndex >= steps.length) {
    throw new RangeError(`movedIndex ${movedIndex} is not a step of this plan`);
  }
  steps.forEach(checkStep);
  const tally: Tally = new Map();
  const result: PlacedStep[] = steps
    .slice(0, movedIndex + 1)
    .map((step) => ({ ...step, days: daysOfStep(step, calendar) }));
  for (const step of result) book(step, step.days, tally);
  for (let index = movedIndex + 1; index < steps.length; index++) {
    const step = steps[index];
    const earliest = readyDate(result[index - 1]);
    const days = daysOfStep(step, calendar);
    const isStillFine =
      step.start >= earliest && days.every((date) => fits(step, date, calendar, tally));
    const next = isStillFine ? { ...step, days } : placeForward(step, earliest, calendar, tally);
    if (isStillFine) book(step, days, tally);
    result.push(next);
  }
  return {
    launch: launchOf(result),
    start: result[0].start,
    steps: result,
    warnings: checkPlan(result, calendar),
  };
}
