import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { ReplanResult } from '@shared/contracts/calendar';
import { formatShortSpan } from './calendar-dates';

export interface ReplanDialogData {
  title: string;
  preview: ReplanResult;
}

/** Shows what "shift the following steps" would move; closes with true to apply it. */
@Component({
  selector: 'kc-replan-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Shift the steps after {{ data.title }}?</h2>
    <mat-dialog-content>
      <ul class="moves">
        @for (move of data.preview.moves; track move.id) {
          <li>
            <strong>{{ move.title }}</strong>: {{ range(move.from.start, move.from.end) }} → {{ range(move.to.start, move.to.end) }}
          </li>
        }
      </ul>
      @for (warning of data.preview.warnings; track $index) {
        <p class="kc-caution" role="note">{{ warning.message }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep them</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Shift {{ data.preview.moves.length }} {{ data.preview.moves.length === 1 ? 'step' : 'steps' }}</button>
    </mat-dialog-actions>
  `,
  styles: `.moves { padding-left: 20px; line-height: 1.6; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReplanDialog {
  protected readonly data = inject<ReplanDialogData>(MAT_DIALOG_DATA);

  protected range(start: string | null, end: string | null): string {
    if (!start || !end) return 'the tray';
    return formatShortSpan(start, end);
  }
}
