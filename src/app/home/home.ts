import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { StudioSummary } from '@shared/contracts/studios';
import { valueOr } from '../core/resource-value';
import { StudioContext } from '../core/studio-context';
import { WorkAtHand } from './work-at-hand';

@Component({
  selector: 'kc-home',
  imports: [RouterLink, MatButtonModule, MatCardModule, MatIconModule, MatProgressBarModule, WorkAtHand],
  templateUrl: './home.html',
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  protected readonly context = inject(StudioContext);
  protected readonly summary = httpResource<StudioSummary>(() =>
    this.context.studioId() === null ? undefined : `${this.context.base()}/summary`,
  );
  protected readonly tiles = computed(() => {
    const summary = valueOr(this.summary, undefined);
    if (!summary) return [];
    return [
      { icon: 'trending_up', label: 'Series imported', value: summary.seriesCount, hint: 'Search-interest and sales figures from your CSV files' },
      { icon: 'category', label: 'Themes', value: summary.themeCount, hint: 'Groups of terms and items you may build a line around' },
      { icon: 'event_upcoming', label: 'Upcoming work', value: summary.upcomingCount, hint: 'Build, content and launch days in the next 30 days' },
      { icon: 'group', label: 'Members', value: summary.memberCount, hint: 'Owner, partners and crew of this studio' },
    ];
  });
}
