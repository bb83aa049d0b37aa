import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { formatLong, formatShort } from '../calendar-dates';
import { CalendarStore, dayOffText } from '../calendar-store';
import { ChipActions } from '../chip-actions';
import { ChipDrags } from '../chip-drags';
import { DayItems } from '../day-items/day-items';
import { MoveFlow } from '../move-flow';

/** One week, a column per day, each with its booked hours against the studio's daily capacity. */
@Component({
  selector: 'kc-week-view',
  imports: [ChipActions, ChipDrags, DayItems],
  templateUrl: './week-view.html',
  styleUrl: './week-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeekView {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  protected readonly formatShort = formatShort;
  protected readonly formatLong = formatLong;
  protected readonly dayOffText = dayOffText;

  protected share(hours: number): number {
    return Math.min(100, Math.round((hours / this.store.capacityHours()) * 100));
  }
}
