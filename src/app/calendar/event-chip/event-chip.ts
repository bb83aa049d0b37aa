import { Directive, input } from '@angular/core';
import type { ChipView } from '../chip-view';

/**
 * One event on a day (or a step in the tray or the agenda) as a button: its kind's colour and icon,
 * its title, a market's hours and the assignee's initials. The list around it writes the title in:
 * `<button kcChip [chip]="chip"><span class="title">{{ chip.item.title }}</span></button>`; the
 * rest is drawn by the chip stylesheet (_chip.scss) from the data attributes set here.
 *
 * A directive with nothing but attribute bindings, no template of its own and no listeners: a month
 * of 300 events draws about a hundred chips at once, and a component with its own view, a few
 * embedded views and two listeners for each was most of the script time of that first draw. Clicks
 * and keys reach the chip's item through the list's one ChipActions (chip-actions.ts), a press gets
 * its drag from ChipDrags (chip-drags.ts).
 */
@Directive({
  selector: 'button[kcChip]',
  host: {
    type: 'button',
    class: 'chip',
    '[class.done]': 'chip().item.done',
    '[class.fixed]': '!chip().canMove',
    '[attr.data-kind]': 'chip().item.kind',
    '[attr.data-event-id]': 'chip().item.id',
    '[attr.data-icon]': 'chip().icon',
    '[attr.data-initials]': 'chip().initials',
    '[attr.data-hours]': 'chip().item.hours || null',
    '[attr.aria-label]': 'chip().label',
    '[attr.aria-keyshortcuts]': "chip().canMove ? 'ArrowLeft ArrowRight ArrowUp ArrowDown Enter M' : null",
  },
})
export class EventChip {
  readonly chip = input.required<ChipView>();
}
