import { NgTemplateOutlet } from '@angular/common';
import { HttpClient, HttpErrorResponse, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatChipsModule } from '@angular/material/chips';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import type { MarketRequest, MarketView } from '@shared/contracts/markets';
import { formatLong, isoOfLocalDate, localDateOf } from '../calendar/calendar-dates';
import { applyServerIssues, messageOf } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { fieldError } from '../ui/zod-validator';
import { dayText } from './day-text';
import { DaysOff } from './days-off';
import { describeRule, repeatChoices, repeatOf, ruleOf, type RepeatKind } from './market-repeat';
import { Confirmer } from '../ui/confirm-dialog';

/** A booth fee in cents as the studio writes it: "35" or "35.50". */
export function feeText(cents: number | null): string {
  if (cents === null) return '';
  return cents % 100 === 0 ? String(cents / 100) : (cents / 100).toFixed(2);
}

/**
 * The studio's markets, craft fairs and booth restock days: each with its place, first day, how it
 * repeats (or its own RRULE), skipped and extra days, hours, booth fee, application round, whether
 * kits may be sold, and notes. The calendar shows their days and deadlines, runways can plan back
 * from them, and a market day is kept free of build work. Owners and partners edit; crew read.
 */
@Component({
  selector: 'kc-markets-page',
  imports: [
    NgTemplateOutlet,
    ReactiveFormsModule,
    DaysOff,
    MatButtonModule,
    MatCardModule,
    MatCheckboxModule,
    MatChipsModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
  ],
  templateUrl: './markets-page.html',
  styleUrl: './markets-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarketsPage {
  private readonly http = inject(HttpClient);
  private readonly confirmer = inject(Confirmer);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  protected readonly fieldError = fieldError;
  protected readonly describeRule = describeRule;
  protected readonly formatLong = formatLong;
  protected readonly feeText = feeText;
  /** One argument only: the template maps lists of days with it, and map's index is not a `today`. */
  protected readonly dayText = (date: string) => dayText(date, this.context.today());

  protected readonly markets = httpResource<MarketView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/markets`));

  /** The market being edited (null: a new one), or undefined while the form is closed. */
  protected readonly editing = signal<MarketView | null | undefined>(undefined);
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly skipped = signal<string[]>([]);
  protected readonly extra = signal<string[]>([]);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [''],
    place: [''],
    start: [null as Date | null],
    repeat: ['once' as RepeatKind],
    rrule: [''],
    hours: [''],
    boothFee: [''],
    applicationDeadline: [null as Date | null],
    decisionDate: [null as Date | null],
    kitsAllowed: [false],
    notes: [''],
  });

  private readonly start = toSignal(this.form.controls.start.valueChanges, { initialValue: null });
  protected readonly repeatKind = toSignal(this.form.controls.repeat.valueChanges, { initialValue: 'once' as RepeatKind });
  /** The repeat choices for the first day chosen. */
  protected readonly choices = computed(() => {
    const start = this.start();
    return repeatChoices(start ? isoOfLocalDate(start) : null);
  });

  protected add(): void {
    this.open(null);
  }

  protected edit(market: MarketView): void {
    this.open(market);
  }

  protected close(): void {
    this.editing.set(undefined);
  }

  private open(market: MarketView | null): void {
    this.formError.set(null);
    this.form.reset();
    if (market) {
      this.form.setValue({
        name: market.name,
        place: market.place,
        start: localDateOf(market.start),
        repeat: repeatOf(market.rrule, market.start),
        rrule: market.rrule ?? '',
        hours: market.hours ?? '',
        boothFee: feeText(market.boothFeeCents),
        applicationDeadline: market.applicationDeadline ? localDateOf(market.applicationDeadline) : null,
        decisionDate: market.decisionDate ? localDateOf(market.decisionDate) : null,
        kitsAllowed: market.kitsAllowed,
        notes: market.notes ?? '',
      });
    }
    this.skipped.set([...(market?.exdates ?? [])]);
    this.extra.set([...(market?.rdates ?? [])]);
    this.editing.set(market);
  }

  protected addDate(list: 'skipped' | 'extra', date: Date | null, input: HTMLInputElement): void {
    if (!date) return;
    const days = list === 'skipped' ? this.skipped : this.extra;
    const iso = isoOfLocalDate(date);
    if (!days().includes(iso)) days.set([...days(), iso].sort());
    input.value = '';
  }

  protected removeDate(list: 'skipped' | 'extra', iso: string): void {
    const days = list === 'skipped' ? this.skipped : this.extra;
    days.set(days().filter((day) => day !== iso));
  }

  /** The request the form stands for, or null after marking what is missing or unreadable. */
  private request(): MarketRequest | null {
    const value = this.form.getRawValue();
    const controls = this.form.controls;
    if (!value.name.trim()) controls.name.setErrors({ server: 'Give the market a name' });
    if (!value.start) controls.start.setErrors({ server: 'Choose the first day it is held' });
    const fee = value.boothFee.trim().replace(/^[$€£]\s*/, '');
    const feeCents = fee === '' ? null : Math.round(Number(fee) * 100);
    if (feeCents !== null && (!Number.isFinite(feeCents) || feeCents < 0)) controls.boothFee.setErrors({ server: 'Write the fee as a number, e.g. 35 or 35.50' });
    if (value.repeat === 'custom' && !value.rrule.trim()) controls.rrule.setErrors({ server: 'Write the rule, e.g. FREQ=MONTHLY;BYDAY=2SA' });
    if (value.start && !repeatChoices(isoOfLocalDate(value.start)).some(({ kind }) => kind === value.repeat)) controls.repeat.setErrors({ server: 'Choose how it repeats from this first day' });
    if (this.form.invalid || !value.start) {
      this.form.markAllAsTouched();
      return null;
    }
    const start = isoOfLocalDate(value.start);
    const rrule = value.repeat === 'custom' ? value.rrule.trim() : ruleOf(value.repeat, start);
    return {
      name: value.name.trim(),
      place: value.place.trim(),
      start,
      ...(rrule ? { rrule } : {}),
      exdates: rrule ? this.skipped() : [],
      rdates: this.extra(),
      ...(value.hours.trim() ? { hours: value.hours.trim() } : {}),
      ...(feeCents !== null ? { boothFeeCents: feeCents } : {}),
      ...(value.applicationDeadline ? { applicationDeadline: isoOfLocalDate(value.applicationDeadline) } : {}),
      ...(value.decisionDate ? { decisionDate: isoOfLocalDate(value.decisionDate) } : {}),
      kitsAllowed: value.kitsAllowed,
      ...(value.notes.trim() ? { notes: value.notes.trim() } : {}),
    };
  }

  protected async save(): Promise<void> {
    this.formError.set(null);
    const request = this.request();
    const market = this.editing();
    if (!request || market === undefined) return;
    this.isBusy.set(true);
    try {
      const base = `${this.context.base()}/markets`;
      await firstValueFrom(market ? this.http.put<MarketView>(`${base}/${market.id}`, { ...request, version: market.version }) : this.http.post<MarketView>(base, request));
      this.snackBar.open(market ? 'Market saved' : 'Market added; its days are on the calendar', undefined, { duration: 3000 });
      this.editing.set(undefined);
      this.markets.reload();
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
      if (error instanceof HttpErrorResponse && error.status === 409) this.markets.reload();
    } finally {
      this.isBusy.set(false);
    }
  }

  protected async remove(market: MarketView): Promise<void> {
    if (!(await this.confirmer.ask({ title: `Delete ${market.name}?`, message: 'Its days and deadlines leave the calendar.', action: 'Delete the market' }))) return;
    try {
      await firstValueFrom(this.http.delete(`${this.context.base()}/markets/${market.id}`));
      if (this.editing()?.id === market.id) this.editing.set(undefined);
      this.snackBar.open('Market deleted', undefined, { duration: 3000 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss', { duration: 8000 });
    } finally {
      this.markets.reload();
    }
  }
}
