import { HttpErrorResponse, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import type { SeriesPage, TargetChoices } from '@shared/contracts/series';
import { themeTransitions, type ThemeDetail, type ThemeStatus, type ThemeTargetKind } from '@shared/contracts/themes';
import { messageOf } from '../../core/api-error';
import { StudioContext } from '../../core/studio-context';
import { fixed, partLabels, partNames, verdictLabels } from '../../trends/trends-format';
import { statusLabels } from '../theme-labels';
import { ThemesApi } from '../themes-api';
import { valueOr } from '../../core/resource-value';
import { Confirmer } from '../../ui/confirm-dialog';

@Component({
  selector: 'kc-theme-page',
  imports: [
    FormsModule,
    RouterLink,
    BaseChartDirective,
    MatButtonModule,
    MatCardModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  templateUrl: './theme-page.html',
  styleUrl: './theme-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThemePage {
  private readonly api = inject(ThemesApi);
  private readonly confirmer = inject(Confirmer);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  readonly themeId = input.required<string>();
  protected readonly statusLabels = statusLabels;
  protected readonly verdictLabels = verdictLabels;
  protected readonly partNames = partNames;
  protected readonly partLabels = partLabels;
  protected readonly fixed = fixed;
  protected readonly targetLabels: Record<ThemeTargetKind, string> = { month: 'Month', occasion: 'Occasion', holiday: 'Holiday', market: 'Market', date: 'Date' };

  protected readonly theme = httpResource<ThemeDetail>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/themes/${this.themeId()}`));
  protected readonly targets = httpResource<TargetChoices>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/series/targets`));
  protected readonly allSeries = httpResource<SeriesPage>(() =>
    this.context.studioId() === null ? undefined : { url: `${this.context.base()}/series`, params: { sort: 'term', order: 'asc', pageSize: '200' } },
  );
  protected readonly isBusy = signal(false);

  // Edit fields, filled from the theme when it loads.
  protected readonly name = signal('');
  protected readonly notes = signal('');
  protected readonly newItem = signal('');
  protected readonly seriesToAdd = signal<number | null>(null);
  protected readonly targetKind = signal<ThemeTargetKind>('month');
  protected readonly targetValue = signal('');
  protected readonly offsetDays = signal(0);

  protected readonly nextStatuses = computed<ThemeStatus[]>(() => {
    const theme = valueOr(this.theme, undefined);
    if (!theme) return [];
    const isOwner = this.context.isOwner();
    // Picking goes through the pick form (it needs a target); dropping a pick is the owner's call.
    return themeTransitions[theme.status].filter((to) => to !== 'picked' && (isOwner || theme.status !== 'picked' || to === 'building'));
  });
  protected readonly addableSeries = computed(() => {
    const theme = valueOr(this.theme, undefined);
    const inTheme = new Set(theme?.seriesIds ?? []);
    const items = new Set((theme?.items ?? []).map((item) => item.toLowerCase()));
    return (valueOr(this.allSeries, undefined)?.items ?? []).filter((series) => !inTheme.has(series.id) && !(series.kind === 'sales' && items.has(series.term.toLowerCase())));
  });
  protected readonly targetOptions = computed(() => {
    const choices = valueOr(this.targets, undefined);
    if (!choices) return [];
    const kind = this.targetKind();
    const lists: Record<ThemeTargetKind, TargetChoices['months']> = { month: choices.months, occasion: choices.occasions, holiday: choices.holidays, market: choices.markets, date: [] };
    return lists[kind].map((choice) => ({ value: choice.key.replace(/^(occasion|holiday|market):/, ''), label: choice.label }));
  });
  protected readonly salesChart = computed<ChartConfiguration<'bar'> | null>(() => {
    const sales = valueOr(this.theme, undefined)?.itemSales ?? [];
    if (sales.length === 0) return null;
    return {
      type: 'bar',
      data: { labels: sales.map((month) => month.month), datasets: [{ label: 'Units sold of the theme’s items', data: sales.map((month) => month.units), backgroundColor: '#5B7F3A' }] },
      options: { responsive: true, maintainAspectRatio: false, animation: false },
    };
  });

  constructor() {
    effect(() => {
      const theme = valueOr(this.theme, undefined);
      if (!theme) return;
      this.name.set(theme.name);
      this.notes.set(theme.notes ?? '');
      this.offsetDays.set(theme.offsetDays);
      if (theme.target) {
        this.targetKind.set(theme.target.kind);
        this.targetValue.set(theme.target.value);
      }
    });
  }

  protected chooseKind(kind: ThemeTargetKind): void {
    this.targetKind.set(kind);
    this.targetValue.set('');
  }

  protected saveDetails(): Promise<void> {
    return this.write((theme) => this.api.update(theme.id, { name: this.name().trim(), notes: this.notes().trim() || null, version: theme.version }), 'Saved');
  }

  /** A sales series joins as its item (the server does the same whichever way it is sent). */
  protected addSeries(): Promise<void> {
    const seriesId = this.seriesToAdd();
    if (seriesId === null) return Promise.resolve();
    this.seriesToAdd.set(null);
    const series = this.addableSeries().find((each) => each.id === seriesId);
    const done = series?.kind === 'sales' ? `${series.term} joins Your items` : undefined;
    return this.write((theme) => this.api.update(theme.id, { seriesIds: [...theme.seriesIds, seriesId], version: theme.version }), done);
  }

  protected removeSeries(seriesId: number): Promise<void> {
    return this.write((theme) => this.api.update(theme.id, { seriesIds: theme.seriesIds.filter((id) => id !== seriesId), version: theme.version }));
  }

  protected addItem(): Promise<void> {
    const item = this.newItem().trim();
    if (!item) return Promise.resolve();
    this.newItem.set('');
    return this.write((theme) => this.api.update(theme.id, { items: [...theme.items, item], version: theme.version }));
  }

  protected removeItem(item: string): Promise<void> {
    return this.write((theme) => this.api.update(theme.id, { items: theme.items.filter((each) => each !== item), version: theme.version }));
  }

  protected moveTo(status: ThemeStatus): Promise<void> {
    return this.write((theme) => this.api.changeStatus(theme.id, { status, version: theme.version }), `Now ${statusLabels[status].toLowerCase()}`);
  }

  protected pick(): Promise<void> {
    const value = this.targetValue();
    if (!value) return Promise.resolve();
    return this.write(
      (theme) => this.api.pick(theme.id, { target: { kind: this.targetKind(), value }, offsetDays: Math.max(0, Math.round(this.offsetDays())), version: theme.version }),
      'Picked',
    );
  }

  protected async remove(): Promise<void> {
    const theme = valueOr(this.theme, undefined);
    if (!theme || !(await this.confirmer.ask({ title: `Delete the theme "${theme.name}"?`, message: 'Its series and sales stay.', action: 'Delete the theme' }))) return;
    await this.api.remove(theme.id);
    await this.router.navigate(['/studios', this.context.studioId(), 'themes']);
  }

  /** Sends one write with the version last read; a 409 reloads the theme and says why. */
  private async write(send: (theme: ThemeDetail) => Promise<ThemeDetail>, done?: string): Promise<void> {
    const theme = valueOr(this.theme, undefined);
    if (!theme || this.isBusy()) return;
    this.isBusy.set(true);
    try {
      this.theme.set(await send(theme));
      if (done) this.snackBar.open(done, undefined, { duration: 2500 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss');
      if (error instanceof HttpErrorResponse && error.status === 409) this.theme.reload();
    } finally {
      this.isBusy.set(false);
    }
  }
}
