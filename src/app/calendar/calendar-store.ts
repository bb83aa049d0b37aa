import { HttpErrorResponse, httpResource } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { addDays, dateRange, type IsoDate } from '@shared/calendar/dates';
import type { CalendarEvent, EventKind, PlanWarningView, ReplanResult, StepKind, TrayStep } from '@shared/contracts/calendar';
import type { BlackoutView } from '@shared/contracts/markets';
import { moveStep } from '@shared/planning/runway';
import { WorkCalendar } from '@shared/planning/work-calendar';
import { messageOf } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';
import { CalendarApi } from './calendar-api';
import { addMonths, loadedRange, visibleDays, type CalendarView } from './calendar-dates';
import { isBand } from './calendar-kinds';
import { markEventsArrived } from './render-marks';

/** What a day cell shows: bands (holidays, occasions) on top, then the other events. */
export interface DayEntry {
  date: IsoDate;
  bands: CalendarEvent[];
  events: CalendarEvent[];
  bookedHours: number;
  /** When the day is one of the studio's days off (a blackout day on the Markets page), with its note. */
  dayOff: { note: string | null } | null;
}

/** How a day off reads beside its date: "Day off", with its note when it has one. */
export function dayOffText(dayOff: { note: string | null }): string {
  return dayOff.note ? `Day off: ${dayOff.note}` : 'Day off';
}

export type MoveOutcome =
  | { status: 'moved'; event: CalendarEvent; warnings: PlanWarningView[] }
  | { status: 'conflict'; message: string; current: CalendarEvent | null }
  | { status: 'broken-rule'; message: string; warnings: PlanWarningView[] }
  | { status: 'failed'; message: string };

type Movable = CalendarEvent | TrayStep;

const stepKinds: ReadonlySet<EventKind> = new Set(['build', 'content', 'launch']);

/** The calendar's state: which days are shown, the events and tray, filters, and moves with rollback. */
@Injectable({ providedIn: 'root' })
export class CalendarStore {
  private readonly api = inject(CalendarApi);
  private readonly context = inject(StudioContext);
  private readonly session = inject(SessionStore);

  private readonly focusDate = signal(this.context.today());
  private readonly chosenView = signal<'month' | 'week'>('month');
  private readonly isPhoneWidth = signal(false);
  private readonly hidden = signal<ReadonlySet<EventKind>>(new Set());
  private readonly mineOnly = signal(false);
  private readonly movesInFlight = signal(0);
  /** Chips held in a drag right now (chip-drags.ts). */
  private heldChips = 0;
  /** The studio's stamp at the last look for changes. */
  private lastStamp: { studioId: number; stamp: string } | null = null;

  /** The studio's today (StudioContext.today), kept as a signal; it moves on when the day turns. */
  readonly today = signal(this.context.today());
  readonly focus = this.focusDate.asReadonly();
  readonly view = computed<CalendarView>(() => (this.isPhoneWidth() ? 'agenda' : this.chosenView()));
  readonly hiddenKinds = this.hidden.asReadonly();
  readonly onlyMine = this.mineOnly.asReadonly();
  readonly weekStart = computed<1 | 7>(() => this.settingsValue()?.weekStart ?? 1);
  readonly capacityHours = computed(() => this.settingsValue()?.dailyCapacityHours ?? 8);
  /** Whether public holidays are days off for the studio's work. */
  readonly holidaysOff = computed(() => this.settingsValue()?.holidaysOff ?? true);
  readonly canEdit = this.context.canEdit;

  readonly days = computed(() => {
    const view = this.view();
    return visibleDays(view, this.focusDate(), this.weekStart());
  });

  readonly events = httpResource<CalendarEvent[]>(() => {
    // Asked for with the settings, not after them: the range covers the grid from either week start.
    if (this.context.studioId() === null) return undefined;
    const view = this.view();
    const range = loadedRange(view, this.focusDate());
    return { url: `${this.context.base()}/events`, params: range };
  }, {
    parse: (events) => {
      markEventsArrived();
      return events as CalendarEvent[];
    },
  });

  readonly tray = httpResource<TrayStep[]>(() =>
    this.context.studioId() === null ? undefined : `${this.context.base()}/events/tray`,
  );

  /** The studio's days off (blackouts), which runways and moves skip. */
  readonly blackouts = httpResource<BlackoutView[]>(() =>
    this.context.studioId() === null ? undefined : `${this.context.base()}/blackouts`,
  );

