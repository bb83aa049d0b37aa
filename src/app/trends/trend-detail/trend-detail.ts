import { httpResource } from '@angular/common/http';
import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import type { SeriesDetail } from '@shared/contracts/series';
import { StudioContext } from '../../core/studio-context';
import { dayMonth, explainScore, monthName, neededText, verdictLabels } from '../trends-format';
import { valueOr } from '../../core/resource-value';

const WALNUT = '#8B5E3C';
const TEAL = '#1F7A7A';
const EMBER = '#D9622B';

@Component({
  selector: 'kc-trend-detail',
  imports: [NgTemplateOutlet, RouterLink, BaseChartDirective, MatCardModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './trend-detail.html',
  styleUrl: './trend-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TrendDetail {
  protected readonly context = inject(StudioContext);
  readonly seriesId = input.required<string>();
  readonly target = input<string>();
  protected readonly verdictLabels = verdictLabels;
  protected readonly neededText = neededText;

  protected readonly series = httpResource<SeriesDetail>(() => {
    if (this.context.studioId() === null) return undefined;
    const target = this.target();
    const params: Record<string, string> = target ? { target } : {};
    return { url: `${this.context.base()}/series/${this.seriesId()}`, params };
  });

  /** Plain figures first; the test statistics go in a fold. */
  protected readonly figures = computed(() => {
    const series = valueOr(this.series, undefined);
    return series?.score ? explainScore(series.score, series.period) : { plain: [], statistics: [] };
  });

  protected readonly lineChart = computed<ChartConfiguration<'line'> | null>(() => {
    const series = valueOr(this.series, undefined);
    if (!series) return null;
    const { analysis } = series;
    return {
      type: 'line',
      data: {
        labels: analysis.dates,
        datasets: [
          { label: series.term, data: analysis.values, borderColor: WALNUT, backgroundColor: WALNUT, pointRadius: 0, borderWidth: 1.5 },
          { label: 'Trend (centred moving average)', data: analysis.trend, borderColor: EMBER, backgroundColor: EMBER, pointRadius: 0, borderWidth: 2 },
          { label: 'Season taken out', data: analysis.adjusted, borderColor: TEAL, backgroundColor: TEAL, pointRadius: 0, borderWidth: 1, borderDash: [4, 3], hidden: true },
        ],
      },
      options: { responsive: true, maintainAspectRatio: false, animation: false, interaction: { mode: 'index', intersect: false }, scales: { x: { ticks: { maxTicksLimit: 10 } } } },
    };
  });

  /** The seasonal index by position in the cycle, labelled by the calendar month or week it falls on. */
  protected readonly profileChart = computed<ChartConfiguration<'bar'> | null>(() => {
    const series = valueOr(this.series, undefined);
    const seasonal = series?.score?.seasonal;
    if (!series || !seasonal) return null;
    const first = series.analysis.dates[0];
    const labels = seasonal.indices.map((_, position) =>
      series.analysis.period === 'monthly' ? monthName(series.analysis.dates[position] ?? first) : `week of ${dayMonth(series.analysis.dates[position] ?? first, false)}`,
    );
    const baseline = seasonal.model === 'multiplicative' ? 1 : 0;
    return {
      type: 'bar',
      data: {
        labels,
        datasets: [
          {
            label: seasonal.model === 'multiplicative' ? 'Seasonal index (1 = an average period)' : 'Seasonal index (0 = an average period)',
            // Bars stand up or hang down from an average period; the axis shows the index itself.
            data: seasonal.indices.map((value) => value - baseline),
            backgroundColor: seasonal.indices.map((_, position) => (position === seasonal.peakPosition ? EMBER : TEAL)),
          },
        ],
      },
      options: {
        responsive: true,
        maintainAspectRatio: false,
        animation: false,
        plugins: { legend: { display: true }, tooltip: { callbacks: { label: (item) => `index ${(Number(item.raw) + baseline).toFixed(3)}` } } },
        scales: { y: { ticks: { callback: (value) => (Number(value) + baseline).toFixed(2) } } },
      },
    };
  });

  protected readonly residualChart = computed<ChartConfiguration<'bar'> | null>(() => {
    const series = valueOr(this.series, undefined);
    if (!series || !series.analysis.model) return null;
    const baseline = series.analysis.model === 'multiplicative' ? 1 : 0;
    return {
      type: 'bar',
      data: {
        labels: series.analysis.dates,
        datasets: [{ label: 'Residual (what season and trend do not explain)', data: series.analysis.residual.map((value) => (value === null ? null : value - baseline)), backgroundColor: WALNUT }],
      },
      options: { responsive: true, maintainAspectRatio: false, animation: false, scales: { x: { ticks: { maxTicksLimit: 10 } }, y: { ticks: { callback: (value) => (Number(value) + baseline).toFixed(2) } } } },
    };
  });
}
