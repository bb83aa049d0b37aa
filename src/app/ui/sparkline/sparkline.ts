import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/**
 * A small inline chart of two lines on one scale: the recent values and, fainter, the same periods
 * a year before. Plain SVG, so a table of many rows stays light.
 */
@Component({
  selector: 'kc-sparkline',
  template: `
    <svg [attr.viewBox]="'0 0 ' + width + ' ' + height" [attr.width]="width" [attr.height]="height" role="img" [attr.aria-label]="label()">
      <polyline class="before" [attr.points]="paths().before" />
      <polyline class="recent" [attr.points]="paths().recent" />
    </svg>
  `,
  styles: `
    :host { display: inline-block; line-height: 0; }
    polyline { fill: none; stroke-width: 1.5; stroke-linejoin: round; }
    .recent { stroke: var(--kc-launch, #d9622b); }
    .before { stroke: var(--mat-sys-outline, #999); stroke-dasharray: 2 2; stroke-width: 1; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Sparkline {
  readonly recent = input<(number | null)[]>([]);
  readonly before = input<(number | null)[]>([]);
  readonly label = input('');
  protected readonly width = 120;
  protected readonly height = 28;

  protected readonly paths = computed(() => {
    const recent = this.recent();
    const before = this.before();
    const all = [...recent, ...before].filter((value): value is number => value !== null && Number.isFinite(value));
    const low = all.length ? Math.min(...all) : 0;
    const high = all.length ? Math.max(...all) : 1;
    const span = high - low || 1;
    const step = recent.length > 1 ? this.width / (recent.length - 1) : 0;
    const line = (values: (number | null)[]) =>
      values
        .map((value, index) => (value === null ? null : `${(index * step).toFixed(1)},${(this.height - 2 - ((value - low) / span) * (this.height - 4)).toFixed(1)}`))
        .filter(Boolean)
        .join(' ');
    return { recent: line(recent), before: line(before) };
  });
}
