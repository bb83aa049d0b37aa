import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import type { ChipView } from '../chip-view';
import { MoveFlow } from '../move-flow';

/**
 * One event on a day (or a step in the tray): kind colour and icon, title, hours of a market and the
 * assignee's initials. Enter or a click opens its side sheet; arrow keys and Enter move it; M opens "Move to…".
 * The host is the button itself (`<button kcChip>`; its drop list makes it draggable when pressed, chip-drags.ts) and it binds a ready-made
 * ChipView (chip-view.ts) and plain spans for the icons, so a month of 300 events stays light: up to
 * four of these in each of its 35 or 42 day cells, drawn at once.
 */
@Component({
  selector: 'button[kcChip]',
  host: {
    type: 'button',
    '[class]': 'chip().classes',
    '[attr.aria-label]': 'chip().label',
    '[attr.aria-keyshortcuts]': "chip().canMove ? 'ArrowLeft ArrowRight ArrowUp ArrowDown Enter M' : null",
    '(click)': 'flow.open(chip().item)',
    '(keydown)': 'keyDown($event)',
  },
  template: `
    <span class="material-symbols-outlined icon" aria-hidden="true">{{ chip().icon }}</span>
    <span class="title">{{ chip().item.title }}</span>
    @if (chip().item.hours) {
      <span class="hours">{{ chip().item.hours }}</span>
    }
    @if (chip().initials) {
      <span class="initials" [attr.title]="chip().item.assigneeName">{{ chip().initials }}</span>
    }
    @if (chip().item.done) {
      <span class="material-symbols-outlined icon" aria-hidden="true">check</span>
    }
  `,
  styleUrl: './event-chip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EventChip {
  protected readonly flow = inject(MoveFlow);
  readonly chip = input.required<ChipView>();

  protected async keyDown(keyboard: KeyboardEvent): Promise<void> {
    const item = this.chip().item;
    // Enter without a pending move is the button's own click (opens the sheet).
    if (keyboard.key === 'Enter' && this.flow.keyboardTarget()?.id !== item.id) return;
    if (await this.flow.keyPressed(item, keyboard.key)) keyboard.preventDefault();
  }
}
