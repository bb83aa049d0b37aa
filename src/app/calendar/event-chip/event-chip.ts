import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import { formatLong, initialsOf } from '../calendar-dates';
import { lookOf } from '../calendar-kinds';
import { MoveFlow } from '../move-flow';

/**
 * One event on a day (or a step in the tray): kind colour and icon, title, hours of a market and the
 * assignee's initials. Enter or a click opens its side sheet; arrow keys and Enter move it; M opens "Move to…".
 * Plain spans for the icons keep a month of 300 events light.
 */
@Component({
  selector: 'kc-event-chip',
  template: `
    <button
      type="button"
      class="chip"
      [class.done]="event().done"
      [class.fixed]="!canMove()"
      [style.--kc-colour]="look().colour"
      [attr.aria-label]="label()"
      [attr.aria-keyshortcuts]="canMove() ? 'ArrowLeft ArrowRight ArrowUp ArrowDown Enter M' : null"
      (click)="flow.open(event())"
      (keydown)="keyDown($event)"
    >
      <span class="material-symbols-outlined icon" aria-hidden="true">{{ look().icon }}</span>
      <span class="title">{{ event().title }}</span>
      @if (event().hours) {
        <span class="hours">{{ event().hours }}</span>
      }
      @if (initials()) {
        <span class="initials" [attr.title]="event().assigneeName">{{ initials() }}</span>
      }
      @if (event().done) {
        <span class="material-symbols-outlined icon" aria-hidden="true">check</span>
      }
    </button>
  `,
  styleUrl: './event-chip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EventChip {
  protected readonly flow = inject(MoveFlow);
  readonly event = input.required<CalendarEvent | TrayStep>();

  protected readonly look = computed(() => lookOf(this.event().kind));
  protected readonly initials = computed(() => initialsOf(this.event().assigneeName));
  protected readonly canMove = computed(() => this.flow.canDrag(this.event()));
  protected readonly label = computed(() => {
    const event = this.event();
    const parts = [`${this.look().label}: ${event.title}`];
    if (event.start) parts.push(event.start === event.end ? formatLong(event.start) : `${formatLong(event.start)} to ${formatLong(event.end!)}`);
    else parts.push('not on the calendar yet');
    if (event.assigneeName) parts.push(`assigned to ${event.assigneeName}`);
    if (event.hours) parts.push(event.hours);
    if (event.done) parts.push('done');
    return parts.join(', ');
  });

  protected async keyDown(keyboard: KeyboardEvent): Promise<void> {
    const pending = this.flow.keyboardTarget();
    // Enter without a pending move is the button's own click (opens the sheet).
    if (keyboard.key === 'Enter' && pending?.id !== this.event().id) return;
    if (await this.flow.keyPressed(this.event(), keyboard.key)) keyboard.preventDefault();
  }
}
