import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { IsoDate } from '@shared/calendar/dates';
import { formatLong, isoOfLocalDate, localDateOf } from './calendar-dates';

export interface MoveToData {
  title: string;
  start: IsoDate;
}

/** "Move to…": the keyboard-friendly way to pick a new start day. Closes with the ISO date or nothing. */
@Component({
  selector: 'kc-move-to-dialog',
  imports: [MatDialogModule, MatButtonModule, MatDatepickerModule],
  template: `
    <h2 mat-dialog-title>Move {{ data.title }} to…</h2>
    <mat-dialog-content>
      <mat-calendar [startAt]="chosen()" [selected]="chosen()" (selectedChange)="chosen.set($event)" />
      <p aria-live="polite">Starts {{ label() }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close type="button">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="iso()">Move</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MoveToDialog {
  protected readonly data = inject<MoveToData>(MAT_DIALOG_DATA);
  protected readonly chosen = signal<Date | null>(localDateOf(this.data.start));

  protected iso(): IsoDate | null {
    const chosen = this.chosen();
    return chosen ? isoOfLocalDate(chosen) : null;
  }

  protected label(): string {
    const iso = this.iso();
    return iso ? formatLong(iso) : '—';
  }
}
