import { Directive, ElementRef, inject } from '@angular/core';
import type { CalendarEvent, TrayStep } from '@shared/contracts/calendar';
import { CalendarStore } from './calendar-store';
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
    const element = target instanceof Element ? target.closest<HTMLElement>('[data-event-id]') : null;
    if (!element || !this.host.contains(element)) return undefined;
    const id = element.dataset['eventId'];
    return this.store.eventList().find((event) => event.id === id) ?? this.store.trayList().find((step) => step.id === id);
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
