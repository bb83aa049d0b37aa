import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import type { BlackoutView } from '@shared/contracts/markets';
import { formatLong, isoOfLocalDate } from '../calendar/calendar-dates';
import { messageOf } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { dayText } from './day-text';
import { valueOr } from '../core/resource-value';

/** "Mon, Dec 21 – Fri, Jan 1, 2027", or one day. */
export function spanText(day: BlackoutView, today: string): string {
  return day.start === day.end ? dayText(day.start, today) : `${dayText(day.start, today)} – ${dayText(day.end, today)}`;
}

/**
 * The studio's days off (holidays away, closures, a delivery day): runways plan no work on them and a
 * step moved onto one is refused with the day named. The whole list is sent back on each change, as
 * the API takes it. Owners and partners change it; crew read.
 */
@Component({
  selector: 'kc-days-off',
  imports: [ReactiveFormsModule, MatButtonModule, MatDatepickerModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <h2>Days off</h2>
    <p class="hint">Time away, closures and delivery days: runways plan no work on them, and a step cannot be moved onto one.</p>
    @if (days.error()) {
      <p role="alert">The days off could not be loaded; reload to try again.</p>
    }
    @if (error(); as message) {
      <p class="form-error" role="alert">{{ message }}</p>
    }
    @let list = days.hasValue() ? days.value() : [];
    @if (list.length === 0 && !days.isLoading()) {
      <p class="hint">No days off set.</p>
    }
    <ul class="days" aria-label="Days off">
      @for (day of list; track $index) {
        <li>
          <mat-icon aria-hidden="true">event_busy</mat-icon>
          <span class="what">{{ spanText(day, context.today()) }}{{ day.note ? ' · ' + day.note : '' }}</span>
          @if (context.canEdit()) {
            <button mat-button type="button" (click)="remove($index)" [attr.aria-label]="'Remove the days off from ' + formatLong(day.start)" [disabled]="isBusy()">Remove</button>
          }
        </li>
      }
    </ul>
    @if (context.canEdit()) {
      <form [formGroup]="form" (ngSubmit)="add()" class="add" aria-label="New days off">
        <mat-form-field appearance="outline">
          <mat-label>From – to</mat-label>
          <mat-date-range-input [rangePicker]="rangePicker">
            <input matStartDate formControlName="start" placeholder="First day" />
            <input matEndDate formControlName="end" placeholder="Last day" />
          </mat-date-range-input>
          <mat-datepicker-toggle matIconSuffix [for]="rangePicker" />
          <mat-date-range-picker #rangePicker />
          <mat-hint>One day: leave the last day empty</mat-hint>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Note</mat-label>
          <input matInput formControlName="note" maxlength="200" placeholder="Winter break" />
        </mat-form-field>
        <button mat-stroked-button type="submit" [disabled]="isBusy()"><mat-icon>add</mat-icon> Add days off</button>
      </form>
    }
  `,
  styles: `
    .hint { color: var(--mat-sys-on-surface-variant); max-width: 760px; }
    .form-error { color: var(--mat-sys-error); }
    .days { list-style: none; padding: 0; max-width: 880px; }
    .days li { display: flex; gap: 12px; align-items: center; padding: 4px 0; }
    .days .what { flex: 1 1 auto; }
    .add { display: flex; gap: 16px; flex-wrap: wrap; align-items: flex-start; }
    .add button { margin-top: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DaysOff {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  protected readonly spanText = spanText;
  protected readonly formatLong = formatLong;
  protected readonly isBusy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected readonly days = httpResource<BlackoutView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/blackouts`));

  protected readonly form = inject(NonNullableFormBuilder).group({
    start: [null as Date | null],
    end: [null as Date | null],
    note: [''],
  });

  protected async add(): Promise<void> {
    const { start, end, note } = this.form.getRawValue();
    if (!start) {
      this.error.set('Choose the first day off');
      return;
    }
    const day = { start: isoOfLocalDate(start), end: isoOfLocalDate(end ?? start), note: note.trim() || null };
    if (await this.save([...valueOr(this.days, []), day], 'Days off added')) this.form.reset();
  }

  protected async remove(index: number): Promise<void> {
    await this.save(valueOr(this.days, []).filter((_, at) => at !== index), 'Days off removed');
  }

  /** Sends the whole list; shows the new one, or the server's reason with nothing changed. */
  private async save(list: BlackoutView[], done: string): Promise<boolean> {
    this.error.set(null);
    this.isBusy.set(true);
    try {
      const saved = await firstValueFrom(this.http.put<BlackoutView[]>(`${this.context.base()}/blackouts`, { blackouts: list }));
      this.days.set(saved);
      this.snackBar.open(done, undefined, { duration: 3000 });
      return true;
    } catch (error) {
      this.error.set(messageOf(error));
      return false;
    } finally {
      this.isBusy.set(false);
    }
  }
}
