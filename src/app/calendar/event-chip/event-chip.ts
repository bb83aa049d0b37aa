import { Directive, effect, ElementRef, inject, input } from '@angular/core';
import type { ChipView } from '../chip-view';

/** The keys a movable chip answers (move-flow.ts), for aria-keyshortcuts. */
const moveKeys = 'ArrowLeft ArrowRight ArrowUp ArrowDown Enter M';

function setAttribute(element: Element, name: string, value: string | null): void {
  if (value === null) element.removeAttribute(name);
  else if (element.getAttribute(name) !== value) element.setAttribute(name, value);
}

/**
 * Draws one event on a day (or a step in the tray or the agenda) onto a button: its kind's colour
 * and icon, its title, a market's hours and the assignee's initials. The title is a
 * `<span class="title">`; the rest is drawn by the chip stylesheet (_chip.scss) from the data
 * attributes written here (the kind's icon from data-kind), and the aria-label is the chip's
 * accessible name. Clicks and keys reach the chip's item through its list's one ChipActions
 * (chip-actions.ts), a press gets its drag from ChipDrags (chip-drags.ts): a chip has no listeners
 * of its own.
 *
 * Plain DOM writes rather than bindings: a month of 300 events draws about a hundred chips at once,
 * and a view with a directive and ten bindings for each was most of the script time of that draw
 * while the page's code is still cold (bench:calendar-ui).
 */
export function writeChip(chip: HTMLButtonElement, view: ChipView): void {
  const { item } = view;
  chip.type = 'button';
  chip.classList.add('chip');
  chip.classList.toggle('done', item.done === true);
  chip.classList.toggle('fixed', !view.canMove);
  chip.classList.toggle('broken', (item.problems?.length ?? 0) > 0);
  setAttribute(chip, 'data-kind', item.kind);
  setAttribute(chip, 'data-event-id', item.id);
  setAttribute(chip, 'data-initials', view.initials);
  setAttribute(chip, 'data-hours', item.hours || null);
  setAttribute(chip, 'aria-label', view.label);
  setAttribute(chip, 'aria-keyshortcuts', view.canMove ? moveKeys : null);
  let title = chip.firstElementChild;
  if (!title) {
    title = chip.ownerDocument.createElement('span');
    title.className = 'title';
    chip.append(title);
  }
  if (title.textContent !== item.title) title.textContent = item.title;
}

/** A chip as a button of a template: `<button [kcChip]="view"></button>` (the tray and the agenda). */
@Directive({ selector: 'button[kcChip]' })
export class EventChip {
  readonly chip = input.required<ChipView>({ alias: 'kcChip' });

  constructor() {
    const host = inject<ElementRef<HTMLButtonElement>>(ElementRef).nativeElement;
    effect(() => writeChip(host, this.chip()));
  }
}

/** Which view each drawn chip shows, so a redraw with the same view object writes nothing. */
const shown = new WeakMap<Element, ChipView>();

/**
 * A day's chips, drawn as the element's children in the given order (`<div [kcChips]="views">`,
 * the month and week days): a chip is kept by its event's id across redraws, as `@for ... track`
 * would, so a moved or refetched event updates its button in place.
 */
@Directive({ selector: '[kcChips]' })
export class ChipList {
  readonly chips = input.required<readonly ChipView[]>({ alias: 'kcChips' });

  constructor() {
    const box = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
    effect(() => drawChips(box, this.chips()));
  }
}

/** Makes `box`'s children the chips of `views`, reusing the buttons of events it already shows. */
export function drawChips(box: HTMLElement, views: readonly ChipView[]): void {
  const byId = new Map<string, HTMLButtonElement>();
  for (const child of box.children) byId.set((child as HTMLElement).dataset['eventId']!, child as HTMLButtonElement);
  let next = box.firstElementChild;
  for (const view of views) {
    let chip = byId.get(view.item.id);
    if (chip) byId.delete(view.item.id);
    else chip = box.ownerDocument.createElement('button');
    if (shown.get(chip) !== view) {
      writeChip(chip, view);
      shown.set(chip, view);
    }
    if (chip === next) next = chip.nextElementSibling;
    else box.insertBefore(chip, next);
  }
  for (const stale of byId.values()) stale.remove();
}
