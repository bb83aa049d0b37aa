import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { lookOf } from '../calendar-kinds';
import { CalendarStore, type DayEntry } from '../calendar-store';
import { chipViewOf, type ChipView } from '../chip-view';
import { ChipList } from '../event-chip/event-chip';
import { MoveFlow } from '../move-flow';

/**
 * What a day cell of the month or week view holds: its bands, then its events as chips (drawn by
 * ChipList, event-chip.ts), which the view's one drop list for all its days makes draggable when
 * pressed (chip-drags.ts) and whose clicks and keys its ChipActions handles (chip-actions.ts).
 */
@Component({
  selector: 'kc-day-items',
  imports: [ChipList],
  host: { '[class.open]': 'isExpanded()' },
  template: `
    @for (band of day().bands; track band.id) {
      @let look = lookOf(band.kind);
      @let isAlsoHoliday = store.occasionsOnHolidays().has(band.id);
      <button
        type="button"
        class="band"
        [attr.data-kind]="band.kind"
        [attr.data-also]="isAlsoHoliday ? 'holiday' : null"
        [attr.data-event-id]="band.id"
        [attr.aria-label]="look.label + (isAlsoHoliday ? ' and public holiday' : '') + ': ' + band.title"
      >{{ band.title }}</button>
    }
    <div class="chips" [kcChips]="chips()"></div>
    <!-- One button kept for the day's life and hidden when not needed: made anew whenever a day
      filled up, it cost a view and a listener for each of a month's days as its events came. -->
    <button
      type="button"
      class="more"
      [hidden]="!more()"
      (click)="isExpanded.set(!isExpanded())"
      [attr.aria-label]="more()?.name ?? null"
    >{{ more()?.label }}</button>
  `,
  styleUrl: './day-items.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DayItems {
  protected readonly flow = inject(MoveFlow);
  protected readonly store = inject(CalendarStore);
  protected readonly lookOf = lookOf;
  readonly day = input.required<DayEntry>();
  /** Chips shown before "+N more" (the month view); all when absent (the week view). */
  readonly limit = input(Infinity);
  protected readonly isExpanded = signal(false);

  // The bands take lines of the limit first; a full day shows one chip fewer than the lines left
  // and the "+N more" line in the space of the last one.
  private readonly shown = computed(() => {
    const { events, bands } = this.day();
    const lines = this.limit() - bands.length;
    return this.isExpanded() || events.length <= lines ? events : events.slice(0, Math.max(0, lines - 1));
  });
  protected readonly chips = computed<ChipView[]>(() => this.shown().map((event) => chipViewOf(event, this.flow.canDrag(event))));
  /** "+N more" while chips are hidden, "Show fewer" once opened, or nothing when all fit. */
  protected readonly more = computed(() => {
    const { events, bands } = this.day();
    const hiddenCount = events.length - this.shown().length;
    if (hiddenCount > 0) return { label: `+${hiddenCount} more`, name: `Show ${hiddenCount} more on this day` };
    return this.isExpanded() && events.length > this.limit() - bands.length ? { label: 'Show fewer', name: null } : null;
  });
}
