import { afterNextRender, ChangeDetectionStrategy, Component, computed, effect, inject, Injector } from '@angular/core';
import { formatLong, formatWeekday, weeksOf } from '../calendar-dates';
import { CalendarStore, dayOffText } from '../calendar-store';
import { ChipActions } from '../chip-actions';
import { ChipDrags } from '../chip-drags';
import { DayItems } from '../day-items/day-items';
import { MoveFlow } from '../move-flow';
import { canMark, measureMonthRender } from '../render-marks';

/** The month as whole weeks from the studio's week start; the grid is one drop list for all its days. */
@Component({
  selector: 'kc-month-view',
  imports: [ChipActions, ChipDrags, DayItems],
  templateUrl: './month-view.html',
  styleUrl: './month-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MonthView {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  private readonly injector = inject(Injector);
  /** Chips a month cell shows before "+N more" (the week view shows every one). */
  protected readonly chipLimit = 4;

  protected readonly month = computed(() => this.store.focus().slice(0, 7));
  /** The weeks of day cells, each with what its template shows worked out once per change of the days. */
  protected readonly weeks = computed(() => {
    const today = this.store.today();
    const month = this.month();
    return weeksOf(
      this.store.dayEntries().map((entry) => ({
        entry,
        date: entry.date,
        number: Number(entry.date.slice(8)),
        label: entry.dayOff ? `${formatLong(entry.date)}, ${dayOffText(entry.dayOff)}` : formatLong(entry.date),
        dayOff: entry.dayOff ? dayOffText(entry.dayOff) : null,
        isToday: entry.date === today,
        isOutside: entry.date.slice(0, 7) !== month,
      })),
    );
  });
  protected readonly weekdayNames = computed(() => this.store.days().slice(0, 7).map(formatWeekday));
  protected readonly keyboardDate = computed(() => this.flow.keyboardTarget()?.date ?? null);

  constructor() {
    // Performance API marks for bench:calendar-ui: from the events' arrival to the painted grid.
    const created = canMark ? performance.now() : 0;
    effect(() => {
      if (!canMark) return;
      const entries = this.store.dayEntries();
      const count = entries.reduce((sum, entry) => sum + entry.events.length + entry.bands.length, 0);
      afterNextRender(() => measureMonthRender(count, created), { injector: this.injector });
    });
  }
}
