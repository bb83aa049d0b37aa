import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import type { TrayStep } from '@shared/contracts/calendar';
import { CalendarStore } from '../calendar-store';
import { ChipActions } from '../chip-actions';
import { ChipDrags } from '../chip-drags';
import { chipViewOf, type ChipView } from '../chip-view';
import { EventChip } from '../event-chip/event-chip';
import { MoveFlow } from '../move-flow';

/** Steps not on the calendar yet, grouped by theme; drag one onto a day, or a day's step back here. */
@Component({
  selector: 'kc-calendar-tray',
  imports: [ChipActions, ChipDrags, EventChip],
  template: `
    <section class="tray" aria-labelledby="tray-heading">
      <h2 id="tray-heading">Tray</h2>
      <div
        class="drop"
        kcChipDrags="tray"
        kcChipActions
        [kcChipDragsOff]="isDragOff()"
        data-date="tray"
      >
        @for (group of store.trayGroups(); track group.themeName) {
          <h3>{{ group.themeName }}</h3>
          @for (step of group.steps; track step.id) {
            <button [kcChip]="chipOf(step)"></button>
          }
        } @empty {
          <p class="empty">
            @if (store.tray.isLoading()) {
              Loading…
            } @else {
              Every planned step is on the calendar.
            }
          </p>
        }
      </div>
    </section>
  `,
  styles: `
    .tray { display: flex; flex-direction: column; gap: 4px; }
    h2 { margin: 0 0 4px; font-size: 1rem; font-weight: 500; }
    h3 { margin: 8px 0 2px; font-size: 0.82rem; font-weight: 500; color: var(--mat-sys-on-surface-variant); }
    .drop { display: flex; flex-direction: column; gap: 3px; min-height: 48px; }
    .empty { font-size: 0.85rem; color: var(--mat-sys-on-surface-variant); margin: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalendarTray {
  protected readonly store = inject(CalendarStore);
  protected readonly flow = inject(MoveFlow);
  /** Whether dragging is off (phone width, where the list scrolls instead). */
  readonly isDragOff = input(false);

  protected chipOf(step: TrayStep): ChipView {
    return chipViewOf(step, this.flow.canDrag(step));
  }
}
