import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { ImportDetail } from '@shared/contracts/imports';
import { messageOf } from '../../core/api-error';
import { StudioContext } from '../../core/studio-context';
import { SeriesChart } from '../series-chart/series-chart';
import { valueOr } from '../../core/resource-value';

@Component({
  selector: 'kc-confirm-delete-import',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Delete this import?</h2>
    <mat-dialog-content>
      <p>
        "{{ data.fileName }}" and everything it stored go: its sales rows and the series points it wrote. Points other imports
        wrote stay; series left without points are removed.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button [mat-dialog-close]="false">Keep it</button>
      <button mat-flat-button [mat-dialog-close]="true">Delete import</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDeleteImport {
  protected readonly data = inject<{ fileName: string }>(MAT_DIALOG_DATA);
}

/** One import: what it was, the series it wrote (each with a small chart), and deletion. */
@Component({
  selector: 'kc-import-detail',
  imports: [RouterLink, MatCardModule, MatButtonModule, MatIconModule, MatProgressBarModule, SeriesChart],
  templateUrl: './import-detail.html',
  styleUrls: ['../import-facts.scss', './import-detail.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportDetailPage {
  private readonly http = inject(HttpClient);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  protected readonly context = inject(StudioContext);

  readonly importId = input.required<string>();
  protected readonly detail = httpResource<ImportDetail>(() =>
    this.context.studioId() === null ? undefined : `${this.context.base()}/imports/${this.importId()}`,
  );
  protected readonly error = signal<string | null>(null);
  protected readonly isDeleting = signal(false);
  protected readonly facts = computed(() => {
    const detail = valueOr(this.detail, undefined);
    if (!detail) return [];
    return [
      { label: 'Kind', value: detail.kind },
      { label: 'Status', value: detail.status },
      { label: 'Rows', value: String(detail.rows) },
      { label: 'Series', value: String(detail.seriesCount) },
      { label: 'Sales rows', value: String(detail.salesRows) },
      { label: 'Period covered', value: detail.periodStart ? `${detail.periodStart} – ${detail.periodEnd}` : '—' },
      { label: 'By', value: detail.createdBy?.name ?? '—' },
      { label: 'When', value: detail.createdAt.slice(0, 16).replace('T', ' ') },
    ];
  });

  protected async remove(): Promise<void> {
    const detail = valueOr(this.detail, undefined);
    if (!detail) return;
    const isConfirmed = await firstValueFrom(this.dialog.open(ConfirmDeleteImport, { data: { fileName: detail.fileName } }).afterClosed());
    if (!isConfirmed) return;
    this.isDeleting.set(true);
    try {
      await firstValueFrom(this.http.delete(`${this.context.base()}/imports/${detail.id}`));
      await this.router.navigate(['/studios', this.context.studioId(), 'imports']);
    } catch (error) {
      this.error.set(messageOf(error));
    } finally {
      this.isDeleting.set(false);
    }
  }
}
