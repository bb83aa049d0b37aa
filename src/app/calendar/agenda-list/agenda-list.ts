import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { formatLong } from '../calendar-dates';
import { lookOf } from '../calendar-kinds';
import type { CalendarEvent } from '@shared/contracts/calendar';
import { CalendarStore, dayOffText } from '../calendar-store';
import { ChipActions } from '../chip-actions';
import { chipViewOf, type ChipView } from '../chip-view';
import { EventChip } from '../event-chip/event-chip';
import { MoveFlow } from '../move-flow';

/** Phone width: today and the next 7 days as a list, for the partner in the workshop. */
@Component({
  selector: 'kc-agenda-list',
  imports: [ChipActions, EventChip],
  template: `
    <ol class="agenda" [attr.aria-label]="store.days()[0] === store.today() ? 'Today and the next 7 days' : 'Eight days from ' + formatLong(store.days()[0])" kcChipActions>
      @for (day of store.dayEntries(); track day.date) {
        <li class="day" [class.today]="day.date === store.today()" [attr.data-date]="day.date">
          <h3>{{ day.date === store.today() ? 'Today · ' : '' }}{{ formatLong(day.date) }}</h3>
          @if (day.dayOff; as dayOff) {
            <p class="day-off">{{ dayOffText(dayOff) }}</p>
          }
          @for (band of day.bands; track band.id) {
            <button type="button" class="band" [style.--kc-colour]="lookOf(band.kind).colour" (click)="flow.open(band)">
              <span class="material-symbols-outlined" aria-hidden="true">{{ lookOf(band.kind).icon }}</span>
              @if (store.occasionsOnHolidays().has(band.id)) {
                <span class="material-symbols-outlined" aria-hidden="true">{{ lookOf('holiday').icon }}</span>
                <span class="cdk-visually-hidden">Public holiday:</span>
              }
              {{ band.title }}
            </button>
          }
          @for (event of day.events; track event.id) {
            <button [kcChip]="chipOf(event)"></button>
          } @empty {
            @if (day.bands.length === 0 && !day.dayOff) {
              <p class="empty">Nothing planned</p>
            }
          }
        </li>
      }
    </ol>
  `,
  styles: `
    .agenda { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 12px; }
    .day { display: flex; flex-direction: column; gap: 4px; }
    .day.today h3 { color: var(--mat-sys-primary); }
    h3 { margin: 0; font-size: 0.95rem; font-weight: 500; }
    .band { display: flex; align-items: center; gap: 4px; border: 0; border-radius: 4px; padding: 4px 8px; background: var(--kc-colour); color: #fff; font: inherit; text-align: left; }
    .band .material-symbols-outlined { font-size: 16px; }
    .day-off { margin: 0; font-size: 0.85rem; font-style: italic; color: var(--mat-sys-on-surface-variant); }
    .empty { margin: 0; font-size: 0.85rem; color: var(--mat-sys-on-surface-variant); }
    .chip { min-height: 36px; line-height: 34px; font-size: 0.9rem; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AgendaList {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  protected readonly lookOf = lookOf;
  protected readonly formatLong = formatLong;
  protected readonly dayOffText = dayOffText;

  protected chipOf(event: CalendarEvent): ChipView {
    return chipViewOf(event, this.flow.canDrag(event));
  }
}
