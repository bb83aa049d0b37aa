import { createDragRef, createDropListRef, type DragRef, type DropListRef } from '@angular/cdk/drag-drop';
import { ScrollDispatcher } from '@angular/cdk/scrolling';
import { DestroyRef, Directive, effect, ElementRef, inject, Injectable, Injector, input } from '@angular/core';
import { CalendarStore } from './calendar-store';
import { chipAt } from './chip-view';
import { dayAt, MoveFlow, type DragData, type DropTarget } from './move-flow';
import { markDragFrames } from './render-marks';

/** The calendar's drop lists on the page (a month's or week's days and the tray), each connected to the others. */
@Injectable({ providedIn: 'root' })
export class ChipDropLists {
  private readonly lists = new Set<DropListRef<DropTarget>>();

  add(list: DropListRef<DropTarget>): void {
    this.lists.add(list);
    this.connect();
  }

  remove(list: DropListRef<DropTarget>): void {
    this.lists.delete(list);
    this.connect();
  }

  private connect(): void {
    for (const list of this.lists) list.connectedTo([...this.lists].filter((other) => other !== list));
  }
}

/**
 * Makes this element a drop list of the CDK (`kcChipDrags="days"` on a month's or week's grid, one for
 * all its days, whose drop lands on the day under the pointer; `"tray"` on the tray) and the chips in
 * it draggable: a chip gets its drag when a pointer goes down on it, not when it is drawn. A month
 * draws about a hundred chips at once, and a cdkDrag on each one (its drag state, a dozen
 * subscriptions, three listeners) was a large part of drawing the month; a press is one chip at a time.
 *
 * The CDK's refs are used without its directives: a cdkDropList marks its view for check when a drag
 * starts in it or in a list connected to it, which re-ran the templates of the whole calendar inside
 * the first frame of every drag. Nothing here needs change detection until the drop.
 *
 * The listeners capture the press on its way down to the chip, so the new drag's own listener on the
 * chip gets that same press. A chip is found by its data-event-id; a drop goes to MoveFlow.dropped.
 */
@Directive({ selector: '[kcChipDrags]' })
export class ChipDrags {
  private readonly store = inject(CalendarStore);
  private readonly flow = inject(MoveFlow);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  private readonly scrollDispatcher = inject(ScrollDispatcher);
  /** Whether the scrolling containers around the list are known (looked up at the first press, as cdkDropList does). */
  private hasScrollableParents = false;
  /** What the list holds: the days of the grid or the tray. */
  readonly target = input.required<DropTarget>({ alias: 'kcChipDrags' });
  /** Whether dragging is off here (the tray at phone width, where the list scrolls instead). */
  readonly isOff = input(false, { alias: 'kcChipDragsOff' });
  /** The CDK drop list of this element (tests drop on it). */
  readonly dropList: DropListRef<DropTarget> = createDropListRef<DropTarget>(this.injector, this.host);
  /** The drags made so far, by chip; dropped when their chip leaves the page. */
  private readonly drags = new Map<HTMLElement, DragRef<DragData>>();
  private outlined: HTMLElement | null = null;

  constructor() {
    this.dropList.sortingDisabled = true;
    const lists = inject(ChipDropLists);
    lists.add(this.dropList);
    effect(() => {
      this.dropList.data = this.target();
      this.dropList.disabled = this.isOff();
    });
    this.dropList.dropped.subscribe((drop) =>
      void this.flow.dropped({ target: drop.container.data, source: drop.previousContainer.data, data: drop.item.data, dropPoint: drop.dropPoint }),
    );
    const press = (event: Event) => this.pressed(event.target);
    this.host.addEventListener('mousedown', press, { capture: true });
    this.host.addEventListener('touchstart', press, { capture: true, passive: true });
    inject(DestroyRef).onDestroy(() => {
      this.host.removeEventListener('mousedown', press, { capture: true });
      this.host.removeEventListener('touchstart', press, { capture: true });
      for (const drag of this.drags.values()) drag.dispose();
      this.drags.clear();
      lists.remove(this.dropList);
      this.dropList.dispose();
    });
  }

  /** The drag made for `chip` by a press, if any (tests read it). */
  dragOf(chip: HTMLElement): DragRef<DragData> | undefined {
    return this.drags.get(chip);
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
    const chip = chipAt(target, this.host);
    if (!chip) return;
    if (!this.hasScrollableParents) {
      // So that a drag near the edge of the app's scrolling content scrolls it, not only the window.
      this.dropList.withScrollableParents(this.scrollDispatcher.getAncestorScrollContainers(this.host).map((scrollable) => scrollable.getElementRef().nativeElement));
      this.hasScrollableParents = true;
    }
    for (const [element, drag] of this.drags) {
      if (!element.isConnected) {
        drag.dispose();
        this.drags.delete(element);
      }
    }
    const day = this.target() === 'tray' ? null : (chip.closest<HTMLElement>('[data-date]')?.dataset['date'] ?? null);
    const item = this.store.findItem(chip.dataset['eventId']);
    let drag = this.drags.get(chip);
    if (!item || this.isOff() || !this.flow.canDrag(item)) {
      if (drag) drag.disabled = true;
      return;
    }
    if (!drag) {
      drag = createDragRef<DragData>(this.injector, chip);
      drag._withDropContainer(this.dropList);
      drag.moved.subscribe(({ pointerPosition }) => this.outline(dayAt(pointerPosition)));
      drag.ended.subscribe(() => this.outline(null));
      this.drags.set(chip, drag);
    }
    // Read at every press: a refetch may have brought a newer version of the step into the same chip.
    drag.data = { item, day };
    drag.disabled = false;
    markDragFrames();
  }
}
