import { createDragRef, createDropListRef, type DragRef, type DropListRef } from '@angular/cdk/drag-drop';
import { ScrollDispatcher } from '@angular/cdk/scrolling';
import { DestroyRef, Directive, effect, ElementRef, inject, Injectable, Injector, input } from '@angular/core';
import { CalendarStore } from './calendar-store';
import { chipAt } from './chip-view';
import { MoveFlow, type DragData, type DropTarget } from './move-flow';
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
 * Where the day cells (data-date) are on screen while a chip is dragged, for the outline of the day
 * under the pointer: read when the drag starts and again after anything scrolls (the CDK scrolls the
 * page when a drag nears its edge), so that a move looks its day up among these rectangles. Hit-testing
 * the page at each move (elementFromPoint) brought the move's style update forward into its handler
 * and added a hit test: about 1 ms of every drag frame (bench:calendar-ui). Only the days inside the
 * visible part of the scrolling containers count, as a day scrolled under the window's edge is not
 * under the pointer. The drop itself still hit-tests its point once (MoveFlow.dropped).
 */
class DayRects {
  private days: { cell: HTMLElement; rect: DOMRect }[] | null = null;
  private readonly forget = () => (this.days = null);

  /** `scrollers`: the scrolling containers around the days, whose visible parts hold the days that count. */
  constructor(private readonly scrollers: () => readonly HTMLElement[]) {}

  /** Starts following scrolls and resizes, which move the days on screen. */
  follow(): void {
    this.days = null;
    document.addEventListener('scroll', this.forget, { capture: true, passive: true });
    window.addEventListener('resize', this.forget, { passive: true });
  }

  stop(): void {
    document.removeEventListener('scroll', this.forget, { capture: true });
    window.removeEventListener('resize', this.forget);
    this.days = null;
  }

  /** The day cell under the point, if any. */
  cellAt(point: { x: number; y: number }): HTMLElement | null {
    const day = (this.days ??= this.read()).find(({ rect }) => point.x >= rect.left && point.x < rect.right && point.y >= rect.top && point.y < rect.bottom);
    return day?.cell ?? null;
  }

  private read(): { cell: HTMLElement; rect: DOMRect }[] {
    let visible = new DOMRect(0, 0, window.innerWidth, window.innerHeight);
    for (const scroller of this.scrollers()) visible = intersection(visible, scroller.getBoundingClientRect());
    const days: { cell: HTMLElement; rect: DOMRect }[] = [];
    for (const cell of document.querySelectorAll<HTMLElement>('[data-date]')) {
      const rect = intersection(visible, cell.getBoundingClientRect());
      if (cell.dataset['date'] !== 'tray' && rect.width > 0 && rect.height > 0) days.push({ cell, rect });
    }
    return days;
  }
}

function intersection(a: DOMRect, b: DOMRect): DOMRect {
  const left = Math.max(a.left, b.left);
  const top = Math.max(a.top, b.top);
  return new DOMRect(left, top, Math.max(0, Math.min(a.right, b.right) - left), Math.max(0, Math.min(a.bottom, b.bottom) - top));
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
  /** The scrolling containers around the list, looked up at the first press (as cdkDropList does). */
  private scrollableParents: HTMLElement[] | null = null;
  private readonly dayRects = new DayRects(() => this.scrollableParents ?? []);
  /** What the list holds: the days of the grid or the tray. */
  readonly target = input.required<DropTarget>({ alias: 'kcChipDrags' });
  /** Whether dragging is off here (the tray at phone width, where the list scrolls instead). */
  readonly isOff = input(false, { alias: 'kcChipDragsOff' });
  /** The CDK drop list of this element (tests drop on it). */
  readonly dropList: DropListRef<DropTarget> = createDropListRef<DropTarget>(this.injector, this.host);
  /** The drags made so far, by chip; dropped when their chip leaves the page. */
  private readonly drags = new Map<HTMLElement, DragRef<DragData>>();
  private outlined: HTMLElement | null = null;
  /** Lets the calendar look for other members' changes again, while a chip of this list is held. */
  private releaseChanges: (() => void) | null = null;

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
      this.dayRects.stop();
      this.releaseChanges?.();
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
  private outline(cell: HTMLElement | null): void {
    if (cell === this.outlined) return;
    this.outlined?.classList.remove('drop-target');
    cell?.classList.add('drop-target');
    this.outlined = cell;
  }

  private pressed(target: EventTarget | null): void {
    const chip = chipAt(target, this.host);
    if (!chip) return;
    if (!this.scrollableParents) {
      // So that a drag near the edge of the app's scrolling content scrolls it, not only the window.
      this.scrollableParents = this.scrollDispatcher.getAncestorScrollContainers(this.host).map((scrollable) => scrollable.getElementRef().nativeElement);
      this.dropList.withScrollableParents(this.scrollableParents);
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
      drag.started.subscribe(() => {
        this.releaseChanges = this.store.holdChanges();
        this.dayRects.follow();
      });
      drag.moved.subscribe(({ pointerPosition }) => this.outline(this.dayRects.cellAt(pointerPosition)));
      drag.ended.subscribe(() => {
        this.releaseChanges?.();
        this.releaseChanges = null;
        this.dayRects.stop();
        this.outline(null);
      });
      this.drags.set(chip, drag);
    }
    // Read at every press: a refetch may have brought a newer version of the step into the same chip.
    drag.data = { item, day };
    drag.disabled = false;
    markDragFrames();
  }
}
