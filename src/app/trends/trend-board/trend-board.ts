import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged } from 'rxjs';
import type { ThemeView } from '@shared/contracts/themes';
import { verdicts, type SeriesPage, type SeriesSort, type SeriesSummary, type TargetChoices } from '@shared/contracts/series';
import { messageOf } from '../../core/api-error';
import { StudioContext } from '../../core/studio-context';
import { Sparkline } from '../../ui/sparkline/sparkline';
import { verdictFigures } from '@shared/scoring/verdict-figures';
import { TrendsApi } from '../trends-api';
import { dayMonth, fixed, neededText, partLabels, partNames, riseText, verdictLabels } from '../trends-format';
import { columnHints, themeColumnHints } from './board-columns';
import { ColumnHint } from './column-hint';
import { valueOr } from '../../core/resource-value';

/** The most series the compare chart shows at once. */
export const MAX_COMPARED = 5;

@Component({
  selector: 'kc-trend-board',
  imports: [
    FormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatCheckboxModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatTooltipModule,
    MatProgressBarModule,
    Sparkline,
    ColumnHint,
  ],
  templateUrl: './trend-board.html',
  styleUrl: './trend-board.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TrendBoard {
  private readonly router = inject(Router);
  private readonly api = inject(TrendsApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  protected readonly verdicts = verdicts;
  protected readonly verdictLabels = verdictLabels;
  protected readonly partNames = partNames;
  protected readonly partLabels = partLabels;
  protected readonly fixed = fixed;
  protected readonly riseText = riseText;
  protected readonly neededText = neededText;
  protected readonly dayMonth = dayMonth;
  protected readonly hints = columnHints;
  protected readonly themeHints = themeColumnHints;
  // Beside the verdict, only the figures it was decided on (issue 23): rise a year and seasonal strength.
  protected readonly columns = ['select', 'term', 'heat', 'verdict', 'spark', 'rise', 'strength', 'nextPeak', 'region', 'covered'];

  protected readonly sort = signal<SeriesSort>('heat');
  protected readonly order = signal<'asc' | 'desc'>('desc');
  protected readonly page = signal(1);
  protected readonly pageSize = signal(25);
  protected readonly searchText = signal('');
  private readonly query = signal('');
  protected readonly verdict = signal('');
  protected readonly target = signal('');
  protected readonly selected = signal<Map<number, string>>(new Map());
  protected readonly themeName = signal('');
  protected readonly isBusy = signal(false);

  protected readonly board = httpResource<SeriesPage>(() => {
    if (this.context.studioId() === null) return undefined;
    const params: Record<string, string> = { sort: this.sort(), order: this.order(), page: String(this.page()), pageSize: String(this.pageSize()) };
    if (this.query()) params['q'] = this.query();
    if (this.verdict()) params['verdict'] = this.verdict();
    if (this.target()) params['target'] = this.target();
    return { url: `${this.context.base()}/series`, params };
  });
  protected readonly targets = httpResource<TargetChoices>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/series/targets`));
  /** The studio's themes beside the series: each scored from its members for its own target. */
  protected readonly themes = httpResource<ThemeView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/themes`));
  protected readonly themeRows = computed(() =>
    valueOr(this.themes, []).filter((theme) => theme.status !== 'retired').sort((a, b) => (b.score?.heat ?? -1) - (a.score?.heat ?? -1)),
  );
  protected readonly rows = computed(() => valueOr(this.board, undefined)?.items ?? []);
  protected readonly waitingNote = computed(() =>
    this.rows().some((row) => row.score?.heat === null) ? 'Series with too little history have no heat yet and come after the scored ones.' : '',
  );
  protected readonly selectedCount = computed(() => this.selected().size);

  constructor() {
    // Typing filters after a pause, not on every key.
    toObservable(this.searchText)
      .pipe(debounceTime(300), distinctUntilChanged(), takeUntilDestroyed())
      .subscribe((text) => {
        this.query.set(text.trim());
        this.page.set(1);
      });
  }

  protected sortBy(sort: Sort): void {
    if (!sort.direction) {
      this.sort.set('heat');
      this.order.set('desc');
    } else {
      this.sort.set(sort.active as SeriesSort);
      this.order.set(sort.direction);
    }
    this.page.set(1);
  }

  protected pageTo(event: PageEvent): void {
    this.page.set(event.pageIndex + 1);
    this.pageSize.set(event.pageSize);
  }

  protected filterVerdict(verdict: string): void {
    this.verdict.set(verdict);
    this.page.set(1);
  }

  protected chooseTarget(target: string): void {
    this.target.set(target);
  }

  protected isSelected(row: SeriesSummary): boolean {
    return this.selected().has(row.id);
  }

  protected toggle(row: SeriesSummary): void {
    const next = new Map(this.selected());
    if (next.has(row.id)) next.delete(row.id);
    else next.set(row.id, row.term);
    this.selected.set(next);
  }

  protected themeVerdict(theme: ThemeView): string {
    return theme.score ? verdictLabels[theme.score.verdict] : '–';
  }

  /** The theme's heat and how many of its series count, e.g. "62 · 2 of 3 series". */
  protected themeHeat(theme: ThemeView): string {
    const score = theme.score;
    if (!score) return '–';
    if (score.heat === null) return `none yet · 0 of ${score.membersTotal} series`;
    return `${fixed(score.heat)} · ${score.membersUsed} of ${score.membersTotal} series`;
  }

  protected verdictFiguresOf(row: SeriesSummary) {
    return row.score ? verdictFigures(row.score) : null;
  }

  protected verdictOf(row: SeriesSummary): string {
    return row.score ? verdictLabels[row.score.verdict] : '–';
  }

  protected clearSelection(): void {
    this.selected.set(new Map());
  }

  protected partsText(row: SeriesSummary): string {
    const score = row.score;
    if (!score) return '';
    return partNames.map((name) => `${partLabels[name]} ${fixed(score.parts[name])} → ${fixed(score.contributions[name], 1)}`).join('\n');
  }

  protected compare(): void {
    void this.router.navigate(['/studios', this.context.studioId(), 'trends', 'compare'], { queryParams: { ids: [...this.selected().keys()].slice(0, MAX_COMPARED).join(',') } });
  }

  protected async groupIntoTheme(): Promise<void> {
    const name = this.themeName().trim();
    if (!name || this.isBusy()) return;
    this.isBusy.set(true);
    try {
      const theme = await this.api.createTheme({ name, seriesIds: [...this.selected().keys()] });
      this.snackBar.open(`Theme "${theme.name}" created`, undefined, { duration: 3000 });
      await this.router.navigate(['/studios', this.context.studioId(), 'themes', theme.id]);
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss');
    } finally {
      this.isBusy.set(false);
    }
  }
}
