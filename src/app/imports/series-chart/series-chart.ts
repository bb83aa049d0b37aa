import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/**
 * A small line chart of one series: plain SVG (no chart library), with the first and last date
 * under it and the highest and lowest value beside it. Blank points break the line.
 */
@Component({
  selector: 'kc-series-chart',
  template: `
    <figure>
      <svg [attr.viewBox]="'0 0 ' + width + ' ' + height" role="img" [attr.aria-label]="label()" preserveAspectRatio="none">
        <line class="axis" x1="0" [attr.y1]="height - 1" [attr.x2]="width" [attr.y2]="height - 1" />
        @for (segment of chart().segments; track $index) {
          <polyline [attr.points]="segment" />
        }
      </svg>
      <figcaption>
        <span>{{ chart().first }}</span>
        <span class="range">{{ chart().low }} – {{ chart().high }}</span>
        <span>{{ chart().last }}</span>
      </figcaption>
    </figure>
  `,
  styles: `
    figure { margin: 0; }
    svg { width: 100%; height: 72px; display: block; }
    polyline { fill: none; stroke: var(--kc-content, #1f7a7a); stroke-width: 1.5; vector-effect: non-scaling-stroke; }
    .axis { stroke: var(--mat-sys-outline-variant, #ccc); stroke-width: 1; vector-effect: non-scaling-stroke; }
    figcaption { display: flex; justify-content: space-between; font-size: 12px; color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesChart {
  readonly values = input<{ date: string; value: number | null }[]>([]);
  readonly label = input('');
  protected readonly width = 300;
  protected readonly height = 72;

  protected readonly chart = computed(() => {
    const values = this.values();
    const numbers = values.map((point) => point.value).filter((value): value is number => value !== null);
    const low = numbers.length ? Math.min(...numbers) : 0;
    const high = numbers.length ? Math.max(...numbers) : 0;
    const span = high - low || 1;
    const step = values.length > 1 ? this.width / (values.length - 1) : 0;
    const segments: string[] = [];
    let current: string[] = [];
    values.forEach((point, index) => {
      if (point.value === null) {
        if (current.length) segments.push(current.join(' '));
        current = [];
        return;
      }
      const y = this.height - 3 - ((point.value - low) / span) * (this.height - 6);
      current.push(`${(index * step).toFixed(1)},${y.toFixed(1)}`);
    });
    if (current.length) segments.push(current.join(' '));
    return { segments, low, high, first: values[0]?.date ?? '', last: values[values.length - 1]?.date ?? '' };
  });
}
