import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, resource, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { firstValueFrom } from 'rxjs';
import type { SeriesDetail } from '@shared/contracts/series';
import { StudioContext } from '../../core/studio-context';
import { MAX_COMPARED } from '../trend-board/trend-board';
import { valueOr } from '../../core/resource-value';

// DESIGN §4 colours, so compared lines look like the rest of the app.
const COLOURS = ['#8B5E3C', '#1F7A7A', '#D9622B', '#5B7F3A', '#7A4E8C'];

@Component({
  selector: 'kc-trend-compare',
  imports: [RouterLink, BaseChartDirective, MatCardModule, MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule],
  template: `
    <section class="kc-page">
      <a mat-button [routerLink]="['..']"><mat-icon>arrow_back</mat-icon> Trends</a>
      <h1>Compare series</h1>
      <p class="lede">Up to {{ max }} series on one chart.
        Indexed puts each line on its own average (100 = that series' mean), so a sales count and a search figure can sit side by side.</p>
      <mat-button-toggle-group [value]="scale()" (change)="scale.set($event.value)" aria-label="Scale">
        <mat-button-toggle value="indexed">Indexed</mat-button-toggle>
        <mat-button-toggle value="raw">As imported</mat-button-toggle>
      </mat-button-toggle-group>
      @if (series.isLoading()) {
        <mat-progress-bar mode="indeterminate" />
      }
      @if (series.error()) {
        <p role="alert">These series could not be loaded.</p>
      }
      @if (chart(); as config) {
        <mat-card appearance="outlined" class="chart-card">
          <mat-card-content><div class="chart"><canvas baseChart [type]="config.type" [data]="config.data" [options]="config.options"></canvas></div></mat-card-content>
        </mat-card>
      }
      @if (dropped() > 0) {
        <p>{{ dropped() }} more selected series left out: the chart holds {{ max }}.</p>
      }
    </section>
  `,
  styles: `
    .lede { color: var(--mat-sys-on-surface-variant); }
    .chart-card { margin-top: 16px; }
    .chart { position: relative; height: 420px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TrendCompare {
  private readonly http = inject(HttpClient);
  private readonly context = inject(StudioContext);
  readonly ids = input<string>('');
  protected readonly max = MAX_COMPARED;
  protected readonly scale = signal<'indexed' | 'raw'>('indexed');

  private readonly idList = computed(() =>
    this.ids()
      .split(',')
      .map(Number)
      .filter((id) => Number.isInteger(id) && id > 0),
  );
  protected readonly dropped = computed(() => Math.max(0, this.idList().length - MAX_COMPARED));

  protected readonly series = resource({
    params: () => (this.context.studioId() === null ? undefined : { base: this.context.base(), ids: this.idList().slice(0, MAX_COMPARED) }),
    loader: ({ params }) => Promise.all(params.ids.map((id) => firstValueFrom(this.http.get<SeriesDetail>(`${params.base}/series/${id}`)))),
  });

  protected readonly chart = computed<ChartConfiguration<'line'> | null>(() => {
    const list = valueOr(this.series, undefined);
    if (!list || list.length === 0) return null;
    const labels = [...new Set(list.flatMap((series) => series.analysis.dates))].sort();
    return {
      type: 'line',
      data: {
        labels,
        datasets: list.map((series, index) => {
          const values = series.analysis.values;
          const numbers = values.filter((value): value is number => value !== null);
          const mean = numbers.reduce((sum, value) => sum + value, 0) / (numbers.length || 1);
          const scaleBy = this.scale() === 'indexed' && mean !== 0 ? 100 / mean : 1;
          return {
            label: `${series.term}${series.region ? ` (${series.region})` : ''}`,
            data: series.analysis.dates.map((date, at) => ({ x: date, y: values[at] === null ? null : (values[at] as number) * scaleBy })) as unknown as number[],
            borderColor: COLOURS[index],
            backgroundColor: COLOURS[index],
            pointRadius: 0,
            borderWidth: 1.5,
            spanGaps: true,
          };
        }),
      },
      options: { responsive: true, maintainAspectRatio: false, animation: false, interaction: { mode: 'nearest', intersect: false }, scales: { x: { ticks: { maxTicksLimit: 12 } } } },
    };
  });
}
