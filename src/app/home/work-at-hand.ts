import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { addDays } from '@shared/calendar/dates';
import type { AtHand, CalendarEvent, StepProblem } from '@shared/contracts/calendar';
import { messageOf } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { valueOr } from '../core/resource-value';
import { StudioContext } from '../core/studio-context';
import { CalendarApi } from '../calendar/calendar-api';
import { formatShortSpan } from '../calendar/calendar-dates';
import { canTickStep } from '../calendar/chip-view';
import { lookOf } from '../calendar/calendar-kinds';

/** Days after today that the list looks at, as the calendar's phone agenda does. */
export const atHandDays = 7;
/** How often the list looks for other members' changes and for a new day. */
export const atHandPollMs = 30_000;

interface StepLine {
  step: CalendarEvent;
  icon: string;
  colour: string;
  kindLabel: string;
  when: string;
  who: string;
  canTick: boolean;
}

/**
 * The home page's list of work in hand: steps overdue (ended before today, not done), today's and
 * the next days', each with its done box. Partners tick any step, crew their own, as in the
 * calendar's side sheet; a tick is sent with the step's version, and a refused one (another member
 * changed the step) says why and reloads the list. Each title opens the calendar on its day, with
 * its side sheet. Other members' changes (the studio's events stamp) and a new day reload it.
 */
@Component({
  selector: 'kc-work-at-hand',
  imports: [RouterLink, MatButtonModule, MatCardModule, MatCheckboxModule, MatProgressBarModule, MatSlideToggleModule],
  templateUrl: './work-at-hand.html',
  styleUrl: './work-at-hand.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkAtHand {
  protected readonly context = inject(StudioContext);
  private readonly session = inject(SessionStore);
  private readonly api = inject(CalendarApi);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly today = signal(this.context.today());
  protected readonly problemText = (problem: StepProblem) => problem.message;
  private readonly through = computed(() => addDays(this.today(), atHandDays));
  protected readonly atHand = httpResource<AtHand>(() =>
    this.context.studioId() === null ? undefined : { url: `${this.context.base()}/events/at-hand`, params: { today: this.today(), through: this.through() } },
  );
  /** Crew see their own steps first; partners the studio's. */
  protected readonly isOnlyMine = signal(this.context.role() === 'crew');
  /** The steps whose tick is on its way. */
  protected readonly ticking = signal<ReadonlySet<string>>(new Set());
  private lastStamp: { studioId: number; stamp: string } | null = null;

  constructor() {
    const timer = setInterval(() => void this.checkForChanges().catch(() => undefined), atHandPollMs);
    void this.checkForChanges().catch(() => undefined);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  /** Reloads the list when the day has turned or another member changed the studio's events; true when it did. */
  async checkForChanges(): Promise<boolean> {
    const today = this.context.today();
    if (today !== this.today()) {
      this.today.set(today);
      return true;
    }
    const studioId = this.context.studioId();
    if (studioId === null || this.ticking().size > 0) return false;
    const { stamp } = await this.api.stamp();
    const hasChanged = this.lastStamp?.studioId === studioId && stamp !== this.lastStamp.stamp;
    this.lastStamp = { studioId, stamp };
    if (hasChanged) this.atHand.reload();
    return hasChanged;
  }

  private readonly lines = computed(() => {
    const answer = valueOr(this.atHand, undefined);
    if (!answer) return null;
    const me = this.session.user()?.id;
    const isMine = (step: CalendarEvent) => step.assigneeId != null && step.assigneeId === me;
    const shown = (steps: CalendarEvent[]) => steps.filter((step) => !this.isOnlyMine() || isMine(step)).map((step) => this.lineOf(step, isMine(step)));
    const today = this.today();
    return {
      overdue: shown(answer.overdue),
      moreOverdue: answer.overdueCount - answer.overdue.length,
      today: shown(answer.upcoming.filter((step) => step.start <= today)),
      next: shown(answer.upcoming.filter((step) => step.start > today)),
    };
  });
  /** Whether the studio has no step in hand at all (not only none of mine): a new studio. */
  protected readonly isStudioIdle = computed(() => {
    const answer = valueOr(this.atHand, undefined);
    return !!answer && answer.overdueCount === 0 && answer.upcoming.length === 0;
  });
  protected readonly groups = computed(() => {
    const lines = this.lines();
    if (!lines) return [];
    return [
      { key: 'overdue', title: 'Overdue', empty: 'Nothing overdue.', lines: lines.overdue, more: lines.moreOverdue },
      { key: 'today', title: 'Today', empty: 'Nothing planned for today.', lines: lines.today, more: 0 },
      { key: 'next', title: `The next ${atHandDays} days`, empty: 'Nothing planned for the next days.', lines: lines.next, more: 0 },
    ];
  });

  private lineOf(step: CalendarEvent, isMine: boolean): StepLine {
    const look = lookOf(step.kind);
    return {
      step,
      icon: look.icon,
      colour: look.colour,
      kindLabel: look.label,
      when: formatShortSpan(step.start, step.end),
      who: isMine ? 'You' : (step.assigneeName ?? 'Nobody yet'),
      canTick: canTickStep(step, this.context.canEdit(), this.session.user()?.id),
    };
  }

  protected async tick(step: CalendarEvent, isDone: boolean): Promise<void> {
    if (step.version === undefined || this.ticking().has(step.id)) return;
    this.ticking.update((ids) => new Set(ids).add(step.id));
    try {
      const stored = await this.api.updateDetails(step.id, { done: isDone, version: step.version });
      const replace = (steps: CalendarEvent[]) => steps.map((each) => (each.id === stored.id ? { ...each, ...stored } : each));
      this.atHand.update((answer) => answer && { ...answer, overdue: replace(answer.overdue), upcoming: replace(answer.upcoming) });
    } catch (error) {
      this.snackBar.open(`Not saved: ${messageOf(error)}`, 'Dismiss', { duration: 8000 });
      this.atHand.reload();
    } finally {
      this.ticking.update((ids) => {
        const left = new Set(ids);
        left.delete(step.id);
        return left;
      });
    }
  }
}
