import { CdkDropList, DragDrop, type DragRef } from '@angular/cdk/drag-drop';
import { DestroyRef, Directive, ElementRef, inject, input } from '@angular/core';
import { CalendarStore } from './calendar-store';
import { MoveFlow, type DragData, type DropTarget } from './move-flow';
import { startDragFrameMarks, stopDragFrameMarks } from './render-marks';

/**
 * Makes the chips of a day cell (or of the tray) draggable with the CDK, on this cdkDropList: a chip
 * gets its drag when a pointer goes down on it, not when it is drawn. A month draws about a hundred
 * chips at once, and a cdkDrag on each one (its drag state, a dozen subscriptions, three listeners)
 * was a large part of drawing the month; a press is one chip at a time.
 *
 * The listeners capture the press on its way down to the chip, so the new drag's own listener on the
 * chip gets that same press. A chip is found by its data-event-id; a drop reaches the list's
 * (cdkDropListDropped) as with cdkDrag, its item's data being the DragData.
 */
@Directive({ selector: '[cdkDropList][kcChipDrags]' })
export class ChipDrags {
  private readonly list = inject<CdkDropList<DropTarget>>(CdkDropList, { self: true });
  private readonly dragDrop = inject(DragDrop);
  private readonly store = inject(CalendarStore);
  private readonly flow = inject(MoveFlow);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  /** The drags made so far, by chip; dropped when their chip leaves the page. */
  private readonly drags = new Map<HTMLElement, DragRef<{ data: DragData }>>();
  /** Whether dragging is off here (the tray at phone width, where the list scrolls instead). */
  readonly isOff = input(false, { alias: 'kcChipDragsOff' });

  constructor() {
    const press = (event: Event) => this.pressed(event.target);
    this.host.addEventListener('mousedown', press, { capture: true });
    this.host.addEventListener('touchstart', press, { capture: true, passive: true });
    inject(DestroyRef).onDestroy(() => {
      this.host.removeEventListener('mousedown', press, { capture: true });
      this.host.removeEventListener('touchstart', press, { capture: true });
      for (const drag of this.drags.values()) drag.dispose();
      this.drags.clear();
    });
  }

  private pressed(target: EventTarget | null): void {
    const chip = target instanceof Element ? target.closest<HTMLElement>('[data-event-id]') : null;
    if (!chip || !this.host.contains(chip)) return;
    for (const [element, drag] of this.drags) {
      if (!element.isConnected) {
        drag.dispose();
        this.drags.delete(element);
      }
    }
    const where = this.list.data;
    const id = chip.dataset['eventId'];
    const item = where === 'tray' ? this.store.trayList().find((step) => step.id === id) : this.store.eventList().find((event) => event.id === id);
    let drag = this.drags.get(chip);
    if (!item || this.isOff() || !this.flow.canDrag(item)) {
      if (drag) drag.disabled = true;
      return;
    }
    if (!drag) {
      drag = this.dragDrop.createDrag<{ data: DragData }>(chip);
      drag._withDropContainer(this.list._dropListRef);
      drag.started.subscribe(() => startDragFrameMarks());
      drag.ended.subscribe(() => stopDragFrameMarks());
      this.drags.set(chip, drag);
    }
    // Read at every press: a refetch may have brought a newer version of the step into the same chip.
    drag.data = { data: { item, day: where === 'tray' ? null : where } };
    drag.disabled = false;
  }
}
