import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import type { ThemeView } from '@shared/contracts/themes';
import { messageOf } from '../../core/api-error';
import { StudioContext } from '../../core/studio-context';
import { fixed, verdictLabels } from '../../trends/trends-format';
import { statusLabels } from '../theme-labels';
import { ThemesApi } from '../themes-api';

@Component({
  selector: 'kc-theme-list',
  imports: [FormsModule, RouterLink, MatTableModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressBarModule],
  template: `
    <section class="kc-page">
      <h1>Themes</h1>
      <p class="lede">Groups of series and your own items that you may build a line around. Pick one for a month or an occasion, then plan its runway.</p>
      @if (context.canEdit()) {
        <form class="new" (ngSubmit)="create()">
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>New theme name</mat-label>
            <input matInput name="name" [ngModel]="name()" (ngModelChange)="name.set($event)" maxlength="120" />
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="!name().trim() || isBusy()"><mat-icon>add</mat-icon> New theme</button>
          <span class="hint">Or select series on the <a [routerLink]="['..', 'trends']">Trends board</a> and group them.</span>
        </form>
      }
      @if (themes.isLoading()) {
        <mat-progress-bar mode="indeterminate" />
      }
      <table mat-table [dataSource]="themes.hasValue() ? themes.value() : []" class="themes">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef>Theme</th>
          <td mat-cell *matCellDef="let theme"><a [routerLink]="[theme.id]">{{ theme.name }}</a></td>
        </ng-container>
        <ng-container matColumnDef="status">
          <th mat-header-cell *matHeaderCellDef>Status</th>
          <td mat-cell *matCellDef="let theme"><span class="status" [class]="'status ' + theme.status">{{ statusOf(theme) }}</span></td>
        </ng-container>
        <ng-container matColumnDef="target">
          <th mat-header-cell *matHeaderCellDef>Target</th>
          <td mat-cell *matCellDef="let theme">{{ theme.target ? theme.target.label : '–' }}{{ theme.target && theme.offsetDays ? ' (' + theme.offsetDays + ' days before)' : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="members">
          <th mat-header-cell *matHeaderCellDef>Series · items</th>
          <td mat-cell *matCellDef="let theme">{{ theme.seriesIds.length }} · {{ theme.items.length }}</td>
        </ng-container>
        <ng-container matColumnDef="heat">
          <th mat-header-cell *matHeaderCellDef>Heat</th>
          <td mat-cell *matCellDef="let theme" class="num">
            @if (theme.score && theme.score.heat !== null) {
              {{ fixed(theme.score.heat) }} <small class="counted">· {{ theme.score.membersUsed }} of {{ theme.score.membersTotal }}</small>
            } @else {
              <small>no heat yet</small>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="verdict">
          <th mat-header-cell *matHeaderCellDef>Verdict</th>
          <td mat-cell *matCellDef="let theme">{{ verdictOf(theme) }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">
            No themes yet. A theme gathers the series of one idea: <a [routerLink]="['../trends']">pick them on the trends board</a>, or
            <a [routerLink]="['../imports']">import figures</a> first.
          </td>
        </tr>
      </table>
    </section>
  `,
  styles: `
    .lede, .hint { color: var(--mat-sys-on-surface-variant); }
    .new { display: flex; flex-wrap: wrap; align-items: center; gap: 12px; margin-bottom: 16px; }
    .themes { width: 100%; }
    .num { text-align: right; }
    .empty { padding: 24px; text-align: center; }
    .status { padding: 2px 8px; border-radius: 12px; background: var(--mat-sys-surface-container-high); }
    .status.picked, .status.building { background: color-mix(in srgb, var(--kc-launch) 18%, transparent); }
    .status.launched { background: color-mix(in srgb, var(--kc-market) 20%, transparent); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThemeList {
  private readonly api = inject(ThemesApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly context = inject(StudioContext);
  protected readonly statusLabels = statusLabels;
  protected readonly verdictLabels = verdictLabels;
  protected readonly fixed = fixed;
  protected readonly columns = ['name', 'status', 'target', 'members', 'heat', 'verdict'];
  protected readonly name = signal('');
  protected readonly isBusy = signal(false);
  protected readonly themes = httpResource<ThemeView[]>(() => (this.context.studioId() === null ? undefined : `${this.context.base()}/themes`));

  protected statusOf(theme: ThemeView): string {
    return statusLabels[theme.status];
  }

  protected verdictOf(theme: ThemeView): string {
    return theme.score ? verdictLabels[theme.score.verdict] : '–';
  }

  protected async create(): Promise<void> {
    if (!this.name().trim() || this.isBusy()) return;
    this.isBusy.set(true);
    try {
      const theme = await this.api.create({ name: this.name().trim() });
      await this.router.navigate(['/studios', this.context.studioId(), 'themes', theme.id]);
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Dismiss');
    } finally {
      this.isBusy.set(false);
    }
  }
}
