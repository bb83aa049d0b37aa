import { CdkDropList, DragDrop, type DragRef } from '@angular/cdk/drag-drop';
import { DestroyRef, Directive, ElementRef, inject, input } from '@angular/core';
import { CalendarStore } from './calendar-store';
import { dayAt, MoveFlow, type DragData, type DropTarget } from './move-flow';
import { startDragFrameMarks, stopDragFrameMarks } from './render-marks';

/**
 * Makes the chips of a month's or week's days (or of the tray) draggable with the CDK, on this
 * cdkDropList — one for all the days, whose drop lands on the day under the pointer: a chip
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
  private outlined: HTMLElement | null = null;
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

  /**
   * Marks the day under the pointer while dragging, by a class on its cell: every day is one drop
   * list (cheap to cross: no list to leave and enter, no change detection), so the CDK cannot.
   */
  private outline(date: string | null): void {
    const cell = date ? document.querySelector<HTMLElement>(`[data-date="${date}"]`) : null;
    if (cell === this.outlined) return;
    this.outlined?.classList.remove('drop-target');
    cell?.classList.add('drop-target');
    this.outlined = cell;
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
    const isTray = this.list.data === 'tray';
    const day = isTray ? null : (chip.closest<HTMLElement>('[data-date]')?.dataset['date'] ?? null);
    const id = chip.dataset['eventId'];
    const item = isTray ? this.store.trayList().find((step) => step.id === id) : this.store.eventList().find((event) => event.id === id);
    let drag = this.drags.get(chip);
    if (!item || this.isOff() || !this.flow.canDrag(item)) {
      if (drag) drag.disabled = true;
      return;
    }
    if (!drag) {
      drag = this.dragDrop.createDrag<{ data: DragData }>(chip);
      drag._withDropContainer(this.list._dropListRef);
      drag.started.subscribe(() => startDragFrameMarks());
      drag.moved.subscribe(({ pointerPosition }) => this.outline(dayAt(pointerPosition)));
      drag.ended.subscribe(() => {
        this.outline(null);
        stopDragFrameMarks();
      });
      this.drags.set(chip, drag);
    }
    // Read at every press: a refetch may have brought a newer version of the step into the same chip.
    drag.data = { data: { item, day } };
    drag.disabled = false;
  }
}