  /** The loaded events and tray steps; empty while loading or after an error (value() throws then). */
  readonly eventList = computed(() => (this.events.hasValue() ? this.events.value() : []));
  readonly trayList = computed(() => (this.tray.hasValue() ? this.tray.value() : []));
  /**
   * Each day off by date, with the note of its range (the first range's, where two overlap). The same
   * days coming again (as a studio's empty list does after the month) redraw nothing.
   */
  readonly daysOff = computed(
    () => {
      const days = new Map<IsoDate, { note: string | null }>();
      for (const { start, end, note } of this.blackouts.hasValue() ? this.blackouts.value() : []) {
        for (const date of dateRange(start, end)) if (!days.has(date)) days.set(date, { note });
      }
      return days;
    },
    { equal: (a, b) => a.size === b.size && [...a].every(([date, { note }]) => b.has(date) && b.get(date)!.note === note) },
  );

  /** The loaded event or tray step with this id (a chip's data-event-id). */
  findItem(id: string | undefined): CalendarEvent | TrayStep | undefined {
    return this.eventList().find((event) => event.id === id) ?? this.trayList().find((step) => step.id === id);
  }
  private readonly settingsValue = computed(() => (this.context.settings.hasValue() ? this.context.settings.value() : undefined));

  /** The studio's work days and days off, with the holidays and market days the calendar has loaded. */
  readonly workCalendar = computed(() => {
    const settings = this.settingsValue();
    const events = this.eventList();
    const daysOf = (kind: EventKind) => events.filter((event) => event.kind === kind).flatMap((event) => dateRange(event.start, event.end));
    return new WorkCalendar({
      workDays: settings?.workDays ?? [1, 2, 3, 4, 5],
      dailyCapacityHours: settings?.dailyCapacityHours ?? 8,
      holidaysOff: this.holidaysOff(),
      blackoutDates: [...this.daysOff().keys()],
      holidays: daysOf('holiday'),
      marketDays: daysOf('market'),
    });
  });

  readonly visibleEvents = computed(() => {
    const hidden = this.hidden();
    const userId = this.session.user()?.id ?? null;
    const mineOnly = this.mineOnly();
    return (this.eventList()).filter(
      (event) => !hidden.has(event.kind) && (!mineOnly || !stepKinds.has(event.kind) || event.assigneeId === userId),
    );
  });

  /**
   * Occasions on a public holiday of the same name (Christmas Day, Thanksgiving), each by the id of
   * that holiday: a day draws them as one band, the occasion's (it has the sell window), marked as a
   * holiday too. Among the shown kinds only, so hiding occasions leaves the holiday's own band.
   */
  private readonly occasionOfHoliday = computed(() => {
    const visible = this.visibleEvents();
    const sameDayName = (event: CalendarEvent) => `${event.start} ${event.title.trim().toLowerCase()}`;
    const occasions = new Map(visible.filter((event) => event.kind === 'occasion').map((event) => [sameDayName(event), event.id]));
    const merged = new Map<string, string>();
    for (const event of visible) {
      const occasionId = event.kind === 'holiday' ? occasions.get(sameDayName(event)) : undefined;
      if (occasionId) merged.set(event.id, occasionId);
    }
    return merged;
  });
  /** The ids of the occasions drawn with a holiday's band (occasionOfHoliday). */
  readonly occasionsOnHolidays = computed(() => new Set(this.occasionOfHoliday().values()), {
    equal: (a, b) => a.size === b.size && [...a].every((id) => b.has(id)),
  });

  /** One entry per visible day, built in a single pass over the events. */
  readonly dayEntries = computed<DayEntry[]>(() => {
    const days = this.days();
    const calendar = this.workCalendar();
    const daysOff = this.daysOff();
    const entries: DayEntry[] = days.map((date) => ({ date, bands: [], events: [], bookedHours: 0, dayOff: daysOff.get(date) ?? null }));
    // The visible days are consecutive, so an event's days are a run of positions in `entries`
    // (ISO dates compare as strings): no date arithmetic per event and day.
    const positions = new Map(days.map((date, position) => [date, position]));
    const first = days[0];
    const last = days[days.length - 1];
    // Whether each visible day is a work day for builds and for content, asked once per day and kind
    // (not once per event and day: a month holds hundreds of those).
    const workDays = { build: [] as boolean[], content: [] as boolean[] };
    const isWorkDayAt = (kind: 'build' | 'content', position: number) =>
      (workDays[kind][position] ??= calendar.isWorkDay(days[position], kind));
    const occasionOfHoliday = this.occasionOfHoliday();
    for (const event of this.visibleEvents()) {
      if (event.end < first || event.start > last || occasionOfHoliday.has(event.id)) continue;
      const from = positions.get(event.start > first ? event.start : first)!;
      const to = positions.get(event.end < last ? event.end : last)!;
      const isBandKind = isBand(event.kind);
      const bookedKind = (event.kind === 'build' || event.kind === 'content') && event.hoursPerDay ? event.kind : null;
      for (let position = from; position <= to; position++) {
        const entry = entries[position];
        if (isBandKind) entry.bands.push(event);
        else entry.events.push(event);
        if (bookedKind && isWorkDayAt(bookedKind, position)) entry.bookedHours += event.hoursPerDay!;
      }
    }
    return entries;
  });

