import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import type { MemberView } from '@shared/contracts/team';
import { messageOf } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { StudioContext } from '../../core/studio-context';
import { formatLong } from '../calendar-dates';
import { lookOf } from '../calendar-kinds';
import { CalendarStore } from '../calendar-store';
import { canTickStep } from '../chip-view';
import { MoveFlow } from '../move-flow';

/** The side sheet of one event: details, notes, assignee, done, the step's cautions, its theme. */
@Component({
  selector: 'kc-event-sheet',
  imports: [FormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './event-sheet.html',
  styleUrl: './event-sheet.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EventSheet {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  protected readonly context = inject(StudioContext);
  private readonly session = inject(SessionStore);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly event = computed<CalendarEvent | TrayStep | null>(() => {
    const id = this.flow.selectedId();
    if (id === null) return null;
    return this.store.eventList().find((event) => event.id === id) ?? this.store.trayList().find((step) => step.id === id) ?? null;
  });
  protected readonly look = computed(() => lookOf(this.event()?.kind ?? 'build'));
  protected readonly isStep = computed(() => ['build', 'content', 'launch'].includes(this.event()?.kind ?? ''));
  protected readonly canEdit = computed(() => !!this.event()?.editable && this.context.canEdit());
  /** Partners tick any step; crew only their own. */
  protected readonly canTick = computed(() => {
    const event = this.event();
    if (!event || !this.isStep()) return false;
    return canTickStep(event, this.context.canEdit(), this.session.user()?.id);
  });
  protected readonly when = computed(() => {
    const event = this.event();
    if (!event?.start || !event.end) return 'Not on the calendar yet (in the tray)';
    return event.start === event.end ? formatLong(event.start) : `${formatLong(event.start)} to ${formatLong(event.end)}`;
  });
  /** The studio's members, asked for once a partner opens a step. */
  private readonly members = httpResource<MemberView[]>(() => (this.canEdit() && this.isStep() ? `${this.context.base()}/members` : undefined));
  /** Assignee choices: the members, else those seen on the calendar and the signed-in user. */
  protected readonly people = computed(() => {
    const people = new Map<number, string>();
    if (this.members.hasValue()) for (const member of this.members.value()) people.set(member.userId, member.name);
    const user = this.session.user();
    if (user) people.set(user.id, user.name);
    for (const event of this.store.eventList()) if (event.assigneeId != null) people.set(event.assigneeId, event.assigneeName ?? `Member ${event.assigneeId}`);
    for (const step of this.store.trayList()) if (step.assigneeId != null) people.set(step.assigneeId, step.assigneeName ?? `Member ${step.assigneeId}`);
    return [...people].map(([id, name]) => ({ id, name }));
  });

  protected readonly title = signal('');
  protected readonly notes = signal('');
  protected readonly assigneeId = signal<number | null>(null);
  protected readonly isSaving = signal(false);

  constructor() {
    effect(() => {
      const event = this.event();
      this.title.set(event?.title ?? '');
      this.notes.set(event?.notes ?? '');
      this.assigneeId.set(event?.assigneeId ?? null);
    });
  }

  protected async save(): Promise<void> {
    const event = this.event();
    if (!event || this.isSaving()) return;
    this.isSaving.set(true);
    try {
      await this.store.updateDetails(event as CalendarEvent, { title: this.title().trim(), notes: this.notes() || null, assigneeId: this.assigneeId() });
      this.snackBar.open(`Saved ${this.title().trim()}`, undefined, { duration: 3000 });
    } catch (error) {
      this.snackBar.open(`Not saved: ${messageOf(error)}`, 'Dismiss', { duration: 8000 });
    } finally {
      this.isSaving.set(false);
    }
  }

  protected async tick(isDone: boolean): Promise<void> {
    const event = this.event();
    if (!event) return;
    try {
      await this.store.setDone(event as CalendarEvent, isDone);
    } catch (error) {
      this.snackBar.open(`Not saved: ${messageOf(error)}`, 'Dismiss', { duration: 8000 });
      this.store.refresh();
    }
  }
}
