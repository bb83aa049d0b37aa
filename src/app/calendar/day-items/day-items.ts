import { CdkDrag, type CdkDragMove } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { lookOf } from '../calendar-kinds';
import type { DayEntry } from '../calendar-store';
import { EventChip } from '../event-chip/event-chip';
import { MoveFlow } from '../move-flow';
import { measureDragFrame } from '../render-marks';

/**
 * What a day cell of the month or week view holds: its bands, then its events as draggable chips.
 * It sits inside the cell's cdkDropList, so the chips' cdkDrag join that list.
 */
@Component({
  selector: 'kc-day-items',
  imports: [CdkDrag, EventChip],
  template: `
    @for (band of day().bands; track band.id) {
      <button type="button" class="band" [style.--kc-colour]="lookOf(band.kind).colour" (click)="flow.open(band)" [attr.aria-label]="lookOf(band.kind).label + ': ' + band.title">
        <span class="material-symbols-outlined" aria-hidden="true">{{ lookOf(band.kind).icon }}</span>{{ band.title }}
      </button>
    }
    @for (event of day().events; track event.id) {
      <kc-event-chip
        cdkDrag
        [cdkDragData]="{ item: event, day: day().date }"
        [cdkDragDisabled]="!flow.canDrag(event)"
        (cdkDragMoved)="dragMoved($event)"
        [event]="event"
        [attr.data-event-id]="event.id"
      />
    }
  `,
  styles: `
    :host { display: contents; }
    .band {
      display: flex; align-items: center; gap: 4px; padding: 1px 6px; border: 0; border-radius: 3px;
      background: var(--kc-colour); color: #fff; font: inherit; font-size: 0.72rem; text-align: left;
      overflow: hidden; white-space: nowrap; text-overflow: ellipsis; cursor: pointer;
    }
    .band .material-symbols-outlined { font-size: 14px; }
    .cdk-drag-placeholder { opacity: 0.35; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DayItems {
  protected readonly flow = inject(MoveFlow);
  protected readonly lookOf = lookOf;
  readonly day = input.required<DayEntry>();

  protected dragMoved(move: CdkDragMove): void {
    measureDragFrame(move.event);
  }
}