  readonly trayGroups = computed(() => {
    const groups = new Map<string, { themeName: string; steps: TrayStep[] }>();
    for (const step of this.trayList()) {
      const key = String(step.themeId ?? step.runwayId ?? 'none');
      const group = groups.get(key) ?? { themeName: step.themeName ?? 'Without a theme', steps: [] };
      group.steps.push(step);
      groups.set(key, group);
    }
    for (const group of groups.values()) group.steps.sort((a, b) => (a.stepIndex ?? 0) - (b.stepIndex ?? 0));
    return [...groups.values()];
  });

  setPhoneWidth(isPhone: boolean): void {
    // The phone's agenda opens on today and the next 7 days, whatever month the wide view showed.
    if (isPhone && !this.isPhoneWidth()) this.focusDate.set(this.today());
    this.isPhoneWidth.set(isPhone);
  }

  setView(view: 'month' | 'week'): void {
    this.chosenView.set(view);
  }

  goTo(date: IsoDate): void {
    this.focusDate.set(date);
  }

  /** When the studio's day has turned (or another studio with another today is open), marks the new today; a view left on the old today follows it. */
  private followToday(): void {
    const today = this.context.today();
    if (today === this.today()) return;
    if (this.focusDate() === this.today()) this.focusDate.set(today);
    this.today.set(today);
  }

  goToday(): void {
    this.today.set(this.context.today());
    this.focusDate.set(this.today());
  }

  step(direction: 1 | -1): void {
    const focus = this.focusDate();
    // The phone's agenda shows 8 days from its first; it steps a week at a time, as the week view does.
    this.focusDate.set(this.view() === 'month' ? addMonths(focus, direction) : addDays(focus, 7 * direction));
  }

  toggleKind(kind: EventKind): void {
    this.hidden.update((hidden) => {
      const next = new Set(hidden);
      if (next.has(kind)) next.delete(kind);
      else next.add(kind);
      return next;
    });
  }

  setOnlyMine(isOn: boolean): void {
    this.mineOnly.set(isOn);
  }

  /** The start and end a step gets when it starts on `start`: its work days from there on. */
  placement(item: Movable, start: IsoDate): { start: IsoDate; end: IsoDate } {
    const kind = item.kind as StepKind;
    const calendar = this.workCalendar();
    let workDays = item.workDays ?? null;
    if (workDays === null && item.start !== null && item.end !== null) {
      workDays = kind === 'launch' ? 0 : Math.max(1, calendar.workDaysBetween(item.start, addDays(item.end, 1), kind));
    }
    const placed = moveStep(
      { name: item.title, kind, workDays: workDays ?? 1, hoursPerDay: item.hoursPerDay ?? 0, cureDays: item.cureDays ?? 0 },
      start,
      calendar,
    );
    return { start: placed.start, end: placed.end };
  }

  /**
   * Moves a step so it starts on `start`: shown there at once, sent with its version, and put back
   * where it was when the server refuses (a stale version or a broken rule without `force`).
   */
  async move(item: Movable, start: IsoDate, options: { force?: boolean; version?: number } = {}): Promise<MoveOutcome> {
    const target = this.placement(item, start);
    const eventsBefore = this.eventList();
    const trayBefore = this.trayList();
    const optimistic: CalendarEvent = { ...(item as CalendarEvent), ...target };
    this.events.set([...eventsBefore.filter((event) => event.id !== item.id), optimistic]);
    if (item.start === null) this.tray.set(trayBefore.filter((step) => step.id !== item.id));
    this.movesInFlight.update((count) => count + 1);
    try {
      const result = await this.api.move(item.id, { ...target, version: options.version ?? item.version ?? 0, ...(options.force ? { force: true } : {}) });
      this.replaceEvent(result.event);
      return { status: 'moved', event: result.event, warnings: result.warnings ?? [] };
    } catch (error) {
      this.events.set(eventsBefore);
      this.tray.set(trayBefore);
      return this.outcomeOf(error);
    } finally {
      this.movesInFlight.update((count) => count - 1);
    }
  }

