import { dateRange, type IsoDate } from '../calendar/dates';
import {
  HOURS_EPSILON,
  isMilestone,
  orderDate,
  readyDate,
  type PlacedStep,
  type PlanWarning,
} from './runway-types';
import type { WorkCalendar } from './work-calendar';

export interface CheckOptions {
  /** When given, a plan starting before it gets a 'too-short' warning. */
  today?: IsoDate;
}

/** The work days a step uses: its listed days, or the work days between its start and end. */
export function daysOfStep(step: PlacedStep, calendar: WorkCalendar): IsoDate[] {
  if (isMilestone(step)) return [];
  if (step.days.length > 0) return step.days;
  return dateRange(step.start, step.end).filter((date) => calendar.isWorkDay(date, step.kind));
}

function formatDates(dates: IsoDate[]): string {
  return dates.length <= 3
    ? dates.join(', ')
    : `${dates.slice(0, 3).join(', ')} and ${dates.length - 3} more`;
}

/**
 * Warnings for any arrangement of steps, such as one the user dragged: days off, days over
 * capacity (counting the calendar's bookings and the plan's own steps), steps before their
 * predecessor ends, and steps inside their predecessor's cure time.
 */
export function checkPlan(
  steps: PlacedStep[],
  calendar: WorkCalendar,
  options: CheckOptions = {},
): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  const stepDays = steps.map((step) => daysOfStep(step, calendar));
  const planHours = new Map<IsoDate, number>();
  steps.forEach((step, index) => {
    for (const date of stepDays[index])
      planHours.set(date, (planHours.get(date) ?? 0) + step.hoursPerDay);
  });

  if (options.today && steps.length > 0 && steps[0].start < options.today) {
    warnings.push({
      code: 'too-short',
      message: `The runway starts on ${steps[0].start}, before today (${options.today})`,
      stepIndex: 0,
    });
  }

  steps.forEach((step, index) => {
    if (isMilestone(step)) return;
    const listed = step.days.length > 0 ? step.days : [step.start, step.end];
    const offDays = [...new Set(listed)].filter((date) => !calendar.isWorkDay(date, step.kind));
    if (offDays.length > 0) {
      const reasons = offDays.map((date) =>
        calendar.describeDayOff(date, calendar.dayOffReason(date, step.kind)!),
      );
      warnings.push({
        code: 'blackout',
        message: `${step.name}: ${reasons.join('; ')}`,
        stepIndex: index,
        dates: offDays,
      });
    }
    const workDayCount = stepDays[index].filter((date) =>
      calendar.isWorkDay(date, step.kind),
    ).length;
    if (step.days.length === 0 && workDayCount < step.workDays) {
      warnings.push({
        code: 'blackout',
        message: `${step.name} has ${workDayCount} work days from ${step.start} to ${step.end} but needs ${step.workDays}`,
        stepIndex: index,
      });
    }
    const clashes = stepDays[index].filter(
      (date) =>
        calendar.bookedHours(date) + (planHours.get(date) ?? 0) >
        calendar.capacityHours + HOURS_EPSILON,
    );
    if (clashes.length > 0) {
      const worst = Math.max(
        ...clashes.map((date) => calendar.bookedHours(date) + (planHours.get(date) ?? 0)),
      );
      warnings.push({
        code: 'capacity',
        message: `${step.name} goes over the daily capacity of ${calendar.capacityHours} h on ${formatDates(clashes)} (up to ${worst} h booked)`,
        stepIndex: index,
        dates: clashes,
      });
    }
  });

  for (let index = 1; index < steps.length; index++) {
    const previous = steps[index - 1];
    const step = steps[index];
    if (step.start < orderDate(previous)) {
      warnings.push({
        code: 'order',
        // Its last day named as such, and the first day that is free: "before Design is done (2026-12-16)"
        // beside a start on 2026-12-16 read as a contradiction.
        message: `${step.name} starts on ${step.start}, but ${previous.name} runs until ${previous.end}; the earliest start is ${orderDate(previous)}`,
        stepIndex: index,
      });
    } else if (step.start < readyDate(previous)) {
      warnings.push({
        code: 'cure',
        message: `${step.name} starts on ${step.start}, inside the ${previous.cureDays} cure days after ${previous.name}; the earliest start is ${readyDate(previous)}`,
        stepIndex: index,
      });
    }
  }
  return warnings;
}
