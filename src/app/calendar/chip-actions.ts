import { Directive, ElementRef, inject } from '@angular/core';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import { CalendarStore } from './calendar-store';
import { chipAt } from './chip-view';
import { MoveFlow } from './move-flow';

/**
 * Clicks and keys for every chip and band inside this element, with one listener each for the whole
 * list instead of two on every chip: a click or Enter opens the item's side sheet; arrow keys and
 * Enter move it, M opens "Move to…" (MoveFlow.keyPressed). The item is found by the data-event-id
 * of the chip or band the event came from, among the calendar's loaded events and tray steps.
 */
@Directive({
  selector: '[kcChipActions]',
  host: { '(click)': 'clicked($event)', '(keydown)': 'keyPressed($event)' },
})
export class ChipActions {
  private readonly store = inject(CalendarStore);
  private readonly flow = inject(MoveFlow);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  private itemOf(target: EventTarget | null): CalendarEvent | TrayStep | undefined {
    const chip = chipAt(target, this.host);
    return chip ? this.store.findItem(chip.dataset['eventId']) : undefined;
  }

  protected clicked(click: MouseEvent): void {
    const item = this.itemOf(click.target);
    if (item) this.flow.open(item);
  }

  protected keyPressed(keyboard: KeyboardEvent): void {
    const item = this.itemOf(keyboard.target);
    // Enter without a pending move is the button's own click (opens the sheet).
    if (!item || (keyboard.key === 'Enter' && this.flow.keyboardTarget()?.id !== item.id)) return;
    if (this.flow.keyPressed(item, keyboard.key)) keyboard.preventDefault();
  }
}