  /** Takes a step off the calendar and back into the tray (shown at once, put back on a refusal). */
  async unschedule(event: CalendarEvent): Promise<MoveOutcome> {
    const eventsBefore = this.eventList();
    const trayBefore = this.trayList();
    this.events.set(eventsBefore.filter((shown) => shown.id !== event.id));
    this.tray.set([...trayBefore, { ...event, start: null, end: null, workDays: event.workDays ?? 1 }]);
    this.movesInFlight.update((count) => count + 1);
    try {
      const result = await this.api.move(event.id, { start: null, end: null, version: event.version ?? 0 });
      this.tray.set([...trayBefore.filter((step) => step.id !== event.id), { ...(result.event as unknown as TrayStep), start: null, end: null, workDays: result.event.workDays ?? event.workDays ?? 1 }]);
      return { status: 'moved', event: result.event, warnings: result.warnings ?? [] };
    } catch (error) {
      this.events.set(eventsBefore);
      this.tray.set(trayBefore);
      return this.outcomeOf(error);
    } finally {
      this.movesInFlight.update((count) => count - 1);
    }
  }

  private outcomeOf(error: unknown): MoveOutcome {
    if (error instanceof HttpErrorResponse && error.status === 409) {
      const current = (error.error?.current as CalendarEvent | undefined) ?? null;
      if (current?.start) this.replaceEvent(current);
      return {
        status: 'conflict',
        current,
        message: 'Someone else changed this step while you were moving it; it is back where they put it.',
      };
    }
    if (error instanceof HttpErrorResponse && error.status === 422) {
      const warnings = (error.error?.warnings as PlanWarningView[] | undefined) ?? [];
      const why = warnings.map((warning) => warning.message).join('; ') || messageOf(error);
      return { status: 'broken-rule', warnings, message: `Not moved: ${why}` };
    }
    return { status: 'failed', message: `Not moved: ${messageOf(error)}` };
  }

  /** Puts the server's copy of an event in place of the shown one. */
  replaceEvent(event: CalendarEvent): void {
    const events = this.eventList();
    this.events.set([...events.filter((shown) => shown.id !== event.id), event]);
  }

  async updateDetails(event: CalendarEvent, patch: { title?: string; notes?: string | null; assigneeId?: number | null }): Promise<CalendarEvent> {
    const saved = await this.api.updateDetails(event.id, { ...patch, version: event.version ?? 0 });
    this.replaceEvent(saved);
    return saved;
  }

  async setDone(event: CalendarEvent, isDone: boolean): Promise<CalendarEvent> {
    const saved = await this.api.updateDetails(event.id, { done: isDone, version: event.version ?? 0 });
    this.replaceEvent(saved);
    return saved;
  }

  previewReplan(eventId: string, fromItself = false): Promise<ReplanResult> {
    return this.api.replan(eventId, true, fromItself);
  }

  async applyReplan(eventId: string, fromItself = false): Promise<ReplanResult> {
    const result = await this.api.replan(eventId, false, fromItself);
    this.refresh();
    return result;
  }

  refresh(): void {
    this.events.reload();
    this.tray.reload();
  }

  /**
   * Holds the look for other members' changes while a chip is dragged, until the returned release is
   * called: a refetch then would draw the held chip's day again under it, around the placeholder the
   * CDK has put in the chip's place.
   */
  holdChanges(): () => void {
    this.heldChips++;
    let isHeld = true;
    return () => {
      if (isHeld) this.heldChips--;
      isHeld = false;
    };
  }

  /**
   * Asks whether anything changed since the last look, and refetches when it did (not while a move is
   * in flight or a chip is held). The last stamp is kept while the calendar is closed, so that opening
   * it again after a change elsewhere (a market or a day off on the Markets page) brings the change.
   */
  async checkForChanges(): Promise<boolean> {
    this.followToday();
    const studioId = this.context.studioId();
    if (studioId === null || this.movesInFlight() > 0 || this.heldChips > 0) return false;
    const { stamp } = await this.api.stamp();
    const hasChanged = this.lastStamp?.studioId === studioId && stamp !== this.lastStamp.stamp;
    this.lastStamp = { studioId, stamp };
    if (hasChanged) {
      this.refresh();
      this.blackouts.reload();
    }
    return hasChanged;
  }
}
